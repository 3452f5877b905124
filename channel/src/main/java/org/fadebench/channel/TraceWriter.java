package org.fadebench.channel;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.Locale;
import java.util.concurrent.ThreadLocalRandom;
import org.apache.commons.compress.compressors.CompressorException;
import org.apache.commons.compress.compressors.CompressorStreamFactory;

/** Writes channel traces (see {@link ChannelTrace#write}). */
final class TraceWriter {

    private static final String[][] COMPRESSIONS = {
        {".gz", CompressorStreamFactory.GZIP},
        {".xz", CompressorStreamFactory.XZ},
        {".bz2", CompressorStreamFactory.BZIP2},
        {".zst", CompressorStreamFactory.ZSTANDARD},
    };

    private TraceWriter() {
    }

    static void write(ChannelTrace trace, Path file) {
        String fileName = file.getFileName().toString();
        String base = fileName.toLowerCase(Locale.ROOT);
        String compression = null;
        for (String[] c : COMPRESSIONS) {
            if (base.endsWith(c[0])) {
                compression = c[1];
                base = base.substring(0, base.length() - c[0].length());
                break;
            }
        }
        boolean npy = base.endsWith(".npy");
        if (!npy && !base.endsWith(".csv")) {
            throw new IllegalArgumentException(file + ": a trace file name must end in .npy or .csv, "
                    + "optionally followed by .gz, .xz, .bz2 or .zst");
        }
        Path dir = file.toAbsolutePath().getParent();
        Path temporary = null;
        try {
            // created like any new file (not by createTempFile, which makes it owner-only): the
            // trace gets the permissions the umask leaves
            temporary = dir.resolve("." + fileName + "." + Long.toHexString(ThreadLocalRandom.current().nextLong())
                    + ".tmp");
            try (OutputStream out = open(temporary, compression)) {
                if (npy) {
                    writeNpy(trace, out);
                } else {
                    writeCsv(trace, out);
                }
            }
            Files.move(temporary, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            temporary = null;
        } catch (IOException e) {
            throw new UncheckedIOException(file + ": cannot write: " + e.getMessage(), e);
        } finally {
            if (temporary != null) {
                try {
                    Files.deleteIfExists(temporary);
                } catch (IOException ignored) {
                    // the write already failed; that failure is the one reported
                }
            }
        }
    }

    private static OutputStream open(Path file, String compression) throws IOException {
        OutputStream out = new BufferedOutputStream(Files.newOutputStream(file, StandardOpenOption.CREATE_NEW,
                StandardOpenOption.WRITE), 1 << 16);
        if (compression == null) {
            return out;
        }
        try {
            return new CompressorStreamFactory().createCompressorOutputStream(compression, out);
        } catch (CompressorException e) {
            out.close();
            throw new IOException("cannot compress with " + compression + ": " + e.getMessage(), e);
        }
    }

    /** NumPy format version 1.0, dtype little-endian complex128, shape (N, Nr, Mt), C order. */
    private static void writeNpy(ChannelTrace trace, OutputStream out) throws IOException {
        StringBuilder header = new StringBuilder("{'descr': '<c16', 'fortran_order': False, 'shape': (")
                .append(trace.size()).append(", ").append(trace.nr()).append(", ").append(trace.mt()).append("), }");
        // magic (6) + version (2) + length (2) + header + '\n' is a multiple of 64
        while ((10 + header.length() + 1) % 64 != 0) {
            header.append(' ');
        }
        header.append('\n');
        out.write(new byte[] {(byte) 0x93, 'N', 'U', 'M', 'P', 'Y', 1, 0,
            (byte) header.length(), (byte) (header.length() >>> 8)});
        out.write(header.toString().getBytes(StandardCharsets.US_ASCII));
        ByteBuffer buffer = ByteBuffer.allocate(1 << 16).order(ByteOrder.LITTLE_ENDIAN);
        for (double v : trace.data()) {
            if (!buffer.hasRemaining()) {
                out.write(buffer.array(), 0, buffer.position());
                buffer.clear();
            }
            buffer.putDouble(v);
        }
        out.write(buffer.array(), 0, buffer.position());
    }

    /** Our CSV layout; Double.toString gives back the same double when parsed. */
    private static void writeCsv(ChannelTrace trace, OutputStream out) throws IOException {
        StringBuilder line = new StringBuilder();
        line.append(TraceReader.CSV_FIRST_LINE).append('\n').append(trace.nr()).append(',').append(trace.mt()).append('\n');
        out.write(line.toString().getBytes(StandardCharsets.US_ASCII));
        double[] data = trace.data();
        int per = 2 * trace.nr() * trace.mt();
        for (int i = 0; i < trace.size(); i++) {
            line.setLength(0);
            for (int k = 0; k < per; k++) {
                if (k > 0) {
                    line.append(',');
                }
                line.append(data[i * per + k]);
            }
            line.append('\n');
            out.write(line.toString().getBytes(StandardCharsets.US_ASCII));
        }
    }
}
