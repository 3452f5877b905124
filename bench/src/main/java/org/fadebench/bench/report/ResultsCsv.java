package org.fadebench.bench.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.analysis.NormalApproximation;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.WeightedInterval;

/**
 * Writes {@code results.csv}: comment lines starting with {@code #} (link, seed, SNR convention,
 * intervals), then a header and one row per SNR point; an AWGN link has one more column at the
 * end, {@value #NORMAL_APPROX_COLUMN}. No timing goes into this file, so the same
 * seed and settings give the same bytes.
 */
public final class ResultsCsv {

    /** The column names, in order. */
    public static final String HEADER = "snr_db,frames,frame_errors,fer,bits,bit_errors,ber,ebn0_db,"
            + "fer_ci_low,fer_ci_high,ber_ci_low,ber_ci_high,symbols,symbol_errors,ser,"
            + "p_out_mimo,p_out_stbc,p_out_qam,p_out_mimo_ci_low,p_out_mimo_ci_high,crc_failures,undetected_errors,"
            + "fec_iterations_mean";

    /** The column an AWGN link adds at the end (see {@link NormalApproximation}); other links have none. */
    public static final String NORMAL_APPROX_COLUMN = "fer_normal_approx";

    /**
     * The columns a run with {@code --estimator fade-sampling} adds at the end; plain runs have none,
     * so that their files stay as they were.
     */
    public static final String FADE_SAMPLING_COLUMNS = "estimator,effective_frames,fer_rel_halfwidth,fade_scale,fer_note";

    /** The note of a weighted point whose interval is not to be trusted. */
    public static final String UNTRUSTED = "too few effective errors";

    /** The SNR convention, stated in every output. */
    public static final String SNR_CONVENTION = "snr_db = total transmitted energy per channel use / N0, "
            + "at each receive antenna, with E|h|^2 = 1 and power split equally over the transmit antennas";

    private ResultsCsv() {
    }

    /**
     * The pilots' overhead as the README states it: not charged to the SNR, reported as the share of
     * slots and the net information bits per channel use. One line, for the terminal and the header.
     */
    public static String pilotLine(LinkSettings link) {
        return "pilots: " + link.channel().pilots() + " slots per fading block, not counted in the SNR or in R;"
                + String.format(Locale.ROOT, " overhead %.2f %% of the slots, so ", 100 * link.pilotOverhead())
                + Numbers.db(link.netBitsPerChannelUse()) + " net information bits per channel use";
    }

