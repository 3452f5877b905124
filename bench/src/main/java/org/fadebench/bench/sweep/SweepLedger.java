package org.fadebench.bench.sweep;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.TreeMap;
import org.fadebench.bench.link.FrameCounters;

/**
 * The books of one sweep, and nothing else: which batch is wanted next, the ordered merge of each
 * point's batches, the stop rules, and the state a checkpoint keeps. No threads, no clock and no
 * I/O: the caller passes the time ({@code System.nanoTime()} or a test's own) and calls it under
 * one lock; the ledger only collects finished points for the caller to report.
 *
 * <p>Reproducibility: batches may be computed and handed back in any order, but a point's batches
 * are merged strictly in batch order and its stop rule is applied after each merged batch;
 * batches beyond the stopping batch are discarded. The sweep's own rule (stop after a point with
 * no errors, or with FER below the floor) is applied to points in SNR order, and points beyond are
 * discarded. So the numbers depend only on the plan, never on who computed the batches or when
 * (unless a time limit is set).
 *
 * <p>Which batch next: the next batch of the lowest point that is not finished and still has
 * batches to hand out, so work spills over to the following points only when a point has none
 * left.
 */
public final class SweepLedger {

    private final SweepPlan plan;
    private final double confidence;
    private final long maxBatches;
    private final Point[] points;
    private final List<PointResult> reportedResults = new ArrayList<>();
    private final List<PointResult> toReport = new ArrayList<>();
    private double[] channels = new double[0];
    private int keptBlocks;
    private int reported;
    private int cutAfter = Integer.MAX_VALUE;
    private String stopReason;
    private boolean interrupted;
    private long framesSimulated;
    private long merges;

    /** One point's books: batches handed out, merged in order, and its stop state. */
    private static final class Point {
        final TreeMap<Long, BatchResult> pending = new TreeMap<>();
        final FrameCounters total;
        long nextBatch;
        long merged;
        boolean done;
        boolean started;
        long startNanos;
        long endNanos;

        Point(PointState resume) {
            this.total = resume == null ? new FrameCounters() : resume.counts().copy();
            this.merged = resume == null ? 0 : resume.mergedBatches();
            this.nextBatch = merged;
            this.done = resume != null && resume.done();
        }
    }

    /**
     * Books for {@code plan}, continuing from {@code resume} (the states of a checkpoint of the
     * same plan) when it is not null. Points already finished are ready to report at once.
     *
     * @param confidence level of the points' confidence intervals
     */
    public SweepLedger(SweepPlan plan, double confidence, List<PointState> resume) {
        if (resume != null && resume.size() != plan.points()) {
            throw new IllegalArgumentException("checkpoint has " + resume.size() + " points, the sweep "
                    + plan.points());
        }
        this.plan = plan;
        this.confidence = confidence;
        this.maxBatches = plan.maxBatches();
        this.points = new Point[plan.points()];
        for (int p = 0; p < points.length; p++) {
            points[p] = new Point(resume == null ? null : resume.get(p));
        }
        reportReady(0);
    }

    /** The batch wanted next, or null when no batch is wanted any more; {@code nanos} starts a point's clock. */
    public BatchId next(long nanos) {
        if (interrupted) {
            return null;
        }
        for (int p = reported; p <= lastPoint(); p++) {
            Point r = points[p];
            if (r.done || r.nextBatch >= maxBatches) {
                continue;
            }
            if (!r.started) {
                r.started = true;
                r.startNanos = nanos;
            }
            return new BatchId(p, r.nextBatch++);
        }
        return null;
    }

    /**
     * Takes a computed batch at time {@code nanos}: merges it and any batches it unblocks in
     * order, or discards it when its point is finished or cut, or the sweep was interrupted. A
     * batch handed back twice is merged once (its frames count as simulated each time).
     *
     * @throws IllegalArgumentException for a batch that was never handed out
     */
    public void merge(BatchResult result, long nanos) {
        BatchId id = result.id();
        if (id.point() < 0 || id.point() >= points.length || id.batch() < 0
                || id.batch() >= points[id.point()].nextBatch) {
            throw new IllegalArgumentException("batch " + id + " was never handed out");
        }
        Point r = points[id.point()];
        framesSimulated += result.counts().frames();
        if (r.done || id.point() > cutAfter || interrupted || id.batch() < r.merged) {
            return;
        }
        r.pending.put(id.batch(), result);
        BatchResult next;
        while (!r.done && (next = r.pending.remove(r.merged)) != null) {
            r.total.add(next.counts());
            if (id.point() == 0) {
                keepChannels(next);
            }
            r.merged++;
            merges++;
            boolean outOfTime = plan.rules().maxSeconds() > 0 && nanos - r.startNanos >= plan.rules().maxSeconds() * 1e9;
            if (plan.rules().pointDone(r.total, confidence) || outOfTime) {
                r.done = true;
                r.endNanos = nanos;
                r.pending.clear();
            }
        }
        reportReady(nanos);
    }

