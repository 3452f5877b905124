package org.fadebench.bench.settings;

import java.io.Serializable;
import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The values of a run's settings, each as the command line would spell it, with where it came
 * from (the command line, a scenario file's line, or the default), so that a message about a value
 * can point at it. Built in layers: defaults, then a scenario file, then the command line. Plain
 * data: serialisable, and free of any command-line library, so a run can be rebuilt from it
 * anywhere (see {@code RunPlan.from}).
 */
public final class SettingValues implements Serializable {

    private static final long serialVersionUID = 1L;

    /** Where a value came from. */
    public record Origin(String source, int line) implements Serializable {
        public static final Origin COMMAND_LINE = new Origin(null, 0);
        public static final Origin DEFAULT = new Origin(null, -1);
        public static final Origin DERIVED = new Origin(null, -2);

        /** True for a value read from a scenario file. */
        public boolean inFile() {
            return source != null;
        }
    }

    private final Map<String, String> text;
    private final Map<String, double[]> matrices;
    private final Map<String, Origin> origins;

    private SettingValues(Map<String, String> text, Map<String, double[]> matrices, Map<String, Origin> origins) {
        this.text = Collections.unmodifiableMap(text);
        this.matrices = Collections.unmodifiableMap(matrices);
        this.origins = Collections.unmodifiableMap(origins);
    }

    /** No value set. */
    public static SettingValues empty() {
        return new SettingValues(new LinkedHashMap<>(), new LinkedHashMap<>(), new LinkedHashMap<>());
    }

    /** Every setting of {@code table} that has a default, at its default. */
    public static SettingValues defaults(List<Setting> table) {
        SettingValues v = empty();
        for (Setting s : table) {
            if (s.defaultText() != null) {
                v = v.with(s, s.defaultText(), Origin.DEFAULT);
            }
        }
        return v;
    }

    /** These values with {@code setting} set to {@code value} (null to unset). */
    public SettingValues with(Setting setting, String value, Origin origin) {
        if (setting.kind() == Setting.Kind.MATRIX) {
            throw new IllegalArgumentException(setting.path() + " takes a matrix");
        }
        Map<String, String> t = new LinkedHashMap<>(text);
        Map<String, Origin> o = new LinkedHashMap<>(origins);
        if (value == null) {
            t.remove(setting.path());
            o.remove(setting.path());
        } else {
            t.put(setting.path(), value);
            o.put(setting.path(), origin);
        }
        return new SettingValues(t, matrices, o);
    }

    /** These values with a matrix setting (interleaved complex, row-major, square). */
    public SettingValues withMatrix(Setting setting, double[] matrix, Origin origin) {
        if (setting.kind() != Setting.Kind.MATRIX) {
            throw new IllegalArgumentException(setting.path() + " does not take a matrix");
        }
        Map<String, double[]> m = new LinkedHashMap<>(matrices);
        Map<String, Origin> o = new LinkedHashMap<>(origins);
        m.put(setting.path(), matrix.clone());
        o.put(setting.path(), origin);
        return new SettingValues(text, m, o);
    }

    /** These values overlaid by every value set in {@code top}. */
    public SettingValues overlaidBy(SettingValues top) {
        Map<String, String> t = new LinkedHashMap<>(text);
        Map<String, double[]> m = new LinkedHashMap<>(matrices);
        Map<String, Origin> o = new LinkedHashMap<>(origins);
        t.putAll(top.text);
        m.putAll(top.matrices);
        o.putAll(top.origins);
        return new SettingValues(t, m, o);
    }

    public boolean isSet(Setting s) {
        return text.containsKey(s.path()) || matrices.containsKey(s.path());
    }

    /** The value's text, or null when unset. */
    public String text(Setting s) {
        return text.get(s.path());
    }

    /** A matrix value (a copy), or null when unset. */
    public double[] matrix(Setting s) {
        double[] m = matrices.get(s.path());
        return m == null ? null : m.clone();
    }

    public Origin origin(Setting s) {
        return origins.get(s.path());
    }

    /** A whole number, or null when unset; {@link InvalidSettingException} when not one. */
    public Long whole(Setting s) {
        String v = text(s);
        if (v == null) {
            return null;
        }
        try {
            return Long.parseLong(v.trim());
        } catch (NumberFormatException e) {
            throw new InvalidSettingException(s, "expected " + Setting.Kind.WHOLE.description() + ", got '" + v + "'");
        }
    }

    /** A whole number that fits an int, or null when unset. */
    public Integer integer(Setting s) {
        Long v = whole(s);
        if (v == null) {
            return null;
        }
        if (v != v.intValue()) {
            throw new InvalidSettingException(s, "expected a whole number up to " + Integer.MAX_VALUE + ", got " + v);
        }
        return v.intValue();
    }

    /** A finite number, or null when unset. */
    public Double number(Setting s) {
        String v = text(s);
        if (v == null) {
            return null;
        }
        try {
            double d = Double.parseDouble(v.trim());
            if (!Double.isNaN(d) && !Double.isInfinite(d)) {
                return d;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new InvalidSettingException(s, "expected " + Setting.Kind.NUMBER.description() + ", got '" + v + "'");
    }

    /** A flag; false when unset. */
    public boolean flag(Setting s) {
        String v = text(s);
        if (v == null) {
            return false;
        }
        String f = v.trim().toLowerCase(Locale.ROOT);
        if (!f.equals("true") && !f.equals("false")) {
            throw new InvalidSettingException(s, "expected true or false, got '" + v + "'");
        }
        return f.equals("true");
    }

    /**
     * A message about a setting's value that points at it: {@code --rx must be …} for a value from
     * the command line or a default, {@code FILE line 7, key link.rx: --rx must be …} for one from a
     * scenario file.
     */
    public String locate(Setting s, String problem) {
        Origin o = origin(s);
        if (o != null && o.inFile()) {
            String said = s.hasOption() ? InvalidSettingException.join(s.option(), problem)
                    : problem.replaceFirst("^:\\s*", "");
            return o.source() + " line " + o.line() + ", key " + s.path() + ": " + said;
        }
        return InvalidSettingException.join(s.display(), problem);
    }

    @Override
    public boolean equals(Object other) {
        if (!(other instanceof SettingValues v) || !text.equals(v.text) || !matrices.keySet().equals(v.matrices.keySet())) {
            return false;
        }
        for (Map.Entry<String, double[]> e : matrices.entrySet()) {
            if (!Arrays.equals(e.getValue(), v.matrices.get(e.getKey()))) {
                return false;
            }
        }
        return true;
    }

    @Override
    public int hashCode() {
        return text.hashCode() * 31 + matrices.keySet().hashCode();
    }

    @Override
    public String toString() {
        return text.toString();
    }
}
