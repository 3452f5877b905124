package org.fadebench.bench.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.TreeMap;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Draws;

/**
 * The Monte Carlo sweep over SNR points, on all the threads it is given.
 *
 * <p>Reproducibility: the frames of a point are cut into batches of a fixed size that depends only
 * on the link. Batch b of point p draws from the stream {@code Draws.of(seed, p, b)}. Workers take
 * batch numbers in any order, but results are merged strictly in batch order and the stop rule is
 * applied after each merged batch; batches finished beyond the stopping batch are discarded. So the
 * numbers depend on the seed and the settings only, never on the thread count or timing.
 *
 * <p>The sweep stops early after a point that ends with zero frame errors at {@code maxFrames}:
 * higher SNRs would show none either.
 */
public final class SweepEngine {

    /** Target number of symbols per batch; batches are whole frames. */
    static final int BATCH_SYMBOLS = 1 << 15;

    /** Told about each finished point, in SNR order. */
    public interface Listener {
        void pointDone(PointResult result);
    }

    private final LinkSettings link;
    private final StopRules rules;
    private final long seed;
    private final int threads;
    private final double confidence;
    private final int batchFrames;
    private long framesSimulated;
    private long nanosSimulating;

    public SweepEngine(LinkSettings link, StopRules rules, long seed, int threads, double confidence) {
        if (threads <= 0) {
            throw new IllegalArgumentException("--threads must be positive, got " + threads);
        }
        this.link = link;
        this.rules = rules;
        this.seed = seed;
        this.threads = threads;
        this.confidence = confidence;
        this.batchFrames = Math.max(1, BATCH_SYMBOLS / link.symbolsPerFrame());
    }

    /** Frames per batch (depends only on the link). */
    public int batchFrames() {
        return batchFrames;
    }

    /** Frames simulated in the last run, including discarded speculative batches. */
    public long framesSimulated() {
        return framesSimulated;
    }

    /** Wall-clock nanoseconds spent simulating in the last run. */
    public long nanosSimulating() {
        return nanosSimulating;
    }

    /** Runs the points in order; returns the finished ones (fewer when the sweep stops early). */
    public List<PointResult> run(double[] snrDb, Listener listener) {
        List<PointResult> results = new ArrayList<>();
        LinkChain[] chains = new LinkChain[threads];
        for (int i = 0; i < threads; i++) {
            chains[i] = new LinkChain(link);
        }
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread th = new Thread(r, "fadebench-worker");
            th.setDaemon(true);
            return th;
        });
        framesSimulated = 0;
        long start = System.nanoTime();
        try {
            for (int p = 0; p < snrDb.length; p++) {
                FrameCounters total = runPoint(pool, chains, p, snrDb[p]);
                double[] ci = BinomialInterval.clopperPearson(total.frameErrors(), total.frames(), confidence);
                PointResult result = new PointResult(snrDb[p], link.ebN0Db(snrDb[p]), total, ci[0], ci[1]);
                results.add(result);
                listener.pointDone(result);
                if (total.frameErrors() == 0 && total.frames() >= rules.maxFrames()) {
                    break;
                }
            }
        } finally {
            pool.shutdownNow();
            nanosSimulating = System.nanoTime() - start;
        }
        return results;
    }

    private FrameCounters runPoint(ExecutorService pool, LinkChain[] chains, int point, double snrDb) {
        double n0 = Math.pow(10.0, -snrDb / 10.0);
        long maxBatches = (rules.maxFrames() + batchFrames - 1) / batchFrames;
        PointRun run = new PointRun(rules);
        List<Future<Long>> futures = new ArrayList<>();
        for (LinkChain chain : chains) {
            futures.add(pool.submit(() -> {
                long frames = 0;
                while (!run.stopped()) {
                    long b = run.next.getAndIncrement();
                    if (b >= maxBatches) {
                        break;
                    }
                    long first = b * batchFrames;
                    int count = (int) Math.min(batchFrames, rules.maxFrames() - first);
                    Draws draws = Draws.of(seed, point, b);
                    FrameCounters c = new FrameCounters();
                    for (int f = 0; f < count; f++) {
                        chain.runFrame(draws, n0, c);
                    }
                    frames += count;
                    run.complete(b, c);
                }
                return frames;
            }));
        }
        for (Future<Long> f : futures) {
            try {
                framesSimulated += f.get();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("interrupted", e);
            } catch (ExecutionException e) {
                throw new IllegalStateException("simulation failed: " + e.getCause(), e.getCause());
            }
        }
        return run.total;
    }

    /** Merges batches of one point in batch order and decides when to stop. */
    private static final class PointRun {
        final AtomicLong next = new AtomicLong();
        private final StopRules rules;
        private final TreeMap<Long, FrameCounters> pending = new TreeMap<>();
        private final FrameCounters total = new FrameCounters();
        private long merged;
        private volatile boolean stop;

        PointRun(StopRules rules) {
            this.rules = rules;
        }

        boolean stopped() {
            return stop;
        }

        synchronized void complete(long batch, FrameCounters counters) {
            if (stop) {
                return;
            }
            pending.put(batch, counters);
            FrameCounters c;
            while (!stop && (c = pending.remove(merged)) != null) {
                total.add(c);
                merged++;
                if (rules.done(total.frames(), total.frameErrors())) {
                    stop = true;
                }
            }
        }
    }
}
