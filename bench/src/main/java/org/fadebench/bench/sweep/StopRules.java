package org.fadebench.bench.sweep;

import java.io.Serializable;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.RunSettings;

/**
 * When to stop simulating one SNR point, and when to stop the sweep.
 *
 * @param minErrors  frame errors to collect per point; 0 means run exactly {@code maxFrames}
 * @param maxFrames  most frames per point
 * @param maxSeconds most wall-clock seconds per point, 0 for no limit (a time limit makes the
 *                   result depend on the machine's speed: the one rule that is not reproducible)
 * @param ferFloor   the sweep stops after the first point whose FER is below this (0: never)
 */
public record StopRules(long minErrors, long maxFrames, double maxSeconds, double ferFloor) implements Serializable {

    /** Default FER floor of the sweep. */
    public static final double DEFAULT_FER_FLOOR = 1e-6;

    public StopRules {
        if (minErrors < 0) {
            throw new InvalidSettingException(RunSettings.MIN_ERRORS, "must be 0 or more, got " + minErrors);
        }
        if (maxFrames <= 0) {
            throw new InvalidSettingException(RunSettings.MAX_FRAMES, "must be positive, got " + maxFrames);
        }
        if (!(maxSeconds >= 0) || Double.isInfinite(maxSeconds)) {
            throw new InvalidSettingException(RunSettings.MAX_SECONDS, "must be 0 (no limit) or a positive number of seconds, got "
                    + maxSeconds);
        }
        if (!(ferFloor >= 0 && ferFloor < 1)) {
            throw new InvalidSettingException(RunSettings.FER_FLOOR, "must lie in [0, 1), got " + ferFloor);
        }
    }

    /** Rules with no time limit and the default FER floor. */
    public StopRules(long minErrors, long maxFrames) {
        this(minErrors, maxFrames, 0, DEFAULT_FER_FLOOR);
    }

    /** Whether a point with these counts is finished (time aside). */
    boolean pointDone(long frames, long frameErrors) {
        return frames >= maxFrames || (minErrors > 0 && frameErrors >= minErrors);
    }

    /** Why the sweep ends after a point with these counts, or null if it goes on. */
    String sweepStopReason(long frames, long frameErrors) {
        if (frameErrors == 0 && frames >= maxFrames) {
            return "no frame errors in " + frames + " frames";
        }
        if (ferFloor > 0 && frames > 0 && (double) frameErrors / frames < ferFloor) {
            return "FER below the floor of " + ferFloor;
        }
        return null;
    }
}
