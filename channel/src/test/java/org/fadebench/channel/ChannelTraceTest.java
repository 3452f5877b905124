package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.zip.GZIPOutputStream;
import org.apache.commons.compress.compressors.lz4.FramedLZ4CompressorOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Channel traces: exact round trips through every layout and compression, content-based detection,
 * trace selection by block index, and a one-line error for every kind of bad file.
 *
 * <p>The .npy files written here by hand follow the NumPy format description ("A simple file format
 * for NumPy arrays", NumPy Enhancement Proposal 1, and numpy.lib.format; versions 1.0 to 3.0):
 * magic \x93NUMPY, major and minor version bytes, a little-endian header length (2 bytes in 1.0,
 * 4 bytes in 2.0 and 3.0), then the header dictionary and the raw data.
 */
class ChannelTraceTest {

    @TempDir
    Path dir;

    /** A 2 x 3 trace of 5 matrices with awkward values: signs, -0.0, tiny and huge magnitudes. */
    private static ChannelTrace sample() {
        double[] m = new double[5 * 12];
        Draws d = Draws.of(77);
        for (int i = 0; i < m.length; i++) {
            m[i] = d.gaussian() * Math.pow(10, (i % 7) * 50 - 150);
        }
        m[3] = -0.0;
        m[4] = Double.MIN_VALUE;
        m[5] = -Double.MAX_VALUE;
        return ChannelTrace.of("sample", 2, 3, m);
    }

    private static double[] matrices(ChannelTrace t) {
        int per = 2 * t.nr() * t.mt();
        double[] all = new double[t.size() * per];
        double[] h = new double[per];
        for (int i = 0; i < t.size(); i++) {
            t.matrix(i, h);
            System.arraycopy(h, 0, all, i * per, per);
        }
        return all;
    }

    @Test
    void roundTripIsExactForEveryLayoutAndCompression() throws IOException {
        ChannelTrace trace = sample();
        for (String layout : new String[] {".npy", ".csv"}) {
            for (String compression : new String[] {"", ".gz", ".xz", ".bz2", ".zst"}) {
                Path file = dir.resolve("trace" + layout + compression);
                trace.write(file);
                ChannelTrace back = ChannelTrace.read(file);
                assertEquals(2, back.nr());
                assertEquals(3, back.mt());
                assertArrayEquals(matrices(trace), matrices(back), 0.0, file.toString());
                // detection by content: the same bytes under a name that says nothing
                Path renamed = dir.resolve("renamed.bin");
                Files.copy(file, renamed, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
                assertArrayEquals(matrices(trace), matrices(ChannelTrace.read(renamed)), 0.0);
            }
        }
        try (var files = Files.list(dir)) {
            assertTrue(files.noneMatch(p -> p.getFileName().toString().endsWith(".tmp")), "temporary files left");
        }
    }

    @Test
    void writtenNpyIsVersionOneWithAnAlignedHeader() throws IOException {
        Path file = dir.resolve("t.npy");
        sample().write(file);
        byte[] b = Files.readAllBytes(file);
        int headerLength = (b[8] & 0xFF) | (b[9] & 0xFF) << 8;
        String header = new String(b, 10, headerLength, StandardCharsets.US_ASCII);
        assertEquals(0, (10 + headerLength) % 64);
        assertTrue(header.startsWith("{'descr': '<c16', 'fortran_order': False, 'shape': (5, 2, 3), }"), header);
        assertTrue(header.endsWith("\n"));
        assertEquals(10 + headerLength + 5 * 6 * 16, b.length);
    }

    /** complex64 and big-endian data, and headers of versions 2.0 and 3.0. */
    @Test
    void readsOtherDtypesAndVersions() throws IOException {
        double[] values = {1.5, -2.25, 0.125, 3.0};
        for (String descr : new String[] {"<c16", ">c16", "<c8", ">c8"}) {
            for (int version = 1; version <= 3; version++) {
                Path file = dir.resolve("v" + version + descr.replace('<', 'l').replace('>', 'b') + ".npy");
                Files.write(file, npy(version, "{'descr': '" + descr + "', 'fortran_order': False, 'shape': (2, 1, 1), }",
                        data(descr, values)));
                ChannelTrace t = ChannelTrace.read(file);
                assertArrayEquals(values, matrices(t), 0.0, file.toString());
            }
        }
    }

    /** The matrix of a block is its index mod N, whatever order blocks are asked for in. */
    @Test
    void blockIndexAloneSelectsTheMatrix() {
        ChannelTrace trace = sample();
        double[] all = matrices(trace);
        double[] h = new double[12];
        for (long index : new long[] {17, 3, 0, 4, 5, 1_000_000_000_007L}) {
            trace.matrix(index, h);
            int i = (int) (index % 5);
            assertArrayEquals(Arrays.copyOfRange(all, 12 * i, 12 * i + 12), h, 0.0);
        }
        assertFalse(trace.cyclesOver(5));
        assertTrue(trace.cyclesOver(6));
        TraceFading sequential = new TraceFading(trace);
        for (int i = 0; i < 5; i++) {
            sequential.draw(null, 2, 3, h);
            assertArrayEquals(Arrays.copyOfRange(all, 12 * i, 12 * i + 12), h, 0.0);
        }
        assertFalse(sequential.cycled());
        sequential.draw(null, 2, 3, h);
        assertTrue(sequential.cycled());
        assertArrayEquals(Arrays.copyOfRange(all, 0, 12), h, 0.0);
        assertEquals("sample: holds 2 x 3 matrices (Nr x Mt) but the link has 2 x 2",
                assertThrows(IllegalArgumentException.class, () -> trace.requireShape(2, 2)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> trace.matrix(-1, h));
    }

    // ------------------------------------------------------------------ bad files

    private static final String GOOD = "{'descr': '<c16', 'fortran_order': False, 'shape': (1, 1, 1), }";
    private static final byte[] ONE = data("<c16", new double[] {1, 0});

    @Test
    void malformedNpyFiles() throws IOException {
        byte[] good = npy(1, GOOD, ONE);
        assertBad(Arrays.copyOf(good, 5), "channel trace CSV");
        byte[] v4 = good.clone();
        v4[6] = 4;
        assertBad(v4, "unsupported .npy version 4.0 (1.0, 2.0 and 3.0 are read)");
        assertBad(Arrays.copyOf(good, 9), "truncated .npy header");
        assertBad(Arrays.copyOf(good, 30), "truncated .npy header");
        byte[] longHeader = Arrays.copyOf(npy(2, GOOD, ONE), 12);
        longHeader[8] = 1;
        longHeader[9] = 0;
        longHeader[10] = 1;
        longHeader[11] = 0;
        assertBad(longHeader, ".npy header of 65537 bytes is longer than 65536");
        assertBad(npy(1, "{'descr': '<c16', 'fortran_order': False}", ONE), "malformed .npy header: missing key 'shape'");
        assertBad(npy(1, GOOD.replace("}", "'extra': 1, }"), ONE), "malformed .npy header: unexpected value at character");
        assertBad(npy(1, GOOD.replace("}", "'extra': True, }"), ONE), "malformed .npy header: unknown key 'extra'");
        assertBad(npy(1, GOOD.replace("}", "'descr': '<c8', }"), ONE), "malformed .npy header: duplicate key 'descr'");
        assertBad(npy(1, GOOD.replace("'shape'", "shape"), ONE), "malformed .npy header: expected a quoted string at character");
        assertBad(npy(1, GOOD + " x", ONE), "malformed .npy header: unexpected text after the dictionary");
        assertBad(npy(1, GOOD.replace("(1, 1, 1)", "(1, 1, 12345678901234567890)"), ONE),
                "malformed .npy header: expected a whole number of at most 18 digits");
        assertBad(npy(1, GOOD.replace("<c16", "<f8"), ONE), "unsupported dtype '<f8' (complex128 or complex64");
        assertBad(npy(1, GOOD.replace("False", "True"), ONE), "fortran_order must be False (C order only), got True");
        assertBad(npy(1, GOOD.replace("(1, 1, 1)", "(1, 1)"), ONE), "shape must be (N, Nr, Mt), got (1, 1)");
        assertBad(npy(1, GOOD.replace("(1, 1, 1)", "(0, 1, 1)"), new byte[0]), "holds no matrices");
        assertBad(npy(1, GOOD.replace("(1, 1, 1)", "(1, 65, 1)"), ONE), "matrices of 65 x 1 (Nr x Mt): both must be 1 to 64");
        assertBad(npy(1, GOOD.replace("(1, 1, 1)", "(2, 1, 1)"), ONE), "truncated: data ends after 16 of 32 bytes");
        assertBad(npy(1, GOOD, Arrays.copyOf(ONE, 17)), "trailing bytes after the 1 x 1 x 1 array");
        assertBad(npy(1, GOOD.replace("(1, 1, 1)", "(1, 2, 1)"), data("<c16", new double[] {1, 0, 0, Double.NaN})),
                "matrix 0, entry (1, 0) is not finite");
        assertBad(npy(1, GOOD.replace("<c16", ">c8"), data(">c8", new double[] {Double.POSITIVE_INFINITY, 0})),
                "matrix 0, entry (0, 0) is not finite");
    }

    @Test
    void malformedCsvFiles() throws IOException {
        String head = "# fadebench channel trace\n";
        assertBad(new byte[0], "the file is empty");
        assertBad(text("hello\n1,1\n1,0\n"), "neither a NumPy .npy file nor a channel trace CSV (whose first line is '# fadebench channel trace')");
        assertBad(text(head), "no 'Nr,Mt' line after the first line");
        assertBad(text(head + "2;2\n"), "line 2: expected 'Nr,Mt' (two whole numbers), got '2;2'");
        assertBad(text(head + "0,2\n"), "matrices of 0 x 2 (Nr x Mt): both must be 1 to 64");
        assertBad(text(head + "# a comment\n1,2\n\n"), "holds no matrices");
        assertBad(text(head + "1,1\n1,0\n1,0,0\n"), "line 4: more than 2 numbers (2·Nr·Mt)");
        assertBad(text(head + "1,2\n1,0,1\n"), "line 3: expected 4 numbers (2·Nr·Mt), got 3");
        assertBad(text(head + "1,1\n1,abc\n"), "line 3, field 2: 'abc' is not a number");
        assertBad(text(head + "1,1\nNaN,0\n"), "line 3, field 1: 'NaN' is not a number");
        assertBad(text(head + "1,1\n0x1p3,0\n"), "line 3, field 1: '0x1p3' is not a number");
        assertBad(text(head + "1,1\n1.0d,0\n"), "line 3, field 1: '1.0d' is not a number");
        assertBad(text(head + "1,1\n1,\n"), "line 3, field 2: '' is not a number");
        assertBad(text(head + "1,1\n1e999,0\n"), "line 3, field 1: '1e999' is not finite");
        assertBad(text(head + "1,1\n" + "1".repeat((1 << 20) + 1) + "\n"), "line 3 is longer than 1048576 characters");
        // accepted: CRLF line ends, blanks, comments between rows, blanks around numbers
        Path ok = dir.resolve("ok.csv");
        Files.write(ok, text(head + "# recorded today\r\n1, 1\r\n 1.5 , -2e-3\r\n\r\n# next\n-0.0,7\n"));
        assertArrayEquals(new double[] {1.5, -2e-3, -0.0, 7}, matrices(ChannelTrace.read(ok)), 0.0);
    }

    @Test
    void limitsAreEnforced() throws IOException {
        Path file = dir.resolve("five.npy");
        sample().write(file);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ChannelTrace.read(file, new TraceLimits(1L << 20, 4)));
        assertEquals(file + ": holds 5 matrices, more than the limit of 4", e.getMessage());
        // the whole file (608 bytes) is read ahead before the header is looked at
        e = assertThrows(IllegalArgumentException.class, () -> ChannelTrace.read(file, new TraceLimits(200, 100)));
        assertEquals(file + ": content exceeds the limit of 200 bytes (after decompression)", e.getMessage());
        Path csv = dir.resolve("five.csv");
        sample().write(csv);
        e = assertThrows(IllegalArgumentException.class, () -> ChannelTrace.read(csv, new TraceLimits(1L << 20, 4)));
        assertEquals(csv + ": more matrices than the limit of 4", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> ChannelTrace.read(csv, new TraceLimits(300, 100)));
        assertEquals(csv + ": content exceeds the limit of 300 bytes (after decompression)", e.getMessage());
    }

    /** A 40 KiB gzip file that inflates to 40 MiB of zeros is stopped at the 1 MiB limit. */
    @Test
    void decompressionBombIsRefused() throws IOException {
        Path bomb = dir.resolve("bomb.gz");
        try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(bomb))) {
            out.write(npy(1, GOOD.replace("(1, 1, 1)", "(2621440, 1, 1)"), new byte[0]));
            byte[] zeros = new byte[1 << 20];
            for (int i = 0; i < 40; i++) {
                out.write(zeros);
            }
        }
        assertTrue(Files.size(bomb) < 100_000);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ChannelTrace.read(bomb, new TraceLimits(1L << 20, 1L << 24)));
        assertEquals(bomb + ": data of 41943040 bytes exceeds the limit of 1048576 bytes", e.getMessage());
        // a header that does not announce the size: the CSV layout of the same zeros
        Path csvBomb = dir.resolve("bomb2");
        try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(csvBomb))) {
            out.write(text("# fadebench channel trace\n1,1\n"));
            byte[] row = text("0,0\n");
            for (int i = 0; i < 1 << 20; i++) {
                out.write(row);
            }
        }
        e = assertThrows(IllegalArgumentException.class,
                () -> ChannelTrace.read(csvBomb, new TraceLimits(1L << 20, 1L << 24)));
        assertEquals(csvBomb + ": content exceeds the limit of 1048576 bytes (after decompression)", e.getMessage());
    }

    @Test
    void compressionProblems() throws IOException {
        ByteArrayOutputStream lz4 = new ByteArrayOutputStream();
        try (OutputStream out = new FramedLZ4CompressorOutputStream(lz4)) {
            out.write(npy(1, GOOD, ONE));
        }
        assertBad(lz4.toByteArray(), "unsupported compression 'lz4-framed' (gz, xz, bz2 and zst are read)");
        ByteArrayOutputStream gz = new ByteArrayOutputStream();
        try (OutputStream out = new GZIPOutputStream(gz)) {
            out.write(npy(1, GOOD, ONE));
        }
        byte[] truncated = Arrays.copyOf(gz.toByteArray(), gz.size() - 12);
        assertBad(truncated, "corrupt or truncated compressed data: unexpected end of data");
        byte[] corrupt = gz.toByteArray();
        for (int i = 12; i < corrupt.length - 8; i++) {
            corrupt[i] ^= 0x5A;
        }
        assertBad(corrupt, "corrupt or truncated compressed data: ");
    }

    @Test
    void ioProblemsAreUncheckedIoErrors() {
        Path missing = dir.resolve("missing.npy");
        UncheckedIOException e = assertThrows(UncheckedIOException.class, () -> ChannelTrace.read(missing));
        assertEquals(missing + ": cannot open: no such file", e.getMessage());
        UncheckedIOException w = assertThrows(UncheckedIOException.class,
                () -> sample().write(dir.resolve("no/such/dir/t.npy")));
        assertTrue(w.getMessage().startsWith(dir.resolve("no/such/dir/t.npy") + ": cannot write: "), w.getMessage());
    }

    @Test
    void writerRefusesUnknownNamesAndWritesNothing() throws IOException {
        Path file = dir.resolve("trace.txt.gz");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> sample().write(file));
        assertEquals(file + ": a trace file name must end in .npy or .csv, optionally followed by .gz, .xz, .bz2 or .zst",
                e.getMessage());
        try (var files = Files.list(dir)) {
            assertEquals(0, files.count());
        }
        assertEquals("x: need a positive multiple of 2·Nr·Mt = 4 numbers, got 6",
                assertThrows(IllegalArgumentException.class, () -> ChannelTrace.of("x", 1, 2, new double[6])).getMessage());
        assertEquals("x: matrix 1, entry (0, 1) is not finite",
                assertThrows(IllegalArgumentException.class,
                        () -> ChannelTrace.of("x", 1, 2, new double[] {0, 0, 0, 0, 0, 0, Double.NaN, 0})).getMessage());
    }

    /**
     * A small .npy file whose header claims (16777216, 4, 2) complex64 matrices (1 GiB of data, within
     * the content limit) reserves no memory for the claim: memory grows with the data actually read,
     * so the truncated file is reported after allocating little (the claim alone would be 2 GiB of
     * doubles). Allocation is measured for this thread by the JVM's own counter.
     */
    @Test
    void npyHeaderClaimsDoNotReserveMemory() throws IOException {
        byte[] file = npy(1, GOOD.replace("<c16", "<c8").replace("(1, 1, 1)", "(16777216, 4, 2)"),
                data("<c8", new double[2 * 100]));
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) java.lang.management.ManagementFactory.getThreadMXBean();
        long before = threads.getThreadAllocatedBytes(Thread.currentThread().getId());
        assertBad(file, "truncated: data ends after 800 of 1073741824 bytes");
        long allocated = threads.getThreadAllocatedBytes(Thread.currentThread().getId()) - before;
        assertTrue(allocated < 16L << 20, "allocated " + allocated + " bytes");
    }

    /** Folders and pipes are refused before opening: reading a pipe would wait for a writer forever. */
    @Test
    void onlyRegularFilesAreRead() throws Exception {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> ChannelTrace.read(dir));
        assertEquals(dir + ": is a folder, not a trace file", e.getMessage());
        Path fifo = dir.resolve("trace.npy");
        org.junit.jupiter.api.Assumptions.assumeTrue(
                new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor() == 0, "mkfifo is available");
        e = assertThrows(IllegalArgumentException.class, () -> ChannelTrace.read(fifo));
        assertEquals(fifo + ": not a regular file (a pipe or a device?); give a trace file", e.getMessage());
    }

    /** Files hold any finite number; a link takes parts up to 1e50 in magnitude, and names the first beyond. */
    @Test
    void linkRangeIsCheckedWithTheEntryNamed() {
        ChannelTrace.of("ok", 1, 2, new double[] {1e50, -1e50, 0, Double.MIN_VALUE}).requireLinkRange();
        for (double huge : new double[] {1.0000000000000001e50 * 1.0000001, -1e150, 1e200}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                    () -> ChannelTrace.of("t", 1, 2, new double[] {1, 0, 0, 0, 0, 1, 0, huge}).requireLinkRange());
            assertEquals("t: matrix 1, entry (0, 1) has a part of magnitude " + Math.abs(huge) + "; a link takes entries"
                    + " whose real and imaginary parts are at most 1e50 in magnitude (larger ones would overflow its"
                    + " arithmetic)", e.getMessage());
        }
    }

    // ------------------------------------------------------------------ helpers

    private void assertBad(byte[] content, String problem) throws IOException {
        Path file = dir.resolve("bad");
        Files.write(file, content);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> ChannelTrace.read(file));
        assertTrue(e.getMessage().startsWith(file + ": "), e.getMessage());
        assertTrue(e.getMessage().contains(problem), "expected '" + problem + "' in: " + e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
    }

    private static byte[] text(String s) {
        return s.getBytes(StandardCharsets.US_ASCII);
    }

    /** A .npy file: magic, version, header length, header padded with blanks and a newline, data. */
    private static byte[] npy(int version, String header, byte[] data) {
        String padded = header + " ".repeat(7) + "\n";
        byte[] h = padded.getBytes(StandardCharsets.ISO_8859_1);
        int lengthBytes = version == 1 ? 2 : 4;
        ByteBuffer b = ByteBuffer.allocate(8 + lengthBytes + h.length + data.length).order(ByteOrder.LITTLE_ENDIAN);
        b.put(new byte[] {(byte) 0x93, 'N', 'U', 'M', 'P', 'Y', (byte) version, 0});
        if (version == 1) {
            b.putShort((short) h.length);
        } else {
            b.putInt(h.length);
        }
        b.put(h).put(data);
        return b.array();
    }

    private static byte[] data(String descr, double[] values) {
        boolean wide = descr.endsWith("c16");
        ByteBuffer b = ByteBuffer.allocate(values.length * (wide ? 8 : 4))
                .order(descr.charAt(0) == '<' ? ByteOrder.LITTLE_ENDIAN : ByteOrder.BIG_ENDIAN);
        for (double v : values) {
            if (wide) {
                b.putDouble(v);
            } else {
                b.putFloat((float) v);
            }
        }
        return b.array();
    }
}
