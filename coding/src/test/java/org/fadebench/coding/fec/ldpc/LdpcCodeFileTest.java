package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class LdpcCodeFileTest {

    @TempDir
    Path dir;

    /**
     * A small QC base matrix with a dual-diagonal parity part (last two base columns): lower
     * triangular with identity blocks on its diagonal, so H has full row rank (worked by hand).
     */
    static final int[][] BASE = {
        {1, 2, 0, -1},
        {3, 0, 0, 0},
    };

    private Path write(String name, String text) throws IOException {
        return Files.writeString(dir.resolve(name), text, StandardCharsets.UTF_8);
    }

    /** The two matrices have the same shape and the same ones. */
    static void assertSame(ParityCheckMatrix expected, ParityCheckMatrix actual) {
        assertEquals(expected.rows(), actual.rows());
        assertEquals(expected.columns(), actual.columns());
        assertEquals(expected.edges(), actual.edges());
        for (int i = 0; i < expected.rows(); i++) {
            for (int j = 0; j < expected.columns(); j++) {
                assertEquals(expected.get(i, j), actual.get(i, j), "entry " + i + ", " + j);
            }
        }
    }

    /** The YAML layout expands to exactly the matrix QcBaseMatrix expands, in either form of YAML list. */
    @Test
    void yamlBaseMatrixExpandsLikeQcBaseMatrix() throws IOException {
        ParityCheckMatrix expected = new QcBaseMatrix(BASE, 4).expand();
        Path block = write("qc.yaml", "# a comment\nlifting: 4\nbase:\n  - [1, 2, 0, -1]\n  - [3, 0, 0, 0]\n");
        Path nested = write("qc.YML", "base:\n  -\n    - 1\n    - 2\n    - 0\n    - -1\n  - [3, 0, +0, 0]\nlifting: 4\n");
        assertSame(expected, LdpcCodeFile.read(block));
        assertSame(expected, LdpcCodeFile.read(nested));
        assertEquals(8, LdpcCodeFile.read(block).rows());
        assertEquals(8, Gf2Elimination.rank(expected));
    }

    /** A .mtx file goes through MatrixMarketReader, and the same checks follow. */
    @Test
    void matrixMarketFileIsReadAndChecked() throws IOException {
        ParityCheckMatrix expected = new QcBaseMatrix(BASE, 4).expand();
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        MatrixMarketWriter.write(expected, "", out);
        assertSame(expected, LdpcCodeFile.read(write("h.mtx", out.toString(StandardCharsets.US_ASCII))));
    }

    @Test
    void theExampleFileForUsersIsAGoodCode() {
        Path example = Path.of("../bench/scenarios/example-ldpc.yaml");
        ParityCheckMatrix h = LdpcCodeFile.read(example);
        assertEquals(128, h.rows());
        assertEquals(256, h.columns());
        assertTrue(h.girth().getAsInt() > 4, "no 4-cycles");
    }

    /**
     * Refusals after reading. The Fano plane's incidence matrix, the 7 x 7 circulant of the perfect
     * difference set {0, 1, 3} mod 7, has rank 4 over GF(2): its first row is 1 + x + x^3, which
     * divides x^7 − 1, and a circulant's rank is 7 − deg gcd(a(x), x^7 − 1) = 4 (worked by hand).
     */
    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "3 3 2\\n1 1\\n2 2      | column 3 (counting from 1) has no ones, so no check covers its bit; valid: at least one"
            + " one in every column",
        "3 3 3\\n1 1\\n2 2\\n3 3 | rank 3 over GF(2) equals its 3 columns, so the only codeword is zero; valid: rank below"
            + " the number of columns",
        "7 7 21\\n1 1\\n1 2\\n1 4\\n2 2\\n2 3\\n2 5\\n3 3\\n3 4\\n3 6\\n4 4\\n4 5\\n4 7\\n5 5\\n5 6\\n5 1\\n6 6\\n6 7\\n6 2"
            + "\\n7 7\\n7 1\\n7 3 | rank 4 over GF(2) is below its 7 rows: 3 row(s) are sums of others; valid: a matrix of"
            + " full row rank (remove the redundant rows)",
    })
    void refusesMatricesWithoutAUsableCode(String body, String expected) throws IOException {
        Path file = write("bad.mtx", "%%MatrixMarket matrix coordinate pattern general\n" + body.replace("\\n", "\n") + "\n");
        String message = assertThrows(IllegalArgumentException.class, () -> LdpcCodeFile.read(file)).getMessage();
        assertEquals("parity-check file " + file + ": " + expected, message);
    }

    /**
     * A QC base matrix of two rows and no zero block is rank-deficient: the 7 rows of each block row
     * add up to the all-ones row, so the two block rows' sums coincide (worked by hand).
     */
    @Test
    void refusesAQcMatrixWithoutZeroBlocks() throws IOException {
        Path file = write("full.yaml", "lifting: 7\nbase:\n  - [0, 1, 2, 3]\n  - [0, 2, 4, 6]\n");
        String message = assertThrows(IllegalArgumentException.class, () -> LdpcCodeFile.read(file)).getMessage();
        assertTrue(message.startsWith("parity-check file " + file + ": rank ") && message.contains(" over GF(2) is below"
                + " its 14 rows"), message);
    }

    /** Each problem of a YAML file: one line naming the file, the line and what is valid. */
    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "lifting: 4\\nbase: [[1, 2]\\n              | line 3: not valid YAML: ",
        "''                                         | : is empty; valid: a mapping with keys lifting",
        "- 1\\n- 2\\n                               | line 1: the top level is a list of 2, not a mapping",
        "lifting: 4\\n                              | line 1: the key 'base' is missing; valid: keys lifting, base",
        "base: [[0]]\\n                             | line 1: the key 'lifting' is missing",
        "lifting: 4\\nbase: [[0]]\\nshift: 2\\n     | line 3: unknown key 'shift'; valid: keys lifting, base",
        "lifting: 4\\nlifting: 4\\nbase: [[0]]\\n   | line 2: key 'lifting' given twice",
        "lifting: 0\\nbase: [[0]]\\n                | line 1: lifting is 0; valid: a whole number from 1 to 1024",
        "lifting: 2.5\\nbase: [[0]]\\n              | line 1: lifting is '2.5', not a whole number",
        "lifting: 4\\nbase: 3\\n                    | line 2: base is '3'; valid: a list of rows",
        "lifting: 4\\nbase: []\\n                   | line 2: base is a list of 0",
        "lifting: 4\\nbase:\\n  - [0, 1]\\n  - [2]\\n | line 4: base row 2 has 1 entries; valid: 2 entries in every row, as in row 1",
        "lifting: 4\\nbase:\\n  - [0, 1]\\n  - 2\\n  | line 4: base row 2 is '2'",
        "lifting: 4\\nbase: [[0, 4]]\\n             | line 2: base row 1, entry 2 is 4; valid: -1 (a zero block) or a shift"
            + " from 0 to 3 (lifting 4)",
        "lifting: 4\\nbase: [[0, -2]]\\n            | line 2: base row 1, entry 2 is -2",
        "lifting: 4\\nbase: [[0, x]]\\n             | line 2: base row 1, entry 2 is 'x', not a whole number",
        "lifting: 4\\nbase: [[0, '1']]\\n           | line 2: base row 1, entry 2 is '1', not a whole number",
        "lifting: 4\\nbase: [[0, 0x1]]\\n           | line 2: base row 1, entry 2 is '0x1', not a whole number",
        "lifting: 4\\nbase: [[0, -1], [1, -1]]\\n   | line 2: base column 2 is -1 in every row, so no check covers its 4"
            + " bits; valid: at least one shift in every column",
        "lifting: 300\\nbase: [[0, 0, 0, 0]]\\n     | line 1: lifting 300 with a 1 x 4 base matrix gives 300 x 1200; valid:"
            + " rows and columns up to 1024",
        "lifting: 100\\nbase: [[0, 0], [0, 1]]\\n   | line 2: the matrix has 400 ones; valid: at most 300",
    })
    void refusesEachYamlProblem(String text, String expected) throws IOException {
        Path file = write("qc.yaml", text.replace("\\n", "\n"));
        MatrixLimits limits = new MatrixLimits(4096, 1024, 300);
        String message = assertThrows(IllegalArgumentException.class, () -> LdpcCodeFile.read(file, limits))
                .getMessage();
        assertTrue(message.startsWith("parity-check file " + file + (expected.startsWith(":") ? "" : " ") + expected),
                message);
        assertFalse(message.contains("\n"), message);
    }

    /**
     * A 2^20 x 2^20 matrix is within the default limits on rows and columns but not within the
     * elimination's 2^25 words (2^20 x 2^14): refused before a shift is read, in either format.
     */
    @Test
    void refusesAShapeBeyondTheEliminationUpFront() throws IOException {
        String expected = "a 1048576 x 1048576 matrix is too large to derive its encoder: GF(2) elimination needs rows x"
                + " columns/64 = 17179869184 words of 64 bits; valid: at most 33554432 words (rows x columns up to"
                + " 2147483648)";
        Path yaml = write("big.yaml", "lifting: 65536\nbase:\n" + "  - [0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, x]\n"
                .repeat(16));
        assertEquals("parity-check file " + yaml + " line 1: " + expected,
                assertThrows(IllegalArgumentException.class, () -> LdpcCodeFile.read(yaml)).getMessage());
        Path mtx = write("big.mtx", "%%MatrixMarket matrix coordinate pattern general\n1048576 1048576 1\nx\n");
        assertEquals("parity-check file " + mtx + " line 2: " + expected,
                assertThrows(IllegalArgumentException.class, () -> LdpcCodeFile.read(mtx)).getMessage());
    }

    /**
     * The elimination's dense copy must fit in three quarters of the free heap: 512 rows of 16 words
     * take 512 x (16 + 128) bytes = 72 KiB (a long[] of 16 with its 16-byte header).
     */
    @Test
    void refusesAMatrixWhoseEliminationWouldNotFitTheHeap() {
        ParityCheckMatrix h = new QcBaseMatrix(new int[][] {{0, 0}}, 512).expand(); // [I I]: 512 x 1024, full rank
        LdpcCodeFile.check(h, "h.mtx", 72 * 1024 / 3 * 4);
        assertEquals("parity-check file h.mtx: the GF(2) elimination that derives the encoder of its 512 x 1024 matrix"
                + " needs about 1 MiB, but the Java heap has 1 MiB free; valid: a smaller matrix, or a larger heap (java"
                + " -Xmx...)", assertThrows(IllegalArgumentException.class,
                        () -> LdpcCodeFile.check(h, "h.mtx", 72 * 1024 / 3 * 4 - 4)).getMessage());
    }

    @Test
    void refusesOtherExtensionsAndFilesThatAreNotRegular() throws IOException {
        Path text = write("h.txt", "lifting: 1\nbase: [[0]]\n");
        assertEquals("parity-check file " + text + ": unknown extension; valid: .mtx, .yaml, .yml (Matrix Market, or a"
                + " quasi-cyclic base matrix in YAML)", assertThrows(IllegalArgumentException.class,
                        () -> LdpcCodeFile.read(text)).getMessage());
        Path folder = Files.createDirectory(dir.resolve("d.yaml"));
        assertEquals("parity-check file " + folder + ": is a folder; valid: a YAML base matrix",
                assertThrows(IllegalArgumentException.class, () -> LdpcCodeFile.read(folder)).getMessage());
        Path large = write("large.yaml", "lifting: 1\nbase: [[0]]\n" + "#".repeat(100) + "\n");
        assertEquals("parity-check file " + large + ": larger than the limit of 64 bytes; valid: a smaller file",
                assertThrows(IllegalArgumentException.class,
                        () -> LdpcCodeFile.read(large, new MatrixLimits(64, 16, 16))).getMessage());
    }
}
