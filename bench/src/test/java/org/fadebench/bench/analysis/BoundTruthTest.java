package org.fadebench.bench.analysis;

import static org.fadebench.bench.analysis.TargetCrossingTest.point;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.Fading;
import org.fadebench.channel.OutageBounds;
import org.fadebench.channel.OutageEstimate;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/**
 * What the bounds and the summary must not get wrong: the bounds of the channel simulated, no
 * Monte Carlo value shown where it says nothing, one meaning per "not reached", and no confident
 * diversity order off its asymptote.
 */
class BoundTruthTest {

    private static LinkSettings alamouti(int rx, int coherence) {
        return new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, rx, 2, ChannelSpec.of(Fading.RAYLEIGH), 256,
                coherence, Equaliser.MF, new FrameCoding(new FecScheme(Crc.NONE, PuncturedCode.CONV_R12),
                        Interleaving.RANDOM, 0, LlrMethod.MAXLOG));
    }

    /** One fading block per frame (coherence 0, or as long as the frame): today's closed forms and counts, exactly. */
    @Test
    void oneBlockPerFrameKeepsTheQuasiStaticBounds() {
        for (LinkSettings link : List.of(alamouti(2, 0), alamouti(2, alamouti(2, 0).slotsPerFrame()))) {
            BoundSettings s = BoundSettings.of(link).withMimoDraws(5000, 4L);
            assertEquals(1, s.fadingBlocks());
            double r = link.bitsPerChannelUse();
            for (double snrDb : new double[] {0, 6, 12}) {
                BoundPoint p = s.point(snrDb, () -> false);
                assertTrue(p.stbc().isExact());
                assertEquals(OutageBounds.stbcOutage(snrDb, 2, 2, 1.0, r), p.value(Bound.STBC));
                OutageEstimate mimo = OutageBounds.mimoOutage(snrDb, 2, 2, r, 5000, 4L);
                assertEquals(mimo.outages(), p.mimo().outages());
                assertEquals(mimo.draws(), p.mimo().draws());
            }
        }
    }

    /**
     * Rician fading: the code bounds come from counted gain draws, so they carry an interval (a
     * band on the plot), and a count of 0 is not shown.
     */
    @Test
    void countedCodeBoundsCarryIntervals() {
        LinkSettings link = alamouti(1, 0);
        BoundSettings s = BoundSettings.of(link).withMimoDraws(4000, 2L)
                .withChannel(ChannelSpec.of(Fading.RICIAN).withKFactor(3));
        assertFalse(s.exact(Bound.STBC));
        BoundCurves c = BoundCurves.compute(s, new double[] {0, 10, 40});
        BoundPoint low = c.points().get(0);
        assertTrue(low.stbc().lower() < low.value(Bound.STBC) && low.value(Bound.STBC) < low.stbc().upper());
        BoundPoint high = c.points().get(2);
        assertEquals(0, high.stbc().outages(), "no outage in 4000 draws at 40 dB");
        assertTrue(Double.isNaN(high.shown(Bound.STBC)), "a 0 count is not shown");
        assertEquals(0.0, high.value(Bound.STBC));
    }

    /**
     * A link already below the target at its lowest SNR did reach it, below the sweep: it is told
     * apart from one that never falls to it, in the terminal's and the JSON's words.
     */
    @Test
    void linkBelowTheTargetFromTheStartIsNotALinkThatNeverReachedIt() {
        LinkSettings bpsk = new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, 1, 1, Fading.RAYLEIGH, 100, 0);
        // descending order on purpose: the lowest SNR decides, not the first point
        List<PointResult> low = List.of(point(1, 30, 2, 1000), point(0, 20, 5, 1000));
        RunSummary below = RunSummary.of(bpsk, low, null, 0.01, RunSummary.NO_BOUNDS);
        assertEquals(Reach.LINK_BELOW_RANGE, below.linkReach());
        assertEquals(Reach.LINK_BELOW_RANGE.words(), below.toJson().get("target_note"));
        assertTrue(below.lines().get(1).contains("already below the target at the lowest swept SNR"),
                below.lines().toString());
        List<PointResult> high = List.of(point(0, 0, 900, 1000), point(1, 5, 500, 1000));
        RunSummary never = RunSummary.of(bpsk, high, null, 0.01, RunSummary.NO_BOUNDS);
        assertEquals(Reach.LINK_NOT_REACHED, never.linkReach());
        assertEquals(Reach.LINK_NOT_REACHED.words(), never.toJson().get("target_note"));
    }

    /** Each way of not reaching the target has its own words. */
    @Test
    void notReachedMeansOneThingEach() {
        LinkSettings bpsk = new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, 1, 1, Fading.RAYLEIGH, 100, 0);
        List<PointResult> high = List.of(point(0, 0, 900, 1000), point(1, 5, 500, 1000), point(2, 10, 200, 1000));
        BoundCurves siso = BoundCurves.compute(BoundSettings.of(bpsk), new double[] {0, 5, 10});
        LinkAnalysis a = LinkAnalysis.of(high, siso);
        assertEquals(Reach.LINK_NOT_REACHED, a.linkReach());
        // the SISO bound at R = 1 reaches 1e-2 at 10·log10(−1/ln 0.99) ≈ 19.98 dB, beyond the sweep:
        // computed all the same from the closed form
        LinkAnalysis.BoundAnalysis stbc = a.bounds().get(Bound.STBC);
        assertEquals(Reach.OUTSIDE_RANGE, stbc.reach());
        assertEquals(10 * Math.log10(-1 / Math.log(0.99)), stbc.snrDbAtTarget().getAsDouble(), 1e-8);
        assertEquals(Reach.FULL_RATE, a.bounds().get(Bound.QAM).reach(), "uncoded BPSK carries R = log2 M");
        assertEquals(Reach.LINK_NOT_REACHED, a.gapReach(Bound.STBC));
        assertEquals(Reach.FULL_RATE, a.gapReach(Bound.QAM));
        assertEquals(Reach.ABOVE_ALPHABET, LinkAnalysis.of(high, BoundCurves.compute(
                BoundSettings.of(bpsk).withSpectralEfficiency(1.5), new double[] {0, 5, 10})).bounds()
                .get(Bound.QAM).reach());

        RunSummary summary = RunSummary.of(bpsk, high, siso, 0.01, RunSummary.NO_BOUNDS);
        String text = String.join("\n", summary.lines());
        assertTrue(text.contains("none: the link did not reach the target FER in the swept range"), text);
        assertTrue(text.contains("stbc outage bound at FER 0.01: 19.98 dB (outside the swept range; the curve was computed beyond it); no gap: "
                + "the link did not reach the target FER in the swept range"), text);
        assertTrue(text.contains("uncoded link at the constellation's full rate: the QAM-constrained bound is 1"), text);

        // a Monte Carlo bound whose 200 draws cannot resolve 1e-2 (it needs about 16 outages, so
        // --outage-draws 1500 or more; see OutageEstimate.drawsToResolve)
        LinkSettings twoByTwo = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, 2, Fading.RAYLEIGH, 128, 0);
        BoundCurves steep = BoundCurves.compute(BoundSettings.of(twoByTwo).withMimoDraws(200, 1L),
                new double[] {0, 30});
        LinkAnalysis.BoundAnalysis unresolved = LinkAnalysis.of(high, steep).bounds().get(Bound.MIMO);
        assertEquals(Reach.UNRESOLVED, unresolved.reach());
        long needed = OutageEstimate.drawsToResolve(0.01);
        assertTrue(needed > 1000 && needed < 2500, "needed " + needed);
        assertEquals(Reach.UNRESOLVED.words() + "; --outage-draws " + needed + " or more would resolve it",
                unresolved.note());
    }

    /**
     * A Monte Carlo bound (MIMO 2x2) that crosses the target outside the swept range, or between
     * a resolved and an unresolved swept point, is followed there on the same draws: the gap is
     * given, and the crossing agrees, within the counts' 95 % intervals, with the bound computed
     * directly around it.
     */
    @Test
    void monteCarloBoundIsFollowedToItsCrossing() {
        LinkSettings twoByTwo = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, 2, Fading.RAYLEIGH, 128, 0);
        BoundSettings s = BoundSettings.of(twoByTwo).withMimoDraws(20_000, 1L);
        // the link crosses 1e-2 between 24 and 26 dB; the MIMO bound at R = 2 crosses below 20 dB
        List<PointResult> link = List.of(point(0, 20, 5000, 100_000), point(1, 22, 2000, 100_000),
                point(2, 24, 1100, 100_000), point(3, 26, 500, 100_000));
        BoundCurves curves = BoundCurves.compute(s, new double[] {20, 22, 24, 26});
        assertTrue(curves.points().get(0).value(Bound.MIMO) < 0.01, "the MIMO bound is below 1e-2 at 20 dB");
        RunSummary summary = RunSummary.of(twoByTwo, link, curves, 0.01, RunSummary.NO_BOUNDS);
        LinkAnalysis.BoundAnalysis mimo = summary.analysis().bounds().get(Bound.MIMO);
        assertEquals(Reach.OUTSIDE_RANGE, mimo.reach());
        double crossing = mimo.snrDbAtTarget().getAsDouble();
        assertTrue(crossing < 20, "crossing " + crossing);
        assertEquals(summary.snrDbAtTarget().getAsDouble() - crossing, summary.gapDb(Bound.MIMO).getAsDouble(), 1e-12);
        assertEquals(summary.gapDb(Bound.MIMO).getAsDouble(),
                ((Map<?, ?>) summary.toJson().get("gap_db")).get("mimo"));
        // the bound computed directly at that SNR, on the same draws: its 95 % Wilson interval holds the target
        OutageEstimate direct = s.mimoOutage(crossing);
        assertTrue(direct.lower() <= 0.01 && 0.01 <= direct.upper(), direct.toString());
        // the extra points are listed apart from the swept ones
        assertTrue(curves.extra().isEmpty());
        assertFalse(summary.analysis().curves().extra().isEmpty());
        assertEquals(4, summary.analysis().curves().points().size());

        // from above the target at a resolved point to an unresolved 0 at the next: halved until resolved
        BoundCurves coarse = BoundCurves.compute(s, new double[] {0, 30});
        LinkAnalysis.BoundAnalysis between = LinkAnalysis.of(link, coarse).bounds().get(Bound.MIMO);
        assertEquals(Reach.IN_RANGE, between.reach());
        OutageEstimate atBetween = s.mimoOutage(between.snrDbAtTarget().getAsDouble());
        assertTrue(atBetween.lower() <= 0.01 && 0.01 <= atBetween.upper(), atBetween.toString());
    }

    /**
     * Alamouti 2x1 in i.i.d. Rayleigh: diversity order Mt·Nr = 2 (Tarokh, Jafarkhani and Calderbank
     * 1999). A fit of about 1 is not on that asymptote, and neither is a fit over FER above 1e-2.
     */
    @Test
    void diversityOffItsAsymptoteIsFlagged() {
        LinkSettings link = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, Fading.RAYLEIGH, 128, 0);
        AsymptoticDiversity expected = AsymptoticDiversity.of(link).orElseThrow();
        assertEquals(2.0, expected.order());
        // a decade per 10 dB (order 1) at FER 1e-1 .. 1e-3
        List<PointResult> shallow = List.of(point(0, 10, 10_000, 100_000), point(1, 20, 1000, 100_000),
                point(2, 30, 100, 100_000));
        RunSummary s = RunSummary.of(link, shallow, null, 0.01, RunSummary.NO_BOUNDS);
        assertEquals(1.0, s.diversity().orElseThrow().order(), 1e-9);
        assertTrue(s.warning().orElseThrow().contains("not yet on its asymptote"), s.warning().toString());
        assertTrue(String.join("\n", s.lines()).contains("not yet on its asymptote"), s.lines().toString());
        assertTrue(s.toJson().get("diversity_warning").toString().contains("asymptote 2.00"), s.toJson().toString());
        // order 2 at FER 1e-2 .. 1e-4: on the asymptote, no warning
        List<PointResult> steep = List.of(point(0, 20, 1000, 100_000), point(1, 25, 100, 100_000),
                point(2, 30, 10, 100_000));
        assertTrue(RunSummary.of(link, steep, null, 0.01, RunSummary.NO_BOUNDS).warning().isEmpty());
        // order 2 but every fitted FER above 1e-2
        List<PointResult> early = List.of(point(0, 0, 50_000, 100_000), point(1, 5, 5000, 100_000),
                point(2, 10, 1500, 100_000));
        RunSummary e = RunSummary.of(link, early, null, 0.01, RunSummary.NO_BOUNDS);
        assertTrue(e.warning().orElseThrow().contains("FER is above 0.01"), e.warning().toString());
        // no fading: no asymptote to compare with
        LinkSettings awgn = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, Fading.NONE, 128, 0);
        assertTrue(AsymptoticDiversity.of(awgn).isEmpty());
        // Nakagami m = 2: m·Mt·Nr = 4
        LinkSettings nakagami = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2,
                ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(2), 128, 0, Equaliser.MF, FrameCoding.NONE);
        assertEquals(4.0, AsymptoticDiversity.of(nakagami).orElseThrow().order());
    }
}
