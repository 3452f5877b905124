package org.fadebench.bench.sweep;

import org.fadebench.bench.link.FrameCounters;

/**
 * The outcome of one SNR point.
 *
 * @param index    position of the point in the sweep
 * @param ferLow   lower end of the two-sided Clopper–Pearson interval for the FER
 * @param ferHigh  upper end of that interval
 * @param berLow   lower end of the frame-clustered BER interval (see {@link BinomialInterval})
 * @param berHigh  upper end of that interval
 * @param complete false for a point cut short by an interruption
 * @param seconds  wall-clock seconds spent on the point in this session (not reproducible)
 */
public record PointResult(int index, double snrDb, double ebN0Db, FrameCounters counts, double ferLow,
                          double ferHigh, double berLow, double berHigh, boolean complete, double seconds) {

    /** The FER interval's upper half-width over the FER (the stop rule of a weighted point); NaN without an error. */
    public double ferRelativeHalfWidth() {
        double fer = counts.fer();
        return fer > 0 ? (ferHigh - fer) / fer : Double.NaN;
    }

    /**
     * The frames of plain Monte Carlo with the same FER and the same variance: the frames for plain
     * counts, {@link WeightedInterval#effectiveFrames} (rounded) for weighted ones, 0 where that is
     * unknown (no error frame). With {@link #equivalentErrors()}, what fits and comparisons weigh.
     */
    public long equivalentFrames() {
        if (!counts.weighted()) {
            return counts.frames();
        }
        double n = WeightedInterval.effectiveFrames(counts);
        return Double.isNaN(n) ? counts.frames() : Math.round(n);
    }

    /** The frame errors of {@link #equivalentFrames()}: FER × those frames, rounded. */
    public long equivalentErrors() {
        return counts.weighted() ? Math.min(equivalentFrames(), Math.round(counts.fer() * equivalentFrames()))
                : counts.frameErrors();
    }

    /** Whether the interval can be trusted: always for plain counts, see {@link WeightedInterval#trusted} for weighted ones. */
    public boolean trusted() {
        return !counts.weighted() || WeightedInterval.trusted(counts);
    }
}
