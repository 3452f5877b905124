package org.fadebench.channel;

/**
 * Rician fading with linear K-factor K ≥ 0 (power of the line-of-sight part over the scattered
 * part): H = √(K/(K+1)) · e^{jφ} · A + √(1/(K+1)) · S, with S a Rayleigh matrix (independent or
 * Kronecker-correlated CN(0, 1) entries) and E|h_rt|² = 1 (M. K. Simon and M.-S. Alouini, Digital
 * Communication over Fading Channels, 2nd ed., 2005, Sec. 2.2.1.3).
 *
 * <p>Line of sight: A is the all-ones matrix, the rank-one response of two arrays to a plane wave
 * arriving broadside; its phase φ is drawn uniform on [0, 2π) once per fading block and shared by
 * all entries. Given φ every entry's magnitude is Rician with factor K, whatever φ is, so
 * independent scattering gives independent Rician branches.
 *
 * <p>Random draws per block: one uniform (φ), then the scattered part as {@link RayleighFading}.
 */
public final class RicianFading implements FadingModel {

    private final double kFactor;
    private final double los;
    private final double scatter;
    private final RayleighFading scattered;

    /** Independent scattering. */
    public RicianFading(double kFactor) {
        this(kFactor, new RayleighFading());
    }

    /** Scattered part correlated by {@code correlation} (which fixes Nr and Mt). */
    public RicianFading(double kFactor, KroneckerCorrelation correlation) {
        this(kFactor, new RayleighFading(correlation));
    }

    private RicianFading(double kFactor, RayleighFading scattered) {
        this.kFactor = RicianChannel.checkKFactor(kFactor);
        this.los = Math.sqrt(kFactor / (kFactor + 1.0));
        this.scatter = Math.sqrt(1.0 / (kFactor + 1.0));
        this.scattered = scattered;
    }

    public double kFactor() {
        return kFactor;
    }

    @Override
    public void draw(Draws draws, int nr, int mt, double[] h) {
        double phase = 2.0 * Math.PI * draws.uniform().nextDouble();
        scattered.draw(draws, nr, mt, h);
        addLineOfSight(h, 0, nr * mt, los, scatter, phase);
    }

    /** h ← scatter · h + los · e^{j·phase} over {@code entries} complex entries from {@code h[off]}. */
    static void addLineOfSight(double[] h, int off, int entries, double los, double scatter, double phase) {
        double lr = los * Math.cos(phase);
        double li = los * Math.sin(phase);
        for (int i = off, end = off + 2 * entries; i < end; i += 2) {
            h[i] = scatter * h[i] + lr;
            h[i + 1] = scatter * h[i + 1] + li;
        }
    }

    @Override
    public String name() {
        return "rician";
    }
}
