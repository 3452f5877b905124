package org.fadebench.coding.fec.ldpc;

import java.io.Serializable;
import java.math.BigDecimal;
import java.util.Objects;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.LaneCoder;
import org.fadebench.coding.fec.Lanes;

/**
 * An LDPC code as a {@link ChannelCode}: where its layouts come from (a {@link Source}: a member of
 * the built-in family, or a user's parity-check matrix) and how its frames are decoded
 * ({@link LdpcDecoding}). Immutable and serialisable. A frame of k information bits is coded by the
 * source's {@link CodeLayout} for k: the encoder's codeword, of which the sent columns go out in
 * order; the receiver puts each sent bit's LLR into its column of H (0 for punctured columns), the
 * decoder decodes up to 128 frames at once, one per lane, and the information columns' hard
 * decisions are the decided bits.
 */
public final class LdpcCode implements ChannelCode {

    private static final long serialVersionUID = 1L;

    /**
     * Where an LDPC code's layouts come from: one per information size from {@link #minInfoBits} to
     * {@link #maxInfoBits}. Immutable and serialisable.
     */
    public interface Source extends Serializable {

        /** Name on the command line and in files, e.g. {@code ldpc-r12}, or the name of the user's file. */
        String name();

        /** How a link's description names the code (its name, and what it is where that is not plain). */
        String describe();

        /** Nominal code rate k/n. */
        double rate();

        /** The fewest information bits per codeword served. */
        int minInfoBits();

        /** The most information bits per codeword served. */
        int maxInfoBits();

        /** The layout for {@code infoBits} information bits, within the sizes served. */
        CodeLayout layout(int infoBits);

        /** Bytes an encoder of {@link #layout}({@code infoBits}) holds, for a memory check before a run. */
        long encoderBytes(int infoBits);
    }

    private final Source source;
    private final LdpcDecoding decoding;
    /** The last layout asked for: a run asks for one size over and over. */
    private transient volatile CodeLayout last;

    public LdpcCode(Source source, LdpcDecoding decoding) {
        this.source = Objects.requireNonNull(source, "source");
        this.decoding = Objects.requireNonNull(decoding, "decoding");
    }

    /**
     * The code of a user's parity-check matrix: every column sent, k = n − rank(H) information bits
     * ({@link SystematicLayout}).
     *
     * @param name the name the code goes by (its file's name)
     * @throws IllegalArgumentException if H has full column rank or is too large for GF(2) elimination
     */
    public static LdpcCode ofMatrix(String name, ParityCheckMatrix h, LdpcDecoding decoding) {
        SystematicLayout layout = new SystematicLayout(h);
        return ofLayout(name, layout, layout.encoderBytes(), decoding);
    }

    /** The code of one layout, named {@code name}, whose encoder holds {@code encoderBytes}. */
    static LdpcCode ofLayout(String name, CodeLayout layout, long encoderBytes, LdpcDecoding decoding) {
        return new LdpcCode(new OneLayout(name, layout, encoderBytes), decoding);
    }

    /** A member of the built-in family ({@code ldpc-r12} …), decoded as {@code decoding} says. */
    public static LdpcCode of(LdpcFamily family, LdpcDecoding decoding) {
        return new LdpcCode(new FamilySource(family), decoding);
    }

    /** This code decoded another way. */
    public LdpcCode withDecoding(LdpcDecoding other) {
        return new LdpcCode(source, other);
    }

    public Source source() {
        return source;
    }

    public LdpcDecoding decoding() {
        return decoding;
    }

    @Override
    public String cliName() {
        return source.name();
    }

    /**
     * E.g. "ldpc-r12, min-sum decoder (factor 0.8125), at most 50 iterations", with ", no early stop"
     * when that is off.
     */
    @Override
    public String describe() {
        LdpcAlgorithm a = decoding.algorithm();
        String correction = a.corrected() ? " (" + (a == LdpcAlgorithm.MIN_SUM ? "factor " : "offset ")
                + BigDecimal.valueOf(decoding.correction()).stripTrailingZeros().toPlainString() + ")" : "";
        return source.describe() + ", " + a.cliName() + " decoder" + correction + ", at most " + decoding.iterations()
                + " iterations" + (decoding.earlyStop() ? "" : ", no early stop");
    }

    @Override
    public double rate() {
        return source.rate();
    }

    @Override
    public int minInfoBits() {
        return source.minInfoBits();
    }

    @Override
    public int maxInfoBits() {
        return source.maxInfoBits();
    }

