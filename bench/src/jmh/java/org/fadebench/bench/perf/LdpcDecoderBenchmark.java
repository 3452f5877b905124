package org.fadebench.bench.perf;

import java.util.Random;
import org.fadebench.coding.fec.ldpc.CodeLayout;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcDecoder;
import org.fadebench.coding.fec.ldpc.LdpcDecoders;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.fec.ldpc.LdpcEncoder;
import org.fadebench.coding.fec.ldpc.LdpcFamily;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * One idea: layered LDPC decoding of the built-in {@code ldpc-r12} at k = {@value #INFO_BITS}
 * (n = 2048 sent), exactly {@value #ITERATIONS} iterations with early stop off, from BPSK LLRs at
 * Eb/N0 = 2 dB (a different noisy codeword per lane; punctured columns at 0). {@code minSumLanes}
 * decodes as many frames as the code's lanes ({@value #LANES}) on the fixed-point decoder a link
 * uses (normalised min-sum, α = 13/16; the block-row kernel), {@code sumProductOneFrame} one frame
 * on the floating-point reference (sum-product), for contrast. Score: information bits per second
 * on one thread, loading the LLRs included. Run with {@code -prof gc} to see bytes allocated
 * (expected: 0).
 */
public class LdpcDecoderBenchmark extends ThroughputBenchmark {

    private static final int ITERATIONS = 10;
    private static final int LANES = 128;
    private static final int INFO_BITS = 1024;

    /** A decoder and the LLRs of its lanes. */
    abstract static class Batch {
        LdpcDecoder decoder;
        double[][] llr;

        void set(LdpcDecoding decoding, int lanes) {
            CodeLayout layout = LdpcFamily.R12.layout(INFO_BITS);
            int n = layout.matrix().columns();
            boolean[] sent = new boolean[n];
            for (int p = 0; p < layout.sentBits(); p++) {
                sent[layout.sentColumn(p)] = true;
            }
            LdpcEncoder encoder = layout.newEncoder();
            Random random = new Random(1);
            byte[] info = new byte[INFO_BITS];
            byte[] word = new byte[n];
            // BPSK, bit 0 -> +1, rate 1/2 at Eb/N0 = 2 dB: sigma^2 = 1 / (2 R Eb/N0); LLR = 2y / sigma^2
            double sigma2 = 1 / (2 * 0.5 * Math.pow(10, 0.2));
            llr = new double[lanes][n];
            for (double[] frame : llr) {
                for (int t = 0; t < info.length; t++) {
                    info[t] = (byte) random.nextInt(2);
                }
                encoder.encode(info, 0, word, 0);
                for (int j = 0; j < n; j++) {
                    double y = 1 - 2 * word[j] + Math.sqrt(sigma2) * random.nextGaussian();
                    frame[j] = sent[j] ? 2 * y / sigma2 : 0;
                }
            }
            decoder = LdpcDecoders.create(layout, decoding, lanes);
        }

        /** Loads every lane, decodes them together and hands back the last lane's first bit. */
        int decode() {
            for (int l = 0; l < llr.length; l++) {
                decoder.load(l, llr[l], 0);
            }
            decoder.decode(llr.length);
            return decoder.bit(llr.length - 1, 0);
        }
    }

    @State(Scope.Thread)
    public static class MinSumLanes extends Batch {
        @Setup
        public void setUp() {
            LdpcDecoding decoding = new LdpcDecoding(LdpcAlgorithm.MIN_SUM, ITERATIONS, false, 0.8125);
            int lanes = LdpcCode.of(LdpcFamily.R12, decoding).lanes(INFO_BITS);
            if (lanes != LANES) {
                throw new IllegalStateException("ldpc-r12 at k = " + INFO_BITS + " takes " + lanes + " lanes, not " + LANES);
            }
            set(decoding, lanes);
        }
    }

    @State(Scope.Thread)
    public static class SumProductOneFrame extends Batch {
        @Setup
        public void setUp() {
            set(new LdpcDecoding(LdpcAlgorithm.SUM_PRODUCT, ITERATIONS, false, Double.NaN), 1);
        }
    }

    @Benchmark
    @OperationsPerInvocation(LANES * INFO_BITS)
    public int minSumLanes(MinSumLanes batch) {
        return batch.decode();
    }

    @Benchmark
    @OperationsPerInvocation(INFO_BITS)
    public int sumProductOneFrame(SumProductOneFrame batch) {
        return batch.decode();
    }
}
