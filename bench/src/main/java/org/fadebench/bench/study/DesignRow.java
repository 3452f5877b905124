package org.fadebench.bench.study;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.TargetCrossing;
import org.fadebench.bench.report.ComparisonPlot;

/**
 * One design's line of a study or comparison, read from its finished run folder
 * ({@code results.json}) and nothing else, so that a study and {@code compare} give the same numbers
 * as the runs themselves.
 *
 * <p>The interval of the SNR at the target: where the curves of the lower and of the upper ends of
 * the points' FER intervals cross the target, interpolated as the FER itself is
 * ({@link TargetCrossing#interpolate}, linear in dB and in log FER, never extrapolated): the upper
 * ends cross later, the lower ends earlier. Near the crossing these are the intervals of the two
 * points around it. The intervals are the run's pointwise Clopper–Pearson intervals (at its
 * {@code confidence}), so the SNR interval is pointwise too; an end is NaN where its curve does not
 * cross within the sweep.
 *
 * @param design             the design's name (the folder's name for {@code compare})
 * @param folder             the run folder
 * @param version            the tool version that wrote the run
 * @param snrConvention      the run's SNR convention, in words
 * @param seed               the run's seed
 * @param link               the link's description
 * @param targetFer          the run's target FER
 * @param bitsPerChannelUse  information bits per channel use
 * @param snrDbAtTarget      the run's SNR at the target FER (its summary), NaN when it has none
 * @param snrDbLow           lower end of its interval, NaN when none
 * @param snrDbHigh          upper end, NaN when none
 * @param targetNote         why there is no SNR at the target (the run's words), or null
 * @param lowestSnrDb        the lowest swept SNR
 * @param highestSnrDb       the highest swept SNR
 * @param ferBelowAtLowest   true when the FER at the lowest swept SNR is already at or below the target
 * @param diversityOrder     the fitted diversity order, NaN when none
 * @param gapDb              gap to each outage bound, NaN when undefined
 * @param gapNote            why a gap is undefined, or null
 * @param frames             frames simulated over all points (the points' counts)
 * @param seconds            the run's wall-clock seconds (timing)
 * @param confidence         the level of the run's FER intervals
 * @param curve              the run's points and QAM-constrained bound, as a figure of every design draws them
 */
public record DesignRow(String design, Path folder, String version, String snrConvention, long seed, String link,
                        double targetFer, double bitsPerChannelUse, double snrDbAtTarget, double snrDbLow,
                        double snrDbHigh, String targetNote, double lowestSnrDb, double highestSnrDb,
                        boolean ferBelowAtLowest, double diversityOrder, Map<Bound, Double> gapDb,
                        Map<Bound, String> gapNote, long frames, double seconds, double confidence,
                        ComparisonPlot.Design curve) {

    /** The file a row is read from. */
    public static final String RESULTS_JSON = "results.json";

    private static final ObjectMapper JSON = new ObjectMapper();

    /** Eb/N0 at the target, dB: the SNR less 10 log10 of the bits per channel use; NaN when no SNR. */
    public double ebn0DbAtTarget() {
        return snrDbAtTarget - 10.0 * Math.log10(bitsPerChannelUse);
    }

    /** True when the run has an SNR at the target. */
    public boolean reached() {
        return !Double.isNaN(snrDbAtTarget);
    }

    /**
     * Reads a finished run folder.
     *
     * @throws IllegalArgumentException (one line naming the folder) when it holds no finished run
     * @throws IOException              when the file cannot be read
     */
    public static DesignRow read(String design, Path folder) throws IOException {
        Path file = folder.resolve(RESULTS_JSON);
        if (!Files.isRegularFile(file)) {
            throw new IllegalArgumentException(folder + ": no " + RESULTS_JSON + "; not a finished run folder");
        }
        JsonNode root;
        try {
            root = JSON.readTree(file.toFile());
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalArgumentException(file + ": not valid JSON (" + e.getOriginalMessage() + ")");
        }
        if (root == null || !"fadebench".equals(root.path("tool").asText()) || !root.path("points").isArray()
                || !root.path("summary").isObject()) {
            throw new IllegalArgumentException(file + ": not a fadebench results file");
        }
        if (!root.path("complete").asBoolean(false)) {
            throw new IllegalArgumentException(folder + ": the run is not finished (interrupted); finish it with "
                    + "'fadebench run " + folder.resolve("scenario.yaml") + " --resume' first");
        }
        JsonNode summary = root.path("summary");
        JsonNode points = root.path("points");
        int n = points.size();
        if (n == 0) {
            throw new IllegalArgumentException(file + ": the run holds no SNR point");
        }
        double target = summary.path("target_fer").asDouble();
        double[] snr = new double[n];
        double[] low = new double[n];
        double[] high = new double[n];
        double[] fer = new double[n];
        List<ComparisonPlot.Point> plotted = new ArrayList<>();
        List<ComparisonPlot.BoundValue> qam = new ArrayList<>();
        long frames = 0;
        for (int i = 0; i < n; i++) {
            JsonNode p = points.get(i);
            snr[i] = p.path("snr_db").asDouble();
            low[i] = number(p.path("fer_ci_low"));
            high[i] = number(p.path("fer_ci_high"));
            fer[i] = number(p.path("fer"));
            frames += p.path("frames").asLong();
            plotted.add(new ComparisonPlot.Point(snr[i], p.path("frames").asLong(), p.path("frame_errors").asLong(),
                    low[i], high[i]));
        }
        for (JsonNode b : root.path("bounds").path("points")) {
            qam.add(new ComparisonPlot.BoundValue(b.path("snr_db").asDouble(), number(b.path("qam").path("value"))));
        }
        int lowest = 0;
        int highest = 0;
        for (int i = 1; i < n; i++) {
            lowest = snr[i] < snr[lowest] ? i : lowest;
            highest = snr[i] > snr[highest] ? i : highest;
        }
        Map<Bound, Double> gaps = new EnumMap<>(Bound.class);
        Map<Bound, String> notes = new EnumMap<>(Bound.class);
        for (Bound b : Bound.values()) {
            gaps.put(b, number(summary.path("gap_db").path(b.key())));
            JsonNode note = summary.path("gap_note").path(b.key());
            notes.put(b, note.isTextual() ? note.asText() : null);
        }
        JsonNode targetNote = summary.path("target_note");
        return new DesignRow(design, folder, root.path("version").asText(), root.path("snr_convention").asText(),
                root.path("seed").asLong(), root.path("link").asText(), target,
                root.path("bits_per_channel_use").asDouble(), number(summary.path("snr_db_at_target")),
                or(TargetCrossing.interpolate(snr, low, target)), or(TargetCrossing.interpolate(snr, high, target)),
                targetNote.isTextual() ? targetNote.asText() : null, snr[lowest], snr[highest],
                fer[lowest] <= target, number(summary.path("diversity_order")), gaps, notes, frames,
                root.path("timing").path("seconds").asDouble(), root.path("settings").path("confidence").asDouble(),
                new ComparisonPlot.Design(design, root.path("bits_per_channel_use").asDouble(), plotted, qam));
    }

    private static double number(JsonNode n) {
        return n.isNumber() ? n.asDouble() : Double.NaN;
    }

    private static double or(OptionalDouble v) {
        return v.isPresent() ? v.getAsDouble() : Double.NaN;
    }
}
