package org.fadebench.bench.study;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.report.HtmlReport;
import org.fadebench.bench.report.Numbers;
import org.fadebench.bench.report.ToolVersion;

/**
 * The ranking of a study or comparison: one {@link DesignRow} per simulated design, ranked, and the
 * designs screened out or skipped with their reasons; as study.csv, study.json and terminal lines.
 *
 * <p>Ranking: with a budget, the designs that meet the target at the budget come first, by rate
 * (bits per channel use, highest first), then by SNR at the target; then the others. Without a
 * budget, by SNR at the target, lowest first. A design whose FER is already below the target at its
 * lowest swept SNR ranks before those with an SNR (its crossing lies lower), one that never reached
 * the target after them; ties by name.
 *
 * @param title    what the table is of (the study file, or the folders compared)
 * @param budgetDb the budget SNR, NaN when none
 * @param rows     the simulated designs, ranked
 * @param screened the designs screened out, with the screen's words
 * @param skipped  the impossible combinations, with their reasons
 * @param flags    what the reader must know when comparing (e.g. runs of different tool versions)
 */
public record StudyTable(String title, double budgetDb, List<DesignRow> rows, List<Named> screened,
                         List<Named> skipped, List<String> flags) {

    /** A design that was not simulated, and why. */
    public record Named(String design, String reason) {
    }

    /** study.csv's columns. */
    public static final String HEADER = "rank,design,bits_per_channel_use,snr_db_at_target,snr_db_at_target_low,"
            + "snr_db_at_target_high,ebn0_db_at_target,diversity_order,gap_db_mimo,gap_db_stbc,gap_db_qam,"
            + "meets_target,frames,seconds,status,reason";

    private static final ObjectMapper JSON = new ObjectMapper();

    /** The table with {@code rows} ranked (see the class comment). */
    public static StudyTable ranked(String title, double budgetDb, List<DesignRow> rows, List<Named> screened,
                                    List<Named> skipped, List<String> flags) {
        Comparator<DesignRow> bySnr = Comparator.comparingDouble(StudyTable::rankSnr);
        Comparator<DesignRow> order = Double.isNaN(budgetDb) ? bySnr
                : Comparator.comparing((DesignRow r) -> !Boolean.TRUE.equals(meets(r, budgetDb)))
                        .thenComparing((DesignRow r) -> Boolean.TRUE.equals(meets(r, budgetDb)) ? -r.bitsPerChannelUse() : 0)
                        .thenComparing(bySnr);
        List<DesignRow> sorted = new ArrayList<>(rows);
        sorted.sort(order.thenComparing(DesignRow::design));
        return new StudyTable(title, budgetDb, List.copyOf(sorted), List.copyOf(screened), List.copyOf(skipped),
                List.copyOf(flags));
    }

    private static double rankSnr(DesignRow r) {
        return r.reached() ? r.snrDbAtTarget() : r.ferBelowAtLowest() ? Double.NEGATIVE_INFINITY : Double.POSITIVE_INFINITY;
    }

    /**
     * Whether {@code r} reaches the target FER at {@code budgetDb}: from its SNR at the target, or,
     * where it has none, from the FER at the ends of its sweep; null when the sweep cannot say (no
     * budget, or the budget lies beyond the swept end that would decide).
     */
    public static Boolean meets(DesignRow r, double budgetDb) {
        if (Double.isNaN(budgetDb)) {
            return null;
        }
        if (r.reached()) {
            return r.snrDbAtTarget() <= budgetDb;
        }
        if (r.ferBelowAtLowest()) {
            return r.lowestSnrDb() <= budgetDb ? Boolean.TRUE : null;
        }
        return r.highestSnrDb() >= budgetDb ? Boolean.FALSE : null;
    }

    /** Why {@link #meets} says nothing, or null when it does. */
    static String meetsNote(DesignRow r, double budgetDb) {
        if (Double.isNaN(budgetDb)) {
            return "no budget_db given";
        }
        if (meets(r, budgetDb) != null) {
            return null;
        }
        return r.ferBelowAtLowest() ? "the FER is below the target from the lowest swept SNR, which lies above the budget"
                : "the FER is above the target up to the highest swept SNR, which lies below the budget";
    }

    /** study.csv: the ranked designs, then those screened out and skipped, with their reasons. */
    public String csv() {
        StringBuilder w = new StringBuilder();
        w.append("# fadebench study: ").append(title).append('\n');
        if (!rows.isEmpty()) {
            w.append("# target FER ").append(rows.get(0).targetFer()).append("; ")
                    .append(Double.isNaN(budgetDb) ? "no budget" : "budget " + Numbers.db(budgetDb) + " dB")
                    .append("; snr_db_at_target_low/high: where the lower/upper ends of the FER intervals cross the"
                            + " target\n");
            w.append("# ").append(rows.get(0).snrConvention()).append('\n');
        }
        for (String f : flags) {
            w.append("# note: ").append(f).append('\n');
        }
        w.append(HEADER).append('\n');
        int rank = 1;
        for (DesignRow r : rows) {
            Boolean meets = meets(r, budgetDb);
            w.append(rank++).append(',').append(r.design()).append(',').append(Numbers.db(r.bitsPerChannelUse()))
                    .append(',').append(db(r.snrDbAtTarget())).append(',').append(db(r.snrDbLow())).append(',')
                    .append(db(r.snrDbHigh())).append(',').append(db(r.ebn0DbAtTarget())).append(',')
                    .append(db(r.diversityOrder()));
            for (Bound b : Bound.values()) {
                w.append(',').append(db(r.gapDb().get(b)));
            }
            w.append(',').append(meets == null ? "" : meets.toString()).append(',').append(r.frames()).append(',')
                    .append(String.format(Locale.ROOT, "%.3f", r.seconds())).append(",simulated,")
                    .append(r.reached() ? "" : csvText(r.targetNote())).append('\n');
        }
        for (Named s : screened) {
            w.append(",").append(s.design()).append(",,,,,,,,,,false,0,,screened_out,").append(csvText(s.reason()))
                    .append('\n');
        }
        for (Named s : skipped) {
            w.append(",").append(s.design()).append(",,,,,,,,,,,0,,skipped,").append(csvText(s.reason())).append('\n');
        }
        return w.toString();
    }

    private static String db(double v) {
        return Double.isNaN(v) ? "" : Numbers.db(v);
    }

    private static String csvText(String s) {
        return s == null ? "" : "\"" + s.replace("\"", "\"\"") + "\"";
    }

    /** study.json: the same, with every number at full precision and the reason beside each empty value. */
    public ObjectNode json() {
        ObjectNode root = JSON.createObjectNode();
        root.put("tool", "fadebench");
        root.put("version", ToolVersion.version());
        root.put("title", title);
        root.set("budget_db", Double.isNaN(budgetDb) ? JSON.nullNode() : JSON.valueToTree(budgetDb));
        ArrayNode f = root.putArray("flags");
        flags.forEach(f::add);
        ArrayNode designs = root.putArray("designs");
        int rank = 1;
        for (DesignRow r : rows) {
            ObjectNode d = designs.addObject();
            d.put("rank", rank++);
            d.put("design", r.design());
            d.put("folder", r.folder().toString());
            d.put("version", r.version());
            d.put("seed", r.seed());
            d.put("link", r.link());
            d.put("target_fer", r.targetFer());
            d.put("bits_per_channel_use", r.bitsPerChannelUse());
            put(d, "snr_db_at_target", r.snrDbAtTarget());
            ArrayNode ci = d.putArray("snr_db_at_target_ci");
            ci.add(nullable(r.snrDbLow()));
            ci.add(nullable(r.snrDbHigh()));
            d.put("snr_db_at_target_note", r.reached() ? null : r.targetNote());
            put(d, "ebn0_db_at_target", r.ebn0DbAtTarget());
            put(d, "diversity_order", r.diversityOrder());
            ObjectNode gaps = d.putObject("gap_db");
            ObjectNode notes = d.putObject("gap_note");
            for (Bound b : Bound.values()) {
                put(gaps, b.key(), r.gapDb().get(b));
                notes.put(b.key(), Double.isNaN(r.gapDb().get(b)) ? r.gapNote().get(b) : null);
            }
            Boolean meets = meets(r, budgetDb);
            if (meets == null) {
                d.putNull("meets_target");
            } else {
                d.put("meets_target", meets);
            }
            d.put("meets_target_note", meetsNote(r, budgetDb));
            d.put("frames", r.frames());
            d.put("seconds", r.seconds());
        }
        ArrayNode s = root.putArray("screened_out");
        screened.forEach(n -> s.addObject().put("design", n.design()).put("reason", n.reason()));
        ArrayNode k = root.putArray("skipped");
        skipped.forEach(n -> k.addObject().put("design", n.design()).put("reason", n.reason()));
        return root;
    }

    private static void put(ObjectNode o, String key, double v) {
        o.set(key, nullable(v));
    }

    private static com.fasterxml.jackson.databind.JsonNode nullable(double v) {
        return Double.isNaN(v) ? JSON.nullNode() : JSON.getNodeFactory().numberNode(v);
    }

    /**
     * A few sentences about the result, each computed from it: the best design with its SNR
     * interval, and which designs meet the target at the budget.
     */
    public List<String> sentences() {
        List<String> lines = new ArrayList<>();
        if (rows.isEmpty() || !rows.get(0).reached()) {
            lines.add(rows.stream().anyMatch(DesignRow::reached) ? "The best-ranked design has no SNR at the target FER "
                    + "within its sweep." : "No design reached the target FER within its sweep.");
        } else {
            DesignRow best = rows.get(0);
            lines.add(String.format(Locale.ROOT, "Best at FER %s: %s, at %.2f dB SNR (%s).", best.targetFer(),
                    best.design(), best.snrDbAtTarget(), interval(best.snrDbLow(), best.snrDbHigh())));
        }
        if (!Double.isNaN(budgetDb)) {
            List<String> meet = rows.stream().filter(r -> Boolean.TRUE.equals(meets(r, budgetDb)))
                    .map(DesignRow::design).toList();
            lines.add(String.format(Locale.ROOT, "At the budget of %s dB, %d of %d designs %s the target%s.",
                    Numbers.db(budgetDb), meet.size(), rows.size() + screened.size(), meet.size() == 1 ? "meets" : "meet",
                    meet.isEmpty() ? "" : ": " + String.join(", ", meet)));
        }
        return lines;
    }

    /** An SNR interval in words: {@code interval from the FER intervals: 4.98 to 5.80 dB}. */
    public static String interval(double low, double high) {
        return Double.isNaN(low) || Double.isNaN(high) ? "interval not resolved by the sweep"
                : String.format(Locale.ROOT, "interval from the FER intervals: %.2f to %.2f dB", low, high);
    }

    /** The ranking as report.html's table: one row per design, then those not simulated with their reasons. */
    public HtmlReport.Table reportTable() {
        List<List<String>> cells = new ArrayList<>();
        int rank = 1;
        for (DesignRow r : rows) {
            Boolean meets = meets(r, budgetDb);
            cells.add(List.of(Integer.toString(rank++), r.design(), Numbers.db(r.bitsPerChannelUse()),
                    r.reached() ? String.format(Locale.ROOT, "%.2f (%s to %s)", r.snrDbAtTarget(), two(r.snrDbLow()),
                            two(r.snrDbHigh())) : "none: " + r.targetNote(),
                    two(r.ebn0DbAtTarget()), two(r.diversityOrder()), two(r.gapDb().get(Bound.MIMO)),
                    two(r.gapDb().get(Bound.STBC)), two(r.gapDb().get(Bound.QAM)),
                    meets == null ? "-" : meets ? "yes" : "no", Long.toString(r.frames())));
        }
        for (Named n : screened) {
            cells.add(List.of("-", n.design(), "", n.reason(), "", "", "", "", "", "no", "0"));
        }
        for (Named n : skipped) {
            cells.add(List.of("-", n.design(), "", "skipped: " + n.reason(), "", "", "", "", "", "", "0"));
        }
        String target = rows.isEmpty() ? "" : " " + rows.get(0).targetFer();
        return new HtmlReport.Table("Ranking", List.of("rank", "design", "bits per channel use",
                "SNR at FER" + target + " (dB, interval)", "Eb/N0 (dB)", "diversity order", "gap to mimo (dB)",
                "gap to stbc (dB)", "gap to qam (dB)", Double.isNaN(budgetDb) ? "meets the target (no budget)"
                        : "meets the target at " + Numbers.db(budgetDb) + " dB", "frames"), cells);
    }

    private static String two(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.2f", v);
    }

    /** The ranking for the terminal: one line per design, then those not simulated. */
    public List<String> lines() {
        List<String> lines = new ArrayList<>();
        String target = rows.isEmpty() ? "" : " " + rows.get(0).targetFer();
        lines.add(String.format(Locale.ROOT, "%-4s %-28s %6s %24s %10s %9s %7s", "rank", "design", "bits/cu",
                "SNR at FER" + target + " (dB)", "Eb/N0 dB", "diversity", Double.isNaN(budgetDb) ? "" : "meets"));
        int rank = 1;
        for (DesignRow r : rows) {
            Boolean meets = meets(r, budgetDb);
            String snr = r.reached() ? String.format(Locale.ROOT, "%.2f [%s, %s]", r.snrDbAtTarget(),
                    r.snrDbLow() == r.snrDbLow() ? String.format(Locale.ROOT, "%.2f", r.snrDbLow()) : "?",
                    r.snrDbHigh() == r.snrDbHigh() ? String.format(Locale.ROOT, "%.2f", r.snrDbHigh()) : "?")
                    : r.ferBelowAtLowest() ? "below " + Numbers.db(r.lowestSnrDb()) : "above " + Numbers.db(r.highestSnrDb());
            lines.add(String.format(Locale.ROOT, "%-4d %-28s %6s %24s %10s %9s %7s", rank++, r.design(),
                    Numbers.db(r.bitsPerChannelUse()), snr, r.reached() ? String.format(Locale.ROOT, "%.2f",
                            r.ebn0DbAtTarget()) : "-",
                    Double.isNaN(r.diversityOrder()) ? "-" : String.format(Locale.ROOT, "%.2f", r.diversityOrder()),
                    meets == null ? (Double.isNaN(budgetDb) ? "" : "?") : meets ? "yes" : "no"));
        }
        screened.forEach(n -> lines.add("-    " + n.design() + ": " + n.reason()));
        skipped.forEach(n -> lines.add("-    " + n.design() + ": skipped: " + n.reason()));
        flags.forEach(f -> lines.add("note: " + f));
        return lines;
    }
}
