package org.fadebench.coding.fec.ldpc;

import java.util.Random;

/** Codes and frames the decoder tests share. */
final class DecoderTestCodes {

    private DecoderTestCodes() {
    }

    /**
     * A rate-1/2 QC code of our own, n = 960 (base 6 x 12, Z = 80): information columns of degree
     * 3 and 4, a dual-diagonal parity part whose first column has weight 3 (shifts 1, 0, 1, so the
     * block rows sum to the identity on it and the parity part is invertible). The shifts were drawn
     * once by a seeded search that refused every shift closing a 4-cycle; the tests check that.
     */
    static final QcBaseMatrix QC_960 = new QcBaseMatrix(new int[][] {
        {25, 73, -1, 9, 42, -1, 1, 0, -1, -1, -1, -1},
        {28, -1, 46, -1, 34, 36, -1, 0, 0, -1, -1, -1},
        {-1, 14, 58, 73, -1, 29, -1, -1, 0, 0, -1, -1},
        {7, 24, -1, -1, 72, 16, 0, -1, -1, 0, 0, -1},
        {-1, -1, 68, 77, 62, -1, -1, -1, -1, -1, 0, 0},
        {-1, 34, -1, 63, -1, 12, 1, -1, -1, -1, -1, 0},
    }, 80);

    /** Random information bits encoded, one codeword of {@code encoder}'s code per call. */
    static byte[] codeword(SystematicEncoder encoder, Random random) {
        byte[] info = new byte[encoder.informationBits()];
        for (int t = 0; t < info.length; t++) {
            info[t] = (byte) random.nextInt(2);
        }
        byte[] word = new byte[encoder.codeBits()];
        encoder.encode(info, 0, word, 0);
        return word;
    }

    /**
     * BPSK over AWGN (bit 0 sent as +1, 1 as −1, noise variance σ² = 1/(2R·Eb/N0)) and the channel
     * LLRs 2y/σ² into {@code llr} (common practice, no source).
     */
    static void bpskLlrs(byte[] word, double rate, double ebN0Db, Random random, double[] llr) {
        double sigma2 = 1 / (2 * rate * Math.pow(10, ebN0Db / 10));
        double sigma = Math.sqrt(sigma2);
        for (int j = 0; j < word.length; j++) {
            double y = 1 - 2 * word[j] + sigma * random.nextGaussian();
            llr[j] = 2 * y / sigma2;
        }
    }
}
