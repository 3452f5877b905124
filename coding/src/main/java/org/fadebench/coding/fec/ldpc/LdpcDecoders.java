package org.fadebench.coding.fec.ldpc;

/**
 * Makes the LDPC decoders: min-sum and offset min-sum on the fixed-point lane decoders, by block
 * rows ({@link QcDecoder}) for a layout that comes from a lifted base matrix and by rows
 * ({@link FixedPointDecoder}) for any other H (the two give the same results); sum-product always
 * in floating point ({@link FloatingPointDecoder}, which is also the reference for the other two).
 */
public final class LdpcDecoders {

    private LdpcDecoders() {
    }

    /**
     * A decoder of the layout's H by the given settings for up to {@code lanes} frames at once: the
     * block-row kernel if the layout is quasi-cyclic and the algorithm a min-sum, else as
     * {@link #create(ParityCheckMatrix, LdpcDecoding, int)}.
     *
     * @throws IllegalArgumentException "L lanes; need at least 1" if {@code lanes} is below 1
     */
    public static LdpcDecoder create(CodeLayout layout, LdpcDecoding decoding, int lanes) {
        QcStructure qc = blockRows(layout, decoding);
        return qc != null ? new QcDecoder(qc, decoding, lanes) : create(layout.matrix(), decoding, lanes);
    }

    /**
     * Bytes the buffers of {@link #create(CodeLayout, LdpcDecoding, int)}'s decoder take.
     *
     * @throws IllegalArgumentException "L lanes; need at least 1" if {@code lanes} is below 1
     */
    public static long bytes(CodeLayout layout, LdpcDecoding decoding, int lanes) {
        LayeredDecoder.checkLanes(lanes);
        QcStructure qc = blockRows(layout, decoding);
        return qc != null ? QcDecoder.bytes(qc, lanes) : bytes(layout.matrix(), decoding, lanes);
    }

    /** The layout's QC structure if the block-row kernel decodes it, else null. */
    private static QcStructure blockRows(CodeLayout layout, LdpcDecoding decoding) {
        return decoding.algorithm() == LdpcAlgorithm.SUM_PRODUCT ? null : layout.quasiCyclic().orElse(null);
    }

    /**
     * A decoder of H, row by row, by the given settings for up to {@code lanes} frames at once.
     *
     * @throws IllegalArgumentException "L lanes; need at least 1" if {@code lanes} is below 1
     */
    public static LdpcDecoder create(ParityCheckMatrix h, LdpcDecoding decoding, int lanes) {
        return decoding.algorithm() == LdpcAlgorithm.SUM_PRODUCT
                ? new FloatingPointDecoder(h, decoding, lanes)
                : new FixedPointDecoder(h, decoding, lanes);
    }

    /**
     * Bytes the buffers of {@link #create(ParityCheckMatrix, LdpcDecoding, int)}'s decoder take (its arrays with their headers), for a
     * memory check before a run.
     *
     * @throws IllegalArgumentException "L lanes; need at least 1" if {@code lanes} is below 1
     */
    public static long bytes(ParityCheckMatrix h, LdpcDecoding decoding, int lanes) {
        LayeredDecoder.checkLanes(lanes);
        return decoding.algorithm() == LdpcAlgorithm.SUM_PRODUCT
                ? FloatingPointDecoder.bytes(h, lanes)
                : FixedPointDecoder.bytes(h, lanes);
    }
}
