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
 * A real process is stopped with SIGTERM while it runs, exits 130 with partial results and a
 * checkpoint, and `--resume` then ends with a results.csv byte-identical to an uninterrupted run.
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

    @Test
    void sigtermThenResumeGivesTheSameBytes() throws Exception {
        Path straight = tmp.resolve("straight");
        assertEquals(0, CliTest.run(args(straight).toArray(new String[0])).code());

        Path cut = tmp.resolve("cut");
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), FadebenchCli.class.getName()));
        cmd.addAll(args(cut));
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true)
                .redirectOutput(tmp.resolve("cut.log").toFile()).start();
        Path checkpoint = cut.resolve("checkpoint.json");
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(30);
        while (!Files.exists(checkpoint) && p.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
        }
        boolean interrupted = p.isAlive();
        p.destroy(); // SIGTERM on Unix
        assertTrue(p.waitFor(30, TimeUnit.SECONDS), "the process stops");
        String log = Files.readString(tmp.resolve("cut.log"));
        // the sweep runs for seconds and the checkpoint appears within a quarter of a second of its
        // start, so the signal arrives while it runs
        assertTrue(interrupted, "the process was still running when the checkpoint appeared");
        assertEquals(130, p.exitValue(), log);
        assertTrue(log.contains("--resume"), log);
        assertTrue(Files.exists(checkpoint), "checkpoint kept for --resume");
        assertTrue(Files.readString(cut.resolve("results.csv")).contains("# interrupted"));
        CliTest.Outcome resumed = CliTest.run(args(cut, "--resume").toArray(new String[0]));
        assertEquals(0, resumed.code(), resumed.err());
        assertEquals(Files.readString(straight.resolve("results.csv")), Files.readString(cut.resolve("results.csv")));
        assertTrue(!Files.exists(checkpoint), "checkpoint removed once the sweep is complete");
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
