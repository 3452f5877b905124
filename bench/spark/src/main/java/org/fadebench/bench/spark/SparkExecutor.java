package org.fadebench.bench.spark;

import java.io.IOException;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.net.URI;
import java.net.URISyntaxException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.Iterator;
import java.util.List;
import java.util.stream.IntStream;
import org.apache.spark.SparkConf;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.JavaFutureAction;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.api.java.function.FlatMapFunction;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.util.LongAccumulator;
import org.fadebench.bench.report.ToolVersion;
import org.fadebench.bench.sweep.BatchExecutor;
import org.fadebench.bench.sweep.BatchId;
import org.fadebench.bench.sweep.BatchPack;
import org.fadebench.bench.sweep.BatchResult;
import org.fadebench.bench.sweep.BatchWorker;
import org.fadebench.bench.sweep.SweepPlan;

/**
 * Computes a sweep's batches on Apache Spark, in rounds: each round takes wanted batches from the
 * feed, cuts them into tasks of consecutive batches, lets Spark compute the tasks on its workers
 * ({@link BatchTask}: a {@link BatchWorker} per task, built from the plan broadcast once per sweep)
 * and hands every result back to the feed, whose ledger merges them in batch order. The numbers are
 * therefore the local thread pool's, whatever the cluster: a task is a pure function of the plan
 * and its batch ids, so a task Spark recomputes (a lost executor, a failed attempt) gives the same
 * results, and batches computed beyond a point's stopping batch are discarded by the ledger.
 *
 * <p>A round has {@code tasksPerRound} tasks (by default {@link #TASKS_PER_CORE} per core of the
 * cluster, so that cores that finish early find work), and Spark holds two rounds at once, so that
 * no core waits for the slowest task of a round. A task computes as many batches as take about
 * {@link #TASK_SECONDS} (timed in the last finished round's tasks), which keeps Spark's cost per
 * task small; but a round at most doubles the batches a point has been given so far, so that a
 * point that needs few frames is not handed many more. A task's batch ids and its results each
 * travel as one packed value ({@link BatchPack}), not as an object per batch.
 */
public final class SparkExecutor implements BatchExecutor {

    /** Tasks per round per core of the cluster, unless set. */
    static final int TASKS_PER_CORE = 3;
    /** Rounds Spark holds at once. */
    private static final int ROUNDS_IN_FLIGHT = 2;
    /** What a task aims to take, in seconds. */
    static final double TASK_SECONDS = 1.0;
    /** How long the driver waits for a standalone master to answer before giving up, in ms. */
    private static final int CONNECT_MILLIS = 5000;

    private final JavaSparkContext spark;
    private final int tasksPerRound;
    private final String version;
    private BatchId failFirstAttempt;

    private SparkExecutor(JavaSparkContext spark, int tasksPerRound, String version) {
        this.spark = spark;
        this.tasksPerRound = tasksPerRound > 0 ? tasksPerRound : TASKS_PER_CORE * spark.defaultParallelism();
        this.version = version;
    }

    /**
     * Starts a Spark application on {@code master} (null: the master spark-submit set) and checks
     * that its workers run this fadebench.
     *
     * @param tasksPerRound tasks per round, or 0 for {@link #TASKS_PER_CORE} per core
     * @throws IllegalArgumentException when there is no master, it cannot be reached or used, or
     *                                  the workers run another fadebench version
     */
    public static SparkExecutor start(String master, int tasksPerRound) {
        return start(master, tasksPerRound, ToolVersion.version());
    }

    /** As {@link #start(String, int)}, for a driver of fadebench {@code version} (tests give another). */
    static SparkExecutor start(String master, int tasksPerRound, String version) {
        SparkConf conf = new SparkConf().setAppName("fadebench");
        if (master != null) {
            conf.setMaster(master);
        } else if (!conf.contains("spark.master")) {
            throw new IllegalArgumentException("--spark-master: --engine spark needs a master URL such as local[2] or "
                    + "spark://HOST:7077, unless spark-submit starts fadebench");
        }
        String url = conf.get("spark.master");
        if (url.startsWith("local")) {
            // one machine: no web page, and no network address beyond the loopback
            conf.set("spark.ui.enabled", "false").set("spark.driver.host", "127.0.0.1")
                    .set("spark.driver.bindAddress", "127.0.0.1");
        }
        requireReachable(url);
        JavaSparkContext spark;
        try {
            spark = new JavaSparkContext(conf);
        } catch (Exception e) {
            throw new IllegalArgumentException("--spark-master " + url + ": Spark cannot start with it (" + rootMessage(e)
                    + "); valid forms: local[N], local[N,ATTEMPTS], spark://HOST:PORT, yarn, k8s://URL");
        }
        try {
            SparkExecutor executor = new SparkExecutor(spark, tasksPerRound, version);
            executor.requireSameVersion();
            return executor;
        } catch (RuntimeException e) {
            spark.stop();
            throw e;
        }
    }

