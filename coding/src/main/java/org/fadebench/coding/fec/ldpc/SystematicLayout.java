package org.fadebench.coding.fec.ldpc;

import java.io.Serializable;

/**
 * The layout of a code given by its whole parity-check matrix (a user's file): every column sent,
 * in column order, nothing shortened or punctured; the information size is fixed at
 * k = n − rank(H), carried by the information set of the {@link SystematicEncoder}. Immutable and
 * serialisable; the encoder (Gaussian elimination of H) is derived once here, and again for each
 * thread's {@link #newEncoder}.
 */
public final class SystematicLayout implements CodeLayout, Serializable {

    private static final long serialVersionUID = 1L;

    private final ParityCheckMatrix matrix;
    private final int[] infoColumns;
    private final long encoderBytes;

    /**
     * @throws IllegalArgumentException if H has full column rank or is too large for GF(2) elimination
     */
    public SystematicLayout(ParityCheckMatrix matrix) {
        SystematicEncoder encoder = new SystematicEncoder(matrix);
        int k = encoder.informationBits();
        int rank = matrix.columns() - k;
        this.matrix = matrix;
        this.infoColumns = java.util.Arrays.copyOf(encoder.columnOrder(), k);
        // the encoder's packed parity rows (rank rows of k bits), its packed information and its column lists
        this.encoderBytes = rank * (16L + 8L * ((k + 63) / 64)) + 16L + 8L * ((k + 63) / 64) + 4L * matrix.columns() + 48;
    }

    @Override
    public ParityCheckMatrix matrix() {
        return matrix;
    }

    @Override
    public int infoBits() {
        return infoColumns.length;
    }

    @Override
    public int infoColumn(int t) {
        return infoColumns[t];
    }

    @Override
    public int sentBits() {
        return matrix.columns();
    }

    @Override
    public int sentColumn(int p) {
        return p;
    }

    @Override
    public LdpcEncoder newEncoder() {
        return new SystematicEncoder(matrix);
    }

    /** Bytes an encoder of {@link #newEncoder} holds, for a memory check before a run. */
    public long encoderBytes() {
        return encoderBytes;
    }
}
