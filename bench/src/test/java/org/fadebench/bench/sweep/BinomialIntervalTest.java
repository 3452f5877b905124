package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.math3.distribution.BetaDistribution;
import org.junit.jupiter.api.Test;

class BinomialIntervalTest {

    /**
     * Closed forms at the extremes, from the definition (Clopper and Pearson, Biometrika 26(4),
     * 1934): with 0 errors the upper bound solves (1-p)^n = α/2, so p = 1 - (α/2)^(1/n); with n
     * errors the lower bound is (α/2)^(1/n).
     */
    @Test
    void extremes() {
        double[] ci = BinomialInterval.clopperPearson(0, 10, 0.95);
        assertEquals(0.0, ci[0], 0);
        assertEquals(1 - Math.pow(0.025, 0.1), ci[1], 1e-12);
        assertEquals(0.30849, ci[1], 1e-5);
        ci = BinomialInterval.clopperPearson(20, 20, 0.95);
        assertEquals(Math.pow(0.025, 1.0 / 20), ci[0], 1e-12);
        assertEquals(1.0, ci[1], 0);
    }

    /** 5 errors in 20 trials, 95 %: [0.0866, 0.4910] (exact binomial interval; from memory). */
    @Test
    void tabulatedValue() {
        double[] ci = BinomialInterval.clopperPearson(5, 20, 0.95);
        assertEquals(0.0866, ci[0], 1e-4);
        assertEquals(0.4910, ci[1], 1e-4);
    }

    /** Against the beta quantiles of a second reference library (Commons Math 3). */
    @Test
    void againstCommonsMathBetaQuantiles() {
        long[][] cases = {{1, 7}, {13, 1000}, {100, 12345}, {999, 1000}, {3, 1_000_000}};
        for (double level : new double[] {0.9, 0.95, 0.99}) {
            double a = 1 - level;
            for (long[] c : cases) {
                long k = c[0];
                long n = c[1];
                double[] ci = BinomialInterval.clopperPearson(k, n, level);
                double lo = new BetaDistribution(k, n - k + 1, 1e-14).inverseCumulativeProbability(a / 2);
                double hi = new BetaDistribution(k + 1, n - k, 1e-14).inverseCumulativeProbability(1 - a / 2);
                assertEquals(lo, ci[0], 1e-9 * lo + 1e-13, k + "/" + n);
                assertEquals(hi, ci[1], 1e-9 * hi + 1e-13, k + "/" + n);
            }
        }
    }

    /**
     * Limits of the clustered BER interval (Korn and Graubard 1998 effective sample size): one bit
     * per frame is plain Clopper–Pearson over bits; all errors packed into whole frames (each erroneous
     * frame entirely wrong) makes the frames the trials, i.e. the FER interval.
     */
    @Test
    void clusteredBerLimits() {
        double[] bits = BinomialInterval.clopperPearson(37, 5000, 0.95);
        double[] oneBitFrames = BinomialInterval.clusteredBer(5000, 1, 37, 37, 0.95);
        assertEquals(bits[0], oneBitFrames[0], 1e-12);
        assertEquals(bits[1], oneBitFrames[1], 1e-12);
        // 20 of 1000 frames of 64 bits entirely wrong: BER = FER = 0.02
        double[] frames = BinomialInterval.clopperPearson(20, 1000, 0.95);
        double[] packed = BinomialInterval.clusteredBer(1000, 64, 20 * 64, 20.0 * 64 * 64, 0.95);
        assertEquals(frames[0], packed[0], 1e-9);
        assertEquals(frames[1], packed[1], 1e-9);
        // no errors: the frames are the trials
        assertEquals(BinomialInterval.clopperPearson(0, 1000, 0.95)[1],
                BinomialInterval.clusteredBer(1000, 64, 0, 0, 0.95)[1], 1e-12);
        // independent bits spread one per frame: design effect near 1, close to the bit interval
        double[] spread = BinomialInterval.clusteredBer(1000, 64, 50, 50, 0.95);
        double[] asBits = BinomialInterval.clopperPearson(50, 64000, 0.95);
        assertEquals(asBits[1], spread[1], 0.02 * asBits[1]);
    }
}
