package org.fadebench.modem;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

class QamConstellationTest {

    private static double[][] allPoints(QamConstellation c) {
        int m = c.modulation().order();
        double[][] pts = new double[m][2];
        for (int label = 0; label < m; label++) {
            c.point(label, pts[label]);
        }
        return pts;
    }

    @ParameterizedTest
    @EnumSource(Modulation.class)
    void unitAverageEnergyAndDistinctPoints(Modulation mod) {
        double[][] pts = allPoints(mod.constellation());
        double energy = 0;
        for (double[] p : pts) {
            energy += p[0] * p[0] + p[1] * p[1];
        }
        assertEquals(1.0, energy / pts.length, 1e-12, "average symbol energy");
        for (int a = 0; a < pts.length; a++) {
            for (int b = a + 1; b < pts.length; b++) {
                assertTrue(Math.hypot(pts[a][0] - pts[b][0], pts[a][1] - pts[b][1]) > 1e-9);
            }
        }
    }

    /** Gray labelling: nearest neighbours differ in exactly one bit (definition of a Gray map). */
    @ParameterizedTest
    @EnumSource(Modulation.class)
    void nearestNeighboursDifferInOneBit(Modulation mod) {
        QamConstellation c = mod.constellation();
        double[][] pts = allPoints(c);
        double dmin = 2 * c.halfSpacing();
        int pairs = 0;
        for (int a = 0; a < pts.length; a++) {
            for (int b = a + 1; b < pts.length; b++) {
                double d = Math.hypot(pts[a][0] - pts[b][0], pts[a][1] - pts[b][1]);
                if (Math.abs(d - dmin) < 1e-9) {
                    assertEquals(1, Integer.bitCount(a ^ b), "labels " + a + " and " + b);
                    pairs++;
                }
            }
        }
        int l = c.levelsPerAxis();
        int expected = mod == Modulation.BPSK ? 1 : 2 * l * (l - 1);
        assertEquals(expected, pairs, "number of nearest-neighbour pairs on the square grid");
    }

    @Test
    void knownPoints() {
        // Common practice, no source: BPSK bit 0 -> +1; QPSK bits (0,1) -> (+1 - j)/√2.
        double[] p = new double[2];
        Modulation.BPSK.constellation().point(0, p);
        assertArrayEquals(new double[] {1, 0}, p, 0);
        Modulation.QPSK.constellation().point(0b01, p);
        assertArrayEquals(new double[] {Math.sqrt(0.5), -Math.sqrt(0.5)}, p, 1e-15);
        // 16-QAM: label 0000 is the outer corner (+3 + 3j)/√10.
        Modulation.QAM16.constellation().point(0, p);
        assertArrayEquals(new double[] {3 / Math.sqrt(10), 3 / Math.sqrt(10)}, p, 1e-15);
    }

    /** Slicing equals exhaustive minimum-distance search over all points. */
    @ParameterizedTest
    @EnumSource(Modulation.class)
    void hardDecisionEqualsExhaustiveSearch(Modulation mod) {
        QamConstellation c = mod.constellation();
        double[][] pts = allPoints(c);
        int k = c.bitsPerSymbol();
        Random rnd = new Random(7);
        double[] y = new double[2];
        byte[] bits = new byte[k];
        for (int trial = 0; trial < 20_000; trial++) {
            y[0] = 2.5 * rnd.nextGaussian();
            y[1] = mod == Modulation.BPSK ? 0 : 2.5 * rnd.nextGaussian();
            c.demapHard(y, 0, bits, 0, 1);
            int best = 0;
            double bestD = Double.MAX_VALUE;
            for (int label = 0; label < pts.length; label++) {
                double d = Math.pow(y[0] - pts[label][0], 2) + Math.pow(y[1] - pts[label][1], 2);
                if (d < bestD) {
                    bestD = d;
                    best = label;
                }
            }
            int got = 0;
            for (byte b : bits) {
                got = (got << 1) | b;
            }
            assertEquals(best, got, "y=" + y[0] + "," + y[1]);
        }
    }

