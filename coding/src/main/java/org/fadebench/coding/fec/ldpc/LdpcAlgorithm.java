package org.fadebench.coding.fec.ldpc;

import org.fadebench.modem.NamedChoice;

/**
 * How an LDPC decoder computes its check-to-variable messages, all on the layered schedule (each
 * check row updates the posterior LLRs before the next row reads them; D. E. Hocevar, "A reduced
 * complexity decoder architecture via layered decoding of LDPC codes", SiPS 2004).
 */
public enum LdpcAlgorithm implements NamedChoice {
    /**
     * Normalised min-sum: the min-sum magnitude times a factor α in (0, 1] (J. Chen, M. P. C.
     * Fossorier, "Near optimum universal belief propagation based decoding of low-density parity
     * check codes", IEEE Trans. Commun. 50(3), 2002).
     */
    MIN_SUM("min-sum", 0.8125),
    /** Offset min-sum: the min-sum magnitude less an offset β ≥ 0 (LLR units), floored at 0 (Chen and Fossorier 2002). */
    OFFSET_MIN_SUM("offset-min-sum", 0.5),
    /** Sum-product (belief propagation) in floating point: the reference, with no correction. */
    SUM_PRODUCT("sum-product", Double.NaN);

    private final String cliName;
    private final double defaultCorrection;

    LdpcAlgorithm(String cliName, double defaultCorrection) {
        this.cliName = cliName;
        this.defaultCorrection = defaultCorrection;
    }

    @Override
    public String cliName() {
        return cliName;
    }

    /** The factor α or offset β used when none is given; NaN for sum-product, which takes none. */
    public double defaultCorrection() {
        return defaultCorrection;
    }

    /** Whether the algorithm takes a correction (α or β). */
    public boolean corrected() {
        return this != SUM_PRODUCT;
    }
}
