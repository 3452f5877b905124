package org.fadebench.coding.fec;

import java.io.Serializable;
import java.util.Objects;

/**
 * What a link does to its payload before modulation: append a CRC, then encode with a channel code
 * (termination and puncturing included). Answers the sizes the link needs; {@link #newCodec} gives
 * the per-thread worker that does it.
 *
 * @param crc  the check appended to each payload
 * @param code the channel code applied to payload and check
 */
public record FecScheme(Crc crc, ChannelCode code) implements Serializable {

    /** No CRC, no channel code. */
    public static final FecScheme NONE = new FecScheme(Crc.NONE, ChannelCodes.NONE);

    public FecScheme {
        Objects.requireNonNull(crc, "crc");
        Objects.requireNonNull(code, "code");
    }

    /** Bits entering the channel encoder for a payload of {@code payloadBits}: payload + CRC. */
    public int infoBits(int payloadBits) {
        return payloadBits + crc.bits();
    }

    /**
     * Checks that the channel code serves a payload of {@code payloadBits} with this CRC (see
     * {@link ChannelCode#minInfoBits}).
     *
     * @throws IllegalArgumentException "--frame-bits P: ...; valid: ..." naming the payloads it serves
     */
    public void checkPayload(int payloadBits) {
        long info = (long) payloadBits + crc.bits();
        if (info >= code.minInfoBits() && info <= code.maxInfoBits()) {
            return;
        }
        long low = Math.max(1, (long) code.minInfoBits() - crc.bits());
        long high = (long) code.maxInfoBits() - crc.bits();
        String withCrc = crc.bits() == 0 ? "" : " with " + crc.cliName();
        String sizes = code.minInfoBits() == code.maxInfoBits() ? "exactly " + code.minInfoBits()
                : code.minInfoBits() + " to " + code.maxInfoBits();
        String valid = high < low ? "no payload" + withCrc + " fits; use a shorter --crc"
                : "--frame-bits " + (low == high ? Long.toString(low) : low + " to " + high) + withCrc;
        throw new IllegalArgumentException("--frame-bits " + payloadBits + withCrc + ": channel code " + code.cliName()
                + " carries " + sizes + " information bits per frame (payload and CRC); valid: " + valid);
    }

    /**
     * The payload nearest to {@code wanted} that the channel code serves with this CRC (at least 1):
     * the frame length of a link that sets none.
     */
    public int payloadNear(int wanted) {
        long low = Math.max(1, (long) code.minInfoBits() - crc.bits());
        long high = Math.max(low, (long) code.maxInfoBits() - crc.bits());
        return (int) Math.max(low, Math.min(high, wanted));
    }

    /** Bits sent for a payload of {@code payloadBits}: CRC, tail and puncturing included. */
    public int codedBits(int payloadBits) {
        return code.codedBits(infoBits(payloadBits));
    }

    /** Payload bits per sent bit, all overheads included (multiply by bits per symbol for spectral efficiency). */
    public double rate(int payloadBits) {
        return (double) payloadBits / codedBits(payloadBits);
    }

    /**
     * How many frames of {@code payloadBits} a link's codec should decode together: the channel
     * code's {@link ChannelCode#lanes lanes} for the payload and CRC.
     */
    public int lanes(int payloadBits) {
        return code.lanes(infoBits(payloadBits));
    }

    /**
     * A worker for frames of {@code payloadBits}, decoding one frame at a time, owning its buffers
     * (one per thread).
     *
     * @param interleaver a permutation of {@link #codedBits(int) codedBits(payloadBits)} bits
     * @throws IllegalArgumentException if the payload is empty or the interleaver has another length
     */
    public FecCodec newCodec(int payloadBits, BitInterleaver interleaver) {
        return newCodec(payloadBits, interleaver, 1);
    }

    /**
     * A worker for frames of {@code payloadBits} that decodes up to {@code lanes} frames at once
     * (see {@link FecCodec}), owning its buffers (one per thread).
     *
     * @throws IllegalArgumentException if the payload is empty, the interleaver has another length
     *                                  or {@code lanes} is below 1
     */
    public FecCodec newCodec(int payloadBits, BitInterleaver interleaver, int lanes) {
        return new FecCodec(this, payloadBits, interleaver, lanes);
    }

    @Override
    public String toString() {
        return "crc " + crc.cliName() + ", code " + code.describe();
    }
}
