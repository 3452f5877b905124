package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/** The SNR text of {@code --snr} and {@code sweep.snr_db}: FROM..TO/STEP, one value, or a list. */
class SnrGridTest {

    @Test
    void rangesIncludeToWhenOnTheGrid() {
        assertArrayEquals(new double[] {0, 2.5, 5, 7.5, 10}, SnrGrid.parse("0..10/2.5"), 0);
        assertArrayEquals(new double[] {0, 2, 4, 6, 8, 10, 12, 14, 16, 18, 20}, SnrGrid.parse("0..20/2"), 0);
        assertArrayEquals(new double[] {0, 2, 4}, SnrGrid.parse("0..5/2"), 0, "TO off the grid is not a point");
        assertEquals(29, SnrGrid.parse("-4..10/0.5").length);
        assertEquals(-4, SnrGrid.parse("-4..10/0.5")[0], 0);
        assertEquals(10, SnrGrid.parse("-4..10/0.5")[28], 0);
        // 0.1 is not exact in binary: ten steps of it land within the tolerance of 1, which is included
        double[] tenths = SnrGrid.parse("0..1/0.1");
        assertEquals(11, tenths.length);
        assertEquals(0.3, tenths[3], 0);
        assertEquals(1, tenths[10], 0);
        assertArrayEquals(new double[] {10, 5, 0}, SnrGrid.parse("10..0/5"), 0, "downwards");
        assertArrayEquals(new double[] {-10, -15}, SnrGrid.parse("-10..-15/5"), 0);
        assertArrayEquals(new double[] {3}, SnrGrid.parse("3"), 0);
        assertArrayEquals(new double[] {1, -1.5}, SnrGrid.parse("1, -1.5"), 0);
    }

    @ParameterizedTest(name = "[{0}]")
    @CsvSource(delimiter = '|', value = {
        "0..10 | is not FROM..TO/STEP",
        "0..10/2/3 | is not FROM..TO/STEP",
        "a..1/2 | is not a number",
        "0..5/0 | STEP must be positive",
        "0..5/-1 | STEP must be positive",
        "0..100/1e-6 | more than 10000",
        "'' | is not a number",
        "1,,2 | is not a number",
        "nan | is not a number",
        "0..500/10 | outside the range -400 to 400 dB",
    })
    void malformedTextIsRefusedNamingTheOption(String text, String expected) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SnrGrid.parse(text));
        assertTrue(e.getMessage().startsWith("--snr"), e.getMessage());
        assertTrue(e.getMessage().contains(expected), e.getMessage());
    }

    /** The colon form of earlier versions is refused, spelling the same points in the new form. */
    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "0:2:20 | 0..20/2 | 0;2;4;6;8;10;12;14;16;18;20",
        "-4:0.5:-2 | -4..-2/0.5 | -4;-3.5;-3;-2.5;-2",
        "10:-5:0 | 10..0/5 | 10;5;0",
    })
    void oldColonFormIsRefusedWithTheNewSpelling(String text, String spelled, String points) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SnrGrid.parse(text));
        assertEquals("--snr '" + text + "': the START:STEP:STOP form is not read; write " + spelled
                + " for the same points", e.getMessage());
        double[] expected = java.util.Arrays.stream(points.split(";")).mapToDouble(Double::parseDouble).toArray();
        assertArrayEquals(expected, SnrGrid.parse(spelled), 0);
    }

    @Test
    void colonTextThatIsNoOldGridGetsTheGeneralHint() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SnrGrid.parse("0:2"));
        assertTrue(e.getMessage().contains("write FROM..TO/STEP (e.g. 0..20/2)"), e.getMessage());
    }

    /** A point given twice would be two rows of one SNR: refused up front, naming the value. */
    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "5,5 | 5 dB appears more than once",
        "0, 2, 4, 2.0 | 2 dB appears more than once",
        "-0, 0 | 0 dB appears more than once",
    })
    void duplicatePointsAreRefused(String text, String expected) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SnrGrid.parse(text));
        assertEquals("--snr '" + text + "': " + expected + "; give each SNR point once", e.getMessage());
    }
}
