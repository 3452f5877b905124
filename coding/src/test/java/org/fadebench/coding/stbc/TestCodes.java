package org.fadebench.coding.stbc;

import java.util.Random;

/** Codes and helpers shared by the tests. */
final class TestCodes {

    private TestCodes() {
    }

    static double[] gaussians(Random rnd, int n, double sd) {
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            v[i] = sd * rnd.nextGaussian();
        }
        return v;
    }

    /**
     * Spatial multiplexing over 2 antennas, X = [s1 s2]/√2, T = 1, K = 2: each antenna sends its own
     * symbol at half power (common practice, no source). Not orthogonal.
     */
    static SpaceTimeCode spatialMultiplexing2x2() {
        return design("sm2", Math.sqrt(0.5), "s1 s2");
    }

    /** A code written like the catalogue's, with the general kernel. */
    static SpaceTimeCode design(String name, double scale, String... rows) {
        return SpaceTimeCodes.design(name, scale, "test code", SpaceTimeCode.Kernel.GENERAL, rows);
    }

    /** A code with complex Gaussian dispersion matrices, scaled to unit energy per slot. */
    static SpaceTimeCode randomCode(Random rnd, int mt, int k, int t) {
        double[][] a = new double[k][];
        double[][] b = new double[k][];
        for (int i = 0; i < k; i++) {
            a[i] = gaussians(rnd, 2 * t * mt, 1);
            b[i] = gaussians(rnd, 2 * t * mt, 1);
        }
        double scale = 1 / Math.sqrt(SpaceTimeCode.averageSlotEnergy(a, b, t));
        for (int i = 0; i < k; i++) {
            for (int c = 0; c < 2 * t * mt; c++) {
                a[i][c] *= scale;
                b[i][c] *= scale;
            }
        }
        return new SpaceTimeCode("random", mt, k, t, a, b, "test code", SpaceTimeCode.Kernel.GENERAL);
    }

    /**
     * The noiseless receive grid Y = X Hᵀ of {@code blocks} code blocks: x holds T·blocks rows of
     * Mt entries, h is Nr x Mt; returns T·blocks rows of Nr entries (interleaved complex).
     */
    static double[] receive(double[] x, double[] h, int nr, int mt, int rows) {
        double[] y = new double[2 * rows * nr];
        for (int slot = 0; slot < rows; slot++) {
            for (int r = 0; r < nr; r++) {
                for (int tx = 0; tx < mt; tx++) {
                    double hr = h[2 * (r * mt + tx)];
                    double hi = h[2 * (r * mt + tx) + 1];
                    double xr = x[2 * (slot * mt + tx)];
                    double xi = x[2 * (slot * mt + tx) + 1];
                    y[2 * (slot * nr + r)] += hr * xr - hi * xi;
                    y[2 * (slot * nr + r) + 1] += hr * xi + hi * xr;
                }
            }
        }
        return y;
    }
}
