package org.fadebench.bench.analysis;

import java.util.Objects;
import java.util.function.BooleanSupplier;
import java.util.function.DoubleUnaryOperator;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.BlockFadingOutage;
import org.fadebench.channel.ChannelGainSamples;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.FadingModel;
import org.fadebench.channel.MimoOutageSimulator;
import org.fadebench.channel.OutageBounds;
import org.fadebench.channel.OutageEstimate;
import org.fadebench.channel.RayleighFading;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation;

/**
 * What the outage bounds of one link need: antennas, the code's symbol rate r = K/T, the
 * modulation, the spectral efficiency R in bits per channel use, which information measure the
 * QAM bound uses, the Monte Carlo effort, the fading, and how many fading blocks a frame spans.
 * Each bound is given at one SNR under the project's SNR convention (total transmit energy per
 * channel use over N0 at each receive antenna); see {@link OutageBounds}.
 *
 * <p><b>One fading block per frame</b> (quasi-static): i.i.d. Rayleigh has closed forms for the
 * code bounds (and for MIMO when min(Mt, Nr) = 1); the MIMO bound with min(Mt, Nr) > 1 is counted
 * over {@code mimoDraws} draws; another model takes the code bounds from the empirical
 * distribution of {@code mimoDraws} draws of ‖H‖²_F, so they are counts too.
 *
 * <p><b>F > 1 fading blocks per frame</b>: all three bounds are the block-fading outage
 * P(Σ_f w_f·I_f < R) counted over {@link #frames()} frames of F blocks each (see
 * {@link BlockFadingOutage}).
 *
 * @param mimoDraws  channel draws per SNR point of a Monte Carlo bound (see {@link #frames()} for F > 1)
 * @param mimoSeed   seed of those draws; every SNR point reuses the same draws, so an estimated
 *                   curve never rises with SNR and is reproducible
 * @param channel    the fading when it is not i.i.d. Rayleigh (Rician, Nakagami-m, correlated), or
 *                   null for i.i.d. Rayleigh
 * @param gains      with {@code channel} and one block per frame: {@code mimoDraws} draws of ‖H‖²_F,
 *                   whose empirical distribution stands in for the Gamma law in the code bounds
 * @param frameSlots channel uses per frame
 * @param blockSlots channel uses per fading block (the last block of a frame may be shorter);
 *                   equal to {@code frameSlots} for one block per frame
 */
