package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.fadebench.bench.report.HtmlChecks;
import org.fadebench.bench.report.Numbers;
import org.fadebench.bench.study.DesignRow;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code fadebench study} and {@code fadebench compare} through the command line. */
class StudyCliTest {

    @TempDir
    Path tmp;

    private static final ObjectMapper JSON = new ObjectMapper();

    /**
     * Three uncoded BPSK designs over quasi-static Rayleigh fading, 64-bit frames, FER target 0.1,
     * 400 frame errors per point (about +-10 % on each FER, so about +-0.25 dB on each SNR at the
     * target at diversity 2).
     */
    private static final String THREE = """
            title: "Transmit or receive diversity, BPSK"
            link:
              modulation: bpsk
              frame_bits: 64
            sweep:
              snr_db: "0..20/1"
              min_errors: 400
              max_frames: 200000
              fer_floor: 0.02
              seed: 7
            analysis:
              target_fer: 0.1
              budget_db: 6
            designs:
              - name: mrc-1x2
                link: {rx: 2}
              - name: alamouti-2x1
                link: {code: alamouti, rx: 1}
              - name: alamouti-2x2
                link: {code: alamouti, rx: 2}
            """;

    private Path file(String name, String text) throws IOException {
        return Files.writeString(tmp.resolve(name), text);
    }

    private static CliTest.Outcome study(Path file, Path out, String... extra) {
        List<String> a = new ArrayList<>(List.of("study", file.toString(), "--out", out.toString(), "--quiet"));
        a.addAll(List.of(extra));
        return CliTest.run(a.toArray(new String[0]));
    }

    private static Map<String, JsonNode> byDesign(Path dir) throws IOException {
        Map<String, JsonNode> m = new TreeMap<>();
        JSON.readTree(dir.resolve("study.json").toFile()).path("designs").forEach(d -> m.put(d.path("design").asText(), d));
        return m;
    }

    /**
     * Alamouti 2x1 has the diversity of 1x2 maximal-ratio combining but splits the power over two
     * transmit antennas, so it needs 10 log10 2 = 3.01 dB more SNR for the same error rate (S. M.
     * Alamouti, "A simple transmit diversity technique for wireless communications", IEEE JSAC 16(8),
     * 1998, section IV; common practice). The difference of the two SNRs at the target must hold
     * 3.01 dB within its interval, formed from the two designs' intervals (each from the FER
     * intervals around its crossing): [low(2x1) - high(1x2), high(2x1) - low(1x2)]. The 2x2 design
     * (diversity 4) ranks first; with the budget of 6 dB only it meets the target.
     */
    @Test
    void alamoutiTwoByOneIsThreeDbBehindCombining() throws Exception {
        Path out = tmp.resolve("three");
        CliTest.Outcome o = study(file("three.yaml", THREE), out, "--threads", "2");
        assertEquals(0, o.code(), o.err());
        Map<String, JsonNode> d = byDesign(out);
        assertEquals("Transmit or receive diversity, BPSK", JSON.readTree(out.resolve("study.json").toFile())
                .path("title").asText(), "the study's title: heads study.json");
        JsonNode mrc = d.get("mrc-1x2");
        JsonNode ala = d.get("alamouti-2x1");
        double diff = ala.path("snr_db_at_target").asDouble() - mrc.path("snr_db_at_target").asDouble();
        double low = ala.path("snr_db_at_target_ci").get(0).asDouble() - mrc.path("snr_db_at_target_ci").get(1).asDouble();
        double high = ala.path("snr_db_at_target_ci").get(1).asDouble() - mrc.path("snr_db_at_target_ci").get(0).asDouble();
        double split = 10 * Math.log10(2);
        assertTrue(low <= split && split <= high, "difference " + diff + " dB, interval " + low + " to " + high);
        // the intervals are those of 400 errors per point: each under 1 dB wide, so the check has teeth
        for (JsonNode n : d.values()) {
            JsonNode ci = n.path("snr_db_at_target_ci");
            assertTrue(ci.get(1).asDouble() - ci.get(0).asDouble() < 1.0, n.toString());
            assertTrue(ci.get(0).asDouble() <= n.path("snr_db_at_target").asDouble()
                    && n.path("snr_db_at_target").asDouble() <= ci.get(1).asDouble(), n.toString());
        }
        assertEquals(1, d.get("alamouti-2x2").path("rank").asInt());
        assertEquals(2, mrc.path("rank").asInt());
        assertEquals(3, ala.path("rank").asInt());
        assertTrue(d.get("alamouti-2x2").path("meets_target").asBoolean());
        assertFalse(mrc.path("meets_target").asBoolean());
        // uncoded at the constellation's full rate: no QAM gap, and the reason is given
        assertTrue(mrc.path("gap_db").path("qam").isNull());
        assertTrue(mrc.path("gap_note").path("qam").asText().contains("full rate"), mrc.toString());
        // each design's folder holds what run writes, and its SNR is the run's own
        for (String name : d.keySet()) {
            JsonNode results = JSON.readTree(out.resolve(name).resolve("results.json").toFile());
            assertEquals(results.path("summary").path("snr_db_at_target").asDouble(),
                    d.get(name).path("snr_db_at_target").asDouble(), 0.0);
            assertTrue(Files.exists(out.resolve(name).resolve("scenario.yaml")));
        }
        // the study's plot and report: one ranking row per design, every SVG well-formed (HtmlChecks)
        assertTrue(Files.size(out.resolve("fer.png")) > 0 && Files.size(out.resolve("fer.svg")) > 0);
        String html = Files.readString(out.resolve("report.html"));
        org.jsoup.nodes.Document page = HtmlChecks.selfContained(html);
        assertEquals(3, page.select("table").first().select("tbody tr").size());
        List<String> svgs = HtmlChecks.svgElements(html);
        assertEquals(1, svgs.size());
        for (String svg : svgs) {
            HtmlChecks.wellFormedXml(svg);
        }
        List<String> csv = Files.readAllLines(out.resolve("study.csv"));
        assertTrue(csv.contains("rank,design,bits_per_channel_use,snr_db_at_target,snr_db_at_target_low,"
                + "snr_db_at_target_high,ebn0_db_at_target,diversity_order,gap_db_mimo,gap_db_stbc,gap_db_qam,"
                + "meets_target,frames,seconds,status,reason"), csv.toString());
        assertTrue(csv.stream().anyMatch(l -> l.startsWith("1,alamouti-2x2,1,")), csv.toString());
    }

