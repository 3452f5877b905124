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
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One idea: the whole frame, hard decisions, per-frame Rayleigh fading, at 15 dB, 512 symbols:
 * Alamouti 2x2 16-QAM and G4 4x1 QPSK, both 4 Gaussian draws per symbol (each link in its own
 * state, so one benchmark's code does not shape the other's compilation); beside them the
 * heaviest orthogonal design, rate 1/2 on 8 antennas with one receive antenna (also 4 draws per
 * symbol), and H4 4x1 QPSK (rate 3/4, 8/3 draws per symbol, 513 symbols: whole code blocks).
 * Score: data QAM symbols per second on one thread. Run with {@code -prof gc} to see bytes
 * allocated per frame (expected: 0 in steady state).
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

    @State(Scope.Thread)
    public static class G4x1Qpsk extends Link {
        @Setup
        public void setUp() {
            set(Modulation.QPSK, SpaceTimeCodes.G4, 1);
        }
    }

    @State(Scope.Thread)
    public static class R12x8x1Qpsk extends Link {
        @Setup
        public void setUp() {
            set(Modulation.QPSK, SpaceTimeCodes.R12_8, 1);
        }
    }

    /** Whole code blocks of H4 (3 symbols each) nearest 512 symbols. */
    static final int H4_SYMBOLS = 513;

    @State(Scope.Thread)
    public static class H4x1Qpsk extends Link {
        @Setup
        public void setUp() {
            set(Modulation.QPSK, SpaceTimeCodes.H4, 1, H4_SYMBOLS);
        }
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public long alamouti2x2Qam16Frame(Alamouti2x2Qam16 link) {
        return link.run();
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public long g4x1QpskFrame(G4x1Qpsk link) {
        return link.run();
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public long r12x8x1QpskFrame(R12x8x1Qpsk link) {
        return link.run();
    }

    @Benchmark
    @OperationsPerInvocation(H4_SYMBOLS)
    public long h4x1QpskFrame(H4x1Qpsk link) {
        return link.run();
    }
}
