package org.fadebench.channel;

import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.mult.MatrixMatrixMult_ZDRM;

/**
 * The receiver's channel knowledge (CSI): from the true Nr x Mt matrix H of a fading block it makes
 * the estimate Ĥ that the combiner is given. Three kinds:
 * <ul>
 *   <li>{@link #perfect}: Ĥ = H.
 *   <li>{@link #withError}: Ĥ = H + E with E independent CN(0, σ²) per entry, σ² fixed (relative to
 *       E|h|² = 1, so independent of the SNR).
 *   <li>{@link #leastSquares}: an exact simulation of least-squares estimation from N ≥ Mt pilot
 *       slots sent through H at the link's noise level n0.
 * </ul>
 *
 * <p>Pilots: the N x Mt pilot matrix P has P(n, t) = e^{−j2π·n·t/N}/√Mt (the first Mt columns of the
 * N-point DFT), so every pilot slot has unit total energy, like a data slot, and PᴴP = (N/Mt)·I since
 * N ≥ Mt. The pilots pass through the channel as data does, Y_p = P Hᵀ + N_p with N_p of independent
 * CN(0, n0) entries, and the least-squares estimate is Ĥᵀ = (PᴴP)⁻¹ Pᴴ Y_p = Hᵀ + (Mt/N)·Pᴴ N_p.
 * Its error entry (r, t) = (Mt/N)·Σ_n conj(P(n, t))·N_p(n, r) is CN(0, (Mt/N)²·(N/Mt)·n0) =
 * CN(0, n0·Mt/N), and errors of different entries are uncorrelated (different r: independent noise;
 * different t: orthogonal columns of P), hence independent. We simulate the pilots rather than draw
 * that error directly so that the test of the formula checks the derivation, and so that the same
 * code works for any pilot matrix; the cost is 2·N·Nr normal draws per fading block.
 *
 * <p>Pilot overhead is not charged to the SNR: pilots have the data's energy per slot, the SNR axis
 * stays the data SNR, and the pilot slots' share N/(N + data slots) is reported apart (see
 * {@link ChannelSpec#pilotOverhead}).
 *
 * <p>Random draws: none (perfect); 2·Nr·Mt normal draws (error); the pilot noise, 2·N·Nr normal draws
 * in the order of {@link MimoChannel#apply} (least squares). An instance holds work arrays: use one
 * per thread.
 */
public final class CsiEstimator {

    /** Most pilot slots per fading block. */
    public static final int MAX_PILOTS = 65_536;

    private final int nr;
    private final int mt;
    private final double errorVariance;
    private final int pilots;
    /** P (N x Mt), null unless least squares. */
    private final ZMatrixRMaj pilotGrid;
    /** Y_p (N x Nr) and Pᴴ Y_p (Mt x Nr), null unless least squares. */
    private final ZMatrixRMaj received;
    private final ZMatrixRMaj correlated;

    private CsiEstimator(int nr, int mt, double errorVariance, int pilots) {
        Antennas.check(nr, mt);
        this.nr = nr;
        this.mt = mt;
        this.errorVariance = errorVariance;
        this.pilots = pilots;
        this.pilotGrid = pilots == 0 ? null : pilotMatrix(pilots, mt);
        this.received = pilots == 0 ? null : new ZMatrixRMaj(pilots, nr);
        this.correlated = pilots == 0 ? null : new ZMatrixRMaj(mt, nr);
    }

    /** Ĥ = H. */
    public static CsiEstimator perfect(int nr, int mt) {
        return new CsiEstimator(nr, mt, 0.0, 0);
    }

    /** Ĥ = H + E, E with independent CN(0, {@code variance}) entries, variance finite and ≥ 0. */
    public static CsiEstimator withError(int nr, int mt, double variance) {
        return new CsiEstimator(nr, mt, checkErrorVariance(variance), 0);
    }

    /** {@code variance} if it is a finite error variance ≥ 0, else an error naming {@code --csi-error}. */
    public static double checkErrorVariance(double variance) {
        if (!(variance >= 0.0 && variance < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("--csi-error must be a finite error variance >= 0, got " + variance);
        }
        return variance;
    }

    /** Least squares from {@code pilots} orthogonal pilot slots, Mt ≤ pilots ≤ {@value #MAX_PILOTS}. */
    public static CsiEstimator leastSquares(int nr, int mt, int pilots) {
        if (pilots < mt || pilots > MAX_PILOTS) {
            throw new IllegalArgumentException("pilots must be at least Mt = " + mt + " and at most "
                    + MAX_PILOTS + ", got " + pilots);
        }
        return new CsiEstimator(nr, mt, 0.0, pilots);
    }

    /** The N x Mt pilot matrix P(n, t) = e^{−j2π·n·t/N}/√Mt, interleaved row-major. */
    static ZMatrixRMaj pilotMatrix(int pilots, int mt) {
        ZMatrixRMaj p = new ZMatrixRMaj(pilots, mt);
        double scale = 1.0 / Math.sqrt(mt);
        for (int n = 0; n < pilots; n++) {
            for (int t = 0; t < mt; t++) {
                // reduce n·t mod N first so the angle stays exact for large N
                double angle = -2.0 * Math.PI * ((long) n * t % pilots) / pilots;
                p.set(n, t, scale * Math.cos(angle), scale * Math.sin(angle));
            }
        }
        return p;
    }

    /** Pilot slots per fading block (0 unless least squares). */
    public int pilots() {
        return pilots;
    }

    /** Variance of each entry of Ĥ − H at noise level {@code n0}: 0, σ², or n0·Mt/N. */
    public double errorVariance(double n0) {
        return pilots > 0 ? n0 * mt / pilots : errorVariance;
    }

    /**
     * Writes the estimate of the matrix at {@code h[0 .. 2·Nr·Mt)} into {@code hHat} (which may not be
     * {@code h}); {@code n0} is the link's noise level, used by the pilots.
     */
    public void estimate(double[] h, double n0, Draws draws, double[] hHat) {
        int n = 2 * nr * mt;
        if (pilots > 0) {
            leastSquaresEstimate(h, n0, draws, hHat);
        } else if (errorVariance > 0.0) {
            double sigma = Math.sqrt(0.5 * errorVariance);
            for (int i = 0; i < n; i++) {
                hHat[i] = h[i] + sigma * draws.gaussian();
            }
        } else {
            System.arraycopy(h, 0, hHat, 0, n);
        }
    }

    /**
     * Ĥ = (Mt/N)·(Pᴴ Y_p)ᵀ. The product is EJML's {@code multTransA_small}: its sum runs in one fixed
     * order for every size (see the contributor guide, "Complex matrix products").
     */
    private void leastSquaresEstimate(double[] h, double n0, Draws draws, double[] hHat) {
        MimoChannel.apply(h, nr, mt, pilotGrid.data, 0, pilots, n0, draws, received.data, 0);
        MatrixMatrixMult_ZDRM.multTransA_small(pilotGrid, received, correlated);
        double scale = (double) mt / pilots;
        for (int r = 0; r < nr; r++) {
            for (int t = 0; t < mt; t++) {
                hHat[2 * (r * mt + t)] = scale * correlated.getReal(t, r);
                hHat[2 * (r * mt + t) + 1] = scale * correlated.getImag(t, r);
            }
        }
    }
}
