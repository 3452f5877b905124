package org.fadebench.coding.fec.ldpc;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;

/**
 * Writes a parity-check matrix in the Matrix Market exchange format, coordinate pattern general
 * (R. F. Boisvert, R. Pozo, K. A. Remington, "The Matrix Market exchange formats: initial design",
 * NISTIR 5935, National Institute of Standards and Technology, 1996): the banner
 * {@code %%MatrixMarket matrix coordinate pattern general}, comment lines starting with {@code %},
 * the size line "rows columns ones", then one line "row column" (1-based) per one, row by row and
 * ascending within a row. Plain ASCII; {@link MatrixMarketReader} reads it back. The caller owns
 * the stream and makes the file atomic (bench writes it through its atomic file writer).
 */
public final class MatrixMarketWriter {

    private MatrixMarketWriter() {
    }

    /**
     * Writes {@code h} to {@code out} (flushed, not closed).
     *
     * @param comment one comment line (without the {@code %}); line breaks become spaces and any
     *        character outside printable ASCII becomes {@code ?}; empty for none
     */
    public static void write(ParityCheckMatrix h, String comment, OutputStream out) throws IOException {
        Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.US_ASCII), 1 << 16);
        w.write("%%MatrixMarket matrix coordinate pattern general\n");
        if (!comment.isEmpty()) {
            w.write("% " + ascii(comment) + "\n");
        }
        w.write(h.rows() + " " + h.columns() + " " + h.edges() + "\n");
        for (int i = 0; i < h.rows(); i++) {
            String row = Integer.toString(i + 1);
            for (int p = 0; p < h.rowDegree(i); p++) {
                w.write(row);
                w.write(' ');
                w.write(Integer.toString(h.rowEntry(i, p) + 1));
                w.write('\n');
            }
        }
        w.flush();
    }

    private static String ascii(String text) {
        StringBuilder sb = new StringBuilder(text.length());
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            sb.append(c == '\n' || c == '\r' || c == '\t' ? ' ' : c >= 32 && c < 127 ? c : '?');
        }
        return sb.toString();
    }
}
