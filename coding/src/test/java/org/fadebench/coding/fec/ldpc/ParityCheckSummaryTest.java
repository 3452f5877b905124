package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class ParityCheckSummaryTest {

    /**
     * Hamming (7,4): column weights 1, 1, 2, 1, 2, 2, 3 and every row of weight 4; girth 4, since
     * columns 3 and 7 share rows 2 and 3 (worked by hand).
     */
    @Test
    void hammingMatrix() {
        ParityCheckSummary s = ParityCheckSummary.of(ParityCheckMatrix.of(ParityCheckMatrixTest.HAMMING_7_4));
        assertEquals("1:3 2:3 3:1", s.variableDegrees());
        assertEquals("4:3", s.checkDegrees());
        assertEquals("4", s.girthText());
        assertEquals(12, s.edges());
    }

    /**
     * The Fano plane's incidence matrix (7 x 7 circulant of the perfect difference set {0, 1, 3}
     * mod 7): every point on 3 lines, every line through 3 points; two points share exactly one
     * line (the differences ±1, ±2, ±3 of the set are distinct mod 7), so there is no 4-cycle, and
     * the triangle of points 0, 1, 3 closes a 6-cycle: girth 6 (worked by hand).
     */
    @Test
    void fanoPlaneHasGirthSix() {
        int[][] dense = new int[7][7];
        for (int i = 0; i < 7; i++) {
            for (int d : new int[] {0, 1, 3}) {
                dense[i][(i + d) % 7] = 1;
            }
        }
        ParityCheckSummary s = ParityCheckSummary.of(ParityCheckMatrix.of(dense));
        assertEquals("3:7", s.variableDegrees());
        assertEquals("3:7", s.checkDegrees());
        assertEquals("6", s.girthText());
    }

    /** One check on three bits: a tree, no cycle; a column of no ones counts at degree 0. */
    @Test
    void treeAndEmptyColumn() {
        ParityCheckSummary s = ParityCheckSummary.of(ParityCheckMatrix.of(new int[][] {{1, 1, 0, 1}}));
        assertEquals("0:1 1:3", s.variableDegrees());
        assertEquals("3:1", s.checkDegrees());
        assertEquals("none", s.girthText());
    }
}
