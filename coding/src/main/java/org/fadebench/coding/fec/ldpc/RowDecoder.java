package org.fadebench.coding.fec.ldpc;

import org.fadebench.coding.fec.Lanes;

/**
 * What the decoders that work row by row on any H share: H by rows as edges (edge e of row i is one
 * of {@code rowStart[i] .. rowStart[i + 1] − 1}, on column {@code edgeColumn[e]}).
 */
abstract class RowDecoder extends LayeredDecoder {

    final int rows;
    final int[] rowStart;
    final int[] edgeColumn;

    RowDecoder(ParityCheckMatrix h, LdpcDecoding decoding, int lanes) {
        super(h.columns(), decoding, lanes);
        this.rows = h.rows();
        this.rowStart = new int[rows + 1];
        this.edgeColumn = new int[h.edges()];
        for (int i = 0, e = 0; i < rows; i++) {
            for (int p = 0; p < h.rowDegree(i); p++) {
                edgeColumn[e++] = h.rowEntry(i, p);
            }
            rowStart[i + 1] = e;
        }
    }

    /** Bytes of the arrays this class and {@link LayeredDecoder} allocate (the edges by row and the outcome per lane). */
    static long sharedBytes(ParityCheckMatrix h, int lanes) {
        return Lanes.rowBytes(4L * (h.rows() + 1)) + Lanes.rowBytes(4L * h.edges()) + LayeredDecoder.sharedBytes(lanes);
    }

    /** Bytes of an array of {@code count} rows of {@code rowPayload} bytes each, with its headers. */
    static long tableBytes(long count, long rowPayload) {
        return Lanes.rowBytes(4L * count) + count * Lanes.rowBytes(rowPayload);
    }

    /** The largest row degree of H. */
    static int largestRowDegree(ParityCheckMatrix h) {
        int most = 0;
        for (int i = 0; i < h.rows(); i++) {
            most = Math.max(most, h.rowDegree(i));
        }
        return most;
    }
}
