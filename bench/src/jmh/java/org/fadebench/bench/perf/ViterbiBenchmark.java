package org.fadebench.bench.perf;

import java.util.Random;
import org.fadebench.coding.fec.conv.ConvolutionalCode;
import org.fadebench.coding.fec.conv.ViterbiDecoder;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * One idea: soft-input Viterbi decoding of terminated 2048-bit frames of the 64-state (133, 171)
 * code, from BPSK LLRs at Eb/N0 = 3 dB. One invocation decodes one batch: {@code k7Rate12Lanes128}
 * 128 frames as lanes (as {@code run} decodes), {@code k7Rate12OneFrame} a single frame. Score:
 * decoded information bits per second on one thread, loading the LLRs included. Run with
 * {@code -prof gc} to see bytes allocated (expected: 0).
 */
public class ViterbiBenchmark extends ThroughputBenchmark {

    private static final int INFO_BITS = 2048;

    /** A decoder for {@code lanes} frames and their LLRs. */
    abstract static class Batch {
        ViterbiDecoder decoder;
        double[][] llr;
        final byte[] decided = new byte[INFO_BITS];

        void set(int lanes) {
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
            llr = new double[lanes][coded.length];
            for (double[] frame : llr) {
                for (int i = 0; i < coded.length; i++) {
                    double y = 1 - 2 * coded[i] + Math.sqrt(sigma2) * random.nextGaussian();
                    frame[i] = 2 * y / sigma2;
                }
            }
            decoder = new ViterbiDecoder(code, INFO_BITS, lanes);
        }

        /** Loads every lane, decodes them together and hands back the last lane's decisions. */
        byte[] decode() {
            for (int l = 0; l < llr.length; l++) {
                decoder.load(l, llr[l], 0);
            }
            decoder.decode(llr.length);
            decoder.decided(llr.length - 1, decided, 0);
            return decided;
        }
    }

    @State(Scope.Thread)
    public static class Lanes128 extends Batch {
        @Setup
        public void setUp() {
            set(128);
        }
    }

    @State(Scope.Thread)
    public static class OneFrame extends Batch {
        @Setup
        public void setUp() {
            set(1);
        }
    }

    @Benchmark
    @OperationsPerInvocation(128 * INFO_BITS)
    public byte[] k7Rate12Lanes128(Lanes128 batch) {
        return batch.decode();
    }

    @Benchmark
    @OperationsPerInvocation(INFO_BITS)
    public byte[] k7Rate12OneFrame(OneFrame batch) {
        return batch.decode();
    }
}
