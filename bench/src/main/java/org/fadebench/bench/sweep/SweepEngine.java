package org.fadebench.bench.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.TreeMap;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.fadebench.bench.link.ChannelRecorder;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Draws;

/**
 * The Monte Carlo sweep over SNR points, on all the threads it is given.
 *
 * <p>Reproducibility: the frames of a point are cut into batches of a fixed size that depends only
 * on the link. Batch b of point p draws from the stream {@code Draws.of(seed, p, b)}. Workers take
 * batches in any order, but a point's batches are merged strictly in batch order and its stop rule
 * is applied after each merged batch; batches finished beyond the stopping batch are discarded.
 * The sweep's own rule (stop after a point with no errors, or with FER below the floor) is applied
 * to points in SNR order, and points beyond are discarded. So the numbers depend only on the seed
 * and the settings, never on the thread count or timing (unless a time limit is set).
 *
 * <p>Scheduling: a free worker takes the next batch of the lowest point that is not finished, so
 * workers spill over to the following points as soon as a point has no more batches to hand out,
 * and every core stays busy until the last point.
 */
public final class SweepEngine {

    /** Target number of symbols per batch; batches are whole frames. */
    static final int BATCH_SYMBOLS = 1 << 15;

    /** Told about finished points (in SNR order) and, now and then, about progress. */
    public interface Listener {
        void pointDone(PointResult result);

        /** Called from the thread that runs the sweep, about every {@code progressMillis}. */
        default void progress(Progress progress) {
        }
    }

    /** A look at a running sweep: the lowest unfinished point and its counts so far. */
    public record Progress(int point, int points, FrameCounters counts, long maxFrames, long minErrors,
                           List<PointState> states) {
    }

    private final LinkSettings link;
    private final StopRules rules;
    private final long seed;
    private final int threads;
    private final double confidence;
    private final int batchFrames;
    private volatile boolean stopRequested;
    private long progressMillis = 500;
    private ChannelRecorder recorder;

    public SweepEngine(LinkSettings link, StopRules rules, long seed, int threads, double confidence) {
        if (threads <= 0) {
            throw new IllegalArgumentException("--threads must be positive, got " + threads);
        }
        this.link = link;
        this.rules = rules;
        this.seed = seed;
        this.threads = threads;
        this.confidence = confidence;
        this.batchFrames = batchFrames(link);
    }

    /**
     * About {@link #BATCH_SYMBOLS} symbols of whole frames, rounded up to a whole number of the
     * groups the receiver decodes together, so that no group is cut short.
     */
    static int batchFrames(LinkSettings link) {
        int frames = Math.max(1, BATCH_SYMBOLS / link.symbolsPerFrame());
        int group = link.framesDecodedTogether();
        return (frames + group - 1) / group * group;
    }

    /** Frames per batch (depends only on the link). */
    public int batchFrames() {
        return batchFrames;
    }

    /**
     * What in a checkpoint's states (for this link, these stop rules and this batch size) could not
     * have come from a sweep, or null when they add up: every point's frames are those of its
     * merged batches, its counts agree with each other and with the frame's size, and it is marked
     * done exactly when its stop rule holds (or, with a time limit, at least when it holds).
     */
    public String checkpointProblem(List<PointState> states) {
        long maxBatches = (rules.maxFrames() + batchFrames - 1) / batchFrames;
        for (int p = 0; p < states.size(); p++) {
            PointState s = states.get(p);
            FrameCounters c = s.counts();
            String problem = null;
            if (s.mergedBatches() > maxBatches
                    || c.frames() != Math.min(s.mergedBatches() * batchFrames, rules.maxFrames())) {
                problem = s.mergedBatches() + " batches of " + batchFrames + " frames cannot hold " + c.frames()
                        + " frames";
            } else if (c.bits() != c.frames() * link.frameBits() || c.symbols() != c.frames() * link.symbolsPerFrame()) {
                problem = "bits or symbols do not match " + c.frames() + " frames";
            } else if (c.frameErrors() > c.frames() || c.bitErrors() < c.frameErrors()
                    || c.bitErrors() > c.frameErrors() * link.frameBits() || c.symbolErrors() > c.symbols()
                    || c.crcFailures() > c.frames() || c.undetectedErrors() > c.frameErrors()) {
                problem = "error counts that do not fit the frames";
            } else if (c.bitErrorsSquared() != Math.rint(c.bitErrorsSquared()) || c.bitErrorsSquared() < c.bitErrors()
                    || c.bitErrorsSquared() > (double) c.bitErrors() * link.frameBits() * (1 + 1e-12)) {
                problem = "a sum of squared bit errors that does not fit the bit errors";
            } else if (s.done() != rules.pointDone(c.frames(), c.frameErrors())
                    && !(s.done() && rules.maxSeconds() > 0)) {
                problem = s.done() ? "marked done before its stop rule holds" : "not marked done though its stop rule holds";
            }
            if (problem != null) {
                return "point " + (p + 1) + ": " + problem;
            }
        }
        return null;
    }

