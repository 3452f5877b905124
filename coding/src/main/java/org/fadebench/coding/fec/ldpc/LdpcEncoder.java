package org.fadebench.coding.fec.ldpc;

/**
 * Encodes information bits into a codeword of an LDPC code, in the parity-check matrix's column
 * order (H·c = 0). Allocates nothing per codeword; may hold scratch, so one per thread.
 */
public interface LdpcEncoder {

    /**
     * Encodes the k information bits (one per byte, 0 or 1) at {@code info[off ..]} into the n code
     * bits at {@code word[wordOff ..]}, in H's column order.
     */
    void encode(byte[] info, int off, byte[] word, int wordOff);
}
