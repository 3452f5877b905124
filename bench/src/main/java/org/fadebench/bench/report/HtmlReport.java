package org.fadebench.bench.report;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Writes {@value #FILE}: one self-contained HTML5 page that opens without a network — inline CSS,
 * inline SVG, no scripts, and no link to any other file, font or image. It shows a title, a few
 * computed sentences, one table (a study's ranking, one row per design; a run's points), the plots,
 * each design's key numbers and settings, and where the results came from. Every text is
 * HTML-escaped; the plots are SVG elements from {@link FerPlot#write} or {@link ComparisonPlot#write},
 * each given ids of its own in the page.
 *
 * <p>Fill a {@link Report} and call {@link #write}; {@link RunReport} does so for a single run.
 */
public final class HtmlReport {

    /** The file name in a run's or a study's folder. */
    public static final String FILE = "report.html";

    /** Cells right-aligned: a number, alone or followed by a space and more (a unit, an interval). */
    private static final Pattern NUMERIC = Pattern.compile("[-+−]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?(\\s.*)?",
            Pattern.DOTALL);

    /** An {@code id='…'} or {@code id="…"} attribute. */
    private static final Pattern ID = Pattern.compile("\\sid=(['\"])([^'\"]+)\\1");

    private static final String STYLE = String.join("\n",
            "body { font-family: sans-serif; color: #222; margin: 2em auto; max-width: 72em; padding: 0 1em;"
                    + " line-height: 1.4; }",
            "h1 { font-size: 1.6em; margin-bottom: 0.3em; }",
            "h2 { font-size: 1.25em; margin-top: 1.8em; border-bottom: 1px solid #ccc; }",
            "h3 { font-size: 1.05em; margin-bottom: 0.3em; }",
            "p.summary { margin: 0.2em 0; }",
            "table { border-collapse: collapse; margin: 0.6em 0; }",
            "th, td { border: 1px solid #ccc; padding: 0.25em 0.6em; vertical-align: top; }",
            "thead th { background: #eef2f6; text-align: left; }",
            "tbody tr:nth-child(even) { background: #f7f7f7; }",
            "td.number { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }",
            "table.numbers th { text-align: left; font-weight: normal; background: #f4f4f4; }",
            "figure { margin: 1em 0; }",
            "figure svg { max-width: 100%; height: auto; border: 1px solid #eee; }",
            "figcaption { color: #555; font-size: 0.9em; }",
            "pre { background: #f6f6f6; border: 1px solid #e2e2e2; padding: 0.6em; overflow-x: auto;"
                    + " font-size: 0.85em; }",
            "dl { display: grid; grid-template-columns: max-content auto; gap: 0.2em 1em; }",
            "dt { font-weight: bold; }",
            "dd { margin: 0; font-family: monospace; overflow-wrap: anywhere; }");

    private HtmlReport() {
    }

    /**
     * A table with a caption: a study's ranking (one row per design, in rank order) or a run's points.
     * Every row has one cell per header.
     */
    public record Table(String caption, List<String> header, List<List<String>> rows) {
        public Table {
            header = List.copyOf(header);
            rows = rows.stream().map(List::copyOf).toList();
            for (List<String> row : rows) {
                if (row.size() != header.size()) {
                    throw new IllegalArgumentException("a table row has " + row.size() + " cells, the header "
                            + header.size());
                }
            }
        }
    }

    /**
     * A plot.
     *
     * @param svg an {@code <svg>} element (not a document with an XML prolog), as
     *            {@link FerPlot#write} and {@link ComparisonPlot#write} return it
     */
    public record Figure(String caption, String svg) {
        public Figure {
            String s = svg.strip();
            if (!s.startsWith("<svg") || !s.endsWith("</svg>") || s.toLowerCase(Locale.ROOT).contains("<script")) {
                throw new IllegalArgumentException("a figure must be one inline <svg> element without scripts");
            }
        }
    }

    /**
     * One design's section.
     *
     * @param keyNumbers its summary, name to value, in the order given (see {@link RunReport#keyNumbers})
     * @param settings   its settings as a scenario file's text (its scenario.yaml)
     */
    public record DesignSection(String name, Map<String, String> keyNumbers, String settings) {
        public DesignSection {
            keyNumbers = Collections.unmodifiableMap(new LinkedHashMap<>(keyNumbers));
        }
    }

    /**
     * Where the results came from.
     *
     * @param seed        the master seed (or seeds, for results of several runs)
     * @param date        when the report was made, e.g. {@code 2026-12-03T01:02:03Z}
     * @param commandLine the command that made it, quoted as a POSIX shell reads it
     */
    public record Provenance(String toolVersion, String seed, String javaVersion, String date, String commandLine) {

        /** This program's version, this Java, the time now (UTC, whole seconds) and {@code fadebench ARGS…}. */
        public static Provenance now(String seed, List<String> args) {
            return new Provenance(ToolVersion.version(), seed, System.getProperty("java.version"),
                    Instant.now().truncatedTo(ChronoUnit.SECONDS).toString(), commandLine(args));
        }

        /** {@code fadebench} and the arguments, each quoted for a POSIX shell where it needs it. */
        static String commandLine(List<String> args) {
            StringBuilder b = new StringBuilder("fadebench");
            for (String a : args) {
                b.append(' ').append(a.matches("[A-Za-z0-9_./:=@%+,-]+") ? a : "'" + a.replace("'", "'\\''") + "'");
            }
            return b.toString();
        }
    }

    /**
     * Everything the page shows.
     *
     * @param summary a few sentences computed from the results, one paragraph each
     * @param table   the ranking of a study, or the points of a run
     * @param figures the plots, in order
     * @param designs one section per design, in the table's order
     */
    public record Report(String title, List<String> summary, Table table, List<Figure> figures, List<DesignSection> designs,
                         Provenance provenance) {
        public Report {
            summary = List.copyOf(summary);
            figures = List.copyOf(figures);
            designs = List.copyOf(designs);
        }
    }

    /** Writes the page to {@code file}, atomically. */
    public static void write(Path file, Report report) throws IOException {
        AtomicFiles.writeString(file, html(report));
    }

    /** The page's text. */
    public static String html(Report r) {
        StringBuilder h = new StringBuilder(64 * 1024);
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(escape(r.title())).append("</title>\n")
                .append("<style>\n").append(STYLE).append("\n</style>\n</head>\n<body>\n");
        h.append("<h1>").append(escape(r.title())).append("</h1>\n");
        for (String s : r.summary()) {
            h.append("<p class=\"summary\">").append(escape(s)).append("</p>\n");
        }
        table(h, r.table());
        for (int i = 0; i < r.figures().size(); i++) {
            Figure f = r.figures().get(i);
            h.append("<figure>\n").append(ownIds(f.svg().strip(), "figure" + (i + 1) + "-"))
                    .append("\n<figcaption>").append(escape(f.caption())).append("</figcaption>\n</figure>\n");
        }
        h.append("<h2>").append(r.designs().size() == 1 ? "Design" : "Designs").append("</h2>\n");
        for (DesignSection d : r.designs()) {
            h.append("<section>\n<h3>").append(escape(d.name())).append("</h3>\n<table class=\"numbers\">\n");
            d.keyNumbers().forEach((k, v) -> h.append("<tr><th scope=\"row\">").append(escape(k)).append("</th>")
                    .append(cell(v)).append("</tr>\n"));
            h.append("</table>\n<p>Settings (scenario file; <code>fadebench run FILE</code> repeats the run):</p>\n")
                    .append("<pre>").append(escape(d.settings())).append("</pre>\n</section>\n");
        }
        Provenance p = r.provenance();
        h.append("<h2>Provenance</h2>\n<dl>\n");
        definition(h, "tool", "fadebench " + p.toolVersion());
        definition(h, "seed", p.seed());
        definition(h, "Java", p.javaVersion());
        definition(h, "date", p.date());
        definition(h, "command", p.commandLine());
        h.append("</dl>\n</body>\n</html>\n");
        return h.toString();
    }

    /**
     * The SVG with {@code prefix} before each of its ids and each reference to them ({@code url(#id)},
     * {@code href="#id"}): two plots drawn alike use the same ids, and in one page a reference finds
     * the first element of its id, which may be the other plot's.
     */
    static String ownIds(String svg, String prefix) {
        Matcher ids = ID.matcher(svg);
        StringBuilder alternatives = new StringBuilder();
        while (ids.find()) {
            alternatives.append(alternatives.length() == 0 ? "" : "|").append(Pattern.quote(ids.group(2)));
        }
        if (alternatives.length() == 0) {
            return svg;
        }
        return Pattern.compile("(\\sid=['\"]|url\\(#|href=['\"]#)(" + alternatives + ")(?=['\")])").matcher(svg)
                .replaceAll(m -> Matcher.quoteReplacement(m.group(1) + prefix + m.group(2)));
    }

    private static void table(StringBuilder h, Table t) {
        h.append("<h2>").append(escape(t.caption())).append("</h2>\n<table>\n<thead>\n<tr>");
        for (String c : t.header()) {
            h.append("<th scope=\"col\">").append(escape(c)).append("</th>");
        }
        h.append("</tr>\n</thead>\n<tbody>\n");
        for (List<String> row : t.rows()) {
            h.append("<tr>");
            row.forEach(c -> h.append(cell(c)));
            h.append("</tr>\n");
        }
        h.append("</tbody>\n</table>\n");
    }

    private static String cell(String text) {
        String open = text != null && NUMERIC.matcher(text).matches() ? "<td class=\"number\">" : "<td>";
        return open + escape(text) + "</td>";
    }

    private static void definition(StringBuilder h, String term, String value) {
        h.append("<dt>").append(escape(term)).append("</dt><dd>").append(escape(value)).append("</dd>\n");
    }

    /** The text with {@code & < > " '} as character references; null as the empty string. */
    static String escape(String text) {
        if (text == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(text.length() + 16);
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '&' -> b.append("&amp;");
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(c);
            }
        }
        return b.toString();
    }
}
