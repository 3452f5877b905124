package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Input files and options that used to give wrong numbers with exit 0, hang, or crash out of
 * memory: each is now refused in one line with exit 2 before anything is written, or handled.
 */
class HostileInputCliTest {

    @TempDir
    Path tmp;

    static void assertRefused(CliTest.Outcome o, String expected, Path out) {
        assertEquals(2, o.code(), o.err());
        String err = o.err().trim();
        assertFalse(err.contains("\n"), "one line: " + err);
        assertTrue(err.startsWith("fadebench run: "), err);
        assertTrue(err.contains(expected), err);
        assertFalse(Files.exists(out), "nothing written");
    }

    /**
     * Alamouti's code written with entries of 1e300 (energy 1e600, beyond a double) is scaled to
     * unit energy like the plain one: at 20 dB its frames mostly get through (before, the overflow
     * made the scale 0 and every frame failed).
     */
    @Test
    void codeFileWithHugeEntriesIsScaledNotSilenced() throws IOException {
        Path file = Files.writeString(tmp.resolve("big.yaml"), String.join("\n",
                "name: big-alamouti", "tx: 2", "slots: 2", "symbols:",
                "  - real: [[1e300, 0], [0, 1e300]]", "    imag: [[\"1e300j\", 0], [0, \"-1e300j\"]]",
                "  - real: [[0, 1e300], [-1e300, 0]]", "    imag: [[0, \"1e300j\"], [\"1e300j\", 0]]", ""));
        CliTest.Outcome listed = CliTest.run("codes", "--code-file", file.toString());
        assertEquals(0, listed.code(), listed.err());
        assertTrue(listed.out().contains("average energy per slot was 2.00000E+600"), listed.out());
        Path out = tmp.resolve("big");
        CliTest.Outcome o = CliTest.run("run", "--code-file", file.toString(), "--rx", "2", "--snr", "20",
                "--min-errors", "20", "--max-frames", "4000", "--seed", "3", "--quiet", "--out", out.toString());
        assertEquals(0, o.code(), o.err());
        List<String> rows = Files.readAllLines(out.resolve("results.csv")).stream().filter(l -> !l.startsWith("#"))
                .toList();
        double fer = Double.parseDouble(rows.get(1).split(",")[3]);
        assertTrue(fer < 0.5, "FER " + fer);
    }

    /** Trace entries beyond 1e50 would overflow the link's arithmetic (FER 1 or 0 with exit 0 before). */
    @Test
    void traceWithHugeEntriesIsRefused() throws IOException {
        Path trace = Files.writeString(tmp.resolve("huge.csv"), "# fadebench channel trace\n1,1\n1,0\n1e200,0\n");
        Path out = tmp.resolve("never");
        assertRefused(CliTest.run("run", "--trace", trace.toString(), "--out", out.toString()),
                "--trace " + trace + ": matrix 1, entry (0, 0) has a part of magnitude 1.0E200; a link takes entries"
                        + " whose real and imaginary parts are at most 1e50", out);
    }

    /** A pipe named as a trace or code file is refused at once instead of waiting for a writer forever. */
    @Test
    void pipesAreRefusedPromptly() throws Exception {
        Path fifo = tmp.resolve("pipe.npy");
        Assumptions.assumeTrue(new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor() == 0,
                "mkfifo is available");
        Path out = tmp.resolve("never");
        CliTest.Outcome trace = assertTimeoutPreemptively(Duration.ofSeconds(20),
                () -> CliTest.run("run", "--trace", fifo.toString(), "--out", out.toString()));
        assertRefused(trace, "--trace " + fifo + ": not a regular file (a pipe or a device?)", out);
        CliTest.Outcome code = assertTimeoutPreemptively(Duration.ofSeconds(20),
                () -> CliTest.run("run", "--code-file", fifo.toString(), "--out", out.toString()));
        assertRefused(code, "--code-file: code file " + fifo + ": not a regular file (a pipe or a device?)", out);
    }

    /**
     * 64 receive antennas and 2^24-bit frames need about 8.5 GiB of buffers per worker thread: with
     * 16 threads no heap of a usual machine holds that, and the run says so before allocating (it
     * used to die with an out-of-memory stack trace, exit 1).
     */
    @Test
    void linkTooLargeForTheHeapIsRefused() {
        Path out = tmp.resolve("never");
        assertRefused(CliTest.run("run", "--rx", "64", "--frame-bits", "16777216", "--threads", "16", "--out",
                out.toString()), "not enough memory: this run needs about", out);
    }

    @Test
    void folderGivenAsTheScenarioIsNamedAFolder() {
        Path out = tmp.resolve("never");
        assertRefused(CliTest.run("run", tmp.toString(), "--out", out.toString()),
                tmp + ": is a folder; give a scenario file (YAML)", out);
    }
}
