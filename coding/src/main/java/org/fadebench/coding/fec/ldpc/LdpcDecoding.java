package org.fadebench.coding.fec.ldpc;

import java.io.Serializable;
import java.util.Objects;

/**
 * How frames of an LDPC code are decoded: the algorithm, the most iterations, whether to stop as
 * soon as the hard decisions satisfy every check, and the algorithm's correction (the normalisation
 * factor α of min-sum, the offset β of offset min-sum; NaN for sum-product). Immutable.
 */
public record LdpcDecoding(LdpcAlgorithm algorithm, int iterations, boolean earlyStop, double correction)
        implements Serializable {

    /** The most iterations accepted. */
    public static final int MAX_ITERATIONS = 1000;

    /** Normalised min-sum, α = 13/16, at most 50 iterations, stopping early. */
    public static final LdpcDecoding DEFAULT = of(LdpcAlgorithm.MIN_SUM, 50);

    /**
     * @throws IllegalArgumentException naming the option and its valid range
     */
    public LdpcDecoding {
        Objects.requireNonNull(algorithm, "algorithm");
        if (iterations < 1 || iterations > MAX_ITERATIONS) {
            throw new IllegalArgumentException("--fec-iterations " + iterations + "; valid: 1 to " + MAX_ITERATIONS);
        }
        switch (algorithm) {
            case MIN_SUM:
                if (!(correction > 0 && correction <= 1)) {
                    throw new IllegalArgumentException("--fec-correction " + correction
                            + " for min-sum; valid: a normalisation factor above 0, at most 1");
                }
                break;
            case OFFSET_MIN_SUM:
                if (!(correction >= 0 && correction <= 8)) {
                    throw new IllegalArgumentException("--fec-correction " + correction
                            + " for offset-min-sum; valid: an offset from 0 to 8 (LLR units)");
                }
                break;
            default:
                if (!Double.isNaN(correction)) {
                    throw new IllegalArgumentException("--fec-correction goes with min-sum or offset-min-sum;"
                            + " sum-product takes none");
                }
        }
    }

    /** The algorithm with its default correction, stopping early. */
    public static LdpcDecoding of(LdpcAlgorithm algorithm, int iterations) {
        return new LdpcDecoding(algorithm, iterations, true, algorithm.defaultCorrection());
    }
}
