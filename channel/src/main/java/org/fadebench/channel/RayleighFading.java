package org.fadebench.channel;

/**
 * Independent Rayleigh fading: every entry of H is CN(0, 1), i.e. real and imaginary parts are
 * independent N(0, 1/2) (common practice; e.g. D. Tse and P. Viswanath, Fundamentals of Wireless
 * Communication, 2005, Sec. 2.4).
 */
public final class RayleighFading implements FadingModel {

    private static final double SQRT_HALF = Math.sqrt(0.5);

    @Override
    public void draw(Draws draws, int nr, int mt, double[] h) {
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
