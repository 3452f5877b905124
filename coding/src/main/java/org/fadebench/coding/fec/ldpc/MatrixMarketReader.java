package org.fadebench.coding.fec.ldpc;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;

/**
 * Reads a parity-check matrix in the Matrix Market coordinate format (an open format). The layout:
 * <pre>
 * %%MatrixMarket matrix coordinate pattern general     (or: ... coordinate integer general)
 * % comment lines, any number
 * 3 7 12                                               rows, columns, entries
 * 1 4                                                  1-based row and column; integer: row col value
 * ...                                                  exactly "entries" lines, one entry each
 * </pre>
 * The banner's words are read without regard to case. Blank lines may stand among the comments and
 * after the last entry, not among the entries. An {@code integer} value must be 0 or 1; a 0 entry is
 * skipped. Limits against hostile files ({@link MatrixLimits}, shared with the other formats): a
 * regular file of at most {@code fileBytes} bytes, rows and columns up to {@code dimension}, entry
 * lines up to {@code edges}, a shape within the GF(2) elimination's words (checked at the size
 * line, before any entry is read); an entry given twice or outside the declared size is refused.
 * Arrays grow with the entries actually read, never from the count the file claims. Every problem is an {@link IllegalArgumentException} with
 * a one-line message naming the file, the line and what is valid.
 */
public final class MatrixMarketReader {

    private static final String BANNER_FORM = "%%MatrixMarket matrix coordinate pattern|integer general";
    private static final int KEY_BITS = 20; // a 0-based row or column index below 2^20
    private static final int ORDINAL_BITS = 24; // an entry's ordinal below 2^24

    private MatrixMarketReader() {
    }

    /** Reads {@code file} within the {@link MatrixLimits#DEFAULT default limits}. */
    public static ParityCheckMatrix read(Path file) {
        return read(file, MatrixLimits.DEFAULT);
    }

    /** Reads {@code file} within {@code limits}. */
    public static ParityCheckMatrix read(Path file, MatrixLimits limits) {
        String name = file.toString();
        try {
            checkFile(file, limits.fileBytes(), "a Matrix Market file");
            try (BufferedReader in = Files.newBufferedReader(file, StandardCharsets.US_ASCII)) {
                return new Parser(name, limits, in).matrix();
            }
        } catch (IOException e) {
            throw new IllegalArgumentException("parity-check file " + name + ": cannot be read ("
                    + e.getClass().getSimpleName() + "); valid: a readable ASCII Matrix Market file");
        }
    }

    /**
     * Refuses, in one line naming the file, a path that is not a regular file (missing, a folder, a
     * pipe or a device: such a file is never opened) or is larger than {@code maxBytes}.
     *
     * @param valid what the file should be, for the message
     */
    static void checkFile(Path file, long maxBytes, String valid) throws IOException {
        if (!Files.isRegularFile(file)) {
            throw new IllegalArgumentException("parity-check file " + file + ": "
                    + (Files.isDirectory(file) ? "is a folder"
                            : Files.exists(file) ? "not a regular file (a pipe or a device?)" : "no such file")
                    + "; valid: " + valid);
        }
        if (Files.size(file) > maxBytes) {
            throw new IllegalArgumentException("parity-check file " + file + ": larger than the limit of "
                    + maxBytes + " bytes; valid: a smaller file");
        }
    }

    private static final class Parser {

        private final String name;
        private final MatrixLimits limits;
        private final BufferedReader in;
        private int lineNumber;

        Parser(String name, MatrixLimits limits, BufferedReader in) {
            this.name = name;
            this.limits = limits;
            this.in = in;
        }

