package org.fadebench.coding.fec;

import java.util.Arrays;
import java.util.function.Function;
import java.util.stream.Collectors;

/** Command-line name look-up shared by the enums of this package. */
final class CliNames {

    private CliNames() {
    }

    /**
     * The constant whose name equals {@code name}, ignoring case and surrounding blanks.
     *
     * @throws IllegalArgumentException "unknown WHAT 'name'; valid: ..." when there is none
     */
    static <E> E find(E[] values, Function<E, String> cliName, String name, String what) {
        for (E v : values) {
            if (cliName.apply(v).equalsIgnoreCase(name.trim())) {
                return v;
            }
        }
        throw new IllegalArgumentException("unknown " + what + " '" + name + "'; valid: "
                + list(values, cliName));
    }

    /** The names, comma separated. */
    static <E> String list(E[] values, Function<E, String> cliName) {
        return Arrays.stream(values).map(cliName).collect(Collectors.joining(", "));
    }
}
