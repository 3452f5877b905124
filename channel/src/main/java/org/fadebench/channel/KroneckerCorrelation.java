package org.fadebench.channel;

import java.io.Serializable;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.mult.MatrixMatrixMult_ZDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * Kronecker spatial correlation of an Nr x Mt channel: H = R_rx^{1/2} · H_w · (R_tx^{1/2})ᵀ, where
 * H_w has independent CN(0, 1) entries and R^{1/2} is the Hermitian positive semidefinite square
 * root (R^{1/2} R^{1/2} = R). Then E[h_rt · conj(h_r't')] = R_rx(r, r') · R_tx(t, t'): R_rx is the
 * correlation between receive antennas seen from one transmit antenna, R_tx the correlation between
 * transmit antennas seen at one receive antenna (D.-S. Shiu, G. J. Foschini, M. J. Gans and J. M.
 * Kahn, "Fading correlation and its effect on the capacity of multielement antenna systems", IEEE
 * Trans. Commun. 48(3), 2000; from memory).
 *
 * <p>Correlation matrices are complex Hermitian, positive semidefinite, with a unit diagonal (so
 * E|h_rt|² = 1 is kept), interleaved row-major like H. The exponential profile
 * R(i, j) = r^{i−j} for i ≥ j and conj(r)^{j−i} for i &lt; j, with |r| &lt; 1, is built in
 * (S. L. Loyka, "Channel capacity of MIMO architecture using the exponential correlation matrix",
 * IEEE Commun. Lett. 5(9), 2001; from memory).
 *
 * <p>The square roots are computed once, at construction, from a symmetric eigendecomposition (EJML)
 * of the real 2n x 2n form [[Re R, −Im R], [Im R, Re R]], whose square root is the real form of
 * R^{1/2}. This also covers singular matrices (e.g. fully correlated antennas), where a Cholesky
 * factor does not exist.
 *
 * <p>An instance holds work matrices: use one per thread.
 */
public final class KroneckerCorrelation implements Serializable {

    /** Tolerance for the Hermitian, unit-diagonal and eigenvalue checks (entries are at most 1). */
    private static final double TOLERANCE = 1e-9;

    private final int nr;
    private final int mt;
    /** R_rx^{1/2} (Nr x Nr), or null for no receive correlation. */
    private final ZMatrixRMaj rxRoot;
    /** (R_tx^{1/2})ᵀ (Mt x Mt, transposed without conjugation), or null for no transmit correlation. */
    private final ZMatrixRMaj txRootTransposed;
    /** Work matrices, Nr x Mt: H, R_rx^{1/2} · H, and the correlated H. */
    private final ZMatrixRMaj channel;
    private final ZMatrixRMaj left;
    private final ZMatrixRMaj both;

    private KroneckerCorrelation(int nr, int mt, ZMatrixRMaj rxRoot, ZMatrixRMaj txRootTransposed) {
        this.nr = nr;
        this.mt = mt;
        this.rxRoot = rxRoot;
        this.txRootTransposed = txRootTransposed;
        this.channel = new ZMatrixRMaj(nr, mt);
        this.left = new ZMatrixRMaj(nr, mt);
        this.both = new ZMatrixRMaj(nr, mt);
    }

    /** No correlation: H = H_w. */
    public static KroneckerCorrelation identity(int nr, int mt) {
        Antennas.check(nr, mt);
        return new KroneckerCorrelation(nr, mt, null, null);
    }

    /**
     * Exponential profiles with real coefficients {@code rxCoefficient} and {@code txCoefficient}
     * in (−1, 1); a coefficient of 0 means no correlation on that side.
     */
    public static KroneckerCorrelation exponential(int nr, int mt, double rxCoefficient, double txCoefficient) {
        Antennas.check(nr, mt);
        double[] rx = rxCoefficient == 0.0 ? null : exponentialMatrix(nr, rxCoefficient, 0.0);
        double[] tx = txCoefficient == 0.0 ? null : exponentialMatrix(mt, txCoefficient, 0.0);
        return of(nr, mt, rx, tx);
    }

    /**
     * Full correlation matrices given by the caller: {@code rx} of Nr x Nr and {@code tx} of Mt x Mt
     * complex entries (interleaved row-major, 2n² numbers), or null for no correlation on that side.
     *
     * @throws IllegalArgumentException naming the matrix and the problem when a matrix has the wrong
     *     size, a non-finite entry, is not Hermitian, has a diagonal entry other than 1, or is not
     *     positive semidefinite
     */
    public static KroneckerCorrelation of(int nr, int mt, double[] rx, double[] tx) {
        Antennas.check(nr, mt);
        return new KroneckerCorrelation(nr, mt,
                rx == null ? null : squareRoot("rx correlation matrix", rx, nr),
                tx == null ? null : CommonOps_ZDRM.transpose(squareRoot("tx correlation matrix", tx, mt), null));
    }

