package org.fadebench.coding.fec.conv;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.fadebench.coding.fec.CrcTest;
import org.junit.jupiter.api.Test;

class ConvolutionalCodeTest {

    private static final ConvolutionalCode K7 = ConvolutionalCode.K7_133_171;
    private static final ConvolutionalCode K3 = ConvolutionalCode.K3_5_7;

    /** A single 1 followed by zeros: output i over the K steps is generator i read from its top bit. */
    @Test
    void impulseResponsesAreTheGenerators() {
        for (ConvolutionalCode code : new ConvolutionalCode[] {K7, K3, ConvolutionalCode.ofOctal(4, "13", "15", "17")}) {
            int k = code.constraintLength();
            int n = code.outputs();
            byte[] out = new byte[code.codedBits(1)];
            assertEquals(n * k, code.encode(new byte[] {1}, 0, 1, out, 0));
            for (int i = 0; i < n; i++) {
                int g = code.generators()[i];
                for (int t = 0; t < k; t++) {
                    assertEquals((g >>> (k - 1 - t)) & 1, out[t * n + i], code + " output " + i + " step " + t);
                }
            }
        }
    }

    /**
     * Encoding is linear over GF(2) and the zero tail returns the register to zero (common practice,
     * no source): the code of x XOR y is the XOR of the codes.
     */
    @Test
    void encodingIsLinear() {
        java.util.Random random = new java.util.Random(5);
        byte[] x = CrcTest.randomBits(random, 50);
        byte[] y = CrcTest.randomBits(random, 50);
        byte[] xy = new byte[50];
        for (int i = 0; i < 50; i++) {
            xy[i] = (byte) (x[i] ^ y[i]);
        }
        byte[] cx = new byte[K7.codedBits(50)];
        byte[] cy = new byte[cx.length];
        byte[] cxy = new byte[cx.length];
        K7.encode(x, 0, 50, cx, 0);
        K7.encode(y, 0, 50, cy, 0);
        K7.encode(xy, 0, 50, cxy, 0);
        for (int i = 0; i < cx.length; i++) {
            assertEquals(cx[i] ^ cy[i], cxy[i]);
        }
    }

    /**
     * Free distances: 10 for (133, 171), 5 for (5, 7) (J. G. Proakis and M. Salehi, Digital
     * Communications, 5th ed., 2008, Sec. 8.3, tables of rate-1/2 codes with maximum free
     * distance; from memory); 6 and 5 for (133, 171) punctured to rates 2/3 and 3/4 (Y. Yasuda,
     * K. Kashiki and Y. Hirata, "High-rate punctured convolutional codes for soft decision Viterbi
     * decoding", IEEE Trans. Commun. 32(3), 1984, table for K = 7; from memory).
     */
    @Test
    void freeDistances() {
        assertEquals(10, TrellisSearch.freeDistance(PuncturedCode.CONV_R12.puncturer()));
        assertEquals(5, TrellisSearch.freeDistance(PuncturedCode.CONV_SMALL.puncturer()));
        assertEquals(6, TrellisSearch.freeDistance(PuncturedCode.CONV_R23.puncturer()));
        assertEquals(5, TrellisSearch.freeDistance(PuncturedCode.CONV_R34.puncturer()));
    }

    /**
     * Weight spectrum of (133, 171): information weights c_d = 36, 211, 1404, 11633, 77433 and
     * event counts a_d = 11, 38, 193, 1331, 7275 for d = 10, 12, ..., 18, none at odd d (from
     * memory; the information weights are those of the union bound tables in Proakis and Salehi,
     * 5th ed., Sec. 8.3).
     */
    @Test
    void spectrumOfK7Code() {
        long[][] s = TrellisSearch.spectrum(K7, 18);
        assertArrayEquals(new long[] {11, 0, 38, 0, 193, 0, 1331, 0, 7275}, java.util.Arrays.copyOfRange(s[0], 10, 19));
        assertArrayEquals(new long[] {36, 0, 211, 0, 1404, 0, 11633, 0, 77433}, java.util.Arrays.copyOfRange(s[1], 10, 19));
    }

    /**
     * (5, 7): transfer function T(D, N) = D^5 N / (1 - 2 D N), so a_d = 2^(d-5) and
     * c_d = (d-4) 2^(d-5) for d >= 5 (A. J. Viterbi, "Convolutional codes and their performance in
     * communication systems", IEEE Trans. Commun. Technol. 19(5), 1971, Sec. IV).
     */
    @Test
    void spectrumOfSmallCodeMatchesTransferFunction() {
        long[][] s = TrellisSearch.spectrum(K3, 20);
        for (int d = 0; d <= 20; d++) {
            assertEquals(d < 5 ? 0 : 1L << (d - 5), s[0][d], "a_" + d);
            assertEquals(d < 5 ? 0 : (d - 4L) << (d - 5), s[1][d], "c_" + d);
        }
    }

    @Test
    void sizesAndNames() {
        assertEquals(64, K7.states());
        assertEquals(2 * (100 + 6), K7.codedBits(100));
        assertEquals("K=7 (133, 171)_8", K7.toString());
        assertEquals(K7, ConvolutionalCode.ofOctal(7, "133", "171"));
    }

    @Test
    void badParametersAreNamed() {
        assertEquals("constraint length 8 not supported; valid: 2 to 7",
                assertThrows(IllegalArgumentException.class, () -> new ConvolutionalCode(8, 0133, 0171)).getMessage());
        assertEquals("generator 233 (octal) does not fit constraint length 7; valid: 1 to 177 (octal)",
                assertThrows(IllegalArgumentException.class, () -> ConvolutionalCode.ofOctal(7, "233", "171")).getMessage());
        assertEquals("generator '19' is not an octal number; valid digits: 0 to 7",
                assertThrows(IllegalArgumentException.class, () -> ConvolutionalCode.ofOctal(7, "19")).getMessage());
        assertEquals("0 generators given; valid: 1 to 8 (code rate 1/n)",
                assertThrows(IllegalArgumentException.class, () -> new ConvolutionalCode(3)).getMessage());
    }
}
