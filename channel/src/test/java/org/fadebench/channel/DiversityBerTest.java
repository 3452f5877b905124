package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.fadebench.modem.ErrorRates;
import org.junit.jupiter.api.Test;

/**
 * BPSK with maximal-ratio combining over L branches drawn by our fading models, against the
 * moment-generating-function method of M. K. Simon and M.-S. Alouini, Digital Communication over
 * Fading Channels, 2nd ed., 2005, ch. 9 (Eq. 9.11 for MRC, with the per-branch MGFs of Table 2.2;
 * from memory):
 * <pre>
 *   P_b = (1/π) ∫_0^{π/2} Π_l M_γl(−1/sin²θ) dθ
 * </pre>
 * (Craig's form of Q(√(2γ)) averaged over independent branch SNRs), integrated numerically with
 * Commons Math.
 *
 * <p>The Monte Carlo sends one BPSK symbol per channel draw, so the error count is binomial with
 * the true P_b; we accept |p̂ − P_b| ≤ 4.5·√(P_b(1 − P_b)/n), a two-sided normal interval that a
 * correct simulation leaves with probability below 1e-5.
 */
class DiversityBerTest {

    private static final int TRIALS = 200_000;
    private static final double Z = 4.5;

    private static double fromDb(double db) {
        return Math.pow(10.0, 0.1 * db);
    }

