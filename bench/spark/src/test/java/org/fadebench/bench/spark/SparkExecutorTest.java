package org.fadebench.bench.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.Stream;
import org.fadebench.bench.cli.FadebenchCli;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.report.ResultsCsv;
import org.fadebench.bench.sweep.BatchExecutor;
import org.fadebench.bench.sweep.BatchId;
import org.fadebench.bench.sweep.LocalThreadExecutor;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.PointState;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.bench.sweep.SweepOutcome;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The Spark executor in local mode gives the local thread pool's results byte for byte, however
 * the batches are cut into tasks and whatever tasks Spark retries; resumes from a checkpoint; and
 * refuses a master it cannot use, or workers of another fadebench, in one line before anything is
 * written. (Identity of results is what the executor promises: the ledger merges in batch order.)
 */
class SparkExecutorTest {

    @TempDir
    Path tmp;

    /** An uncoded Alamouti link and an LDPC-coded one with CRC, each a few seconds of sweep at most. */
    private static final List<String> UNCODED = List.of("run", "--code", "alamouti", "--rx", "2", "--mod", "16qam",
            "--snr", "0..12/4", "--frame-bits", "256", "--min-errors", "40", "--max-frames", "20000", "--seed", "5");
    private static final List<String> CODED = List.of("run", "--fec", "ldpc-r12", "--crc", "crc24", "--rx", "2",
            "--snr", "-2..4/2", "--frame-bits", "576", "--min-errors", "20", "--max-frames", "3000", "--seed", "9",
            "--outage-draws", "1000");
    /** Importance sampling: each worker searches a point's fade scale from pilot runs, which tasks share. */
    private static final List<String> FADE_SAMPLING = List.of("run", "--code", "alamouti", "--rx", "2", "--snr",
            "16,20", "--frame-bits", "128", "--estimator", "fade-sampling", "--rel-precision", "0.3", "--seed", "6",
            "--fer-floor", "0");

    record Outcome(int code, String out, String err) {
    }

