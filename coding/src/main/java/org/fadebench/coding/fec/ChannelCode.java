package org.fadebench.coding.fec;

import java.io.Serializable;
import org.fadebench.modem.NamedChoice;

/**
 * A channel code: what a link applies to each frame's information bits (payload and CRC) before
 * the interleaver and modulation, and undoes from the received LLRs. An open family: the codes
 * selectable by name are listed in {@link ChannelCodes}; each family (none, convolutional, …)
 * lives in its own class or package. A code is an immutable, serialisable description (a run plan
 * holds it); {@link #newCoder} makes the per-thread worker that owns the buffers.
 *
 * <p>Decoders take frames in lanes: up to {@link #lanes} frames of the same length decoded at
 * once, each frame's result the same as if it were decoded alone (a lane decoder that vectorises
 * over frames gains from many; one that does not asks for one).
 */
public interface ChannelCode extends NamedChoice, Serializable {

    /** The most lanes any code is given: a multiple of 16, which vectorises well. */
    int MAX_LANES = 128;

    /** Bytes of lane memory one coder may hold when its lanes are chosen ({@link #lanesWithin}). */
    long LANE_BUDGET_BYTES = 32L << 20;

    /** Name on the command line, e.g. {@code conv-r34}: lower case, unique in a {@link ChannelCodes} registry. */
    @Override
    String cliName();

    /**
     * How a link's description names the code, with whatever else fixes its numbers (e.g. its
     * decoder's settings); the name by default.
     */
    default String describe() {
        return cliName();
    }

    /** Nominal code rate, without termination (1 for no code). */
    double rate();

    /**
     * The fewest information bits (payload and CRC) per frame this code serves; 1 by default. A
     * code serves every size from this to {@link #maxInfoBits} ({@link FecScheme#checkPayload} holds
     * a link to that), and its other methods may refuse any size outside.
     */
    default int minInfoBits() {
        return 1;
    }

    /** The most information bits (payload and CRC) per frame this code serves; no limit by default. */
    default int maxInfoBits() {
        return Integer.MAX_VALUE;
    }

    /** Bits sent for {@code infoBits} information bits, termination and puncturing included. */
    int codedBits(int infoBits);

    /** Bytes one lane of this code's decoder holds for frames of {@code infoBits}. */
    long bytesPerLane(int infoBits);

    /**
     * Bytes of the buffers a {@link #newCoder coder} for frames of {@code infoBits} in {@code lanes}
     * lanes allocates, for a memory check before a run.
     */
    long coderBytes(int infoBits, int lanes);

    /**
     * How many frames of {@code infoBits} a coder should decode together: by default as many lanes
     * as {@link #lanesWithin} allows for {@link #bytesPerLane}.
     */
    default int lanes(int infoBits) {
        return lanesWithin(bytesPerLane(infoBits));
    }

    /**
     * A worker for frames of {@code infoBits} information bits that encodes one frame at a time and
     * decodes up to {@code lanes} frames at once, owning its buffers (one per thread).
     *
     * @throws IllegalArgumentException if {@code infoBits} or {@code lanes} is below 1
     */
    LaneCoder newCoder(int infoBits, int lanes);

    /**
     * {@link #MAX_LANES}, or fewer so that the lanes hold at most {@link #LANE_BUDGET_BYTES} (a
     * multiple of 16 where possible), at least 1.
     */
    static int lanesWithin(long bytesPerLane) {
        long lanes = Math.min(MAX_LANES, Math.max(1, LANE_BUDGET_BYTES / bytesPerLane));
        return (int) (lanes >= 16 ? lanes / 16 * 16 : lanes);
    }
}
