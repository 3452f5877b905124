package org.fadebench.coding.fec;

/**
 * The per-thread worker of a {@link ChannelCode} for frames of a fixed number of information bits:
 * encodes frames one by one, and decodes them in lanes: {@link #load} each frame's LLRs into a
 * lane, {@link #decode} the lanes loaded, read each lane's decisions with {@link #decided}. All
 * buffers are allocated when the coder is made; encoding and decoding allocate nothing. Not
 * thread-safe.
 */
public interface LaneCoder {

    /**
     * Encodes the information bits at {@code info[off ..]} into the code's
     * {@link ChannelCode#codedBits coded bits} at {@code coded[codedOff ..]}.
     */
    void encode(byte[] info, int off, byte[] coded, int codedOff);

    /**
     * Puts one frame's coded-bit LLRs (L = ln P(0)/P(1), finite), from {@code llr[off ..]} in the
     * order {@link #encode} wrote the bits, into a lane for the next {@link #decode}.
     *
     * @throws IllegalArgumentException if the lane is out of range
     */
    void load(int lane, double[] llr, int off);

    /**
     * Decodes lanes 0 .. {@code frames} − 1, as loaded.
     *
     * @throws IllegalArgumentException if {@code frames} is not from 1 to the coder's lanes
     */
    void decode(int frames);

    /**
     * Copies the decided information bits of a lane of the last {@link #decode}, one per byte, to
     * {@code info[off ..]}.
     */
    void decided(int lane, byte[] info, int off);

    /**
     * The iterations the decoder took on a lane in the last {@link #decode} (at least 1 for a
     * decoder that iterates); 0, the default, for a decoder that does not iterate.
     */
    default int iterations(int lane) {
        return 0;
    }

    /**
     * Lanes 0 .. L − 1 that {@link #advance} decodes continuously (a finished lane takes the next
     * frame while the others go on); 0, the default, for a coder that decodes in groups only.
     */
    default int continuousLanes() {
        return 0;
    }

    /**
     * Continuous decoding: starts the lanes {@link #load loaded} since the last call, decodes the
     * running lanes until at least one is finished and writes those lanes to {@code finished[0 ..]};
     * {@link #decided} and {@link #iterations} then read them until they are loaded again.
     *
     * @return how many lanes finished; 0 only when no lane is running
     * @throws UnsupportedOperationException if {@link #continuousLanes} is 0
     */
    default int advance(int[] finished) {
        throw new UnsupportedOperationException("this coder decodes in groups only");
    }
}