    /** How often {@link Listener#progress} is called. */
    public void progressMillis(long millis) {
        this.progressMillis = millis;
    }

    /** Keeps the channels of the first SNR point's first fading blocks (see {@link ChannelRecorder}). */
    public void recordChannels(ChannelRecorder recorder) {
        this.recorder = recorder;
    }

    /** Asks a running sweep to stop after the batches in flight; safe from any thread. */
    public void requestStop() {
        stopRequested = true;
    }

    /** Runs the sweep from the beginning. */
    public SweepOutcome run(double[] snrDb, Listener listener) {
        return run(snrDb, null, listener);
    }

    /**
     * Runs the sweep, continuing from {@code resume} (the states of a checkpoint of the same
     * settings) when it is not null.
     */
    public SweepOutcome run(double[] snrDb, List<PointState> resume, Listener listener) {
        if (resume != null && resume.size() != snrDb.length) {
            throw new IllegalArgumentException("checkpoint has " + resume.size() + " points, the sweep " + snrDb.length);
        }
        Schedule s = new Schedule(snrDb, resume, listener);
        CountDownLatch finished = new CountDownLatch(threads);
        long start = System.nanoTime();
        List<Thread> workers = new ArrayList<>();
        for (int i = 0; i < threads; i++) {
            LinkChain chain = new LinkChain(link);
            Thread t = new Thread(() -> {
                try {
                    work(s, chain);
                } catch (Throwable e) {
                    s.fail(e);
                } finally {
                    finished.countDown();
                }
            }, "fadebench-worker-" + i);
            t.setDaemon(true);
            workers.add(t);
            t.start();
        }
        try {
            while (!finished.await(progressMillis, TimeUnit.MILLISECONDS)) {
                if (stopRequested) {
                    s.interrupt();
                }
                listener.progress(s.progress());
            }
        } catch (RuntimeException | Error e) {
            // the listener failed (e.g. the checkpoint could not be written): stop the workers too
            s.interrupt();
            throw e;
        } catch (InterruptedException e) {
            s.interrupt();
            Thread.currentThread().interrupt();
            for (Thread t : workers) {
                try {
                    t.join();
                } catch (InterruptedException again) {
                    break;
                }
            }
        }
        if (s.failure != null) {
            throw new IllegalStateException("simulation failed: " + s.failure, s.failure);
        }
        listener.progress(s.progress());
        return s.outcome(System.nanoTime() - start);
    }

    private void work(Schedule s, LinkChain chain) {
        ChannelRecorder mine = recorder == null ? null : recorder.forThread();
        Task t;
        while ((t = s.next()) != null) {
            Draws draws = Draws.of(seed, t.point, t.batch);
            FrameCounters c = new FrameCounters();
            chain.recordChannels(t.point == 0 ? mine : null);
            long first = t.batch * batchFrames;
            chain.runFrames(draws, t.n0, first, t.frames, c);
            s.complete(t, c);
        }
    }

    private record Task(int point, long batch, int frames, double n0) {
    }

    /** One point's progress: batches handed out, merged in order, and its stop state. */
    private static final class PointRun {
        final double snrDb;
        final double n0;
        final long maxBatches;
        final TreeMap<Long, FrameCounters> pending = new TreeMap<>();
        FrameCounters total;
        long nextBatch;
        long merged;
        boolean done;
        long startNanos;
        long endNanos;

        PointRun(double snrDb, long maxBatches, PointState resume) {
            this.snrDb = snrDb;
            this.n0 = Math.pow(10.0, -snrDb / 10.0);
            this.maxBatches = maxBatches;
            this.total = resume == null ? new FrameCounters() : resume.counts().copy();
            this.merged = resume == null ? 0 : resume.mergedBatches();
            this.nextBatch = merged;
            this.done = resume != null && resume.done();
        }
    }

    /** The shared state of one sweep; every method holds its lock. */
    private final class Schedule {
        private final PointRun[] points;
        private final Listener listener;
        private final List<PointResult> results = new ArrayList<>();
        private int reported;
        private int cutAfter = Integer.MAX_VALUE;
        private String stopReason;
        private boolean interrupted;
        private long framesSimulated;
        private Throwable failure;

