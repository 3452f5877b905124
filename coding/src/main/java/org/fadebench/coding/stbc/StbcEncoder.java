package org.fadebench.coding.stbc;

/** Maps symbols to the transmit grid, block by block. Implementations do not allocate. */
@FunctionalInterface
public interface StbcEncoder {

    /**
     * Encodes {@code blocks} consecutive code blocks: K symbols each, read (interleaved complex)
     * from symbol index {@code symOffset}, written as T x Mt rows of {@code grid} from row
     * {@code gridRow}.
     */
    void encode(double[] symbols, int symOffset, int blocks, double[] grid, int gridRow);
}
