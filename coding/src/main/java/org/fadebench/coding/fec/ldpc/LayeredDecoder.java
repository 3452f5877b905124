package org.fadebench.coding.fec.ldpc;

import org.fadebench.coding.fec.Lanes;

/**
 * What the layered LDPC decoders share: the decoding settings, each lane's outcome of the last
 * decode and the argument checks.
 */
abstract class LayeredDecoder implements LdpcDecoder {

    final LdpcDecoding decoding;
    final int lanes;
    final int columns;
    final int[] iterations;
    final boolean[] satisfied;
    int decodedLanes;

    LayeredDecoder(int columns, LdpcDecoding decoding, int lanes) {
        checkLanes(lanes);
        this.decoding = decoding;
        this.lanes = lanes;
        this.columns = columns;
        this.iterations = new int[lanes];
        this.satisfied = new boolean[lanes];
    }

    /** @throws IllegalArgumentException "L lanes; need at least 1" unless lanes ≥ 1 */
    static void checkLanes(int lanes) {
        if (lanes < 1) {
            throw new IllegalArgumentException(lanes + " lanes; need at least 1");
        }
    }

    /** Bytes of the arrays this class allocates (the outcome per lane). */
    static long sharedBytes(int lanes) {
        return Lanes.rowBytes(4L * lanes) + Lanes.rowBytes(lanes);
    }

    @Override
    public final int lanes() {
        return lanes;
    }

    @Override
    public final int bit(int lane, int column) {
        Lanes.checkLane(lane, decodedLanes);
        checkColumn(column);
        return decision(lane, column);
    }

    @Override
    public final int iterations(int lane) {
        Lanes.checkLane(lane, decodedLanes);
        return iterations[lane];
    }

    @Override
    public final boolean satisfied(int lane) {
        Lanes.checkLane(lane, decodedLanes);
        return satisfied[lane];
    }

    /** The hard decision of a checked lane and column. */
    abstract int decision(int lane, int column);

    /**
     * @throws IllegalArgumentException "column C; valid columns are 0 to n−1" unless 0 ≤ column < n
     */
    final void checkColumn(int column) {
        if (column < 0 || column >= columns) {
            throw new IllegalArgumentException("column " + column + "; valid columns are 0 to " + (columns - 1));
        }
    }

    /** @throws IllegalArgumentException naming the lane unless every LLR of the frame is finite */
    final void checkFinite(int lane, double[] llr, int off) {
        for (int j = 0; j < columns; j++) {
            if (!Double.isFinite(llr[off + j])) {
                throw notFinite(lane, j, llr[off + j]);
            }
        }
    }

    /** The error for a channel LLR that is not finite. */
    static IllegalArgumentException notFinite(int lane, int column, double llr) {
        return new IllegalArgumentException("LLR of column " + column + " for lane " + lane + " is " + llr + "; valid: finite");
    }
}
