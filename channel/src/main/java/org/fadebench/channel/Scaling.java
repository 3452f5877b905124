package org.fadebench.channel;

/** The one step the scaled fading draws share (see {@link FadingModel#drawScaled}). */
final class Scaling {

    private Scaling() {
    }

    /** Multiplies {@code h[0 .. n)} by √scale (so each entry's power by scale); returns Σ h² before. */
    static double scale(double[] h, int n, double scale) {
        double amplitude = Math.sqrt(scale);
        double energy = 0.0;
        for (int i = 0; i < n; i++) {
            energy += h[i] * h[i];
            h[i] *= amplitude;
        }
        return energy;
    }
}
