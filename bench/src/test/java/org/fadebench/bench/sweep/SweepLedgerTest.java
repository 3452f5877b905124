package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/**
 * The sweep's books on their own, fed by hand-made batch results: no link is simulated, no thread
 * started, and the clock is the test's.
 */
class SweepLedgerTest {

    /** Alamouti 2x1 QPSK, 256-bit frames: 128 symbols, so 256 frames per batch. */
    private static final LinkSettings LINK = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2,
            Fading.RAYLEIGH, 256, 0);
    private static final double[] SNR = {0, 5, 10};
    private static final long SECOND = 1_000_000_000L;

    private static SweepLedger ledger(StopRules rules) {
        return new SweepLedger(new SweepPlan(LINK, SNR, rules, 1), 0.95, null);
    }

    /** A batch of {@code frames} frames, {@code errors} of them with one bit error. */
    private static BatchResult batch(int point, long batch, long frames, long errors) {
        return new BatchResult(new BatchId(point, batch), FrameCounters.of(frames, errors, 256 * frames, errors,
                128 * frames, errors, errors, 0, 0), new double[0]);
    }

    @Test
    void batchSizeComesFromTheLink() {
        assertEquals(256, new SweepPlan(LINK, SNR, new StopRules(0, 600), 1).batchFrames());
    }

    /** The lowest unfinished point first; the last batch is cut at max-frames; then the next point. */
    @Test
    void handsOutTheLowestPointsBatchesFirst() {
        SweepPlan plan = new SweepPlan(LINK, new double[] {0, 5}, new StopRules(0, 600), 1);
        SweepLedger l = new SweepLedger(plan, 0.95, null);
        assertEquals(3, plan.maxBatches());
        assertEquals(600 - 512, plan.framesIn(2));
        for (int p = 0; p < 2; p++) {
            for (long b = 0; b < 3; b++) {
                assertEquals(new BatchId(p, b), l.next(0));
            }
        }
        assertNull(l.next(0), "every batch handed out");
    }

    /** Batches handed back out of order are merged in batch order; the point ends at max-frames. */
    @Test
    void mergesInBatchOrderWhateverTheArrivalOrder() {
        SweepLedger l = ledger(new StopRules(0, 600));
        for (int i = 0; i < 3; i++) {
            l.next(0);
        }
        l.merge(batch(0, 2, 88, 7), 0);
        assertEquals(0, l.states().get(0).mergedBatches(), "batch 2 waits for batches 0 and 1");
        l.merge(batch(0, 0, 256, 1), 0);
        assertEquals(1, l.states().get(0).mergedBatches());
        assertFalse(l.hasFinished());
        l.merge(batch(0, 1, 256, 2), 0);
        List<PointResult> done = l.takeFinished();
        assertEquals(1, done.size());
        assertEquals(600, done.get(0).counts().frames());
        assertEquals(10, done.get(0).counts().frameErrors());
        assertTrue(done.get(0).complete());
        assertEquals(3, l.states().get(0).mergedBatches());
        assertFalse(l.hasFinished(), "taken once");
    }

    /**
     * The point stops at the first merged batch that reaches min-errors; batches beyond it are
     * discarded, whether they came back before or after it, but count as simulated.
     */
    @Test
    void discardsBatchesBeyondTheStoppingBatch() {
        SweepLedger l = ledger(new StopRules(3, 1_000_000));
        for (int i = 0; i < 4; i++) {
            assertEquals(new BatchId(0, i), l.next(0));
        }
        l.merge(batch(0, 3, 256, 50), 0);
        l.merge(batch(0, 1, 256, 2), 0);
        l.merge(batch(0, 0, 256, 1), 0);
        List<PointResult> done = l.takeFinished();
        assertEquals(1, done.size());
        assertEquals(512, done.get(0).counts().frames());
        assertEquals(3, done.get(0).counts().frameErrors());
        l.merge(batch(0, 2, 256, 9), 0);
        assertEquals(3, l.states().get(0).counts().frameErrors(), "batch 2 came after the stop");
        assertEquals(new BatchId(1, 0), l.next(0), "the next point");
        assertEquals(4 * 256, l.outcome(0, 0).framesSimulated());
    }

    /** A point without errors at max-frames ends the sweep, even if later points have batches out. */
    @Test
    void sweepStopRuleCutsTheLaterPoints() {
        SweepLedger l = ledger(new StopRules(10, 512));
        assertEquals(new BatchId(0, 0), l.next(0));
        assertEquals(new BatchId(0, 1), l.next(0));
        assertEquals(new BatchId(1, 0), l.next(0), "spills over once point 0 has no batch left");
        l.merge(batch(1, 0, 256, 4), 0);
        l.merge(batch(0, 1, 256, 0), 0);
        l.merge(batch(0, 0, 256, 0), 0);
        assertNull(l.next(0));
        assertTrue(l.finished());
        SweepOutcome o = l.outcome(0, 0);
        assertEquals(1, o.results().size());
        assertFalse(o.interrupted());
        assertTrue(o.stopReason().contains("no frame errors in 512 frames"), o.stopReason());
    }

    /** Resuming: finished points are reported at once, the others continue after their merged batches. */
    @Test
    void resumesFromCheckpointStates() {
        SweepLedger first = ledger(new StopRules(0, 600));
        for (int i = 0; i < 4; i++) {
            first.next(0);
        }
        for (int b = 0; b < 3; b++) {
            first.merge(batch(0, b, b == 2 ? 88 : 256, 1), 0);
        }
        first.merge(batch(1, 0, 256, 5), 0);
        first.interrupt();
        SweepLedger again = new SweepLedger(new SweepPlan(LINK, SNR, new StopRules(0, 600), 1), 0.95,
                first.outcome(0, 0).states());
        assertEquals(1, again.takeFinished().size(), "point 0 was finished");
        assertEquals(new BatchId(1, 1), again.next(0));
        assertEquals(256, again.states().get(1).counts().frames());
    }

    /** With a time limit the point stops at the first batch merged after it; its seconds come from the given clock. */
    @Test
    void timeLimitEndsAPointAtTheNextMergedBatch() {
        SweepLedger l = ledger(new StopRules(0, 1_000_000, 1.0, 0));
        long t0 = 7 * SECOND;
        l.next(t0);
        l.next(t0);
        l.merge(batch(0, 0, 256, 3), t0 + SECOND / 2);
        assertFalse(l.hasFinished());
        l.merge(batch(0, 1, 256, 3), t0 + SECOND);
        PointResult r = l.takeFinished().get(0);
        assertEquals(512, r.counts().frames());
        assertEquals(1.0, r.seconds(), 1e-12);
    }

    /** After an interruption no batch is handed out, results are ignored, and the partial point is kept. */
    @Test
    void interruptionKeepsThePartialPoint() {
        SweepLedger l = ledger(new StopRules(100, 1_000_000));
        l.next(0);
        l.next(0);
        l.merge(batch(0, 0, 256, 5), 0);
        l.interrupt();
        assertNull(l.next(0));
        l.merge(batch(0, 1, 256, 5), 0);
        SweepOutcome o = l.outcome(0, 0);
        assertTrue(o.interrupted());
        assertEquals(1, o.results().size());
        assertFalse(o.results().get(0).complete());
        assertEquals(256, o.results().get(0).counts().frames());
        assertEquals(1, o.states().get(0).mergedBatches());
    }

    /** The first point's recorded channels are kept in block order, only for merged batches. */
    @Test
    void keepsTheFirstPointsChannelsInOrder() {
        SweepPlan plan = new SweepPlan(LINK, SNR, new StopRules(0, 1000), 1, 300);
        assertEquals(256, plan.recordedBlocksIn(0, 0));
        assertEquals(44, plan.recordedBlocksIn(0, 1));
        assertEquals(0, plan.recordedBlocksIn(0, 2));
        assertEquals(0, plan.recordedBlocksIn(1, 0));
        SweepLedger l = new SweepLedger(plan, 0.95, null);
        for (int i = 0; i < 4; i++) {
            l.next(0);
        }
        int per = 2 * 1 * 2;
        l.merge(new BatchResult(new BatchId(0, 1), FrameCounters.of(256, 0, 0, 0, 0, 0, 0, 0, 0),
                numbered(256, 44, per)), 0);
        l.merge(new BatchResult(new BatchId(0, 0), FrameCounters.of(256, 0, 0, 0, 0, 0, 0, 0, 0),
                numbered(0, 256, per)), 0);
        l.interrupt();
        assertArrayEquals(numbered(0, 300, per), l.outcome(0, 0).recordedChannels());
    }

    private static double[] numbered(int first, int blocks, int per) {
        double[] m = new double[blocks * per];
        for (int i = 0; i < m.length; i++) {
            m[i] = first + i / per;
        }
        return m;
    }

    @Test
    void refusesABatchNeverHandedOutAndCountsARepeatOnce() {
        SweepLedger l = ledger(new StopRules(0, 1000));
        assertThrows(IllegalArgumentException.class, () -> l.merge(batch(0, 0, 256, 1), 0));
        l.next(0);
        l.next(0);
        l.merge(batch(0, 0, 256, 1), 0);
        l.merge(batch(0, 0, 256, 1), 0);
        assertEquals(256, l.states().get(0).counts().frames());
        assertThrows(IllegalArgumentException.class, () -> l.merge(batch(0, 2, 256, 1), 0));
        assertThrows(IllegalArgumentException.class, () -> l.merge(batch(5, 0, 256, 1), 0));
    }

    /**
     * --max-frames accepts the full range of a long: the batch count is rounded up without
     * overflow (it used to wrap to a negative count, so nothing was simulated).
     */
    @Test
    void maxFramesOverTheFullRangeOfALong() {
        SweepPlan plan = new SweepPlan(LINK, SNR, new StopRules(3, Long.MAX_VALUE), 1);
        assertEquals(Long.MAX_VALUE / 256 + 1, plan.maxBatches());
        assertEquals(Long.MAX_VALUE % 256, plan.framesIn(plan.maxBatches() - 1));
        SweepLedger l = new SweepLedger(plan, 0.95, null);
        BatchId first = l.next(0);
        assertNotNull(first, "a batch is wanted");
        l.merge(batch(0, 0, 256, 3), 0);
        assertEquals(256, l.takeFinished().get(0).counts().frames());
    }
}
