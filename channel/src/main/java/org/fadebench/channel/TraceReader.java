package org.fadebench.channel;

import java.io.BufferedInputStream;
import java.io.EOFException;
import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import org.apache.commons.compress.MemoryLimitException;
import org.apache.commons.compress.compressors.CompressorException;
import org.apache.commons.compress.compressors.CompressorStreamFactory;

/**
 * Reads channel traces (see {@link ChannelTrace}); every content problem becomes a one-line
 * {@link IllegalArgumentException} that starts with the file name, every failure to open or read
 * the file an {@link UncheckedIOException}.
 */
final class TraceReader {

    /** First line of our CSV layout. */
    static final String CSV_FIRST_LINE = "# fadebench channel trace";
    private static final byte[] NPY_MAGIC = {(byte) 0x93, 'N', 'U', 'M', 'P', 'Y'};
    private static final int MAX_HEADER = 65_536;
    private static final int MAX_LINE = 1 << 20;
    /** Largest double[] the JVM hands out safely. */
    private static final long MAX_ARRAY = Integer.MAX_VALUE - 8;
    /** Memory the xz decoder may use (its dictionary), in KiB. */
    static final int DECODER_MEMORY_KIB = 128 * 1024;
    private static final int CHUNK = 1 << 16;

    private TraceReader() {
    }

    static ChannelTrace read(Path file, TraceLimits limits) {
        String name = file.toString();
        if (Files.isDirectory(file)) {
            throw bad(name, "is a folder, not a trace file");
        }
        if (Files.exists(file) && !Files.isRegularFile(file)) {
            throw bad(name, "not a regular file (a pipe or a device?); give a trace file");
        }
        InputStream raw;
        try {
            raw = Files.newInputStream(file);
        } catch (IOException e) {
            throw new UncheckedIOException(name + ": cannot open: " + describe(e), e);
        }
        try (InputStream fileSide = new FileSide(raw, name);
             InputStream content = new Bounded(decompress(new BufferedInputStream(fileSide, CHUNK), name),
                     limits.maxBytes(), name);
             BufferedInputStream in = new BufferedInputStream(content, CHUNK)) {
            in.mark(NPY_MAGIC.length);
            byte[] magic = new byte[NPY_MAGIC.length];
            int got = readFully(in, magic, 0, magic.length);
            if (got == 0) {
                throw bad(name, "the file is empty");
            }
            if (got == magic.length && Arrays.equals(magic, NPY_MAGIC)) {
                return readNpy(in, name, limits);
            }
            in.reset();
            return readCsv(in, name, limits);
        } catch (MemoryLimitException e) {
            throw bad(name, "decompressing needs more than the limit of " + DECODER_MEMORY_KIB / 1024
                    + " MiB of memory");
        } catch (IOException e) {
            throw bad(name, "corrupt or truncated compressed data: " + describe(e));
        }
    }

    /** The decompressed stream, or {@code in} itself when the content has no known compression magic. */
    private static InputStream decompress(BufferedInputStream in, String name) throws IOException {
        String kind;
        try {
            kind = CompressorStreamFactory.detect(in);
        } catch (CompressorException e) {
            if (e.getCause() instanceof IOException) {
                throw (IOException) e.getCause();
            }
            return in;
        }
        if (!kind.equals(CompressorStreamFactory.GZIP) && !kind.equals(CompressorStreamFactory.XZ)
                && !kind.equals(CompressorStreamFactory.BZIP2) && !kind.equals(CompressorStreamFactory.ZSTANDARD)) {
            throw bad(name, "unsupported compression '" + kind + "' (gz, xz, bz2 and zst are read)");
        }
        try {
            return new CompressorStreamFactory(true, DECODER_MEMORY_KIB).createCompressorInputStream(kind, in);
        } catch (CompressorException e) {
            if (e.getCause() instanceof IOException) {
                throw (IOException) e.getCause();
            }
            throw bad(name, "cannot decompress " + kind + ": " + describe(e));
        }
    }

    // ---------------------------------------------------------------- NumPy

