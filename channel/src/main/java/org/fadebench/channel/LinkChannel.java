package org.fadebench.channel;

/**
 * The channel of one link as the link chain sees it, made by {@link ChannelSpec#newLinkChannel}: per
 * fading block it makes the channel, passes the transmit grid through it with noise, and gives the
 * receiver its channel estimate. Per fading block, in this order:
 * <pre>
 *   startBlock(draws, blockIndex, slots)   the block's channel: one matrix, or one per slot with Doppler
 *   transmit(x, xRow, n0, draws, y, yRow)  Y = X Hᵀ + N over the block's slots (noise drawn first)
 *   estimate(n0, draws, hHat)              the receiver's CSI Ĥ for the block
 * </pre>
 * Random draws come only from {@code draws}, in that order (fading, noise, CSI), so a block depends
 * only on the stream. A trace draws nothing: its matrix is {@code blockIndex mod N}.
 *
 * <p>With Doppler the channel ages over the block and the CSI refers to its first slot (as from a
 * preamble; least-squares pilots see the first slot's matrix). Without Doppler the matrix is the same
 * for every slot of the block.
 *
 * <p>Holds its work arrays and allocates nothing per block: use one per thread.
 */
public final class LinkChannel {

    private final int nr;
    private final int mt;
    private final int maxSlots;
    private final BlockChannel fading;
    private final boolean varies;
    private final CsiEstimator csi;
    /** One matrix, or with Doppler one per slot (slot s at 2·s·Nr·Mt). */
    private final double[] h;
    private int slots;

    LinkChannel(int nr, int mt, int maxSlots, BlockChannel fading, CsiEstimator csi) {
        this.nr = nr;
        this.mt = mt;
        this.maxSlots = maxSlots;
        this.fading = fading;
        this.varies = fading.varies();
        this.csi = csi;
        this.h = new double[2 * nr * mt * (varies ? maxSlots : 1)];
    }

    /**
     * Starts fading block number {@code blockIndex} (≥ 0; it selects a trace's matrix and is unused
     * otherwise) of {@code slots} slots, 1 to the maximum given at construction.
     */
    public void startBlock(Draws draws, long blockIndex, int slots) {
        if (slots < 1 || slots > maxSlots) {
            throw new IllegalArgumentException("slots must be 1 to " + maxSlots + ", got " + slots);
        }
        this.slots = slots;
        fading.startBlock(draws, blockIndex, slots, h);
    }

    /**
     * Passes the block's slots, rows {@code xRow ..} of the transmit grid {@code x} (slots x Mt), through
     * the channel with noise of variance {@code n0}, into rows {@code yRow ..} of {@code y} (slots x Nr).
     */
    public void transmit(double[] x, int xRow, double n0, Draws draws, double[] y, int yRow) {
        if (varies) {
            MimoChannel.applyPerSlot(h, nr, mt, x, xRow, slots, n0, draws, y, yRow);
        } else {
            MimoChannel.apply(h, nr, mt, x, xRow, slots, n0, draws, y, yRow);
        }
    }

    /**
     * {@link #transmit} on planar arrays, for two transmit antennas and a channel that does not
     * vary within the block: the block's slots, as rows of T slots from row {@code from} of the
     * planes {@code x} (4·T planes), into the same rows of {@code y}, with the same draws and results
     * (see {@link MimoChannel#applyTwoTransmittersPlanar}).
     */
    public void transmit(double[][] x, int from, double n0, Draws draws, double[][] y) {
        int slotsPerRow = x.length / 4;
        if (varies || mt != 2 || slots % slotsPerRow != 0) {
            throw new IllegalStateException("planar transmit needs two transmit antennas, block fading and whole rows");
        }
        MimoChannel.applyTwoTransmittersPlanar(h, nr, x, from, slots / slotsPerRow, n0, draws, y);
    }

    /** Writes the receiver's estimate Ĥ (Nr x Mt) of the block's channel into {@code hHat}. */
    public void estimate(double n0, Draws draws, double[] hHat) {
        csi.estimate(h, n0, draws, hHat);
    }

    /** Copies the true channel of slot {@code slot} of the current block into {@code out}. */
    public void trueChannel(int slot, double[] out) {
        if (slot < 0 || slot >= slots) {
            throw new IllegalArgumentException("slot must be 0 to " + (slots - 1) + ", got " + slot);
        }
        int per = 2 * nr * mt;
        System.arraycopy(h, varies ? slot * per : 0, out, 0, per);
    }

    /** Whether the channel changes from slot to slot within a block. */
    public boolean varies() {
        return varies;
    }

    /** The estimator's error variance per entry at noise level {@code n0} (0 for perfect CSI). */
    public double csiErrorVariance(double n0) {
        return csi.errorVariance(n0);
    }
}