    @ParameterizedTest
    @EnumSource(Modulation.class)
    void mapThenDemapRoundTrips(Modulation mod) {
        QamConstellation c = mod.constellation();
        int n = 1000;
        byte[] bits = new byte[n * c.bitsPerSymbol()];
        Random rnd = new Random(3);
        for (int i = 0; i < bits.length; i++) {
            bits[i] = (byte) rnd.nextInt(2);
        }
        double[] s = new double[2 * (n + 1)];
        c.map(bits, 0, s, 1, n);
        byte[] back = new byte[bits.length];
        c.demapHard(s, 1, back, 0, n);
        assertArrayEquals(bits, back);
    }

    /**
     * Mapping bits into planes and LLRs out of them (every third symbol in a plane, the bits of the
     * others in between) give exactly the interleaved map's symbols and the interleaved demapper's
     * LLRs, max-log and exact, and map agrees with mapLabels.
     */
    @ParameterizedTest
    @EnumSource(Modulation.class)
    void planarBitsAndLlrsEqualInterleaved(Modulation mod) {
        QamConstellation c = mod.constellation();
        int k = c.bitsPerSymbol();
        int perBlock = 3;
        int blocks = 200;
        int n = perBlock * blocks;
        Random rnd = new Random(6);
        byte[] bits = new byte[k * n];
        int[] labels = new int[n];
        for (int i = 0; i < bits.length; i++) {
            bits[i] = (byte) rnd.nextInt(2);
            labels[i / k] = (labels[i / k] << 1) | bits[i];
        }
        double[] s = new double[2 * n];
        c.map(bits, 0, s, 0, n);
        double[] fromLabels = new double[2 * n];
        c.mapLabels(labels, 0, fromLabels, 0, n);
        assertArrayEquals(fromLabels, s);
        double[] gain = new double[n];
        double[] blockGain = new double[blocks];
        for (int b = 0; b < blocks; b++) {
            blockGain[b] = 0.2 + 3 * rnd.nextDouble();
            for (int j = 0; j < perBlock; j++) {
                gain[perBlock * b + j] = blockGain[b];
            }
        }
        double[][] re = new double[perBlock][blocks];
        double[][] im = new double[perBlock][blocks];
        for (int j = 0; j < perBlock; j++) {
            c.map(bits, j * k, perBlock * k, re[j], im[j], blocks);
            for (int b = 0; b < blocks; b++) {
                assertEquals(s[2 * (perBlock * b + j)], re[j][b], 0.0);
                assertEquals(s[2 * (perBlock * b + j) + 1], im[j][b], 0.0);
                re[j][b] += rnd.nextGaussian() * (b % 7 == 0 ? 3.0 : 0.3);
                im[j][b] += rnd.nextGaussian() * 0.3;
                s[2 * (perBlock * b + j)] = re[j][b];
                s[2 * (perBlock * b + j) + 1] = im[j][b];
            }
        }
        for (LlrMethod method : LlrMethod.values()) {
            double[] interleaved = new double[k * n];
            c.demap(method, s, gain, 0, 0.3, interleaved, 0, n);
            double[] planar = new double[k * n];
            for (int j = 0; j < perBlock; j++) {
                c.demap(method, re[j], im[j], blockGain, 0.3, planar, j * k, perBlock * k, blocks);
            }
            // assertArrayEquals on double[] without a delta compares the bit patterns
            assertArrayEquals(interleaved, planar, mod + " " + method);
        }
    }

