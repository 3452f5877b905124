package org.fadebench.bench.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.fadebench.bench.sweep.PointResult;

/**
 * The diversity order of an error-rate curve: minus the slope of log10(error rate) against
 * log10(linear SNR) = SNR_dB / 10, fitted by least squares on the high-SNR tail. An error rate that
 * falls as SNR^(−L) has slope −L.
 *
 * <p><b>Tail.</b> The fit uses the last {@code tailPoints} usable points in order of SNR (or all
 * of them when fewer are usable), and needs at least two. The default of
 * {@value #DEFAULT_TAIL_POINTS} keeps the fit on the highest SNRs, where the curve is closest to
 * its asymptote, while a third point averages more counting noise than a line through two.
 *
 * <p><b>Counted curves</b> ({@link #ofCounts}, {@link #ofPoints}): a point is usable when it has at
 * least {@code minErrors} errors and not every trial failed. Its weight is the inverse variance of
 * y = log10 p̂, with p̂ = k/n for k errors in n trials. By the delta method (G. Casella and R. L.
 * Berger, Statistical Inference, 2nd ed., 2002, Sec. 5.5.4; section from memory),
 * Var(g(p̂)) ≈ g'(p)²·Var(p̂) with g(p) = log10 p, g'(p) = 1/(p·ln 10) and Var(p̂) = p(1−p)/n, so
 * <pre>  Var(log10 p̂) ≈ (1−p) / (n·p·ln²10) ≈ (1−p̂) / (k·ln²10),   weight w = k·ln²10 / (1−p̂).</pre>
 * With these known variances the weighted least-squares slope b = Σw(x−x̄)(y−ȳ) / Σw(x−x̄)² has
 * standard error 1/√(Σw(x−x̄)²) (x̄, ȳ weighted means; common practice, no source), and the
 * interval is b ± z·SE with z the normal 97.5 % quantile. The interval covers counting noise only,
 * not the bias of a tail that has not yet reached its asymptote.
 *
 * <p><b>Closed-form curves</b> ({@link #ofCurve}): equal weights, every value in (0, 1) usable,
 * no standard error or interval (the values have no noise).
 *
 * @param order         the diversity order, −slope
 * @param standardError standard error of the order; NaN for a closed-form curve
 * @param low           lower end of the {@value #CONFIDENCE} interval of the order; NaN for a closed form
 * @param high          upper end of that interval; NaN for a closed form
 * @param snrDbUsed     the SNR points the fit used, increasing
 */
public record DiversityFit(double order, double standardError, double low, double high, List<Double> snrDbUsed) {

    public static final int DEFAULT_MIN_ERRORS = 10;
    public static final int DEFAULT_TAIL_POINTS = 3;
    public static final double CONFIDENCE = 0.95;

    private static final double Z = NormalDistribution.of(0.0, 1.0)
            .inverseCumulativeProbability(0.5 + CONFIDENCE / 2);
    private static final double LN10_SQUARED = Math.log(10.0) * Math.log(10.0);

    public DiversityFit {
        snrDbUsed = List.copyOf(snrDbUsed);
    }

    /** False for a closed-form curve, whose fit has no interval. */
    public boolean hasInterval() {
        return !Double.isNaN(standardError);
    }

    /** The frame error rates of a sweep; see {@link #ofCounts}. */
    public static Optional<DiversityFit> ofPoints(List<PointResult> points, int minErrors, int tailPoints) {
        return ofCounts(points.stream().mapToDouble(PointResult::snrDb).toArray(),
                points.stream().mapToLong(PointResult::equivalentErrors).toArray(),
                points.stream().mapToLong(PointResult::equivalentFrames).toArray(), minErrors, tailPoints);
    }