public record BoundSettings(int receiveAntennas, int transmitAntennas, double codeRate, Modulation modulation,
                            double spectralEfficiency, MutualInformation.Kind information, int mimoDraws,
                            long mimoSeed, ChannelSpec channel, ChannelGainSamples gains, int frameSlots,
                            int blockSlots) {

    /**
     * Draws per point: ten outages, the usual minimum for a count, down to p = 1e-4. A 4x4 point
     * takes about 30 ms on one core (JMH {@code OutagePointBenchmark}: ≈ 3.8 M draws/s).
     */
    public static final int DEFAULT_MIMO_DRAWS = 100_000;
    public static final long DEFAULT_MIMO_SEED = 1L;

    /** With F > 1 blocks per frame, at least this many frames per point (or {@code mimoDraws} if fewer). */
    public static final int MIN_FRAMES = 10_000;

    public BoundSettings {
        Objects.requireNonNull(modulation, "modulation");
        Objects.requireNonNull(information, "information");
        int max = OutageBounds.MAX_ANTENNAS;
        if (transmitAntennas < 1 || transmitAntennas > max) {
            throw new IllegalArgumentException("transmit antennas must be in 1.." + max + ", got " + transmitAntennas);
        }
        if (receiveAntennas < 1 || receiveAntennas > max) {
            throw new IllegalArgumentException("receive antennas must be in 1.." + max + ", got " + receiveAntennas);
        }
        if (!(codeRate > 0.0 && codeRate <= 1.0)) {
            throw new IllegalArgumentException("code rate K/T must be in (0, 1], got " + codeRate);
        }
        if (!(spectralEfficiency > 0.0 && spectralEfficiency < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("spectral efficiency R must be a finite number of bits per channel"
                    + " use > 0, got " + spectralEfficiency);
        }
        if (mimoDraws < 1) {
            throw new IllegalArgumentException("MIMO outage draws must be >= 1, got " + mimoDraws);
        }
        if (frameSlots < 1 || blockSlots < 1 || blockSlots > frameSlots) {
            throw new IllegalArgumentException("need 1 <= slots per fading block <= slots per frame, got "
                    + blockSlots + " and " + frameSlots);
        }
    }

    /** Settings with one fading block per frame. */
    public BoundSettings(int receiveAntennas, int transmitAntennas, double codeRate, Modulation modulation,
                         double spectralEfficiency, MutualInformation.Kind information, int mimoDraws, long mimoSeed,
                         ChannelSpec channel, ChannelGainSamples gains) {
        this(receiveAntennas, transmitAntennas, codeRate, modulation, spectralEfficiency, information, mimoDraws,
                mimoSeed, channel, gains, 1, 1);
    }

    /**
     * The bounds of a simulated link at its own rate R = {@link LinkSettings#bitsPerChannelUse()}
     * and over its own fading blocks, with coded-modulation information, i.i.d. Rayleigh fading
     * (see {@link #withChannel}) and the default Monte Carlo effort. For an uncoded link R is the
     * constellation's full r·log2 M bits, which no finite alphabet carries without outage, so the
     * QAM bound is 1 there; give the rate of the outer code with {@link #withSpectralEfficiency}.
     */
    public static BoundSettings of(LinkSettings link) {
        return new BoundSettings(link.receiveAntennas(), link.transmitAntennas(), link.code().rate(),
                link.modulation(), link.bitsPerChannelUse(), MutualInformation.Kind.CODED_MODULATION,
                DEFAULT_MIMO_DRAWS, DEFAULT_MIMO_SEED, null, null, link.slotsPerFrame(),
                link.effectiveCoherenceSlots());
    }

    /**
     * The bounds over another fading model (Rician, Nakagami-m, correlated), by Monte Carlo over
     * draws of the model. A channel that changes within a block or replays a trace has no such
     * bound here.
     *
     * @throws IllegalArgumentException for a channel with Doppler or a trace
     */
    public BoundSettings withChannel(ChannelSpec spec) {
        if (spec.varies() || spec.trace() != null) {
            throw new IllegalArgumentException("outage bounds need a channel that is constant over a block and "
                    + "drawn from a model (no --doppler, no --trace)");
        }
        return with(spec.iidRayleigh() ? null : spec, mimoDraws, mimoSeed);
    }

    public BoundSettings withSpectralEfficiency(double bitsPerChannelUse) {
        return new BoundSettings(receiveAntennas, transmitAntennas, codeRate, modulation, bitsPerChannelUse,
                information, mimoDraws, mimoSeed, channel, gains, frameSlots, blockSlots);
    }

    public BoundSettings withInformation(MutualInformation.Kind kind) {
        return new BoundSettings(receiveAntennas, transmitAntennas, codeRate, modulation, spectralEfficiency,
                kind, mimoDraws, mimoSeed, channel, gains, frameSlots, blockSlots);
    }

    public BoundSettings withMimoDraws(int draws, long seed) {
        return with(channel, draws, seed);
    }

    /** The same bounds over another channel or effort; the gain draws follow. */
    private BoundSettings with(ChannelSpec spec, int draws, long seed) {
        ChannelGainSamples g = spec == null || fadingBlocks() > 1 ? null
                : ChannelGainSamples.draw(spec.newModel(receiveAntennas, transmitAntennas), receiveAntennas,
                        transmitAntennas, draws, seed);
        return new BoundSettings(receiveAntennas, transmitAntennas, codeRate, modulation, spectralEfficiency,
                information, draws, seed, spec, g, frameSlots, blockSlots);
    }

    /** Fading blocks per frame, F. */
    public int fadingBlocks() {
        return (frameSlots + blockSlots - 1) / blockSlots;
    }

    /**
     * Frames counted per SNR point by a Monte Carlo bound: {@link #mimoDraws()} with one block per
     * frame; with F blocks, mimoDraws / F frames (the same number of channel draws), but at least
     * {@value #MIN_FRAMES} (or mimoDraws, if smaller), so the curve still resolves FER 1e-2 to 1e-3.
     */
    public int frames() {
        int f = fadingBlocks();
        return f == 1 ? mimoDraws : Math.max(mimoDraws / f, Math.min(mimoDraws, MIN_FRAMES));
    }

    /**
     * True when the bound is a closed form rather than a count: one block per frame, i.i.d.
     * Rayleigh, and for MIMO min(Mt, Nr) = 1; and the QAM bound at a rate the alphabet cannot carry,
     * which is exactly 1.
     */
    public boolean exact(Bound bound) {
        if (bound == Bound.QAM && fullRate()) {
            return true;
        }
        return fadingBlocks() == 1 && channel == null
                && (bound != Bound.MIMO || Math.min(transmitAntennas, receiveAntennas) == 1);
    }

    /** True when the MIMO bound is a closed form (see {@link #exact}). */
    public boolean mimoExact() {
        return exact(Bound.MIMO);
    }

    /** The most bits per channel use the QAM bound can carry, r·log2 M; at or above it the bound is 1. */
    public double qamLimit() {
        return codeRate * modulation.bitsPerSymbol();
    }

    /** True when R ≥ r·log2 M, so that the QAM bound is 1 at every SNR. */
    public boolean fullRate() {
        return spectralEfficiency >= qamLimit();
    }

    /** How a bound is computed, for file headers: exact, or Monte Carlo over so many draws. */
    public String method(Bound bound) {
        if (exact(bound)) {
            return "exact";
        }
        return fadingBlocks() > 1
                ? "Monte Carlo over " + frames() + " frames of " + fadingBlocks() + " fading blocks, 95 % Wilson interval"
                : "Monte Carlo over " + mimoDraws + " channel draws, 95 % Wilson interval";
    }

    /** The channel the bounds hold for, e.g. {@code i.i.d. Rayleigh, 32 fading blocks per frame}. */
    public String channelWords() {
        String fading = channel == null ? "i.i.d. Rayleigh" : channel.describe();
        return fadingBlocks() == 1 ? fading + ", one fading block per frame"
                : fading + ", " + fadingBlocks() + " fading blocks per frame (block-fading outage)";
    }

    /** The three bounds at one SNR; {@code stop} is polled during the Monte Carlo counts. */
    public BoundPoint point(double snrDb, BooleanSupplier stop) {
        if (fadingBlocks() > 1) {
            MutualInformation info = MutualInformation.of(modulation, information);
            BlockFadingOutage.Estimates e = new BlockFadingOutage(model(), receiveAntennas, transmitAntennas,
                    frameSlots, blockSlots).estimate(snrDb, spectralEfficiency, codeRate, info::bits, info.maxBits(),
                    frames(), mimoSeed, stop);
            return new BoundPoint(snrDb, e.mimo(), e.stbc(), e.qam());
        }
        return new BoundPoint(snrDb, quasiStatic(Bound.MIMO, snrDb, stop), quasiStatic(Bound.STBC, snrDb, stop),
                quasiStatic(Bound.QAM, snrDb, stop));
    }

    /** One bound at one SNR. */
    public OutageEstimate outage(Bound bound, double snrDb) {
        return fadingBlocks() > 1 ? point(snrDb, () -> false).estimate(bound) : quasiStatic(bound, snrDb, () -> false);
    }

    /** MIMO outage with Gaussian inputs. */
    public OutageEstimate mimoOutage(double snrDb) {
        return outage(Bound.MIMO, snrDb);
    }

    /** Outage of the space-time code with Gaussian symbols. */
    public double stbcOutage(double snrDb) {
        return outage(Bound.STBC, snrDb).probability();
    }

    /** Outage of the space-time code with the link's QAM symbols. */
    public double qamOutage(double snrDb) {
        return outage(Bound.QAM, snrDb).probability();
    }

    /**
     * The closed form of a bound that is {@link #exact}, as a function of SNR in dB.
     *
     * @throws IllegalStateException for a Monte Carlo bound
     */
    public DoubleUnaryOperator closedForm(Bound bound) {
        if (!exact(bound)) {
            throw new IllegalStateException(bound.key() + " bound is a Monte Carlo count here, not a closed form");
        }
        return snrDb -> quasiStatic(bound, snrDb, () -> false).probability();
    }

    /** One bound with one fading block per frame. */
    private OutageEstimate quasiStatic(Bound bound, double snrDb, BooleanSupplier stop) {
        switch (bound) {
            case MIMO:
                if (channel != null) {
                    return new MimoOutageSimulator(model(), receiveAntennas, transmitAntennas)
                            .estimate(snrDb, spectralEfficiency, mimoDraws, mimoSeed, stop);
                }
                return OutageBounds.mimoOutage(snrDb, receiveAntennas, transmitAntennas, spectralEfficiency,
                        mimoDraws, mimoSeed, stop);
            case STBC:
                return codeOutage(OutageBounds.stbcOutage(snrDb, receiveAntennas, transmitAntennas, codeRate,
                        spectralEfficiency, gainCdf()));
            default:
                MutualInformation info = MutualInformation.of(modulation, information);
                return codeOutage(OutageBounds.stbcOutage(snrDb, receiveAntennas, transmitAntennas, codeRate,
                        spectralEfficiency, info::bits, info.maxBits(), gainCdf()));
        }
    }

    /** A code bound: exact under the Gamma law, else the count of gain draws below the threshold. */
    private OutageEstimate codeOutage(double probability) {
        if (gains == null || probability == 1.0 && fullRate()) {
            return OutageEstimate.exact(probability);
        }
        return OutageEstimate.counted((int) Math.round(probability * gains.size()), gains.size());
    }

    private FadingModel model() {
        return channel == null ? new RayleighFading() : channel.newModel(receiveAntennas, transmitAntennas);
    }

    /** The distribution function of ‖H‖²_F: the Gamma law, or the empirical one of the draws. */
    private DoubleUnaryOperator gainCdf() {
        return gains == null ? OutageBounds.rayleighGainCdf(receiveAntennas, transmitAntennas) : gains::cdf;
    }
}
