package org.fadebench.channel;

/** Rician block fading with linear K-factor K ≥ 0 (see {@link RicianFading}), independent or spatially correlated. */
public record RicianChannel(double kFactor, SpatialCorrelation correlation) implements ScatteredChannel {

    public RicianChannel {
        checkKFactor(kFactor);
        java.util.Objects.requireNonNull(correlation, "correlation");
    }

    /** {@code k} if it is a finite K-factor ≥ 0, else an error naming {@code --k-factor}. */
    public static double checkKFactor(double k) {
        if (!(k >= 0.0 && k < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("--k-factor must be a finite linear K-factor >= 0, got " + k);
        }
        return k;
    }

    @Override
    public String name() {
        return "rician";
    }

    @Override
    public FadingModel newModel(int nr, int mt) {
        KroneckerCorrelation c = correlation.forLink(nr, mt);
        return c == null ? new RicianFading(kFactor) : new RicianFading(kFactor, c);
    }

    @Override
    public String describe() {
        return name() + " K=" + kFactor + correlation.describe();
    }
}