    private static ChannelTrace readNpy(InputStream in, String name, TraceLimits limits) throws IOException {
        int major = in.read();
        int minor = in.read();
        if (major < 0 || minor < 0) {
            throw bad(name, "truncated .npy header");
        }
        if (major < 1 || major > 3 || minor != 0) {
            throw bad(name, "unsupported .npy version " + major + "." + minor + " (1.0, 2.0 and 3.0 are read)");
        }
        int lengthBytes = major == 1 ? 2 : 4;
        byte[] lengthField = new byte[lengthBytes];
        if (readFully(in, lengthField, 0, lengthBytes) < lengthBytes) {
            throw bad(name, "truncated .npy header");
        }
        long headerLength = 0;
        for (int i = lengthBytes - 1; i >= 0; i--) {
            headerLength = (headerLength << 8) | (lengthField[i] & 0xFF);
        }
        if (headerLength > MAX_HEADER) {
            throw bad(name, ".npy header of " + headerLength + " bytes is longer than " + MAX_HEADER);
        }
        byte[] header = new byte[(int) headerLength];
        if (readFully(in, header, 0, header.length) < header.length) {
            throw bad(name, "truncated .npy header");
        }
        Map<String, Object> dict = new NpyHeader(new String(header, StandardCharsets.ISO_8859_1), name).parse();

        Object descr = dict.get("descr");
        int itemSize;
        if ("<c16".equals(descr) || ">c16".equals(descr)) {
            itemSize = 16;
        } else if ("<c8".equals(descr) || ">c8".equals(descr)) {
            itemSize = 8;
        } else {
            throw bad(name, "unsupported dtype " + show(descr) + " (complex128 or complex64: '<c16', '<c8', '>c16', '>c8')");
        }
        ByteOrder order = ((String) descr).charAt(0) == '<' ? ByteOrder.LITTLE_ENDIAN : ByteOrder.BIG_ENDIAN;
        if (!Boolean.FALSE.equals(dict.get("fortran_order"))) {
            throw bad(name, "fortran_order must be False (C order only), got " + show(dict.get("fortran_order")));
        }
        if (!(dict.get("shape") instanceof long[]) || ((long[]) dict.get("shape")).length != 3) {
            throw bad(name, "shape must be (N, Nr, Mt), got " + show(dict.get("shape")));
        }
        long[] shape = (long[]) dict.get("shape");
        int[] nrMt = checkShape(shape[1], shape[2], name);
        int nr = nrMt[0];
        int mt = nrMt[1];
        long count = shape[0];
        checkCount(count, nr, mt, name, limits);
        long dataBytes = count * nr * mt * itemSize;
        if (dataBytes > limits.maxBytes()) {
            throw bad(name, "data of " + dataBytes + " bytes exceeds the limit of " + limits.maxBytes() + " bytes");
        }

        // the header's claim is not trusted with memory: the array grows as the data arrives
        long values = 2 * count * nr * mt;
        double[] data = new double[(int) Math.min(values, CHUNK)];
        int per = nr * mt;
        byte[] chunk = new byte[CHUNK];
        ByteBuffer buffer = ByteBuffer.wrap(chunk).order(order);
        long done = 0;
        int entry = 0;
        while (done < dataBytes) {
            int want = (int) Math.min(CHUNK, dataBytes - done);
            int got = readFully(in, chunk, 0, want);
            if (got < want) {
                throw bad(name, "truncated: data ends after " + (done + got) + " of " + dataBytes + " bytes");
            }
            buffer.clear();
            long needed = 2L * (entry + want / itemSize);
            if (needed > data.length) {
                data = Arrays.copyOf(data, (int) Math.min(values, Math.max(needed, 2L * data.length)));
            }
            for (int i = 0; i < want / itemSize; i++, entry++) {
                double re = itemSize == 16 ? buffer.getDouble() : buffer.getFloat();
                double im = itemSize == 16 ? buffer.getDouble() : buffer.getFloat();
                if (!Double.isFinite(re) || !Double.isFinite(im)) {
                    throw bad(name, entry(entry / per, entry % per, nr, mt) + " is not finite");
                }
                data[2 * entry] = re;
                data[2 * entry + 1] = im;
            }
            done += want;
        }
        if (in.read() != -1) {
            throw bad(name, "trailing bytes after the " + count + " x " + nr + " x " + mt + " array");
        }
        return new ChannelTrace(name, nr, mt, (int) count, data);
    }

    /**
     * The header dictionary of a .npy file, a Python literal such as
     * {@code {'descr': '<c16', 'fortran_order': False, 'shape': (10, 2, 2), }}: exactly the keys
     * descr (a string), fortran_order (True or False) and shape (a tuple of whole numbers).
     */
    private static final class NpyHeader {
        private final String text;
        private final String name;
        private int pos;

