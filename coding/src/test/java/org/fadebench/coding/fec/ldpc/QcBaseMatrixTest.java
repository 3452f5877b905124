package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;

class QcBaseMatrixTest {

    @Test
    void expandsEachShiftToAShiftedIdentity() {
        QcBaseMatrix base = new QcBaseMatrix(new int[][] {{0, 2, -1}, {1, -1, 3}}, 4);
        ParityCheckMatrix h = base.expand();
        assertEquals(8, h.rows());
        assertEquals(12, h.columns());
        assertEquals(16, h.edges());
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 3; j++) {
                int s = base.shift(i, j);
                for (int r = 0; r < 4; r++) {
                    for (int c = 0; c < 4; c++) {
                        assertEquals(s >= 0 && c == (r + s) % 4, h.get(4 * i + r, 4 * j + c),
                                "block " + i + "," + j + " entry " + r + "," + c);
                    }
                }
            }
        }
    }

    @Test
    void refusesBadShiftsAndSizes() {
        assertThrows(IllegalArgumentException.class, () -> new QcBaseMatrix(new int[][] {{0, 4}}, 4));
        assertThrows(IllegalArgumentException.class, () -> new QcBaseMatrix(new int[][] {{0, -2}}, 4));
        assertThrows(IllegalArgumentException.class, () -> new QcBaseMatrix(new int[][] {{0, 1}, {0}}, 4));
        assertThrows(IllegalArgumentException.class, () -> new QcBaseMatrix(new int[][] {{0}}, 0));
        assertThrows(IllegalArgumentException.class, () -> new QcBaseMatrix(new int[0][], 4));
    }

    /**
     * The 4-cycle condition of M. P. C. Fossorier, "Quasi-cyclic low-density parity-check codes
     * from circulant permutation matrices", IEEE Trans. Inf. Theory 50(8), 2004, against the girth
     * measured on the expanded matrix, for random small base matrices: girth 4 exactly when the
     * condition finds a 4-cycle. Both outcomes must occur often for the test to mean anything.
     */
    @Test
    void fossorierConditionAgreesWithTheMeasuredGirth() {
        Random random = new Random(15);
        int withCycle = 0;
        int without = 0;
        for (int trial = 0; trial < 400; trial++) {
            int rows = 2 + random.nextInt(3);
            int columns = 3 + random.nextInt(5);
            int lifting = 1 + random.nextInt(13);
            int[][] shifts = new int[rows][columns];
            for (int[] row : shifts) {
                for (int j = 0; j < columns; j++) {
                    row[j] = random.nextInt(5) == 0 ? -1 : random.nextInt(lifting);
                }
            }
            QcBaseMatrix base = new QcBaseMatrix(shifts, lifting);
            boolean four = base.hasFourCycle();
            assertEquals(four, base.expand().girth().orElse(Integer.MAX_VALUE) == 4, "trial " + trial);
            if (four) {
                withCycle++;
            } else {
                without++;
            }
        }
        assertTrue(withCycle >= 50 && without >= 50, withCycle + " with, " + without + " without a 4-cycle");
    }

    /**
     * A QC code with three information columns of degree 3 and a parity part of the usual
     * dual-diagonal shape (common practice, no source): a weight-3 column with shifts 1, 0, 1, then
     * identities on the diagonal and just below it. Over circulants its determinant is
     * a·1 − 1·(1 − a) = 1 (a the shift-1 circulant, characteristic 2), so the parity part is
     * invertible: the encoder keeps the order [info | parity] and every word passes the checks.
     */
    @Test
    void dualDiagonalQcCodeEncodesInPlace() {
        int[][] shifts = {
            {0, 3, 5, 1, 0, -1},
            {2, 0, 6, 0, 0, 0},
            {4, 6, 0, 1, -1, 0},
        };
        int lifting = 7;
        ParityCheckMatrix h = new QcBaseMatrix(shifts, lifting).expand();
        SystematicEncoder encoder = new SystematicEncoder(h);
        assertEquals(3 * lifting, encoder.informationBits());
        assertArrayEquals(IntStream.range(0, 6 * lifting).toArray(), encoder.columnOrder());
        assertEquals(9 * lifting + 3 * lifting + 2 * 2 * lifting, h.edges());
        assertEquals(1.0, h.checkDegrees().nodeFractions()[5] + h.checkDegrees().nodeFractions()[6], 1e-15);
        Random random = new Random(4);
        byte[] info = new byte[3 * lifting];
        byte[] coded = new byte[6 * lifting];
        for (int word = 0; word < 50; word++) {
            for (int t = 0; t < info.length; t++) {
                info[t] = (byte) random.nextInt(2);
            }
            encoder.encode(info, 0, coded, 0);
            assertTrue(h.isCodeword(coded, 0));
            for (int t = 0; t < info.length; t++) {
                assertEquals(info[t], coded[t]);
            }
        }
    }
}
