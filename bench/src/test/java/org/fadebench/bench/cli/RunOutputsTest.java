package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.fadebench.bench.report.Checkpoint;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.sweep.PointState;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.bench.sweep.SweepOutcome;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/** What a run does with its output files: nothing lost, nothing written where it cannot be, nothing hidden. */
class RunOutputsTest {

    @TempDir
    Path tmp;

    private static final String[] SMALL = {"run", "--code", "alamouti", "--snr", "0,6", "--frame-bits", "128",
        "--min-errors", "20", "--seed", "4", "--threads", "2", "--quiet"};

    private static String[] small(String... extra) {
        List<String> a = new ArrayList<>(Arrays.asList(SMALL));
        a.addAll(Arrays.asList(extra));
        return a.toArray(new String[0]);
    }

    private static void assertRefused(CliTest.Outcome o, String expected) {
        assertEquals(2, o.code(), o.err());
        String err = o.err().trim();
        assertTrue(err.startsWith("fadebench run: ") && !err.contains("\n") && err.contains(expected), err);
    }

    /** A one-block-per-line CSV trace of 1 x 2 channels (invented numbers). */
    private Path trace() throws IOException {
        return Files.writeString(tmp.resolve("t.csv"), "# fadebench channel trace\n1,2\n1,0,0.5,0.5\n0.2,-1,1,0.3\n");
    }

    /** --trace-out (or any output) that is an input or another output is refused before anything runs. */
    @Test
    void outputThatIsAnInputOrAnotherOutputIsRefused() throws IOException {
        Path d = tmp.resolve("d");
        assertEquals(0, CliTest.run(small("--out", d.toString())).code());
        String csv = Files.readString(d.resolve("results.csv"));
        for (Path same : new Path[] {d.resolve("results.csv"), d.resolve("../d/./results.csv")}) {
            CliTest.Outcome o = CliTest.run(small("--out", d.toString(), "--overwrite", "--trace-out", same.toString()));
            assertRefused(o, "--trace-out " + same + " is the same file as --out " + d + " (its results.csv)");
        }
        assertEquals(csv, Files.readString(d.resolve("results.csv")), "results.csv untouched");

        Path t = trace();
        String traceText = Files.readString(t);
        CliTest.Outcome o = CliTest.run(small("--out", tmp.resolve("e").toString(), "--trace", t.toString(),
                "--trace-out", tmp.resolve("x/../t.csv").toString()));
        assertRefused(o, "is the same file as --trace " + t + " (read by this run)");
        assertEquals(traceText, Files.readString(t), "the trace read is untouched");
        assertFalse(Files.exists(tmp.resolve("e")), "nothing written");

        // the scenario file read is an output of the folder
        Path f = Files.createDirectories(tmp.resolve("f"));
        Path s = Files.writeString(f.resolve("results.json"), "sweep:\n  snr_db: [3]\n");
        o = CliTest.run("run", s.toString(), "--out", f.toString(), "--overwrite");
        assertRefused(o, "(its results.json) is the same file as the scenario file " + s);
        assertEquals("sweep:\n  snr_db: [3]\n", Files.readString(s));
    }

    /** Another run's folder is kept unless --overwrite; the same run may be repeated; a checkpoint points to --resume. */
    @Test
    void folderOfAnotherRunIsKeptUnlessOverwrite() throws IOException {
        Path d = tmp.resolve("d");
        assertEquals(0, CliTest.run(small("--out", d.toString())).code());
        String first = Files.readString(d.resolve("results.csv"));
        assertEquals(0, CliTest.run(small("--out", d.toString())).code(), "the same run again in its own folder");
        assertEquals(first, Files.readString(d.resolve("results.csv")));

        CliTest.Outcome o = CliTest.run(small("--out", d.toString(), "--rx", "2"));
        assertRefused(o, "--out " + d + " already holds the results of another run (results.csv, results.json, "
                + "fer.png, fer.svg, report.html, scenario.yaml): give another --out, or --overwrite to replace them");
        assertEquals(first, Files.readString(d.resolve("results.csv")), "nothing overwritten");

        o = CliTest.run(small("--out", d.toString(), "--rx", "2", "--overwrite"));
        assertEquals(0, o.code(), o.err());
        assertNotEquals(first, Files.readString(d.resolve("results.csv")));

        Files.writeString(d.resolve(Checkpoint.FILE_NAME), "{}");
        o = CliTest.run(small("--out", d.toString(), "--rx", "2"));
        assertRefused(o, "holds the checkpoint of an interrupted run: continue it with --resume, or give --overwrite");
        assertTrue(Files.exists(d.resolve(Checkpoint.FILE_NAME)), "checkpoint kept");
    }

