package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.fadebench.bench.link.LdpcTestCode;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code run --fec-file}: an LDPC code of the user's from a Matrix Market file through the command
 * line, its decoder options, the iterations column, info_bits_per_second, the written scenario
 * repeating the run, and bad input refused in one line with exit 2 and nothing written.
 */
class LdpcCliTest {

    @TempDir
    Path tmp;

    private Path mtx;

    @BeforeEach
    void writeCode() throws IOException {
        mtx = Files.writeString(tmp.resolve("code.mtx"), LdpcTestCode.matrixMarket());
    }

    private CliTest.Outcome run(Path out, String... more) {
        List<String> args = new java.util.ArrayList<>(List.of("run", "--fec-file", mtx.toString(), "--mod", "bpsk",
                "--fading", "none", "--snr", "0,2", "--min-errors", "0", "--max-frames", "300", "--seed", "4",
                "--quiet", "--out", out.toString()));
        args.addAll(List.of(more));
        return CliTest.run(args.toArray(new String[0]));
    }

    private static List<String[]> rows(Path dir) throws IOException {
        return Files.readAllLines(dir.resolve("results.csv")).stream().filter(l -> !l.startsWith("#"))
                .map(l -> l.split(",", -1)).toList();
    }

    /**
     * Without --frame-bits the payload is the code's k less the CRC (96 − 16); the mean iterations
     * lie from 1 to the limit; results.json holds the decoding used and the information bits per
     * second, which are the symbols per second times 80 payload bits per 192 BPSK symbols.
     */
    @Test
    void userCodeRunsWithItsDecoderAndIterations() throws IOException {
        Path out = tmp.resolve("a");
        CliTest.Outcome o = run(out, "--crc", "crc16", "--fec-decoder", "offset-min-sum", "--fec-iterations", "20");
        assertEquals(0, o.code(), o.err());
        List<String[]> rows = rows(out);
        int column = List.of(rows.get(0)).indexOf("fec_iterations_mean");
        assertEquals(List.of(rows.get(0)).indexOf("undetected_errors") + 1, column, "after the CRC counts");
        for (String[] row : rows.subList(1, rows.size())) {
            double mean = Double.parseDouble(row[column]);
            assertTrue(mean >= 1 && mean <= 20, "mean iterations " + mean);
        }
        JsonNode json = new ObjectMapper().readTree(out.resolve("results.json").toFile());
        assertEquals(80, json.path("settings").path("frame_bits").asInt());
        assertEquals("offset-min-sum", json.path("settings").path("fec_decoder").asText());
        assertEquals(20, json.path("settings").path("fec_iterations").asInt());
        assertEquals(0.5, json.path("settings").path("fec_correction").asDouble(), 0.0);
        double symbols = json.path("symbols_per_second").asDouble();
        assertEquals(symbols * 80 / 192, json.path("info_bits_per_second").asDouble(), 1e-9 * symbols);
        JsonNode point = json.path("points").get(0);
        assertEquals(point.path("fec_iterations_sum").asDouble() / point.path("frames").asDouble(),
                point.path("fec_iterations_mean").asDouble(), 1e-12);
    }

    /** The written scenario repeats the run: the same results.csv, and the same scenario again. */
    @Test
    void writtenScenarioRepeatsTheRun() throws IOException {
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        assertEquals(0, run(a, "--fec-decoder", "sum-product", "--fec-full-iterations", "--fec-iterations", "8")
                .code());
        String scenario = Files.readString(a.resolve("scenario.yaml"));
        assertTrue(scenario.contains("  fec_file: \"" + mtx.toAbsolutePath() + "\"\n")
                && scenario.contains("  fec_decoder: \"sum-product\"\n") && scenario.contains("  fec_full_iterations: true\n"),
                scenario);
        CliTest.Outcome o = CliTest.run("run", a.resolve("scenario.yaml").toString(), "--out", b.toString());
        assertEquals(0, o.code(), o.err());
        assertEquals(Files.readString(a.resolve("results.csv")), Files.readString(b.resolve("results.csv")));
        assertEquals(scenario.substring(scenario.indexOf('\n')), Files.readString(b.resolve("scenario.yaml"))
                .substring(scenario.indexOf('\n')).replace(b.toString(), a.toString()));
        List<String[]> rows = rows(a);
        int column = List.of(rows.get(0)).indexOf("fec_iterations_mean");
        for (String[] row : rows.subList(1, rows.size())) {
            assertEquals("8", row[column], "every frame takes all 8 iterations");
        }
    }

