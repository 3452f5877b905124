package org.fadebench.coding.fec.ldpc;

/**
 * Decodes frames of one LDPC code (a {@link ParityCheckMatrix} H of n columns) in lanes: up to
 * {@link #lanes()} frames at once, each frame's result the same as if it were decoded alone.
 * {@link #load} each frame's n channel LLRs (L = ln P(0)/P(1), in H's column order; 0 for a
 * punctured bit), {@link #decode} the lanes loaded, read each lane's hard decisions with
 * {@link #bit}, its iterations with {@link #iterations} and whether every check holds with
 * {@link #satisfied}. Buffers are allocated when the decoder is made; decoding allocates nothing.
 * Not thread-safe: one per thread.
 *
 * <p>A decoder may also decode continuously ({@link #continuousLanes} above 0): a lane whose frame
 * is finished takes the next frame while the others go on, so a frame that needs every iteration
 * does not hold up the frames decoded with it. Each frame's result is still the one it would have
 * alone.
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

    /** Lanes 0 .. L − 1 that {@link #advance} decodes continuously; 0 if this decoder decodes only in groups. */
    default int continuousLanes() {
        return 0;
    }

    /**
     * Continuous decoding: starts the lanes {@link #load loaded} since the last call, then decodes
     * the running lanes until at least one is finished, and writes the finished lanes to
     * {@code finished[0 ..]}. Their results ({@link #bit}, {@link #iterations}, {@link #satisfied})
     * hold until they are loaded again.
     *
     * @return how many lanes finished; 0 only when no lane is running
     * @throws UnsupportedOperationException if {@link #continuousLanes} is 0
     */
    default int advance(int[] finished) {
        throw new UnsupportedOperationException("this decoder decodes in groups only");
    }
}
