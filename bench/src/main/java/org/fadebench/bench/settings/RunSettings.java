package org.fadebench.bench.settings;

import static org.fadebench.bench.settings.Setting.Kind.FLAG;
import static org.fadebench.bench.settings.Setting.Kind.MATRIX;
import static org.fadebench.bench.settings.Setting.Kind.NUMBER;
import static org.fadebench.bench.settings.Setting.Kind.PATH;
import static org.fadebench.bench.settings.Setting.Kind.SNR;
import static org.fadebench.bench.settings.Setting.Kind.TEXT;
import static org.fadebench.bench.settings.Setting.Kind.WHOLE;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;

/**
 * The table of every setting of {@code run}: one line per setting. Adding an option to
 * {@code run} means adding one line here (and, for the user, one line in the example scenario);
 * the command line, scenario files, the scenario written beside the results and results.json's
 * settings all follow from it.
 */
public final class RunSettings {

    // link
    public static final Setting CODE = new Setting("link", "code", "--code", TEXT, "NAME", "none",
            "Space-time block code: none, alamouti, g3, g4, h3, h4, r12-5 ... r12-8 (see 'fadebench codes').");
    public static final Setting CODE_FILE = new Setting("link", "code_file", "--code-file", PATH, "FILE", null,
            "A linear space-time code of your own, from a YAML or JSON file (see README), instead of --code.");
    public static final Setting DECODER = new Setting("link", "decoder", "--decoder", TEXT, "NAME", null,
            "Linear decoder: mf, zf, mmse (default: mf for orthogonal codes, mmse otherwise).");
    public static final Setting TX = new Setting("link", "tx", "--tx", WHOLE, "N", null,
            "Transmit antennas (default: what the code needs).");
    public static final Setting RX = new Setting("link", "rx", "--rx", WHOLE, "N", "1", "Receive antennas.");
    public static final Setting MODULATION = new Setting("link", "modulation", "--mod", TEXT, "NAME", "qpsk",
            "Modulation: bpsk, qpsk, 16qam, 64qam, 256qam.");
    public static final Setting FADING = new Setting("link", "fading", "--fading", TEXT, "NAME", "rayleigh",
            "Fading model: " + org.fadebench.channel.ChannelModels.STANDARD.choices() + ".");
    public static final Setting K_FACTOR = new Setting("link", "k_factor", "--k-factor", NUMBER, "K", null,
            "Rician K-factor, linear (with --fading rician).");
    public static final Setting NAKAGAMI_M = new Setting("link", "nakagami_m", "--nakagami-m", NUMBER, "M", null,
            "Nakagami m >= 0.5 (with --fading nakagami).");
    public static final Setting TX_CORR = new Setting("link", "tx_corr", "--tx-corr", NUMBER, "R", null,
            "Exponential correlation r^|i-j| between transmit antennas, |r| < 1.");
    public static final Setting RX_CORR = new Setting("link", "rx_corr", "--rx-corr", NUMBER, "R", null,
            "Exponential correlation r^|i-j| between receive antennas, |r| < 1.");
    public static final Setting TX_CORR_MATRIX = new Setting("link", "tx_corr_matrix", null, MATRIX, null, null,
            "Full transmit correlation matrix (scenario files only).");
    public static final Setting RX_CORR_MATRIX = new Setting("link", "rx_corr_matrix", null, MATRIX, null, null,
            "Full receive correlation matrix (scenario files only).");
    public static final Setting DOPPLER = new Setting("link", "doppler", "--doppler", NUMBER, "FD", null,
            "Normalised Doppler f_D T_s: the channel changes every slot (Clarke/Jakes spectrum).");
    public static final Setting CSI_ERROR = new Setting("link", "csi_error", "--csi-error", NUMBER, "VAR", null,
            "The receiver decodes with H + CN(0, VAR) instead of H.");
    public static final Setting PILOTS = new Setting("link", "pilots", "--pilots", WHOLE, "N", null,
            "The receiver estimates H by least squares from N pilot slots per fading block at the link SNR.");
    public static final Setting TRACE = new Setting("link", "trace", "--trace", PATH, "FILE", null,
            "Replay channel matrices from a .npy or CSV trace (optionally gz, xz, bz2, zst), one per fading block.");
    public static final Setting FEC = new Setting("link", "fec", "--fec", TEXT, "NAME", "none",
            "Channel code: " + ChannelCodes.standard().choices() + ".");
    public static final Setting FEC_FILE = new Setting("link", "fec_file", "--fec-file", PATH, "FILE", null,
            "An LDPC code of your own: its parity-check matrix in the Matrix Market format (.mtx), instead of --fec.");
    public static final Setting FEC_DECODER = new Setting("link", "fec_decoder", "--fec-decoder", TEXT, "NAME", null,
            "LDPC decoder: min-sum (normalised), offset-min-sum, sum-product (default: min-sum).");
    public static final Setting FEC_ITERATIONS = new Setting("link", "fec_iterations", "--fec-iterations", WHOLE, "N",
            null, "Most LDPC decoder iterations per frame (default: " + LdpcDecoding.DEFAULT.iterations() + ").");
    public static final Setting FEC_CORRECTION = new Setting("link", "fec_correction", "--fec-correction", NUMBER, "X",
            null, "Normalisation factor of min-sum (0 < X <= 1) or offset of offset-min-sum (0 to 8, LLR units) "
                    + "(default: " + LdpcAlgorithm.MIN_SUM.defaultCorrection() + ", "
                    + LdpcAlgorithm.OFFSET_MIN_SUM.defaultCorrection() + ").");
    public static final Setting FEC_FULL_ITERATIONS = new Setting("link", "fec_full_iterations",
            "--fec-full-iterations", FLAG, null, "false",
            "The LDPC decoder runs all --fec-iterations iterations instead of stopping once every check holds.");
    public static final Setting CRC = new Setting("link", "crc", "--crc", TEXT, "NAME", "none",
            "CRC appended to each frame: none, crc16, crc24, crc32.");
    public static final Setting INTERLEAVER = new Setting("link", "interleaver", "--interleaver", TEXT, "NAME", null,
            "Bit interleaver of a coded frame: random, block, none (default: random when coded).");
    public static final Setting INTERLEAVER_ROWS = new Setting("link", "interleaver_rows", "--interleaver-rows", WHOLE,
            "N", "0", "Rows of the block interleaver; must divide the coded bits per frame.");
    public static final Setting LLR = new Setting("link", "llr", "--llr", TEXT, "NAME", "maxlog",
            "Soft demapping of a coded frame: maxlog, exact.");
    public static final Setting FRAME_BITS = new Setting("link", "frame_bits", "--frame-bits", WHOLE, "N", null,
            "Information bits per frame, a whole number of code blocks (default: 1024 rounded up to whole blocks).");
    public static final Setting COHERENCE = new Setting("link", "coherence", "--coherence", WHOLE, "SLOTS", "0",
            "Symbol periods per fading block, a multiple of the code's slots; 0 for the whole frame.");
    // sweep
    public static final Setting SNR_DB = new Setting("sweep", "snr_db", "--snr", SNR, "DB", "0..20/2",
            "SNR points in dB: FROM..TO/STEP (TO included when on the grid), one value, or a list a,b,c.");
    public static final Setting MIN_ERRORS = new Setting("sweep", "min_errors", "--min-errors", WHOLE, "N", "100",
            "Frame errors to collect per point; 0 runs exactly --max-frames.");
    public static final Setting MAX_FRAMES = new Setting("sweep", "max_frames", "--max-frames", WHOLE, "N", "1000000",
            "Most frames per point.");
    public static final Setting MAX_SECONDS = new Setting("sweep", "max_seconds", "--max-seconds", NUMBER, "S", "0",
            "Most seconds per point, 0 for no limit; results then depend on the machine.");
    public static final Setting FER_FLOOR = new Setting("sweep", "fer_floor", "--fer-floor", NUMBER, "FER", "1e-6",
            "Stop the sweep after the first point with FER below this.");
    public static final Setting ESTIMATOR = new Setting("sweep", "estimator", "--estimator", TEXT, "NAME", "plain",
            "FER estimator: plain (Monte Carlo), fade-sampling (importance sampling of deep fades: Rayleigh, "
                    + "correlated or not, and Nakagami block fading).");
    public static final Setting REL_PRECISION = new Setting("sweep", "rel_precision", "--rel-precision", NUMBER, "X",
            "0.2", "With fade-sampling: a point stops when its FER interval's half-width is below X times the FER "
                    + "(0 < X < 1), or at --max-frames.");
    public static final Setting CONFIDENCE = new Setting("sweep", "confidence", "--confidence", NUMBER, "LEVEL",
            "0.95", "Confidence level of the FER and BER intervals.");
    public static final Setting SEED = new Setting("sweep", "seed", "--seed", WHOLE, "N", "1", "Master seed.");
    public static final Setting THREADS = new Setting("sweep", "threads", "--threads", WHOLE, "N", null,
            "Worker threads (default: all cores).");
    public static final Setting ENGINE = new Setting("sweep", "engine", "--engine", TEXT, "NAME", "local",
            "Who computes the batches: local (threads of this machine) or spark (Apache Spark; see README, "
                    + "Running on a cluster).");
    public static final Setting SPARK_MASTER = new Setting("sweep", "spark_master", "--spark-master", TEXT, "URL",
            null, "Spark master with --engine spark, e.g. local[2] or spark://HOST:7077 (default: spark-submit's).");
    public static final Setting SPARK_TASKS = new Setting("sweep", "spark_tasks_per_round", "--spark-tasks-per-round",
            WHOLE, "N", null, "Spark tasks per round of batches (default: 3 per core of the cluster).");
    // analysis
    public static final Setting TARGET_FER = new Setting("analysis", "target_fer", "--target-fer", NUMBER, "FER",
            "0.01", "FER at which the SNR and the gap to each outage bound are reported.");
    public static final Setting RATE = new Setting("analysis", "rate", "--rate", NUMBER, "R", null,
            "Spectral efficiency of the bounds in information bits per channel use "
                    + "(default: the link's own, code rate x bits per symbol).");
    public static final Setting MI = new Setting("analysis", "mi", "--mi", TEXT, "KIND", "cm",
            "Mutual information of the QAM bound: cm (coded modulation) or bicm (Gray bit-interleaved).");
    public static final Setting OUTAGE_DRAWS = new Setting("analysis", "outage_draws", "--outage-draws", WHOLE, "N",
            "100000", "Channel draws per SNR point of the Monte Carlo bounds.");
    // output
    public static final Setting FOLDER = new Setting("output", "folder", "--out", PATH, "DIR", "fadebench-out",
            "Folder for the outputs.");
    public static final Setting ARCHIVE = new Setting("output", "archive", "--archive", PATH, "FILE", null,
            "Also bundle the outputs into FILE (.tar.xz, .txz, .tar.gz or .tgz; the name is taken as given).");
    public static final Setting QUIET = new Setting("output", "quiet", "--quiet", FLAG, null, "false",
            "Print nothing but errors; no progress bar.");
    public static final Setting OVERWRITE = new Setting("output", "overwrite", "--overwrite", FLAG, null, "false",
            "Replace the results of another run (or its checkpoint) in the output folder.");
    public static final Setting TRACE_OUT = new Setting("output", "trace_out", "--trace-out", PATH, "FILE", null,
            "Write the channels of the first SNR point's fading blocks to FILE (.npy or .csv, optionally .gz, .xz, "
                    + ".bz2, .zst).");
    public static final Setting TRACE_OUT_BLOCKS = new Setting("output", "trace_out_blocks", "--trace-out-blocks",
            WHOLE, "N", "100000", "Most fading blocks --trace-out writes.");
    public static final Setting PLOT_X = new Setting("output", "plot_x", "--plot-x", TEXT, "NAME", "snr",
            "X axis of fer.png and fer.svg: snr, ebn0.");
    public static final Setting PLOT_FLOOR = new Setting("output", "plot_floor", "--plot-floor", NUMBER, "P", null,
            "Fixed lower end of the plot's y axes, e.g. 1e-6, so that two runs' plots line up "
                    + "(default: fitted to the values).");

