package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/** An interrupted sweep resumed from its states ends exactly like an uninterrupted one. */
class ResumeTest {

    private static final LinkSettings LINK = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2,
            Fading.RAYLEIGH, 128, 0);
    private static final double[] SNR = {0, 4, 8, 12, 16};
    private static final StopRules RULES = new StopRules(300, 2_000_000);

    private static void assertSame(List<PointResult> a, List<PointResult> b) {
        assertEquals(a.size(), b.size());
        for (int i = 0; i < a.size(); i++) {
            FrameCounters x = a.get(i).counts();
            FrameCounters y = b.get(i).counts();
            assertEquals(x.frames(), y.frames(), "point " + i);
            assertEquals(x.frameErrors(), y.frameErrors());
            assertEquals(x.bitErrors(), y.bitErrors());
            assertEquals(x.symbolErrors(), y.symbolErrors());
            assertEquals(x.bitErrorsSquared(), y.bitErrorsSquared(), 0.0);
            assertEquals(a.get(i).berHigh(), b.get(i).berHigh(), 0.0);
        }
    }

    @Test
    void interruptedThenResumedEqualsUninterrupted() {
        List<PointResult> straight = new SweepEngine(LINK, RULES, 11, 2, 0.95).run(SNR, p -> { }).results();
        for (int stopAfter : new int[] {0, 2}) {
            SweepEngine first = new SweepEngine(LINK, RULES, 11, 2, 0.95);
            AtomicInteger seen = new AtomicInteger();
            SweepOutcome cut = first.run(SNR, r -> {
                if (seen.getAndIncrement() == stopAfter) {
                    first.requestStop();
                }
            });
            assertTrue(cut.interrupted(), "the sweep was interrupted");
            assertTrue(cut.complete().size() < SNR.length);
            // a second interruption, resumed from the first
            SweepEngine second = new SweepEngine(LINK, RULES, 11, 1, 0.95);
            second.requestStop();
            SweepOutcome cutAgain = second.run(SNR, cut.states(), p -> { });
            SweepOutcome rest = new SweepEngine(LINK, RULES, 11, 3, 0.95).run(SNR, cutAgain.states(), p -> { });
            assertFalse(rest.interrupted());
            assertSame(straight, rest.complete());
        }
    }
}
