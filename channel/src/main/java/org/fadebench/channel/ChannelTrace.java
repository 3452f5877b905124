package org.fadebench.channel;

import java.io.Serializable;
import java.nio.file.Path;

/**
 * A recorded sequence of Nr x Mt channel matrices, read from a file or made in memory. Immutable,
 * so one trace can serve every thread.
 *
 * <p>Files (see README): NumPy {@code .npy} arrays of shape (N, Nr, Mt) and dtype complex128 or
 * complex64, or our CSV layout, each optionally compressed with gzip, xz, bzip2 or Zstandard. The
 * format and the compression are recognised from the content, never from the file name.
 *
 * <p>Determinism: the matrix for a fading block is chosen by the caller's block index alone,
 * {@code index mod N} ({@link #matrix}), never by the order in which threads ask.
 */
public final class ChannelTrace implements Serializable {

    /**
     * Largest magnitude of a real or imaginary part of an entry that a link accepts. A trace's power
     * is the user's to choose, but the link multiplies entries with each other, with symbols and with
     * 1/N0 (up to 1e40 at 400 dB), and sums up to 64·64 such terms: below 1e50 none of that leaves the
     * range of a double (about 1.8e308). Files may hold any finite number; {@link #requireLinkRange}
     * refuses the rest when a link would use them.
     */
    public static final double MAX_ENTRY = 1e50;

    private final String source;
    private final int nr;
    private final int mt;
    private final int size;
    private final double[] data;

    ChannelTrace(String source, int nr, int mt, int size, double[] data) {
        this.source = source;
        this.nr = nr;
        this.mt = mt;
        this.size = size;
        this.data = data;
    }

    /**
     * A trace of the {@code matrices.length / (2·Nr·Mt)} matrices in {@code matrices} (copied), laid
     * out one after the other like {@code FadingModel.draw} writes one.
     *
     * @throws IllegalArgumentException on a bad shape, an empty or ragged array, or a non-finite entry
     */
    public static ChannelTrace of(String source, int nr, int mt, double[] matrices) {
        Antennas.check(nr, mt);
        int per = 2 * nr * mt;
        if (matrices.length == 0 || matrices.length % per != 0) {
            throw new IllegalArgumentException(source + ": need a positive multiple of 2·Nr·Mt = " + per
                    + " numbers, got " + matrices.length);
        }
        for (int i = 0; i < matrices.length; i++) {
            if (!Double.isFinite(matrices[i])) {
                throw new IllegalArgumentException(source + ": " + TraceReader.entry(i / per, i % per / 2, nr, mt)
                        + " is not finite");
            }
        }
        return new ChannelTrace(source, nr, mt, matrices.length / per, matrices.clone());
    }

    /** Reads a trace file with the {@linkplain TraceLimits#DEFAULT default limits}. */
    public static ChannelTrace read(Path file) {
        return read(file, TraceLimits.DEFAULT);
    }

    /**
     * Reads a trace file.
     *
     * @throws IllegalArgumentException one line naming the file and the problem, for bad content
     *     (unknown format or compression, malformed header, wrong shape, truncated or trailing data,
     *     a non-finite entry, corrupt compressed data, a limit exceeded)
     * @throws java.io.UncheckedIOException naming the file, when it cannot be opened or read
     */
    public static ChannelTrace read(Path file, TraceLimits limits) {
        return TraceReader.read(file, limits);
    }

    /**
     * Writes this trace to {@code file}, whose name chooses the layout: {@code .npy} (complex128) or
     * {@code .csv}, optionally followed by {@code .gz}, {@code .xz}, {@code .bz2} or {@code .zst}. The
     * file appears only when complete (written under a temporary name, then renamed).
     *
     * @throws IllegalArgumentException for an unknown file name ending
     * @throws java.io.UncheckedIOException naming the file, when it cannot be written
     */
    public void write(Path file) {
        TraceWriter.write(this, file);
    }

    /** Where the trace came from (the file name), for messages. */
    public String source() {
        return source;
    }

    public int nr() {
        return nr;
    }

    public int mt() {
        return mt;
    }

    /** Number of matrices N. */
    public int size() {
        return size;
    }

    /**
     * Copies matrix {@code index mod N} into {@code h} (2·Nr·Mt numbers), for a block index ≥ 0.
     */
    public void matrix(long index, double[] h) {
        if (index < 0) {
            throw new IllegalArgumentException("block index must be >= 0, got " + index);
        }
        int per = 2 * nr * mt;
        System.arraycopy(data, (int) (index % size) * per, h, 0, per);
    }

    /** Whether {@code blocks} fading blocks (indices 0 .. blocks−1) use some matrix more than once. */
    public boolean cyclesOver(long blocks) {
        return blocks > size;
    }

    /**
     * Throws unless the trace's matrices are {@code nr} x {@code mt}.
     *
     * @throws IllegalArgumentException naming the file and both shapes
     */
    public void requireShape(int nr, int mt) {
        if (nr != this.nr || mt != this.mt) {
            throw new IllegalArgumentException(source + ": holds " + this.nr + " x " + this.mt
                    + " matrices (Nr x Mt) but the link has " + nr + " x " + mt);
        }
    }

    /**
     * Throws unless every real and imaginary part is at most {@link #MAX_ENTRY} in magnitude.
     *
     * @throws IllegalArgumentException naming the file, the first entry beyond it and the limit
     */
    public void requireLinkRange() {
        int per = 2 * nr * mt;
        for (int i = 0; i < data.length; i++) {
            if (!(Math.abs(data[i]) <= MAX_ENTRY)) {
                throw new IllegalArgumentException(source + ": " + TraceReader.entry(i / per, i % per / 2, nr, mt)
                        + " has a part of magnitude " + Math.abs(data[i]) + "; a link takes entries whose real and "
                        + "imaginary parts are at most 1e50 in magnitude (larger ones would overflow its arithmetic)");
            }
        }
    }

    /** The raw numbers, for the writer (not copied). */
    double[] data() {
        return data;
    }
}
