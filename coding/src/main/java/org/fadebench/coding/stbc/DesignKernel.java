package org.fadebench.coding.stbc;

import java.util.Arrays;

/**
 * The planar kernel ({@link PlanarKernel}) of any orthogonal code whose grid entries are each
 * ±c·s_k, ±c·s_k* or 0 — the orthogonal designs of V. Tarokh, H. Jafarkhani and A. R. Calderbank,
 * "Space-time block codes from orthogonal designs", IEEE Trans. Inf. Theory 45(5), 1999 — made
 * from the code's dispersion matrices by tables rather than by hand per code:
 * <ul>
 *   <li>encoder: each real or imaginary part of a grid entry is one symbol part times a signed
 *   power scale (or 0), so grid plane p = {@code factor[p]} · symbol plane {@code source[p]};</li>
 *   <li>combiner: the matched filter z = Fᵀ y of the {@link MatchedFilterCombiner}, summed over
 *   only the rows of F that the code's structure can make non-zero, in the same row order; those
 *   entries of F (the {@link EffectiveChannel}'s sums over the antennas, as EJML's
 *   {@code mult_small} runs them, over the non-zero dispersion entries only) and the diagonal of
 *   FᵀF are computed once per channel.</li>
 * </ul>
 * The received planes are the rows of F in order (plane 2·(τ·Nr + r) + part), so every product and
 * sum is the general combiner's, in its order: the estimates and gains equal its to the last bit.
 * The skipped terms are exact zeros, and every sum here starts from +0, so it never is −0 and
 * adding an exact zero (of either sign) to it changes no bit. Allocation-free after construction.
 */
public final class DesignKernel implements PlanarKernel {

    /** Per grid plane: the symbol plane it copies (2k for Re s_k, 2k + 1 for Im s_k), or −1 for 0. */
    private final int[] source;
    /** Per grid plane: the signed power scale of its symbol plane. */
    private final double[] factor;
    /** Per grid plane: the first grid plane of the same source and factor (itself if none before). */
    private final int[] first;
    private final int nr;
    private final int mt;
    /**
     * Per symbol part c (column of F): the rows of F that may be non-zero, ascending, then as many
     * more (row 0) as make the count a multiple of 4.
     */
    private final int[][] rows;
    /** Per symbol part c: how many of its rows are those of F (the rest are padding). */
    private final int[] used;
    /** Per symbol part c: F's entries in its rows under the current channel (0 for the padding). */
    private final double[][] weights;
    /**
     * Per symbol part c, the terms of F's entry in its j-th row: from {@code termEnd[c][j − 1]} (0
     * for j = 0) to {@code termEnd[c][j]} in the arrays below, one per transmit antenna t whose
     * dispersion entry d = (dr, di) in that row's slot is not 0, t ascending.
     */
    private final int[][] termEnd;
    /** Per symbol part c and term: the offset in H (Nr x Mt, interleaved) of H[r][t]. */
    private final int[][] termChannel;
    /** Per symbol part c and term: dr and di. */
    private final double[][] termReal;
    private final double[][] termImag;
    private final double[] invDiag;
    private final double[] gain;

