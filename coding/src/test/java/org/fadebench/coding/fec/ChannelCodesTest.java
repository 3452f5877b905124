package org.fadebench.coding.fec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.junit.jupiter.api.Test;

class ChannelCodesTest {

    private static final String STANDARD_NAMES =
            "none, conv-r12, conv-r23, conv-r34, conv-small, ldpc-r12, ldpc-r23, ldpc-r34, ldpc-r56";

    @Test
    void namesOfTheStandardCodes() {
        ChannelCodes codes = ChannelCodes.standard();
        assertEquals(STANDARD_NAMES, codes.choices());
        assertSame(PuncturedCode.CONV_R34, codes.find("Conv-R34"));
        assertSame(ChannelCodes.NONE, codes.find(" none "));
        assertEquals("ldpc-r23, min-sum decoder (factor 0.8125), at most 50 iterations", codes.find("ldpc-r23").describe());
        assertEquals("unknown channel code 'turbo'; valid: " + STANDARD_NAMES,
                assertThrows(IllegalArgumentException.class, () -> codes.find("turbo")).getMessage());
    }

    @Test
    void aRegistryWithOneMoreCodeLeavesTheStandardOneAlone() {
        ChannelCode renamed = new PuncturedCode("conv-other", PuncturedCode.CONV_R12.puncturer());
        ChannelCodes more = ChannelCodes.standard().with(renamed);
        assertSame(renamed, more.find("conv-other"));
        assertEquals(STANDARD_NAMES, ChannelCodes.standard().choices());
        assertEquals("channel code 'conv-r12' is already registered",
                assertThrows(IllegalArgumentException.class,
                        () -> more.with(new PuncturedCode("conv-r12", PuncturedCode.CONV_R23.puncturer())))
                        .getMessage());
    }

    /** A code travels in a serialised run plan; "none" comes back as the one instance links compare with. */
    @Test
    void codesSurviveSerialisation() throws Exception {
        assertSame(ChannelCodes.NONE, roundTrip(ChannelCodes.NONE));
        PuncturedCode back = (PuncturedCode) roundTrip(PuncturedCode.CONV_R34);
        assertEquals("conv-r34", back.cliName());
        assertEquals(PuncturedCode.CONV_R34.puncturer().toString(), back.puncturer().toString());
        assertEquals(PuncturedCode.CONV_R34.codedBits(97), back.codedBits(97));
        ChannelCode ldpc = ChannelCodes.standard().find("ldpc-r34");
        ChannelCode ldpcBack = (ChannelCode) roundTrip(ldpc);
        assertEquals(ldpc.describe(), ldpcBack.describe());
        assertEquals(ldpc.codedBits(1000), ldpcBack.codedBits(1000));
    }

    private static Object roundTrip(Object o) throws Exception {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ObjectOutputStream out = new ObjectOutputStream(bytes)) {
            out.writeObject(o);
        }
        try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(bytes.toByteArray()))) {
            return in.readObject();
        }
    }

    /** No code: the bits as they are, rate 1, one lane (hard decisions gain nothing from lanes). */
    @Test
    void noCode() {
        assertEquals(96, ChannelCodes.NONE.codedBits(96));
        assertEquals(1.0, ChannelCodes.NONE.rate(), 0);
        assertEquals(1, ChannelCodes.NONE.lanes(1024));
    }
}
