package org.fadebench.bench.perf;

import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.fadebench.coding.fec.conv.ConvolutionalCode;
import org.fadebench.coding.fec.conv.ViterbiDecoder;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One idea: soft-input Viterbi decoding of terminated 2048-bit frames of the 64-state (133, 171)
 * code, from BPSK LLRs at Eb/N0 = 3 dB: 128 frames per invocation, decoded {@code lanes} at a time
 * (the decoder's batch; 1 is frame by frame). Score: decoded information bits per second on one
 * thread, loading the LLRs included. Run with {@code -prof gc} to see bytes allocated (expected: 0).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class ViterbiBenchmark {

    private static final int INFO_BITS = 2048;
    private static final int FRAMES = 128;

    @Param({"1", "32", "64", "128"})
    public int lanes;

    private ViterbiDecoder decoder;
    private double[][] llr;
    private byte[] decided;

    @Setup
    public void setUp() {
        ConvolutionalCode code = ConvolutionalCode.K7_133_171;
        Random random = new Random(1);
        byte[] info = new byte[INFO_BITS];
        for (int i = 0; i < INFO_BITS; i++) {
            info[i] = (byte) random.nextInt(2);
        }
        byte[] coded = new byte[code.codedBits(INFO_BITS)];
        code.encode(info, 0, INFO_BITS, coded, 0);
        // BPSK, bit 0 -> +1, rate 1/2 at Eb/N0 = 3 dB: sigma^2 = 1 / (2 R Eb/N0); LLR = 2y / sigma^2
        double sigma2 = 1 / (2 * 0.5 * Math.pow(10, 0.3));
        llr = new double[FRAMES][coded.length];
        for (double[] frame : llr) {
            for (int i = 0; i < coded.length; i++) {
                double y = 1 - 2 * coded[i] + Math.sqrt(sigma2) * random.nextGaussian();
                frame[i] = 2 * y / sigma2;
            }
        }
        decoder = new ViterbiDecoder(code, INFO_BITS, lanes);
        decided = new byte[INFO_BITS];
    }

    @Benchmark
    @OperationsPerInvocation(FRAMES * INFO_BITS)
    public byte[] k7Rate12Frames() {
        for (int first = 0; first < FRAMES; first += lanes) {
            for (int l = 0; l < lanes; l++) {
                decoder.load(l, llr[first + l], 0);
            }
            decoder.decode(lanes);
            decoder.decided(lanes - 1, decided, 0);
        }
        return decided;
    }
}
