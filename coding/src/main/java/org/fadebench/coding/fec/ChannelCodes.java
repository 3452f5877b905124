package org.fadebench.coding.fec;

import java.util.ArrayList;
import java.util.List;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.fec.ldpc.LdpcFamily;
import org.fadebench.modem.NamedChoice;

/**
 * A registry of channel codes by command-line name. {@link #standard()} holds the codes the
 * command line offers: {@code none, conv-r12, conv-r23, conv-r34, conv-small} and the LDPC family
 * {@code ldpc-r12, ldpc-r23, ldpc-r34, ldpc-r56} (decoded by default; a run sets the decoding with
 * {@link LdpcCode#withDecoding}). A new code family
 * lives in its own package and adds its named codes to {@link #STANDARD}'s list; {@link #with}
 * makes a registry with one more code (tests use it). Immutable.
 */
public final class ChannelCodes {

    /** No channel code: the information bits are sent as they are. */
    public static final ChannelCode NONE = new Uncoded();

    private static final ChannelCodes STANDARD = new ChannelCodes(List.of(NONE, PuncturedCode.CONV_R12,
            PuncturedCode.CONV_R23, PuncturedCode.CONV_R34, PuncturedCode.CONV_SMALL,
            LdpcCode.of(LdpcFamily.R12, LdpcDecoding.DEFAULT), LdpcCode.of(LdpcFamily.R23, LdpcDecoding.DEFAULT),
            LdpcCode.of(LdpcFamily.R34, LdpcDecoding.DEFAULT), LdpcCode.of(LdpcFamily.R56, LdpcDecoding.DEFAULT)));

    private final List<ChannelCode> codes;

    private ChannelCodes(List<ChannelCode> codes) {
        this.codes = List.copyOf(codes);
    }

    /** The codes selectable on the command line. */
    public static ChannelCodes standard() {
        return STANDARD;
    }

    /**
     * This registry and {@code code}.
     *
     * @throws IllegalArgumentException if the name is taken
     */
    public ChannelCodes with(ChannelCode code) {
        for (ChannelCode c : codes) {
            if (c.cliName().equalsIgnoreCase(code.cliName())) {
                throw new IllegalArgumentException("channel code '" + code.cliName() + "' is already registered");
            }
        }
        List<ChannelCode> more = new ArrayList<>(codes);
        more.add(code);
        return new ChannelCodes(more);
    }

    /** The codes, in the order they are listed. */
    public List<ChannelCode> all() {
        return codes;
    }

    /**
     * The code named {@code name}, ignoring case and surrounding blanks.
     *
     * @throws IllegalArgumentException "unknown channel code 'x'; valid: ..." when there is none
     */
    public ChannelCode find(String name) {
        return NamedChoice.find(codes.toArray(new ChannelCode[0]), name, "channel code");
    }

    /** The valid names, comma separated. */
    public String choices() {
        return NamedChoice.list(codes.toArray(new ChannelCode[0]));
    }
}
