package org.fadebench.coding.fec.ldpc;

import java.util.Optional;

/**
 * One code of the built-in family at one information size k: the protograph lifted by Z =
 * ⌈k / kb⌉, shortened to k information bits and punctured to the bits sent.
 *
 * <p>Shortening: the kb·Z − k (fewer than kb) filler bits are the last bit (offset Z − 1) of the
 * last information blocks, one per block; the family puts its degree-3 information columns last,
 * so the high-degree columns stay whole and each removed column lightens three checks. Their
 * columns are removed from H (known zeros, never sent).
 *
 * <p>Puncturing: of the mb·Z parity bits, mb·Z − (sent − k) are not sent (fewer than mb). They are
 * taken one per staircase column (parity column 1, 2, …), at offset 0 in odd and Z/2 in even ones,
 * so no check sees two punctured bits: each punctured bit has degree 2 and both its checks are
 * otherwise sent, so the first iteration already gives it a message (the idea of recoverable
 * punctured nodes, J. Ha, J. Kim, S. W. McLaughlin, "Rate-compatible puncturing of low-density
 * parity-check codes", IEEE Trans. Inf. Theory 50(11), 2004; from memory). The degree-3 parity
 * column and the information bits are always sent.
 *
 * <p>Columns of H: the k information bits in block order, then the mb·Z parity bits (block c at
 * k + c·Z). Bits sent in column order, the punctured ones left out. Immutable.
 */
final class LiftedLayout implements CodeLayout {

    private final QcBaseMatrix base;
    private final int kb;
    private final int middleRow;
    private final int infoBits;
    private final int[] infoPosition; // information bit t -> its position in the kb·Z lifted information part
    private final int[] sent;
    private final ParityCheckMatrix matrix;
    private final QcStructure structure;

    /**
     * @param base the lifted base matrix (kb information columns, then the dual-diagonal parity part)
     * @param middleRow the row of parity column 0's middle one
     * @param infoBits k, from kb·(Z − 1) + 1 to kb·Z
     * @param sentBits bits sent, from k + (mb − 1)·Z + 1 to k + mb·Z
     */
    LiftedLayout(QcBaseMatrix base, int middleRow, int infoBits, int sentBits) {
        int z = base.lifting();
        int mb = base.baseRows();
        this.base = base;
        this.kb = base.baseColumns() - mb;
        this.middleRow = middleRow;
        this.infoBits = infoBits;
        int fillers = kb * z - infoBits;
        int punctured = infoBits + mb * z - sentBits;
        if (fillers < 0 || fillers >= kb || punctured < 0 || punctured >= mb) {
            throw new IllegalArgumentException("layout of " + infoBits + " information and " + sentBits
                    + " sent bits does not fit lifting size " + z);
        }
        int[] column = new int[kb * z]; // lifted information position -> column of H, −1 if shortened
        infoPosition = new int[infoBits];
        for (int p = 0, t = 0; p < kb * z; p++) {
            boolean filler = p % z == z - 1 && p / z >= kb - fillers;
            column[p] = filler ? -1 : t;
            if (!filler) {
                infoPosition[t++] = p;
            }
        }
        int n = infoBits + mb * z;
        boolean[] skip = new boolean[n];
        for (int c = 1; c <= punctured; c++) {
            skip[infoBits + c * z + (c % 2 == 1 ? 0 : z / 2)] = true;
        }
        sent = new int[sentBits];
        for (int j = 0, p = 0; j < n; j++) {
            if (!skip[j]) {
                sent[p++] = j;
            }
        }
        matrix = build(column, n);
        int[] position = new int[n];
        for (int c = 0; c < n; c++) {
            position[c] = c < infoBits ? infoPosition[c] : kb * z + c - infoBits;
        }
        structure = new QcStructure(base, position);
    }

    /** The expanded base matrix with its columns renumbered (information, then parity) and the fillers left out. */
    private ParityCheckMatrix build(int[] column, int n) {
        ParityCheckMatrix full = base.expand();
        int lifted = column.length;
        int[] r = new int[full.edges()];
        int[] c = new int[full.edges()];
        int e = 0;
        for (int i = 0; i < full.rows(); i++) {
            for (int p = 0; p < full.rowDegree(i); p++) {
                int j = full.rowEntry(i, p);
                int col = j < lifted ? column[j] : infoBits + j - lifted;
                if (col >= 0) {
                    r[e] = i;
                    c[e++] = col;
                }
            }
        }
        return ParityCheckMatrix.of(full.rows(), n, r, c, e);
    }

    @Override
    public ParityCheckMatrix matrix() {
        return matrix;
    }

    @Override
    public Optional<QcStructure> quasiCyclic() {
        return Optional.of(structure);
    }

    @Override
    public int infoBits() {
        return infoBits;
    }

    @Override
    public int infoColumn(int t) {
        return t;
    }

    @Override
    public int sentBits() {
        return sent.length;
    }

    @Override
    public int sentColumn(int p) {
        return sent[p];
    }

    @Override
    public LdpcEncoder newEncoder() {
        return new DualDiagonalEncoder(base, middleRow, infoPosition);
    }
}
