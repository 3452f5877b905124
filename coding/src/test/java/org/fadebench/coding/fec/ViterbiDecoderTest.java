package org.fadebench.coding.fec;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;

class ViterbiDecoderTest {

    /**
     * The Viterbi decision is the maximum likelihood one: it equals an exhaustive search over all
     * 2^k information words for the word whose terminated codeword c maximises Σ L·(1−2c) (the
     * log-likelihood up to a constant for independent bits with LLRs L; Viterbi 1967, see
     * {@link ViterbiDecoder}). Random Gaussian LLRs make ties impossible in practice. The (5, 7) code
     * for k = 1..10, and the punctured 64-state codes (zero LLRs where bits were removed) for k ≤ 8.
     */
    @Test
    void decisionsEqualExhaustiveMaximumLikelihood() {
        Random random = new Random(20261201L);
        for (int k = 1; k <= 10; k++) {
            for (int trial = 0; trial < 20; trial++) {
                checkAgainstExhaustiveSearch(ChannelCode.CONV_SMALL.puncturer(), k, random);
            }
        }
        for (ChannelCode code : new ChannelCode[] {ChannelCode.CONV_R12, ChannelCode.CONV_R23, ChannelCode.CONV_R34}) {
            for (int k = 1; k <= 8; k += 7) {
                for (int trial = 0; trial < 10; trial++) {
                    checkAgainstExhaustiveSearch(code.puncturer(), k, random);
                }
            }
        }
    }

    private static void checkAgainstExhaustiveSearch(Puncturer punctured, int k, Random random) {
        ConvolutionalCode code = punctured.code();
        double[] sent = new double[punctured.codedBits(k)];
        for (int i = 0; i < sent.length; i++) {
            sent[i] = 2 * random.nextGaussian();
        }
        double[] llr = new double[code.codedBits(k)];
        punctured.depuncture(sent, 0, k, llr, 0);

        byte[] word = new byte[k];
        byte[] codeword = new byte[llr.length];
        byte[] best = null;
        double bestMetric = Double.NEGATIVE_INFINITY;
        for (int m = 0; m < 1 << k; m++) {
            for (int i = 0; i < k; i++) {
                word[i] = (byte) ((m >>> i) & 1);
            }
            code.encode(word, 0, k, codeword, 0);
            double metric = correlation(llr, codeword);
            if (metric > bestMetric) {
                bestMetric = metric;
                best = word.clone();
            }
        }
        byte[] decided = new byte[k];
        new ViterbiDecoder(code, k).decode(llr, 0, k, decided, 0);
        assertArrayEquals(best, decided, code + " " + punctured + " k=" + k);
    }

    private static double correlation(double[] llr, byte[] codeword) {
        double sum = 0;
        for (int i = 0; i < llr.length; i++) {
            sum += llr[i] * (1 - 2 * codeword[i]);
        }
        return sum;
    }

    /** Without noise every code and rate returns the information bits, at any offset. */
    @Test
    void noiseFreeDecodingAtEveryRate() {
        Random random = new Random(3);
        for (ChannelCode channelCode : ChannelCode.values()) {
            if (!channelCode.isCoded()) {
                continue;
            }
            Puncturer punctured = channelCode.puncturer();
            ConvolutionalCode code = punctured.code();
            ViterbiDecoder decoder = new ViterbiDecoder(code, 600);
            for (int k : new int[] {1, 2, 3, 50, 517, 600}) {
                byte[] info = CrcTest.randomBits(random, k);
                byte[] mother = new byte[code.codedBits(k)];
                code.encode(info, 0, k, mother, 0);
                byte[] sent = new byte[punctured.codedBits(k) + 1];
                assertEquals(channelCode.codedBits(k), punctured.puncture(mother, 0, k, sent, 1));
                double[] received = new double[sent.length];
                for (int i = 1; i < sent.length; i++) {
                    received[i] = 4.0 * (1 - 2 * sent[i]);
                }
                double[] llr = new double[mother.length + 2];
                punctured.depuncture(received, 1, k, llr, 2);
                byte[] decided = new byte[k + 3];
                decoder.decode(llr, 2, k, decided, 3);
                assertArrayEquals(info, Arrays.copyOfRange(decided, 3, k + 3), channelCode + " k=" + k);
            }
        }
    }

    /** A decoder is reused frame after frame: short and long frames in turn decode independently. */
    @Test
    void decoderIsReusable() {
        ConvolutionalCode code = ConvolutionalCode.K7_133_171;
        ViterbiDecoder decoder = new ViterbiDecoder(code, 300);
        Random random = new Random(9);
        for (int k : new int[] {300, 7, 300, 1, 64}) {
            byte[] info = CrcTest.randomBits(random, k);
            byte[] coded = new byte[code.codedBits(k)];
            code.encode(info, 0, k, coded, 0);
            double[] llr = new double[coded.length];
            for (int i = 0; i < llr.length; i++) {
                llr[i] = 1 - 2 * coded[i];
            }
            byte[] decided = new byte[k];
            decoder.decode(llr, 0, k, decided, 0);
            assertArrayEquals(info, decided);
        }
    }

    @Test
    void frameLengthIsChecked() {
        ViterbiDecoder decoder = new ViterbiDecoder(ConvolutionalCode.K3_5_7, 10);
        assertEquals("frame of 11 information bits; this decoder takes 1 to 10",
                assertThrows(IllegalArgumentException.class,
                        () -> decoder.decode(new double[40], 0, 11, new byte[11], 0)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> new ViterbiDecoder(ConvolutionalCode.K3_5_7, 0));
    }
}
