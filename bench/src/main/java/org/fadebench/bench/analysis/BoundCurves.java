package org.fadebench.bench.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.fadebench.channel.OutageEstimate;

/** The outage bounds of one link over a list of SNR points, in the order given. */
public record BoundCurves(BoundSettings settings, List<BoundPoint> points) {

    public BoundCurves {
        Objects.requireNonNull(settings, "settings");
        points = List.copyOf(points);
    }

    /**
     * Evaluates the three bounds at every SNR in {@code snrDb}.
     *
     * @throws IllegalArgumentException if the list is empty or holds a value that is not a finite number of dB
     */
    public static BoundCurves compute(BoundSettings settings, double[] snrDb) {
        if (snrDb.length == 0) {
            throw new IllegalArgumentException("need at least one SNR point, got none");
        }
        List<BoundPoint> points = new ArrayList<>(snrDb.length);
        for (double s : snrDb) {
            if (!Double.isFinite(s)) {
                throw new IllegalArgumentException("SNR points must be finite numbers of dB, got " + s);
            }
            OutageEstimate mimo = settings.mimoOutage(s);
            points.add(new BoundPoint(s, mimo.probability(), mimo.lower(), mimo.upper(), mimo.outages(),
                    mimo.draws(), settings.stbcOutage(s), settings.qamOutage(s)));
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
}
