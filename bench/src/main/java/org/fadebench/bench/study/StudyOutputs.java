package org.fadebench.bench.study;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.report.AtomicFiles;
import org.fadebench.bench.report.ComparisonPlot;
import org.fadebench.bench.report.FerPlot;
import org.fadebench.bench.report.HtmlReport;
import org.fadebench.bench.report.Numbers;

/**
 * Everything a study (or {@code compare}) writes into its own folder, beside the designs'
 * sub-folders, from one {@link StudyTable}: study.csv, study.json, the plot of every design's FER
 * (fer.png, fer.svg: {@link ComparisonPlot}) and report.html ({@link HtmlReport}). Each file is
 * written under a temporary name and renamed.
 */
public final class StudyOutputs {

    public static final String CSV = "study.csv";
    public static final String JSON = "study.json";

    private static final ObjectMapper MAPPER = new ObjectMapper();

    /**
     * How the plot is drawn.
     *
     * @param x          SNR or Eb/N0 on the x axis
     * @param withBounds each design's QAM-constrained outage bound dashed in its colour
     */
    public record Figure(FerPlot.XQuantity x, boolean withBounds) {
    }

    private StudyOutputs() {
    }

    /**
     * Writes the study's files into {@code dir}; returns the files written.
     *
     * @param sentences  the report's summary, computed from the result (e.g. {@link StudyTable#sentences})
     * @param args       the command line after {@code fadebench}, for the report's provenance
     */
    public static List<Path> write(Path dir, StudyTable table, Figure figure, List<String> sentences, List<String> args)
            throws IOException {
        List<Path> written = new ArrayList<>();
        Path csv = dir.resolve(CSV);
        AtomicFiles.writeString(csv, table.csv());
        written.add(csv);
        Path json = dir.resolve(JSON);
        byte[] bytes = MAPPER.writerWithDefaultPrettyPrinter().writeValueAsBytes(table.json());
        AtomicFiles.write(json, out -> {
            out.write(bytes);
            out.write('\n');
        });
        written.add(json);
        List<HtmlReport.Figure> figures = new ArrayList<>();
        if (!table.rows().isEmpty()) {
            DesignRow first = table.rows().get(0);
            String svg = ComparisonPlot.write(dir, table.rows().stream().map(DesignRow::curve).toList(),
                    new ComparisonPlot.Layout(table.title(), figure.x(), first.targetFer(), table.budgetDb(),
                            figure.withBounds(), first.confidence(), Double.NaN));
            written.add(dir.resolve(FerPlot.PNG_FILE));
            written.add(dir.resolve(FerPlot.SVG_FILE));
            figures.add(new HtmlReport.Figure("FER of every design (" + FerPlot.SVG_FILE + ")", svg));
        } else {
            // no plot without a simulated design: one left by an earlier study in this folder would mislead
            Files.deleteIfExists(dir.resolve(FerPlot.PNG_FILE));
            Files.deleteIfExists(dir.resolve(FerPlot.SVG_FILE));
        }
        List<HtmlReport.DesignSection> sections = new ArrayList<>();
        Set<String> seeds = new LinkedHashSet<>();
        for (DesignRow r : table.rows()) {
            sections.add(new HtmlReport.DesignSection(r.design(), keyNumbers(r, table.budgetDb()), settings(r.folder())));
            seeds.add(Long.toString(r.seed()));
        }
        Path report = dir.resolve(HtmlReport.FILE);
        HtmlReport.write(report, new HtmlReport.Report("fadebench study: " + table.title(), sentences,
                table.reportTable(), figures, sections, HtmlReport.Provenance.now(String.join(", ", seeds), args)));
        written.add(report);
        return written;
    }

    /** A design's key numbers, from its row: what the ranking says of it, in words where a number is missing. */
    static Map<String, String> keyNumbers(DesignRow r, double budgetDb) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("link", r.link());
        m.put("information bits per channel use", Numbers.db(r.bitsPerChannelUse()));
        String target = "at FER " + r.targetFer();
        m.put("SNR " + target, r.reached() ? String.format(Locale.ROOT, "%.2f dB (%s)", r.snrDbAtTarget(),
                StudyTable.interval(r.snrDbLow(), r.snrDbHigh())) : "none: " + r.targetNote());
        if (r.reached()) {
            m.put("Eb/N0 " + target, String.format(Locale.ROOT, "%.2f dB", r.ebn0DbAtTarget()));
        }
        m.put("diversity order", Double.isNaN(r.diversityOrder()) ? "not enough points with errors to fit"
                : String.format(Locale.ROOT, "%.2f", r.diversityOrder()));
        for (Bound b : Bound.values()) {
            double g = r.gapDb().get(b);
            m.put("gap to the " + b.key() + " outage bound", Double.isNaN(g) ? "none: " + r.gapNote().get(b)
                    : String.format(Locale.ROOT, "%.2f dB", g));
        }
        Boolean meets = StudyTable.meets(r, budgetDb);
        m.put("meets the target at the budget", meets == null ? StudyTable.meetsNote(r, budgetDb) : meets ? "yes" : "no");
        m.put("frames simulated", Long.toString(r.frames()));
        m.put("seed", Long.toString(r.seed()));
        return m;
    }

    /** The design folder's scenario.yaml, or a word that it has none. */
    private static String settings(Path folder) throws IOException {
        Path file = folder.resolve("scenario.yaml");
        return Files.isRegularFile(file) ? Files.readString(file, StandardCharsets.UTF_8) : "(no scenario.yaml in " + folder
                + ")";
    }
}
