package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.OptionalInt;
import java.util.Random;
import org.junit.jupiter.api.Test;

class ParityCheckMatrixTest {

    /**
     * The (7,4) Hamming code's parity-check matrix: column j (1-based) is j in binary, top row the
     * most significant bit (common practice, no source).
     */
    static final int[][] HAMMING_7_4 = {
        {0, 0, 0, 1, 1, 1, 1},
        {0, 1, 1, 0, 0, 1, 1},
        {1, 0, 1, 0, 1, 0, 1},
    };

    @Test
    void rowsAndColumnsHoldTheSameEntries() {
        Random random = new Random(11);
        int[][] dense = new int[9][70];
        for (int[] row : dense) {
            for (int j = 0; j < row.length; j++) {
                row[j] = random.nextInt(4) == 0 ? 1 : 0;
            }
        }
        ParityCheckMatrix h = ParityCheckMatrix.of(dense);
        int ones = 0;
        for (int i = 0; i < 9; i++) {
            for (int j = 0; j < 70; j++) {
                assertEquals(dense[i][j] == 1, h.get(i, j), "entry " + i + ", " + j);
                ones += dense[i][j];
            }
        }
        assertEquals(ones, h.edges());
        for (int j = 0; j < 70; j++) {
            int last = -1;
            for (int p = 0; p < h.columnDegree(j); p++) {
                int i = h.columnEntry(j, p);
                assertTrue(i > last && dense[i][j] == 1);
                last = i;
            }
        }
        for (int i = 0; i < 9; i++) {
            int last = -1;
            for (int p = 0; p < h.rowDegree(i); p++) {
                int j = h.rowEntry(i, p);
                assertTrue(j > last && dense[i][j] == 1);
                last = j;
            }
        }
    }

    @Test
    void refusesDuplicateAndOutOfRangeEntries() {
        assertThrows(IllegalArgumentException.class,
                () -> ParityCheckMatrix.of(2, 2, new int[] {0, 0}, new int[] {1, 1}, 2));
        assertThrows(IllegalArgumentException.class,
                () -> ParityCheckMatrix.of(2, 2, new int[] {2}, new int[] {0}, 1));
        assertThrows(IllegalArgumentException.class,
                () -> ParityCheckMatrix.of(2, 2, new int[] {0}, new int[] {-1}, 1));
        assertThrows(IllegalArgumentException.class, () -> ParityCheckMatrix.of(0, 2, new int[0], new int[0], 0));
    }

    /**
     * Hamming (7,4): column weights 1,1,2,1,2,2,3 (12 edges), every row of weight 4. Node and edge
     * perspective as defined by T. Richardson, R. Urbanke, "Modern Coding Theory", 2008, Section
     * 3.3 (from memory): L_d = nodes of degree d / n, λ_d = d·(nodes of degree d) / edges.
     */
    @Test
    void degreeDistributionsOfTheHammingMatrix() {
        ParityCheckMatrix h = ParityCheckMatrix.of(HAMMING_7_4);
        ParityCheckMatrix.Degrees v = h.variableDegrees();
        assertArrayEquals(new double[] {0, 3 / 7.0, 3 / 7.0, 1 / 7.0}, v.nodeFractions(), 1e-15);
        assertArrayEquals(new double[] {0, 3 / 12.0, 6 / 12.0, 3 / 12.0}, v.edgeFractions(), 1e-15);
        ParityCheckMatrix.Degrees c = h.checkDegrees();
        assertArrayEquals(new double[] {0, 0, 0, 0, 1}, c.nodeFractions(), 0);
        assertArrayEquals(new double[] {0, 0, 0, 0, 1}, c.edgeFractions(), 0);
    }

    /**
     * Girth 4 for Hamming (7,4): columns 3 (011) and 7 (111) both check rows 2 and 3, which closes
     * v3–c2–v7–c3–v3, and a simple bipartite graph has no shorter cycle.
     */
    @Test
    void hammingGirthIsFour() {
        assertEquals(OptionalInt.of(4), ParityCheckMatrix.of(HAMMING_7_4).girth());
    }

    /** A ring of L checks and L variables (row i checks columns i and i+1 mod L) is one cycle of length 2L. */
    @Test
    void ringGirthIsTwiceItsLength() {
        for (int length = 2; length <= 9; length++) {
            int[][] dense = new int[length][length];
            for (int i = 0; i < length; i++) {
                dense[i][i] = 1;
                dense[i][(i + 1) % length] = 1;
            }
            assertEquals(OptionalInt.of(2 * length), ParityCheckMatrix.of(dense).girth(), "ring of " + length);
        }
    }

    /** A tree (a chain of checks, each on two neighbouring columns, with an extra leaf) has no cycle. */
    @Test
    void treeHasNoCycle() {
        int[][] chain = {
            {1, 1, 0, 0, 0},
            {0, 1, 1, 0, 1},
            {0, 0, 1, 1, 0},
        };
        assertFalse(ParityCheckMatrix.of(chain).girth().isPresent());
        assertFalse(ParityCheckMatrix.of(new int[][] {{1, 1, 1}}).girth().isPresent());
    }

    @Test
    void isCodewordChecksEveryRow() {
        ParityCheckMatrix h = ParityCheckMatrix.of(HAMMING_7_4);
        assertTrue(h.isCodeword(new byte[] {9, 1, 1, 1, 0, 0, 0, 0}, 1)); // columns 1, 2, 3: 1 ^ 2 ^ 3 = 0
        assertFalse(h.isCodeword(new byte[] {1, 1, 0, 0, 0, 0, 0}, 0));
    }
}
