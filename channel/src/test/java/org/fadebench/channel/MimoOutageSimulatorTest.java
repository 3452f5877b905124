package org.fadebench.channel;

import static org.fadebench.channel.OutageBoundsTest.assertRejects;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.util.SplittableRandom;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.special.Gamma;
import org.apache.commons.math3.util.CombinatoricsUtils;
import org.junit.jupiter.api.Test;

class MimoOutageSimulatorTest {

    private static final double LN2 = Math.log(2);
    private static final double CONFIDENCE = 0.999;

    private static double fromDb(double db) {
        return Math.pow(10, 0.1 * db);
    }

    private static double[] randomChannel(SplittableRandom random, int nr, int mt) {
        double[] h = new double[2 * nr * mt];
        for (int i = 0; i < h.length; i++) {
            h[i] = Math.sqrt(0.5) * random.nextGaussian();
        }
        return h;
    }

    /** Hᴴ of an interleaved row-major Nr x Mt matrix, as an Mt x Nr matrix. */
    private static double[] conjugateTranspose(double[] h, int nr, int mt) {
        double[] out = new double[h.length];
        for (int r = 0; r < nr; r++) {
            for (int t = 0; t < mt; t++) {
                out[2 * (t * nr + r)] = h[2 * (r * mt + t)];
                out[2 * (t * nr + r) + 1] = -h[2 * (r * mt + t) + 1];
            }
        }
        return out;
    }

    /**
     * log2 det(I + c·H Hᴴ) through the real 2n x 2n embedding [[A, −B], [B, A]] of A + jB, whose
     * determinant is |det(A + jB)|² (common practice, no source), with Commons Math's LU.
     */
    private static double bitsByRealEmbedding(double[] h, int nr, int mt, double snr) {
        double c = snr / mt;
        double[][] m = new double[2 * nr][2 * nr];
        for (int i = 0; i < nr; i++) {
            for (int k = 0; k < nr; k++) {
                double re = i == k ? 1 : 0;
                double im = 0;
                for (int t = 0; t < mt; t++) {
                    double ar = h[2 * (i * mt + t)];
                    double ai = h[2 * (i * mt + t) + 1];
                    double br = h[2 * (k * mt + t)];
                    double bi = -h[2 * (k * mt + t) + 1];
                    re += c * (ar * br - ai * bi);
                    im += c * (ar * bi + ai * br);
                }
                m[i][k] = re;
                m[i + nr][k + nr] = re;
                m[i][k + nr] = -im;
                m[i + nr][k] = im;
            }
        }
        double det = new LUDecomposition(new Array2DRowRealMatrix(m, false)).getDeterminant();
        return 0.5 * Math.log(det) / LN2;
    }

    /**
     * The per-draw information against three independent computations: for 2 x 2,
     * det(I + A) = 1 + tr A + det A with det(H Hᴴ) = |det H|² (common practice); for one antenna on
     * a side, log2(1 + snr/Mt·‖H‖²); and for 3 x 3, 4 x 4 and 3 x 2 (the Hᴴ H branch) the real
     * embedding with an LU determinant.
     */
    @Test
    void informationMatchesIndependentDeterminants() {
        SplittableRandom random = new SplittableRandom(7);
        for (int trial = 0; trial < 20; trial++) {
            double snr = fromDb(-10 + 2.5 * trial);
            double[] h = randomChannel(random, 2, 2);
            double c = snr / 2;
            double norm = 0;
            for (double v : h) {
                norm += v * v;
            }
            double detRe = h[0] * h[6] - h[1] * h[7] - (h[2] * h[4] - h[3] * h[5]);
            double detIm = h[0] * h[7] + h[1] * h[6] - (h[2] * h[5] + h[3] * h[4]);
            double expected = Math.log(1 + c * norm + c * c * (detRe * detRe + detIm * detIm)) / LN2;
            MimoOutageSimulator sim = new MimoOutageSimulator(new RayleighFading(), 2, 2);
            assertEquals(expected, sim.bits(h, snr), 1e-12 * Math.max(1, expected));

            for (int[] shape : new int[][] {{1, 3}, {3, 1}}) {
                int nr = shape[0];
                int mt = shape[1];
                double[] v = randomChannel(random, nr, mt);
                double sum = 0;
                for (double x : v) {
                    sum += x * x;
                }
                double simo = Math.log1p(snr / mt * sum) / LN2;
                assertEquals(simo, new MimoOutageSimulator(new RayleighFading(), nr, mt).bits(v, snr),
                        1e-12 * Math.max(1, simo));
            }
            for (int[] shape : new int[][] {{3, 3}, {4, 4}, {3, 2}, {2, 4}}) {
                int nr = shape[0];
                int mt = shape[1];
                double[] v = randomChannel(random, nr, mt);
                double reference = bitsByRealEmbedding(v, nr, mt, snr);
                double actual = new MimoOutageSimulator(new RayleighFading(), nr, mt).bits(v, snr);
                assertEquals(reference, actual, 1e-10 * Math.max(1, reference), nr + "x" + mt);
                // Sylvester: det(I + c H Hᴴ) = det(I + c Hᴴ H), and Hᴴ as a channel has Nr transmit antennas
                double transposed = new MimoOutageSimulator(new RayleighFading(), mt, nr)
                        .bits(conjugateTranspose(v, nr, mt), snr * nr / mt);
                assertEquals(actual, transposed, 1e-12 * Math.max(1, actual), nr + "x" + mt + " transposed");
            }
        }
    }

