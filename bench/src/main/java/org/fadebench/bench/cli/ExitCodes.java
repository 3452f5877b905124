package org.fadebench.bench.cli;

/** Process exit codes (documented in README). */
public final class ExitCodes {

    public static final int OK = 0;
    /** An unexpected failure inside fadebench. */
    public static final int INTERNAL = 1;
    /** Invalid input: options, scenario or code files. */
    public static final int INVALID_INPUT = 2;
    /** Reading or writing files failed, or the cluster computing the batches failed while running. */
    public static final int IO_FAILURE = 3;

    private ExitCodes() {
    }
}
