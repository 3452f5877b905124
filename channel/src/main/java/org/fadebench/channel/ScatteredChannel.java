package org.fadebench.channel;

/**
 * A model made of a scattered part, optionally spatially correlated, and a line of sight of
 * factor K (0 for none): the models that {@link DopplerChannel} lets age within a block.
 */
public interface ScatteredChannel extends ChannelModel {

    /** The line-of-sight factor K, 0 for Rayleigh fading. */
    double kFactor();

    SpatialCorrelation correlation();

    /**
     * 1 for Rayleigh and Rician fading (K delays the asymptote but does not change it), also with
     * exponential correlation |r| < 1, which keeps the correlation matrices full rank; NaN with full
     * correlation matrices, which may be singular.
     */
    @Override
    default double diversityPerPair() {
        return correlation().matrices() == null ? 1.0 : Double.NaN;
    }

    @Override
    default void check(int nr, int mt) {
        correlation().check(nr, mt);
    }
}
