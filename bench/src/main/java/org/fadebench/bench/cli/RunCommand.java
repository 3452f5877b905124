package org.fadebench.bench.cli;

import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.function.Supplier;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.modem.LlrMethod;
import org.fadebench.bench.report.Archive;
import org.fadebench.bench.scenario.Scenario;
import org.fadebench.bench.scenario.ScenarioException;
import org.fadebench.bench.scenario.ScenarioKey;
import org.fadebench.bench.scenario.ScenarioSchema;
import org.fadebench.bench.scenario.ScenarioLoader;
import org.fadebench.bench.sweep.SnrGrid;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.ChannelTrace;
import org.fadebench.channel.KroneckerCorrelation;
import org.fadebench.coding.stbc.Decoder;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.modem.Modulation;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code fadebench run [SCENARIO.yaml] [options]}: simulate one link over a sweep of SNR points. */
@Command(name = "run", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Simulate one link over a sweep of SNR points; print a table and write results.csv, "
                + "results.json and scenario.yaml.",
            "SNR is the total transmitted energy per channel use over N0 at each receive antenna "
                + "(E|h|^2 = 1, power split equally over the transmit antennas).",
            "Options given on the command line override the scenario file."})
final class RunCommand implements Callable<Integer> {

    @Parameters(arity = "0..1", paramLabel = "SCENARIO", description = "A scenario file (YAML); see README.")
    Path scenarioFile;

    @CommandLine.Mixin
    LinkOptions linkOptions = new LinkOptions();

    @Option(names = "--decoder", paramLabel = "NAME",
            description = "Linear decoder: mf, zf, mmse (default: mf for orthogonal codes, mmse otherwise).")
    String decoder;

    @Option(names = "--interleaver", paramLabel = "NAME",
            description = "Bit interleaver of a coded frame: random, block, none (default: random when coded).")
    String interleaver;

    @Option(names = "--interleaver-rows", paramLabel = "N", defaultValue = "0",
            description = "Rows of the block interleaver; must divide the coded bits per frame.")
    int interleaverRows;

    @Option(names = "--llr", paramLabel = "NAME", defaultValue = "maxlog",
            description = "Soft demapping of a coded frame: maxlog, exact (default: ${DEFAULT-VALUE}).")
    String llr;

    @CommandLine.Mixin
    FadingOptions fadingOptions = new FadingOptions();

    @Option(names = "--doppler", paramLabel = "FD",
            description = "Normalised Doppler f_D T_s: the channel changes every slot (Clarke/Jakes spectrum).")
    Double doppler;

    @Option(names = "--csi-error", paramLabel = "VAR",
            description = "The receiver decodes with H + CN(0, VAR) instead of H.")
    Double csiError;

    @Option(names = "--pilots", paramLabel = "N",
            description = "The receiver estimates H by least squares from N pilot slots per fading block at the link SNR.")
    Integer pilots;

    @Option(names = "--trace", paramLabel = "FILE",
            description = "Replay channel matrices from a .npy or CSV trace (optionally gz, xz, bz2, zst), one per fading block.")
    Path trace;

    @Option(names = "--trace-out", paramLabel = "FILE",
            description = "Write the channels of the first SNR point's fading blocks to FILE (.npy or .csv, optionally .gz, .xz, .bz2, .zst).")
    Path traceOut;

    @Option(names = "--trace-out-blocks", paramLabel = "N", defaultValue = "100000",
            description = "Most fading blocks --trace-out writes (default: ${DEFAULT-VALUE}).")
    int traceOutBlocks;

    @CommandLine.Mixin
    FrameOptions frameOptions = new FrameOptions();

    @Option(names = "--snr", paramLabel = "DB", defaultValue = "0:2:20",
            description = "SNR points in dB: START:STEP:STOP, one value, or a list a,b,c (default: ${DEFAULT-VALUE}).")
    String snr;

    @Option(names = "--min-errors", paramLabel = "N", defaultValue = "100",
            description = "Frame errors to collect per point; 0 runs exactly --max-frames (default: ${DEFAULT-VALUE}).")
    long minErrors;

