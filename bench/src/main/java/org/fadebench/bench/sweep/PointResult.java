package org.fadebench.bench.sweep;

import org.fadebench.bench.link.FrameCounters;

/**
 * The outcome of one SNR point.
 *
 * @param ferLow  lower end of the two-sided Clopper–Pearson interval for the FER
 * @param ferHigh upper end of that interval
 */
public record PointResult(double snrDb, double ebN0Db, FrameCounters counts, double ferLow, double ferHigh) {
}
