package org.fadebench.coding.fec.ldpc;

/**
 * The one size limit a parity-check matrix read from a user's file is held to, whatever its format
 * ({@link MatrixMarketReader}, {@link LdpcCodeFile}): a file of at most {@code fileBytes} bytes,
 * rows and columns each up to {@code dimension}, at most {@code edges} ones, and a shape whose
 * dense copy for GF(2) elimination (rows × ⌈columns / 64⌉ words, which deriving the encoder needs)
 * stays within {@link Gf2Elimination#MAX_WORDS}. The shape is checked before any entry is read.
 */
public record MatrixLimits(long fileBytes, int dimension, int edges) {

    /** 256 MiB, 2^20 rows and columns, 2^24 ones (and the elimination's 2^25 words). */
    public static final MatrixLimits DEFAULT = new MatrixLimits(1L << 28, 1 << 20, 1 << 24);

    public MatrixLimits {
        if (fileBytes < 1 || dimension < 1 || dimension > 1 << 20 || edges < 1 || edges > 1 << 24) {
            throw new IllegalArgumentException("limits " + fileBytes + ", " + dimension + ", " + edges
                    + "; valid: positive, dimension up to 2^20, edges up to 2^24");
        }
    }

    /**
     * Why a matrix of this shape is refused, or null when it is within the limits: rows and columns
     * up to {@link #dimension} (checked by the caller, which names them), and the dense elimination
     * within {@link Gf2Elimination#MAX_WORDS}.
     */
    public static String denseProblem(long rows, long columns) {
        long words = rows * ((columns + 63) >>> 6);
        if (words <= Gf2Elimination.MAX_WORDS) {
            return null;
        }
        return "a " + rows + " x " + columns + " matrix is too large to derive its encoder: GF(2) elimination needs "
                + "rows x columns/64 = " + words + " words of 64 bits; valid: at most " + Gf2Elimination.MAX_WORDS
                + " words (rows x columns up to " + (Gf2Elimination.MAX_WORDS << 6) + ")";
    }
}
