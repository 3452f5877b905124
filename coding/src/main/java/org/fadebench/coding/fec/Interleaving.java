package org.fadebench.coding.fec;

import org.fadebench.modem.NamedChoice;

/** The bit interleavers selectable by name on the command line. */
public enum Interleaving implements NamedChoice {
    /** A seeded pseudo-random permutation ({@link BitInterleaver#random}). */
    RANDOM("random"),
    /** Row–column block interleaving ({@link BitInterleaver#block}). */
    BLOCK("block"),
    /** No interleaving. */
    NONE("none");

    private final String cliName;

    Interleaving(String cliName) {
        this.cliName = cliName;
    }

    /** Name on the command line, e.g. {@code random}. */
    @Override
    public String cliName() {
        return cliName;
    }

    /**
     * The interleaver of this kind for a frame of {@code length} coded bits. {@code seed} is used
     * only by {@link #RANDOM}, {@code rows} and {@code cols} only by {@link #BLOCK}.
     *
     * @throws IllegalArgumentException if the sizes do not fit
     */
    public BitInterleaver create(int length, long seed, int rows, int cols) {
        switch (this) {
            case RANDOM:
                return BitInterleaver.random(length, seed);
            case BLOCK:
                return BitInterleaver.block(rows, cols, length);
            case NONE:
                return BitInterleaver.identity(length);
            default:
                throw new AssertionError(this);
        }
    }

    /**
     * Looks an interleaver up by its command-line name, ignoring case.
     *
     * @throws IllegalArgumentException naming the valid choices when the name is unknown
     */
    public static Interleaving fromCliName(String name) {
        return NamedChoice.find(values(), name, "interleaver");
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
