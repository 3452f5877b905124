package org.fadebench.bench.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;

/**
 * Writes {@code results.csv}: comment lines starting with {@code #} (link, seed, SNR convention,
 * intervals), then a header and one row per SNR point. No timing goes into this file, so the same
 * seed and settings give the same bytes.
 */
public final class ResultsCsv {

    /** The column names, in order. */
    public static final String HEADER = "snr_db,frames,frame_errors,fer,bits,bit_errors,ber,ebn0_db,"
            + "fer_ci_low,fer_ci_high,ber_ci_low,ber_ci_high,symbols,symbol_errors,ser";

    /** The SNR convention, stated in every output. */
    public static final String SNR_CONVENTION = "snr_db = total transmitted energy per channel use / N0, "
            + "at each receive antenna, with E|h|^2 = 1 and power split equally over the transmit antennas";

    private ResultsCsv() {
    }

    /** The file's text. */
    public static String text(LinkSettings link, long seed, double confidence, List<PointResult> results,
                              boolean interrupted) {
        StringBuilder w = new StringBuilder();
        String level = Numbers.db(100 * confidence) + " %";
        w.append("# fadebench results: ").append(link.describe()).append('\n');
        w.append("# seed ").append(seed).append('\n');
        w.append("# ").append(SNR_CONVENTION).append('\n');
        w.append("# ebn0_db = snr_db - 10 log10(").append(Numbers.db(link.bitsPerChannelUse()))
                .append(" information bits per channel use)\n");
        w.append("# fer_ci_*: two-sided ").append(level).append(" Clopper-Pearson interval over frames; ber_ci_*: ")
                .append(level).append(" interval with frames as clusters of bits (see README)\n");
        if (interrupted) {
            w.append("# interrupted: partial results; run the same command with --resume to finish\n");
        }
        w.append(HEADER).append('\n');
        for (PointResult r : results) {
            FrameCounters c = r.counts();
            w.append(String.join(",",
                    Numbers.db(r.snrDb()),
                    Long.toString(c.frames()),
                    Long.toString(c.frameErrors()),
                    Numbers.rate(c.fer()),
                    Long.toString(c.bits()),
                    Long.toString(c.bitErrors()),
                    Numbers.rate(c.ber()),
                    Numbers.db(r.ebN0Db()),
                    Numbers.rate(r.ferLow()),
                    Numbers.rate(r.ferHigh()),
                    Numbers.rate(r.berLow()),
                    Numbers.rate(r.berHigh()),
                    Long.toString(c.symbols()),
                    Long.toString(c.symbolErrors()),
                    Numbers.rate(c.ser())));
            w.append('\n');
        }
        return w.toString();
    }

    public static void write(Path file, LinkSettings link, long seed, double confidence, List<PointResult> results,
                             boolean interrupted) throws IOException {
        AtomicFiles.writeString(file, text(link, seed, confidence, results, interrupted));
    }
}
