package org.fadebench.bench.run;

import static org.fadebench.bench.settings.RunSettings.*;

import java.io.Serializable;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.BooleanSupplier;
import java.util.function.Supplier;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.analysis.CsiAgeing;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.link.ChannelRecorder;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.report.Archive;
import org.fadebench.bench.report.FerPlot;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;
import org.fadebench.bench.settings.SettingsText;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.SnrGrid;
import org.fadebench.bench.sweep.Estimator;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.ChannelTrace;
import org.fadebench.channel.KroneckerCorrelation;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcCodeFile;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.fec.ldpc.ParityCheckMatrix;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodeFile;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation;
import org.fadebench.modem.NamedChoice;

/**
 * A validated {@code run}: everything needed to simulate, report and resume, built from the
 * run's {@link SettingValues} alone ({@link #from}), without any command-line library, so that
 * any process that holds the values (a worker of a cluster, a test) can rebuild the same run. Its
 * serialised form is those values.
 *
 * @param values   the settings it was built from (paths resolved)
 * @param source   the scenario file it came from, or null
 * @param archive  the archive to write, or null
 * @param bounds   the outage bounds to compare with, or null when they do not apply to the code
 * @param traceOut where to write the channels of the first point's fading blocks, or null
 * @param plotAxes the plot's x quantity and y-axis floor
 * @param warnings what the user should know before trusting the results (printed, and kept in results.json)
 */
