package org.fadebench.channel;

import java.io.Serializable;

/**
 * A fading model with its parameters: a small immutable value that checked its parameters when it
 * was made (messages start with the setting at fault, e.g. {@code --k-factor must be …}) and makes
 * the per-thread objects that draw channels. The receiver's CSI is not part of it (see
 * {@link ChannelSpec}). Models are found by name in {@link ChannelModels}.
 */
public interface ChannelModel extends Serializable {

    /** The name it is selected by, e.g. {@code rician}. */
    String name();

    /** A short label with the parameters, e.g. {@code rician K=3.0, tx-corr 0.5}. */
    String describe();

    /**
     * Checks the model against a link of {@code nr} receive and {@code mt} transmit antennas (whose
     * counts are already valid), for parameters that fix a shape.
     *
     * @throws IllegalArgumentException naming the setting and both shapes
     */
    default void check(int nr, int mt) {
    }

    /**
     * A model drawing one matrix per call, for block-level uses such as outage: a channel that
     * ages within a block gives its blocks' first matrices (same distribution). One per thread.
     */
    FadingModel newModel(int nr, int mt);

    /** The fading of one link block by block (one per thread); by default one draw of {@link #newModel} per block. */
    default BlockChannel newBlockChannel(int nr, int mt) {
        FadingModel model = newModel(nr, mt);
        return (draws, blockIndex, slots, h) -> model.draw(draws, nr, mt, h);
    }

    /** Whether the channel changes from slot to slot within a block. */
    default boolean varies() {
        return false;
    }

    /** The normalised Doppler f_D·T_s of a channel that changes within a block; 0 for block fading. */
    default double normalisedDoppler() {
        return 0.0;
    }

    /**
     * The diversity order one transmit-receive pair gives at high SNR (an orthogonal space-time code
     * in this fading has Mt·Nr times it), or NaN where it cannot be said: no fading (no finite
     * slope), a trace, full correlation matrices (which may be singular).
     */
    default double diversityPerPair() {
        return Double.NaN;
    }

    /**
     * For importance sampling of deep fades: the Gamma shape m of the power of each independent
     * entry, whose law {@link FadingModel#drawScaled} scales (1 for Rayleigh, independent or
     * correlated; m for Nakagami-m), or NaN for a model that cannot draw scaled fades.
     */
    default double fadeShape() {
        return Double.NaN;
    }

    /** Whether this is i.i.d. Rayleigh block fading, the channel for which the outage bounds have closed forms. */
    default boolean iidRayleigh() {
        return false;
    }
}
