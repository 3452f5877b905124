package org.fadebench.bench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.sweep.PointResult;
import org.junit.jupiter.api.Test;

class RunReportTest {

    /**
     * The key numbers of {@link FerPlotTest#sweep}: its FER falls from 40/2000 = 0.02 at 10 dB to
     * 3/20000 = 1.5e-4 at 15 dB, so the SNR at FER 0.01, linear in dB and in log FER between the two
     * (as the README states), is 10 + 5·log10(0.02/0.01)/log10(0.02/1.5e-4); Eb/N0 is 10·log10(2)
     * lower (QPSK, rate 1).
     */
    @Test
    void keyNumbersOfASweep() {
        List<PointResult> points = FerPlotTest.sweep();
        BoundCurves curves = FerPlotTest.bounds();
        RunSummary summary = RunSummary.of(FerPlotTest.LINK, points, curves, 0.01, RunSummary.NO_BOUNDS);
        Map<String, String> m = RunReport.keyNumbers(FerPlotTest.LINK, summary, 43_000, 1.234);
        double snrDb = 10 + 5 * Math.log10(0.02 / 0.01) / Math.log10(0.02 / 1.5e-4);
        assertEquals("2", m.get("information bits per channel use"));
        assertEquals(String.format(Locale.ROOT, "%.2f dB", snrDb), m.get("SNR at FER 0.01"));
        assertEquals(String.format(Locale.ROOT, "%.2f dB", snrDb - 10 * Math.log10(2)), m.get("Eb/N0 at FER 0.01"));
        for (Bound b : Bound.values()) {
            String gap = m.get("gap to the " + b.key() + " outage bound");
            if (summary.gapDb(b).isPresent()) {
                assertEquals(String.format(Locale.ROOT, "%.2f dB", summary.gapDb(b).getAsDouble()), gap);
            } else {
                assertTrue(gap.startsWith("none: "), gap);
            }
        }
        assertEquals("43000", m.get("frames simulated"));
        assertEquals("1.23", m.get("seconds"));
    }

    /** An interrupted run says so first; its partial point is marked; without a plot there is no figure. */
    @Test
    void interruptedRun() {
        List<PointResult> points = new ArrayList<>(FerPlotTest.sweep());
        PointResult last = points.get(4);
        points.set(4, new PointResult(last.index(), last.snrDb(), last.ebN0Db(), last.counts(), last.ferLow(),
                last.ferHigh(), last.berLow(), last.berHigh(), false, last.seconds()));
        RunSummary summary = RunSummary.of(FerPlotTest.LINK, points, null, 0.01, RunSummary.NO_BOUNDS);
        ResultsJson.Run run = new ResultsJson.Run(Map.of(), FerPlotTest.LINK, 5, points, false, null, 45_000, 2.0, 2,
                summary, List.of("a warning"));
        HtmlReport.Report r = RunReport.report(run, 0.95, null, "sweep:\n  seed: 5\n",
                new HtmlReport.Provenance("v", "5", "17", "d", "fadebench run"));
        assertTrue(r.summary().get(0).startsWith("Link: " + FerPlotTest.LINK.describe() + "; seed 5"));
        assertTrue(r.summary().get(1).startsWith("Interrupted: partial results"), r.summary().toString());
        assertEquals("Warning: a warning", r.summary().get(2));
        assertEquals(points.size(), r.table().rows().size());
        assertEquals("20000 (partial)", r.table().rows().get(4).get(2));
        assertEquals("FER 95 % interval", r.table().header().get(5));
        assertEquals(List.of(), r.figures());
        assertEquals("sweep:\n  seed: 5\n", r.designs().get(0).settings());
    }
}
