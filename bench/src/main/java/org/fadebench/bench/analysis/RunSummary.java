package org.fadebench.bench.analysis;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.fadebench.bench.sweep.PointResult;

/**
 * What a sweep says in a few numbers: diversity order, the SNR at the target FER and, where the
 * outage bounds apply, the gap to each of them. The {@code summary} object of results.json and the
 * lines printed after the table.
 *
 * @param analysis the comparison with the bounds, or null where no bounds apply to the channel
 */
public record RunSummary(double targetFer, Optional<DiversityFit> diversity, OptionalDouble snrDbAtTarget,
                         LinkAnalysis analysis) {

    /** Summarises a sweep; {@code curves} may be null when no bounds apply. */
    public static RunSummary of(List<PointResult> points, BoundCurves curves, double targetFer) {
        if (curves != null) {
            LinkAnalysis a = LinkAnalysis.of(points, curves, targetFer, DiversityFit.DEFAULT_MIN_ERRORS,
                    DiversityFit.DEFAULT_TAIL_POINTS);
            return new RunSummary(targetFer, a.diversity(), a.snrDbAtTarget(), a);
        }
        return new RunSummary(targetFer,
                DiversityFit.ofPoints(points, DiversityFit.DEFAULT_MIN_ERRORS, DiversityFit.DEFAULT_TAIL_POINTS),
                TargetCrossing.ofPoints(points, targetFer), null);
    }

    /** The gap in dB to a bound, empty when not reached or no bounds apply. */
    public OptionalDouble gapDb(Bound bound) {
        return analysis == null ? OptionalDouble.empty() : analysis.gapDb(bound);
    }

    /** The {@code summary} object: numbers, or null for what was not reached. */
    public Map<String, Object> toJson() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("diversity_order", diversity.map(DiversityFit::order).orElse(null));
        m.put("diversity_order_ci", diversity.filter(DiversityFit::hasInterval)
                .map(f -> List.of(f.low(), f.high())).orElse(null));
        m.put("target_fer", targetFer);
        m.put("snr_db_at_target", snrDbAtTarget.isPresent() ? snrDbAtTarget.getAsDouble() : null);
        Map<String, Object> gaps = new LinkedHashMap<>();
        for (Bound b : Bound.values()) {
            OptionalDouble g = gapDb(b);
            gaps.put(b.key(), g.isPresent() ? g.getAsDouble() : null);
        }
        m.put("gap_db", gaps);
        return m;
    }

    /** Two or three lines for the terminal. */
    public List<String> lines() {
        String div = diversity.map(f -> f.hasInterval()
                ? String.format(Locale.ROOT, "diversity order %.2f (95 %% interval %.2f to %.2f), fitted on %s dB",
                        f.order(), f.low(), f.high(), f.snrDbUsed())
                : String.format(Locale.ROOT, "diversity order %.2f, fitted on %s dB", f.order(), f.snrDbUsed()))
                .orElse("diversity order: not enough points with errors to fit");
        String target = String.format(Locale.ROOT, "SNR at FER %s: %s", targetFer,
                snrDbAtTarget.isPresent() ? String.format(Locale.ROOT, "%.2f dB", snrDbAtTarget.getAsDouble())
                        : "not reached");
        if (analysis == null) {
            return List.of(div, target + "; no outage bounds for this channel");
        }
        StringBuilder gap = new StringBuilder("gap to outage at that FER:");
        for (Bound b : Bound.values()) {
            OptionalDouble g = gapDb(b);
            gap.append(' ').append(b.key()).append(' ')
                    .append(g.isPresent() ? String.format(Locale.ROOT, "%.2f dB", g.getAsDouble()) : "not reached")
                    .append(b == Bound.QAM ? "" : ",");
        }
        return List.of(div, target, gap.toString());
    }
}
