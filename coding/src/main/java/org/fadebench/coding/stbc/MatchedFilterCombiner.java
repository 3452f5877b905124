package org.fadebench.coding.stbc;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

/**
 * The general matched-filter combiner on the real-valued effective channel, built with EJML.
 *
 * <p>Stacking the received block as a real vector y (2·T·Nr entries, in the interleaved order of
 * the receive grid) and the symbols as v = (a_1, b_1, …, a_K, b_K), the code and channel together
 * are y = F v + n with the real 2TNr x 2K matrix F whose columns are the received images of A_k
 * and B_k. The combiner forms z = Fᵀ y and divides by the diagonal of FᵀF. For an orthogonal code
 * FᵀF is a multiple of the identity, so this is the maximum-likelihood front end and symbol-wise
 * slicing of its output is exact ML (V. Tarokh, H. Jafarkhani and A. R. Calderbank, "Space-time
 * block codes from orthogonal designs", IEEE Trans. Inf. Theory 45(5), 1999).
 *
 * <p>Gain: the real part's estimate has noise variance n0/(2 G_aa), the imaginary part's
 * n0/(2 G_bb), so the complex estimate has noise n0 (1/G_aa + 1/G_bb)/2 and the reported gain is
 * 2 / (1/G_aa + 1/G_bb) (equal to G_aa for an orthogonal code).
 */
public final class MatchedFilterCombiner implements Combiner {

    private final SpaceTimeCode code;
    private final int nr;
    private final int mt;
    private final int k;
    private final int t;
    private final double[][] a;
    private final double[][] b;
    private final DMatrixRMaj f;
    private final DMatrixRMaj y;
    private final DMatrixRMaj z;
    private final double[] invDiag;
    private final double[] gain;

    public MatchedFilterCombiner(SpaceTimeCode code, int nr) {
        this.code = code;
        this.nr = nr;
        this.mt = code.transmitAntennas();
        this.k = code.symbolsPerBlock();
        this.t = code.slotsPerBlock();
        this.a = new double[k][];
        this.b = new double[k][];
        for (int i = 0; i < k; i++) {
            a[i] = code.realDispersion(i);
            b[i] = code.imagDispersion(i);
        }
        this.f = new DMatrixRMaj(2 * t * nr, 2 * k);
        this.y = new DMatrixRMaj(2 * t * nr, 1);
        this.z = new DMatrixRMaj(2 * k, 1);
        this.invDiag = new double[2 * k];
        this.gain = new double[k];
    }

    public SpaceTimeCode code() {
        return code;
    }

    /** The real effective channel F of the current channel (a view; do not modify). */
    public DMatrixRMaj effectiveChannel() {
        return f;
    }

    @Override
    public void setChannel(double[] h) {
        for (int i = 0; i < k; i++) {
            fillColumn(h, a[i], 2 * i);
            fillColumn(h, b[i], 2 * i + 1);
        }
        for (int c = 0; c < 2 * k; c++) {
            double g = 0;
            for (int row = 0; row < f.numRows; row++) {
                double v = f.unsafe_get(row, c);
                g += v * v;
            }
            invDiag[c] = g > 0 ? 1.0 / g : 0.0;
        }
        for (int i = 0; i < k; i++) {
            double ia = invDiag[2 * i];
            double ib = invDiag[2 * i + 1];
            gain[i] = ia > 0 && ib > 0 ? 2.0 / (ia + ib) : 0.0;
        }
    }

    /** Column c of F: the received image (D Hᵀ) of dispersion matrix D, split into re/im rows. */
    private void fillColumn(double[] h, double[] d, int c) {
        for (int s = 0; s < t; s++) {
            for (int r = 0; r < nr; r++) {
                double re = 0;
                double im = 0;
                for (int tx = 0; tx < mt; tx++) {
                    double dr = d[2 * (s * mt + tx)];
                    double di = d[2 * (s * mt + tx) + 1];
                    double hr = h[2 * (r * mt + tx)];
                    double hi = h[2 * (r * mt + tx) + 1];
                    re += dr * hr - di * hi;
                    im += dr * hi + di * hr;
                }
                int row = 2 * (s * nr + r);
                f.unsafe_set(row, c, re);
                f.unsafe_set(row + 1, c, im);
            }
        }
    }

    @Override
    public void combine(double[] yGrid, int yRow, int blocks, double[] estimates, double[] gainOut,
                        int symOffset) {
        int len = 2 * t * nr;
        for (int blk = 0; blk < blocks; blk++) {
            System.arraycopy(yGrid, 2 * (yRow + blk * t) * nr, y.data, 0, len);
            CommonOps_DDRM.multTransA(f, y, z);
            int so = symOffset + blk * k;
            for (int i = 0; i < k; i++) {
                estimates[2 * (so + i)] = z.data[2 * i] * invDiag[2 * i];
                estimates[2 * (so + i) + 1] = z.data[2 * i + 1] * invDiag[2 * i + 1];
                gainOut[so + i] = gain[i];
            }
        }
    }
}
