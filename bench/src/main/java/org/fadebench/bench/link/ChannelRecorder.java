package org.fadebench.bench.link;

import org.fadebench.channel.LinkChannel;

/**
 * Keeps the true channel of a run of fading blocks, {@code first .. first+blocks-1}, as a chain
 * draws them (for {@code --trace-out}). One recorder serves one batch on one thread; the sweep
 * merges what the batches of a point recorded in batch order. With Doppler the first slot's matrix
 * stands for the block.
 */
public final class ChannelRecorder {

    private final long first;
    private final int blocks;
    private final double[] matrices;
    private final double[] one;

    /**
     * Bytes that keeping {@code capacity} recorded Nr x Mt matrices takes (the sweep keeps those of
     * the first point's first fading blocks, see {@code SweepLedger}); {@link Long#MAX_VALUE} when
     * it is too large for one array.
     */
    public static long bufferBytes(int nr, int mt, int capacity) {
        long values = 2L * nr * mt * capacity;
        return values > Integer.MAX_VALUE - 8 ? Long.MAX_VALUE : 8 * values;
    }

    /** A recorder of {@code blocks} Nr x Mt matrices, from fading block number {@code first} on. */
    public ChannelRecorder(int nr, int mt, long first, int blocks) {
        this.first = first;
        this.blocks = blocks;
        this.one = new double[2 * nr * mt];
        this.matrices = new double[one.length * blocks];
    }

    void record(LinkChannel channel, long block) {
        if (block >= first && block - first < blocks) {
            channel.trueChannel(0, one);
            System.arraycopy(one, 0, matrices, (int) (block - first) * one.length, one.length);
        }
    }

    /** The recorded matrices, block after block, each interleaved row-major Nr x Mt (the caller's array). */
    public double[] matrices() {
        return matrices;
    }
}
