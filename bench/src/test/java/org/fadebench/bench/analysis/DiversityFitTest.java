package org.fadebench.bench.analysis;

import static org.fadebench.bench.analysis.BoundCurvesTest.assertMessage;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.modem.ErrorRates;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation.Kind;
import org.junit.jupiter.api.Test;

class DiversityFitTest {

    private static final double[] HIGH_SNR_DB = {30, 35, 40, 45, 50};

    /**
     * The STBC outage of i.i.d. Rayleigh fading falls as SNR^(−Mt·Nr) at high SNR (D. Tse and P.
     * Viswanath, Fundamentals of Wireless Communication, 2005, ch. 5: p_out ≈ (2^R−1)^L/(L!·SNR^L)
     * with L = Mt·Nr). Its local slope is −L·(1 − O(x)) with x ≤ 3·10^-3 here, so the fitted
     * order is within 0.01 of L.
     */
    @Test
    void outageCurvesHaveOrderMtTimesNr() {
        int[][] links = {{1, 1}, {1, 3}, {2, 1}, {2, 2}, {4, 1}};
        for (int[] l : links) {
            double codeRate = l[0] == 4 ? 0.75 : 1.0;
            BoundSettings s = new BoundSettings(l[1], l[0], codeRate, Modulation.QPSK, 1.0, Kind.CODED_MODULATION,
                    1, 1L, null, null);
            double[] values = new double[HIGH_SNR_DB.length];
            for (int i = 0; i < values.length; i++) {
                values[i] = s.stbcOutage(HIGH_SNR_DB[i]);
            }
            DiversityFit fit = DiversityFit.ofCurve(HIGH_SNR_DB, values, 3).orElseThrow();
            assertEquals(l[0] * l[1], fit.order(), 0.01, l[0] + "x" + l[1]);
            assertEquals(List.of(40.0, 45.0, 50.0), fit.snrDbUsed());
            assertFalse(fit.hasInterval());
        }
    }

    /**
     * BPSK with L-branch MRC in Rayleigh fading, exact BER (Proakis and Salehi, Digital
     * Communications, 5th ed., 2008, Sec. 13.4; section from memory): at high SNR
     * P_b ≈ C(2L−1, L)·(4γ̄)^(−L), slope −L.
     */
    @Test
    void mrcBerHasOrderL() {
        for (int branches = 1; branches <= 4; branches++) {
            double[] ber = new double[HIGH_SNR_DB.length];
            for (int i = 0; i < ber.length; i++) {
                ber[i] = ErrorRates.rayleighMrcBpskBitErrorRate(branches, Math.pow(10, HIGH_SNR_DB[i] / 10));
            }
            assertEquals(branches, DiversityFit.ofCurve(HIGH_SNR_DB, ber, 4).orElseThrow().order(), 0.01,
                    branches + " branches");
        }
    }

    /**
     * With two points the line passes through both whatever the weights, and the slope's variance
     * is the sum of the two points' variances over Δx²; each variance is (1−p̂)/(k·ln²10) (the delta
     * method; see {@link DiversityFit}).
     */
    @Test
    void twoPointFitByHand() {
        long[] errors = {400, 25};
        long[] trials = {1000, 10_000};
        DiversityFit fit = DiversityFit.ofCounts(new double[] {10, 20}, errors, trials, 10, 2).orElseThrow();
        double ln10 = Math.log(10);
        double expectedOrder = -(Math.log10(0.0025) - Math.log10(0.4)) / 1.0;
        double var = (1 - 0.4) / (400 * ln10 * ln10) + (1 - 0.0025) / (25 * ln10 * ln10);
        assertEquals(expectedOrder, fit.order(), 1e-12);
        assertEquals(Math.sqrt(var), fit.standardError(), 1e-12);
        assertEquals(fit.order() - 1.959963984540054 * fit.standardError(), fit.low(), 1e-9);
        assertEquals(fit.order() + 1.959963984540054 * fit.standardError(), fit.high(), 1e-9);
    }

