package org.fadebench.channel;

import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;
import java.util.function.DoubleUnaryOperator;

/**
 * Outage of a frame spread over F independent fading blocks (block fading with F blocks per
 * codeword). The frame is in outage when the information it sees, the channel-use weighted mean
 * of the blocks' information, falls below the rate: P(Σ_f w_f·I_f < R), w_f the share of the
 * frame's channel uses in block f (1/F when the blocks are equal). R. Knopp and P. A. Humblet,
 * "On coding for block fading channels", IEEE Trans. Inf. Theory 46(1), 2000; E. Malkamäki and
 * H. Leib, "Coded diversity on block-fading channels", IEEE Trans. Inf. Theory 45(2), 1999.
 *
 * <p>Three block informations are counted on the same draws, as {@link OutageBounds} defines them
 * for one block: the MIMO channel with Gaussian inputs, log2 det(I + snr/Mt·H Hᴴ); an orthogonal
 * space-time code of rate r with Gaussian symbols, r·log2(1 + γ); the same code with a finite
 * alphabet, r·I(γ); with γ = snr·‖H‖²_F/(Mt·r). Every SNR point restarts the stream
 * {@code Draws.of(seed)}, so all points see the same channels and the counted curves never rise
 * with SNR.
 *
 * <p>Holds working arrays: use one per thread.
 */
public final class BlockFadingOutage {

    private static final double LN2 = Math.log(2.0);

    /** The three counts of one SNR point. */
    public record Estimates(OutageEstimate mimo, OutageEstimate stbc, OutageEstimate qam) {
    }

    private final FadingModel fading;
    private final int nr;
    private final int mt;
    private final double[] weights;
    private final double[] h;
    private final MimoOutageSimulator mimo;

    /**
     * A frame of {@code frameSlots} channel uses in fading blocks of {@code blockSlots} (the last
     * block may be shorter) over {@code fading}, with {@code nr} x {@code mt} antennas.
     *
     * @throws IllegalArgumentException if an antenna count is outside 1..64 or a length is below 1
     */
    public BlockFadingOutage(FadingModel fading, int nr, int mt, int frameSlots, int blockSlots) {
        Antennas.check(nr, mt);
        if (frameSlots < 1 || blockSlots < 1) {
            throw new IllegalArgumentException("frame and block lengths must be >= 1 slot, got " + frameSlots
                    + " and " + blockSlots);
        }
        int blocks = (frameSlots + Math.min(blockSlots, frameSlots) - 1) / Math.min(blockSlots, frameSlots);
        this.weights = new double[blocks];
        for (int f = 0; f < blocks; f++) {
            int slots = Math.min(blockSlots, frameSlots - f * blockSlots);
            weights[f] = (double) slots / frameSlots;
        }
        this.fading = fading;
        this.nr = nr;
        this.mt = mt;
        this.h = new double[2 * nr * mt];
        this.mimo = new MimoOutageSimulator(fading, nr, mt);
    }

    /** Fading blocks per frame, F. */
    public int blocks() {
        return weights.length;
    }

    /**
     * Counts the outages of {@code frames} frames at rate {@code spectralEfficiency} (bits per
     * channel use). {@code bitsPerSymbol} is the alphabet's information curve I(γ) (increasing, at
     * most {@code maxBitsPerSymbol}); at R ≥ r·maxBitsPerSymbol the alphabet's outage is exactly 1.
     * {@code stop} is polled between frames.
     *
     * @throws CancellationException when {@code stop} turns true
     */
    public Estimates estimate(double snrDb, double spectralEfficiency, double codeRate,
                              DoubleUnaryOperator bitsPerSymbol, double maxBitsPerSymbol, int frames, long seed,
                              BooleanSupplier stop) {
        OutageBounds.checkSnrDb(snrDb);
        OutageBounds.checkSpectralEfficiency(spectralEfficiency);
        OutageBounds.checkDraws(frames);
        if (!(codeRate > 0.0 && codeRate <= 1.0)) {
            throw new IllegalArgumentException("code rate K/T must be in (0, 1], got " + codeRate);
        }
        boolean scalarMimo = Math.min(mt, nr) == 1;
        boolean qamCarries = spectralEfficiency < codeRate * maxBitsPerSymbol;
        double snr = Math.pow(10.0, 0.1 * snrDb);
        double symbolSnrPerGain = snr / (mt * codeRate);
        Draws stream = Draws.of(seed);
        int mimoOutages = 0;
        int stbcOutages = 0;
        int qamOutages = 0;
        for (int i = 0; i < frames; i++) {
            if (stop.getAsBoolean()) {
                throw new CancellationException("outage bound stopped");
            }
            double mimoBits = 0.0;
            double stbcBits = 0.0;
            double qamBits = 0.0;
            for (double w : weights) {
                fading.draw(stream, nr, mt, h);
                double gain = 0.0;
                for (double v : h) {
                    gain += v * v;
                }
                double gamma = symbolSnrPerGain * gain;
                // with one antenna on a side, det(I + snr/Mt·H Hᴴ) = 1 + snr/Mt·‖H‖²_F
                mimoBits += w * (scalarMimo ? Math.log1p(snr / mt * gain) / LN2 : mimo.bits(h, snr));
                stbcBits += w * codeRate * Math.log1p(gamma) / LN2;
                if (qamCarries) {
                    qamBits += w * codeRate * bitsPerSymbol.applyAsDouble(gamma);
                }
            }
            mimoOutages += mimoBits < spectralEfficiency ? 1 : 0;
            stbcOutages += stbcBits < spectralEfficiency ? 1 : 0;
            qamOutages += qamBits < spectralEfficiency ? 1 : 0;
        }
        return new Estimates(OutageEstimate.counted(mimoOutages, frames), OutageEstimate.counted(stbcOutages, frames),
                qamCarries ? OutageEstimate.counted(qamOutages, frames) : OutageEstimate.exact(1.0));
    }
}
