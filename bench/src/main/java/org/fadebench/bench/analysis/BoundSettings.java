package org.fadebench.bench.analysis;

import java.util.Objects;
import org.fadebench.bench.link.LinkSettings;
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
 */
public record BoundSettings(int transmitAntennas, int receiveAntennas, double codeRate, Modulation modulation,
                            double spectralEfficiency, MutualInformation.Kind information, int mimoDraws,
                            long mimoSeed) {

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
                DEFAULT_MIMO_DRAWS, DEFAULT_MIMO_SEED);
    }

    public BoundSettings withSpectralEfficiency(double bitsPerChannelUse) {
        return new BoundSettings(transmitAntennas, receiveAntennas, codeRate, modulation, bitsPerChannelUse,
                information, mimoDraws, mimoSeed);
    }

    public BoundSettings withInformation(MutualInformation.Kind kind) {
        return new BoundSettings(transmitAntennas, receiveAntennas, codeRate, modulation, spectralEfficiency,
                kind, mimoDraws, mimoSeed);
    }

    public BoundSettings withMimoDraws(int draws, long seed) {
        return new BoundSettings(transmitAntennas, receiveAntennas, codeRate, modulation, spectralEfficiency,
                information, draws, seed);
    }

    /** True when the MIMO bound is a closed form (min(Mt, Nr) = 1) rather than a Monte Carlo count. */
    public boolean mimoExact() {
        return Math.min(transmitAntennas, receiveAntennas) == 1;
    }

    /** The most bits per channel use the QAM bound can carry, r·log2 M; at or above it the bound is 1. */
    public double qamLimit() {
        return codeRate * modulation.bitsPerSymbol();
    }

    /** MIMO outage with Gaussian inputs: exact, or counted over {@link #mimoDraws()} draws. */
    public OutageEstimate mimoOutage(double snrDb) {
        return OutageBounds.mimoOutage(snrDb, transmitAntennas, receiveAntennas, spectralEfficiency, mimoDraws,
                mimoSeed);
    }

    /** Outage of the space-time code with Gaussian symbols (closed form). */
    public double stbcOutage(double snrDb) {
        return OutageBounds.stbcOutage(snrDb, transmitAntennas, receiveAntennas, codeRate, spectralEfficiency);
    }

    /** Outage of the space-time code with the link's QAM symbols (closed form over the information curve). */
    public double qamOutage(double snrDb) {
        MutualInformation info = MutualInformation.of(modulation, information);
        return OutageBounds.stbcOutage(snrDb, transmitAntennas, receiveAntennas, codeRate, spectralEfficiency,
                info::bits, info.maxBits());
    }
}
