package org.fadebench.bench.perf;

import java.util.ArrayList;
import java.util.List;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.BatchId;
import org.fadebench.bench.sweep.BatchPack;
import org.fadebench.bench.sweep.BatchResult;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepLedger;
import org.fadebench.bench.sweep.SweepPlan;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * One idea: what the driver of a remote executor (Spark) does per batch result, on one core, to
 * know how many workers one driver can keep up with. A round of {@value #TASK} results of
 * uncoded Alamouti 2x2 16-QAM 1024-bit frames (128 frames a batch, the batch the sweep makes for
 * that link), as a task sends them back packed ({@link BatchPack}): the driver unpacks them,
 * merges each into the sweep's ledger in order and hands out and packs the next round's ids.
 * {@code packResults} is the worker's side, packing a task's results. Score: batch results per
 * second. Spark's own scheduling and transport are not in it.
 */
public class DriverBenchmark extends ThroughputBenchmark {

    static final int TASK = 512;

    /** A batch's counts as the uncoded link gives them (128 frames of 1024 bits, a few errors). */
    static FrameCounters batchCounts() {
        return FrameCounters.of(128, 3, 131_072, 17, 32_768, 9, 0.0, 0, 0);
    }

    /** A ledger of one point that never finishes, the next round's ids and their results packed. */
    @State(Scope.Thread)
    public static class Driver {
        SweepLedger ledger;
        final FrameCounters counts = batchCounts();
        List<BatchId> ids = new ArrayList<>(TASK);
        byte[] packed;
        long clock;

        @Setup(Level.Trial)
        public void setUp() {
            LinkSettings link = new LinkSettings(Modulation.QAM16, SpaceTimeCodes.ALAMOUTI, 2, 2, Fading.RAYLEIGH, 1024, 0);
            SweepPlan plan = new SweepPlan(link, new double[] {15}, new StopRules(0, Long.MAX_VALUE), 1);
            ledger = new SweepLedger(plan, 0.95, null);
            handOut();
        }

        /** The worker's side of the round about to be measured: the results of the ids handed out. */
        @Setup(Level.Invocation)
        public void compute() {
            List<BatchResult> results = new ArrayList<>(TASK);
            for (BatchId id : ids) {
                results.add(new BatchResult(id, counts, new double[0]));
            }
            packed = BatchPack.results(results);
        }

        long[] handOut() {
            ids = new ArrayList<>(TASK);
            for (int i = 0; i < TASK; i++) {
                ids.add(ledger.next(clock));
            }
            return BatchPack.ids(ids);
        }
    }

    @Benchmark
    @OperationsPerInvocation(TASK)
    public long[] driverRound(Driver d) {
        for (BatchResult r : BatchPack.results(d.packed)) {
            d.ledger.merge(r, ++d.clock);
        }
        return d.handOut();
    }

    /** A task's results, as a worker packs them. */
    @State(Scope.Thread)
    public static class Task {
        final List<BatchResult> results = new ArrayList<>(TASK);

        @Setup
        public void setUp() {
            for (int i = 0; i < TASK; i++) {
                results.add(new BatchResult(new BatchId(0, i), batchCounts(), new double[0]));
            }
        }
    }

    @Benchmark
    @OperationsPerInvocation(TASK)
    public byte[] packResults(Task t) {
        return BatchPack.results(t.results);
    }
}
