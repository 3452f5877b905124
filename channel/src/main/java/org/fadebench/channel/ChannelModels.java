package org.fadebench.channel;

import static org.fadebench.channel.ModelOptions.CORRELATION_MATRICES;
import static org.fadebench.channel.ModelOptions.DOPPLER;
import static org.fadebench.channel.ModelOptions.K_FACTOR;
import static org.fadebench.channel.ModelOptions.NAKAGAMI_M;
import static org.fadebench.channel.ModelOptions.RX_CORR;
import static org.fadebench.channel.ModelOptions.TX_CORR;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * The fading models by name ({@code --fading}): each name with the settings its model takes and a
 * factory that builds the model from them. Immutable; {@link #with} makes an extended registry.
 * The only place that knows which settings go with which model.
 */
public final class ChannelModels implements Serializable {

    /** Builds a model from the settings given; the model checks them and says which is missing. */
    @FunctionalInterface
    public interface Factory extends Serializable {
        ChannelModel create(ModelOptions options);
    }

    private record Entry(Set<String> settings, Factory factory) implements Serializable {
    }

    private static final Set<String> SCATTERED = Set.of(TX_CORR, RX_CORR, CORRELATION_MATRICES, DOPPLER);

    /** The models of the command line: rayleigh, rician, nakagami, none. */
    public static final ChannelModels STANDARD = new ChannelModels(Map.of())
            .with("rayleigh", SCATTERED, o -> DopplerChannel.over(new RayleighChannel(o.correlation()), o))
            .with("rician", union(SCATTERED, K_FACTOR), o -> DopplerChannel.over(
                    new RicianChannel(o.required("rician", K_FACTOR, "a linear K-factor >= 0"), o.correlation()), o))
            .with("nakagami", Set.of(NAKAGAMI_M), o -> new NakagamiChannel(o.required("nakagami", NAKAGAMI_M,
                    "m >= 0.5")))
            .with("none", Set.of(), o -> new AwgnChannel());

    private final Map<String, Entry> entries;

    private ChannelModels(Map<String, Entry> entries) {
        this.entries = entries;
    }

    /** This registry and the model {@code name} (lower case), which takes the settings {@code settings}. */
    public ChannelModels with(String name, Set<String> settings, Factory factory) {
        Map<String, Entry> m = new LinkedHashMap<>(entries);
        m.put(name.toLowerCase(Locale.ROOT), new Entry(Set.copyOf(settings), factory));
        return new ChannelModels(java.util.Collections.unmodifiableMap(m));
    }

    /** Whether {@code name} (any case, surrounding blanks ignored) is a model here. */
    public boolean has(String name) {
        return entries.containsKey(key(name));
    }

    /**
     * The model {@code name} with the settings {@code options}.
     *
     * @throws IllegalArgumentException for an unknown name (listing the valid ones), a setting the
     *     model needs and lacks, one it does not take (naming the models that do), or a bad value
     */
    public ChannelModel create(String name, ModelOptions options) {
        Entry e = entries.get(key(name));
        if (e == null) {
            throw new IllegalArgumentException("unknown fading model '" + name + "'; valid: " + choices());
        }
        ChannelModel model = e.factory.create(options);
        for (String setting : options.keys()) {
            if (!e.settings.contains(setting)) {
                throw new IllegalArgumentException(setting + (setting.startsWith("--") ? " applies" : " apply")
                        + " only to --fading " + takers(setting));
            }
        }
        return model;
    }

    /** The names, e.g. {@code rayleigh, rician, nakagami, none}. */
    public String choices() {
        return String.join(", ", entries.keySet());
    }

    /** The models that take {@code setting}, e.g. {@code rayleigh or rician}. */
    private String takers(String setting) {
        List<String> names = new ArrayList<>();
        entries.forEach((name, e) -> {
            if (e.settings.contains(setting)) {
                names.add(name);
            }
        });
        return names.isEmpty() ? "none of " + choices() : String.join(" or ", names);
    }

    private static String key(String name) {
        return name == null ? "" : name.trim().toLowerCase(Locale.ROOT);
    }

    private static Set<String> union(Set<String> a, String b) {
        Set<String> s = new java.util.HashSet<>(a);
        s.add(b);
        return s;
    }
}
