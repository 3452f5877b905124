package org.fadebench.coding.fec;

/** The bit interleavers selectable by name on the command line. */
public enum Interleaving {
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
        return CliNames.find(values(), Interleaving::cliName, name, "interleaver");
    }

    /** The valid command-line names, comma separated. */
    public static String choices() {
        return CliNames.list(values(), Interleaving::cliName);
    }

    @Override
    public String toString() {
        return cliName;
    }
}
