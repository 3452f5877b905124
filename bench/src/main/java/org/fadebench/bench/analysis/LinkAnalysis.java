package org.fadebench.bench.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.DoubleUnaryOperator;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.channel.OutageEstimate;

/**
 * What a sweep says against its bounds: the simulated diversity order, the SNR at a target FER,
 * and for each outage bound its own SNR at that target, its diversity order and the gap in dB
 * (simulated SNR − bound SNR; positive when the link needs more SNR than the bound). Where a
 * curve has no SNR at the target, {@link Reach} says why.
 *
 * @param diversity      weighted fit of the simulated FER tail (see {@link DiversityFit#ofPoints})
 * @param snrDbAtTarget  where the simulated FER falls to the target (see {@link TargetCrossing#ofPoints})
 * @param linkReach      {@link Reach#IN_RANGE}, {@link Reach#LINK_BELOW_RANGE} or {@link Reach#LINK_NOT_REACHED}
 * @param curves         the bounds at the swept SNR points
 * @param bounds         the same for each outage bound
 */
public record LinkAnalysis(double targetFer, int minErrors, int tailPoints, Optional<DiversityFit> diversity,
                           OptionalDouble snrDbAtTarget, Reach linkReach, BoundCurves curves,
                           Map<Bound, BoundAnalysis> bounds) {

    /**
     * One bound against the target.
     *
     * @param snrDbAtTarget closed forms: exact crossing by bisection, inside or outside the swept
     *                      range; Monte Carlo counts: interpolated between resolved points, swept
     *                      or extra (see {@link BoundCurves#reaching})
     * @param reach         where it crosses, or why it has no crossing
     * @param diversity     equal-weight fit of the bound's tail (for a Monte Carlo count, over
     *                      swept points with at least {@code minErrors} outages)
     * @param outageDraws   with {@link Reach#UNRESOLVED}: the {@code --outage-draws} that would
     *                      resolve the target; 0 otherwise
     */
    public record BoundAnalysis(OptionalDouble snrDbAtTarget, Reach reach, Optional<DiversityFit> diversity,
                                long outageDraws) {

        public BoundAnalysis(OptionalDouble snrDbAtTarget, Reach reach, Optional<DiversityFit> diversity) {
            this(snrDbAtTarget, reach, diversity, 0);
        }

        /** The words of {@link #reach} (see {@link Reach#note}). */
        public String note() {
            return reach.note(outageDraws);
        }

        /** The link's SNR minus this curve's at the target FER; empty when either has none. */
        public OptionalDouble gapDb(OptionalDouble linkSnrDb) {
            return linkSnrDb.isPresent() && snrDbAtTarget.isPresent()
                    ? OptionalDouble.of(linkSnrDb.getAsDouble() - snrDbAtTarget.getAsDouble())
                    : OptionalDouble.empty();
        }

        /** Why a gap is missing: this curve's reason, else the link's; null when there is a gap. */
        public Reach gapReach(OptionalDouble linkSnrDb, Reach linkReach) {
            return gapDb(linkSnrDb).isPresent() ? null : !reach.hasSnr() ? reach : linkReach;
        }

        /**
         * The words of {@link #gapReach} (with the draws that would resolve an unresolved bound);
         * null when there is a gap.
         */
        public String gapNote(OptionalDouble linkSnrDb, Reach linkReach) {
            Reach r = gapReach(linkSnrDb, linkReach);
            return r == null ? null : r == reach ? note() : r.words();
        }
    }

    public LinkAnalysis {
        TargetCrossing.checkTarget(targetFer);
        Objects.requireNonNull(curves, "curves");
        Objects.requireNonNull(linkReach, "linkReach");
        bounds = Map.copyOf(bounds);
    }

    /** {@link #of(List, BoundCurves, double, int, int)} with target FER 1e-2 and the default fit. */
    public static LinkAnalysis of(List<PointResult> points, BoundCurves curves) {
        return of(points, curves, TargetCrossing.DEFAULT_TARGET, DiversityFit.DEFAULT_MIN_ERRORS,
                DiversityFit.DEFAULT_TAIL_POINTS);
    }

    /**
     * Analyses a sweep against bounds evaluated over the same SNR points; a Monte Carlo bound
     * without a crossing among them is followed beyond them ({@link BoundCurves#reaching}, already
     * done when {@code curves} reach this target).
     *
     * @throws IllegalArgumentException if targetFer is outside (0, 1), minErrors < 1 or tailPoints < 2
     */
    public static LinkAnalysis of(List<PointResult> points, BoundCurves curves, double targetFer, int minErrors,
                                  int tailPoints) {
        Optional<DiversityFit> diversity = DiversityFit.ofPoints(points, minErrors, tailPoints);
        OptionalDouble snrDbAtTarget = TargetCrossing.ofPoints(points, targetFer);
        BoundSettings s = curves.settings();
        double[] snrDb = curves.snrDb();
        curves = curves.reaching(targetFer, () -> false);
        Map<Bound, BoundAnalysis> bounds = new EnumMap<>(Bound.class);
        for (Bound b : Bound.values()) {
            bounds.put(b, s.exact(b) ? closedForm(s, b, snrDb, targetFer, tailPoints)
                    : counted(curves, b, targetFer, minErrors, tailPoints));
        }
        return new LinkAnalysis(targetFer, minErrors, tailPoints, diversity, snrDbAtTarget,
                Reach.ofLink(points, targetFer, snrDbAtTarget), curves, bounds);
    }

    private static BoundAnalysis closedForm(BoundSettings s, Bound b, double[] snrDb, double targetFer,
                                            int tailPoints) {
        if (b == Bound.QAM && s.fullRate()) {
            return new BoundAnalysis(OptionalDouble.empty(), Reach.ofFullRate(s),
                    fit(s.closedForm(b), snrDb, tailPoints));
        }
        return closedForm(s.closedForm(b), snrDb, targetFer, tailPoints);
    }

    /**
     * A curve given in closed form, decreasing in SNR, against the target: its crossing by
     * bisection ({@link TargetCrossing#ofClosedForm}), inside or outside the swept range
     * {@code snrDb}, or {@link Reach#NEVER_REACHED}; its fit over the swept points.
     */
    static BoundAnalysis closedForm(DoubleUnaryOperator f, double[] snrDb, double targetFer, int tailPoints) {
        OptionalDouble crossing = TargetCrossing.ofClosedForm(f, targetFer);
        double low = Arrays.stream(snrDb).min().orElseThrow();
        double high = Arrays.stream(snrDb).max().orElseThrow();
        Reach reach = crossing.isEmpty() ? Reach.NEVER_REACHED
                : crossing.getAsDouble() >= low && crossing.getAsDouble() <= high ? Reach.IN_RANGE
                : Reach.OUTSIDE_RANGE;
        return new BoundAnalysis(crossing, reach, fit(f, snrDb, tailPoints));
    }

    private static Optional<DiversityFit> fit(DoubleUnaryOperator f, double[] snrDb, int tailPoints) {
        double[] values = new double[snrDb.length];
        for (int i = 0; i < snrDb.length; i++) {
            values[i] = f.applyAsDouble(snrDb[i]);
        }
        return DiversityFit.ofCurve(snrDb, values, tailPoints);
    }

    /**
     * A Monte Carlo bound: crossing from the resolved points, swept and extra; fit on the swept
     * points only.
     */
    private static BoundAnalysis counted(BoundCurves curves, Bound b, double targetFer, int minErrors,
                                         int tailPoints) {
        double[] snrDb = curves.snrDb();
        double[] shown = curves.shown(b);
        List<BoundPoint> all = curves.allPoints();
        OptionalDouble crossing = TargetCrossing.interpolate(all.stream().mapToDouble(BoundPoint::snrDb).toArray(),
                all.stream().mapToDouble(p -> p.shown(b)).toArray(), targetFer);
        double[] fitted = new double[snrDb.length];
        for (int i = 0; i < fitted.length; i++) {
            fitted[i] = curves.points().get(i).estimate(b).outages() < minErrors ? Double.NaN : shown[i];
        }
        Optional<DiversityFit> fit = DiversityFit.ofCurve(snrDb, fitted, tailPoints);
        double low = Arrays.stream(snrDb).min().orElseThrow();
        double high = Arrays.stream(snrDb).max().orElseThrow();
        if (crossing.isPresent()) {
            double at = crossing.getAsDouble();
            return new BoundAnalysis(crossing, at >= low && at <= high ? Reach.IN_RANGE : Reach.OUTSIDE_RANGE, fit);
        }
        double first = all.get(0).shown(b);
        double last = all.get(all.size() - 1).shown(b);
        Reach reach = !curves.resolvable(b, targetFer) ? Reach.UNRESOLVED : first <= targetFer ? Reach.BELOW_RANGE
                : last > targetFer ? Reach.ABOVE_RANGE : Reach.UNRESOLVED;
        // with F blocks per frame the count is over frames, about --outage-draws / F of them
        return new BoundAnalysis(crossing, reach, fit, reach == Reach.UNRESOLVED
                ? OutageEstimate.drawsToResolve(targetFer) * curves.settings().fadingBlocks() : 0);
    }

    /** The settings of the bounds. */
    public BoundSettings boundSettings() {
        return curves.settings();
    }

    /** Simulated SNR minus the bound's SNR at the target FER; empty when either has none. */
    public OptionalDouble gapDb(Bound bound) {
        return bounds.get(bound).gapDb(snrDbAtTarget);
    }

    /** Why a gap is missing: the bound's reason, else the link's; null when there is a gap. */
    public Reach gapReach(Bound bound) {
        return bounds.get(bound).gapReach(snrDbAtTarget, linkReach);
    }

    /** The words of {@link #gapReach} (with the draws that would resolve an unresolved bound); null when there is a gap. */
    public String gapNote(Bound bound) {
        return bounds.get(bound).gapNote(snrDbAtTarget, linkReach);
    }

    /**
     * The bounds for results.json as plain maps, lists, numbers and nulls, in a fixed key order
     * (e.g. {@code objectMapper.valueToTree(analysis.toJson())}):
     * <pre>
     * spectral_efficiency, information, fading_blocks, seed, fit {min_errors, tail_points},
     * mimo|stbc|qam {method, draws, snr_db_at_target, reach, note, diversity_order},
     * points [{snr_db, mimo|stbc|qam {value, ci_low, ci_high, outages, draws, resolved}}],
     * extra_points [the same]
     * </pre>
     * {@code extra_points} are the SNRs computed beyond or between the swept ones only to find a
     * Monte Carlo bound's crossing ({@link BoundCurves#reaching}), in increasing SNR.
     * {@code method} is {@code exact} or {@code monte_carlo}; {@code value} is null where a count
     * does not resolve the bound ({@code resolved} false), and the interval and counts are null for
     * a closed form. The simulated curve's own numbers are in the run's {@code summary}.
     */
    public Map<String, Object> toJson() {
        BoundSettings s = boundSettings();
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("spectral_efficiency", s.spectralEfficiency());
        root.put("information", s.information().cliName());
        root.put("fading_blocks", s.fadingBlocks());
        root.put("seed", s.mimoSeed());
        Map<String, Object> fit = new LinkedHashMap<>();
        fit.put("min_errors", minErrors);
        fit.put("tail_points", tailPoints);
        root.put("fit", fit);
        for (Bound bound : Bound.values()) {
            BoundAnalysis a = bounds.get(bound);
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("method", s.exact(bound) ? "exact" : "monte_carlo");
            one.put("draws", s.exact(bound) ? null : curves.points().get(0).estimate(bound).draws());
            one.put("snr_db_at_target", orNull(a.snrDbAtTarget()));
            one.put("reach", a.reach().key());
            one.put("note", a.reach() == Reach.IN_RANGE ? null : a.note());
            one.put("diversity_order", json(a.diversity()));
            root.put(bound.key(), one);
        }
        root.put("points", json(curves.points()));
        root.put("extra_points", json(curves.extra()));
        return root;
    }

    private static List<Object> json(List<BoundPoint> boundPoints) {
        List<Object> points = new ArrayList<>();
        for (BoundPoint p : boundPoints) {
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("snr_db", p.snrDb());
            for (Bound bound : Bound.values()) {
                OutageEstimate e = p.estimate(bound);
                Map<String, Object> v = new LinkedHashMap<>();
                v.put("value", e.resolved() ? e.probability() : null);
                v.put("ci_low", e.isExact() ? null : e.lower());
                v.put("ci_high", e.isExact() ? null : e.upper());
                v.put("outages", e.isExact() ? null : e.outages());
                v.put("draws", e.isExact() ? null : e.draws());
                v.put("resolved", e.resolved());
                one.put(bound.key(), v);
            }
            points.add(one);
        }
        return points;
    }

    /** A fit as a map, or null. */
    static Map<String, Object> json(Optional<DiversityFit> fit) {
        if (fit.isEmpty()) {
            return null;
        }
        DiversityFit f = fit.get();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("value", f.order());
        m.put("standard_error", f.hasInterval() ? f.standardError() : null);
        m.put("ci_low", f.hasInterval() ? f.low() : null);
        m.put("ci_high", f.hasInterval() ? f.high() : null);
        m.put("confidence", f.hasInterval() ? DiversityFit.CONFIDENCE : null);
        m.put("snr_db_used", f.snrDbUsed());
        return m;
    }

    static Double orNull(OptionalDouble v) {
        return v.isPresent() ? v.getAsDouble() : null;
    }
}