    private static Outcome cli(List<String> args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = FadebenchCli.execute(args.toArray(new String[0]), new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Outcome(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    private static List<String> with(List<String> sweep, String... extra) {
        List<String> a = new ArrayList<>(sweep);
        a.addAll(List.of(extra));
        return a;
    }

    private byte[] resultsCsv(List<String> args, String folder) throws IOException {
        Path out = tmp.resolve(folder);
        Outcome o = cli(with(args, "--out", out.toString(), "--quiet"));
        assertEquals(0, o.code(), o.err());
        return Files.readAllBytes(out.resolve("results.csv"));
    }

    static Stream<Arguments> sweeps() {
        return Stream.of(Arguments.of("uncoded", UNCODED), Arguments.of("coded", CODED),
                Arguments.of("fade-sampling", FADE_SAMPLING));
    }

    /** The same results.csv from Spark local[2] (default tasks, 1 and 3 tasks per round) as from 2 threads. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("sweeps")
    void sparkGivesTheLocalResultsByteForByte(String name, List<String> sweep) throws IOException {
        byte[] local = resultsCsv(with(sweep, "--threads", "2"), name + "-local");
        assertTrue(new String(local, StandardCharsets.UTF_8).lines().count() > 3, "a sweep of several points");
        assertArrayEquals(local, resultsCsv(with(sweep, "--engine", "spark", "--spark-master", "local[2]"),
                name + "-spark"));
        for (String tasks : new String[] {"1", "3"}) {
            assertArrayEquals(local, resultsCsv(with(sweep, "--engine", "spark", "--spark-master", "local[2]",
                    "--spark-tasks-per-round", tasks), name + "-spark-" + tasks), tasks + " tasks per round");
        }
    }

    /** Two small designs of a study (uncoded BPSK, 64-bit frames), ranked at FER 0.1. */
    private static final String STUDY = """
            link:
              modulation: bpsk
              frame_bits: 64
            sweep:
              snr_db: "0..12/3"
              min_errors: 100
              max_frames: 50000
              seed: 4
            analysis:
              target_fer: 0.1
              outage_draws: 1000
            designs:
              - name: mrc-1x2
                link: {rx: 2}
              - name: alamouti-2x1
                link: {code: alamouti, rx: 1}
            """;

    /** study.csv's lines without the column {@code seconds}, the one column that depends on the clock. */
    private static List<String> withoutSeconds(Path csv) throws IOException {
        List<String> lines = Files.readAllLines(csv);
        int header = 0;
        while (lines.get(header).startsWith("#")) {
            header++;
        }
        int column = List.of(lines.get(header).split(",", -1)).indexOf("seconds");
        assertTrue(column >= 0, "study.csv has its seconds column");
        List<String> kept = new ArrayList<>();
        for (String line : lines) {
            List<String> cells = new ArrayList<>(List.of(line.split(",", -1)));
            if (!line.startsWith("#") && cells.size() > column) {
                cells.remove(column);
            }
            kept.add(String.join(",", cells));
        }
        return kept;
    }

    /**
     * A study through Spark (study --engine spark) writes the local study's study.csv (but for the
     * seconds each design took), each design's results.csv byte for byte and its scenario.yaml but
     * for the folder's name (the engine, like the thread count, changes no number and stays out of
     * the design's settings); so a study that Spark finished is finished for a local --resume too.
     */
    @Test
    void studyThroughSparkGivesTheLocalStudy() throws IOException {
        Path file = Files.writeString(tmp.resolve("study.yaml"), STUDY);
        Path local = tmp.resolve("study-local");
        Path spark = tmp.resolve("study-spark");
        Outcome l = cli(List.of("study", file.toString(), "--out", local.toString(), "--quiet", "--threads", "2"));
        assertEquals(0, l.code(), l.err());
        Outcome s = cli(List.of("study", file.toString(), "--out", spark.toString(), "--quiet", "--engine", "spark",
                "--spark-master", "local[2]"));
        assertEquals(0, s.code(), s.err());
        assertEquals(withoutSeconds(local.resolve("study.csv")), withoutSeconds(spark.resolve("study.csv")));
        for (String design : new String[] {"mrc-1x2", "alamouti-2x1"}) {
            assertArrayEquals(Files.readAllBytes(local.resolve(design).resolve("results.csv")),
                    Files.readAllBytes(spark.resolve(design).resolve("results.csv")), design);
        }
        for (String design : new String[] {"mrc-1x2", "alamouti-2x1"}) {
            String lo = Files.readString(local.resolve(design).resolve("scenario.yaml"));
            String sp = Files.readString(spark.resolve(design).resolve("scenario.yaml"));
            assertEquals(lo.replace(local.toString(), "STUDY"), sp.replace(spark.toString(), "STUDY"), design);
            assertFalse(sp.contains("spark\""), "a design's scenario does not name the study's engine: " + sp);
        }
        Outcome again = cli(List.of("study", file.toString(), "--out", spark.toString(), "--resume", "--threads", "2"));
        assertEquals(0, again.code(), again.err());
        assertEquals(2, again.out().split("finished earlier; kept", -1).length - 1, again.out());
    }

    private static final LinkSettings LINK = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2,
            Fading.RAYLEIGH, 128, 0);
    private static final double[] SNR = {0, 4, 8, 12};
    private static final StopRules RULES = new StopRules(200, 400_000);

    private static SweepOutcome sweep(BatchExecutor executor, List<PointState> resume, SweepEngine.Listener listener) {
        try (executor) {
            SweepEngine engine = new SweepEngine(LINK, RULES, 3, executor, 0.95);
            engine.progressMillis(20);
            return engine.run(SNR, resume, listener);
        }
    }

    private byte[] csv(SweepOutcome outcome, String name) throws IOException {
        Path file = tmp.resolve(name + ".csv");
        ResultsCsv.write(file, LINK, 3, 0.95, outcome.results(), outcome.interrupted(), null);
        return Files.readAllBytes(file);
    }

    /**
     * A task whose first attempt fails (a lost executor) is computed again by Spark, with the same
     * results; without a second attempt (local[2] allows one) the sweep fails with one line.
     */
    @Test
    void aTaskThatFailsOnceIsRetriedWithTheSameResults() throws IOException {
        byte[] local = csv(sweep(new LocalThreadExecutor(2), null, r -> { }), "local");
        SparkExecutor retried = SparkExecutor.start("local[2,2]", 3);
        retried.failFirstAttemptAt(new BatchId(1, 2));
        assertArrayEquals(local, csv(sweep(retried, null, r -> { }), "retried"));

        SparkExecutor once = SparkExecutor.start("local[2]", 3);
        once.failFirstAttemptAt(new BatchId(1, 2));
        BatchExecutor.Failure f = assertThrows(BatchExecutor.Failure.class, () -> sweep(once, null, r -> { }));
        assertTrue(f.getMessage().contains("the first attempt of the task of batch BatchId[point=1, batch=2] fails"),
                f.getMessage());
        assertFalse(f.getMessage().contains("\n"), "one line");
    }

    /**
     * Progress comes per round and the checkpoint's states change as rounds are merged; a sweep
     * stopped after its second point and resumed through Spark ends as the uninterrupted local one.
     */
    @Test
    void progressCheckpointAndResume() throws IOException {
        byte[] local = csv(sweep(new LocalThreadExecutor(2), null, r -> { }), "local");
        SparkExecutor first = SparkExecutor.start("local[2]", 0);
        assertEquals(3 * 2, first.tasksPerRound(), "3 tasks per core by default");
        AtomicInteger points = new AtomicInteger();
        AtomicInteger states = new AtomicInteger();
        List<Long> frames = new ArrayList<>();
        SweepEngine[] engine = new SweepEngine[1];
        SweepOutcome cut;
        try (first) {
            engine[0] = new SweepEngine(LINK, RULES, 3, first, 0.95);
            engine[0].progressMillis(20);
            cut = engine[0].run(SNR, null, new SweepEngine.Listener() {
                @Override
                public void pointDone(PointResult result) {
                    if (points.incrementAndGet() == 2) {
                        engine[0].requestStop();
                    }
                }

                @Override
                public void progress(SweepEngine.Progress p) {
                    frames.add(p.counts().frames());
                }

                @Override
                public void stateChanged(List<PointState> s) {
                    states.incrementAndGet();
                }
            });
        }
        assertTrue(cut.interrupted());
        assertTrue(states.get() > 0, "checkpoint states were reported");
        assertFalse(frames.isEmpty(), "progress was reported");
        assertTrue(cut.states().stream().filter(PointState::done).count() >= 2);
        SweepOutcome rest = sweep(SparkExecutor.start("local[2]", 2), cut.states(), r -> { });
        assertFalse(rest.interrupted());
        assertArrayEquals(local, csv(rest, "resumed"));
    }

    /** Workers that run another fadebench are refused before any batch, with what to do. */
    @Test
    void workersOfAnotherVersionAreRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> SparkExecutor.start("local[2]", 0, "0.0.0-other"));
        assertTrue(e.getMessage().startsWith("--engine spark: a Spark worker runs fadebench "), e.getMessage());
        assertTrue(e.getMessage().contains("this driver runs 0.0.0-other; give the workers this jar"), e.getMessage());
        // the application was stopped: a new one starts
        SparkExecutor.start("local[1]", 0).close();
    }

