package org.fadebench.coding.stbc;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.ejml.dense.row.SingularOps_DDRM;

/**
 * Numerical checks of a code's structure, made on its dispersion matrices with fixed-seed random
 * symbols so the answer is repeatable. Not for the hot path: these allocate.
 */
final class CodeChecks {

    private static final int TRIALS = 20;
    private static final double RELATIVE_TOLERANCE = 1e-9;

    private CodeChecks() {
    }

    /**
     * True when X^H X = c·(Σ_k |s_k|²)·I with one constant c > 0, checked on {@value #TRIALS}
     * random complex Gaussian symbol vectors (definition of a complex orthogonal design: V. Tarokh,
     * H. Jafarkhani and A. R. Calderbank, IEEE Trans. Inf. Theory 45(5), 1999). Both sides are
     * quadratic forms in the symbols, so random vectors find any mismatch with probability 1.
     */
    static boolean orthogonal(SpaceTimeCode code) {
        int mt = code.transmitAntennas();
        int k = code.symbolsPerBlock();
        int t = code.slotsPerBlock();
        Random rnd = new Random(0x5EED_0001L);
        double[] s = new double[2 * k];
        ZMatrixRMaj x = new ZMatrixRMaj(t, mt);
        ZMatrixRMaj gram = new ZMatrixRMaj(mt, mt);
        double c = Double.NaN;
        for (int trial = 0; trial < TRIALS; trial++) {
            double energy = 0;
            for (int i = 0; i < 2 * k; i++) {
                s[i] = rnd.nextGaussian();
                energy += s[i] * s[i];
            }
            code.encodeGeneral(s, 0, 1, x.data, 0);
            CommonOps_ZDRM.multTransA(x, x, gram);
            double trace = 0;
            for (int i = 0; i < mt; i++) {
                trace += gram.getReal(i, i);
            }
            if (trial == 0) {
                c = trace / (mt * energy);
                if (!(c > 0)) {
                    return false;
                }
            }
            double target = c * energy;
            double tol = RELATIVE_TOLERANCE * target;
            for (int i = 0; i < mt; i++) {
                for (int j = 0; j < mt; j++) {
                    if (Math.abs(gram.getReal(i, j) - (i == j ? target : 0.0)) > tol
                            || Math.abs(gram.getImag(i, j)) > tol) {
                        return false;
                    }
                }
            }
        }
        return true;
    }

    /**
     * The rank criterion (V. Tarokh, N. Seshadri and A. R. Calderbank, "Space-time codes for high
     * data rate wireless communication: performance criterion and code construction", IEEE Trans.
     * Inf. Theory 44(2), 1998): full diversity needs every difference X(s) − X(s') of distinct
     * code words to have rank Mt. For a linear code the difference is X(d) with d = s − s', so this
     * checks that X(d) has rank Mt for each single-symbol difference (d = e_k and d = j·e_k, i.e.
     * every A_k and B_k on its own) and for {@value #TRIALS} random complex Gaussian d. Codes with
     * T < Mt fail at once. Passing is necessary for full diversity with every constellation, not
     * sufficient: a particular constellation may still hold a rank-deficient difference.
     */
    static boolean fullDiversity(SpaceTimeCode code) {
        int mt = code.transmitAntennas();
        int k = code.symbolsPerBlock();
        int t = code.slotsPerBlock();
        if (t < mt) {
            return false;
        }
        for (int i = 0; i < k; i++) {
            if (!fullRank(code.realDispersion(i), t, mt) || !fullRank(code.imagDispersion(i), t, mt)) {
                return false;
            }
        }
        Random rnd = new Random(0x5EED_0002L);
        double[] d = new double[2 * k];
        double[] x = new double[2 * t * mt];
        for (int trial = 0; trial < TRIALS; trial++) {
            for (int i = 0; i < 2 * k; i++) {
                d[i] = rnd.nextGaussian();
            }
            code.encodeGeneral(d, 0, 1, x, 0);
            if (!fullRank(x, t, mt)) {
                return false;
            }
        }
        return true;
    }

    /**
     * Whether the complex T x Mt matrix m has rank Mt, through its real 2T x 2Mt form
     * [[Re, −Im], [Im, Re]], whose rank is twice the complex rank: the smallest of its 2Mt singular
     * values must exceed {@value #RELATIVE_TOLERANCE} times the largest.
     */
    private static boolean fullRank(double[] m, int t, int mt) {
        DMatrixRMaj real = new DMatrixRMaj(2 * t, 2 * mt);
        for (int r = 0; r < t; r++) {
            for (int c = 0; c < mt; c++) {
                double re = m[2 * (r * mt + c)];
                double im = m[2 * (r * mt + c) + 1];
                real.set(r, c, re);
                real.set(r, mt + c, -im);
                real.set(t + r, c, im);
                real.set(t + r, mt + c, re);
            }
        }
        double[] sv = SingularOps_DDRM.singularValues(real);
        double max = 0;
        double min = Double.POSITIVE_INFINITY;
        for (double v : sv) {
            max = Math.max(max, v);
            min = Math.min(min, v);
        }
        return sv.length == 2 * mt && max > 0 && min > RELATIVE_TOLERANCE * max;
    }
}
