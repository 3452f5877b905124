package org.fadebench.coding.stbc;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

/**
 * The general matched-filter combiner on the real effective channel F ({@link EffectiveChannel}),
 * built with EJML: it forms z = Fᵀ y and divides by the diagonal of FᵀF. For an orthogonal code
 * FᵀF is a multiple of the identity, so this is the maximum-likelihood front end and symbol-wise
 * slicing of its output is exact ML (V. Tarokh, H. Jafarkhani and A. R. Calderbank, "Space-time
 * block codes from orthogonal designs", IEEE Trans. Inf. Theory 45(5), 1999). For other codes the
 * other symbols leak into each estimate; the gain counts only noise.
 *
 * <p>Gain: the real part's estimate has noise variance n0/(2 G_aa), the imaginary part's
 * n0/(2 G_bb), so the complex estimate has noise n0 (1/G_aa + 1/G_bb)/2 and the reported gain is
 * 2 / (1/G_aa + 1/G_bb) (equal to G_aa for an orthogonal code).
 */
public final class MatchedFilterCombiner implements Combiner {

    private final SpaceTimeCode code;
    private final EffectiveChannel channel;
    private final int k;
    private final DMatrixRMaj y;
    private final DMatrixRMaj z;
    private final double[] invDiag;
    private final double[] gain;

    public MatchedFilterCombiner(SpaceTimeCode code, int nr) {
        this.code = code;
        this.channel = new EffectiveChannel(code, nr);
        this.k = code.symbolsPerBlock();
        this.y = new DMatrixRMaj(channel.blockLength(), 1);
        this.z = new DMatrixRMaj(2 * k, 1);
        this.invDiag = new double[2 * k];
        this.gain = new double[k];
    }

    public SpaceTimeCode code() {
        return code;
    }

    /** The real effective channel F of the current channel (a view; do not modify). */
    public DMatrixRMaj effectiveChannel() {
        return channel.f;
    }

    @Override
    public void setChannel(double[] h) {
        channel.fill(h);
        channel.matchedFilterDiagonal(invDiag, gain);
    }

    @Override
    public void combine(double[] yGrid, int yRow, int blocks, double[] estimates, double[] gainOut,
                        int symOffset) {
        for (int blk = 0; blk < blocks; blk++) {
            channel.loadBlock(yGrid, yRow, blk, y);
            CommonOps_DDRM.multTransA(channel.f, y, z);
            int so = symOffset + blk * k;
            for (int i = 0; i < k; i++) {
                estimates[2 * (so + i)] = z.data[2 * i] * invDiag[2 * i];
                estimates[2 * (so + i) + 1] = z.data[2 * i + 1] * invDiag[2 * i + 1];
                gainOut[so + i] = gain[i];
            }
        }
    }
}
