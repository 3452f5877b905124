package org.fadebench.bench.analysis;

import java.util.Arrays;
import java.util.Optional;
import java.util.stream.DoubleStream;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.modem.ErrorRates;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation;

/**
 * The finite-blocklength limit of an AWGN link: the normal approximation of Y. Polyanskiy,
 * H. V. Poor and S. Verdú, "Channel coding rate in the finite blocklength regime", IEEE Trans.
 * Inf. Theory 56(5), 2010 (Sec. IV; log2 M* ≈ nC − √(nV)·Q⁻¹(ε) + ½·log2 n, from memory for the
 * equation numbers), solved for the frame error rate of k information bits in n channel uses:
 * <pre>  ε ≈ Q((n·C − k + ½·log2 n) / √(n·V))</pre>
 * with C and V the capacity and dispersion, bits and bits² per channel use, of the channel with the
 * link's QAM alphabet as uniform input ({@link MutualInformation#density}, coded-modulation
 * information whatever {@code --mi} says). It is an approximation, not a bound: no code of that
 * length and rate does much better, and good codes come within a fraction of a dB of it.
 *
 * <p><b>Channel uses.</b> With {@code --fading none} every entry of H is 1, so ‖H‖²_F = Mt·Nr, and
 * an orthogonal space-time code of rate r = K/T decouples into one scalar AWGN channel per QAM
 * symbol, each symbol arriving with SNR ‖H‖²_F·SNR/(Mt·r) = Nr·SNR/r (see the README's SNR
 * convention; V. Tarokh, H. Jafarkhani and A. R. Calderbank, IEEE Trans. Inf. Theory 45(5), 1999).
 * A channel use here is therefore one QAM symbol: n = the data symbols of a frame (coded bits and
 * padding included, pilots not), at the symbol SNR Nr·SNR/r. E.g. G4 sends 4 symbols in 8 slots:
 * each symbol gets twice the energy of a slot (r = 1/2), and a frame of 512 slots is n = 256 uses
 * at 2·Nr·SNR; without a space-time code, maximal-ratio combining of Nr antennas gives Nr·SNR. Per
 * slot this is r·C, the information the QAM outage bound uses. A code that is not orthogonal has no
 * such decoupling and gets no normal approximation; nor does a fading channel or a trace. The
 * receiver's CSI does not enter: the limit belongs to the channel.
 *
 * @param modulation  the QAM alphabet, uniform inputs
 * @param symbols     n, channel uses (QAM symbols) per frame
 * @param payloadBits k, information bits per frame (the CRC is overhead, not payload)
 * @param symbolGain  the SNR of a channel use over the link's SNR (linear): Nr/r
 */
public record NormalApproximation(Modulation modulation, int symbols, int payloadBits, double symbolGain) {

    /** Why a link has none. */
    public static final String NOT_APPLICABLE = "the normal approximation is given for AWGN links (--fading none)"
            + " with an orthogonal space-time code";

    /** Key in results.json. */
    public static final String KEY = "normal_approx";

    /** Most points of the curve the plot draws (see {@link #grid}). */
    static final int GRID_POINTS = 400;

    /** Finest step of that grid, dB. */
    static final double GRID_STEP_DB = 0.02;

    /** The value at which the drawn curve starts, coming down from the top of the plot. */
    static final double GRID_TOP = 0.99;

