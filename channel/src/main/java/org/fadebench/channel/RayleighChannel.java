package org.fadebench.channel;

/** Rayleigh block fading (see {@link RayleighFading}), independent or spatially correlated. */
public record RayleighChannel(SpatialCorrelation correlation) implements ScatteredChannel {

    public RayleighChannel {
        java.util.Objects.requireNonNull(correlation, "correlation");
    }

    /** I.i.d. Rayleigh fading. */
    public RayleighChannel() {
        this(SpatialCorrelation.NONE);
    }

    @Override
    public String name() {
        return "rayleigh";
    }

    @Override
    public double kFactor() {
        return 0.0;
    }

    @Override
    public FadingModel newModel(int nr, int mt) {
        KroneckerCorrelation c = correlation.forLink(nr, mt);
        return c == null ? new RayleighFading() : new RayleighFading(c);
    }

    @Override
    public double fadeShape() {
        return 1.0;
    }

    @Override
    public boolean iidRayleigh() {
        return correlation.none();
    }

    @Override
    public String describe() {
        return name() + correlation.describe();
    }
}
