package org.fadebench.coding.stbc;

import java.util.Arrays;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * Zero-forcing and linear MMSE decoding on the real effective channel F ({@link EffectiveChannel}),
 * for codes that are not orthogonal. Both are one formula with a regulariser λ:
 * <pre>
 *   M = (FᵀF + λ I)⁻¹,   u = M Fᵀ y,   λ = 0 (ZF) or λ = n0 (MMSE)
 * </pre>
 * MMSE: the symbols' real and imaginary parts v_i are taken as independent with variance 1/2
 * (unit-energy symbols) and the noise entries have variance n0/2, so the linear MMSE estimate of v
 * has regulariser (n0/2)/(1/2) = n0. It is biased, E[u_i | v_i] = β_i v_i with
 * β_i = [M FᵀF]_ii = 1 − λ M_ii, and is divided by β_i so that, as the {@link Combiner} contract
 * asks, each estimate is centred on its symbol. The unbiased estimate's error, noise plus the
 * other symbols' residual interference, has variance (n0/2)·M_ii/β_i, which is σ_v²/SINR_i with
 * the unbiased MMSE SINR_i = 1/(λ M_ii) − 1 (see e.g. D. Tse and P. Viswanath, Fundamentals of
 * Wireless Communication, 2005, Sec. 8.3.3; from memory). ZF (λ = 0, β_i = 1) leaves no
 * interference and noise variance (n0/2)·M_ii.
 *
 * <p>Gain: summing the real and imaginary parts, the complex error variance of symbol k is
 * (n0/2)(M_aa/β_a + M_bb/β_b), so the reported gain is g_k = 2 / (M_aa/β_a + M_bb/β_b) and the
 * post-combining SINR is g_k / n0. Treating the residual interference as Gaussian noise in that
 * figure is an approximation (exact for ZF). For an orthogonal code both decoders reduce to the
 * matched filter, estimates and gains alike.
 *
 * <p>The inverse is factored once per {@link #setChannel} (Cholesky, EJML); nothing is allocated
 * after construction. A channel on which FᵀF + λI is not positive definite (e.g. all zero) yields
 * zero estimates and zero gains until the next channel.
 */
public final class LinearEqualiser implements Combiner {

    private final EffectiveChannel channel;
    private final int k;
    private final double lambda;
    private final LinearSolverDense<DMatrixRMaj> solver;
    private final DMatrixRMaj gram;
    private final DMatrixRMaj inverse;
    private final DMatrixRMaj w;
    private final DMatrixRMaj y;
    private final DMatrixRMaj z;
    private final double[] unbias;
    private final double[] errorScale;
    private final double[] gain;

    private LinearEqualiser(SpaceTimeCode code, int nr, double lambda, Equaliser equaliser) {
        this.channel = new EffectiveChannel(code, nr);
        this.k = code.symbolsPerBlock();
        this.lambda = lambda;
        int t = code.slotsPerBlock();
        if (lambda == 0 && t * nr < k) {
            throw new IllegalArgumentException("decoder " + equaliser.cliName() + " cannot separate the "
                    + k + " symbols of code " + code.name() + " from " + t + " slot(s) x " + nr
                    + " receive antenna(s); valid: at least " + ((k + t - 1) / t)
                    + " receive antennas, or decoder mf or mmse with n0 > 0");
        }
        this.solver = LinearSolverFactory_DDRM.symmPosDef(2 * k);
        this.gram = new DMatrixRMaj(2 * k, 2 * k);
        this.inverse = new DMatrixRMaj(2 * k, 2 * k);
        this.w = new DMatrixRMaj(2 * k, channel.blockLength());
        this.y = new DMatrixRMaj(channel.blockLength(), 1);
        this.z = new DMatrixRMaj(2 * k, 1);
        this.unbias = new double[2 * k];
        this.errorScale = new double[2 * k];
        this.gain = new double[k];
    }

    /** Zero forcing: (FᵀF)⁻¹Fᵀy; needs T·Nr ≥ K. */
    public static LinearEqualiser zeroForcing(SpaceTimeCode code, int nr) {
        return new LinearEqualiser(code, nr, 0.0, Equaliser.ZF);
    }

    /**
     * Unbiased linear MMSE for noise density {@code n0} (complex noise variance per receive entry,
     * the same n0 the link adds). n0 = 0 gives zero forcing.
     */
    public static LinearEqualiser mmse(SpaceTimeCode code, int nr, double n0) {
        checkNoise(n0);
        return new LinearEqualiser(code, nr, n0, Equaliser.MMSE);
    }

    static void checkNoise(double n0) {
        if (!(n0 >= 0) || Double.isInfinite(n0)) {
            throw new IllegalArgumentException("noise density n0 for the mmse decoder must be finite and"
                    + " not negative, got " + n0 + "; valid: n0 >= 0");
        }
    }

    @Override
    public void setChannel(double[] h) {
        channel.fill(h);
        CommonOps_DDRM.multInner(channel.f, gram);
        for (int i = 0; i < 2 * k; i++) {
            gram.unsafe_set(i, i, gram.unsafe_get(i, i) + lambda);
        }
        if (!solver.setA(gram)) {
            w.zero();
            Arrays.fill(unbias, 0.0);
            Arrays.fill(gain, 0.0);
            return;
        }
        solver.invert(inverse);
        CommonOps_DDRM.multTransB(inverse, channel.f, w);
        for (int i = 0; i < 2 * k; i++) {
            double m = inverse.unsafe_get(i, i);
            double beta = 1.0 - lambda * m;
            unbias[i] = beta > 0 ? 1.0 / beta : 0.0;
            errorScale[i] = beta > 0 ? m / beta : Double.POSITIVE_INFINITY;
        }
        for (int i = 0; i < k; i++) {
            gain[i] = 2.0 / (errorScale[2 * i] + errorScale[2 * i + 1]);
        }
    }

    @Override
    public void combine(double[] yGrid, int yRow, int blocks, double[] estimates, double[] gainOut,
                        int symOffset) {
        for (int blk = 0; blk < blocks; blk++) {
            channel.loadBlock(yGrid, yRow, blk, y);
            CommonOps_DDRM.mult(w, y, z);
            int so = symOffset + blk * k;
            for (int i = 0; i < k; i++) {
                estimates[2 * (so + i)] = z.data[2 * i] * unbias[2 * i];
                estimates[2 * (so + i) + 1] = z.data[2 * i + 1] * unbias[2 * i + 1];
                gainOut[so + i] = gain[i];
            }
        }
    }
}
