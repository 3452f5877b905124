package org.fadebench.coding.fec;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;

/**
 * A fixed permutation of a frame of coded bits: {@code out[i] = in[source(i)]}. Bits are
 * interleaved before the modem, LLRs deinterleaved after it. Built once per frame size;
 * interleaving and deinterleaving allocate nothing. Immutable and safe to share between threads.
 */
public final class BitInterleaver {

    /** source[i]: the input position that goes to output position i. */
    private final int[] source;

    private BitInterleaver(int[] source) {
        this.source = source;
    }

    /** No interleaving: the identity permutation. */
    public static BitInterleaver identity(int length) {
        int[] p = new int[checkLength(length)];
        for (int i = 0; i < length; i++) {
            p[i] = i;
        }
        return new BitInterleaver(p);
    }

    /**
     * A pseudo-random permutation fixed by {@code seed}: the Fisher–Yates shuffle (R. Durstenfeld,
     * "Algorithm 235: Random permutation", Commun. ACM 7(7), 1964) driven by SplitMix64 from
     * Commons RNG seeded with {@code seed}, so the same seed and length always give the same
     * permutation.
     */
    public static BitInterleaver random(int length, long seed) {
        int[] p = identity(length).source;
        UniformRandomProvider rng = RandomSource.SPLIT_MIX_64.create(seed);
        for (int i = length - 1; i > 0; i--) {
            int j = rng.nextInt(i + 1);
            int t = p[i];
            p[i] = p[j];
            p[j] = t;
        }
        return new BitInterleaver(p);
    }

    /**
     * The row–column block interleaver: bits are written into a rows x cols array row by row and
     * read out column by column (common practice, no source).
     *
     * @throws IllegalArgumentException if rows or cols is not positive or rows x cols is not the
     *                                  frame length
     */
    public static BitInterleaver block(int rows, int cols, int length) {
        if (rows < 1 || cols < 1 || (long) rows * cols != length) {
            throw new IllegalArgumentException("block interleaver of " + rows + " x " + cols
                    + " does not fit a frame of " + length + " coded bits; need rows x cols = " + length);
        }
        int[] p = new int[length];
        for (int c = 0; c < cols; c++) {
            for (int r = 0; r < rows; r++) {
                p[c * rows + r] = r * cols + c;
            }
        }
        return new BitInterleaver(p);
    }

    private static int checkLength(int length) {
        if (length < 1) {
            throw new IllegalArgumentException("interleaver length " + length + "; need at least 1 bit");
        }
        return length;
    }

    /** Frame length in bits. */
    public int length() {
        return source.length;
    }

    /** The input position sent at output position {@code i}. */
    public int source(int i) {
        return source[i];
    }

    /** Writes the {@link #length()} bits of {@code bits[off ..]} permuted to {@code out[outOff ..]}. */
    public void interleave(byte[] bits, int off, byte[] out, int outOff) {
        for (int i = 0; i < source.length; i++) {
            out[outOff + i] = bits[off + source[i]];
        }
    }

    /** Undoes {@link #interleave} on LLRs: {@code out[outOff + source(i)] = llr[off + i]}. */
    public void deinterleave(double[] llr, int off, double[] out, int outOff) {
        for (int i = 0; i < source.length; i++) {
            out[outOff + source[i]] = llr[off + i];
        }
    }
}
