package org.fadebench.bench.perf;

import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Draws;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.fec.ldpc.LdpcFamily;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One idea: the whole coded frame as {@code run} simulates it, Alamouti 2x2 16-QAM over
 * quasi-static Rayleigh (one fading block per frame), {@value #PAYLOAD_BITS} payload bits + CRC-24,
 * random interleaver, max-log LLRs, one group of as many frames as the link decodes together (its
 * lanes, 128 here) per operation: payload, CRC, encoder, interleaver, mapping, channel, combining,
 * LLRs, decoder, CRC check, counting.
 * <ul>
 * <li>{@code ldpcR12Frames}: {@code ldpc-r12} (n = 2096), normalised min-sum α = 13/16, at most 50
 * iterations, early stop, at 10 dB, where {@code run} measured FER 1.0e-2 (seed 5, 19 712 frames;
 * 2.4 iterations per frame).</li>
 * <li>{@code ldpcR12FramesOneIteration} and {@code ldpcR12FramesTenIterations}: the same frames
 * decoded with exactly 1 and exactly 10 iterations (early stop off), so that the difference gives
 * the cost of an iteration, and the first less one iteration the rest of the frame.</li>
 * <li>{@code convR12Frames}: {@code conv-r12} (the 64-state code, soft Viterbi), at 11.5 dB, where
 * {@code run} measured FER 1e-2 (11.51 dB, seed 5, interpolated between 1.5e-2 at 11 and 6.7e-3 at
 * 12 dB), for contrast.</li>
 * </ul>
 * Each link has its own state. Score: payload (information) bits per second on one thread. Run
 * with {@code -prof gc} to see bytes allocated per group (expected: 0 in steady state).
 */
@Warmup(iterations = 4, time = 1)
public class CodedFrameBenchmark extends ThroughputBenchmark {

    static final int PAYLOAD_BITS = 1024;
    static final int LANES = ChannelCode.MAX_LANES;

    /** One link's chain, stream and counters. */
    abstract static class Link {
        LinkChain chain;
        Draws draws;
        FrameCounters counters;
        long frame;
        double n0;

        void set(ChannelCode code, double snrDb) {
            FrameCoding coding = new FrameCoding(new FecScheme(Crc.CRC24, code), Interleaving.RANDOM, 0,
                    LlrMethod.MAXLOG);
            LinkSettings link = new LinkSettings(Modulation.QAM16, SpaceTimeCodes.ALAMOUTI, 2, 2, Fading.RAYLEIGH,
                    PAYLOAD_BITS, 0, Equaliser.MF, coding);
            if (link.lanes() != LANES) {
                throw new IllegalStateException(code.cliName() + " decodes " + link.lanes() + " lanes, not " + LANES);
            }
            chain = new LinkChain(link);
            draws = Draws.of(1, 0, 0);
            counters = new FrameCounters();
            n0 = Math.pow(10, -snrDb / 10);
        }

        long run() {
            chain.runFrames(draws, n0, frame, LANES, counters);
            frame += LANES;
            return counters.frameErrors();
        }
    }

    private static final LdpcCode LDPC_R12 = LdpcCode.of(LdpcFamily.R12, LdpcDecoding.DEFAULT);

    @State(Scope.Thread)
    public static class LdpcR12 extends Link {
        @Setup
        public void setUp() {
            set(LDPC_R12, 10);
        }
    }

    @State(Scope.Thread)
    public static class LdpcR12OneIteration extends Link {
        @Setup
        public void setUp() {
            set(LDPC_R12.withDecoding(exactly(1)), 10);
        }
    }

    @State(Scope.Thread)
    public static class LdpcR12TenIterations extends Link {
        @Setup
        public void setUp() {
            set(LDPC_R12.withDecoding(exactly(10)), 10);
        }
    }

    /** Normalised min-sum, α = 13/16, exactly {@code iterations} iterations. */
    private static LdpcDecoding exactly(int iterations) {
        return new LdpcDecoding(LdpcAlgorithm.MIN_SUM, iterations, false, LdpcAlgorithm.MIN_SUM.defaultCorrection());
    }

    @State(Scope.Thread)
    public static class ConvR12 extends Link {
        @Setup
        public void setUp() {
            set(PuncturedCode.CONV_R12, 11.5);
        }
    }

    @Benchmark
    @OperationsPerInvocation(LANES * PAYLOAD_BITS)
    public long ldpcR12Frames(LdpcR12 link) {
        return link.run();
    }

    @Benchmark
    @OperationsPerInvocation(LANES * PAYLOAD_BITS)
    public long ldpcR12FramesOneIteration(LdpcR12OneIteration link) {
        return link.run();
    }

    @Benchmark
    @OperationsPerInvocation(LANES * PAYLOAD_BITS)
    public long ldpcR12FramesTenIterations(LdpcR12TenIterations link) {
        return link.run();
    }

    @Benchmark
    @OperationsPerInvocation(LANES * PAYLOAD_BITS)
    public long convR12Frames(ConvR12 link) {
        return link.run();
    }
}
