package org.fadebench.bench.analysis;

import java.util.Objects;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.ChannelGainSamples;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.MimoOutageSimulator;
import org.fadebench.channel.OutageBounds;
import org.fadebench.channel.OutageEstimate;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation;

/**
 * What the outage bounds of one link need: antennas, the code's symbol rate r = K/T, the
 * modulation, the spectral efficiency R in bits per channel use, which information measure the
 * QAM bound uses, and the Monte Carlo effort of the MIMO bound. Each method gives one bound at one
 * SNR under the project's SNR convention (total transmit energy per channel use over N0 at each
 * receive antenna, i.i.d. Rayleigh fading, constant over a codeword); see {@link OutageBounds}.
 *
 * @param mimoDraws channel draws per SNR point of the MIMO bound when min(Mt, Nr) > 1
 * @param mimoSeed  seed of those draws; every SNR point reuses the same draws, so the estimated
 *                  curve never rises with SNR and is reproducible
 * @param channel   the fading when it is not i.i.d. Rayleigh (Rician, Nakagami-m, correlated), or
 *                  null for i.i.d. Rayleigh and its closed forms
 * @param gains     with {@code channel}: {@code mimoDraws} draws of ‖H‖²_F, whose empirical
 *                  distribution stands in for the Gamma law in the code bounds
 */
public record BoundSettings(int transmitAntennas, int receiveAntennas, double codeRate, Modulation modulation,
                            double spectralEfficiency, MutualInformation.Kind information, int mimoDraws,
                            long mimoSeed, ChannelSpec channel, ChannelGainSamples gains) {

    /**
     * Draws per point: ten outages, the usual minimum for a count, down to p = 1e-4. A 4x4 point
     * takes about 30 ms on one core (JMH {@code OutagePointBenchmark}: ≈ 3.8 M draws/s).
     */
    public static final int DEFAULT_MIMO_DRAWS = 100_000;
    public static final long DEFAULT_MIMO_SEED = 1L;

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
    }

    /**
     * The bounds of a simulated link at its own rate R = {@link LinkSettings#bitsPerChannelUse()},
     * with coded-modulation information and the default MIMO effort. For an uncoded link R is the
     * constellation's full r·log2 M bits, which no finite alphabet carries without outage, so the
     * QAM bound is 1 there; give the rate of the outer code with {@link #withSpectralEfficiency}.
     */
    public static BoundSettings of(LinkSettings link) {
        return new BoundSettings(link.transmitAntennas(), link.receiveAntennas(), link.code().rate(),
                link.modulation(), link.bitsPerChannelUse(), MutualInformation.Kind.CODED_MODULATION,
                DEFAULT_MIMO_DRAWS, DEFAULT_MIMO_SEED, null, null);
    }

    /**
     * The bounds over another fading model (Rician, Nakagami-m, correlated): all three by Monte
     * Carlo over {@link #mimoDraws()} channel draws of the model, the code bounds through the
     * empirical distribution of ‖H‖²_F. A channel that changes within a block or replays a trace
     * has no such bound here.
     *
     * @throws IllegalArgumentException for a channel with Doppler or a trace
     */
    public BoundSettings withChannel(ChannelSpec spec) {
        if (spec.varies() || spec.trace() != null) {
            throw new IllegalArgumentException("outage bounds need a channel that is constant over a block and "
                    + "drawn from a model (no --doppler, no --trace)");
        }
        if (spec.iidRayleigh()) {
            return new BoundSettings(transmitAntennas, receiveAntennas, codeRate, modulation, spectralEfficiency,
                    information, mimoDraws, mimoSeed, null, null);
        }
        return new BoundSettings(transmitAntennas, receiveAntennas, codeRate, modulation, spectralEfficiency,
                information, mimoDraws, mimoSeed, spec, ChannelGainSamples.draw(
                        spec.newModel(receiveAntennas, transmitAntennas), receiveAntennas, transmitAntennas,
                        mimoDraws, mimoSeed));
    }

    public BoundSettings withSpectralEfficiency(double bitsPerChannelUse) {
        return new BoundSettings(transmitAntennas, receiveAntennas, codeRate, modulation, bitsPerChannelUse,
                information, mimoDraws, mimoSeed, channel, gains);
    }

    public BoundSettings withInformation(MutualInformation.Kind kind) {
        return new BoundSettings(transmitAntennas, receiveAntennas, codeRate, modulation, spectralEfficiency,
                kind, mimoDraws, mimoSeed, channel, gains);
    }

    public BoundSettings withMimoDraws(int draws, long seed) {
        return new BoundSettings(transmitAntennas, receiveAntennas, codeRate, modulation, spectralEfficiency,
                information, draws, seed, channel, channel == null ? null
                : ChannelGainSamples.draw(channel.newModel(receiveAntennas, transmitAntennas), receiveAntennas,
                        transmitAntennas, draws, seed));
    }

    /** True when the MIMO bound is a closed form (min(Mt, Nr) = 1) rather than a Monte Carlo count. */
    public boolean mimoExact() {
        return channel == null && Math.min(transmitAntennas, receiveAntennas) == 1;
    }

    /** The most bits per channel use the QAM bound can carry, r·log2 M; at or above it the bound is 1. */
    public double qamLimit() {
        return codeRate * modulation.bitsPerSymbol();
    }

    /** MIMO outage with Gaussian inputs: exact, or counted over {@link #mimoDraws()} draws. */
    public OutageEstimate mimoOutage(double snrDb) {
        if (channel != null) {
            return new MimoOutageSimulator(channel.newModel(receiveAntennas, transmitAntennas), transmitAntennas,
                    receiveAntennas).estimate(snrDb, spectralEfficiency, mimoDraws, mimoSeed);
        }
        return OutageBounds.mimoOutage(snrDb, transmitAntennas, receiveAntennas, spectralEfficiency, mimoDraws,
                mimoSeed);
    }

    /** The distribution function of ‖H‖²_F: the Gamma law, or the empirical one of the draws. */
    private java.util.function.DoubleUnaryOperator gainCdf() {
        return gains == null ? OutageBounds.rayleighGainCdf(transmitAntennas, receiveAntennas) : gains::cdf;
    }

    /** Outage of the space-time code with Gaussian symbols (closed form). */
    public double stbcOutage(double snrDb) {
        return OutageBounds.stbcOutage(snrDb, transmitAntennas, receiveAntennas, codeRate, spectralEfficiency,
                gainCdf());
    }

    /** Outage of the space-time code with the link's QAM symbols (closed form over the information curve). */
    public double qamOutage(double snrDb) {
        MutualInformation info = MutualInformation.of(modulation, information);
        return OutageBounds.stbcOutage(snrDb, transmitAntennas, receiveAntennas, codeRate, spectralEfficiency,
                info::bits, info.maxBits(), gainCdf());
    }
}
