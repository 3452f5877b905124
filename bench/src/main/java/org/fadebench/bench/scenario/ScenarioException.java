package org.fadebench.bench.scenario;

/** A scenario file that cannot be used; the message names the file, line and key. */
public final class ScenarioException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    public ScenarioException(String message) {
        super(message, null, false, false);
    }
}