    /**
     * The layout for frames of {@code infoBits}.
     *
     * @throws IllegalArgumentException outside the sizes the source serves
     */
    public CodeLayout layout(int infoBits) {
        CodeLayout l = last;
        if (l != null && l.infoBits() == infoBits) {
            return l;
        }
        if (infoBits < source.minInfoBits() || infoBits > source.maxInfoBits()) {
            throw new IllegalArgumentException("channel code " + source.name() + " takes " + (source.minInfoBits() == source.maxInfoBits()
                    ? "exactly " + source.minInfoBits() : source.minInfoBits() + " to " + source.maxInfoBits())
                    + " information bits per frame, not " + infoBits);
        }
        l = source.layout(infoBits);
        last = l;
        return l;
    }

    @Override
    public int codedBits(int infoBits) {
        return layout(infoBits).sentBits();
    }

    /**
     * The row kernel's bytes per lane at {@link ChannelCode#MAX_LANES} lanes, rounded up: the lanes
     * are chosen by it for every LDPC code, so that they, the batches and every result for a seed
     * stay as they were before the block-row kernel (whose lanes hold less: {@link #coderBytes}).
     */
    @Override
    public long bytesPerLane(int infoBits) {
        long all = LdpcDecoders.bytes(layout(infoBits).matrix(), decoding, MAX_LANES);
        return (all + MAX_LANES - 1) / MAX_LANES;
    }

    /** The decoder's buffers, the encoder's, and the coder's own: a codeword, a frame's LLRs in H's order, the column lists. */
    @Override
    public long coderBytes(int infoBits, int lanes) {
        CodeLayout l = layout(infoBits);
        int n = l.matrix().columns();
        return LdpcDecoders.bytes(l, decoding, lanes) + source.encoderBytes(infoBits) + Lanes.rowBytes(n)
                + Lanes.rowBytes(8L * n) + Lanes.rowBytes(4L * l.infoBits())
                + 3 * Lanes.rowBytes(4L * LdpcLaneCoder.sentRuns(l));
    }

    @Override
    public LaneCoder newCoder(int infoBits, int lanes) {
        if (infoBits < 1 || lanes < 1) {
            throw new IllegalArgumentException(infoBits + " bits in " + lanes + " lanes; need at least 1 of each");
        }
        CodeLayout l = layout(infoBits);
        return new LdpcLaneCoder(l, LdpcDecoders.create(l, decoding, lanes));
    }

    @Override
    public String toString() {
        return describe();
    }

    /** A member of the built-in family: a layout for every size from 64 to 8224 information bits. */
    private record FamilySource(LdpcFamily family) implements Source {

        @Override
        public String name() {
            return family.cliName();
        }

        @Override
        public String describe() {
            return family.cliName();
        }

        @Override
        public double rate() {
            return family.rate();
        }

        @Override
        public int minInfoBits() {
            return LdpcFamily.MIN_INFO_BITS;
        }

        @Override
        public int maxInfoBits() {
            return LdpcFamily.MAX_INFO_BITS;
        }

        @Override
        public CodeLayout layout(int infoBits) {
            return family.layout(infoBits);
        }

        /**
         * Its dual-diagonal encoder: the information blocks (below n bytes), the packed blocks (the
         * information blocks and parity block 0 twice, syndrome and parity blocks: below
         * BASE_COLUMNS + 2 runs of 2Z bits and a word), the positions (4k bytes), the block lists.
         */
        @Override
        public long encoderBytes(int infoBits) {
            int z = family.lifting(infoBits);
            int n = z * LdpcFamily.BASE_COLUMNS;
            return Lanes.rowBytes(n) + Lanes.rowBytes(8L * (LdpcFamily.BASE_COLUMNS + 2) * ((2 * z + 63) / 64 + 1))
                    + Lanes.rowBytes(4L * infoBits) + 3 * Lanes.rowBytes(4L * LdpcFamily.BASE_COLUMNS
                    * LdpcFamily.BASE_COLUMNS) + 64;
        }
    }

    /** One layout (a user's matrix: every column sent): one information size. */
    private record OneLayout(String name, CodeLayout layout, long encoderBytes) implements Source {

        @Override
        public String describe() {
            return "LDPC code of " + name + " (n " + layout.sentBits() + ", k " + layout.infoBits() + ")";
        }

        @Override
        public double rate() {
            return (double) layout.infoBits() / layout.sentBits();
        }

        @Override
        public int minInfoBits() {
            return layout.infoBits();
        }

        @Override
        public int maxInfoBits() {
            return layout.infoBits();
        }

        @Override
        public CodeLayout layout(int infoBits) {
            return layout;
        }

        @Override
        public long encoderBytes(int infoBits) {
            return encoderBytes;
        }
    }
}
