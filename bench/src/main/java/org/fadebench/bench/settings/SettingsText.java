package org.fadebench.bench.settings;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Settings written out, from the table: as a scenario file (every setting of the table, the unset
 * ones as comments, so the file shows every choice there is) and as the {@code settings} object of
 * results.json.
 */
public final class SettingsText {

    private SettingsText() {
    }

    /**
     * A scenario file holding {@code values}; {@code comment} lines go first, each prefixed with
     * {@code #}. Reading the file back gives the same values.
     */
    public static String scenario(SettingValues values, List<Setting> table, List<String> comment) {
        StringBuilder y = new StringBuilder();
        for (String c : comment) {
            y.append("# ").append(c).append('\n');
        }
        String section = null;
        for (Setting s : table) {
            if (!s.section().equals(section)) {
                section = s.section();
                y.append(section).append(":\n");
            }
            if (!values.isSet(s)) {
                y.append("  # ").append(s.name()).append(":    (not set) ").append(s.help()).append('\n');
                continue;
            }
            y.append("  ").append(s.name()).append(": ").append(yamlValue(s, values)).append('\n');
        }
        return y.toString();
    }

    private static String yamlValue(Setting s, SettingValues values) {
        switch (s.kind()) {
            case MATRIX:
                return matrix(values.matrix(s));
            case WHOLE:
            case NUMBER:
            case FLAG:
                return values.text(s).trim();
            default:
                return quoted(values.text(s));
        }
    }

    /** A YAML double-quoted scalar. */
    static String quoted(String text) {
        StringBuilder q = new StringBuilder("\"");
        for (char c : text.toCharArray()) {
            switch (c) {
                case '\\' -> q.append("\\\\");
                case '"' -> q.append("\\\"");
                case '\n' -> q.append("\\n");
                case '\t' -> q.append("\\t");
                default -> {
                    if (c < 0x20) {
                        q.append(String.format("\\x%02x", (int) c));
                    } else {
                        q.append(c);
                    }
                }
            }
        }
        return q.append('"').toString();
    }

    /** A square complex matrix as a flow list of rows of [re, im] pairs. */
    private static String matrix(double[] m) {
        int n = (int) Math.round(Math.sqrt(m.length / 2.0));
        StringBuilder b = new StringBuilder("[");
        for (int i = 0; i < n; i++) {
            b.append(i == 0 ? "[" : ", [");
            for (int j = 0; j < n; j++) {
                int k = 2 * (i * n + j);
                b.append(j == 0 ? "" : ", ").append('[').append(Double.toString(m[k])).append(", ")
                        .append(Double.toString(m[k + 1])).append(']');
            }
            b.append(']');
        }
        return b.append(']').toString();
    }

    /**
     * The settings as results.json records them: every setting of the table by its JSON key, as a
     * number, a flag, text or a matrix (rows of [re, im] pairs), or null where unset.
     */
    public static Map<String, Object> json(SettingValues values, List<Setting> table) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (Setting s : table) {
            if (!values.isSet(s)) {
                m.put(s.jsonKey(), null);
                continue;
            }
            switch (s.kind()) {
                case WHOLE -> m.put(s.jsonKey(), values.whole(s));
                case NUMBER -> m.put(s.jsonKey(), values.number(s));
                case FLAG -> m.put(s.jsonKey(), values.flag(s));
                case MATRIX -> m.put(s.jsonKey(), rows(values.matrix(s)));
                default -> m.put(s.jsonKey(), values.text(s));
            }
        }
        return m;
    }

    private static double[][][] rows(double[] m) {
        int n = (int) Math.round(Math.sqrt(m.length / 2.0));
        double[][][] r = new double[n][n][2];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                r[i][j][0] = m[2 * (i * n + j)];
                r[i][j][1] = m[2 * (i * n + j) + 1];
            }
        }
        return r;
    }
}