    /**
     * Same study file and seed on 1 and 3 threads: every file the same bytes, except results.json's
     * timing (seconds, rates, threads, Java version) and study's seconds column.
     */
    @Test
    void sameBytesOnAnyThreadCount() throws IOException {
        String small = THREE.replace("min_errors: 400", "min_errors: 40");
        Path f = file("small.yaml", small);
        Path one = tmp.resolve("one");
        Path three = tmp.resolve("three");
        assertEquals(0, study(f, one, "--threads", "1").code());
        assertEquals(0, study(f, three, "--threads", "3").code());
        assertSameFiles(one, three);
    }

    /** Every file of both folders the same, timing and the folders' own names aside; names the files that differ. */
    private static void assertSameFiles(Path a, Path b) throws IOException {
        Map<String, String> x = files(a);
        Map<String, String> y = files(b);
        assertEquals(x.keySet(), y.keySet());
        List<String> differ = x.keySet().stream().filter(k -> !x.get(k).equals(y.get(k))).toList();
        assertTrue(differ.isEmpty(), "files that differ: " + differ + (differ.isEmpty() ? ""
                : ", first at: " + firstDifference(x.get(differ.get(0)), y.get(differ.get(0)))));
    }

    private static String firstDifference(String a, String b) {
        int i = 0;
        while (i < Math.min(a.length(), b.length()) && a.charAt(i) == b.charAt(i)) {
            i++;
        }
        return a.substring(Math.max(0, i - 60), Math.min(a.length(), i + 60)) + " | "
                + b.substring(Math.max(0, i - 60), Math.min(b.length(), i + 60));
    }

