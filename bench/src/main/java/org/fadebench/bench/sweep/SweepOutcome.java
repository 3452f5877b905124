package org.fadebench.bench.sweep;

import java.util.List;

/**
 * What a sweep produced.
 *
 * @param results         finished points in SNR order, then (when interrupted) partial ones
 * @param states          the state of every point, for a checkpoint
 * @param interrupted     the sweep was stopped on request before it finished
 * @param stopReason      why the sweep ended before its last point, or null
 * @param framesSimulated frames simulated in this session, including discarded speculative batches
 * @param nanos           wall-clock time of the simulation in this session
 * @param recordedChannels the true channels of the first point's first fading blocks, as many as
 *                        the plan asks and its merged frames hold (see {@link SweepPlan#recordedBlocks}),
 *                        each an interleaved row-major Nr x Mt matrix; empty when none are recorded
 */
public record SweepOutcome(List<PointResult> results, List<PointState> states, boolean interrupted,
                           String stopReason, long framesSimulated, long nanos, double[] recordedChannels) {

    /** Finished points only. */
    public List<PointResult> complete() {
        return results.stream().filter(PointResult::complete).toList();
    }
}
