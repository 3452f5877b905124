package org.fadebench.bench.analysis;

import static org.fadebench.bench.analysis.BoundCurvesTest.assertMessage;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.OptionalDouble;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation.Kind;
import org.junit.jupiter.api.Test;

class TargetCrossingTest {

    /** A curve straight in (dB, log10 value) is interpolated exactly: log10 p = −0.2·(s − 5) is 1e-2 at 15 dB. */
    @Test
    void logLinearCurveIsExact() {
        double[] snrDb = {20, 0, 4, 8, 12, 16};
        double[] p = new double[snrDb.length];
        for (int i = 0; i < p.length; i++) {
            p[i] = Math.pow(10, -0.2 * (snrDb[i] - 5));
        }
        assertEquals(15.0, TargetCrossing.interpolate(snrDb, p, 1e-2).getAsDouble(), 1e-12);
        assertEquals(12.5, TargetCrossing.interpolate(snrDb, p, Math.pow(10, -1.5)).getAsDouble(), 1e-12);
    }

    /** Between 0.2 at 10 dB and 0.002 at 12 dB, 0.02 is halfway in log10: 11 dB. A point on the target is itself. */
    @Test
    void bracketingPairByHand() {
        assertEquals(11.0, TargetCrossing.interpolate(new double[] {10, 12}, new double[] {0.2, 0.002}, 0.02)
                .getAsDouble(), 1e-12);
        assertEquals(12.0, TargetCrossing.interpolate(new double[] {10, 12, 14}, new double[] {0.2, 0.01, 0.001}, 0.01)
                .getAsDouble(), 1e-12);
    }

    /** A noisy curve that dips, rises and dips again: the first crossing counts. */
    @Test
    void firstCrossingWins() {
        double[] snrDb = {0, 2, 4, 6};
        double[] p = {0.1, 0.001, 0.1, 0.001};
        assertEquals(1.0, TargetCrossing.interpolate(snrDb, p, 0.01).getAsDouble(), 1e-12);
    }

    @Test
    void notReached() {
        double[] snrDb = {0, 5, 10};
        assertEquals(OptionalDouble.empty(), TargetCrossing.interpolate(snrDb, new double[] {0.9, 0.5, 0.2}, 0.01),
                "never falls that far");
        assertEquals(OptionalDouble.empty(), TargetCrossing.interpolate(snrDb, new double[] {0.005, 1e-3, 1e-4}, 0.01),
                "below the target already at the first point: no extrapolation");
        assertEquals(OptionalDouble.empty(), TargetCrossing.interpolate(snrDb, new double[] {0.5, 0.1, 0.0}, 0.01),
                "a point with no errors has no logarithm");
        assertEquals(OptionalDouble.empty(), TargetCrossing.interpolate(new double[] {3}, new double[] {0.5}, 0.01));
        BoundSettings full = new BoundSettings(1, 2, 1.0, Modulation.QPSK, 2.0, Kind.CODED_MODULATION, 1, 1L, null, null);
        assertEquals(OptionalDouble.empty(), TargetCrossing.ofClosedForm(full::qamOutage, 0.01),
                "QAM bound is 1 at R = r·log2 M");
    }

    /** Zero-error points are skipped, so the pair around them still brackets the target. */
    @Test
    void zeroPointsAreSkipped() {
        double[] snrDb = {0, 2, 4, 6};
        double[] p = {0.2, 0.0, 0.002, 0.0};
        assertEquals(2.0, TargetCrossing.interpolate(snrDb, p, 0.02).getAsDouble(), 1e-12);
    }

    /**
     * SISO Rayleigh outage p = 1 − exp(−(2^R−1)/SNR) (D. Tse and P. Viswanath, Fundamentals of
     * Wireless Communication, 2005, Sec. 5.4.1; from memory) inverts to SNR = −(2^R−1)/ln(1 − p).
     */
    @Test
    void closedFormCrossingInvertsSisoOutage() {
        BoundSettings siso = new BoundSettings(1, 1, 1.0, Modulation.QPSK, 1.5, Kind.CODED_MODULATION, 1, 1L, null, null);
        double target = 1e-3;
        double expected = 10 * Math.log10(-(Math.pow(2, 1.5) - 1) / Math.log1p(-target));
        assertEquals(expected, TargetCrossing.ofClosedForm(siso::stbcOutage, target).getAsDouble(), 1e-8);
    }

    @Test
    void simulatedFerOfPoints() {
        List<PointResult> points = List.of(point(0, 10, 200, 1000), point(1, 12, 20, 10_000));
        assertEquals(11.0, TargetCrossing.ofPoints(points, 0.02).getAsDouble(), 1e-12);
    }

    @Test
    void targetMustBeAProbability() {
        for (double bad : new double[] {0, 1, -0.5, Double.NaN}) {
            assertMessage(() -> TargetCrossing.interpolate(new double[] {1, 2}, new double[] {0.5, 0.1}, bad),
                    "target error rate must be in (0, 1), e.g. 0.01, got " + bad);
            assertMessage(() -> TargetCrossing.ofClosedForm(s -> 0.5, bad), "target error rate must be in (0, 1)");
        }
        assertMessage(() -> TargetCrossing.interpolate(new double[] {1, 2}, new double[] {0.5}, 0.1),
                "got 1 curve values for 2 SNR points; need one per point");
    }

    static PointResult point(int index, double snrDb, long frameErrors, long frames) {
        FrameCounters c = FrameCounters.of(frames, frameErrors, 100 * frames, 3 * frameErrors, 0, 0, 0, 0, 0);
        return new PointResult(index, snrDb, snrDb, c, 0, 1, 0, 1, true, 0);
    }
}
