package org.fadebench.channel;

/**
 * Rayleigh fading: every entry of H is CN(0, 1), i.e. real and imaginary parts are independent
 * N(0, 1/2) (common practice; e.g. D. Tse and P. Viswanath, Fundamentals of Wireless Communication,
 * 2005, Sec. 2.4). The entries are independent, or spatially correlated by a
 * {@link KroneckerCorrelation} applied to the independent draw.
 *
 * <p>A correlated instance holds a work array: use one per thread.
 */
public final class RayleighFading implements FadingModel {

    private static final double SQRT_HALF = Math.sqrt(0.5);

    /** Null for independent entries. */
    private final KroneckerCorrelation correlation;

    /** Independent entries. */
    public RayleighFading() {
        this.correlation = null;
    }

    /** Entries correlated by {@code correlation}, which fixes Nr and Mt. */
    public RayleighFading(KroneckerCorrelation correlation) {
        this.correlation = correlation;
    }

    @Override
    public void draw(Draws draws, int nr, int mt, double[] h) {
        drawIndependent(draws, nr, mt, h);
        if (correlation != null) {
            correlation.correlate(h, 0);
        }
    }

    @Override
    public double drawScaled(Draws draws, int nr, int mt, double scale, double[] h) {
        drawIndependent(draws, nr, mt, h);
        double energy = Scaling.scale(h, 2 * nr * mt, scale);
        if (correlation != null) {
            correlation.correlate(h, 0);
        }
        return energy;
    }

    private void drawIndependent(Draws draws, int nr, int mt, double[] h) {
        if (correlation != null) {
            correlation.checkShape(nr, mt);
        }
        int n = 2 * nr * mt;
        for (int i = 0; i < n; i++) {
            h[i] = SQRT_HALF * draws.gaussian();
        }
    }

    @Override
    public String name() {
        return "rayleigh";
    }
}