    /** The demo replaces its own earlier output, so its command can be run again and again. */
    @Test
    void demoReplacesItsOwnOutput() throws IOException {
        Path demo = tmp.resolve("demo");
        Path earlier = Files.createDirectories(demo.resolve("mrc-1x2"));
        Files.writeString(earlier.resolve("results.csv"), "an earlier demo's results\n");
        CliTest.Outcome o = CliTest.run("demo", "--out", demo.toString(), "--threads", "2");
        assertEquals(0, o.code(), o.err());
        assertTrue(Files.readString(earlier.resolve("results.csv")).startsWith("#"));
    }

    /** A checkpoint edited by hand, or whose counts do not add up, is refused; a genuine one resumes. */
    @Test
    void editedCheckpointIsRefused() throws IOException {
        String[] args = {"run", "--code", "alamouti", "--snr", "0,8,16", "--frame-bits", "128", "--min-errors", "200",
            "--seed", "4", "--threads", "1", "--quiet"};
        Path straight = tmp.resolve("straight");
        assertEquals(0, CliTest.run(with(args, "--out", straight.toString())).code());

        Path d = tmp.resolve("d");
        CommandLine cl = new CommandLine(new RunCommand());
        cl.parseArgs(with(args, "--out", d.toString()));
        RunPlan plan = RunCommand.plan(SettingOptions.given(cl.getParseResult(), RunSettings.all(), Map.of()), null);
        SweepEngine engine = new SweepEngine(plan.link(), plan.rules(), plan.seed(), 1, plan.confidence());
        SweepOutcome cut = engine.run(plan.snrDb(), r -> engine.requestStop());
        assertTrue(cut.interrupted());
        String fingerprint = Checkpoint.fingerprint(plan.numbersFingerprintText(engine.batchFrames()));
        List<PointState> states = cut.states();
        int open = 0;
        while (states.get(open).done()) {
            open++;
        }
        assertTrue(open < states.size(), "an unfinished point");
        Files.createDirectories(d);
        Path file = d.resolve(Checkpoint.FILE_NAME);

        // marked done by hand in the file: the checksum no longer matches
        Checkpoint.write(d, fingerprint, states);
        String text = Files.readString(file);
        int at = nth(text, "\"done\" : false", 0);
        Files.writeString(file, text.substring(0, at) + "\"done\" : true" + text.substring(at + 14));
        assertRefused(CliTest.run(with(args, "--out", d.toString(), "--resume")),
                "damaged or edited checkpoint (its checksum does not match its content)");

        // the same with a fresh checksum: the stop rule does not hold
        List<PointState> edited = new ArrayList<>(states);
        PointState s = states.get(open);
        edited.set(open, new PointState(s.mergedBatches(), s.counts(), true));
        Checkpoint.write(d, fingerprint, edited);
        assertRefused(CliTest.run(with(args, "--out", d.toString(), "--resume")),
                "damaged or edited checkpoint (point " + (open + 1) + ": marked done before its stop rule holds)");

        // counts that no batch could give
        PointState f = states.get(0);
        edited = new ArrayList<>(states);
        var more = f.counts().copy();
        more.addFrame(128, 0, 64, 0);
        edited.set(0, new PointState(f.mergedBatches(), more, f.done()));
        Checkpoint.write(d, fingerprint, edited);
        assertRefused(CliTest.run(with(args, "--out", d.toString(), "--resume")), "point 1: ");

        // the genuine checkpoint resumes to the uninterrupted results
        Checkpoint.write(d, fingerprint, states);
        CliTest.Outcome o = CliTest.run(with(args, "--out", d.toString(), "--resume"));
        assertEquals(0, o.code(), o.err());
        assertEquals(Files.readString(straight.resolve("results.csv")), Files.readString(d.resolve("results.csv")));
    }

    private static int nth(String text, String what, int n) {
        int at = -1;
        for (int i = 0; i <= n; i++) {
            at = text.indexOf(what, at + 1);
        }
        assertTrue(at >= 0, what);
        return at;
    }

    private static String[] with(String[] args, String... extra) {
        List<String> a = new ArrayList<>(Arrays.asList(args));
        a.addAll(Arrays.asList(extra));
        return a.toArray(new String[0]);
    }

    /** Destinations are checked before the sweep; --out= is refused; no Java exception text is shown. */
    @Test
    void destinationsAreCheckedBeforeTheSweep() throws IOException {
        assertRefused(CliTest.run(small("--out=")), "--out needs a file or folder name, got nothing");
        for (String command : new String[] {"demo", "bounds"}) {
            CliTest.Outcome o = CliTest.run(command, "--out=");
            assertEquals(2, o.code(), o.err());
            assertEquals("fadebench " + command + ": --out needs a file or folder name, got nothing", o.err().trim());
        }
        Path blocker = Files.writeString(tmp.resolve("blocker"), "a file, not a folder");
        String[][] cases = {
            {"--out", blocker.resolve("o").toString()},
            {"--out", tmp.resolve("o1").toString(), "--archive", blocker.resolve("r.tar.gz").toString()},
            {"--out", tmp.resolve("o2").toString(), "--trace-out", blocker.resolve("t.npy").toString()},
        };
        for (String[] c : cases) {
            CliTest.Outcome o = CliTest.run(with(small(), c));
            String err = o.err().trim();
            assertEquals(3, o.code(), err);
            assertTrue(err.startsWith("fadebench run: I/O failure: " + c[c.length - 2] + " " + c[c.length - 1]
                    + ": cannot write there (" + blocker + ": not a folder)"), err);
            assertFalse(err.contains("\n") || err.contains("java.") || err.contains("Exception"), err);
            assertEquals("", o.out());
        }
        // nothing simulated: the sweep would have written results
        assertFalse(Files.exists(tmp.resolve("o1/results.csv")) || Files.exists(tmp.resolve("o2/results.csv")));
    }

