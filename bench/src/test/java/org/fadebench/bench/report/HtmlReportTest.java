package org.fadebench.bench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.fadebench.bench.report.ComparisonPlot.Design;
import org.fadebench.bench.report.FerPlot.XQuantity;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HtmlReportTest {

    /** Text that breaks a page unless escaped: markup, a script, an entity, both quotes. */
    private static final String HOSTILE = "<b>R&D</b> \"x\" 'y' </pre><script>alert(1)</script> &amp;";

    /** A study-like report of the three designs of {@link ComparisonPlotTest}, one named {@link #HOSTILE}. */
    private static HtmlReport.Report report(Path dir) throws Exception {
        List<Design> designs = new ArrayList<>(ComparisonPlotTest.designs());
        designs.set(1, new Design(HOSTILE, 2, designs.get(1).points(), designs.get(1).qamBound()));
        String svg = ComparisonPlot.write(dir, designs, new ComparisonPlot.Layout("Three designs", XQuantity.SNR, 0.01,
                14, true, 0.95, Double.NaN));
        List<List<String>> rows = new ArrayList<>();
        List<HtmlReport.DesignSection> sections = new ArrayList<>();
        for (int i = 0; i < designs.size(); i++) {
            String name = designs.get(i).name();
            rows.add(List.of(Integer.toString(i + 1), name, Numbers.db(designs.get(i).bitsPerChannelUse()),
                    (7.5 + i) + " dB", i == 2 ? "no" : "yes"));
            Map<String, String> numbers = new LinkedHashMap<>();
            numbers.put("SNR at FER 0.01", (7.5 + i) + " dB");
            numbers.put("note", HOSTILE);
            sections.add(new HtmlReport.DesignSection(name, numbers, "link:\n  rx: " + (i + 1) + "\n# " + HOSTILE + "\n"));
        }
        return new HtmlReport.Report("Study <of> three & more", List.of("Alamouti 2x1 needs 3.01 dB more than "
                + "1x2 combining.", HOSTILE),
                new HtmlReport.Table("Ranking", List.of("rank", "design", "bits per channel use", "SNR at target",
                        "meets budget"), rows),
                List.of(new HtmlReport.Figure("FER of every design (fer.svg)", svg)), sections,
                new HtmlReport.Provenance("0.1.0-TEST", "7", "17.0.9", "2026-12-03T01:00:00Z",
                        HtmlReport.Provenance.commandLine(List.of("study", "my study.yaml", "--out", "o"))));
    }

    /**
     * The page parses without errors, its plot is well-formed XML, it loads nothing, the table has
     * one row per design, and every text reads back exactly as given (so it was escaped).
     */
    @Test
    void selfContainedPageWithOneRowPerDesign(@TempDir Path dir) throws Exception {
        HtmlReport.Report r = report(dir);
        HtmlReport.write(dir.resolve(HtmlReport.FILE), r);
        String html = Files.readString(dir.resolve(HtmlReport.FILE));
        Document doc = HtmlChecks.selfContained(html);

        assertEquals(r.title(), doc.title());
        assertEquals(r.title(), doc.selectFirst("h1").text());
        assertEquals(r.summary(), doc.select("p.summary").eachText());
        Element table = doc.selectFirst("table");
        assertEquals(r.table().header(), table.select("thead th").eachText());
        Elements rows = table.select("tbody > tr");
        assertEquals(3, rows.size(), "one row per design");
        for (int i = 0; i < rows.size(); i++) {
            assertEquals(r.table().rows().get(i), rows.get(i).select("td").eachText());
        }
        assertEquals("number", rows.get(0).select("td").get(3).className(), "numbers are right-aligned");
        assertEquals("", rows.get(0).select("td").get(1).className());
        assertEquals(1, doc.select("figure > svg").size());
        assertEquals("FER of every design (fer.svg)", doc.selectFirst("figcaption").text());
        assertEquals(3, doc.select("section > h3").size());
        for (int i = 0; i < 3; i++) {
            Element section = doc.select("section").get(i);
            HtmlReport.DesignSection d = r.designs().get(i);
            assertEquals(d.name(), section.selectFirst("h3").text());
            assertEquals(d.settings(), section.selectFirst("pre").wholeText(), "settings verbatim");
            assertEquals(List.copyOf(d.keyNumbers().keySet()), section.select("th").eachText());
            assertEquals(List.copyOf(d.keyNumbers().values()), section.select("td").eachText());
        }
        assertTrue(doc.select("script").isEmpty());
        assertEquals(List.of("fadebench 0.1.0-TEST", "7", "17.0.9", "2026-12-03T01:00:00Z",
                "fadebench study 'my study.yaml' --out o"), doc.select("dd").eachText());
        assertEquals(List.of("tool", "seed", "Java", "date", "command"), doc.select("dt").eachText());
    }

    /**
     * Two plots drawn alike (here the same run's plot twice) use the same ids; in the page each gets
     * its own, and every reference of each plot stays within it.
     */
    @Test
    void twoPlotsKeepTheirOwnIds(@TempDir Path dir) throws Exception {
        String svg = FerPlot.write(dir, FerPlotTest.LINK, 1, FerPlotTest.sweep(), 0.95, FerPlotTest.bounds(), 0.01,
                FerPlot.Axes.AUTOMATIC);
        assertTrue(svg.contains("id='fer-clip-0'") && svg.contains("url(#fer-clip-0)"), "ids as drawn");
        HtmlReport.Figure figure = new HtmlReport.Figure("plot", svg);
        HtmlReport.Report r = new HtmlReport.Report("two plots", List.of(), new HtmlReport.Table("t", List.of("a"),
                List.of()), List.of(figure, figure), List.of(), new HtmlReport.Provenance("v", "1", "17", "d", "c"));
        Document doc = HtmlChecks.selfContained(HtmlReport.html(r));
        assertEquals(2, doc.select("svg").size());
        assertEquals(1, doc.select("#figure1-fer-clip-0").size());
        assertEquals(1, doc.select("#figure2-fer-clip-0").size());
        assertThrows(Throwable.class, () -> HtmlChecks.selfContained(HtmlReport.html(r).replaceAll("figure[12]-", "")),
                "the same page without its own ids fails the checks");
    }

    /** A page that loads something fails the checks the report is held to: they can fail. */
    @Test
    void theChecksCatchWhatWouldLoad() throws Exception {
        String head = "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>t</title></head><body>";
        assertEquals("fine", HtmlChecks.selfContained(head + "<p><a href=\"#x\" id=\"x\">fine</a></p></body></html>")
                .selectFirst("p").text(), "the same page without the bad part passes");
        for (String bad : List.of("<script>1</script>", "<img src=\"https://example.org/a.png\" alt=\"\">",
                "<a href=\"other.html\">x</a>", "<p style=\"background: url(http://example.org/x)\">x</p>",
                "<svg xmlns=\"http://www.w3.org/2000/svg\"><path d=\"M0 0\"></svg>",
                "<p onclick=\"x()\">x</p>")) {
            assertThrows(Throwable.class, () -> HtmlChecks.selfContained(head + bad + "</body></html>"), bad);
        }
    }

    @Test
    void commandLineIsQuotedForAShell() {
        assertEquals("fadebench run --snr 0..10/2 --out 'my run' 'it'\\''s' ''",
                HtmlReport.Provenance.commandLine(List.of("run", "--snr", "0..10/2", "--out", "my run", "it's", "")));
        HtmlReport.Provenance p = HtmlReport.Provenance.now("3", List.of("run"));
        assertEquals(ToolVersion.version(), p.toolVersion());
        assertEquals(System.getProperty("java.version"), p.javaVersion());
        assertTrue(p.date().matches("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\dZ"), p.date());
    }

    @Test
    void refusesWhatItCannotShow() {
        assertThrows(IllegalArgumentException.class,
                () -> new HtmlReport.Table("t", List.of("a", "b"), List.of(List.of("1"))));
        assertThrows(IllegalArgumentException.class, () -> new HtmlReport.Figure("f", "<?xml version=\"1.0\"?><svg/>"));
        assertThrows(IllegalArgumentException.class,
                () -> new HtmlReport.Figure("f", "<svg><script>x()</script></svg>"));
    }
}
