package org.fadebench.bench.settings;

import java.util.Locale;

/**
 * One setting of a run, described once: its command-line option, its scenario key
 * ({@code section.name}), its key in {@code results.json} (the same {@code name}), the kind of
 * value it takes, its default and its help. The command line, the scenario reader and writer and
 * the results are all served from {@link RunSettings}, the table of these.
 *
 * @param section     scenario section: {@code link}, {@code sweep}, {@code analysis} or {@code output}
 * @param name        key in the section and in results.json's settings
 * @param option      command-line option, e.g. {@code --rx}; null for a scenario-only key
 * @param kind        kind of value
 * @param label       the value's name in help, e.g. {@code N}
 * @param defaultText the default as the command line would spell it, or null when there is none
 *                    (the setting is then unset, or derived from others, as its help says)
 * @param help        one sentence of help, without the default
 */
public record Setting(String section, String name, String option, Kind kind, String label, String defaultText,
                      String help) {

    /** The kinds of value a setting takes. */
    public enum Kind {
        TEXT("text"),
        /** A file or folder name; stored resolved in a written scenario. */
        PATH("a file name"),
        WHOLE("a whole number"),
        NUMBER("a number"),
        /** A dB value, a range FROM..TO/STEP, or a list of numbers. */
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

    public Setting {
        if (!name.equals(name.toLowerCase(Locale.ROOT)) || name.contains("-")) {
            throw new IllegalArgumentException("setting names are lower case with underscores: " + name);
        }
    }

    /** {@code section.name}, as scenario files and their error messages show it. */
    public String path() {
        return section + "." + name;
    }

    /** The key of this setting in results.json's {@code settings}. */
    public String jsonKey() {
        return name;
    }

    /** True when the setting exists on the command line. */
    public boolean hasOption() {
        return option != null;
    }

    /** How a message names this setting to a command-line user: the option, or the scenario key. */
    public String display() {
        return option != null ? option : path();
    }
}