    /** A master that cannot be reached or parsed: one line, exit 2, and no output folder. */
    @Test
    void unusableMastersAreInvalidInput() {
        Path out = tmp.resolve("never");
        Outcome unreachable = cli(with(UNCODED, "--engine", "spark", "--spark-master", "spark://127.0.0.1:1",
                "--out", out.toString()));
        assertEquals(2, unreachable.code(), unreachable.err());
        assertTrue(unreachable.err().startsWith("fadebench run: --spark-master spark://127.0.0.1:1: cannot reach "
                + "127.0.0.1:1"), unreachable.err());
        assertEquals(1, unreachable.err().lines().count(), unreachable.err());

        Outcome nonsense = cli(with(UNCODED, "--engine", "spark", "--spark-master", "nowhere", "--out",
                out.toString()));
        assertEquals(2, nonsense.code(), nonsense.err());
        assertTrue(nonsense.err().startsWith("fadebench run: --spark-master nowhere: Spark cannot start with it"),
                nonsense.err());
        assertTrue(nonsense.err().contains("valid forms: local[N]"), nonsense.err());
        assertEquals(1, nonsense.err().lines().count(), nonsense.err());
        Outcome malformed = cli(with(UNCODED, "--engine", "spark", "--spark-master", "spark://a b:7077", "--out",
                out.toString()));
        assertEquals(2, malformed.code(), malformed.err());
        assertEquals("fadebench run: --spark-master spark://a b:7077: needs spark://HOST:PORT", malformed.err().trim());
        assertFalse(Files.exists(out), "nothing written");
    }
}
