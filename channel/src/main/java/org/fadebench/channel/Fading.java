package org.fadebench.channel;

import java.util.Locale;

/**
 * The fading models selectable by name on the command line and in scenario files. Rician and
 * Nakagami fading take parameters; a channel with its parameters and options (correlation, Doppler,
 * CSI, traces) is built with {@link ChannelSpec}.
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

    /**
     * A new model instance of this kind, for the kinds without parameters (independent Rayleigh, none).
     *
     * @throws IllegalStateException for rician and nakagami, which need {@link ChannelSpec}
     */
    public FadingModel model() {
        switch (this) {
            case RAYLEIGH:
                return new RayleighFading();
            case NONE:
                return new NoFading();
            default:
                throw new IllegalStateException(cliName + " fading has parameters: build it with ChannelSpec");
        }
    }

    /**
     * The lookup of modem's {@code NamedChoice}, written out here because channel depends on no
     * other fadebench module; same rules and message form.
     *
     * @throws IllegalArgumentException naming the valid choices when the name is unknown
     */
    public static Fading fromCliName(String name) {
        for (Fading f : values()) {
            if (f.cliName.equalsIgnoreCase(name.trim())) {
                return f;
            }
        }
        throw new IllegalArgumentException("unknown fading model '" + name + "'; valid: " + choices());
    }

    public static String choices() {
        StringBuilder sb = new StringBuilder();
        for (Fading f : values()) {
            if (sb.length() > 0) {
                sb.append(", ");
            }
            sb.append(f.cliName);
        }
        return sb.toString();
    }

    @Override
    public String toString() {
        return cliName.toLowerCase(Locale.ROOT);
    }
}
