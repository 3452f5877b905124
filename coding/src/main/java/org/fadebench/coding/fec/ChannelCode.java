package org.fadebench.coding.fec;

import org.fadebench.modem.NamedChoice;

/**
 * The channel codes selectable by name on the command line: none, or a terminated convolutional
 * code, punctured or not.
 *
 * <p>Puncturing patterns, rows = outputs (generator 133 first, then 171), columns = trellis steps:
 * rate 2/3 keeps [1 1; 1 0] over 2 steps, rate 3/4 keeps [1 1 0; 1 0 1] over 3 steps, as in the
 * IEEE 802.11a OFDM physical layer, 1999, Sec. 17.3.5.6 (from memory).
 */
public enum ChannelCode implements NamedChoice {
    /** Uncoded: the information bits are sent as they are. */
    NONE("none", null),
    /** The 64-state (133, 171) code, rate 1/2. */
    CONV_R12("conv-r12", Puncturer.none(ConvolutionalCode.K7_133_171)),
    /** The 64-state (133, 171) code punctured to rate 2/3. */
    CONV_R23("conv-r23", new Puncturer(ConvolutionalCode.K7_133_171, new int[][] {{1, 1}, {1, 0}})),
    /** The 64-state (133, 171) code punctured to rate 3/4. */
    CONV_R34("conv-r34", new Puncturer(ConvolutionalCode.K7_133_171, new int[][] {{1, 1, 0}, {1, 0, 1}})),
    /** The 4-state (5, 7) code, rate 1/2. */
    CONV_SMALL("conv-small", Puncturer.none(ConvolutionalCode.K3_5_7));

    private final String cliName;
    private final Puncturer puncturer;

    ChannelCode(String cliName, Puncturer puncturer) {
        this.cliName = cliName;
        this.puncturer = puncturer;
    }

    /** Name on the command line, e.g. {@code conv-r34}. */
    @Override
    public String cliName() {
        return cliName;
    }

    /** Whether this is a convolutional code (false only for {@link #NONE}). */
    public boolean isCoded() {
        return puncturer != null;
    }

    /**
     * The punctured convolutional code ({@link Puncturer#code()} gives the mother code).
     *
     * @throws IllegalStateException for {@link #NONE}
     */
    public Puncturer puncturer() {
        if (puncturer == null) {
            throw new IllegalStateException("channel code 'none' has no convolutional code");
        }
        return puncturer;
    }

    /** Nominal code rate without tail: 1, 1/2, 2/3 or 3/4. */
    public double rate() {
        return puncturer == null ? 1.0 : puncturer.rate();
    }

    /** Bits sent for {@code k} information bits, tail and puncturing included. */
    public int codedBits(int infoBits) {
        return puncturer == null ? infoBits : puncturer.codedBits(infoBits);
    }

    /**
     * Looks a channel code up by its command-line name, ignoring case.
     *
     * @throws IllegalArgumentException naming the valid choices when the name is unknown
     */
    public static ChannelCode fromCliName(String name) {
        return NamedChoice.find(values(), name, "channel code");
    }

    /** The valid command-line names, comma separated. */
    public static String choices() {
        return NamedChoice.list(values());
    }

    @Override
    public String toString() {
        return cliName;
    }
}
