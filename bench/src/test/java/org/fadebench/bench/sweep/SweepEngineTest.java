package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

class SweepEngineTest {

    private static final LinkSettings LINK = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2,
            Fading.RAYLEIGH, 256, 0);

    private static List<PointResult> run(int threads, StopRules rules) {
        return new SweepEngine(LINK, rules, 99, threads, 0.95).run(new double[] {5, 10, 15}, p -> { }).results();
    }

    /** Same seed, same numbers, whatever the number of threads. */
    @Test
    void resultsDoNotDependOnThreadCount() {
        StopRules rules = new StopRules(50, 1_000_000);
        List<PointResult> one = run(1, rules);
        for (int threads : new int[] {2, 3, 8}) {
            List<PointResult> many = run(threads, rules);
            assertEquals(one.size(), many.size());
            for (int i = 0; i < one.size(); i++) {
                FrameCounters a = one.get(i).counts();
                FrameCounters b = many.get(i).counts();
                assertEquals(a.frames(), b.frames(), "threads " + threads);
                assertEquals(a.frameErrors(), b.frameErrors());
                assertEquals(a.bitErrors(), b.bitErrors());
                assertEquals(a.symbolErrors(), b.symbolErrors());
            }
        }
    }

    /**
     * A coded link's batches are whole groups of the frames its decoder takes together (1024-bit
     * frames: 1030 QPSK symbols, 31 frames of symbols per batch, rounded up to 128), and its results
     * too do not depend on the number of threads.
     */
    @Test
    void codedBatchesAreWholeDecodeGroups() {
        LinkSettings coded = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, Fading.RAYLEIGH, 1024, 0,
                Equaliser.MF, new FrameCoding(new FecScheme(Crc.CRC16, PuncturedCode.CONV_R12), Interleaving.RANDOM, 0,
                        LlrMethod.MAXLOG));
        assertEquals(128, coded.lanes());
        assertEquals(128, SweepPlan.batchFrames(coded));
        assertEquals(SweepPlan.BATCH_SYMBOLS / LINK.symbolsPerFrame(), SweepPlan.batchFrames(LINK));
        StopRules rules = new StopRules(20, 100_000);
        FrameCounters one = new SweepEngine(coded, rules, 5, 1, 0.95).run(new double[] {6}, p -> { }).results().get(0)
                .counts();
        FrameCounters two = new SweepEngine(coded, rules, 5, 2, 0.95).run(new double[] {6}, p -> { }).results().get(0)
                .counts();
        assertTrue(one.frameErrors() >= 20);
        assertEquals(one.frames(), two.frames());
        assertEquals(one.frameErrors(), two.frameErrors());
        assertEquals(one.bitErrors(), two.bitErrors());
        assertEquals(one.symbolErrors(), two.symbolErrors());
    }

    @Test
    void stopRules() {
        // min-errors 0: exactly max-frames, not a whole number of batches
        List<PointResult> exact = run(2, new StopRules(0, 1000));
        for (PointResult r : exact) {
            assertEquals(1000, r.counts().frames());
        }
        // min-errors: stops at the first batch boundary where the count is reached
        SweepEngine e = new SweepEngine(LINK, new StopRules(30, 10_000_000), 99, 2, 0.95);
        PointResult r = e.run(new double[] {10}, p -> { }).results().get(0);
        assertTrue(r.counts().frameErrors() >= 30);
        assertTrue(r.counts().frames() % e.batchFrames() == 0);
        assertTrue(r.counts().frames() < 10_000_000);
    }

    /** --max-frames 9223372036854775807 (the largest long) simulates until min-errors, as any other limit. */
    @Test
    void largestMaxFramesStillSimulates() {
        SweepOutcome o = new SweepEngine(LINK, new StopRules(20, Long.MAX_VALUE), 99, 2, 0.95)
                .run(new double[] {5}, p -> { });
        assertEquals(1, o.complete().size());
        assertTrue(o.complete().get(0).counts().frameErrors() >= 20);
        assertTrue(o.complete().get(0).counts().frames() > 0);
    }

    /**
     * The listener hears everything on the thread that runs the sweep (so it holds no lock of the
     * workers'): points in SNR order, and the checkpoint state, last as the outcome's.
     */
    @Test
    void listenerIsCalledOnTheCallersThread() {
        Thread caller = Thread.currentThread();
        List<Thread> seen = new java.util.ArrayList<>();
        List<Integer> points = new java.util.ArrayList<>();
        List<List<PointState>> states = new java.util.ArrayList<>();
        SweepEngine e = new SweepEngine(LINK, new StopRules(40, 1_000_000), 99, 3, 0.95);
        e.progressMillis(1);
        SweepOutcome o = e.run(new double[] {5, 10, 15}, new SweepEngine.Listener() {
            @Override
            public void pointDone(PointResult result) {
                seen.add(Thread.currentThread());
                points.add(result.index());
            }

            @Override
            public void progress(SweepEngine.Progress progress) {
                seen.add(Thread.currentThread());
            }

            @Override
            public void stateChanged(List<PointState> s) {
                seen.add(Thread.currentThread());
                states.add(s);
            }
        });
        assertEquals(List.of(0, 1, 2), points);
        assertTrue(seen.stream().allMatch(t -> t == caller), "every call on the caller's thread");
        List<PointState> last = states.get(states.size() - 1);
        for (int i = 0; i < 3; i++) {
            assertEquals(o.states().get(i).mergedBatches(), last.get(i).mergedBatches());
            assertTrue(last.get(i).done());
        }
    }

    /** A point with no errors at max-frames ends the sweep. */
    @Test
    void sweepStopsAfterErrorFreePoint() {
        SweepEngine e = new SweepEngine(LINK, new StopRules(10, 300), 1, 2, 0.95);
        List<PointResult> r = e.run(new double[] {40, 45, 50}, p -> { }).results();
        assertEquals(1, r.size());
        assertEquals(0, r.get(0).counts().frameErrors());
    }
}
