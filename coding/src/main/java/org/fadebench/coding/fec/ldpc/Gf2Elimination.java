package org.fadebench.coding.fec.ldpc;

/**
 * Gaussian elimination over GF(2) on dense rows packed 64 columns to a word (column j is bit
 * j mod 64 of word j / 64). Used once per code, to find its rank and derive its encoder.
 */
public final class Gf2Elimination {

    /** Most words a dense copy of a parity-check matrix may take (2^25 words, 256 MiB). */
    public static final long MAX_WORDS = 1L << 25;

    private Gf2Elimination() {
    }

    /** Rank of H over GF(2). */
    public static int rank(ParityCheckMatrix h) {
        return reduce(pack(h), h.columns(), new int[h.rows()]);
    }

    /**
     * H as dense packed rows.
     *
     * @throws IllegalArgumentException if the dense copy would exceed {@link #MAX_WORDS}
     */
    static long[][] pack(ParityCheckMatrix h) {
        String problem = MatrixLimits.denseProblem(h.rows(), h.columns());
        if (problem != null) {
            throw new IllegalArgumentException(problem);
        }
        int words = (h.columns() + 63) >>> 6;
        long[][] rows = new long[h.rows()][words];
        for (int i = 0; i < h.rows(); i++) {
            for (int p = 0; p < h.rowDegree(i); p++) {
                int j = h.rowEntry(i, p);
                rows[i][j >>> 6] |= 1L << j;
            }
        }
        return rows;
    }

    /**
     * Brings {@code rows} (over {@code columns} columns) to reduced row echelon form in place,
     * taking pivot columns from the last column towards the first, so that a matrix whose last
     * columns are independent keeps them as its pivots. Afterwards rows 0 .. rank − 1 hold the
     * pivots: row i has a one in column {@code pivots[i]} and every other row a zero there; the
     * remaining rows are zero.
     *
     * @return the rank
     */
    static int reduce(long[][] rows, int columns, int[] pivots) {
        int rank = 0;
        for (int col = columns - 1; col >= 0 && rank < rows.length; col--) {
            int word = col >>> 6;
            long bit = 1L << col;
            int found = rank;
            while (found < rows.length && (rows[found][word] & bit) == 0) {
                found++;
            }
            if (found == rows.length) {
                continue;
            }
            long[] pivotRow = rows[found];
            rows[found] = rows[rank];
            rows[rank] = pivotRow;
            for (int i = 0; i < rows.length; i++) {
                if (i != rank && (rows[i][word] & bit) != 0) {
                    long[] row = rows[i];
                    for (int w = 0; w <= word; w++) { // columns above col are zero in the pivot row
                        row[w] ^= pivotRow[w];
                    }
                }
            }
            pivots[rank++] = col;
        }
        return rank;
    }
}
