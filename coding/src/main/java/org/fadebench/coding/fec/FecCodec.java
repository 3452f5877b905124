package org.fadebench.coding.fec;

/**
 * Encodes and decodes frames of a fixed payload size under one {@link FecScheme}: payload → CRC
 * appended → convolutional encoding with zero tail → puncturing → interleaving, and back from LLRs
 * with deinterleaving, depuncturing (zero LLRs), Viterbi decoding and the CRC check. Uncoded
 * schemes decide each bit from the sign of its LLR. Buffers are allocated once; encoding and
 * decoding allocate nothing. Not thread-safe: one instance per thread.
 */
public final class FecCodec {

    private final FecScheme scheme;
    private final int payloadBits;
    private final int infoBits;
    private final int codedBits;
    private final BitInterleaver interleaver;
    private final Puncturer puncturer;
    private final ViterbiDecoder decoder;
    private final byte[] info;
    private final byte[] mother;
    private final byte[] sent;
    private final double[] received;
    private final double[] motherLlr;

    FecCodec(FecScheme scheme, int payloadBits, BitInterleaver interleaver) {
        if (payloadBits < 1) {
            throw new IllegalArgumentException("payload of " + payloadBits + " bits; need at least 1");
        }
        this.scheme = scheme;
        this.payloadBits = payloadBits;
        this.infoBits = scheme.infoBits(payloadBits);
        this.codedBits = scheme.codedBits(payloadBits);
        if (interleaver.length() != codedBits) {
            throw new IllegalArgumentException("interleaver of " + interleaver.length() + " bits does not fit the "
                    + codedBits + " coded bits of " + payloadBits + " payload bits with " + scheme);
        }
        this.interleaver = interleaver;
        this.info = new byte[infoBits];
        this.sent = new byte[codedBits];
        this.received = new double[codedBits];
        if (scheme.code().isCoded()) {
            this.puncturer = scheme.code().puncturer();
            ConvolutionalCode code = puncturer.code();
            this.decoder = new ViterbiDecoder(code, infoBits);
            this.mother = new byte[code.codedBits(infoBits)];
            this.motherLlr = new double[mother.length];
        } else {
            this.puncturer = null;
            this.decoder = null;
            this.mother = null;
            this.motherLlr = null;
        }
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

    /** Encodes {@link #payloadBits()} bits from {@code payload[off ..]} into {@link #codedBits()} at {@code coded[codedOff ..]}. */
    public void encode(byte[] payload, int off, byte[] coded, int codedOff) {
        System.arraycopy(payload, off, info, 0, payloadBits);
        scheme.crc().append(info, 0, payloadBits);
        if (puncturer == null) {
            System.arraycopy(info, 0, sent, 0, infoBits);
        } else {
            puncturer.code().encode(info, 0, infoBits, mother, 0);
            puncturer.puncture(mother, 0, infoBits, sent, 0);
        }
        interleaver.interleave(sent, 0, coded, codedOff);
    }

    /**
     * Decodes {@link #codedBits()} LLRs from {@code llr[off ..]} (L = ln P(0)/P(1)), writing the
     * decided payload to {@code payload[outOff ..]}.
     *
     * @return whether the CRC of the decided bits checks (always true without a CRC)
     */
    public boolean decode(double[] llr, int off, byte[] payload, int outOff) {
        interleaver.deinterleave(llr, off, received, 0);
        if (puncturer == null) {
            for (int i = 0; i < infoBits; i++) {
                info[i] = (byte) (received[i] < 0 ? 1 : 0);
            }
        } else {
            puncturer.depuncture(received, 0, infoBits, motherLlr, 0);
            decoder.decode(motherLlr, 0, infoBits, info, 0);
        }
        System.arraycopy(info, 0, payload, outOff, payloadBits);
        return scheme.crc().check(info, 0, infoBits);
    }
}