public record RunPlan(SettingValues values, String source, LinkSettings link, double[] snrDb, StopRules rules,
                      long seed, int threads, double confidence, Path outDir, Path archive, boolean quiet,
                      BoundSettings bounds, double targetFer, Path traceOut, int traceOutBlocks,
                      FerPlot.Axes plotAxes, List<String> warnings)
        implements Serializable {

    /**
     * Builds and checks the run described by {@code values} (unset settings take the table's
     * defaults). Throws {@link InvalidSettingException} naming the setting at fault, or
     * {@link IllegalArgumentException} for a problem of several settings together.
     *
     * @param source the scenario file the values came from, for results.json, or null
     */
    public static RunPlan from(SettingValues values, String source) {
        SettingValues v = SettingValues.defaults(RunSettings.all()).overlaidBy(values);
        LinkSettings link = link(v);
        double[] snrDb = parse(null, () -> SnrGrid.parse(v.text(SNR_DB)));
        Path traceOut = v.isSet(TRACE_OUT) ? Path.of(v.text(TRACE_OUT)) : null;
        int traceOutBlocks = v.integer(TRACE_OUT_BLOCKS);
        if (traceOut != null) {
            String name = traceOut.getFileName().toString().toLowerCase(Locale.ROOT)
                    .replaceAll("\\.(gz|xz|bz2|zst)$", "");
            if (!name.endsWith(".npy") && !name.endsWith(".csv")) {
                throw new InvalidSettingException(TRACE_OUT, traceOut + ": unknown trace type; valid endings: .npy, "
                        + ".csv, each optionally followed by .gz, .xz, .bz2 or .zst");
            }
            if (traceOutBlocks < 1 || traceOutBlocks > 10_000_000) {
                throw new InvalidSettingException(TRACE_OUT_BLOCKS, "must be between 1 and 10000000, got "
                        + traceOutBlocks);
            }
        }
        Estimator estimator = parse(ESTIMATOR, () -> Estimator.of(v.text(ESTIMATOR)));
        StopRules rules = parse(null, () -> new StopRules(v.whole(MIN_ERRORS), v.whole(MAX_FRAMES),
                v.number(MAX_SECONDS), v.number(FER_FLOOR), estimator, v.number(REL_PRECISION)));
        if (rules.fadeSampling() && Double.isNaN(link.channel().model().fadeShape())) {
            throw new InvalidSettingException(ESTIMATOR, "fade-sampling needs rayleigh (independent or correlated) or "
                    + "nakagami block fading, without --trace or --doppler; got " + link.channel().describe());
        }
        int threads = v.isSet(THREADS) ? v.integer(THREADS) : Runtime.getRuntime().availableProcessors();
        if (threads <= 0 || threads > 1024) {
            throw new InvalidSettingException(THREADS, "must be between 1 and 1024, got " + threads);
        }
        requireHeap(link, threads, traceOut == null ? 0 : traceOutBlocks);
        Engine.from(v);
        double confidence = v.number(CONFIDENCE);
        if (!(confidence > 0 && confidence < 1)) {
            throw new InvalidSettingException(CONFIDENCE, "must lie strictly between 0 and 1 (e.g. 0.95), got "
                    + confidence);
        }
        double targetFer = v.number(TARGET_FER);
        if (!(targetFer > 0 && targetFer < 1)) {
            throw new InvalidSettingException(TARGET_FER, "must lie strictly between 0 and 1 (e.g. 0.01), got "
                    + targetFer);
        }
        BoundSettings bounds = bounds(v, link);
        Path archive = null;
        if (v.isSet(ARCHIVE)) {
            String problem = Archive.problem(v.text(ARCHIVE));
            if (problem != null) {
                throw new IllegalArgumentException(problem);
            }
            archive = Path.of(v.text(ARCHIVE));
        }
        Path outDir = Path.of(v.text(FOLDER));
        if (Files.exists(outDir) && !Files.isDirectory(outDir)) {
            throw new InvalidSettingException(FOLDER, v.text(FOLDER) + " exists and is not a folder");
        }
        FerPlot.XQuantity x = parse(PLOT_X, () -> FerPlot.XQuantity.fromCliName(v.text(PLOT_X)));
        FerPlot.Axes axes = parse(null, () -> new FerPlot.Axes(x, v.isSet(PLOT_FLOOR) ? v.number(PLOT_FLOOR)
                : Double.NaN));
        return new RunPlan(resolvePaths(v), source, link, snrDb, rules, v.whole(SEED), threads, confidence, outDir, archive,
                v.flag(QUIET), bounds, targetFer, traceOut, traceOutBlocks, axes, warnings(link));
    }

    /** Who computes the batches (checked by {@link #from}). */
    public Engine engine() {
        return Engine.from(SettingValues.defaults(RunSettings.all()).overlaidBy(values));
    }

    /**
     * The same run on {@code workers} threads, printing nothing but errors when {@code quiet}, its
     * settings left as they were: a study gives its thread count and its quietness to every design
     * this way, so that the scenario each design writes names neither (neither changes a number)
     * and is the same on any machine and however the study is run.
     */
    public RunPlan onThreads(int workers, boolean quiet) {
        if (workers <= 0 || workers > 1024) {
            throw new InvalidSettingException(THREADS, "must be between 1 and 1024, got " + workers);
        }
        requireHeap(link, workers, traceOut == null ? 0 : traceOutBlocks);
        return new RunPlan(values, source, link, snrDb, rules, seed, workers, confidence, outDir, archive, quiet, bounds,
                targetFer, traceOut, traceOutBlocks, plotAxes, warnings);
    }

    /**
     * The outage bounds at the SNRs of {@code points}, with their crossings of the target found
     * beyond the sweep where needed ({@link BoundCurves#reaching}); null where no bounds apply or
     * nothing was simulated. {@code stop} is polled during Monte Carlo counts, which then throw
     * {@link java.util.concurrent.CancellationException}.
     */
    public BoundCurves boundCurves(List<PointResult> points, BooleanSupplier stop) {
        if (bounds == null || points.isEmpty()) {
            return null;
        }
        return BoundCurves.compute(bounds, points.stream().mapToDouble(PointResult::snrDb).toArray(), stop)
                .reaching(targetFer, stop);
    }

    /**
     * The summary of the finished points: diversity, SNR at the target, gaps to {@code curves}
     * (null where none apply: {@code noBounds} says why, or, when null, {@link RunSummary#noBounds}).
     */
    public RunSummary summary(List<PointResult> complete, BoundCurves curves, String noBounds) {
        return RunSummary.of(link, complete, curves, targetFer, noBounds != null ? noBounds : RunSummary.noBounds(link));
    }

    /** What the user should know before trusting the results: a decoder that is not ML, CSI that is meaningless. */
    private static List<String> warnings(LinkSettings link) {
        List<String> w = new ArrayList<>();
        if (!link.code().isOrthogonal()) {
            w.add("code " + link.code().name() + " is not orthogonal; " + link.equaliser().cliName()
                    + " linear decoding is not maximum-likelihood, so expect a loss against ML decoding");
        }
        CsiAgeing.warning(link).ifPresent(w::add);
        return List.copyOf(w);
    }

    /**
     * The link the values describe: code, antennas, modulation, channel, frame coding, frame length
     * and coherence (also what {@code bounds} computes the bounds of). Unset settings must already
     * hold the table's defaults.
     */
    public static LinkSettings link(SettingValues v) {
        Modulation mod = parse(MODULATION, () -> Modulation.fromCliName(v.text(MODULATION)));
        SpaceTimeCode stbc = code(v);
        Equaliser dec = v.isSet(DECODER) ? parse(DECODER, () -> Equaliser.fromCliName(v.text(DECODER)))
                : stbc.isOrthogonal() ? Equaliser.MF : Equaliser.MMSE;
        int nr = v.integer(RX);
        int mt = v.isSet(TX) ? v.integer(TX) : stbc.transmitAntennas();
        ChannelSpec channel = withCorrelationMatrices(channelSpec(v), v, nr, mt);
        FrameCoding coding = frameCoding(v);
        int bits = v.isSet(FRAME_BITS) ? v.integer(FRAME_BITS)
                : coding.coded() ? coding.scheme().payloadNear(LinkSettings.DEFAULT_FRAME_BITS)
                : LinkSettings.roundUpToBlocks(LinkSettings.DEFAULT_FRAME_BITS, mod, stbc);
        int coherence = v.integer(COHERENCE);
        return parse(null, () -> new LinkSettings(mod, stbc, nr, mt, channel, bits, coherence, dec, coding));
    }

    /**
     * Refuses a run whose buffers (one chain per worker thread, and the recorder of
     * {@code recordedBlocks} channels for --trace-out) would not fit in three quarters of the heap
     * still free, before anything is allocated.
     */
    private static void requireHeap(LinkSettings link, int threads, int recordedBlocks) {
        long chain = LinkChain.bufferBytes(link);
        long recorder = recordedBlocks == 0 ? 0
                : ChannelRecorder.bufferBytes(link.receiveAntennas(), link.transmitAntennas(), recordedBlocks);
        long needed = recorder == Long.MAX_VALUE ? recorder : chain * threads + recorder;
        Runtime rt = Runtime.getRuntime();
        long free = rt.maxMemory() - (rt.totalMemory() - rt.freeMemory());
        if (needed > free / 4 * 3) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "not enough memory: this run needs about %s (%s per worker thread x %d%s) but the Java heap has %s "
                            + "free; use shorter --frame-bits, fewer --rx, fewer --threads%s, or a larger heap "
                            + "(java -Xmx...)", mebibytes(needed), mebibytes(chain), threads,
                    recorder > 0 ? ", plus " + mebibytes(recorder) + " for --trace-out" : "", mebibytes(free),
                    recorder > 0 ? ", fewer --trace-out-blocks" : ""));
        }
    }

    private static String mebibytes(long bytes) {
        return bytes == Long.MAX_VALUE ? "more than 16 GiB in one array" : (bytes + (1 << 20) - 1 >> 20) + " MiB";
    }

    /**
     * The bound settings for a link, or null where they do not apply: a code that is not
     * orthogonal, a channel that changes within a block (Doppler) or replays a trace, and an AWGN
     * link, whose fixed channel has no outage ({@link RunSummary#noBounds} says why).
     */
    public static BoundSettings bounds(SettingValues v, LinkSettings link) {
        Double rate = v.number(RATE);
        if (rate != null && !(rate > 0)) {
            throw new InvalidSettingException(RATE, "must be a positive number of bits per channel use, got " + rate);
        }
        int draws = v.integer(OUTAGE_DRAWS);
        if (draws < 1 || draws > 100_000_000) {
            throw new InvalidSettingException(OUTAGE_DRAWS, "must be between 1 and 100000000, got " + draws);
        }
        MutualInformation.Kind kind = parse(MI, () -> MutualInformation.Kind.fromCliName(v.text(MI)));
        if (!link.code().isOrthogonal()) {
            return null;
        }
        BoundSettings s = parse(null, () -> BoundSettings.of(link));
        if (rate != null) {
            s = s.withSpectralEfficiency(rate);
        }
        s = s.withInformation(kind).withMimoDraws(draws, BoundSettings.DEFAULT_MIMO_SEED);
        ChannelSpec channel = link.channel();
        if (channel.varies() || channel.trace() != null || channel.awgn()) {
            return null;
        }
        return s.withChannel(channel);
    }

    /** The space-time code: from the catalogue, or from a file. */
    public static SpaceTimeCode code(SettingValues v) {
        if (v.isSet(CODE_FILE)) {
            if (v.isSet(CODE) && v.origin(CODE) != SettingValues.Origin.DEFAULT) {
                throw new InvalidSettingException(CODE_FILE, v.text(CODE_FILE)
                        + ": give either --code or --code-file, not both");
            }
            return parse(CODE_FILE, () -> SpaceTimeCodeFile.read(Path.of(v.text(CODE_FILE))));
        }
        return parse(CODE, () -> SpaceTimeCodes.byName(v.text(CODE)));
    }

    /** The run's settings as a scenario file, so that running the file repeats the run. */
    public String scenarioText() {
        List<String> comment = new ArrayList<>();
        // no word of where the settings came from: the file run again in its folder writes the same bytes
        comment.add("fadebench scenario: the settings of this run, written by fadebench; 'fadebench run FILE' repeats it");
        comment.add("every setting is listed; those not set are comments; file and folder names are stored resolved "
                + "(absolute)");
        // a code file takes the place of --code, whose default ("none") the file must not repeat: a
        // scenario giving both is refused
        SettingValues written = values.isSet(CODE_FILE) ? values.with(CODE, null, null) : values;
        return SettingsText.scenario(written, RunSettings.all(), comment);
    }

    /**
     * The settings as results.json records them: every setting by its key, those derived from
     * others (antennas, decoder, frame length, interleaver, threads, rate) at the value the run
     * used, and an LDPC code's decoding; then the SNR points, the channel's description and the
     * scenario file.
     */
    public Map<String, Object> settings() {
        Map<String, Object> m = SettingsText.json(values, RunSettings.all());
        m.put(TX.jsonKey(), link.transmitAntennas());
        m.put(DECODER.jsonKey(), link.equaliser().cliName());
        m.put(FRAME_BITS.jsonKey(), link.frameBits());
        m.put(INTERLEAVER.jsonKey(), link.coding().interleaving().cliName());
        m.put(THREADS.jsonKey(), threads);
        m.put(RATE.jsonKey(), bounds == null ? null : bounds.spectralEfficiency());
        if (link.coding().scheme().code() instanceof LdpcCode ldpc) {
            LdpcDecoding d = ldpc.decoding();
            m.put(FEC_DECODER.jsonKey(), d.algorithm().cliName());
            m.put(FEC_ITERATIONS.jsonKey(), d.iterations());
            m.put(FEC_CORRECTION.jsonKey(), d.algorithm().corrected() ? d.correction() : null);
        }
        m.put("snr_points_db", snrDb);
        m.put("channel", link.channel().describe());
        m.put("scenario", source);
        return m;
    }

    /**
     * Every setting that changes the numbers, for the checkpoint's fingerprint. Its first field
     * changes when the same settings give other numbers: v4 since the noise order of version 0.2.0,
     * so that a checkpoint of 0.1.0 is not resumed with draws in another order. A fade-sampling
     * run's own fields end in {@code scale2} since its frozen fade scale became twice the
     * cross-entropy one (version 0.3.0), so that its earlier checkpoints, drawn with another scale,
     * are not resumed; plain runs' numbers did not change and their checkpoints still resume.
     */
    public String numbersFingerprintText(int batchFrames) {
        return String.join("|", "v4", link.describe(), link.coding().toString(), parityChecks(link),
                link.channel().describe(),
                SpaceTimeCodeFile.format(link.code()), link.equaliser().cliName(), link.modulation().cliName(),
                link.fading(), Integer.toString(link.coherenceSlots()), Arrays.toString(snrDb),
                Long.toString(rules.minErrors()), Long.toString(rules.maxFrames()), Double.toString(rules.maxSeconds()),
                Double.toString(rules.ferFloor()), Long.toString(seed), Integer.toString(batchFrames))
                + (rules.fadeSampling() ? "|" + rules.estimator().cliName() + "|" + rules.relPrecision() + "|scale2" : "");
    }

    /**
     * A digest of an LDPC code's parity-check matrix at the link's frame size (a user's file may
     * change between an interrupted run and its resumption), empty for other codes.
     */
    private static String parityChecks(LinkSettings link) {
        if (!(link.coding().scheme().code() instanceof LdpcCode ldpc)) {
            return "";
        }
        ParityCheckMatrix h = ldpc.layout(link.coding().scheme().infoBits(link.frameBits())).matrix();
        MessageDigest md;
        try {
            md = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
        ByteBuffer row = ByteBuffer.allocate(4 * (h.columns() + 2));
        for (int i = 0; i < h.rows(); i++) {
            row.clear();
            row.putInt(i).putInt(h.rowDegree(i));
            for (int p = 0; p < h.rowDegree(i); p++) {
                row.putInt(h.rowEntry(i, p));
            }
            md.update(row.array(), 0, row.position());
        }
        return h.rows() + "x" + h.columns() + ":" + HexFormat.of().formatHex(md.digest());
    }

    /** A plan travels as its settings and is rebuilt from them where it arrives. */
    private Object writeReplace() {
        return new Serialised(values, source);
    }

    private record Serialised(SettingValues values, String source) implements Serializable {
        private Object readResolve() {
            return from(values, source);
        }
    }

    /** File and folder names made absolute, so a written scenario means the same from anywhere. */
    private static SettingValues resolvePaths(SettingValues v) {
        for (Setting s : RunSettings.all()) {
            if (s.kind() == Setting.Kind.PATH && v.isSet(s)) {
                String text = v.text(s);
                if (text.isBlank()) {
                    throw new InvalidSettingException(s, "needs a file or folder name, got nothing");
                }
                String resolved = parse(s, () -> Path.of(text).toAbsolutePath().normalize().toString());
                v = v.with(s, resolved, v.origin(s));
            }
        }
        return v;
    }

    /** Full correlation matrices ({@code link.rx_corr_matrix}, {@code link.tx_corr_matrix}). */
    private static ChannelSpec withCorrelationMatrices(ChannelSpec channel, SettingValues v, int nr, int mt) {
        double[] rx = v.matrix(RX_CORR_MATRIX);
        double[] tx = v.matrix(TX_CORR_MATRIX);
        if (rx == null && tx == null) {
            return channel;
        }
        if (rx != null && rx.length != 2 * nr * nr) {
            throw new InvalidSettingException(RX_CORR_MATRIX, "must be " + nr + " x " + nr + " for " + nr
                    + " receive antennas");
        }
        if (tx != null && tx.length != 2 * mt * mt) {
            throw new InvalidSettingException(TX_CORR_MATRIX, "must be " + mt + " x " + mt + " for " + mt
                    + " transmit antennas");
        }
        return parse(rx != null ? RX_CORR_MATRIX : TX_CORR_MATRIX,
                () -> channel.withCorrelation(KroneckerCorrelation.of(nr, mt, rx, tx)));
    }

    /** The channel from its settings; only the settings given are passed on. */
    private static ChannelSpec channelSpec(SettingValues v) {
        ChannelSpec named = parse(FADING, () -> ChannelSpec.of(v.text(FADING)));
        return parse(null, () -> {
            ChannelSpec c = named;
            if (v.isSet(K_FACTOR)) {
                c = c.withKFactor(v.number(K_FACTOR));
            }
            if (v.isSet(NAKAGAMI_M)) {
                c = c.withNakagamiM(v.number(NAKAGAMI_M));
            }
            if (v.isSet(TX_CORR)) {
                c = c.withTxCorr(v.number(TX_CORR));
            }
            if (v.isSet(RX_CORR)) {
                c = c.withRxCorr(v.number(RX_CORR));
            }
            if (v.isSet(DOPPLER)) {
                c = c.withDoppler(v.number(DOPPLER));
            }
            if (v.isSet(CSI_ERROR)) {
                c = c.withCsiError(v.number(CSI_ERROR));
            }
            if (v.isSet(PILOTS)) {
                c = c.withPilots(v.integer(PILOTS));
            }
            if (v.isSet(TRACE)) {
                // read by its absolute name, so that the results name the trace alike from any folder
                c = c.withTrace(readTrace(Path.of(v.text(TRACE)).toAbsolutePath().normalize()));
            }
            return c;
        });
    }

    private static ChannelTrace readTrace(Path file) {
        try {
            return ChannelTrace.read(file);
        } catch (java.io.UncheckedIOException e) {
            throw new InvalidSettingException(TRACE, file + ": " + (e.getCause() instanceof java.nio.file.NoSuchFileException
                    ? "no such file" : "cannot be read (" + e.getCause().getMessage() + ")"));
        } catch (IllegalArgumentException e) {
            throw new InvalidSettingException(TRACE, e.getMessage());
        }
    }

    /** CRC, channel code, interleaver and LLRs from their settings. */
    private static FrameCoding frameCoding(SettingValues v) {
        Crc c = parse(CRC, () -> Crc.fromCliName(v.text(CRC)));
        ChannelCode code = channelCode(v);
        boolean coded = c != Crc.NONE || code != ChannelCodes.NONE;
        Interleaving il = v.isSet(INTERLEAVER) ? parse(INTERLEAVER, () -> Interleaving.fromCliName(v.text(INTERLEAVER)))
                : coded ? Interleaving.RANDOM : Interleaving.NONE;
        LlrMethod method = parse(LLR, () -> LlrMethod.fromCliName(v.text(LLR)));
        int rows = v.integer(INTERLEAVER_ROWS);
        return parse(null, () -> new FrameCoding(new FecScheme(c, code), il, rows, method));
    }

    /**
     * The channel code: by name ({@code --fec}) or an LDPC code of the user's ({@code --fec-file}),
     * an LDPC code decoded as its settings say; those settings are refused with any other code.
     */
    private static ChannelCode channelCode(SettingValues v) {
        ChannelCode named = parse(FEC, () -> ChannelCodes.standard().find(v.text(FEC)));
        if (v.isSet(FEC_FILE) && named != ChannelCodes.NONE) {
            throw new InvalidSettingException(FEC_FILE, v.text(FEC_FILE) + ": give either --fec or --fec-file, not both");
        }
        if (v.isSet(FEC_FILE)) {
            Path file = Path.of(v.text(FEC_FILE)).toAbsolutePath().normalize();
            ParityCheckMatrix h = parse(FEC_FILE, () -> LdpcCodeFile.read(file));
            LdpcDecoding decoding = ldpcDecoding(v);
            return parse(FEC_FILE, () -> LdpcCode.ofMatrix(file.getFileName().toString(), h, decoding));
        }
        if (named instanceof LdpcCode ldpc) {
            return ldpc.withDecoding(ldpcDecoding(v));
        }
        for (Setting s : List.of(FEC_DECODER, FEC_ITERATIONS, FEC_CORRECTION, FEC_FULL_ITERATIONS)) {
            boolean given = s.kind() == Setting.Kind.FLAG ? v.flag(s) : v.isSet(s);
            if (given) {
                throw new InvalidSettingException(s, "goes with an LDPC code (--fec-file, or an ldpc code of --fec); "
                        + "--fec " + named.cliName() + " has no such decoder");
            }
        }
        return named;
    }

    /** How an LDPC code is decoded: the algorithm, the most iterations, the correction and early stop. */
    private static LdpcDecoding ldpcDecoding(SettingValues v) {
        LdpcAlgorithm algorithm = v.isSet(FEC_DECODER) ? parse(FEC_DECODER,
                () -> NamedChoice.find(LdpcAlgorithm.values(), v.text(FEC_DECODER), "LDPC decoder"))
                : LdpcDecoding.DEFAULT.algorithm();
        int iterations = v.isSet(FEC_ITERATIONS) ? v.integer(FEC_ITERATIONS) : LdpcDecoding.DEFAULT.iterations();
        double correction = v.isSet(FEC_CORRECTION) ? v.number(FEC_CORRECTION) : algorithm.defaultCorrection();
        return parse(null, () -> new LdpcDecoding(algorithm, iterations, !v.flag(FEC_FULL_ITERATIONS), correction));
    }

    /**
     * Runs a parser. Its {@link IllegalArgumentException} becomes an {@link InvalidSettingException}
     * of {@code setting}, or, when {@code setting} is null, of the setting whose option the message
     * starts with (the library's messages name the option at fault); others pass unchanged.
     */
    static <T> T parse(Setting setting, Supplier<T> parser) {
        try {
            return parser.get();
        } catch (InvalidSettingException e) {
            throw e;
        } catch (IllegalArgumentException e) {
            String msg = String.valueOf(e.getMessage());
            if (setting != null) {
                throw new InvalidSettingException(setting, ": " + msg);
            }
            String first = msg.split("[\\s:]", 2)[0];
            Setting named = first.startsWith("--") ? RunSettings.forOption(first).orElse(null) : null;
            if (named == null) {
                throw e;
            }
            throw new InvalidSettingException(named, msg.substring(first.length()).stripLeading());
        }
    }
}