    private static final List<Setting> ALL = List.of(
            CODE, CODE_FILE, DECODER, TX, RX, MODULATION, FADING, K_FACTOR, NAKAGAMI_M, TX_CORR, RX_CORR,
            TX_CORR_MATRIX, RX_CORR_MATRIX, DOPPLER, CSI_ERROR, PILOTS, TRACE, FEC, FEC_FILE, FEC_DECODER,
            FEC_ITERATIONS, FEC_CORRECTION, FEC_FULL_ITERATIONS, CRC, INTERLEAVER,
            INTERLEAVER_ROWS, LLR, FRAME_BITS, COHERENCE,
            SNR_DB, MIN_ERRORS, MAX_FRAMES, MAX_SECONDS, FER_FLOOR, ESTIMATOR, REL_PRECISION, CONFIDENCE, SEED, THREADS,
            ENGINE, SPARK_MASTER, SPARK_TASKS,
            TARGET_FER, RATE, MI, OUTAGE_DRAWS,
            FOLDER, ARCHIVE, QUIET, OVERWRITE, TRACE_OUT, TRACE_OUT_BLOCKS, PLOT_X, PLOT_FLOOR);

    private RunSettings() {
    }

    /** Every setting, in the order of the scenario file. */
    public static List<Setting> all() {
        return ALL;
    }

