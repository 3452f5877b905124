package org.fadebench.coding.fec.ldpc;

/**
 * How a parity-check matrix H comes from a lifted {@link QcBaseMatrix}: row i·Z + z of H is row z of
 * block row i (the rows in the expanded order), and column c of H is lifted column
 * {@link #position}(c) (block position / Z, offset position mod Z). Lifted columns that no column of
 * H maps to were shortened (removed: known zeros). Lets a decoder work on the Z rows of a block
 * row at once ({@link QcDecoder}). Immutable.
 */
public final class QcStructure {

    private final QcBaseMatrix base;
    private final int[] position;

    /**
     * @param position lifted column of each column of H, distinct, each below base columns · Z; copied
     */
    QcStructure(QcBaseMatrix base, int[] position) {
        int lifted = base.baseColumns() * base.lifting();
        boolean[] seen = new boolean[lifted];
        for (int c = 0; c < position.length; c++) {
            int p = position[c];
            if (p < 0 || p >= lifted || seen[p]) {
                throw new IllegalArgumentException("column " + c + " at lifted position " + p
                        + "; valid: distinct positions from 0 to " + (lifted - 1));
            }
            seen[p] = true;
        }
        this.base = base;
        this.position = position.clone();
    }

    /** H is the expanded base matrix itself: every column at its own position. */
    static QcStructure whole(QcBaseMatrix base) {
        int[] position = new int[base.baseColumns() * base.lifting()];
        for (int c = 0; c < position.length; c++) {
            position[c] = c;
        }
        return new QcStructure(base, position);
    }

    public QcBaseMatrix base() {
        return base;
    }

    /** Columns of H. */
    public int columns() {
        return position.length;
    }

    /** The lifted column of column {@code c} of H. */
    public int position(int c) {
        return position[c];
    }
}
