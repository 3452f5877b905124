package org.fadebench.channel;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;

/**
 * One random stream: a uniform generator and a standard normal sampler on top of it. A stream is
 * derived only from a master seed and a few integer keys (for a sweep: SNR point index and batch
 * index), never from thread identity or timing, so results do not depend on how work is scheduled.
 *
 * <p>Generator: xoshiro256++ (Commons RNG {@code XO_SHI_RO_256_PP}); normal draws: the 256-layer
 * {@link Ziggurat}, whose fast path the JIT inlines into the bulk loops below. The 256-bit state
 * is filled by SplitMix64 over the seed and keys.
 */
public final class Draws {

    private final UniformRandomProvider uniform;

    private Draws(UniformRandomProvider uniform) {
        this.uniform = uniform;
    }

    /** The stream for a master seed and keys, e.g. {@code of(seed, pointIndex, batchIndex)}. */
    public static Draws of(long seed, long... keys) {
        long x = mix(seed ^ 0x6A09E667F3BCC909L);
        for (long k : keys) {
            x = mix(x ^ mix(k + 0x9E3779B97F4A7C15L));
        }
        long[] state = new long[4];
        for (int i = 0; i < 4; i++) {
            x += 0x9E3779B97F4A7C15L;
            state[i] = mix(x);
        }
        return new Draws(RandomSource.XO_SHI_RO_256_PP.create(state));
    }

    /** SplitMix64 finaliser (S. Vigna, public-domain reference code of splitmix64; from memory). */
    private static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    public UniformRandomProvider uniform() {
        return uniform;
    }

    /** One draw from N(0, 1). */
    public double gaussian() {
        return Ziggurat.sample(uniform);
    }

    /** Fills {@code out[off .. off+n)} with independent N(0, sigma²) draws. */
    public void fillGaussian(double[] out, int off, int n, double sigma) {
        final UniformRandomProvider rng = uniform;
        for (int i = off, end = off + n; i < end; i++) {
            out[i] = sigma * Ziggurat.sample(rng);
        }
    }

    /**
     * Fills {@code rows} rows of {@code width} values, from {@code out[off]}, with independent
     * N(0, sigma²) draws taken column by column: value 0 of every row, then value 1 of every row,
     * and so on; row i, value j is {@code out[off + i·width + j]}. With one row this is
     * {@link #fillGaussian(double[], int, int, double)}. The noise of a fading block is drawn so,
     * a row being a code block's received values: the planar channel then fills each plane in one
     * unit-stride run ({@link #fillGaussian(double[][], int, int, double)}, the same draws).
     */
    public void fillGaussianColumns(double[] out, int off, int rows, int width, double sigma) {
        final UniformRandomProvider rng = uniform;
        for (int j = off, endColumn = off + width; j < endColumn; j++) {
            for (int i = j, end = j + rows * width; i < end; i += width) {
                out[i] = sigma * Ziggurat.sample(rng);
            }
        }
    }

    /**
     * The planar form of {@link #fillGaussianColumns}: the same draws in the same order for rows of
     * {@code planes.length} values stored as one plane per value; row i, value j lands in {@code
     * planes[j][i]}. Rows {@code from .. from+rows)} of each plane are filled, plane after plane.
     */
    public void fillGaussian(double[][] planes, int from, int rows, double sigma) {
        for (double[] plane : planes) {
            fillGaussian(plane, from, rows, sigma);
        }
    }

    /**
     * Fills {@code labels[off .. off+n)} with independent uniform labels of {@code bits} bits each
     * (1 to 16), i.e. the bits of n symbols; 64-bit draws are used up {@code 64 / bits} labels at a
     * time.
     */
    public void fillLabels(int[] labels, int off, int n, int bits) {
        final int perDraw = 64 / bits;
        final long mask = (1L << bits) - 1;
        int i = off;
        int end = off + n;
        while (i < end) {
            long r = uniform.nextLong();
            int take = Math.min(perDraw, end - i);
            for (int j = 0; j < take; j++) {
                labels[i++] = (int) (r & mask);
                r >>>= bits;
            }
        }
    }

    /**
     * The planar form of {@link #fillLabels(int[], int, int, int)}: the same labels for the
     * sequence of {@code rows·planes.length} labels read as rows of {@code planes.length}, label j
     * of row i landing in {@code planes[j][i]}, rows {@code from .. from+rows)}.
     */
    public void fillLabels(int[][] planes, int from, int rows, int bits) {
        final int perDraw = 64 / bits;
        final long mask = (1L << bits) - 1;
        if (planes.length == 2 && perDraw % 2 == 0) {
            // each draw holds whole rows: the labels of the loop below, without its bookkeeping
            final int[] first = planes[0];
            final int[] second = planes[1];
            final int rowsPerDraw = perDraw / 2;
            final int end = from + rows;
            int i = from;
            while (i < end) {
                long r = uniform.nextLong();
                for (int stop = Math.min(end, i + rowsPerDraw); i < stop; i++) {
                    first[i] = (int) (r & mask);
                    second[i] = (int) ((r >>> bits) & mask);
                    r >>>= 2 * bits;
                }
            }
            return;
        }
        int left = 0;
        long r = 0;
        for (int i = from, end = from + rows; i < end; i++) {
            for (int[] plane : planes) {
                if (left == 0) {
                    r = uniform.nextLong();
                    left = perDraw;
                }
                plane[i] = (int) (r & mask);
                r >>>= bits;
                left--;
            }
        }
    }

    /** Fills {@code bits[off .. off+n)} with independent fair bits, one per byte. */
    public void fillBits(byte[] bits, int off, int n) {
        int i = off;
        int end = off + n;
        while (i < end) {
            long r = uniform.nextLong();
            int take = Math.min(64, end - i);
            for (int j = 0; j < take; j++) {
                bits[i++] = (byte) ((r >>> j) & 1L);
            }
        }
    }
}
