package org.fadebench.coding.fec.conv;

import java.util.Objects;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.LaneCoder;

/**
 * The convolutional family of channel codes: a terminated convolutional code, punctured or not
 * ({@link Puncturer#none} for no puncturing), decoded by the {@link ViterbiDecoder} in lanes.
 *
 * <p>Puncturing patterns of the named codes, rows = outputs (generator 133 first, then 171),
 * columns = trellis steps: rate 2/3 keeps [1 1; 1 0] over 2 steps, rate 3/4 keeps [1 1 0; 1 0 1]
 * over 3 steps, as in the IEEE 802.11a OFDM physical layer, 1999, Sec. 17.3.5.6 (from memory).
 */
public final class PuncturedCode implements ChannelCode {

    private static final long serialVersionUID = 1L;

    /** The 64-state (133, 171) code, rate 1/2. */
    public static final PuncturedCode CONV_R12 = new PuncturedCode("conv-r12",
            Puncturer.none(ConvolutionalCode.K7_133_171));
    /** The 64-state (133, 171) code punctured to rate 2/3. */
    public static final PuncturedCode CONV_R23 = new PuncturedCode("conv-r23",
            new Puncturer(ConvolutionalCode.K7_133_171, new int[][] {{1, 1}, {1, 0}}));
    /** The 64-state (133, 171) code punctured to rate 3/4. */
    public static final PuncturedCode CONV_R34 = new PuncturedCode("conv-r34",
            new Puncturer(ConvolutionalCode.K7_133_171, new int[][] {{1, 1, 0}, {1, 0, 1}}));
    /** The 4-state (5, 7) code, rate 1/2. */
    public static final PuncturedCode CONV_SMALL = new PuncturedCode("conv-small",
            Puncturer.none(ConvolutionalCode.K3_5_7));

    private final String cliName;
    private final Puncturer puncturer;

    public PuncturedCode(String cliName, Puncturer puncturer) {
        this.cliName = Objects.requireNonNull(cliName);
        this.puncturer = Objects.requireNonNull(puncturer);
    }

    @Override
    public String cliName() {
        return cliName;
    }

    /** The puncturer ({@link Puncturer#code()} gives the mother code). */
    public Puncturer puncturer() {
        return puncturer;
    }

    /** Rate of the puncturing pattern without tail: 1/2, 2/3 or 3/4 for the named codes. */
    @Override
    public double rate() {
        return puncturer.rate();
    }

    @Override
    public int codedBits(int infoBits) {
        return puncturer.codedBits(infoBits);
    }

    @Override
    public long bytesPerLane(int infoBits) {
        return ViterbiDecoder.bytesPerLane(puncturer.code(), infoBits);
    }

    /** The mother code's bits and LLRs, and the Viterbi decoder's rows. */
    @Override
    public long coderBytes(int infoBits, int lanes) {
        ConvolutionalCode code = puncturer.code();
        return 9L * code.codedBits(infoBits) + ViterbiDecoder.bufferBytes(code, infoBits, lanes);
    }

    @Override
    public LaneCoder newCoder(int infoBits, int lanes) {
        return new Coder(puncturer, infoBits, lanes);
    }

    @Override
    public String toString() {
        return cliName;
    }

    /** Encoder, puncturer and Viterbi decoder with the mother code's buffers. */
    private static final class Coder implements LaneCoder {

        private final Puncturer puncturer;
        private final ConvolutionalCode code;
        private final int infoBits;
        private final ViterbiDecoder decoder;
        private final byte[] mother;
        private final double[] motherLlr;

        Coder(Puncturer puncturer, int infoBits, int lanes) {
            this.puncturer = puncturer;
            this.code = puncturer.code();
            this.infoBits = infoBits;
            this.decoder = new ViterbiDecoder(code, infoBits, lanes);
            this.mother = new byte[code.codedBits(infoBits)];
            this.motherLlr = new double[mother.length];
        }

        @Override
        public void encode(byte[] info, int off, byte[] coded, int codedOff) {
            code.encode(info, off, infoBits, mother, 0);
            puncturer.puncture(mother, 0, infoBits, coded, codedOff);
        }

        /** Depunctures (zero LLRs where bits were removed) into a lane of the Viterbi decoder. */
        @Override
        public void load(int lane, double[] llr, int off) {
            puncturer.depuncture(llr, off, infoBits, motherLlr, 0);
            decoder.load(lane, motherLlr, 0);
        }

        @Override
        public void decode(int frames) {
            decoder.decode(frames);
        }

        @Override
        public void decided(int lane, byte[] info, int off) {
            decoder.decided(lane, info, off);
        }
    }
}
