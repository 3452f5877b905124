package org.fadebench.bench.analysis;

import java.util.Objects;
import org.fadebench.channel.OutageEstimate;

/**
 * The three outage bounds at one SNR, each exact or counted over channel draws with its 95 %
 * Wilson interval.
 *
 * @param mimo MIMO outage with Gaussian inputs
 * @param stbc outage of the space-time code with Gaussian symbols
 * @param qam  outage of the space-time code with the link's QAM symbols
 */
public record BoundPoint(double snrDb, OutageEstimate mimo, OutageEstimate stbc, OutageEstimate qam) {

    public BoundPoint {
        Objects.requireNonNull(mimo, "mimo");
        Objects.requireNonNull(stbc, "stbc");
        Objects.requireNonNull(qam, "qam");
    }

    /** The estimate of one bound. */
    public OutageEstimate estimate(Bound bound) {
        switch (bound) {
            case MIMO:
                return mimo;
            case STBC:
                return stbc;
            default:
                return qam;
        }
    }

    /** The value of one bound (a count of 0 included). */
    public double value(Bound bound) {
        return estimate(bound).probability();
    }

    /**
     * The value of one bound where it may be shown, NaN where a count cannot resolve it (its
     * interval is wider than the value; see {@link OutageEstimate#resolved()}).
     */
    public double shown(Bound bound) {
        OutageEstimate e = estimate(bound);
        return e.resolved() ? e.probability() : Double.NaN;
    }
}