    /** A standalone master ({@code spark://HOST:PORT}) must answer; other kinds are Spark's to check. */
    private static void requireReachable(String url) {
        if (!url.startsWith("spark://")) {
            return;
        }
        for (String hostPort : url.substring("spark://".length()).split(",")) {
            URI uri;
            try {
                uri = new URI("spark://" + hostPort);
            } catch (URISyntaxException e) {
                uri = null;
            }
            if (uri == null || uri.getHost() == null || uri.getPort() < 0) {
                throw new IllegalArgumentException("--spark-master " + url + ": needs spark://HOST:PORT");
            }
            try (Socket s = new Socket()) {
                s.connect(new InetSocketAddress(uri.getHost(), uri.getPort()), CONNECT_MILLIS);
            } catch (IOException e) {
                throw new IllegalArgumentException("--spark-master " + url + ": cannot reach " + hostPort + " ("
                        + e.getMessage() + "); check that the master runs and the URL is the one its page shows");
            }
        }
    }

    /** One task per core asks its worker which fadebench it runs (a task checks again before it computes). */
    private void requireSameVersion() {
        int n = spark.defaultParallelism();
        List<String> seen;
        try {
            seen = spark.parallelize(IntStream.range(0, n).boxed().toList(), n).map(i -> ToolVersion.version())
                    .distinct().collect();
        } catch (Exception e) {
            throw new IllegalArgumentException("--spark-master " + spark.master() + ": the workers do not answer ("
                    + rootMessage(e) + ")");
        }
        for (String v : seen) {
            if (!v.equals(version)) {
                throw new IllegalArgumentException(mismatch(v, version));
            }
        }
    }

    private static String mismatch(String worker, String driver) {
        return "--engine spark: a Spark worker runs fadebench " + worker + " but this driver runs " + driver
                + "; give the workers this jar (spark-submit ships it) and no other fadebench jar";
    }

    /** For tests: the first attempt of the task that holds batch {@code id} fails (Spark then retries it). */
    void failFirstAttemptAt(BatchId id) {
        this.failFirstAttempt = id;
    }

    /** Tasks per round. */
    int tasksPerRound() {
        return tasksPerRound;
    }

    @Override
    public void execute(SweepPlan plan, Feed feed) {
        Broadcast<SweepPlan> shared = spark.broadcast(plan);
        Deque<Round> inFlight = new ArrayDeque<>();
        int perTask = 1;
        try {
            while (true) {
                // two rounds in flight: cores that finish a round's last tasks early start the next round
                while (inFlight.size() < ROUNDS_IN_FLIGHT) {
                    List<BatchId> round = takeRound(feed, perTask);
                    if (round.isEmpty()) {
                        break;
                    }
                    LongAccumulator nanos = spark.sc().longAccumulator("fadebench nanoseconds per batch");
                    BatchTask task = new BatchTask(shared, version, failFirstAttempt, nanos);
                    List<long[]> shares = shares(round);
                    inFlight.add(new Round(spark.parallelize(shares, shares.size()).mapPartitions(task)
                            .collectAsync(), nanos));
                }
                if (inFlight.isEmpty()) {
                    return;
                }
                Round done = inFlight.remove();
                for (byte[] results : done.results().get()) {
                    BatchPack.results(results).forEach(feed::done);
                }
                perTask = nextPerTask(perTask, done.nanosPerBatch());
            }
        } catch (Exception e) {
            inFlight.forEach(r -> r.results().cancel(true));
            throw new Failure("Spark could not compute the batches (" + rootMessage(e) + "); what was merged is kept "
                    + "in the checkpoint: run the same command with --resume to continue", e);
        } finally {
            shared.destroy();
        }
    }

    /** A round Spark computes: its batches' results, and the time each batch took in its tasks. */
    private record Round(JavaFutureAction<List<byte[]>> results, LongAccumulator nanosPerBatch) {
    }

    /**
     * The next round's batches: {@code perTask} per task, but at most as many as the first batch's
     * point was given before (and at least one per task).
     */
    private List<BatchId> takeRound(Feed feed, int perTask) {
        List<BatchId> round = new ArrayList<>();
        BatchId first = feed.next();
        if (first == null) {
            return round;
        }
        round.add(first);
        long most = Math.min((long) tasksPerRound * perTask, Math.max(tasksPerRound, first.batch()));
        BatchId id;
        while (round.size() < most && (id = feed.next()) != null) {
            round.add(id);
        }
        return round;
    }

