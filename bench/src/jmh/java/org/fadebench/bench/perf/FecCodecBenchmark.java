package org.fadebench.bench.perf;

import java.util.Random;
import org.fadebench.coding.fec.BitInterleaver;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecCodec;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.infra.Blackhole;

/**
 * One idea: the whole FEC receive path as the link runs it, CRC-24 + rate-3/4 punctured (133, 171)
 * code + random interleaver, 1000 payload bits per frame, a batch of as many frames as the codec
 * decodes together: deinterleave, depuncture, Viterbi, CRC check. Score: payload bits per second on
 * one thread. Run with {@code -prof gc} to see bytes allocated per batch (expected: 0).
 */
public class FecCodecBenchmark extends ThroughputBenchmark {

    private static final int PAYLOAD_BITS = 1000;

    private static final int FRAMES = ChannelCode.MAX_LANES;

    private FecCodec codec;
    private double[][] llr;
    private byte[] decided;

    @Setup
    public void setUp() {
        FecScheme scheme = new FecScheme(Crc.CRC24, PuncturedCode.CONV_R34);
        int n = scheme.codedBits(PAYLOAD_BITS);
        codec = scheme.newCodec(PAYLOAD_BITS, BitInterleaver.random(n, 1), FRAMES);
        Random random = new Random(1);
        byte[] payload = new byte[PAYLOAD_BITS];
        for (int i = 0; i < PAYLOAD_BITS; i++) {
            payload[i] = (byte) random.nextInt(2);
        }
        byte[] coded = new byte[n];
        codec.encode(payload, 0, coded, 0);
        llr = new double[FRAMES][n];
        for (double[] frame : llr) {
            for (int i = 0; i < n; i++) {
                frame[i] = 4 * (1 - 2 * coded[i]) + 2 * random.nextGaussian();
            }
        }
        decided = new byte[PAYLOAD_BITS];
    }

    @Benchmark
    @OperationsPerInvocation(FRAMES * PAYLOAD_BITS)
    public void crc24Rate34Frames(Blackhole crcPassed) {
        for (int lane = 0; lane < FRAMES; lane++) {
            codec.receive(lane, llr[lane], 0);
        }
        codec.decodeReceived(FRAMES);
        for (int lane = 0; lane < FRAMES; lane++) {
            crcPassed.consume(codec.decided(lane, decided, 0));
        }
    }
}
