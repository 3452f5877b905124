package org.fadebench.bench.cli;

import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.Fading;
import picocli.CommandLine.Option;

/** The options that choose the fading model and its parameters (shared by run and bounds). */
final class FadingOptions {

    @Option(names = "--fading", paramLabel = "NAME", defaultValue = "rayleigh",
            description = "Fading model: rayleigh, rician, nakagami, none (default: ${DEFAULT-VALUE}).")
    String fading;

    @Option(names = "--k-factor", paramLabel = "K", description = "Rician K-factor, linear (with --fading rician).")
    Double kFactor;

    @Option(names = "--nakagami-m", paramLabel = "M", description = "Nakagami m >= 0.5 (with --fading nakagami).")
    Double nakagamiM;

    @Option(names = "--tx-corr", paramLabel = "R",
            description = "Exponential correlation r^|i-j| between transmit antennas, |r| < 1.")
    Double txCorr;

    @Option(names = "--rx-corr", paramLabel = "R",
            description = "Exponential correlation r^|i-j| between receive antennas, |r| < 1.")
    Double rxCorr;

    /** The fading from these options; only the options given are passed on. */
    ChannelSpec channel() {
        Fading fad = RunCommand.parse("--fading", () -> Fading.fromCliName(fading));
        return RunCommand.parse(null, () -> {
            ChannelSpec c = ChannelSpec.of(fad);
            if (kFactor != null) {
                c = c.withKFactor(kFactor);
            }
            if (nakagamiM != null) {
                c = c.withNakagamiM(nakagamiM);
            }
            if (txCorr != null) {
                c = c.withTxCorr(txCorr);
            }
            if (rxCorr != null) {
                c = c.withRxCorr(rxCorr);
            }
            return c;
        });
    }
}