    /**
     * The round's batches cut into its tasks' shares, consecutive and as even as can be, each
     * share packed into one value ({@link BatchPack}).
     */
    private List<long[]> shares(List<BatchId> round) {
        int tasks = Math.min(tasksPerRound, round.size());
        List<long[]> shares = new ArrayList<>(tasks);
        for (int t = 0; t < tasks; t++) {
            int from = (int) ((long) t * round.size() / tasks);
            int to = (int) ((long) (t + 1) * round.size() / tasks);
            shares.add(BatchPack.ids(round.subList(from, to)));
        }
        return shares;
    }

    /**
     * Batches per task for a task of about {@link #TASK_SECONDS}, from the time a batch took in the
     * round just finished (measured in its tasks; not in earlier rounds, whose batches the JIT had
     * not yet compiled): at most twice as many as before.
     */
    private static int nextPerTask(int perTask, LongAccumulator nanosPerBatch) {
        if (nanosPerBatch.count() == 0) {
            return perTask;
        }
        double secondsPerBatch = nanosPerBatch.avg() * 1e-9;
        long wanted = (long) (TASK_SECONDS / Math.max(secondsPerBatch, 1e-9));
        return (int) Math.max(1, Math.min(2L * perTask, wanted));
    }

    /** Stops the Spark application. */
    @Override
    public void close() {
        spark.stop();
    }

    /** The first line of the innermost cause's message (Spark's own messages run over many lines). */
    static String rootMessage(Throwable e) {
        Throwable t = e;
        while (t.getCause() != null && t.getCause() != t) {
            t = t.getCause();
        }
        String m = t.getMessage() == null ? t.getClass().getSimpleName() : t.getMessage();
        return m.lines().findFirst().orElse("").trim();
    }

    /**
     * One task: the batches of one partition, computed by one {@link BatchWorker} of the broadcast
     * plan (an idle one of an earlier task of the sweep, or a new one); a pure function of the plan
     * and the batch ids.
     */
    static final class BatchTask implements FlatMapFunction<Iterator<long[]>, byte[]> {
        private static final long serialVersionUID = 1L;

        private final Broadcast<SweepPlan> plan;
        private final String driverVersion;
        private final BatchId failFirstAttempt;
        private final LongAccumulator nanosPerBatch;

        BatchTask(Broadcast<SweepPlan> plan, String driverVersion, BatchId failFirstAttempt,
                  LongAccumulator nanosPerBatch) {
            this.plan = plan;
            this.driverVersion = driverVersion;
            this.failFirstAttempt = failFirstAttempt;
            this.nanosPerBatch = nanosPerBatch;
        }

        @Override
        public Iterator<byte[]> call(Iterator<long[]> shares) {
            if (!ToolVersion.version().equals(driverVersion)) {
                throw new IllegalStateException(mismatch(ToolVersion.version(), driverVersion));
            }
            SweepPlan sweep = plan.value();
            BatchWorker worker = IdleWorkers.borrow(sweep);
            List<byte[]> packed = new ArrayList<>(1);
            while (shares.hasNext()) {
                long[] ids = shares.next();
                List<BatchResult> results = new ArrayList<>(BatchPack.count(ids));
                for (int i = 0; i < BatchPack.count(ids); i++) {
                    BatchId id = BatchPack.id(ids, i);
                    if (id.equals(failFirstAttempt) && TaskContext.get().attemptNumber() == 0) {
                        throw new IllegalStateException("the first attempt of the task of batch " + id
                                + " fails (a test)");
                    }
                    long start = System.nanoTime();
                    results.add(worker.compute(id));
                    nanosPerBatch.add(System.nanoTime() - start);
                }
                packed.add(BatchPack.results(results));
            }
            IdleWorkers.giveBack(sweep, worker);
            return packed.iterator();
        }
    }

    /**
     * The workers of this JVM's finished tasks of the current sweep, for its next tasks to reuse: a
     * worker keeps its frame path's buffers and, with importance sampling, each point's fade scale,
     * so the scale's pilot runs (8 000 frames a point) are made once per worker and point, not once
     * per task. Only the latest sweep's workers are kept (a study runs its designs one after
     * another); a sweep is known by its plan object, which Spark deserialises once per JVM from
     * the broadcast. A worker's results do not depend on what it computed before, as in the thread
     * pool.
     */
    static final class IdleWorkers {
        /** The plan the idle workers were built for (the broadcast's value: one object per JVM and sweep). */
        private static SweepPlan current;
        private static final Deque<BatchWorker> IDLE = new ArrayDeque<>();

        private IdleWorkers() {
        }

        static synchronized BatchWorker borrow(SweepPlan plan) {
            if (plan != current) {
                IDLE.clear();
                current = plan;
            }
            BatchWorker w = IDLE.poll();
            return w != null ? w : new BatchWorker(plan);
        }

        static synchronized void giveBack(SweepPlan plan, BatchWorker worker) {
            if (plan == current) {
                IDLE.push(worker);
            }
        }
    }
}
