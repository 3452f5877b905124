package org.fadebench.coding.stbc;

import org.ejml.data.DMatrixRMaj;

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
    private final double[][] a;
    private final double[][] b;

    EffectiveChannel(SpaceTimeCode code, int nr) {
        SpaceTimeCode.checkReceiveAntennas(nr);
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
    }

    /** Length of one block's received vector y. */
    int blockLength() {
        return 2 * t * nr;
    }

    /** Recomputes F for the channel h (Nr x Mt interleaved complex, row-major). */
    void fill(double[] h) {
        for (int i = 0; i < k; i++) {
            fillColumn(h, a[i], 2 * i);
            fillColumn(h, b[i], 2 * i + 1);
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

    /** Copies block {@code blk} of the receive grid (blocks from row {@code yRow}) into {@code y}. */
    void loadBlock(double[] yGrid, int yRow, int blk, DMatrixRMaj y) {
        System.arraycopy(yGrid, 2 * (yRow + blk * t) * nr, y.data, 0, blockLength());
    }
}
