package org.fadebench.coding.stbc;

import org.fadebench.modem.NamedChoice;

/**
 * The linear decoders a link can use in front of per-symbol slicing. For an orthogonal code all
 * three give the same estimates and gains; they differ only for non-orthogonal codes.
 */
public enum Decoder implements NamedChoice {
    /** Matched filter: z = Fᵀy divided by diag(FᵀF) ({@link MatchedFilterCombiner}). */
    MF("mf"),
    /** Zero forcing: (FᵀF)⁻¹Fᵀy ({@link LinearEqualiser#zeroForcing}). */
    ZF("zf"),
    /** Linear MMSE with unbiased scaling; needs the noise density n0 ({@link LinearEqualiser#mmse}). */
    MMSE("mmse");

    private final String cliName;

    Decoder(String cliName) {
        this.cliName = cliName;
    }

    /** Name on the command line, e.g. {@code zf}. */
    @Override
    public String cliName() {
        return cliName;
    }

    /**
     * Looks a decoder up by its command-line name, ignoring case.
     *
     * @throws IllegalArgumentException naming the valid choices when the name is unknown
     */
    public static Decoder fromCliName(String name) {
        return NamedChoice.find(values(), name, "decoder");
    }

    /** The valid command-line names, comma separated. */
    public static String choices() {
        return NamedChoice.list(values());
    }
}
