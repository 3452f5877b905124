package org.fadebench.bench.analysis;

import static org.fadebench.bench.analysis.BoundCurvesTest.assertMessage;
import static org.fadebench.bench.analysis.TargetCrossingTest.point;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.List;
import java.util.OptionalDouble;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation.Kind;
import org.junit.jupiter.api.Test;

class LinkAnalysisTest {

    private static final LinkSettings SISO_BPSK = new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, 1, 1,
            Fading.RAYLEIGH, 100, 0);

    /** FER falls a decade per 5 dB: 0.2 at 20 dB ... 2e-4 at 35 dB (the last point has only 2 errors). */
    private static final List<PointResult> SWEEP = List.of(point(0, 20, 2000, 10_000), point(1, 25, 200, 10_000),
            point(2, 30, 20, 10_000), point(3, 35, 2, 10_000));

    /**
     * The simulated FER crosses 1e-2 at 25 + 5·log10(2) dB (log-linear between 0.02 and 0.002).
     * The SISO bound at R = 1 is 1 − exp(−1/SNR) (D. Tse and P. Viswanath, Fundamentals of Wireless
     * Communication, 2005, Sec. 5.4.1; from memory), at 1e-2 for SNR = −1/ln(0.99). BPSK
     * uncoded carries R = 1 = log2 M, so its QAM bound is 1 and its gap is "not reached".
     */
    @Test
    void sisoSweepAgainstItsBounds() {
        BoundSettings settings = BoundSettings.of(SISO_BPSK);
        assertEquals(1.0, settings.spectralEfficiency());
        BoundCurves curves = BoundCurves.compute(settings, new double[] {20, 25, 30, 35});
        LinkAnalysis a = LinkAnalysis.of(SWEEP, curves);

        double sim = 25 + 5 * Math.log10(2);
        double bound = 10 * Math.log10(-1 / Math.log(0.99));
        assertEquals(sim, a.snrDbAtTarget().getAsDouble(), 1e-9);
        assertEquals(sim - bound, a.gapDb(Bound.MIMO).getAsDouble(), 1e-8);
        assertEquals(sim - bound, a.gapDb(Bound.STBC).getAsDouble(), 1e-8);
        assertEquals(OptionalDouble.empty(), a.gapDb(Bound.QAM));

        DiversityFit fit = a.diversity().orElseThrow();
        assertEquals(2.0, fit.order(), 1e-12, "a decade per 5 dB is slope −2");
        assertEquals(List.of(20.0, 25.0, 30.0), fit.snrDbUsed(), "35 dB has fewer than 10 errors");
        assertEquals(1.0, a.bounds().get(Bound.STBC).diversity().orElseThrow().order(), 0.01);
    }

    @Test
    void jsonShape() {
        BoundCurves curves = BoundCurves.compute(BoundSettings.of(SISO_BPSK), new double[] {20, 25, 30, 35});
        JsonNode json = new ObjectMapper().valueToTree(LinkAnalysis.of(SWEEP, curves).toJson());
        assertTrue(json.get("target_fer") == null && json.get("gap_db") == null, "the summary says these once");
        JsonNode bounds = json;
        assertEquals(1.0, bounds.get("spectral_efficiency").asDouble());
        assertEquals("cm", bounds.get("information").asText());
        assertEquals(1, bounds.get("fading_blocks").asInt());
        assertEquals("exact", bounds.get("mimo").get("method").asText());
        assertTrue(bounds.get("mimo").get("draws").isNull());
        assertTrue(bounds.get("stbc").get("diversity_order").get("standard_error").isNull());
        assertTrue(bounds.get("qam").get("snr_db_at_target").isNull());
        assertEquals("full_rate", bounds.get("qam").get("reach").asText());
        assertEquals(Reach.FULL_RATE.words(), bounds.get("qam").get("note").asText());
        assertTrue(bounds.get("qam").get("diversity_order").isNull(), "1 everywhere: nothing to fit");
        assertEquals(10, json.get("fit").get("min_errors").asInt());
        assertEquals(3, json.get("fit").get("tail_points").asInt());
        JsonNode points = bounds.get("points");
        assertEquals(4, points.size());
        assertEquals(20.0, points.get(0).get("snr_db").asDouble());
        assertEquals(curves.points().get(0).value(Bound.STBC), points.get(0).get("stbc").get("value").asDouble());
        assertTrue(points.get(0).get("stbc").get("ci_low").isNull(), "a closed form has no interval");
    }

    /** At R below log2 M the QAM bound is reached, later than the Gaussian STBC bound. */
    @Test
    void qamGapAtALowerRate() {
        BoundSettings settings = BoundSettings.of(SISO_BPSK).withSpectralEfficiency(0.5);
        LinkAnalysis a = LinkAnalysis.of(SWEEP, BoundCurves.compute(settings, new double[] {20, 25, 30, 35}));
        double qam = a.gapDb(Bound.QAM).getAsDouble();
        double stbc = a.gapDb(Bound.STBC).getAsDouble();
        assertTrue(qam < stbc, "qam gap " + qam + " vs stbc gap " + stbc);
    }

    /** The Monte Carlo MIMO bound: crossing by interpolation, fit only over points with enough outages. */
    @Test
    void monteCarloMimoBound() {
        BoundSettings settings = new BoundSettings(2, 2, 1.0, Modulation.QPSK, 2.0, Kind.CODED_MODULATION, 4000, 3L, null, null);
        double[] snrDb = {0, 3, 6, 9, 12, 15, 18};
        BoundCurves curves = BoundCurves.compute(settings, snrDb);
        LinkAnalysis a = LinkAnalysis.of(SWEEP, curves, 0.05, 10, 3);
        assertEquals(TargetCrossing.interpolate(snrDb, curves.shown(Bound.MIMO), 0.05),
                a.bounds().get(Bound.MIMO).snrDbAtTarget());
        DiversityFit fit = a.bounds().get(Bound.MIMO).diversity().orElseThrow();
        for (double used : fit.snrDbUsed()) {
            BoundPoint p = curves.points().stream().filter(q -> q.snrDb() == used).findFirst().orElseThrow();
            assertTrue(p.mimo().outages() >= 10, p.toString());
        }
        BoundPoint last = curves.points().get(snrDb.length - 1);
        assertTrue(last.mimo().outages() < 10 && !fit.snrDbUsed().contains(last.snrDb()), last.toString());
    }

    @Test
    void badInputIsNamed() {
        BoundCurves curves = BoundCurves.compute(BoundSettings.of(SISO_BPSK), new double[] {20});
        assertMessage(() -> LinkAnalysis.of(SWEEP, curves, 1.5, 10, 3), "target error rate must be in (0, 1)");
        assertMessage(() -> LinkAnalysis.of(SWEEP, curves, 0.01, 0, 3), "minimum errors per fitted point must be >= 1");
        assertMessage(() -> LinkAnalysis.of(SWEEP, curves, 0.01, 10, 1), "tail points must be >= 2");
    }
}
