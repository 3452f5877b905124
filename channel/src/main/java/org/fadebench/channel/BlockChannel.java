package org.fadebench.channel;

/**
 * The fading of one link, block by block, made by {@link ChannelModel#newBlockChannel}: it writes
 * the channel of a fading block into a caller-owned array (layout of {@link FadingModel}). Holds its
 * own work state and allocates nothing per block: use one per thread.
 */
@FunctionalInterface
public interface BlockChannel {

    /**
     * Writes the channel of fading block number {@code blockIndex} (≥ 0) of {@code slots} slots into
     * {@code h}: one matrix, or, when the channel {@linkplain #varies() varies}, one per slot (slot s
     * at {@code h[2·s·Nr·Mt]}). Random draws come only from {@code draws}, so a block depends only on
     * the stream (and, for a replayed trace, on its index).
     */
    void startBlock(Draws draws, long blockIndex, int slots, double[] h);

    /** Whether the channel changes from slot to slot within a block. */
    default boolean varies() {
        return false;
    }
}