        NpyHeader(String text, String name) {
            this.text = text;
            this.name = name;
        }

        Map<String, Object> parse() {
            Map<String, Object> dict = new HashMap<>();
            expect('{');
            while (peek() != '}') {
                String key = string();
                expect(':');
                Object value = value();
                if (!key.equals("descr") && !key.equals("fortran_order") && !key.equals("shape")) {
                    throw malformed("unknown key '" + key + "'");
                }
                if (dict.put(key, value) != null) {
                    throw malformed("duplicate key '" + key + "'");
                }
                if (peek() != ',') {
                    break;
                }
                pos++;
            }
            expect('}');
            skipSpace();
            if (pos != text.length()) {
                throw malformed("unexpected text after the dictionary at character " + pos);
            }
            for (String key : new String[] {"descr", "fortran_order", "shape"}) {
                if (!dict.containsKey(key)) {
                    throw malformed("missing key '" + key + "'");
                }
            }
            return dict;
        }

        private Object value() {
            char c = peek();
            if (c == '\'' || c == '"') {
                return string();
            }
            if (c == '(') {
                return tuple();
            }
            if (text.startsWith("True", pos)) {
                pos += 4;
                return Boolean.TRUE;
            }
            if (text.startsWith("False", pos)) {
                pos += 5;
                return Boolean.FALSE;
            }
            throw malformed("unexpected value at character " + pos);
        }

        private long[] tuple() {
            expect('(');
            long[] items = new long[0];
            while (peek() != ')') {
                int start = pos;
                while (pos < text.length() && pos - start < 18 && Character.isDigit(text.charAt(pos))
                        && text.charAt(pos) < 128) {
                    pos++;
                }
                if (pos == start || (pos < text.length() && Character.isDigit(text.charAt(pos)))) {
                    throw malformed("expected a whole number of at most 18 digits at character " + start);
                }
                items = Arrays.copyOf(items, items.length + 1);
                items[items.length - 1] = Long.parseLong(text.substring(start, pos));
                if (peek() != ',') {
                    break;
                }
                pos++;
            }
            expect(')');
            return items;
        }

        private String string() {
            char quote = peek();
            if (quote != '\'' && quote != '"') {
                throw malformed("expected a quoted string at character " + pos);
            }
            int end = text.indexOf(quote, pos + 1);
            if (end < 0) {
                throw malformed("unterminated string at character " + pos);
            }
            String s = text.substring(pos + 1, end);
            if (s.indexOf('\\') >= 0) {
                throw malformed("escape sequences are not supported (character " + pos + ")");
            }
            pos = end + 1;
            return s;
        }

        private void expect(char c) {
            if (peek() != c) {
                throw malformed("expected '" + c + "' at character " + pos);
            }
            pos++;
        }

        /** The next character after blanks, or 0 at the end. */
        private char peek() {
            skipSpace();
            return pos < text.length() ? text.charAt(pos) : 0;
        }

        private void skipSpace() {
            while (pos < text.length() && (text.charAt(pos) == ' ' || text.charAt(pos) == '\n')) {
                pos++;
            }
        }

        private IllegalArgumentException malformed(String problem) {
            return bad(name, "malformed .npy header: " + problem);
        }
    }

    // ---------------------------------------------------------------- CSV