    /**
     * The n x n exponential correlation matrix of complex coefficient r = re + j·im, |r| &lt; 1:
     * R(i, j) = r^{i−j} for i ≥ j and conj(r)^{j−i} for i &lt; j.
     */
    public static double[] exponentialMatrix(int n, double re, double im) {
        if (!(Math.hypot(re, im) < 1.0)) {
            throw new IllegalArgumentException("exponential correlation coefficient must have |r| < 1, got "
                    + re + (im < 0 ? "" : "+") + im + "j");
        }
        double[] m = new double[2 * n * n];
        double pr = 1.0;
        double pi = 0.0;
        for (int d = 0; d < n; d++) {
            for (int i = d; i < n; i++) {
                int below = 2 * (i * n + i - d);
                m[below] = pr;
                m[below + 1] = pi;
                int above = 2 * ((i - d) * n + i);
                m[above] = pr;
                m[above + 1] = -pi;
            }
            double nextRe = pr * re - pi * im;
            pi = pr * im + pi * re;
            pr = nextRe;
        }
        return m;
    }

    /** The same correlation with its own work matrices, for another thread. */
    public KroneckerCorrelation copy() {
        return new KroneckerCorrelation(nr, mt, rxRoot, txRootTransposed);
    }

    public int nr() {
        return nr;
    }

    public int mt() {
        return mt;
    }

    /** True when neither side is correlated. */
    public boolean isIdentity() {
        return rxRoot == null && txRootTransposed == null;
    }

    /**
     * Replaces the Nr x Mt matrix at {@code h[off]} by R_rx^{1/2} · H · (R_tx^{1/2})ᵀ. Allocates
     * nothing. The products are EJML's {@code mult_small}: its sum runs in one fixed order for every
     * size (see the contributor guide, "Complex matrix products").
     */
    public void correlate(double[] h, int off) {
        if (isIdentity()) {
            return;
        }
        System.arraycopy(h, off, channel.data, 0, channel.data.length);
        ZMatrixRMaj m = channel;
        if (rxRoot != null) {
            MatrixMatrixMult_ZDRM.mult_small(rxRoot, m, left);
            m = left;
        }
        if (txRootTransposed != null) {
            MatrixMatrixMult_ZDRM.mult_small(m, txRootTransposed, both);
            m = both;
        }
        System.arraycopy(m.data, 0, h, off, m.data.length);
    }

    /** Throws unless this correlation is for an {@code nr} x {@code mt} channel. */
    void checkShape(int nr, int mt) {
        if (nr != this.nr || mt != this.mt) {
            throw new IllegalArgumentException("correlation is for Nr x Mt = " + this.nr + " x " + this.mt
                    + ", not " + nr + " x " + mt);
        }
    }

    /** Validates {@code m} (n x n) and returns its Hermitian positive semidefinite square root. */
    private static ZMatrixRMaj squareRoot(String what, double[] m, int n) {
        if (m.length != 2 * n * n) {
            throw new IllegalArgumentException(what + " must be " + n + " x " + n + " (" + 2 * n * n
                    + " numbers, re and im interleaved), got " + m.length + " numbers");
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double re = m[2 * (i * n + j)];
                double im = m[2 * (i * n + j) + 1];
                if (!Double.isFinite(re) || !Double.isFinite(im)) {
                    throw new IllegalArgumentException(what + " entry (" + i + ", " + j + ") is not finite");
                }
                double cre = m[2 * (j * n + i)];
                double cim = -m[2 * (j * n + i) + 1];
                if (Math.abs(re - cre) > TOLERANCE || Math.abs(im - cim) > TOLERANCE) {
                    throw new IllegalArgumentException(what + " must be Hermitian: entry (" + i + ", " + j
                            + ") = " + complex(re, im) + " but conj of (" + j + ", " + i + ") = " + complex(cre, cim));
                }
            }
            if (Math.abs(m[2 * (i * n + i)] - 1.0) > TOLERANCE) {
                throw new IllegalArgumentException(what + " must have a unit diagonal (E|h|² = 1): entry ("
                        + i + ", " + i + ") = " + complex(m[2 * (i * n + i)], m[2 * (i * n + i) + 1]));
            }
        }
        // real form [[Re, -Im], [Im, Re]] of the (symmetrised) matrix
        DMatrixRMaj real = new DMatrixRMaj(2 * n, 2 * n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double re = 0.5 * (m[2 * (i * n + j)] + m[2 * (j * n + i)]);
                double im = 0.5 * (m[2 * (i * n + j) + 1] - m[2 * (j * n + i) + 1]);
                real.set(i, j, re);
                real.set(i + n, j + n, re);
                real.set(i, j + n, -im);
                real.set(i + n, j, im);
            }
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(2 * n, true, true);
        if (!eig.decompose(real)) {
            throw new IllegalArgumentException(what + ": eigendecomposition failed");
        }
        DMatrixRMaj root = new DMatrixRMaj(2 * n, 2 * n);
        for (int k = 0; k < 2 * n; k++) {
            double lambda = eig.getEigenvalue(k).getReal();
            if (lambda < -TOLERANCE * n) {
                throw new IllegalArgumentException(what + " must be positive semidefinite: it has the eigenvalue "
                        + lambda);
            }
            double s = Math.sqrt(Math.max(lambda, 0.0));
            DMatrixRMaj v = eig.getEigenVector(k);
            for (int i = 0; i < 2 * n; i++) {
                for (int j = 0; j < 2 * n; j++) {
                    root.add(i, j, s * v.get(i) * v.get(j));
                }
            }
        }
        ZMatrixRMaj out = new ZMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                out.set(i, j, root.get(i, j), root.get(i + n, j));
            }
        }
        return out;
    }

    private static String complex(double re, double im) {
        return re + (im < 0 || Double.isNaN(im) ? "" : "+") + im + "j";
    }
}
