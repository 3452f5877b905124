package org.fadebench.coding.fec.ldpc;

/**
 * Decodes frames of one LDPC code (a {@link ParityCheckMatrix} H of n columns) in lanes: up to
 * {@link #lanes()} frames at once, each frame's result the same as if it were decoded alone.
 * {@link #load} each frame's n channel LLRs (L = ln P(0)/P(1), in H's column order; 0 for a
 * punctured bit), {@link #decode} the lanes loaded, read each lane's hard decisions with
 * {@link #bit}, its iterations with {@link #iterations} and whether every check holds with
 * {@link #satisfied}. Buffers are allocated when the decoder is made; decoding allocates nothing.
 * Not thread-safe: one per thread.
 */
public interface LdpcDecoder {

    /** The most frames one {@link #decode} takes. */
    int lanes();

    /** Puts one frame's {@code n} channel LLRs from {@code llr[off ..]} into {@code lane}. */
    void load(int lane, double[] llr, int off);

    /** Decodes lanes 0 .. {@code frames} − 1, as loaded. */
    void decode(int frames);

    /** The hard decision (0 or 1) on column {@code column} of a lane after the last {@link #decode}. */
    int bit(int lane, int column);

    /** Iterations the lane took in the last {@link #decode} (1 to the most allowed). */
    int iterations(int lane);

    /** Whether the lane's hard decisions satisfy every check of H after the last {@link #decode}. */
    boolean satisfied(int lane);
}
