package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.fadebench.bench.link.FrameCounters;
import org.junit.jupiter.api.Test;

/** A task's packed ids and results read back exactly: every count, every bit of every double. */
class BatchPackTest {

    @Test
    void idsRoundTrip() {
        List<BatchId> ids = List.of(new BatchId(0, 0), new BatchId(3, 1L << 40), new BatchId(7, 12));
        long[] packed = BatchPack.ids(ids);
        assertEquals(3, BatchPack.count(packed));
        for (int i = 0; i < ids.size(); i++) {
            assertEquals(ids.get(i), BatchPack.id(packed, i));
        }
    }

    @Test
    void resultsRoundTripBitForBit() {
        FrameCounters plain = FrameCounters.of(128, 3, 131_072, 17, 32_768, 9, 0.1 + 0.2, 2, 1);
        plain.addFrame(1024, 0, 256, 0, false, false, 7);
        FrameCounters weighted = new FrameCounters();
        weighted.fadeScale(0.3125);
        weighted.addWeight(1.0 / 3.0, 2.5e-7, 4, 1);
        weighted.addWeight(Math.PI, 1e-3, 0, 0);
        List<BatchResult> results = List.of(
                new BatchResult(new BatchId(1, 42), plain, new double[] {-0.0, Double.MIN_VALUE, 1.0 / 7.0}),
                new BatchResult(new BatchId(2, 0), weighted, new double[0]));

        List<BatchResult> back = BatchPack.results(BatchPack.results(results));

        assertEquals(results.size(), back.size());
        for (int i = 0; i < results.size(); i++) {
            BatchResult a = results.get(i);
            BatchResult b = back.get(i);
            assertEquals(a.id(), b.id());
            // byName holds every count; equals on Double compares the bits (so -0.0 and NaN are exact)
            assertEquals(a.counts().byName(), b.counts().byName());
            assertArrayEquals(a.channels(), b.channels());
            for (int j = 0; j < a.channels().length; j++) {
                assertEquals(Double.doubleToRawLongBits(a.channels()[j]), Double.doubleToRawLongBits(b.channels()[j]));
            }
        }
    }
}
