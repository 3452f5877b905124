package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import sun.misc.Signal;

/** The exit code after a signal is 128 + its number, as shells report it (POSIX: SIGTERM is 15). */
@SuppressWarnings("restriction")
class SignalStopTest {

    @Test
    void sigtermGives143() throws Exception {
        CountDownLatch seen = new CountDownLatch(1);
        try (SignalStop s = SignalStop.install(seen::countDown)) {
            assertFalse(s.requested());
            assertEquals(130, s.exitCode(), "no signal yet: the interrupted default");
            Signal.raise(new Signal("TERM"));
            assertTrue(seen.await(5, TimeUnit.SECONDS));
            assertTrue(s.requested());
            assertEquals(143, s.exitCode());
        }
    }
}