    /** Outputs get the permissions of any new file in their folder (the umask's), not owner-only ones. */
    @Test
    void outputsHaveTheUsualPermissions() throws IOException {
        Path d = tmp.resolve("d");
        Path traceOut = tmp.resolve("t").resolve("drawn.npy");
        Path archive = tmp.resolve("a").resolve("run.tgz");
        CliTest.Outcome o = CliTest.run(small("--out", d.toString(), "--trace-out", traceOut.toString(),
                "--archive", archive.toString()));
        assertEquals(0, o.code(), o.err());
        List<Path> outputs = new ArrayList<>(List.of(traceOut, archive));
        try (Stream<Path> s = Files.list(d)) {
            s.forEach(outputs::add);
        }
        assertEquals(8, outputs.size());
        for (Path p : outputs) {
            Path plain = Files.createFile(p.resolveSibling("plain-" + p.getFileName()));
            assertEquals(PosixFilePermissions.toString(Files.getPosixFilePermissions(plain)),
                    PosixFilePermissions.toString(Files.getPosixFilePermissions(p)), p.toString());
            Files.delete(plain);
        }
    }

    /**
     * scenario.yaml holds every key (defaults included, paths resolved), and running it repeats the
     * run: the same results and the same scenario.yaml bytes.
     */
    @Test
    void writtenScenarioIsCompleteAndRepeatsItself() throws IOException {
        Path t = trace();
        Path relativeTrace = Path.of("").toAbsolutePath().relativize(t);
        Path d = tmp.resolve("d");
        CliTest.Outcome o = CliTest.run("run", "--code", "alamouti", "--snr", "2,8", "--frame-bits", "128",
                "--min-errors", "20", "--seed", "6", "--threads", "2", "--trace", relativeTrace.toString(),
                "--trace-out", tmp.resolve("drawn.csv").toString(), "--out", d.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        String yaml = Files.readString(d.resolve("scenario.yaml"));
        for (Setting k : RunSettings.all()) {
            assertTrue(yaml.contains("\n  " + k.name() + ":") || yaml.contains("\n  # " + k.name() + ":"), k.path());
        }
        assertTrue(yaml.contains("file and folder names are stored resolved (absolute)"), yaml);
        assertTrue(yaml.contains("  trace: \"" + t.toRealPath() + "\"\n"), yaml);
        assertTrue(yaml.contains("  folder: \"" + d.toRealPath() + "\"\n"), yaml);
        assertTrue(yaml.contains("  # decoder:") && yaml.contains("  max_frames: 1000000\n"), yaml);
        String csv = Files.readString(d.resolve("results.csv"));
        Files.delete(d.resolve("results.csv"));

        o = CliTest.run("run", d.resolve("scenario.yaml").toString());
        assertEquals(0, o.code(), o.err());
        assertEquals(csv, Files.readString(d.resolve("results.csv")));
        assertEquals(yaml, Files.readString(d.resolve("scenario.yaml")));
        assertNotNull(Files.readString(tmp.resolve("drawn.csv")));
    }

    /** Correlation matrices of a scenario file are kept in scenario.yaml and give the same run again. */
    @Test
    void correlationMatricesAreKept() throws IOException {
        Path s = Files.writeString(tmp.resolve("s.yaml"), String.join("\n", "link:", "  code: alamouti", "  rx: 2",
                "  rx_corr_matrix:", "    - [1, [0.5, 0.3]]", "    - [[0.5, -0.3], 1]", "sweep:", "  snr_db: [10]",
                "  min_errors: 10", ""));
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        assertEquals(0, CliTest.run("run", s.toString(), "--out", a.toString(), "--quiet").code());
        assertEquals(0, CliTest.run("run", a.resolve("scenario.yaml").toString(), "--out", b.toString()).code());
        assertTrue(Files.readString(a.resolve("scenario.yaml"))
                .contains("  rx_corr_matrix: [[[1.0, 0.0], [0.5, 0.3]], [[0.5, -0.3], [1.0, 0.0]]]\n"));
        assertEquals(Files.readString(a.resolve("results.csv")), Files.readString(b.resolve("results.csv")));
    }
}
