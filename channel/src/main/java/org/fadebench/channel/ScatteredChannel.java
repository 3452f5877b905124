package org.fadebench.channel;

/**
 * A model made of a scattered part, optionally spatially correlated, and a line of sight of
 * factor K (0 for none): the models that {@link DopplerChannel} lets age within a block.
 */
public interface ScatteredChannel extends ChannelModel {

    /** The line-of-sight factor K, 0 for Rayleigh fading. */
    double kFactor();

    SpatialCorrelation correlation();

    @Override
    default void check(int nr, int mt) {
        correlation().check(nr, mt);
    }
}
