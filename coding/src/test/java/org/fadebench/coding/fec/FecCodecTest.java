package org.fadebench.coding.fec;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.junit.jupiter.api.Test;

class FecCodecTest {

    /** Every CRC, code and interleaver: without noise the payload comes back and the CRC checks. */
    @Test
    void noiseFreeRoundTripForEveryCombination() {
        Random random = new Random(12);
        int payloadBits = 96;
        for (Crc crc : Crc.values()) {
            for (ChannelCode code : ChannelCodes.standard().all()) {
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
        FecScheme scheme = new FecScheme(Crc.CRC24, PuncturedCode.CONV_R34);
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
    /**
     * Frames received into lanes and decoded together come out as each would alone, payload and CRC
     * verdict, for coded and uncoded schemes and for full and partial batches (noisy LLRs, so that
     * some frames break).
     */
    @Test
    void batchesDecodeLikeSingleFrames() {
        Random random = new Random(31);
        int payloadBits = 200;
        for (ChannelCode code : new ChannelCode[] {PuncturedCode.CONV_R23, ChannelCodes.NONE}) {
            FecScheme scheme = new FecScheme(Crc.CRC16, code);
            int n = scheme.codedBits(payloadBits);
            BitInterleaver interleaver = BitInterleaver.random(n, 7);
            FecCodec batch = scheme.newCodec(payloadBits, interleaver, 16);
            FecCodec single = scheme.newCodec(payloadBits, interleaver);
            assertEquals(16, batch.lanes());
            int broken = 0;
            for (int frames : new int[] {16, 5}) {
                double[][] llr = new double[frames][n];
                for (int lane = 0; lane < frames; lane++) {
                    byte[] coded = new byte[n];
                    batch.encode(CrcTest.randomBits(random, payloadBits), 0, coded, 0);
                    for (int i = 0; i < n; i++) {
                        llr[lane][i] = 2 * (1 - 2 * coded[i]) + 2.2 * random.nextGaussian();
                    }
                    batch.receive(lane, llr[lane], 0);
                }
                batch.decodeReceived(frames);
                for (int lane = 0; lane < frames; lane++) {
                    byte[] together = new byte[payloadBits];
                    byte[] alone = new byte[payloadBits];
                    boolean crcTogether = batch.decided(lane, together, 0);
                    assertEquals(single.decode(llr[lane], 0, alone, 0), crcTogether, scheme + " lane " + lane);
                    assertArrayEquals(alone, together, scheme + " lane " + lane);
                    broken += crcTogether ? 0 : 1;
                }
            }
            assertTrue(broken > 0, scheme + ": some frames should fail their CRC in this noise");
        }
    }

    /**
     * Lanes per codec: 128 for frames of a few thousand bits, fewer for long frames so that the
     * decoder's rows (4 bytes per LLR and per 32 states, per step and lane) stay within 32 MiB, and
     * 1 without a convolutional code.
     */
    @Test
    void lanesShrinkForLongFrames() {
        assertEquals(ChannelCode.MAX_LANES, new FecScheme(Crc.CRC24, PuncturedCode.CONV_R12).lanes(1024));
        // 400 000 + 24 + 6 steps of 16 bytes: 6.4 MB per lane, so 5 lanes in 32 MiB
        assertEquals(5, new FecScheme(Crc.CRC24, PuncturedCode.CONV_R12).lanes(400_000));
        // 120 000 + 6 steps of 16 bytes: 17 lanes fit, rounded down to 16
        assertEquals(16, new FecScheme(Crc.NONE, PuncturedCode.CONV_R34).lanes(120_000));
        assertEquals(1, new FecScheme(Crc.CRC32, ChannelCodes.NONE).lanes(1024));
    }

    @Test
    void sizes() {
        FecScheme scheme = new FecScheme(Crc.CRC24, PuncturedCode.CONV_R34);
        assertEquals(124, scheme.infoBits(100));
        assertEquals(43 * 4 + 2, scheme.codedBits(100));
        assertEquals(100.0 / 174, scheme.rate(100), 1e-15);
        assertEquals(100, FecScheme.NONE.codedBits(100));
        assertEquals(1.0, FecScheme.NONE.rate(100), 0);
    }

    @Test
    void badSizesAreNamed() {
        FecScheme scheme = new FecScheme(Crc.CRC16, PuncturedCode.CONV_R12);
        assertEquals("interleaver of 100 bits does not fit the 244 coded bits of 100 payload bits with crc crc16, code conv-r12",
                assertThrows(IllegalArgumentException.class,
                        () -> scheme.newCodec(100, BitInterleaver.identity(100))).getMessage());
        assertEquals("payload of 0 bits; need at least 1",
                assertThrows(IllegalArgumentException.class,
                        () -> scheme.newCodec(0, BitInterleaver.identity(44))).getMessage());
    }
}
