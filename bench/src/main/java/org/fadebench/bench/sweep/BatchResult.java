package org.fadebench.bench.sweep;

import java.io.Serializable;
import org.fadebench.bench.link.FrameCounters;

/**
 * What computing one batch produced: a plain {@link Serializable} value, so that it can come back
 * from another process or machine.
 *
 * @param counts   the error counts of the batch's frames
 * @param channels the true channels of the batch's recorded fading blocks (see
 *                 {@link SweepPlan#recordedBlocksIn}), block after block, each an interleaved
 *                 row-major Nr x Mt matrix; empty when none are recorded
 */
public record BatchResult(BatchId id, FrameCounters counts, double[] channels) implements Serializable {
}
