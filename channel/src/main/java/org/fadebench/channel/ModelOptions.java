package org.fadebench.channel;

import java.io.Serializable;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;

/**
 * The model settings a user gave, by key (the setting's name, e.g. {@code --k-factor}), in the order
 * given: what a {@link ChannelModels} factory builds its model from. Immutable. Each value was
 * checked on its own when it was given; the model checks the combination.
 */
public final class ModelOptions implements Serializable {

    public static final String K_FACTOR = "--k-factor";
    public static final String NAKAGAMI_M = "--nakagami-m";
    public static final String TX_CORR = "--tx-corr";
    public static final String RX_CORR = "--rx-corr";
    /** Full correlation matrices (a {@link KroneckerCorrelation}), from a scenario file or the library. */
    public static final String CORRELATION_MATRICES = "correlation matrices";
    public static final String DOPPLER = "--doppler";

    /** No settings. */
    public static final ModelOptions NONE = new ModelOptions(Map.of());

    private final Map<String, Object> given;

    private ModelOptions(Map<String, Object> given) {
        this.given = given;
    }

    /** These settings with {@code key} set to {@code value}. */
    public ModelOptions with(String key, Object value) {
        Map<String, Object> m = new LinkedHashMap<>(given);
        m.put(key, value);
        return new ModelOptions(Collections.unmodifiableMap(m));
    }

    /** The keys given, in order. */
    public Set<String> keys() {
        return given.keySet();
    }

    public boolean has(String key) {
        return given.containsKey(key);
    }

    /** The value of {@code key}, or null when it was not given. */
    public Object get(String key) {
        return given.get(key);
    }

    /**
     * The number given for {@code key}, which model {@code model} needs.
     *
     * @throws IllegalArgumentException "--fading {model} needs {key} ({what})" when it was not given
     */
    public double required(String model, String key, String what) {
        if (!has(key)) {
            throw new IllegalArgumentException("--fading " + model + " needs " + key + " (" + what + ")");
        }
        return number(key);
    }

    /** The number given for {@code key}, or null when it was not given. */
    public Double number(String key) {
        Object v = given.get(key);
        if (v != null && !(v instanceof Number)) {
            throw new IllegalArgumentException(key + " must be a number, got " + v);
        }
        return v == null ? null : ((Number) v).doubleValue();
    }

    /** The spatial correlation given by {@link #TX_CORR}, {@link #RX_CORR} or {@link #CORRELATION_MATRICES}. */
    public SpatialCorrelation correlation() {
        Object matrices = get(CORRELATION_MATRICES);
        if (matrices != null && !(matrices instanceof KroneckerCorrelation)) {
            throw new IllegalArgumentException(CORRELATION_MATRICES + " must be a KroneckerCorrelation, got " + matrices);
        }
        return new SpatialCorrelation(number(RX_CORR), number(TX_CORR), (KroneckerCorrelation) matrices);
    }
}
