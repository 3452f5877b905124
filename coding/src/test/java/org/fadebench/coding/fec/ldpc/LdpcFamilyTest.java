package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.nio.ByteBuffer;
import java.security.MessageDigest;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class LdpcFamilyTest {

    private static final int[] SIZES = {64, 65, 100, 255, 256, 700, 1000, 1024, 1500, 4097, 8224};
    private static final int[] POWERS = {64, 128, 256, 512, 1024, 2048, 4096, 8192};

    @Test
    void namesAndRates() {
        assertEquals("ldpc-r12 ldpc-r23 ldpc-r34 ldpc-r56", String.join(" ",
                Arrays.stream(LdpcFamily.values()).map(LdpcFamily::cliName).toList()));
        assertEquals(1.0 / 2, LdpcFamily.R12.rate(), 1e-15);
        assertEquals(2.0 / 3, LdpcFamily.R23.rate(), 1e-15);
        assertEquals(3.0 / 4, LdpcFamily.R34.rate(), 1e-15);
        assertEquals(5.0 / 6, LdpcFamily.R56.rate(), 1e-15);
    }

    /** Lifting by ⌈k / kb⌉, fewer than kb fillers, round(k / R) bits sent, H of k + mb·Z columns. */
    @Test
    void layoutsSendExactlyTheNominalRate() {
        for (LdpcFamily code : LdpcFamily.values()) {
            int kb = code.infoColumns();
            int mb = LdpcFamily.BASE_COLUMNS - kb;
            for (int k : SIZES) {
                CodeLayout layout = code.layout(k);
                int z = code.lifting(k);
                assertTrue(kb * z >= k && kb * (z - 1) < k, code + " k " + k);
                assertEquals(k, layout.infoBits());
                assertEquals(Math.round(k / code.rate()), layout.sentBits(), code + " k " + k);
                ParityCheckMatrix h = layout.matrix();
                assertEquals(k + mb * z, h.columns());
                assertEquals(mb * z, h.rows());
                boolean[] isSent = new boolean[h.columns()];
                for (int p = 0; p < layout.sentBits(); p++) {
                    int c = layout.sentColumn(p);
                    assertTrue(p == 0 || c > layout.sentColumn(p - 1), "ascending, distinct");
                    isSent[c] = true;
                }
                for (int t = 0; t < k; t++) {
                    assertEquals(t, layout.infoColumn(t));
                    assertTrue(isSent[t], "information bits are sent");
                }
                // punctured bits: degree-2 parity bits, no check with two of them
                int[] puncturedPerCheck = new int[h.rows()];
                for (int c = 0; c < h.columns(); c++) {
                    if (!isSent[c]) {
                        assertTrue(c >= k + z, "not in parity column 0");
                        assertEquals(2, h.columnDegree(c));
                        for (int p = 0; p < 2; p++) {
                            assertTrue(++puncturedPerCheck[h.columnEntry(c, p)] < 2, code + " k " + k);
                        }
                    }
                }
            }
        }
    }

    @Test
    void sizesOutsideTheRangeAreRefusedInOneLine() {
        for (int k : new int[] {0, 63, 8225, -5}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> LdpcFamily.R34.layout(k));
            assertEquals("ldpc-r34 takes 64 to 8224 information bits per codeword (payload and CRC), got " + k,
                    e.getMessage());
        }
    }

    /**
     * Every encoded word satisfies H·c = 0 (the definition of the code), and the linear-time
     * encoder gives the same codeword as the systematic encoder derived by GF(2) elimination
     * (same code space, same information set: the parity part of a dual-diagonal H is
     * invertible, common practice, no source).
     */
    @Test
    void encoderGivesCodewordsOfTheSystematicEncodersCode() {
        SplittableRandom random = new SplittableRandom(15);
        for (LdpcFamily code : LdpcFamily.values()) {
            for (int k : new int[] {64, 100, 255, 700, 1024}) {
                CodeLayout layout = code.layout(k);
                ParityCheckMatrix h = layout.matrix();
                SystematicEncoder reference = new SystematicEncoder(h);
                assertEquals(k, reference.informationBits(), "H has full rank");
                LdpcEncoder encoder = layout.newEncoder();
                byte[] info = new byte[k + 3];
                byte[] word = new byte[h.columns() + 5];
                byte[] expected = new byte[h.columns()];
                for (int trial = 0; trial < 8; trial++) {
                    for (int t = 0; t < info.length; t++) {
                        info[t] = (byte) random.nextInt(2);
                    }
                    encoder.encode(info, 3, word, 5);
                    assertTrue(h.isCodeword(word, 5), code + " k " + k);
                    reference.encode(info, 3, expected, 0);
                    assertArrayEquals(expected, Arrays.copyOfRange(word, 5, word.length), code + " k " + k);
                }
            }
        }
    }

    /**
     * Girth of H as used, per rate and k: no 4-cycles from k = 256 on (M. P. C. Fossorier, IEEE
     * Trans. Inf. Theory 50(8), 2004, condition on the base matrix, and the girth measured on the
     * expanded graph agree). The table pins the codes' girths; below k = 256 the densest
     * protographs cannot avoid 4-cycles at their small Z.
     */
    @Test
    void girthPerRateAndSize() {
        int[][] girth = GIRTHS;
        for (LdpcFamily code : LdpcFamily.values()) {
            for (int q = 0; q < POWERS.length; q++) {
                int k = POWERS[q];
                int measured = code.layout(k).matrix().girth().getAsInt();
                assertEquals(girth[code.ordinal()][q], measured, code + " k " + k);
                assertEquals(measured == 4, code.baseMatrix(code.lifting(k)).hasFourCycle(), code + " k " + k);
                if (k >= 256) {
                    assertTrue(measured >= 6, code + " k " + k);
                }
            }
        }
    }

    /**
     * No 4-cycles for any k above 220 (Z ≥ 12), at every lifting size the family uses, by the
     * condition of M. P. C. Fossorier, IEEE Trans. Inf. Theory 50(8), 2004 ({@link
     * QcBaseMatrix#hasFourCycle}); rate 1/2 has none at any size.
     */
    @Test
    void noFourCyclesAboveTwoHundredTwentyBits() {
        for (LdpcFamily code : LdpcFamily.values()) {
            int from = code == LdpcFamily.R12 ? LdpcFamily.MIN_INFO_BITS : 221;
            for (int z = code.lifting(from); z <= code.lifting(LdpcFamily.MAX_INFO_BITS); z++) {
                assertFalse(code.baseMatrix(z).hasFourCycle(), code + " Z " + z);
            }
        }
    }

    private static final int[][] GIRTHS = {
        {6, 6, 6, 8, 8, 8, 8, 8},
        {4, 4, 6, 6, 6, 8, 8, 8},
        {4, 4, 6, 6, 6, 8, 8, 8},
        {4, 4, 6, 6, 6, 6, 8, 8},
    };

    /** The shift tables are the same in every run: SHA-256 of every rate's tables at a list of Z. */
    @Test
    void shiftTablesArePinned() throws Exception {
        MessageDigest sha = MessageDigest.getInstance("SHA-256");
        for (LdpcFamily code : LdpcFamily.values()) {
            for (int z : new int[] {4, 6, 13, 22, 43, 52, 86, 171, 342, 686}) {
                QcBaseMatrix base = code.baseMatrix(z);
                ByteBuffer b = ByteBuffer.allocate(4 * base.baseRows() * base.baseColumns());
                for (int i = 0; i < base.baseRows(); i++) {
                    for (int j = 0; j < base.baseColumns(); j++) {
                        b.putInt(base.shift(i, j));
                    }
                }
                sha.update(b.array());
            }
        }
        assertEquals("2e58873cd3e4bf9c4a1478c8af7cf55ee84765f3d3d3405ed34975506b16a04e", HexFormat.of().formatHex(sha.digest()));
    }

    @Test
    void constantsSurviveSerialisation() throws Exception {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ObjectOutputStream out = new ObjectOutputStream(bytes)) {
            out.writeObject(LdpcFamily.R23);
        }
        try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(bytes.toByteArray()))) {
            assertSame(LdpcFamily.R23, in.readObject());
        }
    }
}
