package org.fadebench.bench.cli;

import java.util.concurrent.Callable;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.SnrGrid;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code fadebench run}: simulate one link over a sweep of SNR points. */
@Command(name = "run", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Simulate one link over a sweep of SNR points; print a table and write results.csv.",
            "SNR is the total transmitted energy per channel use over N0 at each receive antenna "
                + "(E|h|^2 = 1, power split equally over the transmit antennas)."})
final class RunCommand implements Callable<Integer> {

    @Option(names = "--code", paramLabel = "NAME", defaultValue = "none",
            description = "Space-time block code: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).",
            completionCandidates = CodeNames.class)
    String code;

    @Option(names = "--tx", paramLabel = "N", description = "Transmit antennas (default: what the code needs).")
    Integer tx;

    @Option(names = "--rx", paramLabel = "N", defaultValue = "1", description = "Receive antennas (default: ${DEFAULT-VALUE}).")
    int rx;

    @Option(names = "--mod", paramLabel = "NAME", defaultValue = "qpsk",
            description = "Modulation: bpsk, qpsk, 16qam, 64qam, 256qam (default: ${DEFAULT-VALUE}).")
    String modulation;

    @Option(names = "--snr", paramLabel = "DB", defaultValue = "0:2:20",
            description = "SNR points in dB: START:STEP:STOP, one value, or a list a,b,c (default: ${DEFAULT-VALUE}).")
    String snr;

    @Option(names = "--fading", paramLabel = "NAME", defaultValue = "rayleigh",
            description = "Fading model: rayleigh, none (default: ${DEFAULT-VALUE}).")
    String fading;

    @Option(names = "--frame-bits", paramLabel = "N",
            description = "Information bits per frame, a whole number of code blocks (default: 1024 rounded up to whole blocks).")
    Integer frameBits;

    @Option(names = "--coherence", paramLabel = "SLOTS", defaultValue = "0",
            description = "Symbol periods per fading block, a multiple of the code's slots (default: the whole frame).")
    int coherence;

    @Option(names = "--min-errors", paramLabel = "N", defaultValue = "100",
            description = "Frame errors to collect per point; 0 runs exactly --max-frames (default: ${DEFAULT-VALUE}).")
    long minErrors;

    @Option(names = "--max-frames", paramLabel = "N", defaultValue = "1000000",
            description = "Most frames per point (default: ${DEFAULT-VALUE}).")
    long maxFrames;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "Master seed (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @Option(names = "--confidence", paramLabel = "LEVEL", defaultValue = "0.95",
            description = "Confidence level of the FER interval (default: ${DEFAULT-VALUE}).")
    double confidence;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "fadebench-out",
            description = "Folder for results.csv (default: ${DEFAULT-VALUE}).")
    String out;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        SweepJob job = validate();
        job.run(spec.commandLine().getOut());
        return ExitCodes.OK;
    }

    /** Turns the options into a job, or throws {@link InvalidInputException} naming the option. */
    SweepJob validate() {
        Modulation mod = parse("--mod", () -> Modulation.fromCliName(modulation));
        SpaceTimeCode stbc = parse("--code", () -> SpaceTimeCodes.byName(code));
        Fading fad = parse("--fading", () -> Fading.fromCliName(fading));
        double[] snrDb = parse(null, () -> SnrGrid.parse(snr));
        int bits = frameBits != null ? frameBits : LinkSettings.roundUpToBlocks(LinkSettings.DEFAULT_FRAME_BITS, mod, stbc);
        int nTx = tx != null ? tx : stbc.transmitAntennas();
        LinkSettings link = parse(null, () -> new LinkSettings(mod, stbc, nTx, rx, fad, bits, coherence));
        StopRules rules = parse(null, () -> new StopRules(minErrors, maxFrames));
        int nThreads = SweepJob.threads(threads);
        if (!(confidence > 0 && confidence < 1)) {
            throw new InvalidInputException("--confidence must lie strictly between 0 and 1 (e.g. 0.95), got "
                    + confidence);
        }
        return new SweepJob(link, snrDb, rules, seed, nThreads, confidence, SweepJob.checkOutDir(out));
    }

    /** Runs a parser; its IllegalArgumentException becomes invalid input, prefixed with the option. */
    static <T> T parse(String option, java.util.function.Supplier<T> parser) {
        try {
            return parser.get();
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException(option == null ? e.getMessage() : option + ": " + e.getMessage());
        }
    }

    /** Catalogue names for the help text. */
    static final class CodeNames implements Iterable<String> {
        @Override
        public java.util.Iterator<String> iterator() {
            java.util.List<String> names = new java.util.ArrayList<>();
            for (SpaceTimeCode c : SpaceTimeCodes.all()) {
                names.add(c.name());
            }
            return names.iterator();
        }
    }
}