    /** The section names in order. */
    public static List<String> sections() {
        Set<String> s = new LinkedHashSet<>();
        for (Setting k : ALL) {
            s.add(k.section());
        }
        return new ArrayList<>(s);
    }

    public static Optional<Setting> find(String section, String name) {
        return ALL.stream().filter(k -> k.section().equals(section) && k.name().equals(name)).findFirst();
    }

    public static Optional<Setting> forOption(String option) {
        return ALL.stream().filter(k -> option.equals(k.option())).findFirst();
    }

    /** Key names of a section. */
    public static List<String> names(String section) {
        List<String> n = new ArrayList<>();
        for (Setting k : ALL) {
            if (k.section().equals(section)) {
                n.add(k.name());
            }
        }
        return Collections.unmodifiableList(n);
    }

    /** The valid word closest to {@code word} by edit distance, if it is close enough to be a typo. */
    public static Optional<String> closest(String word, List<String> candidates) {
        String best = null;
        int bestD = Integer.MAX_VALUE;
        for (String c : candidates) {
            int d = editDistance(word.toLowerCase(Locale.ROOT), c);
            if (d < bestD) {
                bestD = d;
                best = c;
            }
        }
        return best != null && bestD <= Math.max(2, word.length() / 3) ? Optional.of(best) : Optional.empty();
    }

    /** Levenshtein distance (V. I. Levenshtein, 1966), the usual dynamic programme. */
    static int editDistance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }
}
