package org.fadebench.coding.stbc;

import org.fadebench.modem.NamedChoice;

/**
 * The linear equalisers a link can use in front of per-symbol slicing or demapping (the option
 * {@code --decoder}; not to be confused with a channel code's decoder). For an orthogonal code all
 * three give the same estimates and gains; they differ only for non-orthogonal codes.
 */
public enum Equaliser implements NamedChoice {
    /** Matched filter: z = Fᵀy divided by diag(FᵀF) ({@link MatchedFilterCombiner}). */
    MF("mf"),
    /** Zero forcing: (FᵀF)⁻¹Fᵀy ({@link LinearEqualiser#zeroForcing}). */
    ZF("zf"),
    /** Linear MMSE with unbiased scaling; needs the noise density n0 ({@link LinearEqualiser#mmse}). */
    MMSE("mmse");

    private final String cliName;

    Equaliser(String cliName) {
        this.cliName = cliName;
    }

    /** Name on the command line, e.g. {@code zf}. */
    @Override
    public String cliName() {
        return cliName;
    }

    /**
     * Looks an equaliser up by its command-line name ({@code --decoder}), ignoring case.
     *
     * @throws IllegalArgumentException naming the valid choices when the name is unknown
     */
    public static Equaliser fromCliName(String name) {
        return NamedChoice.find(values(), name, "decoder");
    }

    /** The valid command-line names, comma separated. */
    public static String choices() {
        return NamedChoice.list(values());
    }
}
