package org.fadebench.bench.sweep;

import org.apache.commons.statistics.distribution.NormalDistribution;
import org.fadebench.bench.link.FrameCounters;

/**
 * Intervals for rates estimated by importance sampling, from weighted frames (see
 * {@link FrameCounters#addWeight}). The FER estimate is the mean of x_i = w_i·1{frame i in error}
 * over n frames, the BER the mean of w_i·e_i/B; each is a mean of n independent values, so its
 * interval is the normal approximation mean ± z·√(S²/n) with S² the sample variance of the x_i
 * (common practice for importance sampling, e.g. R. Y. Rubinstein and D. P. Kroese, Simulation and
 * the Monte Carlo Method, 2nd ed., Wiley 2008, Sec. 5.7; from memory), clamped at 0.
 *
 * <p>Trust: the normal approximation needs enough error frames whose weights do not differ too
 * much. Their effective number (Σ w)²/Σ w² over the frames in error (L. Kish, Survey Sampling,
 * Wiley 1965; from memory) must reach {@link #MIN_EFFECTIVE_ERRORS}; a point below it is marked
 * as not trusted. The {@linkplain #effectiveFrames effective frames} are the plain Monte Carlo
 * frames that give the same variance, p(1 − p)/Var, so their ratio to the frames simulated is the
 * speed-up in frames.
 */
public final class WeightedInterval {

    /** Effective error frames below which a weighted point's interval is not trusted (common practice, no source). */
    public static final double MIN_EFFECTIVE_ERRORS = 10;

    private WeightedInterval() {
    }

    /** {low, high} of the FER at {@code level} (e.g. 0.95). */
    public static double[] fer(FrameCounters c, double level) {
        return normal(c.errorWeight(), c.errorWeightSquares(), c.frames(), level);
    }

    /** {low, high} of the BER at {@code level}. */
    public static double[] ber(FrameCounters c, int bitsPerFrame, double level) {
        double b = bitsPerFrame;
        return normal(c.bitErrorWeight() / b, c.bitErrorWeightSquares() / (b * b), c.frames(), level);
    }

    /** Half-width of the FER interval over the FER; NaN without an error frame. */
    public static double relativeHalfWidth(FrameCounters c, double level) {
        double[] i = normalBounds(c.errorWeight(), c.errorWeightSquares(), c.frames(), level);
        double mean = c.fer();
        return mean > 0 ? (i[1] - mean) / mean : Double.NaN;
    }

    /** Effective number of error frames, (Σ w)²/Σ w² over them (0 without one). */
    public static double effectiveErrors(FrameCounters c) {
        return c.errorWeightSquares() > 0 ? c.errorWeight() * c.errorWeight() / c.errorWeightSquares() : 0;
    }

    /** Whether the interval can be trusted: {@link #effectiveErrors} reaches {@link #MIN_EFFECTIVE_ERRORS}. */
    public static boolean trusted(FrameCounters c) {
        return effectiveErrors(c) >= MIN_EFFECTIVE_ERRORS;
    }

    /** Plain Monte Carlo frames giving the FER estimate's variance, p(1 − p)/Var; NaN without an error frame. */
    public static double effectiveFrames(FrameCounters c) {
        double p = c.fer();
        double variance = meanVariance(c.errorWeight(), c.errorWeightSquares(), c.frames());
        return p > 0 && variance > 0 ? p * (1 - p) / variance : Double.NaN;
    }

    private static double[] normal(double sum, double squares, long n, double level) {
        double[] i = normalBounds(sum, squares, n, level);
        i[0] = Math.max(0.0, i[0]);
        return i;
    }

    private static double[] normalBounds(double sum, double squares, long n, double level) {
        if (!(level > 0 && level < 1)) {
            throw new IllegalArgumentException("confidence level must lie strictly between 0 and 1, got " + level);
        }
        double mean = sum / n;
        double z = NormalDistribution.of(0, 1).inverseCumulativeProbability(0.5 + level / 2);
        double half = z * Math.sqrt(meanVariance(sum, squares, n));
        return new double[] {mean - half, mean + half};
    }

    /** The estimated variance of the mean of n values with these sums: S²/n, S² = (Σx² − n·mean²)/(n − 1). */
    private static double meanVariance(double sum, double squares, long n) {
        if (n < 2) {
            return Double.NaN;
        }
        double mean = sum / n;
        return Math.max(0.0, (squares - n * mean * mean) / (n - 1)) / n;
    }
}
