package org.fadebench.bench.analysis;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;

/**
 * What a sweep says in a few numbers: diversity order (with a warning when the curve is not yet
 * on its asymptote), the SNR at the target FER and, where the outage bounds apply, the gap to each
 * of them. The {@code summary} object of results.json and the lines printed after the table.
 *
 * @param linkReach  where the simulated FER meets the target, or why it does not (see {@link Reach#ofLink})
 * @param asymptote  the diversity order the link tends to, where it can be said
 * @param warning    why the fitted order is not to be quoted yet, or empty
 * @param analysis   the comparison with the bounds, or null where there are none
 * @param noBounds   with no analysis: why (e.g. "no outage bounds for this channel")
 * @param normal     the {@link NormalApproximation} against the target, or null where it does not
 *                   apply ({@link NormalApproximation#NOT_APPLICABLE}) or nothing was simulated
 */
public record RunSummary(double targetFer, Optional<DiversityFit> diversity, OptionalDouble snrDbAtTarget,
                         Reach linkReach, Optional<AsymptoticDiversity> asymptote, Optional<String> warning, LinkAnalysis analysis,
                         String noBounds, LinkAnalysis.BoundAnalysis normal) {

    /** The words when a channel has no outage bounds. */
    public static final String NO_BOUNDS = "no outage bounds for this channel";

    /** The words for an AWGN link, which has no outage bounds. */
    public static final String NO_BOUNDS_AWGN = "no outage bounds over AWGN (--fading none): the channel is fixed, "
            + "so a frame is never in outage; the normal approximation is the limit there";

    /** Why {@code link} has no outage bounds (where it has none): {@link #NO_BOUNDS_AWGN} or {@link #NO_BOUNDS}. */
    public static String noBounds(LinkSettings link) {
        return link.channel().awgn() ? NO_BOUNDS_AWGN : NO_BOUNDS;
    }

    /** Summarises a sweep of {@code link}; {@code curves} may be null, and {@code noBounds} then says why. */
    public static RunSummary of(LinkSettings link, List<PointResult> points, BoundCurves curves, double targetFer,
                                String noBounds) {
        LinkAnalysis a = curves == null ? null : LinkAnalysis.of(points, curves, targetFer,
                DiversityFit.DEFAULT_MIN_ERRORS, DiversityFit.DEFAULT_TAIL_POINTS);
        Optional<DiversityFit> diversity = a != null ? a.diversity()
                : DiversityFit.ofPoints(points, DiversityFit.DEFAULT_MIN_ERRORS, DiversityFit.DEFAULT_TAIL_POINTS);
        Optional<AsymptoticDiversity> asymptote = AsymptoticDiversity.of(link);
        Optional<String> warning = diversity.flatMap(f -> asymptote.isPresent()
                ? asymptote.get().warning(f, points) : AsymptoticDiversity.warningWithoutAsymptote(f, points));
        OptionalDouble crossing = a != null ? a.snrDbAtTarget() : TargetCrossing.ofPoints(points, targetFer);
        double[] snrDb = points.stream().mapToDouble(PointResult::snrDb).toArray();
        LinkAnalysis.BoundAnalysis normal = snrDb.length == 0 ? null
                : NormalApproximation.of(link).map(n -> n.against(snrDb, targetFer)).orElse(null);
        return new RunSummary(targetFer, diversity, crossing, Reach.ofLink(points, targetFer, crossing), asymptote,
                warning, a, a == null ? noBounds : null, normal);
    }

    /** The gap in dB to a bound, empty when either side has no SNR at the target or no bounds apply. */
    public OptionalDouble gapDb(Bound bound) {
        return analysis == null ? OptionalDouble.empty() : analysis.gapDb(bound);
    }

    /** The {@code summary} object: numbers, or null for what has none, with the reason beside it. */
    public Map<String, Object> toJson() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("diversity_order", diversity.map(DiversityFit::order).orElse(null));
        m.put("diversity_order_ci", diversity.filter(DiversityFit::hasInterval)
                .map(f -> List.of(f.low(), f.high())).orElse(null));
        m.put("diversity_snr_db_used", diversity.map(DiversityFit::snrDbUsed).orElse(null));
        m.put("diversity_asymptote", asymptote.map(AsymptoticDiversity::order).orElse(null));
        m.put("diversity_asymptote_basis", asymptote.map(AsymptoticDiversity::basis).orElse(null));
        m.put("diversity_warning", warning.orElse(null));
        m.put("target_fer", targetFer);
        m.put("snr_db_at_target", snrDbAtTarget.isPresent() ? snrDbAtTarget.getAsDouble() : null);
        m.put("target_note", snrDbAtTarget.isPresent() ? null : linkReach.words());
        Map<String, Object> gaps = new LinkedHashMap<>();
        Map<String, Object> notes = new LinkedHashMap<>();
        for (Bound b : Bound.values()) {
            OptionalDouble g = gapDb(b);
            gaps.put(b.key(), g.isPresent() ? g.getAsDouble() : null);
            notes.put(b.key(), analysis == null ? noBounds : analysis.gapNote(b));
        }
        gaps.put(NormalApproximation.KEY, normal == null ? null : LinkAnalysis.orNull(normal.gapDb(snrDbAtTarget)));
        notes.put(NormalApproximation.KEY, normal == null ? NormalApproximation.NOT_APPLICABLE
                : normal.gapNote(snrDbAtTarget, linkReach));
        m.put("gap_db", gaps);
        m.put("gap_note", notes);
        Map<String, Object> approx = null;
        if (normal != null) {
            approx = new LinkedHashMap<>();
            approx.put("snr_db_at_target", LinkAnalysis.orNull(normal.snrDbAtTarget()));
            approx.put("reach", normal.reach().key());
            approx.put("note", normal.reach() == Reach.IN_RANGE ? null : normal.note());
        }
        m.put(NormalApproximation.KEY, approx);
        return m;
    }

    /** A few lines for the terminal. */
    public List<String> lines() {
        List<String> lines = new ArrayList<>();
        lines.add(diversity.map(f -> (f.hasInterval()
                ? String.format(Locale.ROOT, "diversity order %.2f (95 %% interval %.2f to %.2f), fitted on %s dB",
                        f.order(), f.low(), f.high(), f.snrDbUsed())
                : String.format(Locale.ROOT, "diversity order %.2f, fitted on %s dB", f.order(), f.snrDbUsed()))
                + warning.map(w -> "; " + w).orElse(""))
                .orElse("diversity order: not enough points with errors to fit"));
        if (analysis == null) {
            lines.add(targetLine() + "; " + noBounds);
        } else {
            lines.add(targetLine());
            for (Bound b : Bound.values()) {
                lines.add("  " + boundLine(b));
            }
        }
        if (normal != null) {
            lines.add("  " + normalLine());
        }
        return lines;
    }

    /**
     * The lines of {@link #lines} that the plot repeats under its title, in the same words: the
     * link's when it did not reach the target, and each bound's that does not cross the target
     * within the swept range, except a bound that is 1 at every SNR (the plot's legend says that).
     */
    public List<String> reachLines() {
        List<String> lines = new ArrayList<>();
        if (snrDbAtTarget.isEmpty()) {
            lines.add(targetLine());
        }
        for (Bound b : analysis == null ? new Bound[0] : Bound.values()) {
            Reach r = analysis.bounds().get(b).reach();
            if (r != Reach.IN_RANGE && r != Reach.FULL_RATE && r != Reach.ABOVE_ALPHABET) {
                lines.add(boundLine(b));
            }
        }
        if (normal != null && normal.reach() != Reach.IN_RANGE) {
            lines.add(normalLine());
        }
        return lines;
    }

    private String targetLine() {
        return String.format(Locale.ROOT, "SNR at FER %s: %s", targetFer,
                snrDbAtTarget.isPresent() ? String.format(Locale.ROOT, "%.2f dB", snrDbAtTarget.getAsDouble())
                        : "none: " + linkReach.words());
    }

    /** E.g. {@code mimo outage bound at FER 0.01: 9.80 dB (outside the swept range; …), gap 14.20 dB}. */
    private String boundLine(Bound b) {
        return curveLine(b.key() + " outage bound", analysis.bounds().get(b));
    }

    /** E.g. {@code normal approximation (finite length, AWGN) at FER 0.01: 1.02 dB, gap 1.80 dB}. */
    private String normalLine() {
        return curveLine("normal approximation (finite length, AWGN)", normal);
    }

    private String curveLine(String label, LinkAnalysis.BoundAnalysis ba) {
        OptionalDouble g = ba.gapDb(snrDbAtTarget);
        String at = ba.snrDbAtTarget().isPresent()
                ? String.format(Locale.ROOT, "%.2f dB", ba.snrDbAtTarget().getAsDouble()) : "none";
        String note = ba.reach() == Reach.IN_RANGE ? "" : " (" + ba.note() + ")";
        Reach missing = ba.gapReach(snrDbAtTarget, linkReach);
        String gap = g.isPresent() ? String.format(Locale.ROOT, ", gap %.2f dB", g.getAsDouble())
                : missing == ba.reach() ? "" : "; no gap: " + missing.words();
        return String.format(Locale.ROOT, "%s at FER %s: %s%s%s", label, targetFer, at, note, gap);
    }
}
