package org.fadebench.bench.analysis;

import java.util.Comparator;
import java.util.stream.IntStream;

/** Visits the points of a curve in increasing SNR, whatever order the sweep ran them in. */
final class SnrOrder {

    private SnrOrder() {
    }

    /**
     * The indices of {@code snrDb} sorted by increasing SNR.
     *
     * @throws IllegalArgumentException if a value is not a finite number of dB or appears twice
     */
    static int[] ascending(double[] snrDb) {
        int[] order = IntStream.range(0, snrDb.length).boxed()
                .sorted(Comparator.comparingDouble(i -> snrDb[i]))
                .mapToInt(Integer::intValue).toArray();
        for (int k = 0; k < order.length; k++) {
            double s = snrDb[order[k]];
            if (!Double.isFinite(s)) {
                throw new IllegalArgumentException("SNR points must be finite numbers of dB, got " + s);
            }
            if (k > 0 && s == snrDb[order[k - 1]]) {
                throw new IllegalArgumentException("SNR points must be distinct, got " + s + " dB twice");
            }
        }
        return order;
    }

    static void checkSameLength(double[] snrDb, int length, String what) {
        if (length != snrDb.length) {
            throw new IllegalArgumentException("got " + length + " " + what + " for " + snrDb.length
                    + " SNR points; need one per point");
        }
    }
}
