package org.fadebench.modem;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/** The shared name lookup: case and blanks ignored, one message form naming every valid choice. */
class NamedChoiceTest {

    @Test
    void findsIgnoringCaseAndBlanks() {
        assertEquals(Modulation.QAM16, NamedChoice.find(Modulation.values(), " 16QAM\t", "modulation"));
        assertEquals(LlrMethod.EXACT, LlrMethod.fromCliName("Exact"));
    }

    @Test
    void unknownNameListsTheChoicesInOrder() {
        assertEquals("bpsk, qpsk, 16qam, 64qam, 256qam", Modulation.choices());
        assertEquals("unknown modulation ' 8psk'; valid: bpsk, qpsk, 16qam, 64qam, 256qam",
                assertThrows(IllegalArgumentException.class, () -> Modulation.fromCliName(" 8psk")).getMessage());
        assertEquals("unknown LLR method 'soft'; valid: maxlog, exact",
                assertThrows(IllegalArgumentException.class, () -> LlrMethod.fromCliName("soft")).getMessage());
        assertEquals("unknown mutual information kind 'x'; valid: cm, bicm",
                assertThrows(IllegalArgumentException.class,
                        () -> MutualInformation.Kind.fromCliName("x")).getMessage());
    }
}
