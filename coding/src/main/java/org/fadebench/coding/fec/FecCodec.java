package org.fadebench.coding.fec;

/**
 * Encodes and decodes frames of a fixed payload size under one {@link FecScheme}: payload → CRC
 * appended → channel code ({@link LaneCoder}) → interleaving, and back from LLRs with
 * deinterleaving, the channel code's lane decoder and the CRC check.
 *
 * <p>Decoding takes frames in batches of up to {@link #lanes()}, which the lane decoder decodes
 * together: {@link #receive} each frame into a lane, {@link #decodeReceived} them, read each with
 * {@link #decided}. {@link #decode(double[], int, byte[], int)} does all three for one frame.
 * Buffers are allocated once; encoding and decoding allocate nothing. Not thread-safe: one
 * instance per thread.
 */
public final class FecCodec {

    private final FecScheme scheme;
    private final int payloadBits;
    private final int infoBits;
    private final int codedBits;
    private final int lanes;
    private final BitInterleaver interleaver;
    private final LaneCoder coder;
    private final byte[] info;
    private final byte[] sent;
    private final double[] received;

    /**
     * Bytes the buffers of a codec for frames of {@code payloadBits} in {@code lanes} lanes take
     * (what the constructor below allocates, with its decoder and interleaver), for a memory check
     * before a run.
     */
    public static long bufferBytes(FecScheme scheme, int payloadBits, int lanes) {
        long info = scheme.infoBits(payloadBits);
        long coded = scheme.codedBits(payloadBits);
        return info + coded + 8 * coded + 4 * coded + scheme.code().coderBytes((int) info, lanes);
    }

    FecCodec(FecScheme scheme, int payloadBits, BitInterleaver interleaver, int lanes) {
        if (payloadBits < 1) {
            throw new IllegalArgumentException("payload of " + payloadBits + " bits; need at least 1");
        }
        if (lanes < 1) {
            throw new IllegalArgumentException(lanes + " lanes; need at least 1");
        }
        this.scheme = scheme;
        this.payloadBits = payloadBits;
        this.infoBits = scheme.infoBits(payloadBits);
        this.codedBits = scheme.codedBits(payloadBits);
        this.lanes = lanes;
        if (interleaver.length() != codedBits) {
            throw new IllegalArgumentException("interleaver of " + interleaver.length() + " bits does not fit the "
                    + codedBits + " coded bits of " + payloadBits + " payload bits with " + scheme);
        }
        this.interleaver = interleaver;
        this.coder = scheme.code().newCoder(infoBits, lanes);
        this.info = new byte[infoBits];
        this.sent = new byte[codedBits];
        this.received = new double[codedBits];
    }

    public FecScheme scheme() {
        return scheme;
    }

    /** Payload bits per frame. */
    public int payloadBits() {
        return payloadBits;
    }

    /** Bits sent per frame. */
    public int codedBits() {
        return codedBits;
    }

    /** The most frames one {@link #decodeReceived} takes. */
    public int lanes() {
        return lanes;
    }

    /** Encodes {@link #payloadBits()} bits from {@code payload[off ..]} into {@link #codedBits()} at {@code coded[codedOff ..]}. */
    public void encode(byte[] payload, int off, byte[] coded, int codedOff) {
        System.arraycopy(payload, off, info, 0, payloadBits);
        scheme.crc().append(info, 0, payloadBits);
        coder.encode(info, 0, sent, 0);
        interleaver.interleave(sent, 0, coded, codedOff);
    }

    /**
     * Takes one frame's {@link #codedBits()} LLRs from {@code llr[off ..]} (L = ln P(0)/P(1),
     * finite) into a lane of the next {@link #decodeReceived}, deinterleaved.
     */
    public void receive(int lane, double[] llr, int off) {
        Lanes.checkLane(lane, lanes);
        interleaver.deinterleave(llr, off, received, 0);
        coder.load(lane, received, 0);
    }

    /** Decodes the frames received into lanes 0 .. {@code frames} − 1. */
    public void decodeReceived(int frames) {
        coder.decode(frames);
    }

    /** Lanes 0 .. L − 1 that {@link #advance} decodes continuously; 0 if the code decodes in groups only. */
    public int continuousLanes() {
        return coder.continuousLanes();
    }

    /**
     * Continuous decoding ({@link LaneCoder#advance}): starts the lanes received since the last
     * call, decodes until at least one is finished and writes those lanes to {@code finished[0 ..]},
     * whose payloads {@link #decided} then reads.
     *
     * @return how many lanes finished; 0 only when no lane is running
     */
    public int advance(int[] finished) {
        return coder.advance(finished);
    }

    /**
     * Writes the decided payload of a lane of the last {@link #decodeReceived} to
     * {@code payload[outOff ..]}.
     *
     * @return whether the CRC of the decided bits checks (always true without a CRC)
     */
    public boolean decided(int lane, byte[] payload, int outOff) {
        coder.decided(lane, info, 0);
        System.arraycopy(info, 0, payload, outOff, payloadBits);
        return scheme.crc().check(info, 0, infoBits);
    }

    /** The decoder iterations of a lane of the last {@link #decodeReceived}; 0 for a code that does not iterate. */
    public int iterations(int lane) {
        return coder.iterations(lane);
    }

    /**
     * Decodes one frame's {@link #codedBits()} LLRs from {@code llr[off ..]}, writing the decided
     * payload to {@code payload[outOff ..]}: {@link #receive} into lane 0, {@link #decodeReceived},
     * {@link #decided}.
     *
     * @return whether the CRC of the decided bits checks (always true without a CRC)
     */
    public boolean decode(double[] llr, int off, byte[] payload, int outOff) {
        receive(0, llr, off);
        decodeReceived(1);
        return decided(0, payload, outOff);
    }
}
