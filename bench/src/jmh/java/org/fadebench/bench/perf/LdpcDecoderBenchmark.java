package org.fadebench.bench.perf;

import java.util.Random;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.fec.ldpc.LdpcDecoder;
import org.fadebench.coding.fec.ldpc.LdpcDecoders;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.fec.ldpc.ParityCheckMatrix;
import org.fadebench.coding.fec.ldpc.QcBaseMatrix;
import org.fadebench.coding.fec.ldpc.SystematicEncoder;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * One idea: layered LDPC decoding of a rate-1/2 code of n = 2048 (k = 1024), exactly
 * {@value #ITERATIONS} iterations with early stop off, from BPSK LLRs at Eb/N0 = 2 dB (a different
 * noisy codeword per lane). {@code minSumLanes} decodes {@value #LANES} frames as lanes on the
 * fixed-point decoder (normalised min-sum, α = 13/16), {@code sumProductOneFrame} one frame on the
 * floating-point reference (sum-product), for contrast. Score: information bits per second on one
 * thread, loading the LLRs included. Run with {@code -prof gc} to see bytes allocated (expected: 0).
 */
public class LdpcDecoderBenchmark extends ThroughputBenchmark {

    private static final int ITERATIONS = 10;
    private static final int LANES = 128;
    private static final int INFO_BITS = 1024;

    /**
     * A representative QC code of our own (to be replaced by the built-in rate-1/2 family): base
     * 8 x 16, Z = 128; information columns of degree 4 and 5, a dual-diagonal parity part whose first
     * column has weight 3; shifts from a seeded search refusing 4-cycles (girth 6).
     */
    static ParityCheckMatrix code() {
        return new QcBaseMatrix(new int[][] {
            {93, 44, -1, 15, 10, -1, -1, 32, 1, 0, -1, -1, -1, -1, -1, -1},
            {81, -1, 90, -1, 87, 82, -1, -1, -1, 0, 0, -1, -1, -1, -1, -1},
            {-1, 62, 72, -1, -1, 14, 75, -1, -1, -1, 0, 0, -1, -1, -1, -1},
            {95, -1, -1, 32, -1, -1, 89, 76, -1, -1, -1, 0, 0, -1, -1, -1},
            {-1, 114, -1, -1, 118, 100, -1, 48, 0, -1, -1, -1, 0, 0, -1, -1},
            {-1, -1, 45, 108, -1, -1, 60, 79, -1, -1, -1, -1, -1, 0, 0, -1},
            {1, 95, -1, -1, -1, 94, 75, -1, -1, -1, -1, -1, -1, -1, 0, 0},
            {-1, -1, 121, 89, 13, -1, -1, 98, 1, -1, -1, -1, -1, -1, -1, 0},
        }, 128).expand();
    }

    /** A decoder and the LLRs of its lanes. */
    abstract static class Batch {
        LdpcDecoder decoder;
        double[][] llr;

        void set(LdpcDecoding decoding, int lanes) {
            ParityCheckMatrix h = code();
            SystematicEncoder encoder = new SystematicEncoder(h);
            Random random = new Random(1);
            byte[] info = new byte[encoder.informationBits()];
            byte[] word = new byte[h.columns()];
            // BPSK, bit 0 -> +1, rate 1/2 at Eb/N0 = 2 dB: sigma^2 = 1 / (2 R Eb/N0); LLR = 2y / sigma^2
            double sigma2 = 1 / (2 * 0.5 * Math.pow(10, 0.2));
            llr = new double[lanes][h.columns()];
            for (double[] frame : llr) {
                for (int t = 0; t < info.length; t++) {
                    info[t] = (byte) random.nextInt(2);
                }
                encoder.encode(info, 0, word, 0);
                for (int j = 0; j < word.length; j++) {
                    double y = 1 - 2 * word[j] + Math.sqrt(sigma2) * random.nextGaussian();
                    frame[j] = 2 * y / sigma2;
                }
            }
            decoder = LdpcDecoders.create(h, decoding, lanes);
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
            set(new LdpcDecoding(LdpcAlgorithm.MIN_SUM, ITERATIONS, false, 0.8125), LANES);
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
