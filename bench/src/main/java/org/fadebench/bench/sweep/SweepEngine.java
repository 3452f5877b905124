package org.fadebench.bench.sweep;

import java.util.List;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;

/**
 * Runs a Monte Carlo sweep over SNR points: a {@link SweepLedger} keeps the books, a
 * {@link BatchExecutor} computes the batches ({@link LocalThreadExecutor} by default), and the
 * engine joins the two under one lock and tells a {@link Listener} what happened.
 *
 * <p>The listener is called only on the thread that calls {@link #run}, one call at a time and
 * never under the lock, so its I/O (terminal, checkpoint file) never holds up the batches.
 * Finished points are reported in SNR order as soon as they are merged; progress and checkpoint
 * state every {@link #progressMillis}.
 */
public final class SweepEngine {

    /** Told about finished points (in SNR order), progress, and checkpoint state; see the class comment. */
    public interface Listener {
        void pointDone(PointResult result);

        /** Called about every {@code progressMillis}, and once at the end. */
        default void progress(Progress progress) {
        }

        /**
         * The reproducible state changed (batches were merged): what a checkpoint keeps. Called at
         * most once per {@code progressMillis}, and once at the end if it changed.
         */
        default void stateChanged(List<PointState> states) {
        }
    }

    /** A look at a running sweep: the lowest unfinished point and its counts so far. */
    public record Progress(int point, int points, FrameCounters counts, long maxFrames, long minErrors,
                           List<PointState> states) {
    }

    private final LinkSettings link;
    private final StopRules rules;
    private final long seed;
    private final BatchExecutor executor;
    private final double confidence;
    private volatile boolean stopRequested;
    private volatile Session session;
    private long progressMillis = 500;
    private int recordedBlocks;

    /** A sweep on {@code threads} threads of this machine. */
    public SweepEngine(LinkSettings link, StopRules rules, long seed, int threads, double confidence) {
        this(link, rules, seed, new LocalThreadExecutor(threads), confidence);
    }

    /** A sweep whose batches {@code executor} computes. */
    public SweepEngine(LinkSettings link, StopRules rules, long seed, BatchExecutor executor, double confidence) {
        this.link = link;
        this.rules = rules;
        this.seed = seed;
        this.executor = executor;
        this.confidence = confidence;
    }

    /** Frames per batch (depends only on the link). */
    public int batchFrames() {
        return SweepPlan.batchFrames(link);
    }

    /**
     * What in a checkpoint's states (for this link, these stop rules and this batch size) could not
     * have come from a sweep, or null when they add up: every point's frames are those of its
     * merged batches, its counts agree with each other and with the frame's size, and it is marked
     * done exactly when its stop rule holds (or, with a time limit, at least when it holds).
     */
    public String checkpointProblem(List<PointState> states) {
        int batchFrames = batchFrames();
        long maxBatches = SweepPlan.batches(rules.maxFrames(), batchFrames);
        for (int p = 0; p < states.size(); p++) {
            PointState s = states.get(p);
            FrameCounters c = s.counts();
            String problem = null;
            if (s.mergedBatches() > maxBatches || c.frames() != (s.mergedBatches() == maxBatches ? rules.maxFrames()
                    : s.mergedBatches() * batchFrames)) {
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
            } else if (s.done() != rules.pointDone(c, confidence)
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

    /** Keeps the channels of the first SNR point's first {@code blocks} fading blocks (see {@link SweepOutcome}). */
    public void recordChannels(int blocks) {
        this.recordedBlocks = blocks;
    }

    /** Asks a running sweep to stop after the batches in flight; safe from any thread. */
    public void requestStop() {
        stopRequested = true;
        Session s = session;
        if (s != null) {
            s.interrupt();
        }
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
        SweepPlan plan = new SweepPlan(link, snrDb, rules, seed, recordedBlocks);
        Session s = new Session(new SweepLedger(plan, confidence, resume));
        session = s;
        if (stopRequested) {
            s.interrupt();
        }
        long start = System.nanoTime();
        Thread driver = new Thread(() -> {
            try {
                executor.execute(plan, s);
            } catch (RuntimeException | Error e) {
                s.fail(e);
            } finally {
                s.executorDone();
            }
        }, "fadebench-sweep");
        driver.setDaemon(true);
        driver.start();
        try {
            s.report(listener);
        } catch (RuntimeException | Error e) {
            // the listener failed (e.g. the checkpoint could not be written): stop the batches too
            s.interrupt();
            join(driver);
            throw e;
        }
        join(driver);
        return s.outcome(start);
    }

    private static void join(Thread t) {
        try {
            t.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /** One run: the ledger under its lock, as the executor's feed, and the listener's calls outside it. */
    private final class Session implements BatchExecutor.Feed {
        private final SweepLedger ledger;
        private boolean executorDone;
        private Throwable failure;

        Session(SweepLedger ledger) {
            this.ledger = ledger;
        }

        @Override
        public synchronized BatchId next() {
            return ledger.next(System.nanoTime());
        }

        @Override
        public synchronized void done(BatchResult result) {
            ledger.merge(result, System.nanoTime());
            if (ledger.hasFinished()) {
                notifyAll();
            }
        }

        synchronized void interrupt() {
            ledger.interrupt();
        }

        synchronized void fail(Throwable e) {
            if (failure == null) {
                failure = e;
            }
            ledger.interrupt();
        }

        synchronized void executorDone() {
            executorDone = true;
            notifyAll();
        }

        /**
         * Calls the listener until the executor is done: finished points as they come, progress
         * and changed states every tick. An interruption of this thread interrupts the sweep.
         */
        void report(Listener listener) {
            boolean interruptedThread = false;
            long lastMerges = 0;
            long nextTick = System.nanoTime() + progressMillis * 1_000_000;
            boolean running = true;
            while (running) {
                List<PointResult> finished;
                SweepEngine.Progress progress = null;
                List<PointState> states = null;
                synchronized (this) {
                    try {
                        long wait;
                        while (!ledger.hasFinished() && !executorDone
                                && (wait = nextTick - System.nanoTime()) > 0) {
                            wait(wait / 1_000_000, (int) (wait % 1_000_000));
                        }
                    } catch (InterruptedException e) {
                        // stop the sweep, wait for the batches in flight, and keep the thread's status
                        ledger.interrupt();
                        interruptedThread = true;
                    }
                    running = !executorDone;
                    finished = ledger.takeFinished();
                    if (!running || System.nanoTime() - nextTick >= 0) {
                        nextTick = System.nanoTime() + progressMillis * 1_000_000;
                        progress = ledger.progress();
                        if (ledger.merges() != lastMerges) {
                            lastMerges = ledger.merges();
                            states = progress.states();
                        }
                    }
                }
                finished.forEach(listener::pointDone);
                if (progress != null) {
                    listener.progress(progress);
                }
                if (states != null) {
                    listener.stateChanged(states);
                }
            }
            if (interruptedThread) {
                Thread.currentThread().interrupt();
            }
        }

        synchronized SweepOutcome outcome(long startNanos) {
            if (failure instanceof BatchExecutor.Failure f) {
                throw f;
            }
            if (failure != null) {
                throw new IllegalStateException("simulation failed: " + failure, failure);
            }
            long now = System.nanoTime();
            SweepOutcome outcome = ledger.outcome(now, now - startNanos);
            if (!outcome.interrupted() && !ledger.finished()) {
                throw new IllegalStateException("the batch executor returned before the sweep was finished");
            }
            return outcome;
        }
    }
}
