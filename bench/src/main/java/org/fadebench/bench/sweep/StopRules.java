package org.fadebench.bench.sweep;

/**
 * When to stop simulating one SNR point, and the sweep.
 *
 * @param minErrors frame errors to collect per point; 0 means run exactly {@code maxFrames}
 * @param maxFrames most frames per point
 */
public record StopRules(long minErrors, long maxFrames) {

    public StopRules {
        if (minErrors < 0) {
            throw new IllegalArgumentException("--min-errors must be 0 or more, got " + minErrors);
        }
        if (maxFrames <= 0) {
            throw new IllegalArgumentException("--max-frames must be positive, got " + maxFrames);
        }
    }

    /** Whether a point with these counts is finished. */
    boolean done(long frames, long frameErrors) {
        return frames >= maxFrames || (minErrors > 0 && frameErrors >= minErrors);
    }
}