        ParityCheckMatrix matrix() throws IOException {
            boolean integer = field(next());
            String size = next();
            while (size != null && (size.isBlank() || size.startsWith("%"))) {
                size = next();
            }
            if (size == null) {
                throw error("no size line; valid: a line 'rows columns entries' after the comments");
            }
            String[] dims = size.trim().split("\\s+");
            if (dims.length != 3) {
                throw error("size line '" + size.trim() + "'; valid: three whole numbers 'rows columns entries'");
            }
            int rows = whole(dims[0], "rows", limits.dimension());
            int columns = whole(dims[1], "columns", limits.dimension());
            int entries = whole(dims[2], "entries", limits.edges());
            String dense = MatrixLimits.denseProblem(rows, columns);
            if (dense != null) {
                throw error(dense);
            }
            int sizeLine = lineNumber;
            long[] keys = new long[Math.min(entries, 1 << 12)];
            int kept = 0;
            for (int e = 0; e < entries; e++) {
                String line = next();
                if (line == null) {
                    throw error("the file ends after " + e + " of the " + entries + " entries the size line declares; "
                            + "valid: one entry per line");
                }
                String[] t = line.trim().split("\\s+");
                if (t.length != (integer ? 3 : 2) || t[0].isEmpty()) {
                    throw error("entry '" + line.trim() + "'; valid: " + (integer ? "'row column value'" : "'row column'")
                            + " with no blank line among the entries");
                }
                int r = whole(t[0], "row", rows);
                int c = whole(t[1], "column", columns);
                if (integer) {
                    if (!t[2].equals("0") && !t[2].equals("1")) {
                        throw error("value '" + t[2] + "'; valid: 0 or 1");
                    }
                    if (t[2].equals("0")) {
                        continue;
                    }
                }
                if (kept == keys.length) {
                    keys = Arrays.copyOf(keys, Math.min(entries, 2 * kept));
                }
                keys[kept++] = ((((long) (r - 1) << KEY_BITS) | (c - 1)) << ORDINAL_BITS) | e;
            }
            for (String line = next(); line != null; line = next()) {
                if (!line.isBlank()) {
                    throw error("more entries than the " + entries + " the size line declares; valid: exactly "
                            + entries + " entry lines");
                }
            }
            return build(keys, kept, rows, columns, sizeLine);
        }

        /** Sorts the entries, refuses one given twice (naming both lines) and builds the matrix. */
        private ParityCheckMatrix build(long[] keys, int kept, int rows, int columns, int sizeLine) {
            Arrays.sort(keys, 0, kept); // by row, column, then ordinal: equal entries end up side by side
            int[] r = new int[kept];
            int[] c = new int[kept];
            long mask = (1L << ORDINAL_BITS) - 1;
            for (int e = 0; e < kept; e++) {
                long key = keys[e] >>> ORDINAL_BITS;
                if (e > 0 && key == keys[e - 1] >>> ORDINAL_BITS) {
                    lineNumber = sizeLine + 1 + (int) (keys[e] & mask);
                    throw error("entry (" + ((key >>> KEY_BITS) + 1) + ", " + ((key & ((1 << KEY_BITS) - 1)) + 1)
                            + ") given again (first on line " + (sizeLine + 1 + (keys[e - 1] & mask))
                            + "); valid: each entry once");
                }
                r[e] = (int) (key >>> KEY_BITS);
                c[e] = (int) (key & ((1 << KEY_BITS) - 1));
            }
            return ParityCheckMatrix.of(rows, columns, r, c, kept);
        }

        /** The next line (counted), or null at the end of the file. */
        private String next() throws IOException {
            String line = in.readLine();
            if (line != null) {
                lineNumber++;
            }
            return line;
        }

        /** Checks the banner; true for the integer field, false for pattern. */
        private boolean field(String banner) {
            lineNumber = 1; // also for an empty file
            String[] t = banner == null ? new String[0] : banner.trim().toLowerCase(Locale.ROOT).split("\\s+");
            if (t.length != 5 || !t[0].equals("%%matrixmarket") || !t[1].equals("matrix")) {
                throw error("not a Matrix Market banner; valid: '" + BANNER_FORM + "' as the first line");
            }
            if (!t[2].equals("coordinate")) {
                throw error("format '" + t[2] + "'; valid: coordinate");
            }
            if (!t[3].equals("pattern") && !t[3].equals("integer")) {
                throw error("field '" + t[3] + "'; valid: pattern or integer (0/1 entries)");
            }
            if (!t[4].equals("general")) {
                throw error("symmetry '" + t[4] + "'; valid: general");
            }
            return t[3].equals("integer");
        }

        /** A whole number from 1 to {@code max}. */
        private int whole(String text, String what, int max) {
            long v = -1;
            if (text.matches("[0-9]{1,10}")) {
                v = Long.parseLong(text);
            }
            if (v < 1 || v > max) {
                throw error(what + " '" + text + "'; valid: a whole number from 1 to " + max);
            }
            return (int) v;
        }

        private IllegalArgumentException error(String problem) {
            return new IllegalArgumentException("parity-check file " + name + " line " + lineNumber + ": " + problem);
        }
    }
}
