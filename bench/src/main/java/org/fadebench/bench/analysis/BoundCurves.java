package org.fadebench.bench.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.BooleanSupplier;

/** The outage bounds of one link over a list of SNR points, in the order given. */
public record BoundCurves(BoundSettings settings, List<BoundPoint> points) {

    public BoundCurves {
        Objects.requireNonNull(settings, "settings");
        points = List.copyOf(points);
    }

    /** {@link #compute(BoundSettings, double[], BooleanSupplier)} without a way to stop. */
    public static BoundCurves compute(BoundSettings settings, double[] snrDb) {
        return compute(settings, snrDb, () -> false);
    }

    /**
     * Evaluates the three bounds at every SNR in {@code snrDb}; {@code stop} is polled during the
     * Monte Carlo counts, so a signal ends a long computation promptly.
     *
     * @throws IllegalArgumentException if the list is empty or holds a value that is not a finite number of dB
     * @throws java.util.concurrent.CancellationException when {@code stop} turns true
     */
    public static BoundCurves compute(BoundSettings settings, double[] snrDb, BooleanSupplier stop) {
        if (snrDb.length == 0) {
            throw new IllegalArgumentException("need at least one SNR point, got none");
        }
        List<BoundPoint> points = new ArrayList<>(snrDb.length);
        for (double s : snrDb) {
            if (!Double.isFinite(s)) {
                throw new IllegalArgumentException("SNR points must be finite numbers of dB, got " + s);
            }
            points.add(settings.point(s, stop));
        }
        return new BoundCurves(settings, points);
    }

    /** The SNR of every point, in order. */
    public double[] snrDb() {
        return points.stream().mapToDouble(BoundPoint::snrDb).toArray();
    }

    /** The values of one bound at every point, in order. */
    public double[] values(Bound bound) {
        return points.stream().mapToDouble(p -> p.value(bound)).toArray();
    }

    /** The values of one bound where they may be shown, NaN where a count cannot resolve them. */
    public double[] shown(Bound bound) {
        return points.stream().mapToDouble(p -> p.shown(bound)).toArray();
    }
}
