package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;

/**
 * A systematic encoder of the null space of a parity-check matrix H, derived once by Gaussian
 * elimination over GF(2) ({@link Gf2Elimination#reduce}). The pivot columns of the reduced H carry
 * the r = rank(H) parity bits, the other k = n − r columns (the information set) carry the
 * information bits in ascending column order; {@link #columnOrder()} lists the information set
 * then the parity columns, so the codeword read in that order is [info | parity]. Pivots are taken
 * from the last column first: when the last r columns of H are independent (a triangular or
 * dual-diagonal parity part) the order is the identity and the codeword is [info | parity] as
 * written. A reduced pivot row i reads c[pivot_i] + Σ_j R_ij·c[info_j] = 0, so each parity bit is
 * the parity of R_i masked by the information bits. Encoding allocates nothing; not thread-safe.
 */
public final class SystematicEncoder implements LdpcEncoder {

    private final int n;
    private final int[] infoColumns;
    private final int[] parityColumns;
    private final long[][] parityRows; // R_i over the information bits, packed
    private final long[] packedInfo;

    /**
     * Derives the encoder of H.
     *
     * @throws IllegalArgumentException if H has full column rank (no information bit) or is too
     *         large for dense elimination
     */
    public SystematicEncoder(ParityCheckMatrix h) {
        n = h.columns();
        long[][] rows = Gf2Elimination.pack(h);
        int[] pivots = new int[h.rows()];
        int rank = Gf2Elimination.reduce(rows, n, pivots);
        int k = n - rank;
        if (k == 0) {
            throw new IllegalArgumentException("parity-check matrix of " + h.rows() + " x " + n + " has rank " + rank
                    + " and so no codeword but zero; valid: rank below the number of columns");
        }
        boolean[] parity = new boolean[n];
        for (int i = 0; i < rank; i++) {
            parity[pivots[i]] = true;
        }
        infoColumns = new int[k];
        for (int j = 0, t = 0; j < n; j++) {
            if (!parity[j]) {
                infoColumns[t++] = j;
            }
        }
        parityColumns = Arrays.copyOf(pivots, rank);
        parityRows = new long[rank][(k + 63) >>> 6];
        for (int i = 0; i < rank; i++) {
            for (int t = 0; t < k; t++) {
                int j = infoColumns[t];
                if ((rows[i][j >>> 6] & (1L << j)) != 0) {
                    parityRows[i][t >>> 6] |= 1L << t;
                }
            }
        }
        packedInfo = new long[(k + 63) >>> 6];
    }

    /** Information bits per codeword, k = n − rank(H). */
    public int informationBits() {
        return infoColumns.length;
    }

    /** Code length n (columns of H). */
    public int codeBits() {
        return n;
    }

    /**
     * The information set then the parity columns, each ascending: the codeword read in this order
     * is [info | parity].
     */
    public int[] columnOrder() {
        int[] order = Arrays.copyOf(infoColumns, n);
        System.arraycopy(parityColumns, 0, order, infoColumns.length, parityColumns.length);
        Arrays.sort(order, infoColumns.length, n);
        return order;
    }

    /**
     * Encodes the k information bits (one per byte, 0 or 1) at {@code info[off ..]} into the n
     * code bits at {@code coded[codedOff ..]}, in H's column order: information bit t goes to
     * column {@code columnOrder()[t]}, and H·c = 0.
     */
    @Override
    public void encode(byte[] info, int off, byte[] coded, int codedOff) {
        Arrays.fill(packedInfo, 0L);
        for (int t = 0; t < infoColumns.length; t++) {
            int b = info[off + t] & 1;
            packedInfo[t >>> 6] |= (long) b << t;
            coded[codedOff + infoColumns[t]] = (byte) b;
        }
        for (int i = 0; i < parityColumns.length; i++) {
            long[] row = parityRows[i];
            long acc = 0;
            for (int w = 0; w < row.length; w++) {
                acc ^= row[w] & packedInfo[w];
            }
            coded[codedOff + parityColumns[i]] = (byte) (Long.bitCount(acc) & 1);
        }
    }
}
