package org.fadebench.bench.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.DiversityFit;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;

/**
 * The {@link HtmlReport} of one run: its summary lines, its points as the table, its FER plot, its
 * key numbers and settings, and provenance.
 */
public final class RunReport {

    private RunReport() {
    }

    /**
     * Writes the run's {@value HtmlReport#FILE} into {@code file}, atomically.
     *
     * @param run        what results.json says about the run
     * @param confidence the level of the points' intervals
     * @param svg        the FER plot as an SVG element ({@link FerPlot#write}), or null when there is none
     * @param settings   the run's scenario.yaml text
     */
    public static void write(Path file, ResultsJson.Run run, double confidence, String svg, String settings,
                             HtmlReport.Provenance provenance) throws IOException {
        HtmlReport.write(file, report(run, confidence, svg, settings, provenance));
    }

    static HtmlReport.Report report(ResultsJson.Run run, double confidence, String svg, String settings,
                                    HtmlReport.Provenance provenance) {
        LinkSettings link = run.link();
        List<String> sentences = new ArrayList<>();
        sentences.add("Link: " + link.describe() + "; seed " + run.seed() + ".");
        if (!run.complete()) {
            sentences.add("Interrupted: partial results; run the same command with --resume to finish.");
        }
        run.warnings().forEach(w -> sentences.add("Warning: " + w));
        sentences.addAll(run.summary().lines().stream().map(String::strip).toList());
        if (run.stopReason() != null) {
            sentences.add(run.stopReason());
        }
        List<HtmlReport.Figure> figures = svg == null ? List.of()
                : List.of(new HtmlReport.Figure("FER and BER of the run (" + FerPlot.SVG_FILE + ")", svg));
        HtmlReport.DesignSection design = new HtmlReport.DesignSection(FerPlot.title(link),
                keyNumbers(link, run.summary(), run.framesSimulated(), run.seconds()), settings);
        return new HtmlReport.Report("fadebench run: " + FerPlot.title(link), sentences,
                points(run.results(), confidence), figures, List.of(design), provenance);
    }

    /** The points as a table: SNR, Eb/N0, frames, errors, FER with its interval, BER, SER. */
    static HtmlReport.Table points(List<PointResult> results, double confidence) {
        List<List<String>> rows = new ArrayList<>();
        for (PointResult r : results) {
            FrameCounters c = r.counts();
            rows.add(List.of(Numbers.db(r.snrDb()), Numbers.db(r.ebN0Db()),
                    c.frames() + (r.complete() ? "" : " (partial)"), Long.toString(c.frameErrors()),
                    Numbers.shortRate(c.fer()),
                    Numbers.shortRate(r.ferLow()) + " to " + Numbers.shortRate(r.ferHigh()),
                    Numbers.shortRate(c.ber()), Numbers.shortRate(c.ser())));
        }
        return new HtmlReport.Table("Points", List.of("SNR (dB)", "Eb/N0 (dB)", "frames", "frame errors", "FER",
                "FER " + Numbers.db(100 * confidence) + " % interval", "BER", "SER"), rows);
    }

    /**
     * A design's key numbers, in the words of the terminal: information bits per channel use, SNR
     * and Eb/N0 at the target FER (or why there is none), diversity order (and why not to quote it
     * yet, where that applies), the gap to each outage bound (or why there is none), frames
     * simulated and seconds.
     *
     * @param framesSimulated frames simulated (speculative batches included), as results.json's timing
     * @param seconds         wall-clock seconds of the sweep
     */
    public static Map<String, String> keyNumbers(LinkSettings link, RunSummary summary, long framesSimulated,
                                                 double seconds) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("information bits per channel use", Numbers.db(link.bitsPerChannelUse()));
        String target = "at FER " + summary.targetFer();
        if (summary.snrDbAtTarget().isPresent()) {
            double snrDb = summary.snrDbAtTarget().getAsDouble();
            m.put("SNR " + target, two(snrDb) + " dB");
            m.put("Eb/N0 " + target, two(link.ebN0Db(snrDb)) + " dB");
        } else {
            m.put("SNR " + target, "none: " + summary.linkReach().words());
        }
        m.put("diversity order", summary.diversity().map(RunReport::order).orElse("not enough points with errors to fit"));
        summary.warning().ifPresent(w -> m.put("diversity order, caution", w));
        @SuppressWarnings("unchecked")
        Map<String, String> notes = (Map<String, String>) summary.toJson().get("gap_note");
        for (Bound b : Bound.values()) {
            m.put("gap to the " + b.key() + " outage bound", summary.gapDb(b).isPresent()
                    ? two(summary.gapDb(b).getAsDouble()) + " dB" : "none: " + notes.get(b.key()));
        }
        m.put("frames simulated", Long.toString(framesSimulated));
        m.put("seconds", two(seconds));
        return m;
    }

    private static String order(DiversityFit f) {
        return f.hasInterval() ? two(f.order()) + " (95 % interval " + two(f.low())
                + " to " + two(f.high()) + ")" : two(f.order());
    }

    /** Two decimals, as the terminal prints dB and orders. */
    private static String two(double v) {
        return String.format(Locale.ROOT, "%.2f", v);
    }
}