    /** Planar mapping and slicing give exactly the interleaved ones' symbols and labels. */
    @ParameterizedTest
    @EnumSource(Modulation.class)
    void planarLabelsEqualInterleaved(Modulation mod) {
        QamConstellation c = mod.constellation();
        int n = 500;
        int from = 2;
        Random rnd = new Random(4);
        int[] labels = new int[from + n];
        for (int i = from; i < labels.length; i++) {
            labels[i] = rnd.nextInt(mod.order());
        }
        double[] s = new double[2 * n];
        c.mapLabels(labels, from, s, 0, n);
        double[] re = new double[from + n];
        double[] im = new double[from + n];
        c.mapLabels(labels, re, im, from, n);
        for (int i = 0; i < n; i++) {
            assertEquals(s[2 * i], re[from + i], 0.0);
            assertEquals(s[2 * i + 1], im[from + i], 0.0);
        }
        // noisy estimates, some far outside the constellation
        for (int i = 0; i < 2 * n; i++) {
            s[i] += rnd.nextGaussian() * (i % 7 == 0 ? 3.0 : 0.3);
        }
        for (int i = 0; i < n; i++) {
            re[from + i] = s[2 * i];
            im[from + i] = s[2 * i + 1];
        }
        int[] expected = new int[n];
        c.demapLabels(s, 0, expected, 0, n);
        int[] got = new int[from + n];
        c.demapLabels(re, im, got, from, n);
        for (int i = 0; i < n; i++) {
            assertEquals(expected[i], got[from + i]);
        }
    }

    /**
     * Values on one axis: the decision boundaries (L-2-2j)·h and the amplitudes themselves, each
     * nudged by 0 to ±4 ulps and by ±1e-9 relative, and 0, -0, ±1e300, ±infinity and NaN.
     */
    private static java.util.List<Double> nearBoundaries(QamConstellation c) {
        int levels = c.levelsPerAxis();
        double h = c.halfSpacing();
        java.util.List<Double> axis = new java.util.ArrayList<>();
        for (int j = -1; j <= 2 * levels - 1; j++) {
            double v = (levels - 1 - j) * h;
            double up = v;
            double down = v;
            axis.add(v);
            for (int u = 0; u < 4; u++) {
                up = Math.nextUp(up);
                down = Math.nextDown(down);
                axis.add(up);
                axis.add(down);
            }
            axis.add(v * (1 + 1e-9));
            axis.add(v * (1 - 1e-9));
        }
        for (double v : new double[] {0.0, -0.0, 1e300, -1e300, Double.POSITIVE_INFINITY,
            Double.NEGATIVE_INFINITY, Double.NaN}) {
            axis.add(v);
        }
        return axis;
    }

    /**
     * The max-log LLRs are, bit for bit, those of the plain search over every level of the bit's
     * axis, min over d² = (y - a)² with the bit 1 less min with the bit 0, times gain / n0 (the form
     * the demapper keeps for 8 and 16 levels; common practice, no source):
     * for estimates on and within ulps of every boundary and amplitude, far outside, infinite, NaN,
     * and Gaussian around the points.
     */
    @ParameterizedTest
    @EnumSource(Modulation.class)
    void maxLogLlrIsTheSearchOverEveryLevelBitForBit(Modulation mod) {
        QamConstellation c = mod.constellation();
        int k = c.bitsPerSymbol();
        int m = mod == Modulation.BPSK ? 1 : k / 2;
        int levels = c.levelsPerAxis();
        double[] amplitudeOfAxisLabel = new double[levels];
        double[] point = new double[2];
        for (int g = 0; g < levels; g++) {
            c.point(mod == Modulation.BPSK ? g : g << m, point);
            amplitudeOfAxisLabel[g] = point[0];
        }
        java.util.List<Double> axis = nearBoundaries(c);
        Random rnd = new Random(17);
        double[] y = new double[2];
        double[] gain = new double[1];
        double[] llr = new double[k];
        for (int trial = 0; trial < 40000; trial++) {
            for (int a = 0; a < 2; a++) {
                y[a] = trial % 2 == 0 ? axis.get(rnd.nextInt(axis.size()))
                        : amplitudeOfAxisLabel[rnd.nextInt(levels)] + 0.4 * rnd.nextGaussian();
            }
            gain[0] = 0.1 + 3 * rnd.nextDouble();
            double n0 = 0.05 + rnd.nextDouble();
            c.demapMaxLog(y, gain, 0, n0, llr, 0, 1);
            for (int j = 0; j < k; j++) {
                double v = y[j / m];
                int shift = m - 1 - j % m;
                double min0 = Double.POSITIVE_INFINITY;
                double min1 = Double.POSITIVE_INFINITY;
                for (int g = 0; g < levels; g++) {
                    double d = v - amplitudeOfAxisLabel[g];
                    double d2 = d * d;
                    if (((g >>> shift) & 1) == 0) {
                        min0 = d2 < min0 ? d2 : min0;
                    } else {
                        min1 = d2 < min1 ? d2 : min1;
                    }
                }
                double expected = (min1 - min0) * (gain[0] / n0);
                assertEquals(Double.doubleToLongBits(expected), Double.doubleToLongBits(llr[j]),
                        mod + " y = " + v + " bit " + j + ": " + expected + " against " + llr[j]);
            }
        }
    }

