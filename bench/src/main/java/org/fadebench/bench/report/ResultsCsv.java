package org.fadebench.bench.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;

/**
 * Writes {@code results.csv}: comment lines starting with {@code #} (link, seed, SNR convention),
 * then a header and one row per SNR point. No timing goes into this file, so the same seed and
 * settings give the same bytes.
 */
public final class ResultsCsv {

    /** The column names, in order. */
    public static final String HEADER = "snr_db,frames,frame_errors,fer,bits,bit_errors,ber,ebn0_db,"
            + "fer_ci_low,fer_ci_high,symbols,symbol_errors,ser";

    /** The SNR convention, stated in every output. */
    public static final String SNR_CONVENTION = "snr_db = total transmitted energy per channel use / N0, "
            + "at each receive antenna, with E|h|^2 = 1 and power split equally over the transmit antennas";

    private ResultsCsv() {
    }

    /** Writes the file through a temporary name and an atomic rename: never half-written. */
    public static void write(Path file, LinkSettings link, long seed, double confidence,
                             List<PointResult> results) throws IOException {
        Path dir = file.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path tmp = Files.createTempFile(dir, ".results", ".tmp");
        try {
            try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
                w.write("# fadebench results: " + link.describe() + "\n");
                w.write("# seed " + seed + "; fer_ci_low/fer_ci_high: two-sided " + Numbers.db(100 * confidence)
                        + " % Clopper-Pearson interval\n");
                w.write("# " + SNR_CONVENTION + "\n");
                w.write("# ebn0_db = snr_db - 10 log10(" + Numbers.db(link.bitsPerChannelUse())
                        + " information bits per channel use)\n");
                w.write(HEADER + "\n");
                for (PointResult r : results) {
                    FrameCounters c = r.counts();
                    w.write(String.join(",",
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
                            Long.toString(c.symbols()),
                            Long.toString(c.symbolErrors()),
                            Numbers.rate(c.ser())));
                    w.write("\n");
                }
            }
            Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } finally {
            Files.deleteIfExists(tmp);
        }
    }
}
