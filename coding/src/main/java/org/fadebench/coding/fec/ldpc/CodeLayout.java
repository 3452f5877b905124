package org.fadebench.coding.fec.ldpc;

import java.util.Optional;

/**
 * One LDPC code at one information size as a link sends it: the parity-check matrix the decoder
 * works on (shortened columns already removed: their bits are known zeros, never sent), which of
 * its columns carry the information bits, and which columns are sent and in what order (columns
 * not sent are punctured: the decoder starts them at LLR 0). Immutable, shared by threads;
 * {@link #newEncoder} gives each thread its encoder.
 */
public interface CodeLayout {

    /** The parity-check matrix H the decoder uses, n = {@code matrix().columns()}. */
    ParityCheckMatrix matrix();

    /**
     * How {@link #matrix()} comes from a lifted base matrix, if it does: the decoder then works on
     * whole block rows at once ({@link LdpcDecoders#create}). Empty by default.
     */
    default Optional<QcStructure> quasiCyclic() {
        return Optional.empty();
    }

    /** Information bits k per codeword. */
    int infoBits();

    /** Column of H that carries information bit {@code t}, 0 ≤ t < k. */
    int infoColumn(int t);

    /** Bits sent per codeword (n less the punctured). */
    int sentBits();

    /** Column of H sent as bit {@code p} of the frame, 0 ≤ p < {@link #sentBits()}. */
    int sentColumn(int p);

    /** An encoder of this code (one per thread): information bit t goes to column {@link #infoColumn}(t). */
    LdpcEncoder newEncoder();
}
