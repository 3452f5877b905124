package org.fadebench.bench.cli;

import java.util.ArrayList;
import java.util.List;
import sun.misc.Signal;
import sun.misc.SignalHandler;

/**
 * Turns SIGINT (Ctrl-C) and SIGTERM into a polite request to stop, for as long as it is installed,
 * so a sweep can finish its batches in flight and write partial results, and a bound computation
 * can end at its next poll. Remembers which signal came, for the exit code 128 + its number (130
 * for SIGINT, 143 for SIGTERM, as shells report them). Restores the previous handlers on close.
 * Uses the JDK's {@code sun.misc.Signal} (module jdk.unsupported), the one way the JDK offers to
 * catch a signal without ending the process.
 */
@SuppressWarnings("restriction")
final class SignalStop implements AutoCloseable {

    /** Exit code after an interruption whose signal is unknown (128 + SIGINT). */
    static final int INTERRUPTED = 130;

    private final List<Signal> signals = new ArrayList<>();
    private final List<SignalHandler> previous = new ArrayList<>();
    private volatile int exitCode;

    private SignalStop() {
    }

    /** Installs the handlers; {@code onSignal} runs (on the JDK's signal thread) at each signal. */
    static SignalStop install(Runnable onSignal) {
        SignalStop s = new SignalStop();
        for (String name : new String[] {"INT", "TERM"}) {
            try {
                Signal sig = new Signal(name);
                SignalHandler old = Signal.handle(sig, x -> {
                    if (s.exitCode == 0) {
                        s.exitCode = 128 + x.getNumber();
                    }
                    onSignal.run();
                });
                s.signals.add(sig);
                s.previous.add(old);
            } catch (IllegalArgumentException | UnsupportedOperationException e) {
                // signal not available on this platform or already used by the JVM: leave it alone
            }
        }
        return s;
    }

    /** True once a signal has come; a long computation polls this. */
    boolean requested() {
        return exitCode != 0;
    }

    /** 128 + the number of the first signal that came, or {@value #INTERRUPTED} if none did. */
    int exitCode() {
        return exitCode == 0 ? INTERRUPTED : exitCode;
    }

    @Override
    public void close() {
        for (int i = 0; i < signals.size(); i++) {
            Signal.handle(signals.get(i), previous.get(i));
        }
    }
}
