package org.fadebench.channel;

import org.apache.commons.math3.special.Erf;
import org.apache.commons.rng.UniformRandomProvider;

/**
 * Standard normal draws by the ziggurat method (G. Marsaglia and W. W. Tsang, "The ziggurat method
 * for generating random variables", Journal of Statistical Software 5(8), 2000), with 256 layers
 * and, as J. A. Doornik recommends ("An improved ziggurat method to generate normal random
 * samples", 2005), independent bits for the layer and for the abscissa: one 64-bit draw gives the
 * layer (its low 8 bits) and a signed 56-bit abscissa (the rest). About 99 % of draws take the fast
 * path: one 64-bit draw, one comparison, one multiplication. The rest go to the wedges (uniform in
 * the layer's band under the density) or, from the base layer, to the tail beyond r, drawn by
 * Marsaglia's exponential rejection (G. Marsaglia, "Generating a variable from the tail of the
 * normal distribution", Technometrics 6(1), 1964).
 *
 * <p>The layers are computed when the class loads: r is found by bisection so that the 255 layers
 * of equal area v above the base close exactly at the top (x₀ = 0), v = r·f(r) + ∫_r^∞ f with
 * f(x) = exp(−x²/2). The fast path is kept small so that the JIT inlines it into the callers' loops.
 */
final class Ziggurat {

    static final int LAYERS = 256;

    /** Where the tail starts: the right edge of the widest layer above the base. */
    static final double R;
    /** The area of each layer (unnormalised density f(x) = exp(−x²/2), x ≥ 0). */
    static final double V;

    /** 2^-55: one step of the signed 56-bit abscissa. */
    private static final double STEP = 0x1.0p-55;

    /** Layer i: abscissa step, so that x = j · W[i] for the signed 56-bit j. */
    private static final double[] W = new double[LAYERS];
    /** Layer i: |j| below K[i] lies under the layer above, inside the density for sure. */
    private static final long[] K = new long[LAYERS];
    /** f at the layer's edge x_i (F[0] = f(0) = 1). */
    private static final double[] F = new double[LAYERS];

    static {
        R = closingR();
        V = layerArea(R);
        double[] x = edges(R, V);
        double q = V / f(R);
        W[0] = q * STEP;
        K[0] = (long) (R / q / STEP);
        F[0] = 1;
        for (int i = 1; i < LAYERS; i++) {
            W[i] = x[i] * STEP;
            K[i] = (long) (x[i - 1] / x[i] / STEP);
            F[i] = f(x[i]);
        }
    }

    private Ziggurat() {
    }

    /** One N(0, 1) draw. */
    static double sample(UniformRandomProvider rng) {
        long u = rng.nextLong();
        int i = (int) u & (LAYERS - 1);
        long j = u >> 8;
        if (Math.abs(j) < K[i]) {
            return j * W[i];
        }
        return outside(rng, i, j);
    }

    /** The draws that missed the inner rectangles: wedges, the tail, or a fresh draw. */
    private static double outside(UniformRandomProvider rng, int layer, long abscissa) {
        int i = layer;
        long j = abscissa;
        while (true) {
            if (i == 0) {
                return tail(rng, j < 0);
            }
            double x = j * W[i];
            if (F[i] + rng.nextDouble() * (F[i - 1] - F[i]) < f(x)) {
                return x;
            }
            long u = rng.nextLong();
            i = (int) u & (LAYERS - 1);
            j = u >> 8;
            if (Math.abs(j) < K[i]) {
                return j * W[i];
            }
        }
    }

    /** A draw from the normal tail beyond R, with the given sign (Marsaglia 1964). */
    private static double tail(UniformRandomProvider rng, boolean negative) {
        double x;
        double y;
        do {
            x = -Math.log(1 - rng.nextDouble()) / R;
            y = -Math.log(1 - rng.nextDouble());
        } while (y + y < x * x);
        return negative ? -(R + x) : R + x;
    }

    private static double f(double x) {
        return Math.exp(-0.5 * x * x);
    }

    /** v(r) = r f(r) + ∫_r^∞ exp(−t²/2) dt, the base layer's area (rectangle plus tail). */
    static double layerArea(double r) {
        return r * f(r) + Math.sqrt(Math.PI / 2) * Erf.erfc(r / Math.sqrt(2));
    }

    /**
     * Layer edges x_0 = 0 < x_1 < ... < x_255 = r for layers of area v: x_{i−1} = f⁻¹(v/x_i + f(x_i)).
     * When r is too small the recursion runs out of density before the top: the remaining edges are NaN.
     */
    static double[] edges(double r, double v) {
        double[] x = new double[LAYERS];
        x[LAYERS - 1] = r;
        for (int i = LAYERS - 1; i > 1; i--) {
            x[i - 1] = Math.sqrt(-2 * Math.log(v / x[i] + f(x[i])));
        }
        x[0] = 0;
        return x;
    }

    /** The excess area of the top layer, v/x_1 + f(x_1) − 1: zero when the layers close. */
    static double topExcess(double r) {
        double v = layerArea(r);
        double x1 = edges(r, v)[1];
        return Double.isNaN(x1) ? Double.POSITIVE_INFINITY : v / x1 + f(x1) - 1;
    }

    /** Bisection for the r whose layers close: too small an r leaves too much area per layer. */
    private static double closingR() {
        double lo = 3;
        double hi = 4.5;
        for (int n = 0; n < 200 && hi - lo > 1e-15; n++) {
            double mid = 0.5 * (lo + hi);
            if (topExcess(mid) > 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }
}
