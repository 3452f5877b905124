package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.apache.commons.math3.distribution.ExponentialDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.Test;

class ChannelStatisticsTest {

    /**
     * The normal sampler passes a one-sample Kolmogorov-Smirnov test against the N(0,1) CDF of
     * Commons Math (reference library). With a fixed seed the p-value is a fixed number; we require
     * p > 0.01, which a correct sampler fails for only 1 % of seeds.
     */
    @Test
    void gaussianPassesKolmogorovSmirnov() {
        Draws d = Draws.of(1234, 0, 0);
        double[] x = new double[50_000];
        for (int i = 0; i < x.length; i++) {
            x[i] = d.gaussian();
        }
        double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new NormalDistribution(0, 1), x);
        assertTrue(p > 0.01, "KS p-value " + p);
    }

    /**
     * Rayleigh entries: |h|² is exponential with mean 1 (KS against Commons Math), and the sample
     * mean of |h|² lies within 4 standard errors of 1 (std of an Exp(1) variable is 1).
     */
    @Test
    void rayleighPowerIsUnitExponential() {
        Draws d = Draws.of(99);
        FadingModel m = new RayleighFading();
        int nr = 2;
        int mt = 3;
        double[] h = new double[2 * nr * mt];
        int draws = 10_000;
        double[] power = new double[draws * nr * mt];
        int n = 0;
        for (int i = 0; i < draws; i++) {
            m.draw(d, nr, mt, h);
            for (int e = 0; e < nr * mt; e++) {
                power[n++] = h[2 * e] * h[2 * e] + h[2 * e + 1] * h[2 * e + 1];
            }
        }
        double mean = Arrays.stream(power).average().orElseThrow();
        assertEquals(1.0, mean, 4.0 / Math.sqrt(power.length));
        double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new ExponentialDistribution(1.0), power);
        assertTrue(p > 0.01, "KS p-value " + p);
    }

    @Test
    void noFadingIsAllOnes() {
        double[] h = new double[8];
        Arrays.fill(h, 7);
        new NoFading().draw(Draws.of(1), 2, 2, h);
        assertArrayEquals(new double[] {1, 0, 1, 0, 1, 0, 1, 0}, h, 0);
    }

    /** Y = X Hᵀ + N: with n0 = 0 the product is exact; the noise has variance n0 per complex entry. */
    @Test
    void mimoProductAndNoisePower() {
        // H = [[1+2j, 3], [-1j, 2-1j]] (2 x 2), x = [1, 1j]
        double[] h = {1, 2, 3, 0, 0, -1, 2, -1};
        double[] x = {1, 0, 0, 1};
        double[] y = new double[4];
        MimoChannel.apply(h, 2, 2, x, 0, 1, 0.0, Draws.of(5), y, 0);
        // y0 = (1+2j)·1 + 3·1j = 1 + 5j ; y1 = -1j·1 + (2-1j)·1j = 1 + 1j
        assertArrayEquals(new double[] {1, 5, 1, 1}, y, 1e-15);

        double n0 = 0.3;
        int slots = 40_000;
        double[] zeros = new double[2 * slots];
        double[] one = {1, 0};
        double[] out = new double[2 * slots];
        MimoChannel.apply(one, 1, 1, zeros, 0, slots, n0, Draws.of(6), out, 0);
        double power = 0;
        for (double v : out) {
            power += v * v;
        }
        power /= slots;
        // |n|²/n0 is Exp(1): standard error of the mean is n0/√slots; allow 4 of them.
        assertEquals(n0, power, 4 * n0 / Math.sqrt(slots));
    }

    /**
     * The planar fill takes the same draws as the interleaved one, column by column: row i, column
     * j in plane j at i, for any number of planes; each column is one unit-stride run of the flat
     * fill (the planes in order make up the flat sequence), and both leave the stream at the same
     * place.
     */
    @Test
    void planarFillTakesTheSameDraws() {
        for (int cols : new int[] {1, 3, 4, 8, 16}) {
            int rows = 37;
            double[] interleaved = new double[cols * (rows + 1)];
            Draws a = Draws.of(8, cols);
            a.fillGaussianColumns(interleaved, cols, rows, cols, 0.7);
            double[][] planes = new double[cols][rows + 2];
            Draws b = Draws.of(8, cols);
            b.fillGaussian(planes, 2, rows, 0.7);
            double[] flat = new double[cols * rows];
            Draws c = Draws.of(8, cols);
            c.fillGaussian(flat, 0, flat.length, 0.7);
            for (int j = 0; j < cols; j++) {
                assertEquals(0.0, interleaved[j], 0.0, "row before the first untouched");
            }
            for (int i = 0; i < rows; i++) {
                for (int j = 0; j < cols; j++) {
                    assertEquals(interleaved[(i + 1) * cols + j], planes[j][i + 2], 0.0, cols + " planes, row " + i);
                    assertEquals(flat[j * rows + i], planes[j][i + 2], 0.0, cols + " planes, row " + i);
                }
            }
            double next = c.gaussian();
            assertEquals(next, a.gaussian(), 0.0, cols + " columns: stream position");
            assertEquals(next, b.gaussian(), 0.0, cols + " planes: stream position");
        }
    }

    @Test
    void streamsDependOnlyOnSeedAndKeys() {
        Draws a = Draws.of(42, 3, 7);
        Draws b = Draws.of(42, 3, 7);
        Draws c = Draws.of(42, 7, 3);
        Draws e = Draws.of(43, 3, 7);
        boolean differsC = false;
        boolean differsE = false;
        for (int i = 0; i < 100; i++) {
            double va = a.gaussian();
            assertEquals(va, b.gaussian(), 0.0);
            differsC |= va != c.gaussian();
            differsE |= va != e.gaussian();
        }
        assertTrue(differsC);
        assertTrue(differsE);
        byte[] bits = new byte[130];
        Draws.of(1).fillBits(bits, 0, bits.length);
        int ones = 0;
        for (byte bit : bits) {
            assertTrue(bit == 0 || bit == 1);
            ones += bit;
        }
        assertFalse(ones == 0 || ones == bits.length);
    }
}
