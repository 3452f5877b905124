package org.fadebench.bench.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.TreeMap;
import java.util.function.BooleanSupplier;
import java.util.stream.Stream;
import org.fadebench.channel.OutageEstimate;

/**
 * The outage bounds of one link over a list of SNR points, in the order given, and the extra
 * points (in increasing SNR) computed beyond or between them only to find where each Monte Carlo
 * bound crosses {@code target} (see {@link #reaching}); none, and a NaN target, before that.
 */
public record BoundCurves(BoundSettings settings, List<BoundPoint> points, double target, List<BoundPoint> extra) {

    /** How far beyond the swept range a Monte Carlo bound is followed to its crossing, in dB. */
    public static final double REACH_LIMIT_DB = 40.0;

    /** The smallest step of that search, in dB (the sweep's step when it is larger). */
    static final double MIN_STEP_DB = 0.5;

    /** Halvings of an SNR interval that brackets a crossing of a bound with an unresolved end. */
    private static final int BISECTIONS = 24;

    public BoundCurves {
        Objects.requireNonNull(settings, "settings");
        points = List.copyOf(points);
        extra = List.copyOf(extra);
    }

    public BoundCurves(BoundSettings settings, List<BoundPoint> points) {
        this(settings, points, Double.NaN, List.of());
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

    /**
     * These curves with the extra points that let every Monte Carlo bound cross {@code target}
     * (this object when they are already there). A bound without a crossing among the resolved
     * swept values is followed outward, in the sweep's step (at least {@value #MIN_STEP_DB} dB, 1 dB
     * for a single point) on the grid of the lowest swept SNR, up to {@value #REACH_LIMIT_DB} dB
     * beyond the swept range, until a resolved value lies on each side of the target; where the
     * point after the last resolved value above the target is not resolved, the interval between
     * is halved down to {@value #MIN_STEP_DB} dB. Every extra point reuses the bound's fixed-seed draws, so the curve
     * stays deterministic and never rises with SNR. Nothing is computed for a bound whose draws
     * cannot resolve the target at all ({@link #resolvable}).
     *
     * @throws java.util.concurrent.CancellationException when {@code stop} turns true
     */
    public BoundCurves reaching(double target, BooleanSupplier stop) {
        TargetCrossing.checkTarget(target);
        if (target == this.target) {
            return this;
        }
        Search search = new Search(target, stop);
        for (Bound b : Bound.values()) {
            if (!settings.exact(b) && resolvable(b, target)) {
                search.follow(b);
            }
        }
        return new BoundCurves(settings, points, target, new ArrayList<>(search.extra.values()));
    }

    /** True when a count of bound {@code b} with its draws resolves a value as small as {@code target}. */
    public boolean resolvable(Bound b, double target) {
        return settings.exact(b) || points.get(0).estimate(b).draws() >= OutageEstimate.drawsToResolve(target);
    }

    /** The swept points and the extra ones, in increasing SNR. */
    public List<BoundPoint> allPoints() {
        return Stream.concat(points.stream(), extra.stream()).sorted(Comparator.comparingDouble(BoundPoint::snrDb))
                .toList();
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

    /** The walk of {@link #reaching}: the extra points by SNR, shared by the three bounds. */
    private final class Search {
        final TreeMap<Double, BoundPoint> extra = new TreeMap<>();
        final double target;
        final BooleanSupplier stop;
        final double low;
        final double high;
        final double step;

        Search(double target, BooleanSupplier stop) {
            this.target = target;
            this.stop = stop;
            double[] snr = snrDb();
            Arrays.sort(snr);
            low = snr[0];
            high = snr[snr.length - 1];
            double smallest = Double.POSITIVE_INFINITY;
            for (int i = 1; i < snr.length; i++) {
                smallest = Math.min(smallest, snr[i] - snr[i - 1]);
            }
            step = snr.length == 1 ? 1.0 : Math.max(MIN_STEP_DB, smallest);
        }

        /** Adds points until bound b has resolved values on both sides of the target, or the limit is hit. */
        void follow(Bound b) {
            while (true) {
                List<BoundPoint> all = known();
                BoundPoint above = null; // highest resolved point above the target
                for (BoundPoint p : all) {
                    if (p.estimate(b).resolved() && p.value(b) > target) {
                        above = p;
                    }
                }
                if (above == null) {
                    double next = all.get(0).snrDb() - step;
                    if (next < low - REACH_LIMIT_DB) {
                        return;
                    }
                    at(next);
                    continue;
                }
                BoundPoint next = null; // the next point above it
                for (BoundPoint p : all) {
                    if (p.snrDb() > above.snrDb()) {
                        next = p;
                        break;
                    }
                }
                if (next == null) {
                    double s = low + step * (Math.floor((above.snrDb() - low) / step) + 1);
                    if (s > high + REACH_LIMIT_DB) {
                        return;
                    }
                    at(s);
                    continue;
                }
                if (next.estimate(b).resolved()) {
                    return; // resolved on both sides: the crossing is between them
                }
                bisect(b, above.snrDb(), next.snrDb());
                return;
            }
        }

        /**
         * Halves [a, c] (resolved above the target at a, unresolved at c) until it is at most
         * {@value #MIN_STEP_DB} dB wide, keeping a resolved value above the target at a.
         */
        private void bisect(Bound b, double a, double c) {
            for (int i = 0; i < BISECTIONS && c - a > MIN_STEP_DB; i++) {
                double m = 0.5 * (a + c);
                BoundPoint p = at(m);
                if (p.estimate(b).resolved() && p.value(b) > target) {
                    a = m;
                } else {
                    c = m;
                }
            }
        }

        private BoundPoint at(double snrDb) {
            return extra.computeIfAbsent(snrDb, s -> settings.point(s, stop));
        }

        private List<BoundPoint> known() {
            List<BoundPoint> all = new ArrayList<>(points);
            all.addAll(extra.values());
            all.sort(Comparator.comparingDouble(BoundPoint::snrDb));
            return all;
        }
    }
}
