package org.fadebench.bench.perf;

import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Draws;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One idea: the whole frame, hard decisions, per-frame Rayleigh fading, at 15 dB, 512 symbols:
 * Alamouti 2x2 16-QAM (4 Gaussian draws per symbol) and every other orthogonal design of the
 * catalogue, 1 receive antenna, QPSK (G3, G4 and the rate-1/2 codes on 5 to 8 antennas also 4
 * draws per symbol; H3 and H4 8/3). Each link has its own state and each code its own fork, so
 * one benchmark's code does not shape another's compilation. Score: data QAM symbols per second
 * on one thread. Run with {@code -prof gc} to see bytes allocated per frame (expected: 0 in
 * steady state).
 */
@Warmup(iterations = 4, time = 1)
public class FullFrameBenchmark extends ThroughputBenchmark {

    static final int SYMBOLS = 512;

    /** One link's chain, stream and counters. */
    abstract static class Link {
        LinkChain chain;
        Draws draws;
        FrameCounters counters;
        long frame;
        final double n0 = Math.pow(10, -1.5);

        void set(Modulation mod, SpaceTimeCode code, int rx) {
            set(mod, code, rx, SYMBOLS);
        }

        void set(Modulation mod, SpaceTimeCode code, int rx, int symbols) {
            chain = new LinkChain(new LinkSettings(mod, code, rx, code.transmitAntennas(), Fading.RAYLEIGH,
                    symbols * mod.bitsPerSymbol(), 0));
            draws = Draws.of(1, 0, 0);
            counters = new FrameCounters();
        }

        long run() {
            chain.runFrames(draws, n0, frame++, 1, counters);
            return counters.bitErrors();
        }
    }

    @State(Scope.Thread)
    public static class Alamouti2x2Qam16 extends Link {
        @Setup
        public void setUp() {
            set(Modulation.QAM16, SpaceTimeCodes.ALAMOUTI, 2);
        }
    }

    /** Another orthogonal design of the catalogue, QPSK, one receive antenna, whole code blocks nearest 512 symbols. */
    @State(Scope.Thread)
    public static class Design extends Link {
        @Param({"g3", "g4", "h3", "h4", "r12-5", "r12-6", "r12-7", "r12-8"})
        public String code;

        @Setup
        public void setUp() {
            SpaceTimeCode c = SpaceTimeCodes.byName(code);
            int k = c.symbolsPerBlock();
            set(Modulation.QPSK, c, 1, (SYMBOLS + k / 2) / k * k);
        }
    }

    /** {@link Design}'s frame; scored as 512 symbols (H3 and H4 send 513, 0.2 % more). */
    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public long designFrame(Design link) {
        return link.run();
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public long alamouti2x2Qam16Frame(Alamouti2x2Qam16 link) {
        return link.run();
    }
}