    private DesignKernel(SpaceTimeCode code, int nr, int[] source, double[] factor) {
        SpaceTimeCode.checkReceiveAntennas(nr);
        this.source = source;
        this.factor = factor;
        this.first = new int[source.length];
        for (int p = 0; p < source.length; p++) {
            int q = 0;
            while (source[q] != source[p] || factor[q] != factor[p]) {
                q++;
            }
            first[p] = q;
        }
        this.nr = nr;
        int k = code.symbolsPerBlock();
        int t = code.slotsPerBlock();
        int mt = code.transmitAntennas();
        this.mt = mt;
        this.rows = new int[2 * k][];
        this.used = new int[2 * k];
        this.weights = new double[2 * k][];
        this.termEnd = new int[2 * k][];
        this.termChannel = new int[2 * k][];
        this.termReal = new double[2 * k][];
        this.termImag = new double[2 * k][];
        for (int c = 0; c < 2 * k; c++) {
            double[] d = c % 2 == 0 ? code.realDispersion(c / 2) : code.imagDispersion(c / 2);
            int[] list = new int[2 * t * nr + 3];
            int n = 0;
            for (int slot = 0; slot < t; slot++) {
                boolean sent = false;
                for (int i = 2 * slot * mt; i < 2 * (slot + 1) * mt; i++) {
                    sent |= d[i] != 0;
                }
                for (int j = 0; sent && j < 2 * nr; j++) {
                    list[n++] = 2 * slot * nr + j;
                }
            }
            used[c] = n;
            rows[c] = Arrays.copyOf(list, Math.max(4, (n + 3) / 4 * 4));
            weights[c] = new double[rows[c].length];
            tableTerms(c, d);
        }
        this.invDiag = new double[2 * k];
        this.gain = new double[k];
    }

    /** The term tables of symbol part c, whose dispersion matrix is {@code d}. */
    private void tableTerms(int c, double[] d) {
        int n = used[c];
        termEnd[c] = new int[n];
        termChannel[c] = new int[n * mt];
        termReal[c] = new double[n * mt];
        termImag[c] = new double[n * mt];
        int q = 0;
        for (int j = 0; j < n; j++) {
            int slot = rows[c][j] / (2 * nr);
            int r = rows[c][j] / 2 % nr;
            for (int t = 0; t < mt; t++) {
                int e = 2 * (slot * mt + t);
                if (d[e] != 0 || d[e + 1] != 0) {
                    termChannel[c][q] = 2 * (r * mt + t);
                    termReal[c][q] = d[e];
                    termImag[c][q] = d[e + 1];
                    q++;
                }
            }
            termEnd[c][j] = q;
        }
    }

    /**
     * The kernel of {@code code} for {@code nr} receive antennas, or null when the code is not
     * orthogonal or some grid entry mixes more than one symbol part.
     */
    static DesignKernel of(SpaceTimeCode code, int nr) {
        if (!code.isOrthogonal()) {
            return null;
        }
        int k = code.symbolsPerBlock();
        int planes = 2 * code.slotsPerBlock() * code.transmitAntennas();
        int[] source = new int[planes];
        double[] factor = new double[planes];
        Arrays.fill(source, -1);
        for (int c = 0; c < 2 * k; c++) {
            double[] d = c % 2 == 0 ? code.realDispersion(c / 2) : code.imagDispersion(c / 2);
            for (int p = 0; p < planes; p++) {
                if (d[p] != 0) {
                    if (source[p] >= 0) {
                        return null;
                    }
                    source[p] = c;
                    factor[p] = d[p];
                }
            }
        }
        return new DesignKernel(code, nr, source, factor);
    }

    /**
     * The general encoder's values: each grid part is a sum of products of which one alone is not
     * an exact zero, so it equals that product (up to the sign of a zero). A plane that shares its
     * array with an earlier plane of the same values ({@link #newGrid}) is written once.
     */
    @Override
    public void encode(double[][] symbols, int from, int blocks, double[][] grid) {
        int end = from + blocks;
        for (int p = 0; p < source.length; p++) {
            double[] x = grid[p];
            if (first[p] != p && x == grid[first[p]]) {
                continue;
            }
            if (source[p] < 0) {
                Arrays.fill(x, from, end, 0.0);
                continue;
            }
            double[] s = symbols[source[p]];
            double a = factor[p];
            for (int i = from; i < end; i++) {
                x[i] = s[i] * a;
            }
        }
    }

    /**
     * One array per distinct pair of symbol part and signed scale (and one for the zero entries),
     * shared by the grid planes that carry it: 16 arrays instead of 64 for G4, which keeps the grid
     * of a frame in the first-level cache.
     */
    @Override
    public double[][] newGrid(int gridPlanes, int blocks) {
        checkGridPlanes(gridPlanes);
        double[][] grid = new double[gridPlanes][];
        for (int p = 0; p < gridPlanes; p++) {
            grid[p] = first[p] == p ? new double[blocks] : grid[first[p]];
        }
        return grid;
    }

