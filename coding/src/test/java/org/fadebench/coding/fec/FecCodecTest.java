package org.fadebench.coding.fec;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;

class FecCodecTest {

    /** Every CRC, code and interleaver: without noise the payload comes back and the CRC checks. */
    @Test
    void noiseFreeRoundTripForEveryCombination() {
        Random random = new Random(12);
        int payloadBits = 96;
        for (Crc crc : Crc.values()) {
            for (ChannelCode code : ChannelCode.values()) {
                FecScheme scheme = new FecScheme(crc, code);
                int n = scheme.codedBits(payloadBits);
                for (Interleaving kind : Interleaving.values()) {
                    int rows = kind == Interleaving.BLOCK ? smallestFactor(n) : 0;
                    FecCodec codec = scheme.newCodec(payloadBits, kind.create(n, 5, rows, rows == 0 ? 0 : n / rows));
                    byte[] payload = CrcTest.randomBits(random, payloadBits + 1);
                    byte[] coded = new byte[n + 2];
                    codec.encode(payload, 1, coded, 2);
                    double[] llr = new double[n + 3];
                    for (int i = 0; i < n; i++) {
                        llr[3 + i] = 2.5 * (1 - 2 * coded[2 + i]);
                    }
                    byte[] decided = new byte[payloadBits + 4];
                    String what = scheme + ", " + kind;
                    assertTrue(codec.decode(llr, 3, decided, 4), what);
                    assertArrayEquals(Arrays.copyOfRange(payload, 1, payloadBits + 1),
                            Arrays.copyOfRange(decided, 4, payloadBits + 4), what);
                }
            }
        }
    }

    private static int smallestFactor(int n) {
        for (int f = 2; f * f <= n; f++) {
            if (n % f == 0) {
                return f;
            }
        }
        return 1;
    }

    /**
     * In noise bad enough to break some frames, no broken frame passes the CRC (an undetected error
     * has probability about 2^-24 per broken frame for CRC-24, so none is expected among these few).
     * A frame whose payload is right may still fail when the errors hit only its check bits.
     */
    @Test
    void crcFlagsExactlyTheBrokenFrames() {
        FecScheme scheme = new FecScheme(Crc.CRC24, ChannelCode.CONV_R34);
        int payloadBits = 200;
        int n = scheme.codedBits(payloadBits);
        FecCodec codec = scheme.newCodec(payloadBits, BitInterleaver.random(n, 1));
        Random random = new Random(77);
        int broken = 0;
        int frames = 200;
        for (int f = 0; f < frames; f++) {
            byte[] payload = CrcTest.randomBits(random, payloadBits);
            byte[] coded = new byte[n];
            codec.encode(payload, 0, coded, 0);
            double[] llr = new double[n];
            for (int i = 0; i < n; i++) {
                llr[i] = 2 * (1 - 2 * coded[i] + 0.7 * random.nextGaussian()) / 0.49;
            }
            byte[] decided = new byte[payloadBits];
            boolean passed = codec.decode(llr, 0, decided, 0);
            boolean correct = Arrays.equals(payload, decided);
            assertTrue(correct || !passed, "frame " + f + " is broken but passed the CRC");
            broken += correct ? 0 : 1;
        }
        assertTrue(broken > 10 && broken < frames - 10, broken + " broken frames: noise level does not exercise both cases");
    }

    /** Sizes the link needs: CRC-24 on 100 bits, rate 3/4 with 6 tail bits: 130 steps = 43 periods + 1 step. */
    @Test
    void sizes() {
        FecScheme scheme = new FecScheme(Crc.CRC24, ChannelCode.CONV_R34);
        assertEquals(124, scheme.infoBits(100));
        assertEquals(43 * 4 + 2, scheme.codedBits(100));
        assertEquals(100.0 / 174, scheme.rate(100), 1e-15);
        assertEquals(100, FecScheme.NONE.codedBits(100));
        assertEquals(1.0, FecScheme.NONE.rate(100), 0);
    }

    @Test
    void badSizesAreNamed() {
        FecScheme scheme = new FecScheme(Crc.CRC16, ChannelCode.CONV_R12);
        assertEquals("interleaver of 100 bits does not fit the 244 coded bits of 100 payload bits with crc crc16, code conv-r12",
                assertThrows(IllegalArgumentException.class,
                        () -> scheme.newCodec(100, BitInterleaver.identity(100))).getMessage());
        assertEquals("payload of 0 bits; need at least 1",
                assertThrows(IllegalArgumentException.class,
                        () -> scheme.newCodec(0, BitInterleaver.identity(44))).getMessage());
        assertFalse(new FecScheme(Crc.NONE, ChannelCode.NONE).code().isCoded());
    }
}
