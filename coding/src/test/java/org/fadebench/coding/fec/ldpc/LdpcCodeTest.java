package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.util.Random;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.LaneCoder;
import org.junit.jupiter.api.Test;

/**
 * {@link LdpcCode} as a channel code: a user's matrix sends its codewords whole, a layout with
 * punctured and reordered columns sends and receives each bit in its column, lanes decode as
 * frames alone do, sizes outside the code are refused, and the code survives serialisation.
 *
 * <p>A word c is a codeword of the code of H exactly when H·c = 0 over GF(2) (R. G. Gallager,
 * "Low-density parity-check codes", MIT Press, 1963, ch. 1; from memory).
 */
class LdpcCodeTest {

    private static final ParityCheckMatrix H = DecoderTestCodes.QC_960.expand();
    private static final LdpcCode CODE = LdpcCode.ofMatrix("qc960", H, LdpcDecoding.DEFAULT);
    private static final int K = 480;

    private static byte[] randomBits(int count, Random random) {
        byte[] bits = new byte[count];
        for (int i = 0; i < count; i++) {
            bits[i] = (byte) random.nextInt(2);
        }
        return bits;
    }

    @Test
    void userMatrixSendsWholeSystematicCodewordsInColumnOrder() {
        assertEquals(K, CODE.minInfoBits());
        assertEquals(K, CODE.maxInfoBits());
        assertEquals(960, CODE.codedBits(K));
        assertEquals(0.5, CODE.rate(), 0.0);
        CodeLayout layout = CODE.layout(K);
        LaneCoder coder = CODE.newCoder(K, 16);
        Random random = new Random(7);
        for (int f = 0; f < 20; f++) {
            byte[] info = randomBits(K, random);
            byte[] coded = new byte[960];
            coder.encode(info, 0, coded, 0);
            assertTrue(H.isCodeword(coded, 0), "H c = 0");
            for (int t = 0; t < K; t++) {
                assertEquals(info[t], coded[layout.infoColumn(t)], "information bit " + t + " in its column");
            }
        }
    }

    /**
     * 16 frames at Eb/N0 = 1.5 dB, where some fail, decoded in 16 lanes at once and one by one in a
     * one-lane coder: the same decisions and iterations frame by frame.
     */
    @Test
    void lanesDecodeAsFramesAlone() {
        LaneCoder lanes = CODE.newCoder(K, 16);
        LaneCoder alone = CODE.newCoder(K, 1);
        Random random = new Random(11);
        byte[][] infos = new byte[16][];
        double[][] llrs = new double[16][960];
        byte[] coded = new byte[960];
        for (int f = 0; f < 16; f++) {
            infos[f] = randomBits(K, random);
            lanes.encode(infos[f], 0, coded, 0);
            DecoderTestCodes.bpskLlrs(coded, 0.5, 1.5, random, llrs[f]);
            lanes.load(f, llrs[f], 0);
        }
        lanes.decode(16);
        int wrongFrames = 0;
        byte[] fromLane = new byte[K];
        byte[] fromAlone = new byte[K];
        for (int f = 0; f < 16; f++) {
            alone.load(0, llrs[f], 0);
            alone.decode(1);
            lanes.decided(f, fromLane, 0);
            alone.decided(0, fromAlone, 0);
            assertArrayEquals(fromAlone, fromLane, "frame " + f);
            assertEquals(alone.iterations(0), lanes.iterations(f), "iterations of frame " + f);
            assertTrue(lanes.iterations(f) >= 1 && lanes.iterations(f) <= 50, "iterations " + lanes.iterations(f));
            wrongFrames += java.util.Arrays.equals(fromLane, infos[f]) ? 0 : 1;
        }
        assertTrue(wrongFrames < 16, "at 1.5 dB most frames decode: " + wrongFrames + " wrong");
    }

    /**
     * A layout that punctures the first 80 columns (one per check: block column 0 holds one bit of
     * every check row it meets) and sends the rest in reverse order: each sent bit is the codeword's
     * bit of its column, and noiseless LLRs of the sent bits decode to the information sent, the
     * punctured bits recovered from their checks.
     */
    @Test
    void puncturedAndReorderedColumnsGoToTheirPlaces() {
        SystematicLayout whole = new SystematicLayout(H);
        CodeLayout punctured = new CodeLayout() {
            @Override
            public ParityCheckMatrix matrix() {
                return H;
            }

            @Override
            public int infoBits() {
                return K;
            }

            @Override
            public int infoColumn(int t) {
                return whole.infoColumn(t);
            }

            @Override
            public int sentBits() {
                return 880;
            }

            @Override
            public int sentColumn(int p) {
                return 959 - p;
            }

            @Override
            public LdpcEncoder newEncoder() {
                return whole.newEncoder();
            }
        };
        LdpcCode code = LdpcCode.ofLayout("punctured", punctured, 0, LdpcDecoding.DEFAULT);
        assertEquals(880, code.codedBits(K));
        LaneCoder coder = code.newCoder(K, 16);
        LdpcEncoder encoder = whole.newEncoder();
        Random random = new Random(3);
        byte[] word = new byte[960];
        byte[] coded = new byte[880];
        double[] llr = new double[880];
        byte[] decided = new byte[K];
        for (int f = 0; f < 10; f++) {
            byte[] info = randomBits(K, random);
            coder.encode(info, 0, coded, 0);
            encoder.encode(info, 0, word, 0);
            for (int p = 0; p < 880; p++) {
                assertEquals(word[959 - p], coded[p], "sent bit " + p);
                llr[p] = coded[p] == 0 ? 6 : -6;
            }
            coder.load(f, llr, 0);
            coder.decode(f + 1);
            coder.decided(f, decided, 0);
            assertArrayEquals(info, decided, "frame " + f);
        }
    }

