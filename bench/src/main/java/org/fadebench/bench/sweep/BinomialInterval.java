package org.fadebench.bench.sweep;

import org.apache.commons.statistics.distribution.BetaDistribution;

/**
 * Confidence intervals for error rates.
 *
 * <p>FER: frames fail independently, so the exact (Clopper–Pearson) two-sided interval applies:
 * with k errors in n trials at level 1-α, the bounds are the α/2 quantile of Beta(k, n-k+1) and
 * the 1-α/2 quantile of Beta(k+1, n-k), with 0 and 1 at the extremes (C. J. Clopper and E. S.
 * Pearson, "The use of confidence or fiducial limits illustrated in the case of the binomial",
 * Biometrika 26(4), 1934). Quantiles from Apache Commons Statistics.
 *
 * <p>BER: the bits of one frame share its fading and are not independent, so the bit count is not
 * a binomial sample; frames are. The BER interval treats each frame as a cluster of B bits and
 * uses the Clopper–Pearson interval at an effective sample size (E. L. Korn and B. I. Graubard,
 * "Confidence intervals for proportions with small expected number of positive counts estimated
 * from survey data", Survey Methodology 24(2), 1998; from memory): with p̂ the BER, the design
 * effect is d = s² / (p̂(1-p̂)/B), where s² is the between-frame variance of the per-frame bit
 * error fraction, clamped to [1, B]; the interval is Clopper–Pearson with n_eff = n·B/d trials and
 * p̂·n_eff errors (real-valued). With no bit error at all, d = B: the frames are the trials.
 */
public final class BinomialInterval {

    private BinomialInterval() {
    }

    /** {lower, upper} for {@code errors} in {@code trials} at confidence {@code level} (e.g. 0.95). */
    public static double[] clopperPearson(long errors, long trials, double level) {
        if (trials <= 0 || errors < 0 || errors > trials) {
            throw new IllegalArgumentException("need 0 <= errors <= trials and trials > 0");
        }
        return clopperPearson((double) errors, (double) trials, level);
    }

    /** Clopper–Pearson with real-valued counts (effective sample sizes). */
    static double[] clopperPearson(double errors, double trials, double level) {
        if (!(level > 0 && level < 1)) {
            throw new IllegalArgumentException("confidence level must lie strictly between 0 and 1, got " + level);
        }
        double alpha = 1 - level;
        double lower = errors <= 0 ? 0.0
                : BetaDistribution.of(errors, trials - errors + 1).inverseCumulativeProbability(alpha / 2);
        double upper = errors >= trials ? 1.0
                : BetaDistribution.of(errors + 1, trials - errors).inverseCumulativeProbability(1 - alpha / 2);
        return new double[] {lower, upper};
    }

    /**
     * BER interval from frame clusters (see the class comment).
     *
     * @param frames            frames observed (n)
     * @param bitsPerFrame      bits per frame (B)
     * @param bitErrors         total bit errors
     * @param bitErrorsSquared  Σ over frames of (bit errors in the frame)²
     */
    public static double[] clusteredBer(long frames, int bitsPerFrame, long bitErrors, double bitErrorsSquared,
                                        double level) {
        if (frames <= 0) {
            throw new IllegalArgumentException("need at least one frame");
        }
        double b = bitsPerFrame;
        double n = frames;
        double p = bitErrors / (n * b);
        double design;
        if (bitErrors == 0 || p >= 1) {
            design = b;
        } else {
            // between-frame sample variance of x_i = e_i / B
            double meanSq = bitErrorsSquared / (n * b * b);
            double var = frames > 1 ? Math.max(0.0, (meanSq - p * p) * n / (n - 1)) : p * (1 - p);
            design = var / (p * (1 - p) / b);
            design = Math.min(b, Math.max(1.0, design));
        }
        double nEff = n * b / design;
        return clopperPearson(p * nEff, nEff, level);
    }
}
