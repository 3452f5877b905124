package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.ldpc.LdpcCodeFile;
import org.fadebench.coding.fec.ldpc.MatrixMarketReader;
import org.fadebench.coding.fec.ldpc.ParityCheckMatrix;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** {@code fadebench codes}: the channel codes listed, a user's LDPC code file, and {@code --export-h}. */
class ChannelCodesCliTest {

    static final Path EXAMPLE = Path.of("scenarios/example-ldpc.yaml");

    @TempDir
    Path tmp;

    /** The row of the channel-code table (after its header) that lists {@code name}. */
    private static String row(String out, String name) {
        return out.substring(out.indexOf("\nchannel code ")).lines().filter(l -> l.startsWith(name + " ")).findFirst()
                .orElseThrow(() -> new AssertionError(name));
    }

    private static List<String> cells(String row) {
        return Arrays.asList(row.trim().split("\\s+"));
    }

    /**
     * k, n and rate of the built-in channel codes. conv-r12: the rate-1/2 code with its 6 zero tail
     * bits sends 2·(K + 6) bits; conv-small (memory 2) sends 2·(K + 2) (worked by hand).
     */
    @Test
    void listsTheChannelCodesAtThePayloadSize() {
        CliTest.Outcome o = CliTest.run("codes");
        assertEquals(0, o.code(), o.err());
        assertEquals(List.of("none", "1024", "1024", "1.000", "-", "-"), cells(row(o.out(), "none")));
        assertEquals(List.of("conv-r12", "1024", "2060", "0.497", "-", "-"), cells(row(o.out(), "conv-r12")));
        assertEquals(List.of("conv-small", "1024", "2052", "0.499", "-", "-"), cells(row(o.out(), "conv-small")));
        assertTrue(o.out().contains("conv-r23 ") && o.out().contains("conv-r34 "), o.out());
        // the built-in LDPC family sends exactly k / R bits
        assertEquals(List.of("ldpc-r12", "1024", "2048", "0.500"), cells(row(o.out(), "ldpc-r12")).subList(0, 4));
        assertEquals(List.of("ldpc-r56", "1024", "1229", "0.833"), cells(row(o.out(), "ldpc-r56")).subList(0, 4));
        CliTest.Outcome one = CliTest.run("codes", "--fec", "CONV-R12", "--frame-bits", "100");
        assertEquals(0, one.code(), one.err());
        assertEquals(List.of("conv-r12", "100", "212", "0.472", "-", "-"), cells(row(one.out(), "conv-r12")));
        assertFalse(one.out().contains("conv-small"), one.out());
    }

    /**
     * The example code file: 4 x 8 base matrix, Z = 32. Base column weights 3, 3, 3, 3, 2, 2, 2, 1 and
     * row weights 4, 5, 5, 5 (counted by hand in the file) give 32 x 4 columns of degree 3, 3 x 32 of
     * degree 2, 32 of degree 1, 32 rows of degree 4 and 96 of degree 5; n = 256, k = 256 − 128.
     */
    @Test
    void listsACodeFileWithDegreesAndGirth() {
        CliTest.Outcome o = CliTest.run("codes", "--fec-file", EXAMPLE.toString());
        assertEquals(0, o.code(), o.err());
        String girth = Integer.toString(LdpcCodeFile.read(EXAMPLE).girth().getAsInt());
        assertEquals(List.of("example-ldpc.yaml", "128", "256", "0.500", girth, "variable", "1:32", "2:96", "3:128;",
                "check", "4:32", "5:96"), cells(row(o.out(), "example-ldpc.yaml")));
        assertTrue(row(o.out(), "conv-r12").contains("2060"), "the built-in codes are listed too");
    }

