package org.fadebench.bench.sweep;

import org.fadebench.modem.NamedChoice;

/**
 * How a point's FER is estimated ({@code --estimator}): plain Monte Carlo over the model's own
 * fades, or importance sampling of deep fades (see {@link FadeScaleSearch} and the README).
 */
public enum Estimator implements NamedChoice {
    /** Frames drawn from the channel's own law; Clopper-Pearson intervals; stop on errors. */
    PLAIN("plain"),
    /** Fades drawn from a scaled law, frames weighted by their likelihood ratio; normal intervals; stop on precision. */
    FADE_SAMPLING("fade-sampling");

    private final String cliName;

    Estimator(String cliName) {
        this.cliName = cliName;
    }

    @Override
    public String cliName() {
        return cliName;
    }

    /** The estimator named {@code name}, or "unknown estimator 'x'; valid: plain, fade-sampling". */
    public static Estimator of(String name) {
        return NamedChoice.find(values(), name, "estimator");
    }
}
