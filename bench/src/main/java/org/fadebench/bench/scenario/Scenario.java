package org.fadebench.bench.scenario;

import java.util.Collections;
import java.util.Map;

/**
 * A loaded scenario: for each option it sets, the value as the command line would spell it and
 * where in the file it came from.
 *
 * @param source the file name (or built-in name) for messages
 * @param text   the file's text, kept for archives
 */
public record Scenario(String source, String text, Map<String, Setting> settings) {

    /** The setting of a scenario-only key (e.g. a matrix) by its path {@code section.name}, or null. */
    public Setting byPath(String path) {
        for (Setting s : settings.values()) {
            if (s.key().path().equals(path)) {
                return s;
            }
        }
        return null;
    }

    /**
     * One value: the option it sets, its text, and its place in the file.
     *
     * @param matrix a {@link ScenarioKey.Kind#MATRIX} value: rows x rows complex entries,
     *               interleaved row-major; null for other kinds
     */
    public record Setting(ScenarioKey key, String value, int line, double[] matrix) {

        public Setting(ScenarioKey key, String value, int line) {
            this(key, value, line, null);
        }

        /** "FILE line N, key K" for messages. */
        public String where(String source) {
            return source + " line " + line + ", key " + key.path();
        }
    }

    public Scenario {
        settings = Collections.unmodifiableMap(settings);
    }
}
