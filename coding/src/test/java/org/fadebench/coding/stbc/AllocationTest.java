package org.fadebench.coding.stbc;

import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.lang.management.ManagementFactory;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Hot paths allocate nothing per call. After a warm-up, N rounds of encode, setChannel and
 * combine must add fewer than 16·N bytes to the thread's allocated-bytes counter (HotSpot's
 * per-thread count, exposed by com.sun.management.ThreadMXBean). The smallest Java object takes
 * 16 bytes on a 64-bit HotSpot VM (common practice, no source), so any allocation made on every
 * call would reach 16·N; what stays below it are one-off events of the VM itself (compilation
 * switches, class loading), which the interpreter shows to be absent once warm.
 */
class AllocationTest {

    private static final com.sun.management.ThreadMXBean THREADS =
            (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
    private static final int ROUNDS = 2000;

    @Test
    void encodersAndCombinersAllocateNothing() {
        assumeTrue(THREADS.isThreadAllocatedMemorySupported() && THREADS.isThreadAllocatedMemoryEnabled());
        List<SpaceTimeCode> codes = new ArrayList<>();
        SpaceTimeCodes.all().forEach(codes::add);
        codes.add(TestCodes.spatialMultiplexing2x2());
        codes.add(TestCodes.randomCode(new Random(1), 2, 3, 2));
        int nr = 2;
        int blocks = 8;
        Random rnd = new Random(2);
        for (SpaceTimeCode code : codes) {
            int k = code.symbolsPerBlock();
            double[] s = TestCodes.gaussians(rnd, 2 * k * blocks, 1);
            double[] x = new double[2 * code.slotsPerBlock() * code.transmitAntennas() * blocks];
            double[] h = TestCodes.gaussians(rnd, 2 * nr * code.transmitAntennas(), 1);
            double[] y = TestCodes.gaussians(rnd, 2 * code.slotsPerBlock() * nr * blocks, 1);
            double[] est = new double[2 * k * blocks];
            double[] gain = new double[k * blocks];
            StbcEncoder enc = code.newEncoder();
            List<Combiner> combiners = new ArrayList<>(List.of(new MatchedFilterCombiner(code, nr),
                    LinearEqualiser.mmse(code, nr, 0.2), LinearEqualiser.zeroForcing(code, nr)));
            combiners.add(code.newCombiner(nr));
            for (Combiner c : combiners) {
                Runnable work = () -> {
                    enc.encode(s, 0, blocks, x, 0);
                    c.setChannel(h);
                    c.combine(y, 0, blocks, est, gain, 0);
                };
                for (int i = 0; i < ROUNDS; i++) {
                    work.run();
                }
                long before = THREADS.getCurrentThreadAllocatedBytes();
                for (int i = 0; i < ROUNDS; i++) {
                    work.run();
                }
                long allocated = THREADS.getCurrentThreadAllocatedBytes() - before;
                assertTrue(allocated < 16L * ROUNDS, code.name() + " " + c.getClass().getSimpleName()
                        + " allocated " + allocated + " bytes in " + ROUNDS + " rounds");
            }
        }
    }
}
