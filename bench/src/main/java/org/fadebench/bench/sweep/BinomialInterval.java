package org.fadebench.bench.sweep;

import org.apache.commons.statistics.distribution.BetaDistribution;

/**
 * Exact (Clopper–Pearson) two-sided confidence interval for a binomial proportion: with k errors in
 * n trials and level 1-α, the bounds are the α/2 quantile of Beta(k, n-k+1) and the 1-α/2 quantile
 * of Beta(k+1, n-k), with 0 and 1 at the extremes (C. J. Clopper and E. S. Pearson, "The use of
 * confidence or fiducial limits illustrated in the case of the binomial", Biometrika 26(4), 1934).
 * Quantiles from Apache Commons Statistics.
 */
public final class BinomialInterval {

    private BinomialInterval() {
    }

    /** {lower, upper} for {@code errors} in {@code trials} at confidence {@code level} (e.g. 0.95). */
    public static double[] clopperPearson(long errors, long trials, double level) {
        if (trials <= 0 || errors < 0 || errors > trials) {
            throw new IllegalArgumentException("need 0 <= errors <= trials and trials > 0");
        }
        if (!(level > 0 && level < 1)) {
            throw new IllegalArgumentException("confidence level must lie strictly between 0 and 1, got " + level);
        }
        double alpha = 1 - level;
        double lower = errors == 0 ? 0.0
                : BetaDistribution.of(errors, trials - errors + 1).inverseCumulativeProbability(alpha / 2);
        double upper = errors == trials ? 1.0
                : BetaDistribution.of(errors + 1, trials - errors).inverseCumulativeProbability(1 - alpha / 2);
        return new double[] {lower, upper};
    }
}
