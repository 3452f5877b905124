package org.fadebench.bench.cli;

import static org.fadebench.bench.cli.HostileInputCliTest.assertRefused;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.fadebench.bench.report.ResultsCsv;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code --estimator fade-sampling} on the command line: its columns, and what it refuses. */
class FadeSamplingCliTest {

    @TempDir
    Path tmp;

    private static final String[] LINK = {"--code", "alamouti", "--rx", "2", "--frame-bits", "128", "--threads", "2",
        "--quiet"};

    private CliTest.Outcome run(Path out, String... more) {
        List<String> args = new ArrayList<>(List.of("run", "--out", out.toString(), "--fer-floor", "0"));
        args.addAll(List.of(LINK));
        args.addAll(List.of(more));
        return CliTest.run(args.toArray(String[]::new));
    }

    @Test
    void fadeSamplingRunsHaveTheirColumnsAndPlainRunsNone() throws IOException {
        Path weighted = tmp.resolve("weighted");
        CliTest.Outcome o = run(weighted, "--snr", "18", "--estimator", "fade-sampling", "--rel-precision", "0.3");
        assertEquals(0, o.code(), o.err());
        List<String> lines = Files.readAllLines(weighted.resolve("results.csv"));
        String header = lines.get(lines.size() - 2);
        assertTrue(header.endsWith("," + ResultsCsv.FADE_SAMPLING_COLUMNS), header);
        String[] row = lines.get(lines.size() - 1).split(",", -1);
        assertEquals("fade-sampling", row[row.length - 5]);
        assertTrue(Double.parseDouble(row[row.length - 3]) <= 0.3, "relative half-width " + row[row.length - 3]);
        assertTrue(Double.parseDouble(row[row.length - 2]) < 1, "fade scale " + row[row.length - 2]);
        assertTrue(Files.readString(weighted.resolve("results.json")).contains("\"fade_scale\""));
        // the header names the intervals each run has: normal from the weights, or Clopper-Pearson
        String weightedText = String.join("\n", lines);
        assertTrue(weightedText.contains("normal intervals from the weighted sample variance"), weightedText);
        assertFalse(weightedText.contains("Clopper-Pearson"), weightedText);

        Path plain = tmp.resolve("plain");
        assertEquals(0, run(plain, "--snr", "6", "--max-frames", "2000").code());
        List<String> plainLines = Files.readAllLines(plain.resolve("results.csv"));
        assertEquals(ResultsCsv.HEADER, plainLines.get(plainLines.size() - 2));
        assertFalse(String.join("\n", plainLines).contains("estimator"));
        assertTrue(String.join("\n", plainLines).contains("Clopper-Pearson interval over frames"));
    }

    /** A point cut at 10 frames cannot have 10 effective error frames: results.csv and results.json say so. */
    @Test
    void aPointWithTooFewEffectiveErrorsSaysSo() throws IOException {
        Path out = tmp.resolve("short");
        assertEquals(0, run(out, "--snr", "20", "--estimator", "fade-sampling", "--max-frames", "10").code());
        List<String> lines = Files.readAllLines(out.resolve("results.csv"));
        assertTrue(lines.get(lines.size() - 1).endsWith("," + ResultsCsv.UNTRUSTED), lines.get(lines.size() - 1));
        assertTrue(Files.readString(out.resolve("results.json")).contains("\"trusted\" : false"));
    }

    @Test
    void modelsWithoutAScaledLawAreRefused() throws IOException {
        Path out = tmp.resolve("x");
        assertRefused(run(out, "--snr", "10", "--estimator", "fade-sampling", "--fading", "rician", "--k-factor", "3"),
                "--estimator fade-sampling needs rayleigh (independent or correlated) or nakagami", out);
        assertRefused(run(out, "--snr", "10", "--estimator", "fade-sampling", "--doppler", "0.01"),
                "without --trace or --doppler", out);
        Path traced = tmp.resolve("traced");
        Path trace = tmp.resolve("h.npy");
        assertEquals(0, run(traced, "--snr", "10", "--max-frames", "100", "--trace-out", trace.toString()).code());
        assertRefused(run(out, "--snr", "10", "--estimator", "fade-sampling", "--trace", trace.toString()),
                "without --trace or --doppler", out);
    }

    @Test
    void badEstimatorAndPrecisionAreRefused() {
        Path out = tmp.resolve("x");
        assertRefused(run(out, "--snr", "10", "--estimator", "lucky"), "valid: plain, fade-sampling", out);
        for (String bad : new String[] {"0", "1", "1.5", "-0.2"}) {
            assertRefused(run(out, "--snr", "10", "--estimator", "fade-sampling", "--rel-precision", bad),
                    "--rel-precision must lie strictly between 0 and 1", out);
        }
    }
}
