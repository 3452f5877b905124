package org.fadebench.bench.sweep;

import java.util.HashSet;
import java.util.Locale;
import java.util.Set;

/**
 * Parses the SNR points of a sweep, in dB: a range {@code FROM..TO/STEP} ({@code 0..20/2},
 * {@code -4..10/0.5}), a single value, or a list {@code a,b,c}.
 *
 * <p>A range starts at FROM and steps by STEP (positive) towards TO, upwards or downwards; TO is
 * a point when it lies on the grid within {@link #GRID_TOLERANCE} of a step, and points are rounded
 * to 1e-9 dB so that {@code 0..1/0.1} gives 0.3, not 0.30000000000000004. Every point must be
 * distinct: a list that names one twice is refused.
 */
public final class SnrGrid {

    /** Most points one sweep may have. */
    public static final int MAX_POINTS = 10_000;
    /** TO belongs to the range when (TO − FROM)/STEP is within this of a whole number of steps. */
    public static final double GRID_TOLERANCE = 1e-9;
    private static final String FORMS = "; use FROM..TO/STEP (e.g. 0..20/2), a single value, or a list a,b,c, in dB";

    private SnrGrid() {
    }

    public static double[] parse(String spec) {
        String s = spec.trim();
        try {
            if (s.contains(":")) {
                throw new IllegalArgumentException("--snr '" + spec + "': the START:STEP:STOP form is not read; "
                        + oldFormHint(s));
            }
            double[] v = s.contains("..") ? range(s, spec) : list(s, spec);
            requireDistinct(v, spec);
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("--snr '" + spec + "' is not a number" + FORMS);
        }
    }

    private static double[] range(String s, String spec) {
        int dots = s.indexOf("..");
        int slash = s.indexOf('/', dots);
        if (slash < 0 || s.indexOf("..", dots + 2) >= 0 || s.indexOf('/', slash + 1) >= 0) {
            throw new IllegalArgumentException("--snr '" + spec + "' is not FROM..TO/STEP" + FORMS);
        }
        double from = finite(s.substring(0, dots), spec);
        double to = finite(s.substring(dots + 2, slash), spec);
        double step = finite(s.substring(slash + 1), spec);
        if (!(step > 0)) {
            throw new IllegalArgumentException("--snr '" + spec + "': STEP must be positive (the points run from FROM "
                    + "towards TO, downwards when TO is below FROM), got " + s.substring(slash + 1).trim());
        }
        double signed = to >= from ? step : -step;
        double n = Math.floor((to - from) / signed + GRID_TOLERANCE) + 1;
        if (n > MAX_POINTS) {
            throw new IllegalArgumentException("--snr '" + spec + "' gives " + (long) n + " points, more than "
                    + MAX_POINTS);
        }
        double[] v = new double[(int) n];
        for (int i = 0; i < v.length; i++) {
            v[i] = Math.round((from + i * signed) * 1e9) / 1e9;
        }
        return v;
    }

    private static double[] list(String s, String spec) {
        String[] p = s.split(",", -1);
        if (p.length > MAX_POINTS) {
            throw new IllegalArgumentException("--snr has more than " + MAX_POINTS + " points");
        }
        double[] v = new double[p.length];
        for (int i = 0; i < p.length; i++) {
            v[i] = finite(p[i], spec);
        }
        return v;
    }

    /** Each SNR point is one point of the results: the same value twice is refused, naming it. */
    private static void requireDistinct(double[] v, String spec) {
        Set<Double> seen = new HashSet<>();
        for (double x : v) {
            if (!seen.add(x == 0 ? 0.0 : x)) {
                throw new IllegalArgumentException("--snr '" + spec + "': " + format(x)
                        + " dB appears more than once; give each SNR point once");
            }
        }
    }

    /** The new spelling of an old {@code START:STEP:STOP} text, or the general forms. */
    private static String oldFormHint(String s) {
        String[] p = s.split(":", -1);
        if (p.length == 3) {
            try {
                double start = Double.parseDouble(p[0].trim());
                double step = Double.parseDouble(p[1].trim());
                double stop = Double.parseDouble(p[2].trim());
                if (Double.isFinite(start) && Double.isFinite(stop) && Double.isFinite(step) && step != 0) {
                    return "write " + format(start) + ".." + format(stop) + "/" + format(Math.abs(step))
                            + " for the same points";
                }
            } catch (NumberFormatException e) {
                // fall through to the general hint
            }
        }
        return "write FROM..TO/STEP (e.g. 0..20/2), a single value, or a list a,b,c, in dB";
    }

    /** A number as typed by a person: 2, 0.5, -4, 1e-3. */
    private static String format(double x) {
        String t = Double.toString(x);
        return t.endsWith(".0") ? t.substring(0, t.length() - 2) : t;
    }

    private static double finite(String part, String spec) {
        String t = part.trim().toLowerCase(Locale.ROOT);
        if (t.isEmpty()) {
            throw new NumberFormatException();
        }
        double v = Double.parseDouble(t);
        if (!Double.isFinite(v) || Math.abs(v) > 400) {
            throw new IllegalArgumentException("--snr '" + spec + "': " + part.trim()
                    + " dB is outside the range -400 to 400 dB");
        }
        return v;
    }
}