    @Override
    public int gridArrays(int gridPlanes) {
        checkGridPlanes(gridPlanes);
        int arrays = 0;
        for (int p = 0; p < gridPlanes; p++) {
            arrays += first[p] == p ? 1 : 0;
        }
        return arrays;
    }

    private void checkGridPlanes(int gridPlanes) {
        if (gridPlanes != source.length) {
            throw new IllegalArgumentException("grid planes: the code has " + source.length + ", got " + gridPlanes);
        }
    }

    /**
     * F's entries in the rows of each column: the received image D Hᵀ of the column's dispersion
     * matrix D, row 2·(τ·Nr + r) + part, summed over the antennas from 0 as {@code mult_small} sums
     * it (real part dr·hr − di·hi, imaginary dr·hi + di·hr), then the diagonal of FᵀF over the
     * same rows in order and its inverse, as {@link EffectiveChannel#matchedFilterDiagonal}.
     */
    @Override
    public void setChannel(double[] h) {
        for (int c = 0; c < rows.length; c++) {
            int[] ends = termEnd[c];
            int[] at = termChannel[c];
            double[] dr = termReal[c];
            double[] di = termImag[c];
            double g = 0;
            int q = 0;
            for (int j = 0; j < ends.length; j++) {
                boolean real = (rows[c][j] & 1) == 0;
                double v = 0;
                for (; q < ends[j]; q++) {
                    double hr = h[at[q]];
                    double hi = h[at[q] + 1];
                    v += real ? dr[q] * hr - di[q] * hi : dr[q] * hi + di[q] * hr;
                }
                weights[c][j] = v;
                g += v * v;
            }
            invDiag[c] = g;
        }
        EffectiveChannel.invertDiagonal(invDiag, gain);
    }

    @Override
    public double gain(int symbol) {
        return gain[symbol];
    }

    /**
     * z = Fᵀ y over the rows of each column in order, four rows a pass ((z + p1) + p2 … as the
     * general combiner adds them, from 0), the last pass multiplied by the inverse diagonal of FᵀF
     * (the others by 1, exactly). The padding rows add products of weight 0, exact zeros, to a sum
     * that started from +0 and so never is −0: they change no bit.
     */
    @Override
    public void combine(double[][] received, int from, int blocks, double[][] estimates) {
        int end = from + blocks;
        for (int c = 0; c < rows.length; c++) {
            double[] z = estimates[c];
            int[] r = rows[c];
            double[] w = weights[c];
            for (int j = 0; j < r.length; j += 4) {
                double scale = j + 4 == r.length ? invDiag[c] : 1.0;
                sumFour(z, j > 0, scale, w[j], received[r[j]], w[j + 1], received[r[j + 1]], w[j + 2],
                        received[r[j + 2]], w[j + 3], received[r[j + 3]], from, end);
            }
        }
    }

    /** {@code z[i] = ((add ? z[i] : 0) + w0·y0[i] + w1·y1[i] + w2·y2[i] + w3·y3[i]) · scale}, i in {@code from .. end)}. */
    private static void sumFour(double[] z, boolean add, double scale, double w0, double[] y0, double w1, double[] y1,
                                double w2, double[] y2, double w3, double[] y3, int from, int end) {
        if (add) {
            for (int i = from; i < end; i++) {
                z[i] = (z[i] + w0 * y0[i] + w1 * y1[i] + w2 * y2[i] + w3 * y3[i]) * scale;
            }
        } else {
            for (int i = from; i < end; i++) {
                z[i] = (0.0 + w0 * y0[i] + w1 * y1[i] + w2 * y2[i] + w3 * y3[i]) * scale;
            }
        }
    }
}
