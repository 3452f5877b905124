package org.fadebench.bench.report;

import java.io.PrintWriter;
import java.util.Locale;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.WeightedInterval;

/** The terminal table, one row printed as each point finishes. */
public final class ResultsTable {

    private final PrintWriter out;

    public ResultsTable(PrintWriter out) {
        this.out = out;
    }

    public void header(double confidence) {
        String ci = "FER " + Numbers.db(100 * confidence) + "% CI";
        out.println(String.format(Locale.ROOT, "%8s %8s %11s %9s %10s %-23s %10s %10s",
                "SNR dB", "Eb/N0 dB", "frames", "errors", "FER", ci, "BER", "SER"));
    }

    public void row(PointResult r) {
        FrameCounters c = r.counts();
        out.println(String.format(Locale.ROOT, "%8s %8s %11d %9d %10s %-23s %10s %10s",
                Numbers.db(r.snrDb()), Numbers.db(r.ebN0Db()), c.frames(), c.frameErrors(),
                Numbers.shortRate(c.fer()),
                "[" + Numbers.shortRate(r.ferLow()) + ", " + Numbers.shortRate(r.ferHigh()) + "]",
                Numbers.shortRate(c.ber()), Numbers.shortRate(c.ser()))
                + (c.weighted() ? String.format(Locale.ROOT, "  fade-sampling: scale %s, %s effective frames, half-width %s%s",
                        Numbers.shortRate(c.fadeScale()), Numbers.shortRate(WeightedInterval.effectiveFrames(c)),
                        Numbers.shortRate(r.ferRelativeHalfWidth()), r.trusted() ? "" : ", " + ResultsCsv.UNTRUSTED) : ""));
        out.flush();
    }
}
