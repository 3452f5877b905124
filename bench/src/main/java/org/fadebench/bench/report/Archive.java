package org.fadebench.bench.report;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.apache.commons.compress.archivers.tar.TarArchiveEntry;
import org.apache.commons.compress.archivers.tar.TarArchiveOutputStream;
import org.apache.commons.compress.compressors.gzip.GzipCompressorOutputStream;
import org.apache.commons.compress.compressors.xz.XZCompressorOutputStream;

/** Bundles a run's files into a {@code .tar.xz} or {@code .tar.gz} archive (Apache Commons Compress). */
public final class Archive {

    private Archive() {
    }

    /** Checks the archive name before anything runs; returns null when it is fine. */
    public static String problem(String name) {
        String n = name.toLowerCase(Locale.ROOT);
        if (n.endsWith(".tar.xz") || n.endsWith(".txz") || n.endsWith(".tar.gz") || n.endsWith(".tgz")) {
            return null;
        }
        return "--archive " + name + ": unknown archive type; valid endings: .tar.xz, .txz, .tar.gz, .tgz";
    }

    /** Writes the files (by their file names, flat) into the archive, atomically. */
    public static void write(Path archive, List<Path> files) throws IOException {
        boolean xz = archive.getFileName().toString().toLowerCase(Locale.ROOT).matches(".*\\.(tar\\.xz|txz)");
        AtomicFiles.write(archive, raw -> {
            try (OutputStream compressed = xz ? new XZCompressorOutputStream(raw) : new GzipCompressorOutputStream(raw);
                 TarArchiveOutputStream tar = new TarArchiveOutputStream(compressed)) {
                tar.setLongFileMode(TarArchiveOutputStream.LONGFILE_POSIX);
                for (Path f : files) {
                    TarArchiveEntry e = new TarArchiveEntry(f.getFileName().toString());
                    e.setSize(Files.size(f));
                    e.setModTime(Files.getLastModifiedTime(f));
                    tar.putArchiveEntry(e);
                    Files.copy(f, tar);
                    tar.closeArchiveEntry();
                }
                tar.finish();
            }
        });
    }
}
