package org.fadebench.coding.fec;

import java.io.Serializable;
import java.util.Objects;

/**
 * What a link does to its payload before modulation: append a CRC, then encode with a channel code
 * (tail and puncturing included). Answers the sizes the link needs; {@link #newCodec} gives the
 * per-thread worker that does it.
 *
 * @param crc  the check appended to each payload
 * @param code the channel code applied to payload and check
 */
public record FecScheme(Crc crc, ChannelCode code) implements Serializable {

    /** No CRC, no channel code. */
    public static final FecScheme NONE = new FecScheme(Crc.NONE, ChannelCode.NONE);

    public FecScheme {
        Objects.requireNonNull(crc, "crc");
        Objects.requireNonNull(code, "code");
    }

    /** Bits entering the channel encoder for a payload of {@code payloadBits}: payload + CRC. */
    public int infoBits(int payloadBits) {
        return payloadBits + crc.bits();
    }

    /** Bits sent for a payload of {@code payloadBits}: CRC, tail and puncturing included. */
    public int codedBits(int payloadBits) {
        return code.codedBits(infoBits(payloadBits));
    }

    /** Payload bits per sent bit, all overheads included (multiply by bits per symbol for spectral efficiency). */
    public double rate(int payloadBits) {
        return (double) payloadBits / codedBits(payloadBits);
    }

    /** The most frames a codec decodes together: a multiple of 16 lanes, which vectorises well. */
    public static final int MAX_LANES = 128;

    /** Bytes of decoder rows (soft inputs and decisions) allowed per codec when choosing lanes. */
    static final long LANE_BUDGET_BYTES = 32L << 20;

    /**
     * How many frames of {@code payloadBits} a link's codec should decode together: {@link #MAX_LANES},
     * fewer for long frames so that the decoder's rows stay within {@value #LANE_BUDGET_BYTES}
     * bytes (a multiple of 16 where possible), 1 for schemes without a convolutional code.
     */
    public int decodeLanes(int payloadBits) {
        if (!code.isCoded()) {
            return 1;
        }
        ConvolutionalCode mother = code.puncturer().code();
        long bytesPerLane = 4L * mother.steps(infoBits(payloadBits))
                * (mother.outputs() + (mother.states() + 31) / 32);
        long lanes = Math.min(MAX_LANES, Math.max(1, LANE_BUDGET_BYTES / bytesPerLane));
        return (int) (lanes >= 16 ? lanes / 16 * 16 : lanes);
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
        return "crc " + crc.cliName() + ", code " + code.cliName();
    }
}
