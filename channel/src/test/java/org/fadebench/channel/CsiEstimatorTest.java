package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/**
 * The receiver's channel estimate. The error E = Ĥ − H should have independent CN(0, v) entries
 * with v = σ² (error model) or v = n0·Mt/N (least squares from N orthogonal pilots at unit energy
 * per slot: (PᴴP)⁻¹ = (Mt/N)·I and the error (Mt/N)·Pᴴ N_p has covariance (Mt/N)²·(N/Mt)·n0·I; common
 * practice, e.g. M. Biguesh and A. B. Gershman, "Training-based MIMO channel estimation: a study of
 * estimator tradeoffs and optimal training signals", IEEE Trans. Signal Process. 54(3), 2006; from
 * memory).
 *
 * <p>Tolerances: |e|²/v is Exp(1) (mean 1, standard deviation 1), so the mean of n independent
 * |e|² has standard error v/√n; the product of two independent CN(0, v) entries has E|e_a·conj(e_b)|²
 * = v², so their sample mean has complex standard error v/√n. We allow 5 standard errors (a
 * two-sided normal interval a correct estimator leaves with probability below 6e-7 per check).
 */
class CsiEstimatorTest {

    private static final int BLOCKS = 20_000;

    /** Mean |e|², and the sample mean of e_(0,0)·conj(e_(last)) (zero for independent entries). */
    private static double[] errorStatistics(CsiEstimator csi, int nr, int mt, double n0, long seed) {
        double[] h = new double[2 * nr * mt];
        double[] hHat = new double[h.length];
        Draws draws = Draws.of(seed);
        FadingModel fading = new RayleighFading();
        double power = 0;
        double crossRe = 0;
        double crossIm = 0;
        double meanRe = 0;
        int last = h.length - 2;
        for (int i = 0; i < BLOCKS; i++) {
            fading.draw(draws, nr, mt, h);
            csi.estimate(h, n0, draws, hHat);
            for (int k = 0; k < h.length; k++) {
                double e = hHat[k] - h[k];
                power += e * e;
            }
            double ar = hHat[0] - h[0];
            double ai = hHat[1] - h[1];
            double br = hHat[last] - h[last];
            double bi = hHat[last + 1] - h[last + 1];
            crossRe += ar * br + ai * bi;
            crossIm += ai * br - ar * bi;
            meanRe += ar;
        }
        return new double[] {power / ((double) BLOCKS * nr * mt), crossRe / BLOCKS, crossIm / BLOCKS, meanRe / BLOCKS};
    }

    private static void assertIndependentErrors(CsiEstimator csi, int nr, int mt, double n0, double v, long seed) {
        double[] s = errorStatistics(csi, nr, mt, n0, seed);
        String what = nr + " x " + mt + ", pilots " + csi.pilots() + ": ";
        assertEquals(v, csi.errorVariance(n0), 1e-15 * v);
        assertEquals(v, s[0], 5 * v / Math.sqrt((double) BLOCKS * nr * mt), what + "error variance");
        assertEquals(0.0, Math.hypot(s[1], s[2]), 5 * v / Math.sqrt(BLOCKS), what + "cross-correlation");
        // Re e is N(0, v/2): standard error √(v/2)/√n
        assertEquals(0.0, s[3], 5 * Math.sqrt(0.5 * v / BLOCKS), what + "mean");
    }

    @Test
    void leastSquaresErrorVarianceIsN0TimesMtOverN() {
        assertIndependentErrors(CsiEstimator.leastSquares(2, 2, 2), 2, 2, 0.1, 0.1 * 2 / 2, 51);
        assertIndependentErrors(CsiEstimator.leastSquares(1, 3, 4), 1, 3, 0.5, 0.5 * 3 / 4, 52);
        assertIndependentErrors(CsiEstimator.leastSquares(2, 4, 7), 2, 4, 0.2, 0.2 * 4 / 7, 53);
    }

    @Test
    void errorModelHasTheGivenVariance() {
        assertIndependentErrors(CsiEstimator.withError(2, 3, 0.2), 2, 3, 0.7, 0.2, 54);
    }

    /** Without noise the least-squares estimate is the channel (the pilot columns are orthogonal). */
    @Test
    void noiselessPilotsRecoverTheChannel() {
        for (int[] c : new int[][] {{3, 2, 2}, {2, 4, 5}, {1, 8, 8}, {2, 3, 64}}) {
            int nr = c[0];
            int mt = c[1];
            double[] h = new double[2 * nr * mt];
            new RayleighFading().draw(Draws.of(c[2]), nr, mt, h);
            double[] hHat = new double[h.length];
            CsiEstimator.leastSquares(nr, mt, c[2]).estimate(h, 0.0, Draws.of(1), hHat);
            assertArrayEquals(h, hHat, 1e-12);
        }
    }

    @Test
    void perfectIsACopy() {
        double[] h = {1, 2, 3, 4};
        double[] hHat = new double[4];
        CsiEstimator.perfect(2, 1).estimate(h, 1.0, Draws.of(1), hHat);
        assertArrayEquals(h, hHat, 0.0);
        assertEquals(0.0, CsiEstimator.perfect(2, 1).errorVariance(1.0));
    }

    @Test
    void parametersAreChecked() {
        assertEquals("pilots must be at least Mt = 3 and at most 65536, got 2",
                assertThrows(IllegalArgumentException.class, () -> CsiEstimator.leastSquares(1, 3, 2)).getMessage());
        assertEquals("--csi-error must be a finite error variance >= 0, got -0.1",
                assertThrows(IllegalArgumentException.class, () -> CsiEstimator.withError(1, 1, -0.1)).getMessage());
    }
}
