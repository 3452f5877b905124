package org.fadebench.channel;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * Nakagami-m fading, m ≥ 1/2: the entries of H are independent, each with power |h|² ~ Gamma(m, 1/m)
 * (shape m, scale 1/m, so E|h|² = 1) and a phase uniform on [0, 2π) independent of it (M. Nakagami,
 * "The m-distribution — a general formula of intensity distribution of rapid fading", in Statistical
 * Methods in Radio Wave Propagation, 1960; M. K. Simon and M.-S. Alouini, Digital Communication over
 * Fading Channels, 2nd ed., 2005, Sec. 2.2.1.4). m = 1 is Rayleigh fading; m → ∞ no fading.
 *
 * <p>Gamma draws: G. Marsaglia and W. W. Tsang, "A simple method for generating gamma variables",
 * ACM Trans. Math. Softw. 26(3), 2000, on the stream's normal and uniform draws; for m &lt; 1 the
 * paper's boost Gamma(m) = Gamma(m + 1) · U^{1/m}. The constants are fixed at construction, so a draw
 * allocates nothing.
 */
public final class NakagamiFading implements FadingModel {

    private final double m;
    /** Marsaglia-Tsang constants for shape max(m, m + 1 if m < 1). */
    private final double d;
    private final double c;
    private final boolean boost;

    public NakagamiFading(double m) {
        this.m = NakagamiChannel.checkM(m);
        this.boost = m < 1.0;
        this.d = (boost ? m + 1.0 : m) - 1.0 / 3.0;
        this.c = 1.0 / Math.sqrt(9.0 * d);
    }

    public double m() {
        return m;
    }

    @Override
    public void draw(Draws draws, int nr, int mt, double[] h) {
        UniformRandomProvider u = draws.uniform();
        for (int i = 0, n = nr * mt; i < n; i++) {
            double amplitude = Math.sqrt(gamma(draws) / m);
            double phase = 2.0 * Math.PI * u.nextDouble();
            h[2 * i] = amplitude * Math.cos(phase);
            h[2 * i + 1] = amplitude * Math.sin(phase);
        }
    }

    @Override
    public double drawScaled(Draws draws, int nr, int mt, double scale, double[] h) {
        draw(draws, nr, mt, h);
        return Scaling.scale(h, 2 * nr * mt, scale);
    }

    /** One Gamma(m, 1) draw. */
    private double gamma(Draws draws) {
        UniformRandomProvider u = draws.uniform();
        double g;
        while (true) {
            double x = draws.gaussian();
            double v = 1.0 + c * x;
            if (v <= 0.0) {
                continue;
            }
            v = v * v * v;
            double w = u.nextDouble();
            double x2 = x * x;
            if (w < 1.0 - 0.0331 * x2 * x2 || Math.log(w) < 0.5 * x2 + d * (1.0 - v + Math.log(v))) {
                g = d * v;
                break;
            }
        }
        return boost ? g * Math.pow(u.nextDouble(), 1.0 / m) : g;
    }

    @Override
    public String name() {
        return "nakagami";
    }
}