    /** Every file of a study folder by its relative name, timing removed. */
    private static Map<String, String> files(Path dir) throws IOException {
        Map<String, String> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(dir)) {
            // report.html holds the date and the command line (as results.json holds timing): left out
            for (Path p : s.filter(Files::isRegularFile).filter(p -> !p.endsWith("report.html")).toList()) {
                String name = dir.relativize(p).toString();
                String text = name.endsWith(".png") ? java.util.Base64.getEncoder().encodeToString(Files.readAllBytes(p))
                        : Files.readString(p);
                if (name.endsWith(".json")) {
                    text = withoutTiming(JSON.readTree(text)).toString();
                } else if (name.equals("study.csv")) {
                    text = text.replaceAll(",[0-9.]+,(simulated|screened_out|skipped),", ",,$1,");
                }
                m.put(name, text.replace(dir.toAbsolutePath().toString(), "DIR").replace(dir.toString(), "DIR"));
            }
        }
        return m;
    }

    private static JsonNode withoutTiming(JsonNode n) {
        if (n instanceof ObjectNode o) {
            o.remove(List.of("seconds", "timing", "symbols_per_second", "info_bits_per_second", "threads", "java"));
            for (Iterator<JsonNode> it = o.elements(); it.hasNext(); ) {
                withoutTiming(it.next());
            }
        } else if (n.isArray()) {
            n.forEach(StudyCliTest::withoutTiming);
        }
        return n;
    }

    /**
     * SIGTERM while the second design runs: exit 143, the first design kept, the second's checkpoint
     * written; --resume then ends with the same files as a study never interrupted.
     */
    @Test
    void interruptedStudyResumes() throws Exception {
        String text = """
                sweep:
                  snr_db: "0..18/3"
                  seed: 21
                designs:
                  - name: quick
                    link: {modulation: bpsk, frame_bits: 64}
                  - name: long
                    link: {code: alamouti, modulation: 16qam, frame_bits: 256}
                """;
        Path straight = tmp.resolve("straight");
        Path cut = tmp.resolve("interrupted");
        Path longFile = file("cut.yaml", text.replace("  seed: 21", "  seed: 21\n  min_errors: 60000"));
        assertEquals(0, study(longFile, straight, "--threads", "1").code());

        Path checkpoint = cut.resolve("long").resolve("checkpoint.json");
        Process p = InterruptResumeTest.terminatedOnceWritten(List.of("study", longFile.toString(), "--out",
                cut.toString(), "--threads", "1"), checkpoint, tmp.resolve("cut.log"));
        String log = Files.readString(tmp.resolve("cut.log"));
        assertEquals(143, p.exitValue(), log);
        assertTrue(log.contains("run the same command with --resume"), log);
        assertTrue(Files.exists(cut.resolve("quick").resolve("results.csv")), "the finished design is kept");
        assertFalse(Files.exists(cut.resolve("study.csv")), "no ranking before every design is done");

        CliTest.Outcome resumed = study(longFile, cut, "--threads", "1", "--resume");
        assertEquals(0, resumed.code(), resumed.err());
        assertSameFiles(straight, cut);
        assertFalse(Files.exists(checkpoint));
    }

    /** Bad study files: one line naming the file, line and key, exit 2, nothing written. */
    @Test
    void badStudyFilesAreRefusedInOneLine() throws IOException {
        String[][] cases = {
            // unknown key in the common link section, with the closest key
            {"link:\n  rxx: 2\ndesigns:\n  - name: a\n", "line 2: unknown key 'link.rxx' (did you mean 'rx'?)"},
            // unknown section
            {"desings:\n  - name: a\n", "line 1: unknown section 'desings' (did you mean 'designs'?)"},
            // unknown key of a design
            {"designs:\n  - name: a\n    lnk: {rx: 2}\n", "line 3: unknown key 'designs.lnk' (did you mean 'link'?)"},
            // unknown key in a design's link
            {"designs:\n  - name: a\n    link: {modulaton: bpsk}\n", "line 3: unknown key 'link.modulaton' (did you "
                    + "mean 'modulation'?)"},
            // unknown vary key
            {"vary:\n  rxx: [1, 2]\n", "line 2: unknown key 'vary.rxx' (did you mean 'rx'?)"},
            // a grid that yields zero designs
            {"vary:\n  rx: []\n", "line 2, key vary.rx: an empty list, so the grid yields zero designs"},
            // every combination impossible: alamouti needs two transmit antennas
            {"link:\n  tx: 1\nvary:\n  code: [alamouti, g4]\n", "the grid yields zero designs"},
            // duplicate design names
            {"designs:\n  - name: a\n  - name: b\n  - name: a\n", "line 4, key designs.name: design name 'a' appears "
                    + "twice (first at line 2)"},
            // an invalid design
            {"designs:\n  - name: ok\n  - name: bad\n    link: {rx: 0}\n", "line 4, key link.rx: --rx"},
            // a study key of the wrong kind
            {"analysis:\n  budget_db: high\ndesigns:\n  - name: a\n", "line 2, key analysis.budget_db: expected a "
                    + "number, got 'high'"},
            // a screen without a budget
            {"analysis:\n  screen: true\ndesigns:\n  - name: a\n", "line 2, key analysis.screen: needs "
                    + "analysis.budget_db"},
            // a title that is not one line of text
            {"title: [a, b]\ndesigns:\n  - name: a\n", "line 1, key title: the study's title is one line"},
            // an explicit YAML tag
            {"designs:\n  - name: !!str a\n", "line 2: YAML tags are not allowed"},
        };
        for (String[] c : cases) {
            Path f = file("bad.yaml", c[0]);
            Path out = tmp.resolve("bad-out");
            CliTest.Outcome o = study(f, out);
            String err = o.err().trim();
            assertEquals(2, o.code(), c[0] + " -> " + err);
            assertTrue(err.startsWith("fadebench study: " + f), err);
            assertTrue(err.contains(c[1]), c[0] + " -> " + err);
            assertFalse(err.contains("\n") || err.contains("Exception"), err);
            assertFalse(Files.exists(out), "nothing written for " + c[0]);
        }
    }

    /**
     * vary: crosses its lists into designs named from their values; the impossible combinations
     * (Alamouti's code on one transmit antenna, no code on two) are skipped and listed with their
     * reason.
     */
    @Test
    void varyCrossesAndSkipsTheImpossible() throws IOException {
        String text = """
                link:
                  modulation: bpsk
                  frame_bits: 64
                sweep:
                  snr_db: "0,10"
                  min_errors: 10
                vary:
                  code: [none, alamouti]
                  tx: [1, 2]
                """;
        Path out = tmp.resolve("grid");
        CliTest.Outcome o = study(file("grid.yaml", text), out, "--threads", "2");
        assertEquals(0, o.code(), o.err());
        JsonNode j = JSON.readTree(out.resolve("study.json").toFile());
        assertEquals(List.of("code-alamouti_tx-2", "code-none_tx-1"), List.copyOf(byDesign(out).keySet()));
        List<String> skipped = new ArrayList<>();
        j.path("skipped").forEach(s -> skipped.add(s.path("design").asText()));
        assertEquals(List.of("code-none_tx-2", "code-alamouti_tx-1"), skipped);
        j.path("skipped").forEach(s -> assertTrue(s.path("reason").asText().contains("--tx"), s.toString()));
        assertFalse(Files.exists(out.resolve("code-alamouti_tx-1")));
        assertTrue(Files.readString(out.resolve("study.csv")).contains(",code-alamouti_tx-1,"));
        // a value no combination can use is refused: Alamouti's code with one transmit antenna fixed
        CliTest.Outcome refused = study(file("grid2.yaml", text.replace("  tx: [1, 2]", "  rx: [1, 2]")
                .replace("link:\n", "link:\n  tx: 1\n")), tmp.resolve("grid2"));
        assertEquals(2, refused.code(), refused.err());
        assertTrue(refused.err().contains("line 9, key vary.code: the value 'alamouti' makes no possible design"),
                refused.err());
    }

    /**
     * Screening: over quasi-static Rayleigh fading a 1x1 link of R bits per channel use is in outage
     * with probability 1 - exp(-(2^R - 1)/SNR) with Gaussian inputs (L. H. Ozarow, S. Shamai, A. D.
     * Wyner, "Information theoretic considerations for cellular mobile radio", IEEE Trans. Veh.
     * Technol. 43(2), 1994); at R near 1 and 10 dB that is about 0.09, and QPSK's constrained outage
     * is higher still: far above 2 x 0.01, so the design is screened out and not simulated. Alamouti
     * 2x2 at 10 dB is in outage with probability below 1e-3 and is simulated; the uncoded design is
     * at the constellation's full rate and is not screened.
     */
    @Test
    void screeningSkipsWhatCannotMeetTheTarget() throws IOException {
        String text = """
                link:
                  modulation: qpsk
                  fec: conv-r12
                  frame_bits: 64
                sweep:
                  snr_db: "0,10"
                  min_errors: 10
                analysis:
                  budget_db: 10
                  screen: true
                designs:
                  - name: siso
                  - name: alamouti-2x2
                    link: {code: alamouti, rx: 2}
                  - name: uncoded
                    link: {fec: none}
                """;
        Path out = tmp.resolve("screen");
        CliTest.Outcome o = study(file("screen.yaml", text), out, "--threads", "2");
        assertEquals(0, o.code(), o.err());
        JsonNode j = JSON.readTree(out.resolve("study.json").toFile());
        assertEquals("siso", j.path("screened_out").get(0).path("design").asText());
        String reason = j.path("screened_out").get(0).path("reason").asText();
        assertTrue(reason.startsWith("screened out: QAM-constrained outage 0."), reason);
        assertFalse(Files.exists(out.resolve("siso")), "not simulated");
        assertEquals(List.of("alamouti-2x2", "uncoded"), List.copyOf(byDesign(out).keySet()));
    }

    /**
     * compare of two run folders gives each run's own numbers: the SNR at the target, the diversity
     * order and the gaps exactly as in its results.json, the frames summed over its points; runs
     * with another SNR convention are refused, and runs of another tool version flagged.
     */
    @Test
    void compareReproducesTheRuns() throws IOException {
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        String[] common = {"--snr", "0..20/4", "--frame-bits", "128", "--min-errors", "40", "--threads", "2", "--quiet"};
        assertEquals(0, CliTest.run(with(new String[] {"run", "--rx", "2", "--out", a.toString()}, common)).code());
        assertEquals(0, CliTest.run(with(new String[] {"run", "--code", "alamouti", "--fec", "conv-r12", "--out",
            b.toString()}, common)).code());
        Path out = tmp.resolve("cmp");
        CliTest.Outcome o = CliTest.run("compare", a.toString(), b.toString(), "--out", out.toString());
        assertEquals(0, o.code(), o.err());
        Map<String, JsonNode> rows = byDesign(out);
        List<String> csv = Files.readAllLines(out.resolve("study.csv"));
        for (Path run : List.of(a, b)) {
            JsonNode results = JSON.readTree(run.resolve("results.json").toFile());
            JsonNode summary = results.path("summary");
            JsonNode row = rows.get(run.getFileName().toString());
            assertEquals(summary.path("snr_db_at_target"), row.path("snr_db_at_target"));
            assertEquals(summary.path("diversity_order"), row.path("diversity_order"));
            for (String bound : List.of("mimo", "stbc", "qam")) {
                assertEquals(summary.path("gap_db").path(bound), row.path("gap_db").path(bound), bound);
            }
            assertEquals(results.path("bits_per_channel_use"), row.path("bits_per_channel_use"));
            long frames = 0;
            for (JsonNode p : results.path("points")) {
                frames += p.path("frames").asLong();
            }
            assertEquals(frames, row.path("frames").asLong());
            // the points a figure draws are the run's own
            DesignRow read = DesignRow.read("x", run);
            for (int i = 0; i < results.path("points").size(); i++) {
                JsonNode p = results.path("points").get(i);
                assertEquals(p.path("fer").asDouble(), read.curve().points().get(i).fer(), 0.0);
                assertEquals(p.path("fer_ci_high").asDouble(), read.curve().points().get(i).ferHigh(), 0.0);
                assertEquals(p.path("snr_db").asDouble(), read.curve().points().get(i).snrDb(), 0.0);
            }
            String line = csv.stream().filter(l -> l.contains("," + run.getFileName() + ",")).findFirst().orElseThrow();
            assertTrue(line.contains("," + Numbers.db(summary.path("snr_db_at_target").asDouble()) + ","), line);
        }
        // the plot and report of the comparison; a run's own folder is refused as its folder
        assertTrue(Files.exists(out.resolve("fer.svg")) && Files.exists(out.resolve("report.html")));
        CliTest.Outcome intoRun = CliTest.run("compare", a.toString(), b.toString(), "--out", a.toString());
        assertEquals(2, intoRun.code(), intoRun.err());
        assertTrue(intoRun.err().contains("holds a run's results"), intoRun.err());
        // another SNR convention is refused; another version is flagged
        Path c = tmp.resolve("c");
        copy(a, c);
        ObjectNode edited = (ObjectNode) JSON.readTree(c.resolve("results.json").toFile());
        edited.put("snr_convention", "snr_db = Es/N0 per transmit antenna");
        JSON.writeValue(c.resolve("results.json").toFile(), edited);
        CliTest.Outcome refused = CliTest.run("compare", a.toString(), c.toString());
        assertEquals(2, refused.code(), refused.err());
        assertTrue(refused.err().contains("its SNR convention differs"), refused.err());
        edited = (ObjectNode) JSON.readTree(a.resolve("results.json").toFile());
        edited.put("version", "0.0.1");
        JSON.writeValue(c.resolve("results.json").toFile(), edited);
        CliTest.Outcome flagged = CliTest.run("compare", a.toString(), c.toString());
        assertEquals(0, flagged.code(), flagged.err());
        assertTrue(flagged.out().contains("note: runs written by different tool versions"), flagged.out());
    }

    private static void copy(Path from, Path to) throws IOException {
        Files.createDirectories(to);
        try (Stream<Path> s = Files.list(from)) {
            for (Path p : s.toList()) {
                Files.copy(p, to.resolve(p.getFileName()));
            }
        }
    }

    private static String[] with(String[] a, String[] b) {
        List<String> l = new ArrayList<>(List.of(a));
        l.addAll(List.of(b));
        return l.toArray(new String[0]);
    }
}
