package org.fadebench.bench.cli;

import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.modem.MutualInformation;
import picocli.CommandLine.Option;

/** The options of the outage bounds (shared by run and bounds). */
final class BoundOptions {

    @Option(names = "--rate", paramLabel = "R",
            description = "Spectral efficiency of the bounds in information bits per channel use "
                    + "(default: the link's own, code rate x bits per symbol).")
    Double rate;

    @Option(names = "--mi", paramLabel = "KIND", defaultValue = "cm",
            description = "Mutual information of the QAM bound: cm (coded modulation) or bicm (Gray bit-interleaved) "
                    + "(default: ${DEFAULT-VALUE}).")
    String information;

    @Option(names = "--outage-draws", paramLabel = "N", defaultValue = "100000",
            description = "Channel draws per SNR point of the Monte Carlo MIMO bound (default: ${DEFAULT-VALUE}).")
    int draws;

    /**
     * The bound settings for a link, or null where they do not apply: a code that is not
     * orthogonal, a channel that changes within a block (Doppler) or replays a trace. Throws
     * {@link InvalidInputException} naming the option at fault.
     */
    BoundSettings settings(LinkSettings link) {
        if (rate != null && !(rate > 0 && Double.isFinite(rate))) {
            throw new InvalidInputException("--rate must be a positive number of bits per channel use, got " + rate);
        }
        if (draws < 1 || draws > 100_000_000) {
            throw new InvalidInputException("--outage-draws must be between 1 and 100000000, got " + draws);
        }
        MutualInformation.Kind kind = RunCommand.parse("--mi", () -> MutualInformation.Kind.fromCliName(information));
        if (!link.code().isOrthogonal()) {
            return null;
        }
        BoundSettings s = RunCommand.parse(null, () -> BoundSettings.of(link));
        if (rate != null) {
            s = s.withSpectralEfficiency(rate);
        }
        s = s.withInformation(kind).withMimoDraws(draws, BoundSettings.DEFAULT_MIMO_SEED);
        ChannelSpec channel = link.channel();
        if (channel.varies() || channel.trace() != null) {
            return null;
        }
        return s.withChannel(channel);
    }
}
