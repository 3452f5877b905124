package org.fadebench.channel;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * Time-varying fading: a channel matrix per slot whose scattered part has the Clarke/Jakes Doppler
 * spectrum, autocorrelation E[h(t+τ)·conj(h(t))] = J0(2π·f_D·T_s·τ) over τ slots (R. H. Clarke,
 * "A statistical theory of mobile-radio reception", Bell Syst. Tech. J. 47(6), 1968; W. C. Jakes,
 * Microwave Mobile Communications, 1974).
 *
 * <p>Every entry of H has its own sum-of-sinusoids generator (Y. R. Zheng and C. Xiao, "Simulation
 * models with correct statistical properties for Rayleigh fading channels", IEEE Trans. Commun.
 * 51(6), 2003; from memory):
 * <pre>
 *   g(t) = √(2/M) · Σ_{n=1..M} e^{jψ_n} · cos(2π f_D T_s · t · cos α_n + φ),   α_n = (2πn − π + θ)/(4M)
 * </pre>
 * with θ, φ and ψ_1..ψ_M independent and uniform, drawn afresh for every entry at the start of every
 * fading block, so blocks are independent and the ensemble autocorrelation is exactly J0 with
 * E|g|² = 1 (the paper's quadratures scaled by 1/√2). M = {@value #SINUSOIDS}.
 *
 * <p>The per-slot matrix is then shaped like the block models: G(t) ← R_rx^{1/2} G(t) (R_tx^{1/2})ᵀ
 * (Kronecker correlation, optional) and, for a K-factor K &gt; 0, H(t) = √(K/(K+1))·e^{jφ_0}·A +
 * √(1/(K+1))·G(t) with the all-ones line-of-sight matrix A of {@link RicianFading} and a phase φ_0
 * drawn once per block (the line of sight itself does not fade within a block).
 *
 * <p>Random draws per block, all uniform: φ_0 (only when K &gt; 0), then per entry in row-major order
 * θ, φ, ψ_1..ψ_M. An instance holds its block state: use one per thread.
 */
public final class DopplerFading {

    /** Sinusoids per generator. */
    public static final int SINUSOIDS = 16;

    private static final double TWO_PI = 2.0 * Math.PI;

    private final int nr;
    private final int mt;
    private final double normalisedDoppler;
    private final double los;
    private final double scatter;
    private final KroneckerCorrelation correlation;
    /** Per entry e and sinusoid n at e·M + n: angular frequency in radians per slot, cos ψ, sin ψ. */
    private final double[] frequency;
    private final double[] cosPsi;
    private final double[] sinPsi;
    /** Per entry: the common phase φ. */
    private final double[] phase;

    /**
     * A process for an {@code nr} x {@code mt} channel at normalised Doppler {@code normalisedDoppler}
     * = f_D·T_s in [0, 0.5], with line-of-sight factor {@code kFactor} ≥ 0 (0 for Rayleigh) and
     * scattered part correlated by {@code correlation} (null for none).
     */
    public DopplerFading(int nr, int mt, double normalisedDoppler, double kFactor,
                         KroneckerCorrelation correlation) {
        Antennas.check(nr, mt);
        DopplerChannel.checkDoppler(normalisedDoppler);
        RicianChannel.checkKFactor(kFactor);
        if (correlation != null) {
            correlation.checkShape(nr, mt);
        }
        this.nr = nr;
        this.mt = mt;
        this.normalisedDoppler = normalisedDoppler;
        this.los = Math.sqrt(kFactor / (kFactor + 1.0));
        this.scatter = Math.sqrt(1.0 / (kFactor + 1.0));
        this.correlation = correlation;
        int n = nr * mt * SINUSOIDS;
        this.frequency = new double[n];
        this.cosPsi = new double[n];
        this.sinPsi = new double[n];
        this.phase = new double[nr * mt];
    }

    public double normalisedDoppler() {
        return normalisedDoppler;
    }

    /**
     * Starts a new, independent fading block and writes its first {@code slots} channel matrices into
     * {@code hSlots}, one after the other (slot s at {@code hSlots[2·s·Nr·Mt]}).
     */
    public void drawBlock(Draws draws, int slots, double[] hSlots) {
        UniformRandomProvider u = draws.uniform();
        double losPhase = los > 0.0 ? TWO_PI * u.nextDouble() : 0.0;
        double omega = TWO_PI * normalisedDoppler;
        int entries = nr * mt;
        for (int e = 0; e < entries; e++) {
            double theta = TWO_PI * u.nextDouble() - Math.PI;
            phase[e] = TWO_PI * u.nextDouble() - Math.PI;
            for (int n = 0; n < SINUSOIDS; n++) {
                int k = e * SINUSOIDS + n;
                double alpha = (TWO_PI * (n + 1) - Math.PI + theta) / (4.0 * SINUSOIDS);
                frequency[k] = omega * Math.cos(alpha);
                double psi = TWO_PI * u.nextDouble() - Math.PI;
                cosPsi[k] = Math.cos(psi);
                sinPsi[k] = Math.sin(psi);
            }
        }
        double amplitude = Math.sqrt(2.0 / SINUSOIDS);
        for (int s = 0; s < slots; s++) {
            int off = 2 * s * entries;
            for (int e = 0; e < entries; e++) {
                double re = 0;
                double im = 0;
                for (int k = e * SINUSOIDS, end = k + SINUSOIDS; k < end; k++) {
                    double wave = Math.cos(frequency[k] * s + phase[e]);
                    re += cosPsi[k] * wave;
                    im += sinPsi[k] * wave;
                }
                hSlots[off + 2 * e] = amplitude * re;
                hSlots[off + 2 * e + 1] = amplitude * im;
            }
            if (correlation != null) {
                correlation.correlate(hSlots, off);
            }
            if (los > 0.0) {
                RicianFading.addLineOfSight(hSlots, off, entries, los, scatter, losPhase);
            }
        }
    }
}
