package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
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

    private static final int[] POWERS = {64, 128, 256, 512, 1024, 2048, 4096, 8192};
    /** Per rate, the largest k whose H has 4-cycles (0: none). */
    private static final int[] LAST_WITH_FOUR_CYCLES = {0, 160, 198, 220};

    @Test
    void namesAndRates() {
        assertEquals("ldpc-r12 ldpc-r23 ldpc-r34 ldpc-r56", String.join(" ",
                Arrays.stream(LdpcFamily.values()).map(LdpcFamily::cliName).toList()));
        assertEquals(1.0 / 2, LdpcFamily.R12.rate(), 1e-15);
        assertEquals(2.0 / 3, LdpcFamily.R23.rate(), 1e-15);
        assertEquals(3.0 / 4, LdpcFamily.R34.rate(), 1e-15);
        assertEquals(5.0 / 6, LdpcFamily.R56.rate(), 1e-15);
    }

    /**
     * Every k from 64 to 8224 at every rate: lifting by ⌈k / kb⌉, fewer than kb fillers, round(k / R)
     * bits sent, H of k + mb·Z columns, the punctured bits recoverable ({@link #puncturedBits}); the
     * second round of puncturing serves exactly the sizes the first could not (a filler count f with
     * round(f·mb / kb) = mb: f = 17 of 18 at rate 3/4, f = 18 and 19 of 20 at rate 5/6, one or two
     * sizes per Z). H·c = 0 for one encoded word at every k. 4-cycles (M. P. C. Fossorier, IEEE
     * Trans. Inf. Theory 50(8), 2004, condition on the base matrix, {@link QcBaseMatrix#hasFourCycle})
     * exactly up to the sizes the family's javadoc names: none at rate 1/2, up to k = 160, 198 and
     * 220 (Z = 10, 11, 11) at rates 2/3, 3/4 and 5/6, none above.
     */
    @Test
    void everySizeIsServedAtTheNominalRate() {
        SplittableRandom random = new SplittableRandom(23);
        int[] secondRoundSizes = new int[LdpcFamily.values().length];
        for (LdpcFamily code : LdpcFamily.values()) {
            int kb = code.infoColumns();
            int mb = LdpcFamily.BASE_COLUMNS - kb;
            for (int k = LdpcFamily.MIN_INFO_BITS; k <= LdpcFamily.MAX_INFO_BITS; k++) {
                CodeLayout layout = code.layout(k);
                int z = code.lifting(k);
                assertTrue(kb * z >= k && kb * (z - 1) < k, code + " k " + k);
                assertEquals(k, layout.infoBits());
                assertEquals(Math.round(k / code.rate()), layout.sentBits(), code + " k " + k);
                ParityCheckMatrix h = layout.matrix();
                assertEquals(k + mb * z, h.columns());
                assertEquals(mb * z, h.rows());
                int punctured = puncturedBits(layout, z, code + " k " + k);
                if (punctured == mb) {
                    secondRoundSizes[code.ordinal()]++;
                }
                byte[] info = new byte[k];
                for (int t = 0; t < k; t++) {
                    info[t] = (byte) random.nextInt(2);
                }
                byte[] word = new byte[h.columns()];
                layout.newEncoder().encode(info, 0, word, 0);
                assertTrue(h.isCodeword(word, 0), code + " k " + k);
                assertEquals(k <= LAST_WITH_FOUR_CYCLES[code.ordinal()], code.baseMatrix(z).hasFourCycle(),
                        code + " k " + k);
            }
        }
        assertArrayEquals(new int[] {0, 0, 453, 816}, secondRoundSizes);
    }

    /**
     * The puncturing rule at its most, two rounds of mb − 1 bits, at every lifting size the family
     * uses (from Z = ⌈64 / kb⌉ ≥ 4): each check still sees at most one punctured bit. One bit more,
     * or a second round below Z = 4 (where ⌊qZ/4⌋, q = 0 … 3, are no longer distinct), is refused.
     */
    @Test
    void twoRoundsOfPuncturingLeaveOnePuncturedBitPerCheck() {
        for (LdpcFamily code : LdpcFamily.values()) {
            int kb = code.infoColumns();
            int mb = LdpcFamily.BASE_COLUMNS - kb;
            int middle = code.protograph().middleRow();
            int smallest = code.lifting(LdpcFamily.MIN_INFO_BITS);
            assertTrue(smallest >= 4, code + " Z " + smallest);
            for (int z = smallest; z <= code.lifting(LdpcFamily.MAX_INFO_BITS); z++) {
                int k = kb * z;
                CodeLayout layout = new LiftedLayout(code.baseMatrix(z), middle, k, k + mb * z - 2 * (mb - 1));
                assertEquals(2 * (mb - 1), puncturedBits(layout, z, code + " Z " + z));
            }
            int k = kb * smallest;
            assertThrows(IllegalArgumentException.class, () -> new LiftedLayout(code.baseMatrix(smallest), middle, k,
                    k + mb * smallest - 2 * (mb - 1) - 1));
            assertThrows(IllegalArgumentException.class, () -> new LiftedLayout(code.baseMatrix(3), middle, 3 * kb,
                    3 * kb + 3 * mb - mb));
            new LiftedLayout(code.baseMatrix(3), middle, 3 * kb, 3 * kb + 3 * mb - (mb - 1));
        }
    }

    /**
     * Checks a layout's sent columns (ascending, every information bit sent) and its punctured bits:
     * parity bits of degree 2 outside parity column 0, no check with two of them, so each is
     * recovered from either of its checks in the first iteration (J. Ha, J. Kim, S. W. McLaughlin,
     * IEEE Trans. Inf. Theory 50(11), 2004; from memory). Returns how many are punctured.
     */
    private static int puncturedBits(CodeLayout layout, int z, String what) {
        ParityCheckMatrix h = layout.matrix();
        int k = layout.infoBits();
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
        int[] puncturedPerCheck = new int[h.rows()];
        int punctured = 0;
        for (int c = 0; c < h.columns(); c++) {
            if (!isSent[c]) {
                punctured++;
                assertTrue(c >= k + z, "not in parity column 0");
                assertEquals(2, h.columnDegree(c));
                for (int p = 0; p < 2; p++) {
                    assertTrue(++puncturedPerCheck[h.columnEntry(c, p)] < 2, what);
                }
            }
        }
        assertEquals(h.columns() - layout.sentBits(), punctured);
        return punctured;
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
     * expanded graph agree). The table pins the codes' girths; below k = 256 the denser
     * protographs keep 4-cycles at their small Z ({@link LdpcFamily}: avoiding them there needs more
     * checks than parity bits sent, and the 4-cycle-free codes tried measured worse).
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