    @Option(names = "--max-frames", paramLabel = "N", defaultValue = "1000000",
            description = "Most frames per point (default: ${DEFAULT-VALUE}).")
    long maxFrames;

    @Option(names = "--max-seconds", paramLabel = "S", defaultValue = "0",
            description = "Most seconds per point, 0 for no limit; results then depend on the machine (default: ${DEFAULT-VALUE}).")
    double maxSeconds;

    @Option(names = "--fer-floor", paramLabel = "FER", defaultValue = "1e-6",
            description = "Stop the sweep after the first point with FER below this (default: ${DEFAULT-VALUE}).")
    double ferFloor;

    @Option(names = "--confidence", paramLabel = "LEVEL", defaultValue = "0.95",
            description = "Confidence level of the FER and BER intervals (default: ${DEFAULT-VALUE}).")
    double confidence;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "Master seed (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @CommandLine.Mixin
    BoundOptions boundOptions = new BoundOptions();

    @Option(names = "--target-fer", paramLabel = "FER", defaultValue = "0.01",
            description = "FER at which the SNR and the gap to each outage bound are reported (default: ${DEFAULT-VALUE}).")
    double targetFer;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "fadebench-out",
            description = "Folder for the outputs (default: ${DEFAULT-VALUE}).")
    String out;

    @Option(names = "--archive", paramLabel = "FILE", description = "Also bundle the outputs into FILE.tar.xz or FILE.tar.gz.")
    String archive;

    @Option(names = "--resume", description = "Continue an interrupted run from the checkpoint in --out.")
    boolean resume;

    @Option(names = "--quiet", description = "Print nothing but errors; no progress bar.")
    boolean quiet;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    /** A scenario given by the caller instead of a file (the built-in demo). */
    Scenario preloaded;

    @Override
    public Integer call() {
        Scenario scenario = loadScenario();
        RunPlan plan;
        try {
            if (scenario != null) {
                applyScenario(scenario);
            }
            plan = plan(scenario);
        } catch (InvalidInputException e) {
            throw locate(e, scenario);
        }
        if (!plan.link().code().isOrthogonal() && !plan.quiet()) {
            spec.commandLine().getErr().println("fadebench run: warning: code " + plan.link().code().name()
                    + " is not orthogonal; " + plan.link().decoder().cliName()
                    + " linear decoding is not maximum-likelihood, so expect a loss against ML decoding");
        }
        return new SweepJob(plan, spec.commandLine().getOut()).run();
    }

    private Scenario loadScenario() {
        if (preloaded != null) {
            return preloaded;
        }
        if (scenarioFile == null) {
            return null;
        }
        try {
            return ScenarioLoader.load(scenarioFile);
        } catch (ScenarioException e) {
            throw new InvalidInputException(e.getMessage());
        }
    }

    /** Sets every option the scenario names and the command line does not. */
    private void applyScenario(Scenario scenario) {
        CommandLine.ParseResult parsed = spec.commandLine().getParseResult();
        for (Map.Entry<String, Scenario.Setting> e : scenario.settings().entrySet()) {
            String option = e.getValue().key().option();
            if (option == null || (parsed != null && parsed.hasMatchedOption(option))) {
                continue;
            }
            OptionSpec o = spec.findOption(option);
            Scenario.Setting s = e.getValue();
            try {
                o.setValue(convert(o.type(), s.value()));
            } catch (NumberFormatException ex) {
                throw new InvalidInputException(s.where(scenario.source()) + ": expected "
                        + s.key().kind().description() + " in range, got '" + s.value() + "'");
            }
        }
    }

    private static Object convert(Class<?> type, String v) {
        if (type == int.class || type == Integer.class) {
            return Integer.valueOf(v);
        }
        if (type == long.class || type == Long.class) {
            return Long.valueOf(v);
        }
        if (type == double.class || type == Double.class) {
            return Double.valueOf(v);
        }
        if (type == boolean.class || type == Boolean.class) {
            return Boolean.valueOf(v);
        }
        if (type == Path.class) {
            return Path.of(v);
        }
        return v;
    }

    /** An error about an option the scenario set names the file, line and key too. */
    private InvalidInputException locate(InvalidInputException e, Scenario scenario) {
        String msg = e.getMessage();
        if (scenario == null || !msg.startsWith("--")) {
            return e;
        }
        String option = msg.split("[\\s:]", 2)[0];
        Scenario.Setting s = scenario.settings().get(option);
        CommandLine.ParseResult parsed = spec.commandLine().getParseResult();
        if (s == null || (parsed != null && parsed.hasMatchedOption(option))) {
            return e;
        }
        return new InvalidInputException(s.where(scenario.source()) + ": " + msg);
    }

    /** Turns the options into a plan, or throws {@link InvalidInputException} naming the option. */
    RunPlan plan(Scenario scenario) {
        Modulation mod = linkOptions.modulation();
        SpaceTimeCode stbc = linkOptions.code();
        Decoder dec = decoder != null ? parse("--decoder", () -> Decoder.fromCliName(decoder))
                : stbc.isOrthogonal() ? Decoder.MF : Decoder.MMSE;
        ChannelSpec channel = withCorrelationMatrices(channelSpec(), scenario, linkOptions.rx,
                linkOptions.transmitAntennas(stbc));
        double[] snrDb = parse(null, () -> SnrGrid.parse(snr));
        FrameCoding coding = frameCoding();
        int bits = frameOptions.frameBits(coding.coded(), mod, stbc);
        int nTx = linkOptions.transmitAntennas(stbc);
        LinkSettings link = parse(null, () -> new LinkSettings(mod, stbc, nTx, linkOptions.rx, channel, bits,
                frameOptions.coherence,
                dec, coding));
        if (traceOut != null) {
            String name = traceOut.getFileName().toString().toLowerCase(java.util.Locale.ROOT)
                    .replaceAll("\\.(gz|xz|bz2|zst)$", "");
            if (!name.endsWith(".npy") && !name.endsWith(".csv")) {
                throw new InvalidInputException("--trace-out " + traceOut + ": unknown trace type; valid endings: .npy, "
                        + ".csv, each optionally followed by .gz, .xz, .bz2 or .zst");
            }
            if (traceOutBlocks < 1 || traceOutBlocks > 10_000_000) {
                throw new InvalidInputException("--trace-out-blocks must be between 1 and 10000000, got " + traceOutBlocks);
            }
        }
        StopRules rules = parse(null, () -> new StopRules(minErrors, maxFrames, maxSeconds, ferFloor));
        int nThreads = SweepJob.threads(threads);
        if (!(confidence > 0 && confidence < 1)) {
            throw new InvalidInputException("--confidence must lie strictly between 0 and 1 (e.g. 0.95), got "
                    + confidence);
        }
        if (!(targetFer > 0 && targetFer < 1)) {
            throw new InvalidInputException("--target-fer must lie strictly between 0 and 1 (e.g. 0.01), got " + targetFer);
        }
        BoundSettings bounds = boundOptions.settings(link);
        Path archivePath = null;
        if (archive != null) {
            String problem = Archive.problem(archive);
            if (problem != null) {
                throw new InvalidInputException(problem);
            }
            archivePath = Path.of(archive);
        }
        String effective = effectiveScenario(scenario);
        return new RunPlan(link, snr.trim(), snrDb, rules, seed, nThreads, confidence, SweepJob.checkOutDir(out),
                archivePath, resume, quiet, scenario, bounds, targetFer, traceOut, traceOutBlocks,
                effective);
    }

    /**
     * The run's settings as a scenario file: every key of the schema whose option has a value
     * (command line, scenario or default), so that running the file repeats the run.
     */
    private String effectiveScenario(Scenario source) {
        StringBuilder y = new StringBuilder("# fadebench scenario: the settings of this run, written by fadebench");
        y.append(source != null ? " (from " + source.source() + " and the command line)\n" : "\n");
        String section = null;
        for (ScenarioKey key : ScenarioSchema.keys()) {
            if (key.option() == null) {
                continue;
            }
            Object value = spec.findOption(key.option()).getValue();
            if (value == null || key.section().equals("output")) {
                continue;
            }
            if (!key.section().equals(section)) {
                section = key.section();
                y.append(section).append(":\n");
            }
            String text = String.valueOf(value);
            boolean quote = key.kind() == ScenarioKey.Kind.TEXT || key.kind() == ScenarioKey.Kind.SNR;
            y.append("  ").append(key.name()).append(": ")
                    .append(quote ? "\"" + text.replace("\\", "\\\\").replace("\"", "\\\"") + "\"" : text)
                    .append('\n');
        }
        return y.toString();
    }

    /**
     * Full correlation matrices from the scenario file ({@code link.rx_corr_matrix},
     * {@code link.tx_corr_matrix}), checked Hermitian, unit diagonal and positive semidefinite;
     * errors name the file, line and key.
     */
    private static ChannelSpec withCorrelationMatrices(ChannelSpec channel, Scenario scenario, int nr, int mt) {
        if (scenario == null) {
            return channel;
        }
        Scenario.Setting rx = scenario.byPath("link.rx_corr_matrix");
        Scenario.Setting tx = scenario.byPath("link.tx_corr_matrix");
        if (rx == null && tx == null) {
            return channel;
        }
        Scenario.Setting first = rx != null ? rx : tx;
        try {
            if (rx != null && rx.matrix().length != 2 * nr * nr) {
                throw new IllegalArgumentException("the receive correlation matrix must be " + nr + " x " + nr
                        + " for " + nr + " receive antennas");
            }
            if (tx != null && tx.matrix().length != 2 * mt * mt) {
                first = tx;
                throw new IllegalArgumentException("the transmit correlation matrix must be " + mt + " x " + mt
                        + " for " + mt + " transmit antennas");
            }
            return channel.withCorrelation(KroneckerCorrelation.of(nr, mt, rx == null ? null : rx.matrix(),
                    tx == null ? null : tx.matrix()));
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException(first.where(scenario.source()) + ": " + e.getMessage());
        }
    }

    /** The channel from its options; only the options given are passed on. */
    private ChannelSpec channelSpec() {
        ChannelSpec fadingOnly = fadingOptions.channel();
        return parse(null, () -> {
            ChannelSpec c = fadingOnly;
            if (doppler != null) {
                c = c.withDoppler(doppler);
            }
            if (csiError != null) {
                c = c.withCsiError(csiError);
            }
            if (pilots != null) {
                c = c.withPilots(pilots);
            }
            if (trace != null) {
                c = c.withTrace(readTrace(trace));
            }
            return c;
        });
    }

    private static ChannelTrace readTrace(Path file) {
        try {
            return ChannelTrace.read(file);
        } catch (java.io.UncheckedIOException e) {
            throw new IllegalArgumentException("--trace " + file + ": " + (e.getCause() instanceof java.nio.file.NoSuchFileException
                    ? "no such file" : "cannot be read (" + e.getCause().getMessage() + ")"));
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("--trace " + e.getMessage());
        }
    }

    /** CRC, channel code, interleaver and LLRs from their options. */
    private FrameCoding frameCoding() {
        Interleaving il = interleaver == null ? null
                : parse("--interleaver", () -> Interleaving.fromCliName(interleaver));
        LlrMethod method = parse("--llr", () -> LlrMethod.fromCliName(llr));
        return frameOptions.coding(il, interleaverRows, method);
    }

    /** Runs a parser; its IllegalArgumentException becomes invalid input, prefixed with the option. */
    static <T> T parse(String option, Supplier<T> parser) {
        try {
            return parser.get();
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException(option == null ? e.getMessage() : option + ": " + e.getMessage());
        }
    }
}
