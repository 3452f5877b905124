package org.fadebench.modem;

import java.util.Locale;

/**
 * The modulations fadebench carries: BPSK and Gray-labelled square QAM, each with unit average
 * symbol energy. {@link #cliName()} is the name used on the command line and in scenario files.
 */
public enum Modulation implements NamedChoice {
    BPSK("bpsk", 1),
    QPSK("qpsk", 2),
    QAM16("16qam", 4),
    QAM64("64qam", 6),
    QAM256("256qam", 8);

    private final String cliName;
    private final int bitsPerSymbol;

    Modulation(String cliName, int bitsPerSymbol) {
        this.cliName = cliName;
        this.bitsPerSymbol = bitsPerSymbol;
    }

    /** Name on the command line, e.g. {@code 16qam}. */
    @Override
    public String cliName() {
        return cliName;
    }

    /** Bits carried by one symbol: log2 of the order. */
    public int bitsPerSymbol() {
        return bitsPerSymbol;
    }

    /** Number of constellation points M. */
    public int order() {
        return 1 << bitsPerSymbol;
    }

    /** The constellation of this modulation (a fresh immutable object; cheap). */
    public QamConstellation constellation() {
        return new QamConstellation(this);
    }

    /**
     * Looks a modulation up by its command-line name, ignoring case.
     *
     * @throws IllegalArgumentException naming the valid choices when the name is unknown
     */
    public static Modulation fromCliName(String name) {
        return NamedChoice.find(values(), name, "modulation");
    }

    /** The valid command-line names, comma separated. */
    public static String choices() {
        return NamedChoice.list(values());
    }

    @Override
    public String toString() {
        return cliName.toUpperCase(Locale.ROOT);
    }
}
