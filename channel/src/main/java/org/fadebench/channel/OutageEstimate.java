package org.fadebench.channel;

import org.apache.commons.math3.stat.interval.ConfidenceInterval;
import org.apache.commons.math3.stat.interval.IntervalUtils;

/**
 * An outage probability, either exact (from a closed form; no draws, the interval is the point)
 * or counted over independent channel draws, with a Wilson score interval (E. B. Wilson,
 * "Probable inference, the law of succession, and statistical inference", J. Amer. Statist.
 * Assoc. 22, 1927; computed with Commons Math's {@code IntervalUtils}).
 */
public final class OutageEstimate {

    private final double probability;
    private final int outages;
    private final int draws;

    private OutageEstimate(double probability, int outages, int draws) {
        this.probability = probability;
        this.outages = outages;
        this.draws = draws;
    }

    /** An exact probability. */
    public static OutageEstimate exact(double probability) {
        if (!(probability >= 0.0 && probability <= 1.0)) {
            throw new IllegalArgumentException("probability must be in [0, 1], got " + probability);
        }
        return new OutageEstimate(probability, 0, 0);
    }

    /** {@code outages} outages counted in {@code draws} independent draws. */
    public static OutageEstimate counted(int outages, int draws) {
        if (draws < 1 || outages < 0 || outages > draws) {
            throw new IllegalArgumentException(
                    "need 1 <= draws and 0 <= outages <= draws, got " + outages + " of " + draws);
        }
        return new OutageEstimate((double) outages / draws, outages, draws);
    }

    /** The exact value, or the fraction of draws in outage. */
    public double probability() {
        return probability;
    }

    /** Draws in outage (0 when exact). */
    public int outages() {
        return outages;
    }

    /** Number of channel draws (0 when exact). */
    public int draws() {
        return draws;
    }

    public boolean isExact() {
        return draws == 0;
    }

    /**
     * True when the value says something: exact, or counted with a 95 % interval no wider than the
     * value itself. A count of no outages never is (its interval reaches from 0 to above 0).
     */
    public boolean resolved() {
        return isExact() || upper() - lower() <= probability;
    }

    /**
     * About how many draws a count needs to resolve (see {@link #resolved()}) a probability
     * {@code p} in (0, 1): n = ⌈k/p⌉ for the smallest count k whose 95 % Wilson interval over n
     * draws is no wider than k/n (k is about 16 for small p). For p below 1e-6, k is taken at 1e-6
     * (it hardly changes with p there) so that the draws fit an int.
     */
    public static long drawsToResolve(double p) {
        if (!(p > 0.0 && p < 1.0)) {
            throw new IllegalArgumentException("probability must be in (0, 1), got " + p);
        }
        double q = Math.max(p, 1e-6);
        for (int k = 1; ; k++) {
            int n = (int) Math.ceil(k / q);
            if (counted(k, n).resolved()) {
                return (long) Math.ceil(k / p);
            }
        }
    }

    /** Lower end of the 95 % interval. */
    public double lower() {
        return lower(0.95);
    }

    /** Upper end of the 95 % interval. */
    public double upper() {
        return upper(0.95);
    }

    /** Lower end of the Wilson interval at {@code confidence} in (0, 1); the value itself when exact. */
    public double lower(double confidence) {
        return isExact() ? probability : Math.max(0.0, wilson(confidence).getLowerBound());
    }

    /** Upper end of the Wilson interval at {@code confidence} in (0, 1); the value itself when exact. */
    public double upper(double confidence) {
        return isExact() ? probability : Math.min(1.0, wilson(confidence).getUpperBound());
    }

    private ConfidenceInterval wilson(double confidence) {
        if (!(confidence > 0.0 && confidence < 1.0)) {
            throw new IllegalArgumentException("confidence must be in (0, 1), got " + confidence);
        }
        return IntervalUtils.getWilsonScoreInterval(draws, outages, confidence);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof OutageEstimate e && Double.compare(probability, e.probability) == 0
                && outages == e.outages && draws == e.draws;
    }

    @Override
    public int hashCode() {
        return java.util.Objects.hash(probability, outages, draws);
    }

    @Override
    public String toString() {
        if (isExact()) {
            return "outage " + probability + " (exact)";
        }
        return "outage " + probability + " [" + lower() + ", " + upper() + "] from " + outages + "/" + draws;
    }
}
