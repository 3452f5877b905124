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
}