    /**
     * Weighted fit of counted error rates {@code errors[i] / trials[i]} at {@code snrDb[i]} (any
     * order, distinct); empty when fewer than two points are usable.
     *
     * @throws IllegalArgumentException on arrays of different lengths, repeated or non-finite SNRs,
     *                                  counts outside 0 <= errors <= trials, minErrors < 1 or tailPoints < 2
     */
    public static Optional<DiversityFit> ofCounts(double[] snrDb, long[] errors, long[] trials, int minErrors,
                                                  int tailPoints) {
        SnrOrder.checkSameLength(snrDb, errors.length, "error counts");
        SnrOrder.checkSameLength(snrDb, trials.length, "trial counts");
        if (minErrors < 1) {
            throw new IllegalArgumentException("minimum errors per fitted point must be >= 1, got " + minErrors);
        }
        checkTail(tailPoints);
        List<Integer> usable = new ArrayList<>();
        for (int i : SnrOrder.ascending(snrDb)) {
            if (errors[i] < 0 || errors[i] > trials[i]) {
                throw new IllegalArgumentException("need 0 <= errors <= trials, got " + errors[i] + " errors in "
                        + trials[i] + " trials at " + snrDb[i] + " dB");
            }
            if (errors[i] >= minErrors && errors[i] < trials[i]) {
                usable.add(i);
            }
        }
        List<Integer> tail = usable.subList(Math.max(0, usable.size() - tailPoints), usable.size());
        double[] y = new double[tail.size()];
        double[] w = new double[tail.size()];
        for (int j = 0; j < tail.size(); j++) {
            int i = tail.get(j);
            double p = (double) errors[i] / trials[i];
            y[j] = Math.log10(p);
            w[j] = errors[i] * LN10_SQUARED / (1.0 - p);
        }
        return fit(snrDb, tail, y, w, true);
    }

    /**
     * Equal-weight fit of a closed-form curve (e.g. an outage bound), {@code values[i]} at
     * {@code snrDb[i]} (any order, distinct). Values outside (0, 1), and NaN, are not usable;
     * empty when fewer than two are.
     *
     * @throws IllegalArgumentException on arrays of different lengths, repeated or non-finite SNRs, or tailPoints < 2
     */
    public static Optional<DiversityFit> ofCurve(double[] snrDb, double[] values, int tailPoints) {
        SnrOrder.checkSameLength(snrDb, values.length, "curve values");
        checkTail(tailPoints);
        List<Integer> usable = new ArrayList<>();
        for (int i : SnrOrder.ascending(snrDb)) {
            if (values[i] > 0.0 && values[i] < 1.0) {
                usable.add(i);
            }
        }
        List<Integer> tail = usable.subList(Math.max(0, usable.size() - tailPoints), usable.size());
        double[] y = tail.stream().mapToDouble(i -> Math.log10(values[i])).toArray();
        double[] w = new double[tail.size()];
        Arrays.fill(w, 1.0);
        return fit(snrDb, tail, y, w, false);
    }

    private static Optional<DiversityFit> fit(double[] snrDb, List<Integer> tail, double[] y, double[] w,
                                              boolean weighted) {
        if (tail.size() < 2) {
            return Optional.empty();
        }
        double[] x = tail.stream().mapToDouble(i -> snrDb[i] / 10.0).toArray();
        double sw = 0;
        double swx = 0;
        double swy = 0;
        for (int j = 0; j < x.length; j++) {
            sw += w[j];
            swx += w[j] * x[j];
            swy += w[j] * y[j];
        }
        double xMean = swx / sw;
        double yMean = swy / sw;
        double sxx = 0;
        double sxy = 0;
        for (int j = 0; j < x.length; j++) {
            sxx += w[j] * (x[j] - xMean) * (x[j] - xMean);
            sxy += w[j] * (x[j] - xMean) * (y[j] - yMean);
        }
        double order = -sxy / sxx;
        List<Double> used = tail.stream().map(i -> snrDb[i]).toList();
        if (!weighted) {
            return Optional.of(new DiversityFit(order, Double.NaN, Double.NaN, Double.NaN, used));
        }
        double se = 1.0 / Math.sqrt(sxx);
        return Optional.of(new DiversityFit(order, se, order - Z * se, order + Z * se, used));
    }

    private static void checkTail(int tailPoints) {
        if (tailPoints < 2) {
            throw new IllegalArgumentException("tail points must be >= 2 (a line needs two), got " + tailPoints);
        }
    }
}
