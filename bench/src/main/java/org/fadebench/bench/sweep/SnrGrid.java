package org.fadebench.bench.sweep;

import java.util.Locale;

/** Parses the SNR points of a sweep: {@code START:STEP:STOP}, a single value, or a list {@code a,b,c} (dB). */
public final class SnrGrid {

    /** Most points one sweep may have. */
    public static final int MAX_POINTS = 10_000;

    private SnrGrid() {
    }

    public static double[] parse(String spec) {
        String s = spec.trim();
        String form = "; use START:STEP:STOP, a single value, or a comma-separated list, in dB (e.g. 0:2:20)";
        try {
            if (s.contains(":")) {
                String[] p = s.split(":", -1);
                if (p.length != 3) {
                    throw new IllegalArgumentException("--snr '" + spec + "' is not START:STEP:STOP" + form);
                }
                double start = finite(p[0], spec);
                double step = finite(p[1], spec);
                double stop = finite(p[2], spec);
                if (step == 0 || (stop - start) / step < 0) {
                    throw new IllegalArgumentException("--snr '" + spec + "': STEP must be non-zero and lead from START to STOP"
                            + form);
                }
                double n = Math.floor((stop - start) / step + 1e-9) + 1;
                if (n > MAX_POINTS) {
                    throw new IllegalArgumentException("--snr '" + spec + "' gives " + (long) n + " points, more than "
                            + MAX_POINTS);
                }
                double[] v = new double[(int) n];
                for (int i = 0; i < v.length; i++) {
                    v[i] = Math.round((start + i * step) * 1e9) / 1e9;
                }
                return v;
            }
            String[] p = s.split(",", -1);
            if (p.length > MAX_POINTS) {
                throw new IllegalArgumentException("--snr has more than " + MAX_POINTS + " points");
            }
            double[] v = new double[p.length];
            for (int i = 0; i < p.length; i++) {
                v[i] = finite(p[i], spec);
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("--snr '" + spec + "' is not a number" + form);
        }
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
