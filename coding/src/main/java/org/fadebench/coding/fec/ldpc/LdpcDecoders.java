package org.fadebench.coding.fec.ldpc;

import java.util.Optional;

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
        Optional<QcStructure> qc = layout.quasiCyclic();
        return qc.isPresent() && decoding.algorithm() != LdpcAlgorithm.SUM_PRODUCT
                ? new QcDecoder(qc.get(), decoding, lanes)
                : create(layout.matrix(), decoding, lanes);
    }

    /**
     * Bytes the buffers of {@link #create(CodeLayout, LdpcDecoding, int)}'s decoder take.
     *
     * @throws IllegalArgumentException "L lanes; need at least 1" if {@code lanes} is below 1
     */
    public static long bytes(CodeLayout layout, LdpcDecoding decoding, int lanes) {
        LayeredDecoder.checkLanes(lanes);
        Optional<QcStructure> qc = layout.quasiCyclic();
        return qc.isPresent() && decoding.algorithm() != LdpcAlgorithm.SUM_PRODUCT
                ? QcDecoder.bytes(qc.get(), lanes)
                : bytes(layout.matrix(), decoding, lanes);
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
