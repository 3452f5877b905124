package org.fadebench.coding.stbc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

class SpaceTimeCodeFileTest {

    private static final String RESOURCES = "src/test/resources/org/fadebench/coding/stbc/";

    private static void assertSameCode(SpaceTimeCode expected, SpaceTimeCode actual, double tol) {
        assertEquals(expected.transmitAntennas(), actual.transmitAntennas());
        assertEquals(expected.symbolsPerBlock(), actual.symbolsPerBlock());
        assertEquals(expected.slotsPerBlock(), actual.slotsPerBlock());
        for (int i = 0; i < expected.symbolsPerBlock(); i++) {
            assertArrayEquals(expected.realDispersion(i), actual.realDispersion(i), tol, expected.name() + " A" + i);
            assertArrayEquals(expected.imagDispersion(i), actual.imagDispersion(i), tol, expected.name() + " B" + i);
        }
    }

    /** Writing a code and reading it back gives the very same matrices (no scaling, exact numbers). */
    @Test
    void roundTripKeepsEveryMatrixExactly() {
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            SpaceTimeCode back = SpaceTimeCodeFile.parse(SpaceTimeCodeFile.format(code), code.name());
            assertEquals(code.name(), back.name());
            assertSameCode(code, back, 0.0);
            assertTrue(back.scaleNote().startsWith("as written"), back.scaleNote());
        }
        SpaceTimeCode random = TestCodes.randomCode(new Random(5), 3, 4, 5);
        assertSameCode(random, SpaceTimeCodeFile.parse(SpaceTimeCodeFile.format(random), "random"), 0.0);
    }

    @Test
    void writesAndReadsFiles(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("h4.yaml");
        SpaceTimeCodeFile.write(SpaceTimeCodes.H4, file);
        SpaceTimeCode back = SpaceTimeCodeFile.read(file);
        assertSameCode(SpaceTimeCodes.H4, back, 0.0);
        assertTrue(back.isOrthogonal());
    }

    /**
     * Alamouti's matrix [[s1, s2], [-s2*, s1*]] (S. M. Alamouti, IEEE JSAC 16(8), 1998) written
     * unscaled, in YAML with every entry form and in JSON (with tabs): loaded, it is scaled by 1/√2
     * (average slot energy 2 in the file) and equals the catalogue's Alamouti code.
     */
    @ParameterizedTest
    @ValueSource(strings = {"alamouti-unscaled.yaml", "alamouti-unscaled.json"})
    void unscaledAlamoutiFileLoadsAsTheCatalogueCode(String file) {
        SpaceTimeCode code = SpaceTimeCodeFile.read(Path.of(RESOURCES + file));
        assertEquals("alamouti-file", code.name());
        assertSameCode(SpaceTimeCodes.ALAMOUTI, code, 1e-15);
        assertEquals("scaled by 0.707107 on load: the file's average energy per slot was 2", code.scaleNote());
        assertTrue(code.isOrthogonal());
    }

    /** The example shipped for users loads as two-antenna spatial multiplexing, and its test copy is the same file. */
    @Test
    void exampleFileIsSpatialMultiplexing() throws IOException {
        Path shipped = Path.of("src/main/resources/org/fadebench/coding/stbc/example-code.yaml");
        assertEquals(Files.readString(shipped, StandardCharsets.UTF_8),
                Files.readString(Path.of(RESOURCES + "example-code.yaml"), StandardCharsets.UTF_8));
        SpaceTimeCode code = SpaceTimeCodeFile.read(shipped);
        assertEquals("sm2", code.name());
        assertSameCode(TestCodes.spatialMultiplexing2x2(), code, 1e-15);
        assertFalse(code.isOrthogonal());
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "0.5-0.5j   | 0.5   | -0.5",
        "j          | 0     | 1",
        "-j         | 0     | -1",
        "+2j        | 0     | 2",
        "1+j        | 1     | 1",
        "1e-3+2E2j  | 0.001 | 200",
        "-1.5e+2-j  | -150  | -1",
        "3          | 3     | 0",
        "-.25       | -0.25 | 0",
        "' 1 - 2 j' | 1     | -2"})
    void parsesComplexEntries(String text, double re, double im) {
        assertArrayEquals(new double[] {re, im}, SpaceTimeCodeFile.parseComplex(text), 0.0);
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "1+", "j2", "1i", "nan", "NaN", "Infinity", "0x10", "1.5.2", "--1", "1e", "e5j",
                            "1+2", "jj", "1d", "2f"})
    void rejectsMalformedEntries(String text) {
        assertNull(SpaceTimeCodeFile.parseComplex(text));
    }

    @ParameterizedTest
    @CsvSource({"0.5, 0, 0.5", "0, -1, -1j", "1, 1, 1+1j", "-0.25, -3, -0.25-3j", "1e-20, 2, 1.0E-20+2j"})
    void formatsEntries(double re, double im, String text) {
        assertEquals(text, SpaceTimeCodeFile.formatEntry(re, im));
    }

    private static final String GOOD = String.join("\n",
            "name: sm2",
            "tx: 2",
            "slots: 1",
            "symbols:",
            "  - real: [[1, 0]]",
            "    imag: [[j, 0]]",
            "  - real: [[0, 1]]",
            "    imag: [[0, j]]",
            "");

    /** One well-formed file with a single line replaced. */
    private static String with(String line, String replacement) {
        assertTrue(GOOD.contains(line + "\n"), line);
        return GOOD.replace(line + "\n", replacement + "\n");
    }

    static Stream<Arguments> badFiles() {
        return Stream.of(
            Arguments.of("not valid YAML or JSON", "name: [unclosed\n"),
            Arguments.of("not valid YAML or JSON: found duplicate key tx", with("tx: 2", "tx: 2\ntx: 3")),
            Arguments.of("not valid YAML or JSON", with("name: sm2", "name: !!java.io.File /tmp")),
            Arguments.of("not valid YAML or JSON",
                    "!!javax.script.ScriptEngineManager [!!java.net.URLClassLoader [[!!java.net.URL [\"http://127.0.0.1/\"]]]]\n"),
            Arguments.of("is empty", ""),
            Arguments.of("the top level is a list of 1, not a mapping", "- 1\n"),
            Arguments.of("the top level has unknown key 'sots'", GOOD + "sots: 2\n"),
            Arguments.of("the top level lacks key 'slots'", with("slots: 1", "")),
            Arguments.of("'name' is 12 (integer)", with("name: sm2", "name: 12")),
            Arguments.of("'name' is 'a b'", with("name: sm2", "name: a b")),
            Arguments.of("'tx' is 'two', not a whole number from 1 to 64", with("tx: 2", "tx: two")),
            Arguments.of("'tx' is 0 (integer), not a whole number from 1 to 64", with("tx: 2", "tx: 0")),
            Arguments.of("'slots' is 2.5 (double), not a whole number from 1 to 64", with("slots: 1", "slots: 2.5")),
            Arguments.of("'symbols' must be a non-empty list, got a list of 0",
                    "name: x\ntx: 1\nslots: 1\nsymbols: []\n"),
            Arguments.of("symbol 1 is 1 (integer), not a mapping", "name: x\ntx: 1\nslots: 1\nsymbols: [1]\n"),
            Arguments.of("symbol 1 has unknown key 'rea'", with("  - real: [[1, 0]]", "  - rea: [[1, 0]]")),
            Arguments.of("symbol 2 lacks key 'imag'", with("    imag: [[0, j]]", "")),
            Arguments.of("symbol 1 real is a list of 2; valid: one row per slot (1), each with one entry per transmit antenna (2)",
                    with("  - real: [[1, 0]]", "  - real: [[1, 0], [0, 0]]")),
            Arguments.of("symbol 2 imag row 1 is a list of 3", with("    imag: [[0, j]]", "    imag: [[0, j, 0]]")),
            Arguments.of("'tx' is 1000000000 (integer), not a whole number from 1 to 64",
                    with("tx: 2", "tx: 1000000000")),
            Arguments.of("'slots' is 65 (integer), not a whole number from 1 to 64", with("slots: 1", "slots: 65")),
            Arguments.of("'symbols' has 10000 entries, more than 64; valid: 1 to 64 symbols per block",
                    "name: x\ntx: 1\nslots: 1\nsymbols:\n" + "  - {real: [[1]], imag: [[j]]}\n".repeat(10_000)),
            Arguments.of("the entries are too small to be scaled to unit energy per slot",
                    "name: x\ntx: 1\nslots: 1\nsymbols:\n  - {real: [[1e-320]], imag: [[0]]}\n"),
            Arguments.of("the entries are too large to be scaled to unit energy per slot",
                    "name: x\ntx: 1\nslots: 1\nsymbols:\n  - {real: [[1.7e308]], imag: [[1.7e308]]}\n"),
            Arguments.of("symbol 1 real row 1 entry 1 is NaN (double), not finite",
                    with("  - real: [[1, 0]]", "  - real: [[.nan, 0]]")),
            Arguments.of("symbol 1 real row 1 entry 2 is Infinity (double), not finite",
                    with("  - real: [[1, 0]]", "  - real: [[1, .inf]]")),
            Arguments.of("symbol 1 imag row 1 entry 1 is '1e999j', not finite",
                    with("    imag: [[j, 0]]", "    imag: [[\"1e999j\", 0]]")),
            Arguments.of("symbol 1 real row 1 entry 1 is '1i', not a complex number",
                    with("  - real: [[1, 0]]", "  - real: [[1i, 0]]")),
            Arguments.of("symbol 1 real row 1 entry 1 is true (boolean), not a complex number",
                    with("  - real: [[1, 0]]", "  - real: [[true, 0]]")),
            Arguments.of("symbol 1 real row 1 entry 1 is a list of 3, not a complex number",
                    with("  - real: [[1, 0]]", "  - real: [[[1, 2, 3], 0]]")),
            Arguments.of("every dispersion matrix is zero; valid: at least one nonzero entry",
                    "name: x\ntx: 1\nslots: 1\nsymbols:\n  - {real: [[0]], imag: [[\"0j\"]]}\n"),
            Arguments.of("symbol 2 is never sent",
                    with("  - real: [[0, 1]]\n    imag: [[0, j]]", "  - real: [[0, 0]]\n    imag: [[0, 0]]")));
    }

    /** Each bad input is an IllegalArgumentException with a one-line message: file, problem, valid choices. */
    @ParameterizedTest
    @MethodSource("badFiles")
    void badFilesAreRejectedWithOneLineMessages(String expected, String text) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> SpaceTimeCodeFile.parse(text, "bad.yaml"));
        String message = e.getMessage();
        assertTrue(message.startsWith("code file bad.yaml: "), message);
        assertTrue(message.contains(expected), message);
        assertTrue(message.contains("; valid: "), message);
        assertFalse(message.contains("\n"), message);
    }

    @Test
    void missingFileIsBadInput(@TempDir Path dir) {
        Path missing = dir.resolve("nope.yaml");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SpaceTimeCodeFile.read(missing));
        assertEquals("code file " + missing + ": no such file; valid: a YAML or JSON file", e.getMessage());
    }

    /** A folder or a pipe is refused before reading: reading a pipe would wait for a writer forever. */
    @Test
    void onlyRegularFilesAreRead(@TempDir Path dir) throws Exception {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SpaceTimeCodeFile.read(dir));
        assertEquals("code file " + dir + ": is a folder; valid: a YAML or JSON file", e.getMessage());
        Path fifo = dir.resolve("code.yaml");
        org.junit.jupiter.api.Assumptions.assumeTrue(
                new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor() == 0, "mkfifo is available");
        e = assertThrows(IllegalArgumentException.class, () -> SpaceTimeCodeFile.read(fifo));
        assertEquals("code file " + fifo + ": not a regular file (a pipe or a device?); valid: a YAML or JSON file",
                e.getMessage());
    }

    @Test
    void filesAboveTheSizeLimitAreRefusedUnread(@TempDir Path dir) throws IOException {
        Path big = Files.write(dir.resolve("big.yaml"), new byte[(int) SpaceTimeCodeFile.MAX_FILE_BYTES + 1]);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SpaceTimeCodeFile.read(big));
        assertTrue(e.getMessage().startsWith("code file " + big + ": larger than the limit of 3145728 bytes"),
                e.getMessage());
    }

    /**
     * Huge and tiny entries are scaled like ordinary ones: the code with every entry multiplied by
     * 1e300 (whose energy, 1e600, is beyond a double) or by 1e-300 loads as the same code to within
     * a few rounding errors, and the note states the energy the file had.
     */
    @Test
    void hugeAndTinyEntriesScaleToTheSameCode() {
        SpaceTimeCode plain = SpaceTimeCodeFile.parse(GOOD, "plain.yaml");
        for (String factor : new String[] {"1e300", "1e-300"}) {
            String text = GOOD.replace("[[1, 0]]", "[[" + factor + ", 0]]").replace("[[0, 1]]", "[[0, " + factor + "]]")
                    .replace("[[j, 0]]", "[[\"" + factor + "j\", 0]]").replace("[[0, j]]", "[[0, \"" + factor + "j\"]]");
            SpaceTimeCode scaled = SpaceTimeCodeFile.parse(text, "scaled.yaml");
            for (int i = 0; i < plain.symbolsPerBlock(); i++) {
                assertArrayEquals(plain.realDispersion(i), scaled.realDispersion(i), 1e-15, factor + " A" + i);
                assertArrayEquals(plain.imagDispersion(i), scaled.imagDispersion(i), 1e-15, factor + " B" + i);
            }
            assertTrue(scaled.scaleNote().endsWith(factor.equals("1e300") ? "was 2.00000E+600" : "was 2.00000E-600"),
                    scaled.scaleNote());
        }
    }

    /**
     * For codes whose energy is an ordinary number the robust factor has the very bits of
     * 1/√E computed directly, so scaling user codes changes no simulated number.
     */
    @Test
    void unitEnergyScaleIsBitIdenticalForOrdinaryCodes() {
        Random random = new Random(11);
        for (int trial = 0; trial < 2000; trial++) {
            int k = 1 + random.nextInt(8);
            int t = 1 + random.nextInt(8);
            int mt = 1 + random.nextInt(8);
            double magnitude = Math.pow(10, random.nextInt(121) - 60);
            double[][] a = new double[k][2 * t * mt];
            double[][] b = new double[k][2 * t * mt];
            for (int i = 0; i < k; i++) {
                for (int c = 0; c < a[i].length; c++) {
                    a[i][c] = magnitude * random.nextGaussian();
                    b[i][c] = magnitude * random.nextGaussian();
                }
            }
            double direct = 1 / Math.sqrt(SpaceTimeCode.averageSlotEnergy(a, b, t));
            assertEquals(direct, SpaceTimeCode.unitEnergyScale(a, b, t), 0.0, "trial " + trial);
        }
    }
}
