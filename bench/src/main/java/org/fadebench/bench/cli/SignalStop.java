package org.fadebench.bench.cli;

import java.util.ArrayList;
import java.util.List;
import sun.misc.Signal;
import sun.misc.SignalHandler;

/**
 * Turns SIGINT (Ctrl-C) and SIGTERM into a polite request to stop, for as long as it is installed,
 * so a sweep can finish its batches in flight and write partial results. Restores the previous
 * handlers on close. Uses the JDK's {@code sun.misc.Signal} (module jdk.unsupported), the one way
 * the JDK offers to catch a signal without ending the process.
 */
@SuppressWarnings("restriction")
final class SignalStop implements AutoCloseable {

    private final List<Signal> signals = new ArrayList<>();
    private final List<SignalHandler> previous = new ArrayList<>();

    private SignalStop() {
    }

    static SignalStop install(Runnable onSignal) {
        SignalStop s = new SignalStop();
        for (String name : new String[] {"INT", "TERM"}) {
            try {
                Signal sig = new Signal(name);
                SignalHandler old = Signal.handle(sig, x -> onSignal.run());
                s.signals.add(sig);
                s.previous.add(old);
            } catch (IllegalArgumentException | UnsupportedOperationException e) {
                // signal not available on this platform or already used by the JVM: leave it alone
            }
        }
        return s;
    }

    @Override
    public void close() {
        for (int i = 0; i < signals.size(); i++) {
            Signal.handle(signals.get(i), previous.get(i));
        }
    }
}
