package org.fadebench.channel;

/**
 * The names of the built-in fading models, as constants for library callers: {@code
 * ChannelSpec.of(Fading.RICIAN)} is {@code ChannelSpec.of("rician")}. Names are resolved, and
 * listed, by {@link ChannelModels}; a model added there needs no constant here.
 */
public enum Fading {
    RAYLEIGH("rayleigh"),
    RICIAN("rician"),
    NAKAGAMI("nakagami"),
    NONE("none");

    private final String cliName;

    Fading(String cliName) {
        this.cliName = cliName;
    }

    public String cliName() {
        return cliName;
    }

    @Override
    public String toString() {
        return cliName;
    }
}
