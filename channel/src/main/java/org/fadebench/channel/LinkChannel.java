package org.fadebench.channel;

/**
 * The channel of one link as the link chain sees it, made by {@link ChannelSpec#newLinkChannel}: per
 * fading block it makes the channel, passes the transmit grid through it with noise, and gives the
 * receiver its channel estimate. Per fading block, in this order:
 * <pre>
 *   startBlock(draws, blockIndex, slots)   the block's channel: one matrix, or one per slot with Doppler
 *   transmit(x, xRow, rowSlots, n0, draws, y, yRow)  Y = X Hᵀ + N over the block's slots (noise first)
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
    /** The model, for scaled fades (importance sampling); its fading model is made on first use (and grown once if a later block is longer). */
    private final ChannelModel model;
    private FadingModel scaledFading;
    /** The scale of the fades drawn, or NaN for the model's own draws. */
    private double fadeScale = Double.NaN;
    private double fadeShape;
    private double blockLogWeight;
    private double blockFadeEnergy;
    /** One matrix, or with Doppler one per slot (slot s at 2·s·Nr·Mt). */
    private final double[] h;
    private int slots;

    LinkChannel(int nr, int mt, int maxSlots, BlockChannel fading, CsiEstimator csi, ChannelModel model) {
        this.model = model;
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
        if (fadeScale == fadeScale) {
            drawScaled(draws);
        } else {
            fading.startBlock(draws, blockIndex, slots, h);
        }
    }

    /**
     * Importance sampling of deep fades: from now on each block's channel is drawn with every
     * independent entry's power scaled by {@code scale} (see {@link FadingModel#drawScaled}), and
     * {@link #blockLogWeight()} gives the block's log likelihood ratio; NaN returns to the model's
     * own draws.
     *
     * @throws IllegalStateException for a model that cannot draw scaled fades ({@link ChannelModel#fadeShape()} NaN)
     */
    public void fadeScale(double scale) {
        if (scale != scale) {
            fadeScale = Double.NaN;
            return;
        }
        if (!(scale > 0 && scale < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("fade scale must be positive, got " + scale);
        }
        double shape = model.fadeShape();
        if (shape != shape || varies) {
            throw new IllegalStateException(model.describe() + " cannot draw scaled fades");
        }
        if (scaledFading == null) {
            scaledFading = model.newModel(nr, mt);
        }
        fadeScale = scale;
        fadeShape = shape;
    }

    /**
     * The block's channel from the scaled law q (entries' powers Gamma(m, s/m) instead of
     * Gamma(m, 1/m)) and its log likelihood ratio ln p(H)/q(H). The ratio of the independent
     * entries' densities is the ratio of H's (a fixed linear correlation maps both alike): per
     * entry of power g, p/q = s^m exp(−m (1 − 1/s) g) (the Gamma density, M. K. Simon and
     * M.-S. Alouini, Digital Communication over Fading Channels, 2nd ed., 2005, Sec. 2.2.1.4), so
     * with g = s·g₀ over the Nr·Mt entries, ln p/q = m (Nr·Mt ln s − (s − 1) Σ g₀).
     */
    private void drawScaled(Draws draws) {
        double energy = scaledFading.drawScaled(draws, nr, mt, fadeScale, h);
        blockLogWeight = fadeShape * (nr * mt * Math.log(fadeScale) - (fadeScale - 1.0) * energy);
        blockFadeEnergy = fadeScale * energy;
    }

    /** Whether blocks are drawn from a scaled law (see {@link #fadeScale(double)}). */
    public boolean scaled() {
        return fadeScale == fadeScale;
    }

    /** ln p(H)/q(H) of the current block when {@linkplain #scaled() scaled}. */
    public double blockLogWeight() {
        return blockLogWeight;
    }

    /** Σ of the current block's independent entries' powers (as drawn, scaled) when {@linkplain #scaled() scaled}. */
    public double blockFadeEnergy() {
        return blockFadeEnergy;
    }

    /**
     * Passes the block's slots, rows {@code xRow ..} of the transmit grid {@code x} (slots x Mt), through
     * the channel with noise of variance {@code n0}, into rows {@code yRow ..} of {@code y} (slots x Nr).
     * The noise is drawn for runs of {@code rowSlots} slots (the code block) as rows, column by
     * column (see {@link MimoChannel#apply}), as the planar form below draws it.
     */
    public void transmit(double[] x, int xRow, int rowSlots, double n0, Draws draws, double[] y, int yRow) {
        if (varies) {
            MimoChannel.applyPerSlot(h, nr, mt, x, xRow, slots, rowSlots, n0, draws, y, yRow);
        } else {
            MimoChannel.apply(h, nr, mt, x, xRow, slots, rowSlots, n0, draws, y, yRow);
        }
    }

    /**
     * {@link #transmit} on planar arrays, for a channel that does not vary within the block: the
     * block's slots, as rows of T slots from row {@code from} of the planes {@code x} (2·T·Mt
     * planes), into the same rows of {@code y}, with the same draws and results (see
     * {@link MimoChannel#applyTwoTransmittersPlanar} and {@link MimoChannel#applyPlanar}).
     */
    public void transmit(double[][] x, int from, double n0, Draws draws, double[][] y) {
        int slotsPerRow = x.length / (2 * mt);
        if (varies || slots % slotsPerRow != 0) {
            throw new IllegalStateException("planar transmit needs block fading and whole rows");
        }
        int rows = slots / slotsPerRow;
        if (mt == 2) {
            MimoChannel.applyTwoTransmittersPlanar(h, nr, x, from, rows, n0, draws, y);
        } else {
            if (planarSum == null || planarSum.length < from + rows) {
                planarSum = new double[from + rows];
            }
            MimoChannel.applyPlanar(h, nr, mt, x, from, rows, n0, draws, y, planarSum);
        }
    }

    /** The work plane of {@link #transmit(double[][], int, double, Draws, double[][])} for Mt ≠ 2, made on first use (and grown once if a later block is longer). */
    private double[] planarSum;

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
