package org.fadebench.channel;

import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.ejml.dense.row.decompose.chol.CholeskyDecompositionInner_ZDRM;

/**
 * Monte Carlo outage of the Mt x Nr MIMO channel with Gaussian inputs, equal power on the transmit
 * antennas and no channel knowledge at the transmitter: the channel is in outage when
 * {@code log2 det(I + snr/Mt · H Hᴴ) < R} (E. Telatar, "Capacity of multi-antenna Gaussian
 * channels", Eur. Trans. Telecommun. 10(6), 1999).
 *
 * <p>The determinant is taken over the smaller of H Hᴴ and Hᴴ H (equal by Sylvester's identity
 * det(I + AB) = det(I + BA)), by an EJML complex Cholesky factorisation I + c·G = L Lᴴ, so that
 * log det = 2 Σ ln L_ii. The fading model draws straight into the EJML matrix (both use
 * interleaved row-major complex storage), and nothing is allocated per draw.
 *
 * <p>A simulator holds working matrices: use one per thread.
 */
public final class MimoOutageSimulator {

    private static final double LN2 = Math.log(2.0);

    private final FadingModel fading;
    private final int nr;
    private final int mt;
    private final int size;
    private final ZMatrixRMaj h;
    private final ZMatrixRMaj gram;
    private final CholeskyDecompositionInner_ZDRM cholesky = new CholeskyDecompositionInner_ZDRM(true);

    /**
     * A simulator for {@code nr} receive and {@code mt} transmit antennas over {@code fading}.
     *
     * @throws IllegalArgumentException if an antenna count is outside 1..64
     */
    public MimoOutageSimulator(FadingModel fading, int nr, int mt) {
        Antennas.check(nr, mt);
        this.fading = fading;
        this.nr = nr;
        this.mt = mt;
        this.size = Math.min(mt, nr);
        this.h = new ZMatrixRMaj(nr, mt);
        this.gram = new ZMatrixRMaj(size, size);
    }

    /**
     * log2 det(I + snr/Mt · H Hᴴ) of the channel {@code channel} (Nr x Mt, interleaved row-major as
     * drawn by a {@link FadingModel}) at linear SNR {@code snr}.
     */
    public double bits(double[] channel, double snr) {
        if (channel.length != h.data.length) {
            throw new IllegalArgumentException("channel must hold 2·Nr·Mt = " + h.data.length
                    + " numbers, got " + channel.length);
        }
        if (!(snr >= 0.0 && snr < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("linear SNR must be finite and >= 0, got " + snr);
        }
        System.arraycopy(channel, 0, h.data, 0, channel.length);
        return currentBits(snr);
    }

    /**
     * Counts outages at rate {@code spectralEfficiency} (bits per channel use) over {@code draws}
     * channel draws of the stream {@code Draws.of(seed)}. Every SNR point uses the same channel
     * draws for the same seed, so an SNR sweep is monotone and reproducible.
     */
    public OutageEstimate estimate(double snrDb, double spectralEfficiency, int draws, long seed) {
        return estimate(snrDb, spectralEfficiency, draws, seed, () -> false);
    }

    /**
     * As {@link #estimate(double, double, int, long)}, polling {@code stop} every 1024 draws.
     *
     * @throws CancellationException when {@code stop} turns true
     */
    public OutageEstimate estimate(double snrDb, double spectralEfficiency, int draws, long seed,
                                   BooleanSupplier stop) {
        OutageBounds.checkSnrDb(snrDb);
        OutageBounds.checkSpectralEfficiency(spectralEfficiency);
        OutageBounds.checkDraws(draws);
        double snr = Math.pow(10.0, 0.1 * snrDb);
        Draws stream = Draws.of(seed);
        int outages = 0;
        for (int i = 0; i < draws; i++) {
            if ((i & 1023) == 0 && stop.getAsBoolean()) {
                throw new CancellationException("outage bound stopped");
            }
            fading.draw(stream, nr, mt, h.data);
            if (currentBits(snr) < spectralEfficiency) {
                outages++;
            }
        }
        return OutageEstimate.counted(outages, draws);
    }

    private double currentBits(double snr) {
        if (nr <= mt) {
            CommonOps_ZDRM.multTransB(h, h, gram);
        } else {
            CommonOps_ZDRM.multTransA(h, h, gram);
        }
        double c = snr / mt;
        double[] g = gram.data;
        for (int i = 0; i < g.length; i++) {
            g[i] *= c;
        }
        for (int i = 0; i < size; i++) {
            g[2 * (i * size + i)] += 1.0;
        }
        if (!cholesky.decompose(gram)) {
            throw new IllegalStateException("I + snr/Mt·H Hᴴ is not positive definite; snr = " + snr);
        }
        double[] t = cholesky._getT().data;
        double logDet = 0.0;
        for (int i = 0; i < size; i++) {
            logDet += Math.log(t[2 * (i * size + i)]);
        }
        return 2.0 * logDet / LN2;
    }
}
