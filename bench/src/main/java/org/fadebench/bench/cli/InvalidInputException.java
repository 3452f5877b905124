package org.fadebench.bench.cli;

/** Input the user can fix: reported as one line on stderr with exit code 2. */
public final class InvalidInputException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    public InvalidInputException(String message) {
        super(message, null, false, false);
    }
}