    @Test
    void sizesOutsideTheCodeAreRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> CODE.codedBits(K + 1));
        assertEquals("channel code qc960 takes exactly 480 information bits per frame, not 481", e.getMessage());
        FecScheme withCrc = new FecScheme(Crc.CRC24, CODE);
        withCrc.checkPayload(K - 24);
        e = assertThrows(IllegalArgumentException.class, () -> withCrc.checkPayload(1024));
        assertEquals("--frame-bits 1024 with crc24: channel code qc960 carries exactly 480 information bits per frame"
                + " (payload and CRC); valid: --frame-bits 456 with crc24", e.getMessage());
        assertEquals(K - 24, withCrc.payloadNear(1024));
        assertEquals(K, new FecScheme(Crc.NONE, CODE).payloadNear(64));
        // a code of 4 information bits (H = [I I], every bit repeated once) leaves no room for a CRC-16
        int[][] twice = new int[4][8];
        for (int i = 0; i < 4; i++) {
            twice[i][i] = 1;
            twice[i][4 + i] = 1;
        }
        FecScheme tooSmall = new FecScheme(Crc.CRC16, LdpcCode.ofMatrix("tiny", ParityCheckMatrix.of(twice),
                LdpcDecoding.DEFAULT));
        e = assertThrows(IllegalArgumentException.class, () -> tooSmall.checkPayload(tooSmall.payloadNear(1024)));
        assertEquals("--frame-bits 1 with crc16: channel code tiny carries exactly 4 information bits per frame (payload"
                + " and CRC); valid: no payload with crc16 fits; use a shorter --crc", e.getMessage());
    }

    /**
     * A family code takes every size of its range, also those that need the second round of
     * puncturing (rate 3/4 at k = 73: Z = 5, 17 fillers, 6 punctured; rate 5/6 at k = 81 and 82: Z = 5,
     * 19 and 18 fillers, 4 punctured): noiseless LLRs of the sent bits decode to the information sent.
     * Outside the range, one line names the sizes it takes.
     */
    @Test
    void familyCodeTakesEverySizeOfItsRangeAndNamesItOutside() {
        Random random = new Random(9);
        decodesNoiselessFrames(LdpcFamily.R34, 73, random);
        decodesNoiselessFrames(LdpcFamily.R56, 81, random);
        decodesNoiselessFrames(LdpcFamily.R56, 82, random);
        LdpcCode code = LdpcCode.of(LdpcFamily.R34, LdpcDecoding.DEFAULT);
        for (int k : new int[] {63, 8225}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> code.codedBits(k));
            assertEquals("channel code ldpc-r34 takes 64 to 8224 information bits per frame, not " + k, e.getMessage());
        }
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new FecScheme(Crc.CRC32, code).checkPayload(8193));
        assertEquals("--frame-bits 8193 with crc32: channel code ldpc-r34 carries 64 to 8224 information bits per frame"
                + " (payload and CRC); valid: --frame-bits 32 to 8192 with crc32", e.getMessage());
    }

    private static void decodesNoiselessFrames(LdpcFamily family, int k, Random random) {
        LdpcCode code = LdpcCode.of(family, LdpcDecoding.DEFAULT);
        int n = code.codedBits(k);
        assertEquals(Math.round(k / family.rate()), n);
        LaneCoder coder = code.newCoder(k, 4);
        byte[] coded = new byte[n];
        double[] llr = new double[n];
        byte[] decided = new byte[k];
        for (int f = 0; f < 4; f++) {
            byte[] info = randomBits(k, random);
            coder.encode(info, 0, coded, 0);
            for (int p = 0; p < n; p++) {
                llr[p] = coded[p] == 0 ? 6 : -6;
            }
            coder.load(0, llr, 0);
            coder.decode(1);
            coder.decided(0, decided, 0);
            assertArrayEquals(info, decided, family + " k " + k + " frame " + f);
        }
    }

    @Test
    void describesItsDecoding() {
        assertEquals("LDPC code of qc960 (n 960, k 480), min-sum decoder (factor 0.8125), at most 50 iterations",
                CODE.describe());
        assertEquals("LDPC code of qc960 (n 960, k 480), offset-min-sum decoder (offset 0.5), at most 50 iterations",
                CODE.withDecoding(LdpcDecoding.of(LdpcAlgorithm.OFFSET_MIN_SUM, 50)).describe());
        assertEquals("LDPC code of qc960 (n 960, k 480), sum-product decoder, at most 20 iterations, no early stop",
                CODE.withDecoding(new LdpcDecoding(LdpcAlgorithm.SUM_PRODUCT, 20, false, Double.NaN)).describe());
    }

    @Test
    void serialisedCodeCodesAlike() throws Exception {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ObjectOutputStream out = new ObjectOutputStream(bytes)) {
            out.writeObject(CODE);
        }
        LdpcCode back;
        try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(bytes.toByteArray()))) {
            back = (LdpcCode) in.readObject();
        }
        assertEquals(CODE.describe(), back.describe());
        byte[] info = randomBits(K, new Random(5));
        byte[] a = new byte[960];
        byte[] b = new byte[960];
        CODE.newCoder(K, 1).encode(info, 0, a, 0);
        back.newCoder(K, 1).encode(info, 0, b, 0);
        assertArrayEquals(a, b);
    }
}
