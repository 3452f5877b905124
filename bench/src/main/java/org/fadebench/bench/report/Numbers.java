package org.fadebench.bench.report;

import java.math.BigDecimal;
import java.util.Locale;

/** Number formatting shared by tables and files: locale-free and stable, so files are reproducible. */
public final class Numbers {

    private Numbers() {
    }

    /** A value in dB with up to 4 decimals and no trailing zeros, e.g. {@code 2.5}, {@code -3}. */
    public static String db(double v) {
        if (Double.isNaN(v)) {
            return "nan";
        }
        BigDecimal d = new BigDecimal(String.format(Locale.ROOT, "%.4f", v)).stripTrailingZeros();
        String s = d.toPlainString();
        return s.equals("-0") ? "0" : s;
    }

    /** A rate or probability in scientific notation with 6 significant digits. */
    public static String rate(double v) {
        if (Double.isNaN(v)) {
            return "nan";
        }
        return String.format(Locale.ROOT, "%.5e", v);
    }

    /** A rate in short form for the terminal table. */
    public static String shortRate(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        return String.format(Locale.ROOT, "%.3e", v);
    }
}