    /** (1/π)∫_0^{π/2} mgfProduct(−1/sin²θ) dθ. */
    private static double mgfBer(DoubleUnaryOperator mgfProduct) {
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-14);
        return integrator.integrate(100_000, theta -> {
            double s = Math.sin(theta);
            return s == 0.0 ? 0.0 : mgfProduct.applyAsDouble(-1.0 / (s * s));
        }, 0.0, 0.5 * Math.PI) / Math.PI;
    }

    /** Rician branch MGF (Simon and Alouini, Table 2.2): (1+K)/(1+K−sγ̄)·exp(Ksγ̄/(1+K−sγ̄)). */
    private static double ricianMgf(double s, double k, double gammaBar) {
        double d = 1.0 + k - s * gammaBar;
        return (1.0 + k) / d * Math.exp(k * s * gammaBar / d);
    }

    /** Nakagami-m branch MGF (Simon and Alouini, Table 2.2): (1 − sγ̄/m)^{−m}. */
    private static double nakagamiMgf(double s, double m, double gammaBar) {
        return Math.pow(1.0 - s * gammaBar / m, -m);
    }

    /**
     * Bit error rate of BPSK + MRC over the entries of H (all Nr·Mt of them taken as branches):
     * y_l = h_l·b + n_l with n_l ~ CN(0, n0), decide sign Re(Σ conj(h_l)·y_l).
     */
    private static double monteCarlo(FadingModel model, int nr, int mt, double gammaBar, long seed) {
        int branches = nr * mt;
        Draws draws = Draws.of(seed);
        double n0 = 1.0 / gammaBar;
        double[] h = new double[2 * branches];
        double[] x = new double[2];
        double[] y = new double[2 * branches];
        long errors = 0;
        for (int i = 0; i < TRIALS; i++) {
            model.draw(draws, nr, mt, h);
            double bit = draws.uniform().nextBoolean() ? 1.0 : -1.0;
            x[0] = bit;
            // the Nr x Mt matrix read as an (Nr·Mt) x 1 column: every entry is one branch
            MimoChannel.apply(h, branches, 1, x, 0, 1, n0, draws, y, 0);
            double z = 0.0;
            for (int l = 0; l < branches; l++) {
                z += h[2 * l] * y[2 * l] + h[2 * l + 1] * y[2 * l + 1];
            }
            if (z * bit < 0.0) {
                errors++;
            }
        }
        return (double) errors / TRIALS;
    }

    /** The Monte Carlo of {@code model} against the MGF integral of {@code mgfProduct}. */
    private static void assertMrc(FadingModel model, int nr, int mt, double gammaBar,
                                  DoubleUnaryOperator mgfProduct, long seed, String what) {
        assertWithinInterval(mgfBer(mgfProduct), monteCarlo(model, nr, mt, gammaBar, seed), what);
    }

    private static void assertWithinInterval(double expected, double measured, String what) {
        double tolerance = Z * Math.sqrt(expected * (1.0 - expected) / TRIALS);
        assertEquals(expected, measured, tolerance, what);
    }

    @Test
    void ricianBranches() {
        assertRician(2.0, 2, 5.0);
        assertRician(5.0, 1, 8.0);
        assertRician(0.5, 3, 2.0);
    }

    private static void assertRician(double k, int branches, double snrDb) {
        double gammaBar = fromDb(snrDb);
        assertMrc(new RicianFading(k), branches, 1, gammaBar, s -> Math.pow(ricianMgf(s, k, gammaBar), branches),
                11, "Rician K=" + k + ", L=" + branches);
    }

    @Test
    void nakagamiBranches() {
        assertNakagami(0.7, 2, 6.0);
        assertNakagami(2.5, 2, 3.0);
        assertNakagami(0.5, 1, 10.0);
    }

    private static void assertNakagami(double m, int branches, double snrDb) {
        double gammaBar = fromDb(snrDb);
        assertMrc(new NakagamiFading(m), branches, 1, gammaBar, s -> Math.pow(nakagamiMgf(s, m, gammaBar), branches),
                12, "Nakagami m=" + m + ", L=" + branches);
    }

    /**
     * Nakagami m = 1 is Rayleigh: the MGF integral equals the closed form for L-branch MRC
     * (J. G. Proakis and M. Salehi, Digital Communications, 5th ed., 2008, Sec. 13.4, section number
     * from memory; modem's ErrorRates), and so does the Monte Carlo over our Nakagami model.
     */
    @Test
    void nakagamiOneIsRayleigh() {
        int branches = 3;
        double gammaBar = fromDb(4.0);
        double closedForm = ErrorRates.rayleighMrcBpskBitErrorRate(branches, gammaBar);
        double integral = mgfBer(s -> Math.pow(nakagamiMgf(s, 1.0, gammaBar), branches));
        assertEquals(closedForm, integral, 1e-9 * closedForm);
        assertWithinInterval(closedForm, monteCarlo(new NakagamiFading(1.0), branches, 1, gammaBar, 13),
                "Nakagami m=1");
    }

    /**
     * Correlated Rayleigh branches h ~ CN(0, R): Σ|h_l|² = Σ λ_i |w_i|² with w independent CN(0, 1)
     * and λ_i the eigenvalues of R (Simon and Alouini, Sec. 9.6; from memory), so the MGF is
     * Π_i (1 − sγ̄λ_i)^{−1}. Eigenvalues by Commons Math. Receive correlation alone (3 x 1), and a
     * 2 x 2 Kronecker channel whose 4 entries have covariance R_rx ⊗ R_tx.
     */
    @Test
    void correlatedRayleighBranches() {
        double gammaBar = fromDb(5.0);
        double[][] rx3 = exponential(3, 0.7);
        FadingModel receive = new RayleighFading(KroneckerCorrelation.exponential(3, 1, 0.7, 0.0));
        assertMrc(receive, 3, 1, gammaBar, eigenvalueMgf(eigenvalues(rx3), gammaBar), 14, "rx-corr 0.7, 3 x 1");

        double[][] rx = exponential(2, 0.5);
        double[][] tx = exponential(2, -0.8);
        double[][] kron = new double[4][4];
        for (int r = 0; r < 2; r++) {
            for (int t = 0; t < 2; t++) {
                for (int r2 = 0; r2 < 2; r2++) {
                    for (int t2 = 0; t2 < 2; t2++) {
                        kron[r * 2 + t][r2 * 2 + t2] = rx[r][r2] * tx[t][t2];
                    }
                }
            }
        }
        FadingModel both = new RayleighFading(KroneckerCorrelation.exponential(2, 2, 0.5, -0.8));
        assertMrc(both, 2, 2, gammaBar, eigenvalueMgf(eigenvalues(kron), gammaBar), 15, "Kronecker 2 x 2");
    }

    private static DoubleUnaryOperator eigenvalueMgf(double[] lambda, double gammaBar) {
        return s -> {
            double p = 1.0;
            for (double l : lambda) {
                p /= 1.0 - s * gammaBar * l;
            }
            return p;
        };
    }

    /** r^{|i−j|}, written out here from the definition. */
    private static double[][] exponential(int n, double r) {
        double[][] m = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                m[i][j] = Math.pow(r, Math.abs(i - j));
            }
        }
        return m;
    }

    private static double[] eigenvalues(double[][] symmetric) {
        return new EigenDecomposition(new Array2DRowRealMatrix(symmetric)).getRealEigenvalues();
    }
}
