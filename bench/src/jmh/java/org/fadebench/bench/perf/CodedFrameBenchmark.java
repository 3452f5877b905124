package org.fadebench.bench.perf;

import java.util.Arrays;
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
import org.fadebench.coding.fec.LaneCoder;
import org.fadebench.coding.fec.conv.PuncturedCode;
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
 * <li>{@code ldpcR12FramesWithoutDecoding}: the same frames with the decoder's {@code decode} left
 * out (the LLRs still go into its lanes; the decided bits are zeros): the rest of the frame's cost.</li>
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
    public static class LdpcR12WithoutDecoding extends Link {
        @Setup
        public void setUp() {
            set(new WithoutDecoding(LDPC_R12), 10);
        }
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
    public long ldpcR12FramesWithoutDecoding(LdpcR12WithoutDecoding link) {
        return link.run();
    }

    @Benchmark
    @OperationsPerInvocation(LANES * PAYLOAD_BITS)
    public long convR12Frames(ConvR12 link) {
        return link.run();
    }

    /** A code whose coder does all its code's work but {@code decode}: the decided bits are zeros. */
    private record WithoutDecoding(ChannelCode code) implements ChannelCode {

        @Override
        public String cliName() {
            return code.cliName();
        }

        @Override
        public double rate() {
            return code.rate();
        }

        @Override
        public int minInfoBits() {
            return code.minInfoBits();
        }

        @Override
        public int maxInfoBits() {
            return code.maxInfoBits();
        }

        @Override
        public int codedBits(int infoBits) {
            return code.codedBits(infoBits);
        }

        @Override
        public long bytesPerLane(int infoBits) {
            return code.bytesPerLane(infoBits);
        }

        @Override
        public long coderBytes(int infoBits, int lanes) {
            return code.coderBytes(infoBits, lanes);
        }

        @Override
        public LaneCoder newCoder(int infoBits, int lanes) {
            LaneCoder coder = code.newCoder(infoBits, lanes);
            return new LaneCoder() {
                @Override
                public void encode(byte[] info, int off, byte[] coded, int codedOff) {
                    coder.encode(info, off, coded, codedOff);
                }

                @Override
                public void load(int lane, double[] llr, int off) {
                    coder.load(lane, llr, off);
                }

                @Override
                public void decode(int frames) {
                }

                @Override
                public void decided(int lane, byte[] info, int off) {
                    Arrays.fill(info, off, off + infoBits, (byte) 0);
                }
            };
        }
    }
}
