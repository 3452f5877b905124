package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The layout read is the Matrix Market coordinate format (an open format; common practice, no source beyond its banner). */
class MatrixMarketReaderTest {

    @TempDir
    Path dir;

    private Path write(String text) throws IOException {
        Path file = dir.resolve("h.mtx");
        Files.writeString(file, text, StandardCharsets.US_ASCII);
        return file;
    }

    /** The Hamming (7,4) matrix written in both fields reads back entry for entry. */
    @Test
    void readsPatternAndIntegerFiles() throws IOException {
        ParityCheckMatrix expected = ParityCheckMatrix.of(ParityCheckMatrixTest.HAMMING_7_4);
        StringBuilder pattern = new StringBuilder("%%MatrixMarket matrix coordinate pattern general\n% Hamming (7,4)\n\n3 7 12\n");
        StringBuilder integer = new StringBuilder("%%matrixmarket MATRIX Coordinate INTEGER general\n3 7 14\n");
        for (int j = 6; j >= 0; j--) { // any order
            for (int i = 0; i < 3; i++) {
                if (ParityCheckMatrixTest.HAMMING_7_4[i][j] == 1) {
                    pattern.append(i + 1).append(' ').append(j + 1).append('\n');
                    integer.append(' ').append(i + 1).append("\t").append(j + 1).append(" 1 \n");
                }
            }
        }
        integer.append("1 1 0\n2 1 0\n\n");
        for (String text : new String[] {pattern.toString(), integer.toString()}) {
            ParityCheckMatrix h = MatrixMarketReader.read(write(text));
            assertEquals(3, h.rows());
            assertEquals(7, h.columns());
            assertEquals(12, h.edges());
            for (int i = 0; i < 3; i++) {
                for (int j = 0; j < 7; j++) {
                    assertEquals(expected.get(i, j), h.get(i, j));
                }
            }
        }
    }

    /** Each problem: the message is one line naming the file, the line and the problem. */
    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "''                                                                   | line 1: not a Matrix Market banner",
        "%%MatrixMarket matrix array pattern general\\n2 2\\n                 | line 1: format 'array'",
        "%%MatrixMarket matrix coordinate real general\\n2 2 1\\n1 1 1.0\\n   | line 1: field 'real'",
        "%%MatrixMarket matrix coordinate pattern symmetric\\n2 2 1\\n1 1\\n  | line 1: symmetry 'symmetric'",
        "%%MatrixMarket matrix coordinate pattern general\\n% only comments\\n | line 2: no size line",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2\\n            | line 2: size line '2 2'",
        "%%MatrixMarket matrix coordinate pattern general\\n0 2 1\\n1 1\\n     | line 2: rows '0'",
        "%%MatrixMarket matrix coordinate pattern general\\n2 x 1\\n1 1\\n     | line 2: columns 'x'",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 -1\\n         | line 2: entries '-1'",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 65\\n         | line 2: entries '65'; valid: a whole number from 1 to 64",
        "%%MatrixMarket matrix coordinate pattern general\\n40 2 1\\n1 1\\n    | line 2: rows '40'; valid: a whole number from 1 to 32",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 2\\n1 1\\n     | line 3: the file ends after 1 of the 2 entries",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 2\\n1 1\\n\\n2 2\\n | line 4: entry ''",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 1\\n1 1 1\\n   | line 3: entry '1 1 1'",
        "%%MatrixMarket matrix coordinate integer general\\n2 2 1\\n1 1\\n     | line 3: entry '1 1'",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 1\\n3 1\\n     | line 3: row '3'; valid: a whole number from 1 to 2",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 1\\n1 0\\n     | line 3: column '0'",
        "%%MatrixMarket matrix coordinate integer general\\n2 2 1\\n1 1 2\\n   | line 3: value '2'; valid: 0 or 1",
        "%%MatrixMarket matrix coordinate integer general\\n2 2 1\\n1 1 -1\\n  | line 3: value '-1'",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 1\\n1 1\\n2 2\\n | line 4: more entries than the 1",
        "%%MatrixMarket matrix coordinate pattern general\\n2 2 3\\n1 2\\n2 1\\n1 2\\n | line 5: entry (1, 2) given again (first on line 3)",
    })
    void refusesEachProblemWithTheLine(String text, String expected) throws IOException {
        Path file = write(text.replace("\\n", "\n"));
        MatrixLimits limits = new MatrixLimits(1000, 32, 64);
        String message = assertThrows(IllegalArgumentException.class, () -> MatrixMarketReader.read(file, limits))
                .getMessage();
        assertTrue(message.startsWith("parity-check file " + file + " " + expected), message);
        assertFalse(message.contains("\n"), message);
    }

    @Test
    void refusesFilesThatAreMissingTooLargeOrNotRegular() throws IOException {
        String missing = assertThrows(IllegalArgumentException.class,
                () -> MatrixMarketReader.read(dir.resolve("none.mtx"))).getMessage();
        assertTrue(missing.endsWith("none.mtx: no such file; valid: a Matrix Market file"), missing);
        String folder = assertThrows(IllegalArgumentException.class, () -> MatrixMarketReader.read(dir)).getMessage();
        assertTrue(folder.contains(": is a folder"), folder);
        Path device = Path.of("/dev/null");
        if (Files.exists(device)) {
            String special = assertThrows(IllegalArgumentException.class, () -> MatrixMarketReader.read(device)).getMessage();
            assertTrue(special.endsWith(": not a regular file (a pipe or a device?); valid: a Matrix Market file"), special);
        }
        Path file = write("%%MatrixMarket matrix coordinate pattern general\n1 1 1\n1 1\n");
        assertEquals(1, MatrixMarketReader.read(file, new MatrixLimits(Files.size(file), 1, 1)).edges());
        String large = assertThrows(IllegalArgumentException.class,
                () -> MatrixMarketReader.read(file, new MatrixLimits(Files.size(file) - 1, 1, 1))).getMessage();
        assertTrue(large.contains(": larger than the limit of " + (Files.size(file) - 1) + " bytes"), large);
    }
}
