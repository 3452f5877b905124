package org.fadebench.bench.link;

import org.fadebench.channel.ChannelTrace;
import org.fadebench.channel.LinkChannel;

/**
 * Keeps the true channel of the first {@code capacity} fading blocks of an SNR point, by block
 * number, for {@code --trace-out}. A block's channel depends only on the seed and its number, so
 * what is kept does not depend on which thread drew it; each block number is written by one
 * thread only, into its own part of the array, and read after the workers have finished. With
 * Doppler the first slot's matrix stands for the block.
 */
public final class ChannelRecorder {

    private final int nr;
    private final int mt;
    private final int capacity;
    private final double[] matrices;
    private final double[] one;
    private final boolean[] seen;

    /**
     * Bytes the storage of a recorder of {@code capacity} Nr x Mt matrices takes (the arrays the
     * constructor below allocates); {@link Long#MAX_VALUE} when it is too large for one array.
     */
    public static long bufferBytes(int nr, int mt, int capacity) {
        long values = 2L * nr * mt * capacity;
        return values > Integer.MAX_VALUE - 8 ? Long.MAX_VALUE : 8 * values + capacity;
    }

    public ChannelRecorder(int nr, int mt, int capacity) {
        this.nr = nr;
        this.mt = mt;
        this.capacity = capacity;
        this.matrices = new double[2 * nr * mt * capacity];
        this.one = new double[2 * nr * mt];
        this.seen = new boolean[capacity];
    }

    /** A recorder of the same size, sharing the storage: one per worker thread (own work array). */
    public ChannelRecorder forThread() {
        return new ChannelRecorder(this);
    }

    private ChannelRecorder(ChannelRecorder shared) {
        this.nr = shared.nr;
        this.mt = shared.mt;
        this.capacity = shared.capacity;
        this.matrices = shared.matrices;
        this.seen = shared.seen;
        this.one = new double[2 * nr * mt];
    }

    void record(LinkChannel channel, long block) {
        if (block < capacity) {
            channel.trueChannel(0, one);
            System.arraycopy(one, 0, matrices, (int) block * one.length, one.length);
            seen[(int) block] = true;
        }
    }

    /**
     * The first {@code blocks} recorded blocks as a trace (the caller passes the blocks of the
     * point's merged frames, so batches computed speculatively beyond them do not count).
     */
    public ChannelTrace trace(String name, int blocks) {
        int n = 0;
        while (n < Math.min(blocks, capacity) && seen[n]) {
            n++;
        }
        double[] kept = java.util.Arrays.copyOf(matrices, 2 * nr * mt * n);
        return ChannelTrace.of(name, nr, mt, kept);
    }
}
