package org.fadebench.modem;

import java.util.Locale;

/** How bit LLRs are computed from a symbol estimate: max-log or exact (log-sum-exp). */
public enum LlrMethod {
    MAXLOG("maxlog"),
    EXACT("exact");

    private final String cliName;

    LlrMethod(String cliName) {
        this.cliName = cliName;
    }

    public String cliName() {
        return cliName;
    }

    /** @throws IllegalArgumentException naming the valid choices when the name is unknown */
    public static LlrMethod fromCliName(String name) {
        for (LlrMethod m : values()) {
            if (m.cliName.equalsIgnoreCase(name.trim())) {
                return m;
            }
        }
        throw new IllegalArgumentException("unknown LLR method '" + name + "'; valid: maxlog, exact");
    }

    @Override
    public String toString() {
        return cliName.toLowerCase(Locale.ROOT);
    }
}
