package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.compress.archivers.tar.TarArchiveEntry;
import org.apache.commons.compress.archivers.tar.TarArchiveInputStream;
import org.apache.commons.compress.compressors.CompressorStreamFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ScenarioCliTest {

    @TempDir
    Path tmp;

    private Path scenario(String text) throws IOException {
        return Files.writeString(tmp.resolve("s.yaml"), text);
    }

    private static final String SMALL = String.join("\n",
            "link:",
            "  code: alamouti",
            "  rx: 2",
            "  frame_bits: 128",
            "sweep:",
            "  snr_db: [2, 6]",
            "  min_errors: 20",
            "  seed: 3",
            "");

    @Test
    void scenarioRunsAndCommandLineOverrides() throws IOException {
        Path s = scenario(SMALL);
        Path a = tmp.resolve("a");
        CliTest.Outcome o = CliTest.run("run", s.toString(), "--out", a.toString(), "--rx", "1");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("alamouti 2x1"), "--rx 1 overrides rx: 2 — " + o.out());
        String csv = Files.readString(a.resolve("results.csv"));
        assertTrue(csv.contains("\n2,") && csv.contains("\n6,"), csv);
        String kept = Files.readString(a.resolve("scenario.yaml"));
        assertTrue(kept.contains("  rx: 1\n") && kept.contains("  code: \"alamouti\"") && kept.contains("seed: 3"),
                "the effective settings, command-line override included, are kept with the results: " + kept);
    }

    /** The effective scenario written by a plain run reproduces the run. */
    @Test
    void writtenScenarioReproducesTheRun() throws IOException {
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        assertEquals(0, CliTest.run("run", "--code", "alamouti", "--snr", "3,7", "--min-errors", "20",
                "--seed", "9", "--out", a.toString()).code());
        CliTest.Outcome o = CliTest.run("run", a.resolve("scenario.yaml").toString(), "--out", b.toString());
        assertEquals(0, o.code(), o.err());
        assertEquals(Files.readString(a.resolve("results.csv")), Files.readString(b.resolve("results.csv")));
    }

    /**
     * A run with a space-time code of the user's ({@code --code-file}) writes a scenario that runs
     * again: the file's code, not the catalogue's default {@code code: none} beside it (which the
     * run would refuse as two codes), the same results and the same scenario.
     */
    @Test
    void writtenScenarioOfACodeFileRepeatsTheRun() throws IOException {
        Path codeFile = Path.of("scenarios", "example-code.yaml").toAbsolutePath();
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        CliTest.Outcome o = CliTest.run("run", "--code-file", codeFile.toString(), "--rx", "2", "--snr", "4,8",
                "--min-errors", "20", "--seed", "4", "--out", a.toString());
        assertEquals(0, o.code(), o.err());
        String scenario = Files.readString(a.resolve("scenario.yaml"));
        assertTrue(scenario.contains("  code_file: \"" + codeFile + "\"\n") && scenario.contains("  # code:"), scenario);
        o = CliTest.run("run", a.resolve("scenario.yaml").toString(), "--out", b.toString());
        assertEquals(0, o.code(), o.err());
        assertEquals(Files.readString(a.resolve("results.csv")), Files.readString(b.resolve("results.csv")));
        String again = Files.readString(b.resolve("scenario.yaml")).replace(b.toString(), a.toString());
        assertEquals(scenario.substring(scenario.indexOf('\n')), again.substring(again.indexOf('\n')));
    }

    /** Running a written scenario as it is writes the same scenario again, byte for byte. */
    @Test
    void writtenScenarioIsAFixedPoint() throws IOException {
        Path a = tmp.resolve("a");
        assertEquals(0, CliTest.run("run", "--code", "alamouti", "--snr", "4", "--min-errors", "5", "--seed", "2",
                "--fec", "conv-r12", "--out", a.toString()).code());
        String first = Files.readString(a.resolve("scenario.yaml"));
        Path copy = Files.writeString(tmp.resolve("again.yaml"), first);
        CliTest.Outcome o = CliTest.run("run", copy.toString());
        assertEquals(0, o.code(), o.err());
        String second = Files.readString(a.resolve("scenario.yaml"));
        assertEquals(first.substring(first.indexOf('\n')), second.substring(second.indexOf('\n')),
                "the same settings, every one listed");
        for (org.fadebench.bench.settings.Setting k : org.fadebench.bench.settings.RunSettings.all()) {
            assertTrue(first.contains("  " + k.name() + ":") || first.contains("  # " + k.name() + ":"),
                    "every setting is in the file: " + k.path());
        }
    }

    /** Every option of the settings table is an option of run, with its help. */
    @Test
    void runHelpListsEverySetting() {
        CliTest.Outcome o = CliTest.run("run", "--help");
        assertEquals(0, o.code());
        for (org.fadebench.bench.settings.Setting k : org.fadebench.bench.settings.RunSettings.all()) {
            if (k.hasOption()) {
                assertTrue(o.out().contains(k.option()), k.option() + " in run --help");
            }
        }
    }

    @Test
    void outOfRangeValueNamesFileLineAndKey() throws IOException {
        Path s = scenario("link:\n  code: alamouti\n  rx: 0\n");
        CliTest.Outcome o = CliTest.run("run", s.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertEquals("fadebench run: " + s + " line 3, key link.rx: --rx must be a positive number of receive "
                + "antennas, got 0", o.err().trim());
        assertFalse(Files.exists(tmp.resolve("x")));
    }

    @Test
    void unknownCodeInScenarioNamesFileLineAndKey() throws IOException {
        Path s = scenario("link:\n  code: g9\n");
        CliTest.Outcome o = CliTest.run("run", s.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().startsWith("fadebench run: " + s + " line 2, key link.code: --code: unknown space-time code"),
                o.err());
    }

    @Test
    void unknownKeySuggestsClosest() throws IOException {
        Path s = scenario("sweep:\n  max_frame: 10\n");
        CliTest.Outcome o = CliTest.run("run", s.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("line 2: unknown key 'sweep.max_frame' (did you mean 'max_frames'?)"), o.err());
        assertFalse(o.err().trim().contains("\n"));
    }

    @Test
    void wholeNumberTooLargeForItsOption() throws IOException {
        Path s = scenario("link:\n  rx: 99999999999\n");
        CliTest.Outcome o = CliTest.run("run", s.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("line 2, key link.rx: --rx expected a whole number up to 2147483647, got 99999999999"),
                o.err());
    }

    @Test
    void missingScenarioFile() {
        CliTest.Outcome o = CliTest.run("run", tmp.resolve("none.yaml").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("none.yaml: no such scenario file"), o.err());
    }

    /** --archive bundles CSV, JSON, plot, scenario and report; both compressions read back with Commons Compress. */
    @Test
    void archives() throws Exception {
        for (String name : new String[] {"run.tar.xz", "run.tar.gz"}) {
            Path archive = tmp.resolve(name);
            CliTest.Outcome o = CliTest.run("run", "--snr", "5", "--min-errors", "10", "--out",
                    tmp.resolve("o-" + name).toString(), "--archive", archive.toString(), "--quiet");
            assertEquals(0, o.code(), o.err());
            assertEquals("", o.out(), "--quiet prints nothing");
            List<String> entries = new ArrayList<>();
            try (InputStream raw = Files.newInputStream(archive);
                 InputStream in = new CompressorStreamFactory().createCompressorInputStream(
                         new java.io.BufferedInputStream(raw));
                 TarArchiveInputStream tar = new TarArchiveInputStream(in)) {
                TarArchiveEntry e;
                while ((e = tar.getNextEntry()) != null) {
                    entries.add(e.getName());
                }
            }
            assertEquals(List.of("results.csv", "results.json", "fer.png", "fer.svg", "scenario.yaml", "report.html"),
                    entries);
        }
        CliTest.Outcome bad = CliTest.run("run", "--archive", tmp.resolve("r.zip").toString(), "--out",
                tmp.resolve("z").toString());
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("valid endings: .tar.xz, .txz, .tar.gz, .tgz"), bad.err());
        assertFalse(Files.exists(tmp.resolve("z")));
    }

    /** An archive that cannot be written is an I/O failure (exit 3) and leaves no temporary file. */
    @Test
    void ioFailureLeavesNoPartialFiles() throws IOException {
        Path blocker = Files.writeString(tmp.resolve("blocker"), "a file, not a folder");
        Path out = tmp.resolve("o");
        CliTest.Outcome o = CliTest.run("run", "--snr", "5", "--min-errors", "10", "--out", out.toString(),
                "--archive", blocker.resolve("r.tar.gz").toString(), "--quiet");
        assertEquals(3, o.code(), o.err());
        assertTrue(o.err().startsWith("fadebench run: I/O failure:"), o.err());
        try (var s = Files.list(out)) {
            assertTrue(s.noneMatch(p -> p.getFileName().toString().endsWith(".tmp")));
        }
    }

    /**
     * Full correlation matrices come from the scenario file and are checked (Hermitian, unit
     * diagonal, positive semidefinite); an error names the file, line and key.
     */
    @Test
    void correlationMatricesFromScenario() throws IOException {
        Path ok = scenario(String.join("\n", "link:", "  code: alamouti", "  rx: 2", "  rx_corr_matrix:",
                "    - [1, [0.5, 0.3]]", "    - [[0.5, -0.3], 1]", "sweep:", "  snr_db: [10]", "  min_errors: 10", ""));
        CliTest.Outcome o = CliTest.run("run", ok.toString(), "--out", tmp.resolve("ok").toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertTrue(Files.readString(tmp.resolve("ok/results.csv")).contains("correlation matrices"));
        Path notHermitian = scenario(String.join("\n", "link:", "  rx: 2", "  rx_corr_matrix:", "    - [1, 0.5]",
                "    - [0.4, 1]", ""));
        o = CliTest.run("run", notHermitian.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("key link.rx_corr_matrix: rx correlation matrix must be Hermitian"), o.err());
        Path notPsd = scenario(String.join("\n", "link:", "  rx: 2", "  rx_corr_matrix:", "    - [1, 1.5]",
                "    - [1.5, 1]", ""));
        o = CliTest.run("run", notPsd.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("must be positive semidefinite"), o.err());
        Path ragged = scenario(String.join("\n", "link:", "  rx: 2", "  rx_corr_matrix:", "    - [1, 0]",
                "    - [0]", ""));
        o = CliTest.run("run", ragged.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("line 5, key link.rx_corr_matrix: row 2 must hold 2 entries"), o.err());
        assertTrue(!Files.exists(tmp.resolve("x")));
    }
}
