package org.fadebench.coding.fec.conv;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.fadebench.coding.fec.CrcTest;
import org.junit.jupiter.api.Test;

class ViterbiDecoderTest {

    /**
     * The Viterbi decision is the maximum likelihood one: it equals an exhaustive search over all
     * 2^k information words for the word whose terminated codeword c maximises Σ L·(1−2c) (the
     * log-likelihood up to a constant for independent bits with LLRs L; Viterbi 1967, see
     * {@link ViterbiDecoder}). Random Gaussian LLRs make ties impossible in practice. The (5, 7) code
     * for k = 1..10, and the punctured 64-state codes (zero LLRs where bits were removed) for k = 1,
     * 8 and 12.
     */
    @Test
    void decisionsEqualExhaustiveMaximumLikelihood() {
        Random random = new Random(20261201L);
        for (int k = 1; k <= 10; k++) {
            for (int trial = 0; trial < 20; trial++) {
                checkAgainstExhaustiveSearch(PuncturedCode.CONV_SMALL.puncturer(), k, random);
            }
        }
        for (PuncturedCode code : new PuncturedCode[] {PuncturedCode.CONV_R12, PuncturedCode.CONV_R23, PuncturedCode.CONV_R34}) {
            for (int k : new int[] {1, 8, 12}) {
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
        new ViterbiDecoder(code, k, 1).decode(llr, 0, decided, 0);
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
        for (PuncturedCode channelCode : new PuncturedCode[] {PuncturedCode.CONV_R12, PuncturedCode.CONV_R23,
            PuncturedCode.CONV_R34, PuncturedCode.CONV_SMALL}) {
            Puncturer punctured = channelCode.puncturer();
            ConvolutionalCode code = punctured.code();
            for (int k : new int[] {1, 2, 3, 50, 517, 600}) {
                ViterbiDecoder decoder = new ViterbiDecoder(code, k, 1);
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
                decoder.decode(llr, 2, decided, 3);
                assertArrayEquals(info, Arrays.copyOfRange(decided, 3, k + 3), channelCode + " k=" + k);
            }
        }
    }

    /**
     * Frames decoded together in lanes are decoded independently: each lane's bits equal those of
     * the same frame decoded alone, for full and partial batches, and a decoder is reused batch
     * after batch. Noisy LLRs (BPSK at 1 dB, rate 1/2) so that the frames carry errors to agree on.
     */
    @Test
    void lanesDecodeIndependently() {
        ConvolutionalCode code = ConvolutionalCode.K7_133_171;
        int k = 300;
        int lanes = 37;
        ViterbiDecoder batch = new ViterbiDecoder(code, k, lanes);
        ViterbiDecoder alone = new ViterbiDecoder(code, k, 1);
        Random random = new Random(9);
        double sigma = Math.sqrt(1 / Math.pow(10, 0.1));
        int differing = 0;
        for (int frames : new int[] {lanes, 1, 20, lanes}) {
            byte[][] info = new byte[frames][];
            double[][] llr = new double[frames][code.codedBits(k)];
            for (int l = 0; l < frames; l++) {
                info[l] = CrcTest.randomBits(random, k);
                byte[] coded = new byte[code.codedBits(k)];
                code.encode(info[l], 0, k, coded, 0);
                for (int i = 0; i < coded.length; i++) {
                    llr[l][i] = 2 * (1 - 2 * coded[i] + sigma * random.nextGaussian()) / (sigma * sigma);
                }
                batch.load(l, llr[l], 0);
            }
            batch.decode(frames);
            for (int l = 0; l < frames; l++) {
                byte[] together = new byte[k];
                batch.decided(l, together, 0);
                byte[] single = new byte[k];
                alone.decode(llr[l], 0, single, 0);
                assertArrayEquals(single, together, "lane " + l + " of " + frames);
                differing += Arrays.equals(single, info[l]) ? 0 : 1;
            }
        }
        assertTrue(differing > 0, "some frames should be decoded wrongly at 1 dB");
    }

    /**
     * Only the ratios of LLRs matter: a frame scaled by 1e-200 or 1e200 decodes as the original
     * (each frame is scaled to its largest LLR before rounding).
     */
    @Test
    void decisionsDoNotDependOnTheLlrScale() {
        ConvolutionalCode code = ConvolutionalCode.K7_133_171;
        int k = 200;
        ViterbiDecoder decoder = new ViterbiDecoder(code, k, 1);
        Random random = new Random(5);
        double[] llr = new double[code.codedBits(k)];
        for (int i = 0; i < llr.length; i++) {
            llr[i] = 1 + 1.5 * random.nextGaussian();
        }
        byte[] reference = new byte[k];
        decoder.decode(llr, 0, reference, 0);
        for (double factor : new double[] {1e-200, 1e200}) {
            double[] scaled = llr.clone();
            for (int i = 0; i < scaled.length; i++) {
                scaled[i] *= factor;
            }
            byte[] decided = new byte[k];
            decoder.decode(scaled, 0, decided, 0);
            assertArrayEquals(reference, decided, "scale " + factor);
        }
    }

    @Test
    void argumentsAreChecked() {
        ViterbiDecoder decoder = new ViterbiDecoder(ConvolutionalCode.K3_5_7, 10, 4);
        assertEquals("batch of 5 frames; this decoder takes 1 to 4",
                assertThrows(IllegalArgumentException.class, () -> decoder.decode(5)).getMessage());
        assertEquals("lane 4; valid lanes are 0 to 3",
                assertThrows(IllegalArgumentException.class, () -> decoder.load(4, new double[24], 0)).getMessage());
        double[] bad = new double[24];
        bad[3] = Double.NaN;
        assertEquals("LLRs of lane 1 are not all finite",
                assertThrows(IllegalArgumentException.class, () -> decoder.load(1, bad, 0)).getMessage());
        bad[3] = Double.NEGATIVE_INFINITY;
        assertThrows(IllegalArgumentException.class, () -> decoder.load(1, bad, 0));
        decoder.load(0, new double[24], 0);
        decoder.decode(1);
        assertEquals("lane 1; valid lanes are 0 to 0",
                assertThrows(IllegalArgumentException.class, () -> decoder.decided(1, new byte[10], 0)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> new ViterbiDecoder(ConvolutionalCode.K3_5_7, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> new ViterbiDecoder(ConvolutionalCode.K3_5_7, 10, 0));
    }
}