    /** Appends the first point's recorded channels while they continue the ones kept so far. */
    private void keepChannels(BatchResult b) {
        int blocks = plan.recordedBlocksIn(0, b.id().batch());
        if (blocks == 0 || plan.firstFrame(b.id().batch()) * plan.link().fadingBlocksPerFrame() != keptBlocks) {
            return;
        }
        int per = b.channels().length / blocks;
        if (channels.length == 0) {
            channels = new double[per * plan.recordedBlocks()];
        }
        System.arraycopy(b.channels(), 0, channels, per * keptBlocks, b.channels().length);
        keptBlocks += blocks;
    }

    /** Stops handing out batches and ignores results from now on. */
    public void interrupt() {
        interrupted = true;
    }

    /** Points finished (in SNR order) since the last call, for the caller to report. */
    public List<PointResult> takeFinished() {
        List<PointResult> out = List.copyOf(toReport);
        toReport.clear();
        return out;
    }

    /** Whether {@link #takeFinished} has something. */
    public boolean hasFinished() {
        return !toReport.isEmpty();
    }

    /** Whether every point the sweep still counts is finished. */
    public boolean finished() {
        return reported > lastPoint();
    }

    /** Batches merged since the ledger was made: grows whenever the checkpoint state changes. */
    public long merges() {
        return merges;
    }

    /** The reproducible state of every point, for a checkpoint. */
    public List<PointState> states() {
        List<PointState> s = new ArrayList<>(points.length);
        for (Point r : points) {
            s.add(new PointState(r.merged, r.total.copy(), r.done));
        }
        return s;
    }

    /** The lowest unfinished point and its counts so far. */
    public SweepEngine.Progress progress() {
        int p = Math.min(reported, points.length - 1);
        return new SweepEngine.Progress(p, points.length, points[p].total.copy(), plan.rules().maxFrames(),
                plan.rules().minErrors(), states());
    }

    /**
     * What the sweep produced so far: finished points, and (when interrupted) the partial ones.
     *
     * @param nanos        the time now, for the partial points' seconds
     * @param sessionNanos wall-clock time of the sweep in this session
     */
    public SweepOutcome outcome(long nanos, long sessionNanos) {
        List<PointResult> all = new ArrayList<>(reportedResults);
        if (interrupted) {
            for (int p = reported; p <= lastPoint(); p++) {
                if (points[p].total.frames() > 0 && !points[p].done) {
                    all.add(result(p, false, nanos));
                }
            }
        }
        int per = 2 * plan.link().receiveAntennas() * plan.link().transmitAntennas();
        return new SweepOutcome(all, states(), interrupted && !finished(), stopReason, framesSimulated, sessionNanos,
                Arrays.copyOf(channels, per * keptBlocks));
    }

    private int lastPoint() {
        return Math.min(points.length - 1, cutAfter);
    }

    /** Reports finished points in SNR order and applies the sweep's stop rule to each. */
    private void reportReady(long nanos) {
        while (reported <= lastPoint() && points[reported].done) {
            PointResult res = result(reported, true, nanos);
            reportedResults.add(res);
            toReport.add(res);
            String reason = plan.rules().sweepStopReason(res.counts());
            if (reason != null && reported < points.length - 1) {
                cutAfter = reported;
                stopReason = "stopped after " + res.snrDb() + " dB: " + reason + "; higher SNRs skipped";
            }
            reported++;
        }
    }

    private PointResult result(int p, boolean complete, long nanos) {
        Point r = points[p];
        FrameCounters c = r.total.copy();
        double[] fer = c.weighted() ? WeightedInterval.fer(c, confidence)
                : BinomialInterval.clopperPearson(c.frameErrors(), c.frames(), confidence);
        double[] ber = c.weighted() ? WeightedInterval.ber(c, plan.link().frameBits(), confidence)
                : BinomialInterval.clusteredBer(c.frames(), plan.link().frameBits(), c.bitErrors(),
                c.bitErrorsSquared(), confidence);
        double seconds = r.started ? ((r.done ? r.endNanos : nanos) - r.startNanos) * 1e-9 : 0;
        double snrDb = plan.snrDb(p);
        return new PointResult(p, snrDb, plan.link().ebN0Db(snrDb), c, fer[0], fer[1], ber[0], ber[1], complete,
                seconds);
    }
}