    /** 1 x L and L x 1: the count agrees with the closed form within its 99.9 % interval. */
    @Test
    void countMatchesClosedFormWithOneAntennaOnASide() {
        int[][] shapes = {{1, 1}, {1, 3}, {3, 1}, {2, 1}};
        int draws = 40_000;
        for (int[] shape : shapes) {
            int mt = shape[0];
            int nr = shape[1];
            MimoOutageSimulator sim = new MimoOutageSimulator(new RayleighFading(), nr, mt);
            for (double db : new double[] {0, 5, 10}) {
                OutageEstimate count = sim.estimate(db, 2, draws, 11);
                double closed = OutageBounds.stbcOutage(db, nr, mt, 1.0, 2);
                assertTrue(count.lower(CONFIDENCE) <= closed && closed <= count.upper(CONFIDENCE),
                        mt + "x" + nr + " at " + db + " dB: " + count + " vs " + closed);
            }
        }
    }

    /**
     * Outage of the Mt x Nr channel with m = min, n = max, from the joint density of the unordered
     * eigenvalues of the complex Wishart matrix: p(λ) = e^(−Σλ) Π λ_i^(n−m) Π_{i<j} (λ_i − λ_j)² /
     * (m!·K), K = Π_{i=1..m} Γ(m−i+1) Γ(n−i+1) (E. Telatar, "Capacity of multi-antenna Gaussian
     * channels", Eur. Trans. Telecommun. 10(6), 1999, Sec. 4; from memory). For m = 2 the inner
     * integral over λ2 < b is a sum of incomplete gamma functions (Commons Math) and the outer one
     * is taken by adaptive Gauss–Legendre (Commons Math).
     */
    private static double twoEigenvalueOutage(int n, double snrOverMt, double bits) {
        int d = n - 2;
        double k = CombinatoricsUtils.factorialDouble(n - 1) * CombinatoricsUtils.factorialDouble(n - 2);
        double target = Math.pow(2, bits);
        double lambdaMax = (target - 1) / snrOverMt;
        return new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-15).integrate(1_000_000, a -> {
            double b = (target / (1 + snrOverMt * a) - 1) / snrOverMt;
            // ∫_0^b x^d (a − x)² e^(−x) dx
            double inner = a * a * Gamma.gamma(d + 1) * Gamma.regularizedGammaP(d + 1, b)
                    - 2 * a * Gamma.gamma(d + 2) * Gamma.regularizedGammaP(d + 2, b)
                    + Gamma.gamma(d + 3) * Gamma.regularizedGammaP(d + 3, b);
            return Math.pow(a, d) * Math.exp(-a) * inner / (2 * k);
        }, 0, lambdaMax);
    }

    @Test
    void twoByTwoAndTwoByThreeMatchWishartIntegral() {
        int draws = 40_000;
        // (SNR dB, R) with outage between about 0.05 and 0.3 for each receiver count
        double[][][] pointsByShape = {{{5, 2}, {10, 4}, {15, 6}}, {{5, 3}, {10, 5}, {15, 7.5}}};
        for (int nr : new int[] {2, 3}) {
            MimoOutageSimulator sim = new MimoOutageSimulator(new RayleighFading(), nr, 2);
            for (double[] point : pointsByShape[nr - 2]) {
                double reference = twoEigenvalueOutage(nr, fromDb(point[0]) / 2, point[1]);
                OutageEstimate count = sim.estimate(point[0], point[1], draws, 3);
                assertTrue(count.lower(CONFIDENCE) <= reference && reference <= count.upper(CONFIDENCE),
                        "2x" + nr + " at " + point[0] + " dB, R=" + point[1] + ": " + count + " vs " + reference);
            }
        }
    }

    /**
     * Alamouti (rate 1) on 2 x 1 loses nothing: its outage equals the MIMO outage; on 2 x 2 it is
     * capacity-lossy, so the MIMO outage is clearly smaller (Tse and Viswanath 2005, Sec. 3.3.2 and
     * 5.4; from memory). The 2 x 1 MIMO count agrees with the code's closed form within its interval.
     */
    @Test
    void alamoutiAgainstMimo() {
        for (double db = 0; db <= 30; db += 5) {
            for (double bits : new double[] {1, 4}) {
                assertEquals(OutageBounds.stbcOutage(db, 1, 2, 1.0, bits),
                        OutageBounds.mimoOutage(db, 1, 2, bits, 1, 0).probability(), 0.0);
            }
        }
        MimoOutageSimulator miso = new MimoOutageSimulator(new RayleighFading(), 1, 2);
        OutageEstimate count = miso.estimate(8, 2, 40_000, 5);
        double closed = OutageBounds.stbcOutage(8, 1, 2, 1.0, 2);
        assertTrue(count.lower(CONFIDENCE) <= closed && closed <= count.upper(CONFIDENCE), count + " vs " + closed);

        double[][] points = {{10, 4}, {15, 6}, {20, 8}};
        for (double[] point : points) {
            OutageEstimate mimo = OutageBounds.mimoOutage(point[0], 2, 2, point[1], 40_000, 9);
            double alamouti = OutageBounds.stbcOutage(point[0], 2, 2, 1.0, point[1]);
            assertTrue(mimo.upper(CONFIDENCE) < alamouti, mimo + " vs Alamouti " + alamouti);
        }
    }

    /**
     * Same seed, same numbers; and with the same seed every SNR sees the same channels, so the
     * count cannot grow with SNR (the information of each draw increases with SNR).
     */
    @Test
    void reproducibleAndMonotoneInSnr() {
        MimoOutageSimulator sim = new MimoOutageSimulator(new RayleighFading(), 4, 4);
        OutageEstimate a = sim.estimate(5, 8, 5_000, 42);
        OutageEstimate b = new MimoOutageSimulator(new RayleighFading(), 4, 4).estimate(5, 8, 5_000, 42);
        assertEquals(a.outages(), b.outages());
        assertTrue(a.outages() != sim.estimate(5, 8, 5_000, 43).outages());
        int previous = Integer.MAX_VALUE;
        for (double db = -5; db <= 15; db += 1) {
            int outages = sim.estimate(db, 8, 5_000, 42).outages();
            assertTrue(outages <= previous, "count grew at " + db + " dB");
            previous = outages;
        }
        assertTrue(previous < 5_000 / 10 && sim.estimate(-5, 8, 5_000, 42).outages() > 5_000 * 9 / 10);
    }

    /** The draw loop allocates nothing: 20 000 extra draws cost (almost) no extra heap. */
    @Test
    void drawLoopAllocatesNothing() {
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        MimoOutageSimulator sim = new MimoOutageSimulator(new RayleighFading(), 4, 4);
        sim.estimate(10, 8, 20_000, 1);
        long id = Thread.currentThread().getId();
        long before = threads.getThreadAllocatedBytes(id);
        sim.estimate(10, 8, 1_000, 2);
        long small = threads.getThreadAllocatedBytes(id) - before;
        before = threads.getThreadAllocatedBytes(id);
        sim.estimate(10, 8, 21_000, 2);
        long large = threads.getThreadAllocatedBytes(id) - before;
        assertTrue(large - small < 4096, "20 000 extra draws allocated " + (large - small) + " bytes");
    }

    @Test
    void wilsonIntervalIsWilsons() {
        // E. B. Wilson 1927: (k + z²/2)/(n + z²) ± z/(n + z²)·√(k(n − k)/n + z²/4), z = 1.959964 for 95 %
        int k = 37;
        int n = 1000;
        double z = 1.959963984540054;
        double centre = (k + z * z / 2) / (n + z * z);
        double half = z / (n + z * z) * Math.sqrt((double) k * (n - k) / n + z * z / 4);
        OutageEstimate e = OutageEstimate.counted(k, n);
        assertEquals(centre - half, e.lower(), 1e-12);
        assertEquals(centre + half, e.upper(), 1e-12);
        assertEquals(0.037, e.probability(), 0.0);
        OutageEstimate exact = OutageEstimate.exact(0.25);
        assertEquals(0.25, exact.lower(), 0.0);
        assertEquals(0.25, exact.upper(CONFIDENCE), 0.0);
        assertEquals(0.0, OutageEstimate.counted(0, 10).lower(), 1e-15);
    }

    @Test
    void rejectsBadInput() {
        MimoOutageSimulator sim = new MimoOutageSimulator(new RayleighFading(), 2, 2);
        assertRejects(() -> sim.estimate(10, 2, 0, 1), "draws");
        assertRejects(() -> sim.bits(new double[4], 1), "2·Nr·Mt = 8");
        assertRejects(() -> sim.bits(new double[8], -1), ">= 0");
        assertRejects(() -> new MimoOutageSimulator(new RayleighFading(), 2, 0), "1..64");
        assertRejects(() -> OutageEstimate.counted(5, 4), "outages <= draws");
        assertRejects(() -> OutageEstimate.counted(1, 4).lower(1.0), "(0, 1)");
        assertRejects(() -> OutageEstimate.exact(1.5), "[0, 1]");
    }
}
