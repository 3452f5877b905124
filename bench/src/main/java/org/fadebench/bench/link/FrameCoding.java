package org.fadebench.bench.link;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.fadebench.coding.fec.BitInterleaver;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.modem.LlrMethod;

/**
 * What happens to a frame's bits around the modem: CRC, channel code, bit interleaver, and how
 * the receiver computes its LLRs. {@link #NONE} is the uncoded link with hard decisions.
 *
 * @param interleaverRows rows of the block interleaver (0 unless {@code interleaving} is block)
 */
public record FrameCoding(FecScheme scheme, Interleaving interleaving, int interleaverRows, LlrMethod llr)
        implements Serializable {

    /** Uncoded: no CRC, no code, no interleaver, hard decisions. */
    public static final FrameCoding NONE = new FrameCoding(FecScheme.NONE, Interleaving.NONE, 0, LlrMethod.MAXLOG);

    /** The random interleaver's permutation is a fixed part of the design, the same in every run. */
    public static final long INTERLEAVER_SEED = 0x5EED_1EAFL;

    public FrameCoding {
        Objects.requireNonNull(scheme);
        Objects.requireNonNull(interleaving);
        Objects.requireNonNull(llr);
        if (interleaverRows < 0) {
            throw new IllegalArgumentException("--interleaver-rows must be positive, got " + interleaverRows);
        }
    }

    /** Whether the frame carries a CRC or a channel code (and so is decoded from LLRs). */
    public boolean coded() {
        return scheme.crc() != Crc.NONE || scheme.code() != ChannelCodes.NONE;
    }

    /** Bits sent for a payload, CRC and the channel code's overhead included. */
    public int codedBits(int payloadBits) {
        return coded() ? scheme.codedBits(payloadBits) : payloadBits;
    }

    /**
     * Checks the payload against the channel code and the interleaver against the coded frame; the
     * message names the option and valid sizes.
     */
    void check(int payloadBits) {
        scheme.checkPayload(payloadBits);
        int n = codedBits(payloadBits);
        if (interleaving == Interleaving.BLOCK) {
            if (interleaverRows == 0) {
                throw new IllegalArgumentException("--interleaver block needs --interleaver-rows, a divisor of the "
                        + n + " coded bits per frame, e.g. " + divisors(n));
            }
            if (n % interleaverRows != 0) {
                throw new IllegalArgumentException("--interleaver-rows " + interleaverRows + " does not divide the " + n
                        + " coded bits per frame; valid: a divisor such as " + divisors(n));
            }
        } else if (interleaverRows != 0) {
            throw new IllegalArgumentException("--interleaver-rows goes with --interleaver block only");
        }
        if (!coded() && interleaving != Interleaving.NONE) {
            throw new IllegalArgumentException("--interleaver " + interleaving.cliName()
                    + " needs a coded frame (--fec or --crc); an uncoded link has nothing to interleave");
        }
    }

    /** The interleaver for a payload size (immutable, shared by threads). */
    public BitInterleaver interleaver(int payloadBits) {
        int n = codedBits(payloadBits);
        int rows = interleaving == Interleaving.BLOCK ? interleaverRows : 0;
        return interleaving.create(n, INTERLEAVER_SEED, rows, rows == 0 ? 0 : n / rows);
    }

    private static String divisors(int n) {
        List<String> d = new ArrayList<>();
        for (int r = 2; r * r <= n && d.size() < 6; r++) {
            if (n % r == 0) {
                d.add(Integer.toString(r));
            }
        }
        return d.isEmpty() ? "1 or " + n + " (the length is prime)" : String.join(", ", d);
    }

    /**
     * One line for tables, e.g. "conv-r12 + crc16, random interleaver, maxlog LLRs": the channel code
     * and the CRC, each only when there is one ("conv-r12, …" without a CRC, "crc16, …" without a code).
     */
    public String describe() {
        if (!coded()) {
            return "uncoded";
        }
        String code = scheme.code() == ChannelCodes.NONE ? "" : scheme.code().describe();
        String crc = scheme.crc() == Crc.NONE ? "" : scheme.crc().cliName();
        String both = code.isEmpty() || crc.isEmpty() ? code + crc : code + " + " + crc;
        return both + ", " + interleaving.cliName()
                + " interleaver" + (interleaving == Interleaving.BLOCK ? " (" + interleaverRows + " rows)" : "")
                + ", " + llr.cliName() + " LLRs";
    }
}