    /**
     * Counting hard-decision errors against the symbols sent equals slicing every estimate and
     * comparing labels (bits by popcount, symbols by inequality), in planar and interleaved form,
     * for estimates that sit on both sides of every decision boundary within a few ulps, exactly on
     * it, far outside the constellation, at ±infinity and NaN, and under Gaussian noise of several
     * strengths. The check that skips slicing must never skip a wrong decision.
     */
    @ParameterizedTest
    @EnumSource(Modulation.class)
    void countingHardErrorsEqualsSlicingEveryEstimate(Modulation mod) {
        QamConstellation c = mod.constellation();
        double h = c.halfSpacing();
        java.util.List<Double> axis = nearBoundaries(c);
        Random rnd = new Random(11);
        int n = 20000;
        int[] labels = new int[n];
        double[] sent = new double[2 * n];
        double[] sentRe = new double[n];
        double[] sentIm = new double[n];
        double[] est = new double[2 * n];
        for (int i = 0; i < n; i++) {
            labels[i] = rnd.nextInt(mod.order());
        }
        c.mapLabels(labels, 0, sent, 0, n);
        c.mapLabels(labels, sentRe, sentIm, 0, n);
        for (int i = 0; i < 2 * n; i++) {
            if (i < n) {
                est[i] = axis.get(rnd.nextInt(axis.size()));
            } else {
                double sigma = new double[] {0.05, 0.3, 1.0, 5.0}[i % 4] * h;
                est[i] = sent[i] + sigma * rnd.nextGaussian();
            }
        }
        double[] re = new double[n];
        double[] im = new double[n];
        for (int i = 0; i < n; i++) {
            re[i] = est[2 * i];
            im[i] = est[2 * i + 1];
        }
        int[] decided = new int[n];
        c.demapLabels(est, 0, decided, 0, n);
        int bitErrors = 0;
        int symbolErrors = 0;
        for (int i = 0; i < n; i++) {
            bitErrors += Integer.bitCount(labels[i] ^ decided[i]);
            symbolErrors += labels[i] != decided[i] ? 1 : 0;
        }
        assertTrue(symbolErrors > n / 10, "the estimates exercise wrong decisions");
        int[] planar = {5, 7};
        c.countHardErrors(labels, sentRe, sentIm, re, im, 0, n, planar);
        assertArrayEquals(new int[] {5 + bitErrors, 7 + symbolErrors}, planar);
        int[] interleaved = new int[2];
        c.countHardErrors(labels, 0, sent, est, 0, n, interleaved);
        assertArrayEquals(new int[] {bitErrors, symbolErrors}, interleaved);
        // one symbol at a time, so a single wrong decision cannot hide among the others
        for (int i = 0; i < n; i++) {
            int[] one = new int[2];
            c.countHardErrors(labels, sentRe, sentIm, re, im, i, 1, one);
            assertEquals(Integer.bitCount(labels[i] ^ decided[i]), one[0], "symbol " + i);
        }
    }

