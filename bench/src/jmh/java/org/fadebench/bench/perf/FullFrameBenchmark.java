package org.fadebench.bench.perf;

import java.util.concurrent.TimeUnit;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Draws;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One idea: the whole frame, hard decisions, per-frame Rayleigh fading, at 15 dB: Alamouti 2x2
 * 16-QAM and G4 4x1 QPSK, 512 symbols each. Score: data QAM symbols per second on one thread.
 * Run with {@code -prof gc} to see bytes allocated per frame (expected: 0 in steady state).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class FullFrameBenchmark {

    private static final int SYMBOLS = 512;

    private LinkChain chain;
    private LinkChain g4Chain;
    private Draws draws;
    private FrameCounters counters;
    private double n0;

    @Setup
    public void setUp() {
        LinkSettings link = new LinkSettings(Modulation.QAM16, SpaceTimeCodes.ALAMOUTI, 2, 2, Fading.RAYLEIGH,
                SYMBOLS * 4, 0);
        chain = new LinkChain(link);
        g4Chain = new LinkChain(new LinkSettings(Modulation.QPSK, SpaceTimeCodes.G4, 4, 1, Fading.RAYLEIGH,
                SYMBOLS * 2, 0));
        draws = Draws.of(1, 0, 0);
        counters = new FrameCounters();
        n0 = Math.pow(10, -1.5);
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public long alamouti2x2Qam16Frame() {
        chain.runFrame(draws, n0, 0, counters);
        return counters.bitErrors();
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public long g4x1QpskFrame() {
        g4Chain.runFrame(draws, n0, 0, counters);
        return counters.bitErrors();
    }
}
