package org.fadebench.bench.scenario;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.fadebench.bench.scenario.ScenarioKey.Kind;

/**
 * The keys a scenario file may hold, each tied to the {@code run} option it sets. A scenario sets
 * what the command line would; options given on the command line win. Adding an option to
 * {@code run} means adding one line here (and to the example scenario).
 */
public final class ScenarioSchema {

    private static final List<ScenarioKey> KEYS = List.of(
            new ScenarioKey("link", "code", "--code", Kind.TEXT, "space-time block code"),
            new ScenarioKey("link", "code_file", "--code-file", Kind.PATH, "a space-time code of your own"),
            new ScenarioKey("link", "decoder", "--decoder", Kind.TEXT, "mf, zf, mmse"),
            new ScenarioKey("link", "tx", "--tx", Kind.WHOLE, "transmit antennas"),
            new ScenarioKey("link", "rx", "--rx", Kind.WHOLE, "receive antennas"),
            new ScenarioKey("link", "modulation", "--mod", Kind.TEXT, "bpsk, qpsk, 16qam, 64qam, 256qam"),
            new ScenarioKey("link", "fading", "--fading", Kind.TEXT, "fading model"),
            new ScenarioKey("link", "k_factor", "--k-factor", Kind.NUMBER, "Rician K-factor, linear"),
            new ScenarioKey("link", "nakagami_m", "--nakagami-m", Kind.NUMBER, "Nakagami m"),
            new ScenarioKey("link", "tx_corr", "--tx-corr", Kind.NUMBER, "transmit correlation"),
            new ScenarioKey("link", "rx_corr", "--rx-corr", Kind.NUMBER, "receive correlation"),
            new ScenarioKey("link", "tx_corr_matrix", null, Kind.MATRIX, "full transmit correlation matrix"),
            new ScenarioKey("link", "rx_corr_matrix", null, Kind.MATRIX, "full receive correlation matrix"),
            new ScenarioKey("link", "doppler", "--doppler", Kind.NUMBER, "normalised Doppler"),
            new ScenarioKey("link", "csi_error", "--csi-error", Kind.NUMBER, "CSI error variance"),
            new ScenarioKey("link", "pilots", "--pilots", Kind.WHOLE, "pilot slots per fading block"),
            new ScenarioKey("link", "trace", "--trace", Kind.PATH, "recorded channel trace"),
            new ScenarioKey("link", "fec", "--fec", Kind.TEXT, "channel code"),
            new ScenarioKey("link", "crc", "--crc", Kind.TEXT, "CRC per frame"),
            new ScenarioKey("link", "interleaver", "--interleaver", Kind.TEXT, "random, block, none"),
            new ScenarioKey("link", "interleaver_rows", "--interleaver-rows", Kind.WHOLE, "block interleaver rows"),
            new ScenarioKey("link", "llr", "--llr", Kind.TEXT, "maxlog, exact"),
            new ScenarioKey("link", "frame_bits", "--frame-bits", Kind.WHOLE, "information bits per frame"),
            new ScenarioKey("link", "coherence", "--coherence", Kind.WHOLE, "symbol periods per fading block"),
            new ScenarioKey("sweep", "snr_db", "--snr", Kind.SNR, "SNR points in dB"),
            new ScenarioKey("sweep", "min_errors", "--min-errors", Kind.WHOLE, "frame errors per point"),
            new ScenarioKey("sweep", "max_frames", "--max-frames", Kind.WHOLE, "most frames per point"),
            new ScenarioKey("sweep", "max_seconds", "--max-seconds", Kind.NUMBER, "most seconds per point"),
            new ScenarioKey("sweep", "fer_floor", "--fer-floor", Kind.NUMBER, "stop the sweep below this FER"),
            new ScenarioKey("sweep", "confidence", "--confidence", Kind.NUMBER, "interval level"),
            new ScenarioKey("sweep", "seed", "--seed", Kind.WHOLE, "master seed"),
            new ScenarioKey("sweep", "threads", "--threads", Kind.WHOLE, "worker threads"),
            new ScenarioKey("analysis", "target_fer", "--target-fer", Kind.NUMBER, "FER of the reported SNR and gaps"),
            new ScenarioKey("analysis", "rate", "--rate", Kind.NUMBER, "spectral efficiency of the bounds"),
            new ScenarioKey("analysis", "mi", "--mi", Kind.TEXT, "cm or bicm"),
            new ScenarioKey("analysis", "outage_draws", "--outage-draws", Kind.WHOLE, "draws of the MIMO bound"),
            new ScenarioKey("output", "folder", "--out", Kind.PATH, "output folder"),
            new ScenarioKey("output", "archive", "--archive", Kind.PATH, ".tar.xz or .tar.gz bundle"),
            new ScenarioKey("output", "quiet", "--quiet", Kind.FLAG, "no table or progress bar"),
            new ScenarioKey("output", "overwrite", "--overwrite", Kind.FLAG, "replace another run's results in the folder"),
            new ScenarioKey("output", "trace_out", "--trace-out", Kind.PATH, "record the channels drawn"),
            new ScenarioKey("output", "trace_out_blocks", "--trace-out-blocks", Kind.WHOLE, "most blocks recorded"));

    private ScenarioSchema() {
    }

    public static List<ScenarioKey> keys() {
        return KEYS;
    }

    /** The section names in order. */
    public static List<String> sections() {
        Set<String> s = new LinkedHashSet<>();
        for (ScenarioKey k : KEYS) {
            s.add(k.section());
        }
        return new ArrayList<>(s);
    }

    public static Optional<ScenarioKey> find(String section, String name) {
        return KEYS.stream().filter(k -> k.section().equals(section) && k.name().equals(name)).findFirst();
    }

    public static Optional<ScenarioKey> forOption(String option) {
        return KEYS.stream().filter(k -> option.equals(k.option())).findFirst();
    }

    /** Key names of a section. */
    public static List<String> names(String section) {
        List<String> n = new ArrayList<>();
        for (ScenarioKey k : KEYS) {
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
            int d = editDistance(word.toLowerCase(java.util.Locale.ROOT), c);
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
