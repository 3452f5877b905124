package org.fadebench.bench.scenario;

/**
 * One key of the scenario schema: its section and name in the file, the command-line option it
 * stands for (null for a key that exists in scenario files only), and the kind of value it takes.
 */
public record ScenarioKey(String section, String name, String option, Kind kind, String help) {

    /** The kinds of value a key takes. */
    public enum Kind {
        TEXT("text"),
        WHOLE("a whole number"),
        NUMBER("a number"),
        /** A dB value, a FROM..TO/STEP text, or a list of numbers. */
        SNR("a number, FROM..TO/STEP, or a list of numbers"),
        FLAG("true or false"),
        /** A square complex matrix: a list of rows, each entry a number or a pair [re, im]. */
        MATRIX("a list of rows of numbers or [re, im] pairs");

        private final String description;

        Kind(String description) {
            this.description = description;
        }

        public String description() {
            return description;
        }
    }

    /** {@code section.name}, as error messages show it. */
    public String path() {
        return section + "." + name;
    }
}
