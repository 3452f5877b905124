package org.fadebench.coding.stbc;

/**
 * Linear combining at the receiver. After {@link #setChannel} with the channel matrix of a fading
 * block (Nr x Mt, interleaved complex, row-major), {@link #combine} turns received code blocks into
 * symbol estimates on the unit-energy scale, {@code ŝ_k = s_k + w_k}, and a post-combining gain
 * {@code g_k} per symbol such that {@code w_k ~ CN(0, n0 / g_k)}: the symbol's post-combining SNR
 * is {@code g_k / n0}. Implementations own their work buffers and do not allocate after
 * construction.
 */
public interface Combiner {

    /** Takes the channel matrix for the blocks that follow; {@code h} is read, not kept. */
    void setChannel(double[] h);

    /**
     * Combines {@code blocks} code blocks received as T x Nr rows of {@code y} from row
     * {@code yRow}; writes K estimates per block (interleaved complex) and K gains per block, both
     * from symbol index {@code symOffset}.
     */
    void combine(double[] y, int yRow, int blocks, double[] estimates, double[] gain, int symOffset);
}
