package org.fadebench.bench.analysis;

import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.DoubleUnaryOperator;
import org.fadebench.bench.sweep.PointResult;

/**
 * What a sweep says against its bounds: the simulated diversity order, the SNR at a target FER,
 * and for each outage bound its own SNR at that target, its diversity order and the gap in dB
 * (simulated SNR − bound SNR; positive when the link needs more SNR than the bound). Every
 * "not reached" is an empty optional here and {@code null} in {@link #toJson()}.
 *
 * @param diversity      weighted fit of the simulated FER tail (see {@link DiversityFit#ofPoints})
 * @param snrDbAtTarget  where the simulated FER falls to the target (see {@link TargetCrossing#ofPoints})
 * @param bounds         the same for each outage bound
 */
public record LinkAnalysis(double targetFer, int minErrors, int tailPoints, Optional<DiversityFit> diversity,
                           OptionalDouble snrDbAtTarget, BoundSettings boundSettings,
                           Map<Bound, BoundAnalysis> bounds) {

    /**
     * One bound against the target.
     *
     * @param snrDbAtTarget closed forms: exact crossing by bisection; the Monte Carlo MIMO curve:
     *                      interpolated between the evaluated points
     * @param diversity     equal-weight fit of the bound's tail (for the Monte Carlo MIMO curve, over
     *                      points with at least {@code minErrors} outages)
     */
    public record BoundAnalysis(OptionalDouble snrDbAtTarget, Optional<DiversityFit> diversity) {
    }

    public LinkAnalysis {
        TargetCrossing.checkTarget(targetFer);
        Objects.requireNonNull(boundSettings, "boundSettings");
        bounds = Map.copyOf(bounds);
    }

    /** {@link #of(List, BoundCurves, double, int, int)} with target FER 1e-2 and the default fit. */
    public static LinkAnalysis of(List<PointResult> points, BoundCurves curves) {
        return of(points, curves, TargetCrossing.DEFAULT_TARGET, DiversityFit.DEFAULT_MIN_ERRORS,
                DiversityFit.DEFAULT_TAIL_POINTS);
    }

    /**
     * Analyses a sweep against bounds evaluated over the same SNR points.
     *
     * @throws IllegalArgumentException if targetFer is outside (0, 1), minErrors < 1 or tailPoints < 2
     */
    public static LinkAnalysis of(List<PointResult> points, BoundCurves curves, double targetFer, int minErrors,
                                  int tailPoints) {
        Optional<DiversityFit> diversity = DiversityFit.ofPoints(points, minErrors, tailPoints);
        OptionalDouble snrDbAtTarget = TargetCrossing.ofPoints(points, targetFer);
        BoundSettings s = curves.settings();
        double[] snrDb = curves.snrDb();
        Map<Bound, BoundAnalysis> bounds = new EnumMap<>(Bound.class);
        for (Bound b : Bound.values()) {
            double[] values = curves.values(b);
            OptionalDouble crossing;
            if (b == Bound.MIMO && !s.mimoExact()) {
                crossing = TargetCrossing.interpolate(snrDb, values, targetFer);
                for (int i = 0; i < values.length; i++) {
                    if (curves.points().get(i).mimoOutages() < minErrors) {
                        values[i] = Double.NaN;
                    }
                }
            } else {
                crossing = TargetCrossing.ofClosedForm(closedForm(s, b), targetFer);
            }
            bounds.put(b, new BoundAnalysis(crossing, DiversityFit.ofCurve(snrDb, values, tailPoints)));
        }
        return new LinkAnalysis(targetFer, minErrors, tailPoints, diversity, snrDbAtTarget, s, bounds);
    }

    /** Simulated SNR minus the bound's SNR at the target FER; empty when either is not reached. */
    public OptionalDouble gapDb(Bound bound) {
        OptionalDouble boundDb = bounds.get(bound).snrDbAtTarget();
        return snrDbAtTarget.isPresent() && boundDb.isPresent()
                ? OptionalDouble.of(snrDbAtTarget.getAsDouble() - boundDb.getAsDouble())
                : OptionalDouble.empty();
    }

    /**
     * The analysis as plain maps, lists, numbers and nulls, in a fixed key order, for results.json
     * (e.g. {@code objectMapper.valueToTree(analysis.toJson())}):
     * <pre>
     * target_fer, snr_db_at_target, diversity_order {value, standard_error, ci_low, ci_high,
     *   confidence, snr_db_used}, gap_db {mimo, stbc, qam}, fit {min_errors, tail_points},
     * bounds {spectral_efficiency, information, mimo_exact, mimo_draws, mimo_seed,
     *   mimo|stbc|qam {snr_db_at_target, diversity_order}}
     * </pre>
     * A value not reached, and an interval a closed form does not have, is null.
     */
    public Map<String, Object> toJson() {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("target_fer", targetFer);
        root.put("snr_db_at_target", orNull(snrDbAtTarget));
        root.put("diversity_order", json(diversity));
        Map<String, Object> gaps = new LinkedHashMap<>();
        for (Bound b : Bound.values()) {
            gaps.put(b.key(), orNull(gapDb(b)));
        }
        root.put("gap_db", gaps);
        Map<String, Object> fit = new LinkedHashMap<>();
        fit.put("min_errors", minErrors);
        fit.put("tail_points", tailPoints);
        root.put("fit", fit);
        Map<String, Object> b = new LinkedHashMap<>();
        b.put("spectral_efficiency", boundSettings.spectralEfficiency());
        b.put("information", boundSettings.information().cliName());
        b.put("mimo_exact", boundSettings.mimoExact());
        b.put("mimo_draws", boundSettings.mimoExact() ? null : boundSettings.mimoDraws());
        b.put("mimo_seed", boundSettings.mimoExact() ? null : boundSettings.mimoSeed());
        for (Bound bound : Bound.values()) {
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("snr_db_at_target", orNull(bounds.get(bound).snrDbAtTarget()));
            one.put("diversity_order", json(bounds.get(bound).diversity()));
            b.put(bound.key(), one);
        }
        root.put("bounds", b);
        return root;
    }

    private static Map<String, Object> json(Optional<DiversityFit> fit) {
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

    private static Double orNull(OptionalDouble v) {
        return v.isPresent() ? v.getAsDouble() : null;
    }

    private static DoubleUnaryOperator closedForm(BoundSettings s, Bound b) {
        switch (b) {
            case MIMO:
                return snrDb -> s.mimoOutage(snrDb).probability();
            case STBC:
                return s::stbcOutage;
            default:
                return s::qamOutage;
        }
    }
}
