package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.fadebench.bench.report.HtmlChecks;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class CliTest {

    @TempDir
    Path tmp;

    record Outcome(int code, String out, String err) {
    }

    static Outcome run(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = FadebenchCli.execute(args, new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Outcome(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    private String[] withOut(Path dir, String... args) {
        List<String> a = new ArrayList<>(Arrays.asList(args));
        a.add("--out");
        a.add(dir.toString());
        return a.toArray(new String[0]);
    }

    @Test
    void runWritesCsvWithHeaderAndConvention() throws Exception {
        Path dir = tmp.resolve("ok");
        Outcome o = run(withOut(dir, "run", "--code", "alamouti", "--rx", "2", "--mod", "16qam",
                "--snr", "0..10/5", "--frame-bits", "512", "--min-errors", "20", "--max-frames", "2000",
                "--threads", "2"));
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("alamouti 2x2"), o.out());
        List<String> lines = Files.readAllLines(dir.resolve("results.csv"));
        assertTrue(lines.stream().anyMatch(l -> l.contains("total transmitted energy per channel use / N0")));
        String header = lines.stream().filter(l -> !l.startsWith("#")).findFirst().orElseThrow();
        assertTrue(header.startsWith("snr_db,frames,frame_errors,fer,bits,bit_errors,ber,ebn0_db"), header);
        assertEquals(3, lines.stream().filter(l -> !l.startsWith("#")).count() - 1);
        // 16-QAM Alamouti: 4 bits per channel use, so Eb/N0 = SNR - 6.0206 dB
        assertTrue(lines.stream().anyMatch(l -> l.startsWith("10,") && l.contains(",3.9794,")), lines.toString());
        try (var s = Files.list(dir)) {
            assertEquals(List.of("fer.png", "fer.svg", "report.html", "results.csv", "results.json", "scenario.yaml"),
                    s.map(p -> p.getFileName().toString()).sorted().toList(), "no temporary files or checkpoint left");
        }
        runReport(dir, 3, "fadebench run --code alamouti --rx 2 --mod 16qam --snr 0..10/5");
    }

    /**
     * The run's report.html: a page that loads nothing (checked as {@link HtmlChecks} says), with
     * one table row per point holding the numbers of results.csv, the FER plot inline, the run's
     * scenario.yaml verbatim, its summary lines and the command line.
     */
    static void runReport(Path dir, int points, String commandStart) throws Exception {
        org.jsoup.nodes.Document doc = HtmlChecks.selfContained(Files.readString(dir.resolve("report.html")));
        List<String[]> csv = Files.readAllLines(dir.resolve("results.csv")).stream().filter(l -> !l.startsWith("#"))
                .skip(1).map(l -> l.split(",", -1)).toList();
        var rows = doc.selectFirst("table").select("tbody > tr");
        assertEquals(points, rows.size(), "one row per point");
        for (int i = 0; i < points; i++) {
            List<String> cells = rows.get(i).select("td").eachText();
            assertEquals(csv.get(i)[0], cells.get(0), "SNR");
            assertEquals(csv.get(i)[1], cells.get(2), "frames");
            assertEquals(csv.get(i)[2], cells.get(3), "frame errors");
        }
        assertEquals(1, doc.select("figure > svg").size());
        assertTrue(doc.selectFirst("figure > svg").text().contains("FER, simulated"));
        assertEquals(Files.readString(dir.resolve("scenario.yaml")), doc.selectFirst("section pre").wholeText());
        assertTrue(doc.select("p.summary").eachText().stream().anyMatch(t -> t.startsWith("SNR at FER 0.01: ")),
                doc.select("p.summary").eachText().toString());
        String command = doc.select("dd").get(4).text();
        assertTrue(command.startsWith(commandStart), command);
    }

    /** Same seed: byte-identical CSV for different thread counts. */
    @Test
    void sameSeedSameBytes() throws IOException {
        String[] base = {"run", "--code", "alamouti", "--snr", "4,8", "--min-errors", "30", "--seed", "5"};
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        List<String> argsA = new ArrayList<>(Arrays.asList(withOut(a, base)));
        argsA.addAll(List.of("--threads", "1"));
        List<String> argsB = new ArrayList<>(Arrays.asList(withOut(b, base)));
        argsB.addAll(List.of("--threads", "3"));
        assertEquals(0, run(argsA.toArray(new String[0])).code());
        assertEquals(0, run(argsB.toArray(new String[0])).code());
        assertEquals(Files.readString(a.resolve("results.csv")), Files.readString(b.resolve("results.csv")));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "--code g9 | --code: unknown space-time code 'g9'; valid: none, alamouti",
        "--mod 8psk | --mod: unknown modulation '8psk'; valid: bpsk, qpsk, 16qam, 64qam, 256qam",
        "--fading foggy | --fading: unknown fading model 'foggy'; valid: rayleigh, rician, nakagami, none",
        "--code alamouti --tx 3 | --code alamouti needs exactly 2 transmit antennas (--tx 2), got --tx 3",
        "--code none --tx 2 | --code none needs exactly 1 transmit antenna (--tx 1), got --tx 2",
        "--rx 0 | --rx must be a positive number of receive antennas, got 0",
        "--tx -1 | --tx must be a positive number of transmit antennas, got -1",
        "--snr 0:2:20 | --snr '0:2:20': the START:STEP:STOP form is not read; write 0..20/2 for the same points",
        "--snr 0..4/0 | STEP must be positive",
        "--snr 5,5 | --snr '5,5': 5 dB appears more than once; give each SNR point once",
        "--snr x | --snr 'x' is not a number",
        "--code alamouti --mod 16qam --frame-bits 100 | --frame-bits 100 does not fill whole code blocks",
        "--code alamouti --coherence 3 | --coherence 3 must be a positive multiple of alamouti's 2 slots",
        "--max-frames 0 | --max-frames must be positive, got 0",
        "--min-errors -3 | --min-errors must be 0 or more, got -3",
        "--threads 0 | --threads must be between 1 and 1024, got 0",
        "--confidence 1.5 | --confidence must lie strictly between 0 and 1",
        "--tx two | --tx expected a whole number, got 'two'",
        "--k-factor 3 | --k-factor applies only to --fading rician",
        "--fading rician | --fading rician needs --k-factor",
        "--doppler 0.7 | --doppler must be a normalised Doppler",
        "--trace /nonexistent.npy | --trace /nonexistent.npy: no such file",
        "--code alamouti --pilots 1 | --pilots must be at least the number of transmit antennas Mt = 2",
        "--tx-corr 1.5 | --tx-corr must be an exponential correlation coefficient in (-1, 1)",
        "--fading nakagami --nakagami-m 0.2 | --nakagami-m must be a finite Nakagami m >= 0.5",
        "--trace-out x.txt | --trace-out x.txt: unknown trace type",
        "--fec conv-r14 | --fec: unknown",
        "--crc crc8 | --crc: unknown",
        "--fec conv-r12 --interleaver block --interleaver-rows 7 | does not divide the 2060 coded bits",
        "--llr soft | --llr: unknown LLR method 'soft'; valid: maxlog, exact",
        "--rate -1 | --rate must be a positive number",
        "--target-fer 2 | --target-fer must lie strictly between 0 and 1",
        "--mi xyz | --mi: unknown mutual information kind",
        "--fadding rayleigh | Unknown option: '--fadding'; did you mean --fading?",
    })
    void badInputIsOneLineExitTwoAndWritesNothing(String args, String expected) {
        Path dir = tmp.resolve("never");
        List<String> a = new ArrayList<>(List.of("run"));
        a.addAll(Arrays.asList(args.trim().split("\\s+")));
        Outcome o = run(withOut(dir, a.toArray(new String[0])));
        assertEquals(2, o.code(), o.err());
        String err = o.err().trim();
        assertFalse(err.contains("\n"), "one line: " + err);
        assertFalse(err.contains("Exception"), "no stack trace: " + err);
        assertTrue(err.startsWith("fadebench run: "), err);
        assertTrue(err.contains(expected.trim()), err);
        assertFalse(Files.exists(dir), "no output written");
        assertEquals("", o.out());
    }

    @Test
    void outThatIsAFileIsRejected() throws IOException {
        Path file = Files.writeString(tmp.resolve("plain.txt"), "x");
        Outcome o = run("run", "--out", file.toString(), "--snr", "0");
        assertEquals(2, o.code());
        assertTrue(o.err().contains("exists and is not a folder"), o.err());
    }

    @Test
    void noCommandAndHelp() {
        Outcome o = run();
        assertEquals(2, o.code());
        assertTrue(o.err().contains("choose a command"), o.err());
        Outcome help = run("run", "--help");
        assertEquals(0, help.code());
        assertTrue(help.out().contains("--coherence"));
    }
}
