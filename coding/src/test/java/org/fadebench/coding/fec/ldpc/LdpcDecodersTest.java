package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

class LdpcDecodersTest {

    private static final ParityCheckMatrix H = DecoderTestCodes.QC_960.expand();

    private static final LdpcDecoding[] ALL = {
        LdpcDecoding.of(LdpcAlgorithm.MIN_SUM, 20),
        LdpcDecoding.of(LdpcAlgorithm.OFFSET_MIN_SUM, 20),
        LdpcDecoding.of(LdpcAlgorithm.SUM_PRODUCT, 20),
    };

    /** Fossorier's condition (QcBaseMatrix) and the measured girth agree: the test code has no 4-cycle. */
    @Test
    void theTestCodeHasNoFourCycle() {
        assertFalse(DecoderTestCodes.QC_960.hasFourCycle());
        assertEquals(6, H.girth().getAsInt());
    }

    /**
     * Encoded words satisfy H·c = 0; sent without noise (LLR ±4) every decoder returns them after one
     * iteration, satisfied; at Eb/N0 = 6 dB, far above the code's waterfall (common practice, no
     * source), every one of 8 frames decodes to its codeword.
     */
    @Test
    void cleanFramesDecodeToTheCodeword() {
        SystematicEncoder encoder = new SystematicEncoder(H);
        Random random = new Random(5);
        int n = H.columns();
        for (LdpcDecoding decoding : ALL) {
            LdpcDecoder decoder = LdpcDecoders.create(H, decoding, 8);
            byte[][] words = new byte[8][];
            double[] llr = new double[n];
            for (int l = 0; l < 8; l++) {
                words[l] = DecoderTestCodes.codeword(encoder, random);
                assertTrue(H.isCodeword(words[l], 0));
                for (int j = 0; j < n; j++) {
                    llr[j] = 4 * (1 - 2 * words[l][j]);
                }
                decoder.load(l, llr, 0);
            }
            decoder.decode(8);
            for (int l = 0; l < 8; l++) {
                assertArrayEquals(words[l], decisions(decoder, l, n), decoding + " lane " + l);
                assertEquals(1, decoder.iterations(l));
                assertTrue(decoder.satisfied(l));
            }
            for (int l = 0; l < 8; l++) {
                DecoderTestCodes.bpskLlrs(words[l], 0.5, 6, random, llr);
                decoder.load(l, llr, 0);
            }
            decoder.decode(8);
            for (int l = 0; l < 8; l++) {
                assertArrayEquals(words[l], decisions(decoder, l, n), decoding + " lane " + l);
                assertTrue(decoder.satisfied(l));
            }
        }
    }

    /** One-line refusals, as fec.Lanes words them. */
    @Test
    void refusesBadArguments() {
        for (LdpcDecoding decoding : ALL) {
            assertEquals("0 lanes; need at least 1", assertThrows(IllegalArgumentException.class,
                    () -> LdpcDecoders.create(H, decoding, 0)).getMessage());
            assertThrows(IllegalArgumentException.class, () -> LdpcDecoders.bytes(H, decoding, -1));
            LdpcDecoder decoder = LdpcDecoders.create(H, decoding, 4);
            double[] llr = new double[H.columns()];
            assertEquals("lane 4; valid lanes are 0 to 3",
                    assertThrows(IllegalArgumentException.class, () -> decoder.load(4, llr, 0)).getMessage());
            assertThrows(IllegalArgumentException.class, () -> decoder.load(-1, llr, 0));
            assertEquals("batch of 5 frames; this decoder takes 1 to 4",
                    assertThrows(IllegalArgumentException.class, () -> decoder.decode(5)).getMessage());
            assertThrows(IllegalArgumentException.class, () -> decoder.decode(0));
            decoder.load(0, llr, 0);
            decoder.load(1, llr, 0);
            decoder.decode(2);
            assertEquals("lane 2; valid lanes are 0 to 1",
                    assertThrows(IllegalArgumentException.class, () -> decoder.iterations(2)).getMessage());
            assertThrows(IllegalArgumentException.class, () -> decoder.satisfied(-1));
            assertEquals("column 960; valid columns are 0 to 959",
                    assertThrows(IllegalArgumentException.class, () -> decoder.bit(0, 960)).getMessage());
            llr[7] = Double.NaN;
            String message = assertThrows(IllegalArgumentException.class, () -> decoder.load(0, llr, 0)).getMessage();
            assertEquals("LLR of column 7 for lane 0 is NaN; valid: finite", message);
            assertFalse(message.contains("\n"));
        }
    }

    static byte[] decisions(LdpcDecoder decoder, int lane, int n) {
        byte[] bits = new byte[n];
        for (int j = 0; j < n; j++) {
            bits[j] = (byte) decoder.bit(lane, j);
        }
        return bits;
    }
}
