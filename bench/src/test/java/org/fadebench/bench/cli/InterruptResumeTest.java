package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A real process is stopped with SIGTERM while it runs, exits 143 (128 + SIGTERM) with partial
 * results and a checkpoint, and `--resume` then ends with a results.csv byte-identical to an
 * uninterrupted run. The same holds while the outage bounds are computed after the sweep.
 */
class InterruptResumeTest {

    @TempDir
    Path tmp;

    private static final String[] SWEEP = {"run", "--code", "alamouti", "--mod", "16qam", "--snr", "0..18/3",
        "--frame-bits", "256", "--min-errors", "60000", "--seed", "21", "--threads", "1"};

    private static List<String> args(Path out, String... extra) {
        List<String> a = new ArrayList<>(List.of(SWEEP));
        a.add("--out");
        a.add(out.toString());
        a.addAll(List.of(extra));
        return a;
    }

    /**
     * Runs {@code fadebench ARGS} in a new process (output to {@code log}) and sends it SIGTERM as
     * soon as {@code file} appears; returns the stopped process. Asserts that it was still running
     * then: the sweeps of the callers run for seconds and their checkpoints appear within a quarter
     * of a second of the sweep's start, so the signal arrives while it runs.
     */
    static Process terminatedOnceWritten(List<String> args, Path file, Path log) throws Exception {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), FadebenchCli.class.getName()));
        cmd.addAll(args);
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile()).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
        while (!Files.exists(file) && p.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
        }
        boolean running = p.isAlive();
        p.destroy(); // SIGTERM on Unix
        assertTrue(p.waitFor(30, TimeUnit.SECONDS), "the process stops");
        assertTrue(running, "the process was still running when " + file + " appeared: " + Files.readString(log));
        return p;
    }

    @Test
    void sigtermThenResumeGivesTheSameBytes() throws Exception {
        Path straight = tmp.resolve("straight");
        assertEquals(0, CliTest.run(args(straight).toArray(new String[0])).code());

        Path cut = tmp.resolve("cut");
        Path checkpoint = cut.resolve("checkpoint.json");
        Process p = terminatedOnceWritten(args(cut), checkpoint, tmp.resolve("cut.log"));
        String log = Files.readString(tmp.resolve("cut.log"));
        assertEquals(143, p.exitValue(), "128 + SIGTERM: " + log);
        assertTrue(log.contains("--resume"), log);
        assertTrue(Files.exists(checkpoint), "checkpoint kept for --resume");
        assertTrue(Files.readString(cut.resolve("results.csv")).contains("# interrupted"));
        CliTest.Outcome resumed = CliTest.run(args(cut, "--resume").toArray(new String[0]));
        assertEquals(0, resumed.code(), resumed.err());
        assertEquals(Files.readString(straight.resolve("results.csv")), Files.readString(cut.resolve("results.csv")));
        assertTrue(!Files.exists(checkpoint), "checkpoint removed once the sweep is complete");
    }

    /**
     * A signal while the Monte Carlo bounds are computed (here 10^8 draws per point, tens of
     * seconds) ends the process within seconds, exit 143, with the finished sweep in the
     * checkpoint; --resume (with a smaller effort, which is no part of the checkpoint) writes the
     * results with their bounds and the same counts.
     */
    @Test
    void sigtermWhileTheBoundsAreComputed() throws Exception {
        Path dir = tmp.resolve("bounds");
        List<String> link = List.of("run", "--code", "alamouti", "--rx", "2", "--snr", "0", "--max-frames", "64",
                "--min-errors", "0", "--seed", "3", "--threads", "1", "--out", dir.toString());
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), FadebenchCli.class.getName()));
        cmd.addAll(link);
        cmd.addAll(List.of("--outage-draws", "100000000"));
        Path logFile = tmp.resolve("bounds.log");
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(logFile.toFile()).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(30);
        // the sweep's one row is printed when it is done; the bounds come next
        java.util.regex.Pattern row = java.util.regex.Pattern.compile("(?m)^\\s+0\\s+\\S+\\s+64\\s");
        while (!row.matcher(Files.readString(logFile)).find() && p.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
        }
        Thread.sleep(300);
        assertTrue(p.isAlive(), "still computing the bounds: " + Files.readString(logFile));
        long sent = System.nanoTime();
        p.destroy(); // SIGTERM on Unix
        assertTrue(p.waitFor(10, TimeUnit.SECONDS), "the process stops promptly");
        double seconds = (System.nanoTime() - sent) * 1e-9;
        String log = Files.readString(logFile);
        assertEquals(143, p.exitValue(), log);
        assertTrue(log.contains("interrupted while computing the outage bounds"), log);
        assertTrue(Files.exists(dir.resolve("checkpoint.json")), "checkpoint kept for --resume");
        assertTrue(seconds < 10, seconds + " s");

        List<String> resume = new ArrayList<>(link);
        resume.addAll(List.of("--resume", "--outage-draws", "1000"));
        CliTest.Outcome o = CliTest.run(resume.toArray(new String[0]));
        assertEquals(0, o.code(), o.err());
        String csv = Files.readString(dir.resolve("results.csv"));
        assertTrue(csv.contains("\n0,64,"), csv);
        assertTrue(!Files.exists(dir.resolve("checkpoint.json")), "checkpoint removed once complete");
    }

    @Test
    void resumeWithOtherSettingsIsRefused() throws Exception {
        Path dir = tmp.resolve("d");
        Files.createDirectories(dir);
        org.fadebench.bench.report.Checkpoint.write(dir, "not-this-run", List.of());
        CliTest.Outcome o = CliTest.run(args(dir, "--resume").toArray(new String[0]));
        assertEquals(2, o.code());
        assertTrue(o.err().contains("written for different settings"), o.err());
        Files.writeString(dir.resolve("checkpoint.json"), "{not json");
        o = CliTest.run(args(dir, "--resume").toArray(new String[0]));
        assertEquals(2, o.code());
        assertTrue(o.err().contains("damaged checkpoint"), o.err());
        assertTrue(!new File(dir.toFile(), "results.csv").exists(), "nothing written");
    }
}
