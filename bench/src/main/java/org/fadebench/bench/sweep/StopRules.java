package org.fadebench.bench.sweep;

import java.io.Serializable;
import org.fadebench.bench.link.FrameCounters;
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
 * @param estimator  how a point's FER is estimated; with {@link Estimator#FADE_SAMPLING} a point
 *                   stops on {@code relPrecision} instead of {@code minErrors}
 * @param relPrecision the half-width of a weighted point's FER interval over its FER at which it
 *                   stops (once its effective error frames reach {@link WeightedInterval#MIN_EFFECTIVE_ERRORS}), in (0, 1)
 */
public record StopRules(long minErrors, long maxFrames, double maxSeconds, double ferFloor, Estimator estimator,
                        double relPrecision) implements Serializable {

    /** Default relative precision of a weighted point. */
    public static final double DEFAULT_REL_PRECISION = 0.2;

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
        java.util.Objects.requireNonNull(estimator, "estimator");
        if (!(relPrecision > 0 && relPrecision < 1)) {
            throw new InvalidSettingException(RunSettings.REL_PRECISION, "must lie strictly between 0 and 1 (e.g. 0.2), got "
                    + relPrecision);
        }
    }

    /** Plain rules: plain Monte Carlo. */
    public StopRules(long minErrors, long maxFrames, double maxSeconds, double ferFloor) {
        this(minErrors, maxFrames, maxSeconds, ferFloor, Estimator.PLAIN, DEFAULT_REL_PRECISION);
    }

    /** Rules with no time limit and the default FER floor. */
    public StopRules(long minErrors, long maxFrames) {
        this(minErrors, maxFrames, 0, DEFAULT_FER_FLOOR);
    }

    /** The same rules with another estimator. */
    public StopRules with(Estimator estimator) {
        return new StopRules(minErrors, maxFrames, maxSeconds, ferFloor, estimator, relPrecision);
    }

    /** Whether points are estimated by importance sampling of deep fades. */
    public boolean fadeSampling() {
        return estimator == Estimator.FADE_SAMPLING;
    }

    /** Whether a point with these counts is finished (time aside); {@code level} of a weighted point's interval. */
    boolean pointDone(FrameCounters c, double level) {
        if (c.frames() >= maxFrames) {
            return true;
        }
        if (fadeSampling()) {
            return WeightedInterval.trusted(c) && WeightedInterval.relativeHalfWidth(c, level) <= relPrecision;
        }
        return minErrors > 0 && c.frameErrors() >= minErrors;
    }

    /** Why the sweep ends after a point with these counts, or null if it goes on. */
    String sweepStopReason(FrameCounters c) {
        long frames = c.frames();
        if (c.frameErrors() == 0 && frames >= maxFrames) {
            return "no frame errors in " + frames + " frames";
        }
        if (ferFloor > 0 && frames > 0 && c.fer() < ferFloor) {
            return "FER below the floor of " + ferFloor;
        }
        return null;
    }
}
