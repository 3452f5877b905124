package org.fadebench.bench.cli;

import java.nio.file.Path;
import java.util.Map;
import org.fadebench.bench.scenario.Scenario;
import org.fadebench.bench.scenario.ScenarioKey;
import org.fadebench.bench.scenario.ScenarioSchema;
import picocli.CommandLine.Model.CommandSpec;

/**
 * A run's settings as a scenario file, written beside its results as scenario.yaml: every key of the
 * schema, defaults included, so that running the file repeats the run and writes the same file
 * again. A key whose default follows the other settings (the decoder, the transmit antennas, the
 * frame length, ...) is written as a comment with the value used, so that an edited file does not
 * keep a value that no longer fits; a key that was not set at all is a comment too. Paths are stored
 * resolved (absolute).
 */
final class ScenarioText {

    static final String HEADER = "# fadebench scenario: every setting of this run, defaults included; "
            + "'fadebench run FILE' repeats it.\n"
            + "# Paths are stored resolved (absolute). Commented keys were not set; where one shows a value, "
            + "it is the default\n# that follows the other settings.\n";

    private ScenarioText() {
    }

    /**
     * @param spec    the run command, whose options hold the values (command line, scenario or default)
     * @param source  the scenario file read, or null (its correlation matrices are copied)
     * @param derived for options without a value, the value the run derived from the other settings
     */
    static String of(CommandSpec spec, Scenario source, Map<String, Object> derived) {
        StringBuilder y = new StringBuilder(HEADER);
        String section = null;
        for (ScenarioKey key : ScenarioSchema.keys()) {
            if (!key.section().equals(section)) {
                section = key.section();
                y.append(section).append(":\n");
            }
            if (key.option() == null) {
                Scenario.Setting m = source == null ? null : source.byPath(key.path());
                if (m == null || m.matrix() == null) {
                    y.append("  # ").append(key.name()).append(": not set\n");
                } else {
                    matrix(y.append("  ").append(key.name()).append(":\n"), m.matrix());
                }
                continue;
            }
            Object value = spec.findOption(key.option()).getValue();
            if (value == null) {
                Object d = derived.get(key.option());
                y.append("  # ").append(key.name()).append(": ")
                        .append(d == null ? "not set" : text(key, d) + " (default)").append('\n');
                continue;
            }
            y.append("  ").append(key.name()).append(": ").append(text(key, value)).append('\n');
        }
        return y.toString();
    }

    private static String text(ScenarioKey key, Object value) {
        String t = key.kind() == ScenarioKey.Kind.PATH ? RunOutputs.resolved(Path.of(value.toString())).toString()
                : String.valueOf(value);
        boolean quote = key.kind() == ScenarioKey.Kind.TEXT || key.kind() == ScenarioKey.Kind.SNR
                || key.kind() == ScenarioKey.Kind.PATH;
        return quote ? "\"" + t.replace("\\", "\\\\").replace("\"", "\\\"") + "\"" : t;
    }

    /** A square complex matrix (interleaved, row-major) as rows of [re, im] pairs. */
    private static void matrix(StringBuilder y, double[] m) {
        int n = (int) Math.round(Math.sqrt(m.length / 2.0));
        for (int i = 0; i < n; i++) {
            y.append("    - [");
            for (int j = 0; j < n; j++) {
                y.append(j == 0 ? "" : ", ").append('[').append(m[2 * (i * n + j)]).append(", ")
                        .append(m[2 * (i * n + j) + 1]).append(']');
            }
            y.append("]\n");
        }
    }
}
