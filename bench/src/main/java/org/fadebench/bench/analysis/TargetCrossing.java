package org.fadebench.bench.analysis;

import java.util.List;
import java.util.OptionalDouble;
import java.util.function.DoubleUnaryOperator;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.channel.OutageBounds;

/**
 * The SNR at which an error-rate or outage curve first falls to a target, e.g. FER = 1e-2. An empty
 * result means "not reached": the curve does not cross the target within the points (or, for a
 * closed form, within ±500 dB). No value is ever extrapolated.
 */
public final class TargetCrossing {

    public static final double DEFAULT_TARGET = 1e-2;

    /** The range {@link OutageBounds#snrDbForOutage} searches, ±500 dB. */
    private static final double SEARCH_LIMIT_DB = 500.0;

    private TargetCrossing() {
    }

    /** Where the simulated FER of a sweep first falls to {@code target}; see {@link #interpolate}. */
    public static OptionalDouble ofPoints(List<PointResult> points, double target) {
        return interpolate(points.stream().mapToDouble(PointResult::snrDb).toArray(),
                points.stream().mapToDouble(p -> p.counts().fer()).toArray(), target);
    }

    /**
     * Where sampled values {@code values[i]} at {@code snrDb[i]} (any order, distinct) first fall
     * to {@code target}, going up in SNR: between the first two neighbouring points p_a ≥ target ≥
     * p_b, interpolated linearly in dB and in log10 of the value,
     * <pre>  snr = s_a + (s_b − s_a)·(log10 target − log10 p_a) / (log10 p_b − log10 p_a).</pre>
     * Only values in (0, 1] take part: a zero (no errors seen) or NaN has no logarithm, so such
     * points are skipped. Empty when no pair brackets the target.
     *
     * @throws IllegalArgumentException if target is outside (0, 1), the arrays differ in length, or
     *                                  an SNR is repeated or not finite
     */
    public static OptionalDouble interpolate(double[] snrDb, double[] values, double target) {
        checkTarget(target);
        SnrOrder.checkSameLength(snrDb, values.length, "curve values");
        double prevDb = Double.NaN;
        double prev = Double.NaN;
        for (int i : SnrOrder.ascending(snrDb)) {
            double v = values[i];
            if (!(v > 0.0 && v <= 1.0)) {
                continue;
            }
            if (prev >= target && v <= target) {
                if (prev == v) {
                    return OptionalDouble.of(prevDb);
                }
                double t = (Math.log10(target) - Math.log10(prev)) / (Math.log10(v) - Math.log10(prev));
                return OptionalDouble.of(prevDb + t * (snrDb[i] - prevDb));
            }
            prevDb = snrDb[i];
            prev = v;
        }
        return OptionalDouble.empty();
    }

    /**
     * Where a closed-form outage curve, decreasing in SNR, equals {@code target}: bisection by
     * {@link OutageBounds#snrDbForOutage}; empty when it does not cross within ±500 dB (e.g. a QAM
     * bound at a rate the constellation cannot carry, which is 1 everywhere).
     *
     * @throws IllegalArgumentException if target is outside (0, 1)
     */
    public static OptionalDouble ofClosedForm(DoubleUnaryOperator outageOfSnrDb, double target) {
        checkTarget(target);
        boolean crosses = outageOfSnrDb.applyAsDouble(-SEARCH_LIMIT_DB) > target
                && outageOfSnrDb.applyAsDouble(SEARCH_LIMIT_DB) <= target;
        return crosses ? OptionalDouble.of(OutageBounds.snrDbForOutage(outageOfSnrDb, target)) : OptionalDouble.empty();
    }

    /** @throws IllegalArgumentException if target is outside (0, 1) */
    public static void checkTarget(double target) {
        if (!(target > 0.0 && target < 1.0)) {
            throw new IllegalArgumentException("target error rate must be in (0, 1), e.g. 0.01, got " + target);
        }
    }
}
