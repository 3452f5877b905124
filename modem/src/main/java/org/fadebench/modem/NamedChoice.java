package org.fadebench.modem;

import java.util.Arrays;
import java.util.stream.Collectors;

/**
 * A value chosen by name on the command line and in scenario files (a modulation, a CRC, …). The
 * enums of modem and coding implement it and look their names up with {@link #find}, so every
 * lookup ignores case and surrounding blanks and fails with the same one-line message.
 */
public interface NamedChoice {

    /** The name on the command line, e.g. {@code 16qam}. */
    String cliName();

    /**
     * The choice whose name equals {@code name}, ignoring case and surrounding blanks.
     *
     * @param what what is chosen, for the message, e.g. {@code "modulation"}
     * @throws IllegalArgumentException "unknown WHAT 'name'; valid: a, b, c" when there is none
     */
    static <E extends NamedChoice> E find(E[] choices, String name, String what) {
        for (E choice : choices) {
            if (choice.cliName().equalsIgnoreCase(name.trim())) {
                return choice;
            }
        }
        throw new IllegalArgumentException("unknown " + what + " '" + name + "'; valid: " + list(choices));
    }

    /** The names, comma separated, in the given order. */
    static String list(NamedChoice[] choices) {
        return Arrays.stream(choices).map(NamedChoice::cliName).collect(Collectors.joining(", "));
    }
}