    /** --export-h writes the matrix as read; a second time it needs --overwrite; the file reads back. */
    @Test
    void exportsTheMatrixOfACodeFile() throws IOException {
        Path out = tmp.resolve("sub/h.mtx");
        CliTest.Outcome o = CliTest.run("codes", "--fec-file", EXAMPLE.toString(), "--export-h", out.toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("wrote " + out + ": the 128 x 256 parity-check matrix of example-ldpc.yaml (608 ones)"),
                o.out());
        ParityCheckMatrix expected = LdpcCodeFile.read(EXAMPLE);
        ParityCheckMatrix back = MatrixMarketReader.read(out);
        assertEquals(expected.edges(), back.edges());
        for (int i = 0; i < expected.rows(); i++) {
            for (int p = 0; p < expected.rowDegree(i); p++) {
                assertTrue(back.get(i, expected.rowEntry(i, p)));
            }
        }
        String first = Files.readString(out, StandardCharsets.US_ASCII);
        assertTrue(first.startsWith("%%MatrixMarket matrix coordinate pattern general\n% parity-check matrix of "
                + "example-ldpc.yaml, n = 256, k = 128, written by fadebench\n128 256 608\n"), first);
        CliTest.Outcome again = CliTest.run("codes", "--fec-file", EXAMPLE.toString(), "--export-h", out.toString());
        assertEquals(2, again.code());
        assertEquals("fadebench codes: --export-h " + out + " already exists: give another name, or --overwrite to"
                + " replace it", again.err().trim());
        assertEquals("", again.out());
        CliTest.Outcome replaced = CliTest.run("codes", "--fec-file", out.toString(), "--export-h",
                tmp.resolve("h2.mtx").toString());
        assertEquals(0, replaced.code(), replaced.err());
        assertEquals(first.substring(first.indexOf("\n128 ")), Files.readString(tmp.resolve("h2.mtx"))
                .substring(Files.readString(tmp.resolve("h2.mtx")).indexOf("\n128 ")), "a written file exports the same");
        assertEquals(0, CliTest.run("codes", "--fec-file", EXAMPLE.toString(), "--export-h", out.toString(),
                "--overwrite").code());
    }

    private void assertRefused(String expected, String... args) {
        Path out = tmp.resolve("never.mtx");
        List<String> a = new ArrayList<>(Arrays.asList(args));
        if (!a.contains("--export-h")) {
            a.add("--export-h");
            a.add(out.toString());
        }
        CliTest.Outcome o = CliTest.run(a.toArray(new String[0]));
        assertEquals(2, o.code(), o.err());
        assertEquals("fadebench codes: " + expected, o.err().trim());
        assertEquals("", o.out(), "nothing printed");
        assertFalse(Files.exists(out), "nothing written");
    }

