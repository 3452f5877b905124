package org.fadebench.coding.stbc;

import org.ejml.data.DMatrixRMaj;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.ejml.dense.row.mult.MatrixMatrixMult_ZDRM;

/**
 * The real effective channel of a code over an Nr-antenna channel. Stacking a received block as a
 * real vector y (2·T·Nr entries, in the interleaved order of the receive grid: slot, then receive
 * antenna, then re/im) and the symbols as v = (a_1, b_1, …, a_K, b_K), the code and channel
 * together are y = F v + n with the real 2TNr x 2K matrix F whose columns are the received images
 * A_k Hᵀ and B_k Hᵀ. Shared by the general combiners; allocation-free after construction.
 */
final class EffectiveChannel {

    final int nr;
    final int mt;
    final int k;
    final int t;
    /** F for the current channel; rows 2TNr, columns 2K. */
    final DMatrixRMaj f;
    /** The dispersion matrices in the column order of F: A_1, B_1, …, A_K, B_K (T x Mt each). */
    private final ZMatrixRMaj[] dispersion;
    /** H (Nr x Mt), Hᵀ (Mt x Nr, not conjugated) and one received image D Hᵀ (T x Nr). */
    private final ZMatrixRMaj channel;
    private final ZMatrixRMaj channelTransposed;
    private final ZMatrixRMaj image;

    EffectiveChannel(SpaceTimeCode code, int nr) {
        SpaceTimeCode.checkReceiveAntennas(nr);
        this.nr = nr;
        this.mt = code.transmitAntennas();
        this.k = code.symbolsPerBlock();
        this.t = code.slotsPerBlock();
        this.dispersion = new ZMatrixRMaj[2 * k];
        for (int i = 0; i < k; i++) {
            dispersion[2 * i] = new ZMatrixRMaj(t, mt, true, code.realDispersion(i));
            dispersion[2 * i + 1] = new ZMatrixRMaj(t, mt, true, code.imagDispersion(i));
        }
        this.f = new DMatrixRMaj(2 * t * nr, 2 * k);
        this.channel = new ZMatrixRMaj(nr, mt);
        this.channelTransposed = new ZMatrixRMaj(mt, nr);
        this.image = new ZMatrixRMaj(t, nr);
    }

    /** Length of one block's received vector y. */
    int blockLength() {
        return 2 * t * nr;
    }

    /**
     * Recomputes F for the channel h (Nr x Mt interleaved complex, row-major). Column c of F is the
     * received image D Hᵀ of the c-th dispersion matrix D, whose interleaved entries (slot, receive
     * antenna, re/im) are the rows of y. The products are EJML's {@code mult_small}: its sum runs in
     * one fixed order for every size (see the contributor guide, "Complex matrix products").
     */
    void fill(double[] h) {
        System.arraycopy(h, 0, channel.data, 0, channel.data.length);
        CommonOps_ZDRM.transpose(channel, channelTransposed);
        for (int c = 0; c < dispersion.length; c++) {
            MatrixMatrixMult_ZDRM.mult_small(dispersion[c], channelTransposed, image);
            for (int row = 0; row < image.data.length; row++) {
                f.unsafe_set(row, c, image.data[row]);
            }
        }
    }

    /**
     * The inverse diagonal of FᵀF for the current F into {@code invDiag} (2K entries; 0 where a
     * column is zero) and each symbol's matched-filter gain 2 / (1/G_aa + 1/G_bb) into {@code gain}
     * (K entries; 0 where either is zero). The sums run over the rows of F in order.
     */
    void matchedFilterDiagonal(double[] invDiag, double[] gain) {
        for (int c = 0; c < 2 * k; c++) {
            double g = 0;
            for (int row = 0; row < f.numRows; row++) {
                double v = f.unsafe_get(row, c);
                g += v * v;
            }
            invDiag[c] = g;
        }
        invertDiagonal(invDiag, gain);
    }

    /**
     * Replaces the diagonal of FᵀF in {@code invDiag} by its inverse (0 where a column is zero) and
     * writes each symbol's matched-filter gain 2 / (1/G_aa + 1/G_bb) into {@code gain} (0 where
     * either is zero).
     */
    static void invertDiagonal(double[] invDiag, double[] gain) {
        for (int c = 0; c < invDiag.length; c++) {
            double g = invDiag[c];
            invDiag[c] = g > 0 ? 1.0 / g : 0.0;
        }
        for (int i = 0; i < gain.length; i++) {
            double ia = invDiag[2 * i];
            double ib = invDiag[2 * i + 1];
            gain[i] = ia > 0 && ib > 0 ? 2.0 / (ia + ib) : 0.0;
        }
    }

    /** Copies block {@code blk} of the receive grid (blocks from row {@code yRow}) into {@code y}. */
    void loadBlock(double[] yGrid, int yRow, int blk, DMatrixRMaj y) {
        System.arraycopy(yGrid, 2 * (yRow + blk * t) * nr, y.data, 0, blockLength());
    }
}