    private static ChannelTrace readCsv(InputStream in, String name, TraceLimits limits) throws IOException {
        Lines lines = new Lines(in, name);
        String first = lines.next();
        if (first == null || !first.strip().equals(CSV_FIRST_LINE)) {
            throw bad(name, "neither a NumPy .npy file nor a channel trace CSV (whose first line is '"
                    + CSV_FIRST_LINE + "')");
        }
        String line = lines.nextContent();
        if (line == null) {
            throw bad(name, "no 'Nr,Mt' line after the first line");
        }
        String[] size = line.split(",", -1);
        long nrValue = size.length == 2 ? wholeNumber(size[0]) : -1;
        long mtValue = size.length == 2 ? wholeNumber(size[1]) : -1;
        if (nrValue < 0 || mtValue < 0) {
            throw bad(name, "line " + lines.number + ": expected 'Nr,Mt' (two whole numbers), got '" + clip(line) + "'");
        }
        int[] nrMt = checkShape(nrValue, mtValue, name);
        int nr = nrMt[0];
        int mt = nrMt[1];
        int fields = 2 * nr * mt;
        double[] data = new double[fields * 16];
        long count = 0;
        while ((line = lines.nextContent()) != null) {
            if (count == limits.maxMatrices()) {
                throw bad(name, "more matrices than the limit of " + limits.maxMatrices());
            }
            long start = count * fields;
            if (start + fields > data.length) {
                long grown = Math.min(2L * data.length, MAX_ARRAY / fields * fields);
                if (grown < start + fields) {
                    throw bad(name, "too many matrices to hold in memory");
                }
                data = Arrays.copyOf(data, (int) grown);
            }
            int field = 0;
            int from = 0;
            while (true) {
                int comma = line.indexOf(',', from);
                String token = comma < 0 ? line.substring(from) : line.substring(from, comma);
                if (field == fields) {
                    throw bad(name, "line " + lines.number + ": more than " + fields + " numbers (2·Nr·Mt)");
                }
                data[(int) start + field] = number(token, name, lines.number, field + 1);
                field++;
                if (comma < 0) {
                    break;
                }
                from = comma + 1;
            }
            if (field != fields) {
                throw bad(name, "line " + lines.number + ": expected " + fields + " numbers (2·Nr·Mt), got " + field);
            }
            count++;
        }
        if (count == 0) {
            throw bad(name, "holds no matrices");
        }
        return new ChannelTrace(name, nr, mt, (int) count, Arrays.copyOf(data, (int) (count * fields)));
    }

    /** A decimal number: digits, sign, point and exponent only (no NaN, Infinity, hex or suffixes). */
    private static double number(String token, String name, long line, int field) {
        String t = token.strip();
        boolean plain = !t.isEmpty();
        for (int i = 0; i < t.length() && plain; i++) {
            char c = t.charAt(i);
            plain = (c >= '0' && c <= '9') || c == '+' || c == '-' || c == '.' || c == 'e' || c == 'E';
        }
        double v;
        try {
            v = plain ? Double.parseDouble(t) : Double.NaN;
        } catch (NumberFormatException e) {
            plain = false;
            v = Double.NaN;
        }
        if (!plain) {
            throw bad(name, "line " + line + ", field " + field + ": '" + clip(t) + "' is not a number");
        }
        if (!Double.isFinite(v)) {
            throw bad(name, "line " + line + ", field " + field + ": '" + clip(t) + "' is not finite");
        }
        return v;
    }

    /** The whole number in {@code s} (1 to 9 digits, blanks around allowed), or −1. */
    private static long wholeNumber(String s) {
        String t = s.strip();
        if (t.isEmpty() || t.length() > 9) {
            return -1;
        }
        for (int i = 0; i < t.length(); i++) {
            if (t.charAt(i) < '0' || t.charAt(i) > '9') {
                return -1;
            }
        }
        return Long.parseLong(t);
    }

    /** Lines of text, each at most {@value #MAX_LINE} characters, read byte-wise as ISO-8859-1. */
    private static final class Lines {
        private final InputStream in;
        private final String name;
        private final byte[] buffer = new byte[CHUNK];
        private final StringBuilder line = new StringBuilder();
        private int length;
        private int next;
        long number;

        Lines(InputStream in, String name) {
            this.in = in;
            this.name = name;
        }

        /** The next line without its end ('\n' or "\r\n"), or null at the end of the content. */
        String next() throws IOException {
            line.setLength(0);
            boolean any = false;
            while (true) {
                if (next == length) {
                    length = in.read(buffer, 0, buffer.length);
                    next = 0;
                    if (length <= 0) {
                        length = 0;
                        break;
                    }
                }
                any = true;
                char c = (char) (buffer[next++] & 0xFF);
                if (c == '\n') {
                    break;
                }
                if (line.length() == MAX_LINE) {
                    throw bad(name, "line " + (number + 1) + " is longer than " + MAX_LINE + " characters");
                }
                line.append(c);
            }
            if (!any) {
                return null;
            }
            number++;
            int end = line.length();
            if (end > 0 && line.charAt(end - 1) == '\r') {
                line.setLength(end - 1);
            }
            return line.toString();
        }

        /** The next line that is neither blank nor a comment ('#' first), or null. */
        String nextContent() throws IOException {
            String s;
            while ((s = next()) != null) {
                String t = s.strip();
                if (!t.isEmpty() && t.charAt(0) != '#') {
                    return s;
                }
            }
            return null;
        }
    }