    /**
     * Every bad input of a code file: one line naming the file (and line), exit 2, nothing written.
     * The Fano plane's incidence matrix (circulant of {0, 1, 3} mod 7) has rank 4 over GF(2): its
     * first row 1 + x + x^3 divides x^7 − 1 (worked by hand).
     */
    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "h.mtx  | %%MatrixMarket matrix coordinate real general\\n2 2 1\\n1 1 1.0\\n"
            + "| FILE line 1: field 'real'; valid: pattern or integer (0/1 entries)",
        "h.mtx  | %%MatrixMarket matrix coordinate integer general\\n2 3 2\\n1 1 1\\n2 2 2\\n"
            + "| FILE line 4: value '2'; valid: 0 or 1",
        "h.mtx  | %%MatrixMarket matrix coordinate pattern general\\n2 3\\n"
            + "| FILE line 2: size line '2 3'; valid: three whole numbers 'rows columns entries'",
        "h.mtx  | %%MatrixMarket matrix coordinate pattern general\\n2 3 3\\n1 1\\n2 2\\n1 3\\n1 1\\n"
            + "| FILE line 6: more entries than the 3 the size line declares; valid: exactly 3 entry lines",
        "h.mtx  | %%MatrixMarket matrix coordinate pattern general\\n7 7 21\\n1 1\\n1 2\\n1 4\\n2 2\\n2 3\\n2 5\\n3 3"
            + "\\n3 4\\n3 6\\n4 4\\n4 5\\n4 7\\n5 5\\n5 6\\n5 1\\n6 6\\n6 7\\n6 2\\n7 7\\n7 1\\n7 3\\n"
            + "| FILE: rank 4 over GF(2) is below its 7 rows: 3 row(s) are sums of others; valid: a matrix of full row"
            + " rank (remove the redundant rows)",
        "h.mtx  | %%MatrixMarket matrix coordinate pattern general\\n2 3 3\\n1 1\\n2 2\\n1 2\\n"
            + "| FILE: column 3 (counting from 1) has no ones, so no check covers its bit; valid: at least one one in"
            + " every column",
        "h.mtx  | %%MatrixMarket matrix coordinate pattern general\\n2 2 2\\n1 1\\n2 2\\n"
            + "| FILE: rank 2 over GF(2) equals its 2 columns, so the only codeword is zero; valid: rank below the number"
            + " of columns",
        "h.mtx  | %%MatrixMarket matrix coordinate pattern general\\n1048577 4 1\\n1 1\\n"
            + "| FILE line 2: rows '1048577'; valid: a whole number from 1 to 1048576",
        "h.mtx  | %%MatrixMarket matrix coordinate pattern general\\n4 4 16777217\\n1 1\\n"
            + "| FILE line 2: entries '16777217'; valid: a whole number from 1 to 16777216",
        "h.mtx  | %%MatrixMarket matrix coordinate pattern general\\n1048576 1048576 1\\n1 1\\n"
            + "| FILE line 2: a 1048576 x 1048576 matrix is too large to derive its encoder: GF(2) elimination needs rows"
            + " x columns/64 = 17179869184 words of 64 bits; valid: at most 33554432 words (rows x columns up to"
            + " 2147483648)",
        "qc.yaml | lifting: 4\\nbase:\\n  - [0, 1, 7]\\n"
            + "| FILE line 3: base row 1, entry 3 is 7; valid: -1 (a zero block) or a shift from 0 to 3 (lifting 4)",
        "qc.yaml | lifting: 4\\nbase:\\n  - [0, 1, 2]\\n  - [0, 1]\\n"
            + "| FILE line 4: base row 2 has 2 entries; valid: 3 entries in every row, as in row 1",
        "qc.yaml | lifting: 4\\nbase:\\n  - [0, 1, -1]\\n  - [2, -1, -1]\\n"
            + "| FILE line 3: base column 3 is -1 in every row, so no check covers its 4 bits; valid: at least one shift"
            + " in every column",
        "qc.yaml | lifting: 1048576\\nbase: [[0, 0]]\\n"
            + "| FILE line 1: lifting 1048576 with a 1 x 2 base matrix gives 1048576 x 2097152; valid: rows and columns up"
            + " to 1048576",
        "qc.yaml | lifting: 4\\nbase: [[0, 1]\\n"
            + "| FILE line 3: not valid YAML: expected ',' or ']', but got <stream end>; valid: a mapping with keys lifting"
            + " (Z) and base (rows of shifts, -1 for a zero block)",
        "qc.yaml | lifting: 4\\nshifts: [[0, 1]]\\n"
            + "| FILE line 2: unknown key 'shifts'; valid: keys lifting, base",
        "h.txt  | 1 1\\n"
            + "| FILE: unknown extension; valid: .mtx, .yaml, .yml (Matrix Market, or a quasi-cyclic base matrix in YAML)",
    })
    void refusesEachBadCodeFile(String name, String text, String expected) throws IOException {
        Path file = Files.writeString(tmp.resolve(name), text.replace("\\n", "\n"), StandardCharsets.US_ASCII);
        assertRefused("--fec-file: parity-check file " + expected.replace("FILE", file.toString()),
                "codes", "--fec-file", file.toString());
    }

    @Test
    void refusesFilesThatAreMissingUnreadableFoldersOrDevices() throws IOException {
        Path missing = tmp.resolve("none.mtx");
        assertRefused("--fec-file: parity-check file " + missing + ": no such file; valid: a Matrix Market file",
                "codes", "--fec-file", missing.toString());
        Path folder = Files.createDirectory(tmp.resolve("folder.yaml"));
        assertRefused("--fec-file: parity-check file " + folder + ": is a folder; valid: a YAML base matrix",
                "codes", "--fec-file", folder.toString());
        Path locked = Files.copy(EXAMPLE, tmp.resolve("locked.yaml"));
        if (locked.toFile().setReadable(false, false) && !Files.isReadable(locked)) { // not for a superuser
            assertRefused("--fec-file: parity-check file " + locked + ": cannot be read (AccessDeniedException); valid: a"
                    + " readable UTF-8 YAML file", "codes", "--fec-file", locked.toString());
        }
        if (Files.exists(Path.of("/dev/null"))) {
            Path device = Files.createSymbolicLink(tmp.resolve("device.mtx"), Path.of("/dev/null"));
            assertRefused("--fec-file: parity-check file " + device + ": not a regular file (a pipe or a device?); valid:"
                    + " a Matrix Market file", "codes", "--fec-file", device.toString());
        }
    }

    @Test
    void refusesBadOptions() throws IOException {
        assertRefused("--frame-bits must be a whole number from 1 to 16777216, got 0", "codes", "--frame-bits", "0");
        assertRefused("--frame-bits must be a whole number from 1 to 16777216, got 16777217", "codes",
                "--frame-bits", "16777217");
        assertRefused("--fec: unknown channel code 'ldpc'; valid: " + ChannelCodes.standard().choices(),
                "codes", "--fec", "ldpc");
        assertRefused("--frame-bits 10 with ldpc-r12: channel code ldpc-r12 takes 64 to 8224 information bits per "
                + "frame, not 10", "codes", "--fec", "ldpc-r12", "--frame-bits", "10");
        assertRefused("give either --fec or --fec-file, not both", "codes", "--fec", "conv-r12", "--fec-file",
                EXAMPLE.toString());
        assertRefused("--export-h: conv-r12 is not an LDPC code and has no parity-check matrix; valid: --fec-file FILE, "
                + "or --fec with one of: ldpc-r12, ldpc-r23, ldpc-r34, ldpc-r56",
                "codes", "--fec", "conv-r12");
        assertRefused("--export-h needs the code whose parity-check matrix to write: give --fec NAME or --fec-file FILE",
                "codes");
        Path txt = tmp.resolve("h.txt");
        assertRefused("--export-h " + txt + ": the name must end in .mtx (Matrix Market)", "codes", "--fec-file",
                EXAMPLE.toString(), "--export-h", txt.toString());
        assertFalse(Files.exists(txt));
        Path input = Files.copy(EXAMPLE, tmp.resolve("mine.mtx.yaml"));
        Path same = tmp.resolve("link.mtx");
        Files.createSymbolicLink(same, input);
        CliTest.Outcome o = CliTest.run("codes", "--fec-file", input.toString(), "--export-h", same.toString(),
                "--overwrite");
        assertEquals(2, o.code());
        assertEquals("fadebench codes: --export-h " + same + " is the same file as --fec-file " + input
                + " (read by this run); every input and output of a run must be a different file", o.err().trim());
        assertEquals(Files.readString(EXAMPLE), Files.readString(input), "the input is untouched");
        Path folder = Files.createDirectory(tmp.resolve("out.mtx"));
        assertRefused("--export-h " + folder + " is a folder; valid: a file name ending in .mtx", "codes", "--fec-file",
                EXAMPLE.toString(), "--export-h", folder.toString(), "--overwrite");
    }
}
