package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;

/**
 * A quasi-cyclic LDPC code given by a base matrix of circulant shifts and a lifting size Z: entry
 * s_ij = −1 is the Z x Z zero block, 0 ≤ s_ij < Z the identity with its columns shifted
 * cyclically by s_ij, so row r of block (i, j) has its one in column (r + s_ij) mod Z. Immutable.
 */
public final class QcBaseMatrix {

    private final int[][] shifts;
    private final int lifting;

    /**
     * @param shifts the base matrix (rows of equal length), each entry −1 or from 0 to Z − 1; copied
     * @param lifting the lifting size Z, at least 1
     * @throws IllegalArgumentException naming the entry at fault
     */
    public QcBaseMatrix(int[][] shifts, int lifting) {
        if (lifting < 1) {
            throw new IllegalArgumentException("lifting size " + lifting + "; valid: at least 1");
        }
        if (shifts.length == 0 || shifts[0].length == 0) {
            throw new IllegalArgumentException("empty base matrix; valid: at least one row and one column");
        }
        this.shifts = new int[shifts.length][];
        for (int i = 0; i < shifts.length; i++) {
            if (shifts[i].length != shifts[0].length) {
                throw new IllegalArgumentException("base matrix row " + i + " has " + shifts[i].length
                        + " entries; valid: " + shifts[0].length + " as in row 0");
            }
            for (int j = 0; j < shifts[i].length; j++) {
                int s = shifts[i][j];
                if (s < -1 || s >= lifting) {
                    throw new IllegalArgumentException("base matrix entry (" + i + ", " + j + ") is " + s
                            + "; valid: -1 (zero block) or a shift from 0 to " + (lifting - 1));
                }
            }
            this.shifts[i] = shifts[i].clone();
        }
        this.lifting = lifting;
    }

    /** Rows of the base matrix. */
    public int baseRows() {
        return shifts.length;
    }

    /** Columns of the base matrix. */
    public int baseColumns() {
        return shifts[0].length;
    }

    /** The lifting size Z. */
    public int lifting() {
        return lifting;
    }

    /** The shift of block (i, j), −1 for a zero block. */
    public int shift(int i, int j) {
        return shifts[i][j];
    }

    /** The expanded parity-check matrix, (rows · Z) x (columns · Z). */
    public ParityCheckMatrix expand() {
        int[] column = new int[shifts[0].length * lifting];
        Arrays.setAll(column, p -> p);
        return expand(column, column.length);
    }

    /**
     * The expanded matrix with its columns renumbered: lifted column p (block p / Z, offset p mod Z)
     * becomes column {@code column[p]} of a matrix of {@code columns} columns, or is left out where
     * {@code column[p]} is −1 (a shortened bit, a known zero).
     */
    ParityCheckMatrix expand(int[] column, int columns) {
        int count = 0;
        for (int[] row : shifts) {
            for (int s : row) {
                count += s >= 0 ? lifting : 0;
            }
        }
        int[] r = new int[count];
        int[] c = new int[count];
        int e = 0;
        for (int i = 0; i < shifts.length; i++) {
            for (int j = 0; j < shifts[i].length; j++) {
                int s = shifts[i][j];
                if (s < 0) {
                    continue;
                }
                for (int t = 0; t < lifting; t++) {
                    int col = column[j * lifting + (t + s) % lifting];
                    if (col >= 0) {
                        r[e] = i * lifting + t;
                        c[e++] = col;
                    }
                }
            }
        }
        return ParityCheckMatrix.of(shifts.length * lifting, columns, r, c, e);
    }

    /**
     * Whether the expanded matrix has a 4-cycle, by the condition of M. P. C. Fossorier,
     * "Quasi-cyclic low-density parity-check codes from circulant permutation matrices", IEEE
     * Trans. Inf. Theory 50(8), 2004 (its condition for cycles of length 4): for base rows i ≠ j and
     * columns k ≠ l whose four blocks are all nonzero, a 4-cycle exists iff
     * (s_ik − s_jk + s_jl − s_il) mod Z = 0.
     */
    public boolean hasFourCycle() {
        for (int i = 0; i < shifts.length; i++) {
            for (int j = i + 1; j < shifts.length; j++) {
                for (int k = 0; k < shifts[i].length; k++) {
                    if (shifts[i][k] < 0 || shifts[j][k] < 0) {
                        continue;
                    }
                    for (int l = k + 1; l < shifts[i].length; l++) {
                        if (shifts[i][l] >= 0 && shifts[j][l] >= 0
                                && Math.floorMod(shifts[i][k] - shifts[j][k] + shifts[j][l] - shifts[i][l], lifting) == 0) {
                            return true;
                        }
                    }
                }
            }
        }
        return false;
    }
}
