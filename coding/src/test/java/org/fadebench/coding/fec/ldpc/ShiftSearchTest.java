package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class ShiftSearchTest {

    /**
     * The cycle condition in the base domain (M. P. C. Fossorier, "Quasi-cyclic low-density
     * parity-check codes from circulant permutation matrices", IEEE Trans. Inf. Theory 50(8), 2004,
     * Section III: a closed base path lifts to cycles of its length iff its alternating shift sum
     * is 0 mod Z) against the girth measured on the expanded matrix, for random templates and
     * shifts: no closed 4-path iff girth above 4, and no closed 4- or 6-path iff girth above 6.
     * Shifts are random here (not searched) so that every case occurs often.
     */
    @Test
    void closedBasePathsAgreeWithTheMeasuredGirth() {
        SplittableRandom random = new SplittableRandom(6);
        int[] seen = new int[3]; // girth 4, 6, above 6
        for (int trial = 0; trial < 300; trial++) {
            int rows = 3 + random.nextInt(2);
            int columns = 4 + random.nextInt(4);
            int lifting = 3 + random.nextInt(20);
            int[][] template = new int[rows][columns];
            int[][] shifts = new int[rows][columns];
            for (int i = 0; i < rows; i++) {
                for (int j = 0; j < columns; j++) {
                    boolean one = random.nextInt(4) != 0;
                    template[i][j] = one ? Protograph.FREE : Protograph.ZERO;
                    shifts[i][j] = one ? random.nextInt(lifting) : -1;
                }
            }
            ShiftSearch search = new ShiftSearch(template);
            var girth = new QcBaseMatrix(shifts, lifting).expand().girth();
            int g = girth.isPresent() ? girth.getAsInt() : Integer.MAX_VALUE;
            long four = search.closedCycles(shifts, lifting, 4);
            long six = search.closedCycles(shifts, lifting, 6);
            assertEquals(four == 0, g > 4, "trial " + trial);
            assertEquals(four == 0 && six == 0, g > 6, "trial " + trial);
            seen[g == 4 ? 0 : g == 6 ? 1 : 2]++;
        }
        for (int s : seen) {
            assertTrue(s >= 20, "each girth class occurs: " + java.util.Arrays.toString(seen));
        }
    }

    /** The search keeps the template's zero blocks and fixed shifts, and gives the same shifts every time. */
    @Test
    void searchKeepsTheTemplateAndIsRepeatable() {
        int[][] template = LdpcFamily.R23.protograph().template();
        for (int lifting : new int[] {5, 16, 97}) {
            int[][] shifts = new ShiftSearch(template).shifts(lifting);
            for (int i = 0; i < template.length; i++) {
                for (int j = 0; j < template[i].length; j++) {
                    int t = template[i][j];
                    if (t == Protograph.FREE) {
                        assertTrue(shifts[i][j] >= 0 && shifts[i][j] < lifting);
                    } else {
                        assertEquals(t, shifts[i][j]);
                    }
                }
            }
            assertArrayEquals(shifts, new ShiftSearch(template).shifts(lifting));
        }
    }
}