    // ---------------------------------------------------------------- shared

    private static int[] checkShape(long nr, long mt, String name) {
        if (nr < 1 || nr > Antennas.MAX || mt < 1 || mt > Antennas.MAX) {
            throw bad(name, "matrices of " + nr + " x " + mt + " (Nr x Mt): both must be 1 to "
                    + Antennas.MAX);
        }
        return new int[] {(int) nr, (int) mt};
    }

    private static void checkCount(long count, int nr, int mt, String name, TraceLimits limits) {
        if (count < 1) {
            throw bad(name, "holds no matrices");
        }
        if (count > limits.maxMatrices()) {
            throw bad(name, "holds " + count + " matrices, more than the limit of " + limits.maxMatrices());
        }
        if (count > MAX_ARRAY / (2L * nr * mt)) {
            throw bad(name, "holds " + count + " matrices, too many to hold in memory");
        }
    }

    /** "matrix i, entry (r, t)" for complex entry {@code e} (0 .. Nr·Mt−1) of matrix {@code i}. */
    static String entry(long matrix, int e, int nr, int mt) {
        return "matrix " + matrix + ", entry (" + e / mt + ", " + e % mt + ")";
    }

    private static int readFully(InputStream in, byte[] b, int off, int len) throws IOException {
        int total = 0;
        while (total < len) {
            int n = in.read(b, off + total, len - total);
            if (n < 0) {
                break;
            }
            total += n;
        }
        return total;
    }

    static IllegalArgumentException bad(String name, String problem) {
        return new IllegalArgumentException(name + ": " + problem);
    }

    private static String show(Object value) {
        if (value instanceof long[]) {
            return Arrays.toString((long[]) value).replace('[', '(').replace(']', ')');
        }
        if (value instanceof Boolean) {
            return (Boolean) value ? "True" : "False";
        }
        return value instanceof String ? "'" + value + "'" : String.valueOf(value);
    }

    private static String clip(String s) {
        return s.length() <= 40 ? s : s.substring(0, 40) + "...";
    }

    private static String describe(Throwable e) {
        if (e instanceof NoSuchFileException) {
            return "no such file";
        }
        if (e instanceof AccessDeniedException) {
            return "access denied";
        }
        if (e instanceof EOFException) {
            return "unexpected end of data";
        }
        String m = e.getMessage();
        return (m == null ? e.getClass().getSimpleName() : m).replace('\n', ' ');
    }

    /** The file as read from disk: a read failure is an I/O error, not bad content. */
    private static final class FileSide extends FilterInputStream {
        private final String name;

        FileSide(InputStream in, String name) {
            super(in);
            this.name = name;
        }

        @Override
        public int read() {
            try {
                return super.read();
            } catch (IOException e) {
                throw failure(e);
            }
        }

        @Override
        public int read(byte[] b, int off, int len) {
            try {
                return super.read(b, off, len);
            } catch (IOException e) {
                throw failure(e);
            }
        }

        @Override
        public long skip(long n) {
            try {
                return super.skip(n);
            } catch (IOException e) {
                throw failure(e);
            }
        }

        private UncheckedIOException failure(IOException e) {
            return new UncheckedIOException(name + ": cannot read: " + describe(e), e);
        }
    }

    /** Counts content bytes and refuses to go past the limit (against decompression bombs). */
    private static final class Bounded extends FilterInputStream {
        private final long limit;
        private final String name;
        private long count;

        Bounded(InputStream in, long limit, String name) {
            super(in);
            this.limit = limit;
            this.name = name;
        }

        @Override
        public int read() throws IOException {
            int b = super.read();
            if (b >= 0) {
                add(1);
            }
            return b;
        }

        @Override
        public int read(byte[] b, int off, int len) throws IOException {
            int n = super.read(b, off, len);
            if (n > 0) {
                add(n);
            }
            return n;
        }

        @Override
        public long skip(long n) throws IOException {
            long s = super.skip(n);
            add(s);
            return s;
        }

        @Override
        public boolean markSupported() {
            return false;
        }

        private void add(long n) {
            count += n;
            if (count > limit) {
                throw bad(name, "content exceeds the limit of " + limit + " bytes (after decompression)");
            }
        }
    }
}