    @Test
    void badInputIsRefusedInOneLine() throws IOException {
        Path out = tmp.resolve("never");
        HostileInputCliTest.assertRefused(run(out, "--frame-bits", "100"), "--frame-bits 100: channel code code.mtx "
                + "carries exactly 96 information bits per frame (payload and CRC); valid: --frame-bits 96", out);
        HostileInputCliTest.assertRefused(run(out, "--crc", "crc24", "--frame-bits", "96"),
                "valid: --frame-bits 72 with crc24", out);
        HostileInputCliTest.assertRefused(run(out, "--fec", "conv-r12"),
                "--fec-file " + mtx.toAbsolutePath() + ": give either --fec or --fec-file, not both", out);
        HostileInputCliTest.assertRefused(run(out, "--fec-decoder", "belief"),
                "--fec-decoder: unknown LDPC decoder 'belief'; valid: min-sum, offset-min-sum, sum-product", out);
        HostileInputCliTest.assertRefused(run(out, "--fec-iterations", "0"), "--fec-iterations 0; valid: 1 to 1000",
                out);
        HostileInputCliTest.assertRefused(run(out, "--fec-correction", "1.5"),
                "--fec-correction 1.5 for min-sum; valid: a normalisation factor above 0, at most 1", out);
        HostileInputCliTest.assertRefused(run(out, "--fec-decoder", "sum-product", "--fec-correction", "0.5"),
                "--fec-correction goes with min-sum or offset-min-sum; sum-product takes none", out);
        for (String option : List.of("--fec-decoder", "--fec-iterations", "--fec-correction")) {
            String value = option.equals("--fec-decoder") ? "min-sum" : "1";
            HostileInputCliTest.assertRefused(CliTest.run("run", "--fec", "conv-r12", option, value, "--out",
                    out.toString()), option + " goes with an LDPC code", out);
        }
        HostileInputCliTest.assertRefused(CliTest.run("run", "--fec-full-iterations", "--out", out.toString()),
                "--fec-full-iterations goes with an LDPC code (--fec-file, or an ldpc code of --fec); --fec none has "
                        + "no such decoder", out);
        Path text = Files.writeString(tmp.resolve("code.txt"), "not a code");
        HostileInputCliTest.assertRefused(CliTest.run("run", "--fec-file", text.toString(), "--out", out.toString()),
                "--fec-file: parity-check file " + text.toAbsolutePath() + ": unknown extension; valid: .mtx, .yaml, "
                        + ".yml", out);
        Path broken = Files.writeString(tmp.resolve("broken.mtx"), "%%MatrixMarket matrix coordinate real general\n");
        HostileInputCliTest.assertRefused(CliTest.run("run", "--fec-file", broken.toString(), "--out", out.toString()),
                "--fec-file: parity-check file " + broken.toAbsolutePath() + " line 1: field 'real'", out);
        Path full = Files.writeString(tmp.resolve("full.mtx"),
                "%%MatrixMarket matrix coordinate pattern general\n2 2 2\n1 1\n2 2\n");
        HostileInputCliTest.assertRefused(CliTest.run("run", "--fec-file", full.toString(), "--out", out.toString()),
                "--fec-file: parity-check file " + full.toAbsolutePath() + ": rank 2 over GF(2) equals its 2 columns", out);
    }
}