    /**
     * Max-log LLR equals its definition evaluated by brute force over all M points (max-log
     * approximation of the bit LLR: Proakis and Salehi, Digital Communications, 5th ed.; common
     * practice), and its sign agrees with the hard decision.
     */
    @ParameterizedTest
    @EnumSource(Modulation.class)
    void maxLogLlrEqualsBruteForce(Modulation mod) {
        QamConstellation c = mod.constellation();
        double[][] pts = allPoints(c);
        int k = c.bitsPerSymbol();
        Random rnd = new Random(11);
        double[] y = new double[2];
        double[] gain = {0};
        double[] llr = new double[k];
        byte[] hard = new byte[k];
        for (int trial = 0; trial < 5000; trial++) {
            y[0] = 1.5 * rnd.nextGaussian();
            y[1] = mod == Modulation.BPSK ? 0 : 1.5 * rnd.nextGaussian();
            gain[0] = 0.1 + 3 * rnd.nextDouble();
            double n0 = 0.05 + rnd.nextDouble();
            c.demapMaxLog(y, gain, 0, n0, llr, 0, 1);
            c.demapHard(y, 0, hard, 0, 1);
            for (int j = 0; j < k; j++) {
                double min0 = Double.MAX_VALUE;
                double min1 = Double.MAX_VALUE;
                for (int label = 0; label < pts.length; label++) {
                    double d = Math.pow(y[0] - pts[label][0], 2) + Math.pow(y[1] - pts[label][1], 2);
                    if (((label >>> (k - 1 - j)) & 1) == 0) {
                        min0 = Math.min(min0, d);
                    } else {
                        min1 = Math.min(min1, d);
                    }
                }
                double expected = (min1 - min0) * gain[0] / n0;
                assertEquals(expected, llr[j], 1e-9 * (1 + Math.abs(expected)));
                if (Math.abs(llr[j]) > 1e-9) {
                    assertEquals(llr[j] > 0 ? 0 : 1, hard[j], "sign of LLR vs hard decision");
                }
            }
        }
    }

    @Test
    void namesAndErrors() {
        assertEquals(Modulation.QAM64, Modulation.fromCliName("64QAM"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Modulation.fromCliName("8psk"));
        assertTrue(e.getMessage().contains("bpsk, qpsk, 16qam, 64qam, 256qam"), e.getMessage());
    }

    /**
     * The exact LLR equals its definition over the full 2-D constellation with complex Gaussian
     * noise, ln Σ_{b=0} exp(-|y-s|²/σ²) - ln Σ_{b=1} exp(-|y-s|²/σ²) (bit LLR with equiprobable
     * symbols; Proakis and Salehi, Digital Communications, 5th ed.), computed naively here, and it
     * is never further from max-log than ln(M/2) (the log-sum-exp of M/2 terms exceeds its maximum
     * by at most that).
     */
    @ParameterizedTest
    @EnumSource(Modulation.class)
    void exactLlrEqualsDefinition(Modulation mod) {
        QamConstellation c = mod.constellation();
        double[][] pts = allPoints(c);
        int k = c.bitsPerSymbol();
        Random rnd = new Random(13);
        double[] y = new double[2];
        double[] gain = {0};
        double[] exact = new double[k];
        double[] maxLog = new double[k];
        for (int trial = 0; trial < 3000; trial++) {
            y[0] = 1.2 * rnd.nextGaussian();
            y[1] = mod == Modulation.BPSK ? 0 : 1.2 * rnd.nextGaussian();
            gain[0] = 0.2 + 2 * rnd.nextDouble();
            double n0 = 0.1 + rnd.nextDouble();
            c.demap(LlrMethod.EXACT, y, gain, 0, n0, exact, 0, 1);
            c.demap(LlrMethod.MAXLOG, y, gain, 0, n0, maxLog, 0, 1);
            double w = gain[0] / n0;
            for (int j = 0; j < k; j++) {
                double s0 = 0;
                double s1 = 0;
                for (int label = 0; label < pts.length; label++) {
                    double d = Math.pow(y[0] - pts[label][0], 2) + Math.pow(y[1] - pts[label][1], 2);
                    double e = Math.exp(-d * w);
                    if (((label >>> (k - 1 - j)) & 1) == 0) {
                        s0 += e;
                    } else {
                        s1 += e;
                    }
                }
                if (s0 > 1e-250 && s1 > 1e-250) {
                    double expected = Math.log(s0) - Math.log(s1);
                    assertEquals(expected, exact[j], 1e-9 * (1 + Math.abs(expected)), mod + " bit " + j);
                }
                assertTrue(Math.abs(exact[j] - maxLog[j]) <= Math.log(pts.length / 2.0) + 1e-9);
            }
        }
    }
}