        Schedule(double[] snrDb, List<PointState> resume, Listener listener) {
            this.listener = listener;
            long maxBatches = (rules.maxFrames() + batchFrames - 1) / batchFrames;
            points = new PointRun[snrDb.length];
            for (int p = 0; p < snrDb.length; p++) {
                points[p] = new PointRun(snrDb[p], maxBatches, resume == null ? null : resume.get(p));
            }
            synchronized (this) {
                reportReady();
            }
        }

        synchronized Task next() {
            if (stopRequested) {
                interrupted = true;
            }
            if (interrupted) {
                return null;
            }
            int last = Math.min(points.length - 1, cutAfter);
            for (int p = reported; p <= last; p++) {
                PointRun r = points[p];
                if (r.done || r.nextBatch >= r.maxBatches) {
                    continue;
                }
                if (r.startNanos == 0) {
                    r.startNanos = System.nanoTime();
                }
                long b = r.nextBatch++;
                int frames = (int) Math.min(batchFrames, rules.maxFrames() - b * batchFrames);
                return new Task(p, b, frames, r.n0);
            }
            return null;
        }

        synchronized void complete(Task t, FrameCounters c) {
            framesSimulated += t.frames;
            PointRun r = points[t.point];
            if (r.done || t.point > cutAfter || interrupted) {
                return;
            }
            r.pending.put(t.batch, c);
            FrameCounters next;
            while (!r.done && (next = r.pending.remove(r.merged)) != null) {
                r.total.add(next);
                r.merged++;
                boolean outOfTime = rules.maxSeconds() > 0
                        && System.nanoTime() - r.startNanos >= rules.maxSeconds() * 1e9;
                if (rules.pointDone(r.total.frames(), r.total.frameErrors()) || outOfTime) {
                    r.done = true;
                    r.endNanos = System.nanoTime();
                    r.pending.clear();
                }
            }
            reportReady();
        }

        /** Reports finished points in SNR order and applies the sweep's stop rule to each. */
        private void reportReady() {
            while (reported < points.length && reported <= cutAfter && points[reported].done) {
                PointResult res = result(reported, true);
                results.add(res);
                listener.pointDone(res);
                String reason = rules.sweepStopReason(res.counts().frames(), res.counts().frameErrors());
                if (reason != null && reported < points.length - 1) {
                    cutAfter = reported;
                    stopReason = "stopped after " + res.snrDb() + " dB: " + reason + "; higher SNRs skipped";
                }
                reported++;
            }
        }

        private PointResult result(int p, boolean complete) {
            PointRun r = points[p];
            FrameCounters c = r.total.copy();
            double[] fer = BinomialInterval.clopperPearson(c.frameErrors(), c.frames(), confidence);
            double[] ber = BinomialInterval.clusteredBer(c.frames(), link.frameBits(), c.bitErrors(),
                    c.bitErrorsSquared(), confidence);
            double seconds = r.startNanos == 0 ? 0
                    : ((r.endNanos != 0 ? r.endNanos : System.nanoTime()) - r.startNanos) * 1e-9;
            return new PointResult(p, r.snrDb, link.ebN0Db(r.snrDb), c, fer[0], fer[1], ber[0], ber[1], complete,
                    seconds);
        }

        synchronized void interrupt() {
            interrupted = true;
        }

        synchronized void fail(Throwable e) {
            if (failure == null) {
                failure = e;
            }
            interrupted = true;
        }

        synchronized List<PointState> states() {
            List<PointState> s = new ArrayList<>(points.length);
            for (PointRun r : points) {
                s.add(new PointState(r.merged, r.total.copy(), r.done));
            }
            return s;
        }

        synchronized Progress progress() {
            int p = Math.min(reported, points.length - 1);
            return new Progress(p, points.length, points[p].total.copy(), rules.maxFrames(), rules.minErrors(),
                    states());
        }

        synchronized SweepOutcome outcome(long nanos) {
            List<PointResult> all = new ArrayList<>(results);
            if (interrupted) {
                int last = Math.min(points.length - 1, cutAfter);
                for (int p = reported; p <= last; p++) {
                    if (points[p].total.frames() > 0 && !points[p].done) {
                        all.add(result(p, false));
                    }
                }
            }
            boolean unfinished = interrupted && reported <= Math.min(points.length - 1, cutAfter);
            return new SweepOutcome(all, states(), unfinished, stopReason, framesSimulated, nanos);
        }
    }
}
