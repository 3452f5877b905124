package org.fadebench.modem;

import java.util.Locale;

/** How bit LLRs are computed from a symbol estimate: max-log or exact (log-sum-exp). */
public enum LlrMethod implements NamedChoice {
    MAXLOG("maxlog"),
    EXACT("exact");

    private final String cliName;

    LlrMethod(String cliName) {
        this.cliName = cliName;
    }

    @Override
    public String cliName() {
        return cliName;
    }

    /** @throws IllegalArgumentException naming the valid choices when the name is unknown */
    public static LlrMethod fromCliName(String name) {
        return NamedChoice.find(values(), name, "LLR method");
    }

    @Override
    public String toString() {
        return cliName.toLowerCase(Locale.ROOT);
    }
}