    public NormalApproximation {
        if (modulation == null) {
            throw new IllegalArgumentException("modulation must be given");
        }
        if (symbols < 1 || payloadBits < 1) {
            throw new IllegalArgumentException("need n >= 1 channel uses and k >= 1 information bits, got n = "
                    + symbols + ", k = " + payloadBits);
        }
        if (!(symbolGain > 0.0 && symbolGain < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("symbol SNR gain must be finite and > 0, got " + symbolGain);
        }
    }

    /** The normal approximation of {@code link}, or empty where it does not apply (see {@link #NOT_APPLICABLE}). */
    public static Optional<NormalApproximation> of(LinkSettings link) {
        if (!link.channel().awgn() || !link.code().isOrthogonal()) {
            return Optional.empty();
        }
        return Optional.of(new NormalApproximation(link.modulation(), link.symbolsPerFrame(), link.frameBits(),
                link.receiveAntennas() / link.code().rate()));
    }

    /** The SNR of one channel use (linear) at the link's SNR {@code snrDb}. */
    public double symbolSnr(double snrDb) {
        return symbolGain * Math.pow(10.0, 0.1 * snrDb);
    }

    /** Capacity and dispersion per channel use at the link's SNR {@code snrDb}. */
    public MutualInformation.Density density(double snrDb) {
        return MutualInformation.of(modulation, MutualInformation.Kind.CODED_MODULATION).density(symbolSnr(snrDb));
    }

    /** The approximate FER at the link's SNR {@code snrDb}. */
    public double fer(double snrDb) {
        MutualInformation.Density d = density(snrDb);
        return fer(d.bits(), d.dispersion(), symbols, payloadBits);
    }

    /**
     * ε = Q((n·C − k + ½·log2 n) / √(n·V)) for capacity C (bits) and dispersion V (bits²) per
     * channel use. Where V = 0 (no noise, or no signal) the argument is ±∞: ε is 0 when
     * n·C − k + ½·log2 n is positive, 1 when negative, ½ when zero.
     */
    public static double fer(double capacity, double dispersion, long n, long k) {
        double margin = n * capacity - k + 0.5 * Math.log(n) / Math.log(2.0);
        if (!(dispersion > 0.0)) {
            return margin > 0 ? 0.0 : margin < 0 ? 1.0 : 0.5;
        }
        return ErrorRates.q(margin / Math.sqrt(n * dispersion));
    }

    /**
     * The SNRs at which the plot draws the curve: where it falls from {@value #GRID_TOP} to
     * {@code floor}, in {@value #GRID_POINTS} equal steps or steps of {@value #GRID_STEP_DB} dB,
     * whichever is coarser, preceded by the lowest swept SNR when that lies below (the curve is
     * flat near 1 there). The fall may lie outside the swept range, up to
     * {@link BoundCurves#REACH_LIMIT_DB} dB beyond it; the plot then widens to show it, since the
     * swept points alone would not (the curve falls by decades within a dB).
     *
     * @param floor the lowest value the plot shows, in (0, 1)
     */
    public double[] grid(double[] sweptSnrDb, double floor) {
        double low = Arrays.stream(sweptSnrDb).min().orElseThrow();
        double high = Arrays.stream(sweptSnrDb).max().orElseThrow();
        double top = TargetCrossing.ofClosedForm(this::fer, GRID_TOP).orElse(low);
        double bottom = TargetCrossing.ofClosedForm(this::fer, floor).orElse(high);
        double from = Math.max(low - BoundCurves.REACH_LIMIT_DB, Math.min(top, high + BoundCurves.REACH_LIMIT_DB));
        double to = Math.max(from, Math.min(bottom, high + BoundCurves.REACH_LIMIT_DB));
        int steps = (int) Math.min(GRID_POINTS, Math.ceil((to - from) / GRID_STEP_DB));
        DoubleStream.Builder grid = DoubleStream.builder();
        if (low < from) {
            grid.add(low);
        }
        for (int i = 0; i < steps; i++) {
            grid.add(from + (to - from) * i / steps);
        }
        return grid.add(to).build().toArray();
    }

    /** This curve against the target FER over the swept SNRs: crossing (by bisection) and where it lies. */
    public LinkAnalysis.BoundAnalysis against(double[] snrDb, double targetFer) {
        return LinkAnalysis.closedForm(this::fer, snrDb, targetFer, DiversityFit.DEFAULT_TAIL_POINTS);
    }
}
