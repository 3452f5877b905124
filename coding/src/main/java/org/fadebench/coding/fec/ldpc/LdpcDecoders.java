package org.fadebench.coding.fec.ldpc;

/**
 * Makes the LDPC decoders: min-sum and offset min-sum on the fixed-point lane decoder
 * ({@link FixedPointDecoder}), sum-product always in floating point ({@link FloatingPointDecoder},
 * which is also the reference for the other two).
 */
public final class LdpcDecoders {

    private LdpcDecoders() {
    }

    /**
     * A decoder of H by the given settings for up to {@code lanes} frames at once.
     *
     * @throws IllegalArgumentException "L lanes; need at least 1" if {@code lanes} is below 1
     */
    public static LdpcDecoder create(ParityCheckMatrix h, LdpcDecoding decoding, int lanes) {
        return decoding.algorithm() == LdpcAlgorithm.SUM_PRODUCT
                ? new FloatingPointDecoder(h, decoding, lanes)
                : new FixedPointDecoder(h, decoding, lanes);
    }

    /**
     * Bytes the buffers of {@link #create}'s decoder take (its arrays with their headers), for a
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