    /**
     * Synthetic counts from FER = 0.5·(SNR/10)^(−3) at 10, 13, 16, 19 dB with 20 000 frames each,
     * drawn from Binomial(n, p) with fixed seeds: the interval from seed 1 covers 3, and over 400
     * seeds the 95 % interval covers 3 between 91 % and 99 % of the time (the coverage count is
     * Binomial(400, 0.95), standard deviation 1.1 %; the band is 3.6 standard deviations wide on
     * each side, so a right formula fails it with probability below 10^-3, and the seeds are fixed).
     */
    @Test
    void syntheticSlopeIsRecoveredWithHonestIntervals() {
        double[] snrDb = {10, 13, 16, 19};
        long[] trials = {20_000, 20_000, 20_000, 20_000};
        DiversityFit first = DiversityFit.ofCounts(snrDb, binomialCounts(snrDb, trials, 1L), trials, 10, 4)
                .orElseThrow();
        assertTrue(first.low() < 3 && 3 < first.high(), first.toString());
        assertEquals(4, first.snrDbUsed().size());
        int covered = 0;
        int runs = 400;
        for (long seed = 1; seed <= runs; seed++) {
            DiversityFit f = DiversityFit.ofCounts(snrDb, binomialCounts(snrDb, trials, seed), trials, 10, 4)
                    .orElseThrow();
            covered += f.low() < 3 && 3 < f.high() ? 1 : 0;
        }
        assertTrue(covered >= 0.91 * runs && covered <= 0.99 * runs, "coverage " + covered + "/" + runs);
    }

    private static long[] binomialCounts(double[] snrDb, long[] trials, long seed) {
        UniformRandomProvider rng = RandomSource.XO_SHI_RO_256_PP.create(seed);
        long[] k = new long[snrDb.length];
        for (int i = 0; i < k.length; i++) {
            double p = 0.5 * Math.pow(Math.pow(10, snrDb[i] / 10) / 10, -3);
            k[i] = BinomialDistribution.of((int) trials[i], p).createSampler(rng).sample();
        }
        return k;
    }

    /** The tail is the last usable points by SNR, whatever the input order; short tails use what there is. */
    @Test
    void tailSelection() {
        // SNR order: 0 dB all frames wrong (unusable), 5 and 10 dB usable, 15 dB too few errors.
        double[] snrDb = {15, 0, 10, 5};
        long[] errors = {3, 100, 40, 400};
        long[] trials = {10_000, 100, 10_000, 1_000};
        DiversityFit fit = DiversityFit.ofCounts(snrDb, errors, trials, 10, 3).orElseThrow();
        assertEquals(List.of(5.0, 10.0), fit.snrDbUsed());
        assertEquals(List.of(10.0, 15.0),
                DiversityFit.ofCounts(snrDb, errors, trials, 3, 2).orElseThrow().snrDbUsed());
        assertEquals(Optional.empty(), DiversityFit.ofCounts(snrDb, errors, trials, 50, 3));
        assertEquals(Optional.empty(), DiversityFit.ofCurve(new double[] {0, 1, 2}, new double[] {1, 0.5, 0}, 2));
    }

    @Test
    void pointsUseFrameCounts() {
        List<PointResult> points = new ArrayList<>();
        long[][] counts = {{400, 1000}, {25, 10_000}};
        for (int i = 0; i < counts.length; i++) {
            FrameCounters c = FrameCounters.of(counts[i][1], counts[i][0], 1000 * counts[i][1], counts[i][0], 0, 0, 0, 0, 0);
            points.add(new PointResult(i, 10 * (i + 1), 0, c, 0, 1, 0, 1, true, 0));
        }
        assertEquals(DiversityFit.ofCounts(new double[] {10, 20}, new long[] {400, 25}, new long[] {1000, 10_000}, 10, 2),
                DiversityFit.ofPoints(points, 10, 2));
    }

    @Test
    void badInputIsNamed() {
        double[] s = {1, 2};
        long[] k = {5, 5};
        long[] n = {10, 10};
        assertMessage(() -> DiversityFit.ofCounts(s, k, n, 10, 1), "tail points must be >= 2 (a line needs two), got 1");
        assertMessage(() -> DiversityFit.ofCounts(s, k, n, 0, 2), "minimum errors per fitted point must be >= 1, got 0");
        assertMessage(() -> DiversityFit.ofCounts(s, new long[] {5}, n, 1, 2),
                "got 1 error counts for 2 SNR points; need one per point");
        assertMessage(() -> DiversityFit.ofCounts(s, new long[] {11, 5}, n, 1, 2),
                "need 0 <= errors <= trials, got 11 errors in 10 trials at 1.0 dB");
        assertMessage(() -> DiversityFit.ofCurve(new double[] {3, 3}, new double[] {0.1, 0.01}, 2),
                "SNR points must be distinct, got 3.0 dB twice");
        assertMessage(() -> DiversityFit.ofCurve(new double[] {3, Double.NaN}, new double[] {0.1, 0.01}, 2),
                "SNR points must be finite numbers of dB, got NaN");
    }
}
