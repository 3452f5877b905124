package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The layout written is the Matrix Market exchange format, coordinate pattern general: R. F.
 * Boisvert, R. Pozo, K. A. Remington, "The Matrix Market exchange formats: initial design", NISTIR
 * 5935, 1996 (banner, % comments, size line "rows columns entries", 1-based "row column" lines).
 */
class MatrixMarketWriterTest {

    @TempDir
    Path dir;

    private static String text(ParityCheckMatrix h, String comment) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        MatrixMarketWriter.write(h, comment, out);
        return out.toString(StandardCharsets.US_ASCII);
    }

    /** Hamming (7,4) written out in full: banner, comment, size line, entries by row (checked by hand). */
    @Test
    void writesTheHammingMatrixLineByLine() throws IOException {
        String expected = "%%MatrixMarket matrix coordinate pattern general\n"
                + "% Hamming (7,4) ? caf? with a break\n"
                + "3 7 12\n"
                + "1 4\n1 5\n1 6\n1 7\n"
                + "2 2\n2 3\n2 6\n2 7\n"
                + "3 1\n3 3\n3 5\n3 7\n";
        assertEquals(expected, text(ParityCheckMatrix.of(ParityCheckMatrixTest.HAMMING_7_4),
                "Hamming (7,4) \u2013 caf\u00e9 with\na break"));
    }

    /** Random sparse matrices (and a QC expansion) read back entry for entry through MatrixMarketReader. */
    @Test
    void roundTripsThroughTheReader() throws IOException {
        Random random = new Random(23);
        for (int trial = 0; trial < 20; trial++) {
            int rows = 1 + random.nextInt(40);
            int columns = 1 + random.nextInt(90);
            int[][] dense = new int[rows][columns];
            for (int[] row : dense) {
                for (int j = 0; j < columns; j++) {
                    row[j] = random.nextInt(5) == 0 ? 1 : 0;
                }
            }
            dense[0][0] = 1; // at least one entry: the size line's count must be at least 1 for the reader
            roundTrip(ParityCheckMatrix.of(dense), "trial " + trial);
        }
        roundTrip(new QcBaseMatrix(LdpcCodeFileTest.BASE, 37).expand(), "");
    }

    private void roundTrip(ParityCheckMatrix h, String comment) throws IOException {
        Path file = Files.writeString(dir.resolve("h.mtx"), text(h, comment), StandardCharsets.US_ASCII);
        LdpcCodeFileTest.assertSame(h, MatrixMarketReader.read(file));
    }
}
