package org.fadebench.bench.link;

import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.fec.ldpc.ParityCheckMatrix;
import org.fadebench.coding.fec.ldpc.QcBaseMatrix;

/**
 * A small rate-1/2 quasi-cyclic LDPC code of our own for link and command-line tests: base matrix
 * 4 x 8, lifting 24, so n = 192 and k = 96. Information block columns of degree 3 and 4; a
 * dual-diagonal parity part whose first column has weight 3 (shifts 1, 0, 1: the block rows sum to
 * the identity on it, so the parity part is invertible and k = n − 96). The shifts were drawn once
 * by a seeded search that refused every shift closing a 4-cycle (the tests check that).
 */
public final class LdpcTestCode {

    public static final QcBaseMatrix BASE = new QcBaseMatrix(new int[][] {
        {6, 1, 0, -1, 1, 0, -1, -1},
        {0, 5, -1, 4, 0, 0, 0, -1},
        {16, -1, 1, 22, -1, -1, 0, 0},
        {23, 7, 21, 11, 1, -1, -1, 0},
    }, 24);

    /** Information bits per codeword. */
    public static final int K = 96;

    private LdpcTestCode() {
    }

    /** The code as a user's file would give it, decoded as {@code decoding} says. */
    public static LdpcCode code(LdpcDecoding decoding) {
        return LdpcCode.ofMatrix("test-192.mtx", BASE.expand(), decoding);
    }

    /** The matrix in the Matrix Market coordinate format (pattern field), as a user's file holds it. */
    public static String matrixMarket() {
        ParityCheckMatrix h = BASE.expand();
        StringBuilder t = new StringBuilder("%%MatrixMarket matrix coordinate pattern general\n");
        t.append(h.rows()).append(' ').append(h.columns()).append(' ').append(h.edges()).append('\n');
        for (int i = 0; i < h.rows(); i++) {
            for (int p = 0; p < h.rowDegree(i); p++) {
                t.append(i + 1).append(' ').append(h.rowEntry(i, p) + 1).append('\n');
            }
        }
        return t.toString();
    }
}