    /** The file's text. */
    public static String text(LinkSettings link, long seed, double confidence, List<PointResult> results,
                              boolean interrupted, BoundCurves bounds) {
        StringBuilder w = new StringBuilder();
        String level = Numbers.db(100 * confidence) + " %";
        w.append("# fadebench results: ").append(link.describe()).append('\n');
        w.append("# seed ").append(seed).append('\n');
        w.append("# ").append(SNR_CONVENTION).append('\n');
        w.append("# ebn0_db = snr_db - 10 log10(").append(Numbers.db(link.bitsPerChannelUse()))
                .append(" information bits per channel use)\n");
        if (link.channel().pilots() > 0) {
            w.append("# ").append(pilotLine(link)).append('\n');
        }
        boolean weighted = results.stream().anyMatch(r -> r.counts().weighted());
        if (!weighted) {
            // a fade-sampling run's intervals are described with its estimator below
            w.append("# fer_ci_*: two-sided ").append(level).append(" Clopper-Pearson interval over frames; ber_ci_*: ")
                    .append(level).append(" interval with frames as clusters of bits (see README)\n");
        }
        boolean awgn = link.channel().awgn();
        if (bounds != null) {
            BoundSettings b = bounds.settings();
            w.append("# p_out_*: outage probability at R = ").append(Numbers.db(b.spectralEfficiency()))
                    .append(" bits per channel use, ").append(b.channelWords())
                    .append(": mimo = Gaussian inputs on the ")
                    .append(b.transmitAntennas()).append('x').append(b.receiveAntennas()).append(" channel")
                    .append("; stbc = the code with Gaussian symbols; qam = the code with ")
                    .append(link.modulation().cliName()).append(" (").append(b.information().cliName()).append(")\n");
            for (Bound bound : Bound.values()) {
                w.append("# p_out_").append(bound.key()).append(": ").append(b.method(bound)).append('\n');
            }
            w.append("# a Monte Carlo value is left empty where its interval is wider than the value\n");
        } else if (awgn) {
            w.append("# p_out_*: empty, ").append(RunSummary.NO_BOUNDS_AWGN).append('\n');
        } else {
            w.append("# p_out_*: empty, outage bounds are given for orthogonal codes over channels constant within a "
                    + "block (no Doppler, no trace)\n");
        }
        Optional<NormalApproximation> normal = NormalApproximation.of(link);
        if (normal.isPresent()) {
            NormalApproximation a = normal.get();
            w.append("# ").append(NORMAL_APPROX_COLUMN).append(": finite-blocklength limit, normal approximation")
                    .append(" Q((nC - k + log2(n)/2) / sqrt(nV)) (Polyanskiy, Poor, Verdu 2010) with n = ")
                    .append(a.symbols()).append(" channel uses (").append(a.modulation().cliName())
                    .append(" symbols, each at ").append(Numbers.db(a.symbolGain())).append(" x SNR), k = ")
                    .append(a.payloadBits()).append(" information bits, C and V of the ")
                    .append(a.modulation().cliName()).append("-input AWGN channel (coded modulation)\n");
        } else if (awgn) {
            w.append("# ").append(NORMAL_APPROX_COLUMN).append(": empty, ").append(NormalApproximation.NOT_APPLICABLE)
                    .append('\n');
        }
        if (link.coding().coded()) {
            w.append("# coded: ").append(link.coding().describe()).append("; ").append(link.codedBitsPerFrame())
                    .append(" coded bits per frame; symbols and ser count raw decisions on the coded bits; ")
                    .append("crc_failures: frames whose CRC did not check; undetected_errors: wrong frames whose CRC checked\n");
        }
        if (weighted) {
            w.append("# estimator fade-sampling: fades drawn with each entry's power scaled by fade_scale, each frame ")
                    .append("weighted by its likelihood ratio; fer, ber, ser are weighted means, frame_errors and the other ")
                    .append("counts are counts of the drawn frames; fer_ci_* and ber_ci_*: ").append(level)
                    .append(" normal intervals from the weighted sample variance; effective_frames: plain frames giving ")
                    .append("the same variance; fer_note: '").append(UNTRUSTED).append("' below ")
                    .append(Numbers.db(WeightedInterval.MIN_EFFECTIVE_ERRORS)).append(" effective error frames\n");
        }
        if (interrupted) {
            w.append("# interrupted: partial results; run the same command with --resume to finish\n");
        }
        w.append(HEADER).append(awgn ? "," + NORMAL_APPROX_COLUMN : "").append(weighted ? "," + FADE_SAMPLING_COLUMNS : "")
                .append('\n');
        for (int i = 0; i < results.size(); i++) {
            PointResult r = results.get(i);
            FrameCounters c = r.counts();
            BoundPoint b = bounds == null ? null : bounds.points().get(i);
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
                    Numbers.rate(c.ser()),
                    b == null ? "" : shown(b, Bound.MIMO),
                    b == null ? "" : shown(b, Bound.STBC),
                    b == null ? "" : shown(b, Bound.QAM),
                    b == null ? "" : Numbers.rate(b.mimo().lower()),
                    b == null ? "" : Numbers.rate(b.mimo().upper()),
                    Long.toString(c.crcFailures()),
                    Long.toString(c.undetectedErrors()),
                    Double.isNaN(c.fecIterationsMean()) ? "" : Numbers.db(c.fecIterationsMean())));
            if (awgn) {
                w.append(',').append(normal.map(a -> Numbers.rate(a.fer(r.snrDb()))).orElse(""));
            }
            if (weighted) {
                w.append(',').append(String.join(",", fadeSamplingCells(r)));
            }
            w.append('\n');
        }
        return w.toString();
    }

    /** The {@link #FADE_SAMPLING_COLUMNS} of a point, empty where it has no value. */
    static String[] fadeSamplingCells(PointResult r) {
        FrameCounters c = r.counts();
        if (!c.weighted()) {
            return new String[] {"plain", "", "", "", ""};
        }
        double effective = WeightedInterval.effectiveFrames(c);
        double half = r.ferRelativeHalfWidth();
        return new String[] {"fade-sampling", Double.isNaN(effective) ? "" : Long.toString(Math.round(effective)),
                Double.isNaN(half) ? "" : Numbers.rate(half), Numbers.rate(c.fadeScale()), r.trusted() ? "" : UNTRUSTED};
    }

    /** A bound's value, empty where its count cannot resolve it. */
    public static String shown(BoundPoint p, Bound bound) {
        return p.estimate(bound).resolved() ? Numbers.rate(p.value(bound)) : "";
    }

    public static void write(Path file, LinkSettings link, long seed, double confidence, List<PointResult> results,
                             boolean interrupted, BoundCurves bounds) throws IOException {
        AtomicFiles.writeString(file, text(link, seed, confidence, results, interrupted, bounds));
    }
}
