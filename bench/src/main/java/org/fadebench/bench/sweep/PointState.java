package org.fadebench.bench.sweep;

import org.fadebench.bench.link.FrameCounters;

/**
 * The reproducible state of one SNR point: how many batches have been merged in order, their
 * counts, and whether the point is finished. This is what a checkpoint keeps.
 */
public record PointState(long mergedBatches, FrameCounters counts, boolean done) {
}
