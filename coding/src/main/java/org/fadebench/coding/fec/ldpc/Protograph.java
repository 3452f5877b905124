package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;

/**
 * A protograph (base matrix pattern) of the built-in family, of our own design: kb information
 * columns then mb parity columns. The parity part is dual-diagonal (common practice, no source):
 * parity column 0 has degree 3 (rows 0, mb/2 and mb − 1, shifts {@link #CORNER_SHIFT}, 0,
 * {@link #CORNER_SHIFT}), parity column c = 1 .. mb − 1 has shift 0 in rows c − 1 and c (a
 * staircase), so the parity bits follow from the information bits in linear time
 * ({@link DualDiagonalEncoder}). The information columns have two degrees: {@code highCount} of
 * degree {@code highDegree} first, then degree 3. Their ones are placed column by column, each
 * in the rows of the lowest degree so far (then the rows it shares fewest columns with), so the
 * check degrees differ by at most one. Immutable.
 *
 * <p>The degree profile is chosen by {@link #search}: the (highDegree, highCount) whose ensemble
 * has the largest threshold under Gaussian-approximation density evolution ({@link
 * DensityEvolution}; S.-Y. Chung, T. J. Richardson, R. L. Urbanke, IEEE Trans. Inf. Theory 47(2),
 * 2001).
 */
final class Protograph {

    /** Template entry of a zero block. */
    static final int ZERO = -1;
    /** Template entry whose shift the {@link ShiftSearch} chooses. */
    static final int FREE = -2;
    /** Shift of parity column 0 in the first and last row (any nonzero shift keeps H_p invertible). */
    static final int CORNER_SHIFT = 1;
    /** Degree of the information columns that are not of the high degree. */
    static final int LOW_DEGREE = 3;

    private final int kb;
    private final int mb;
    private final int highDegree;
    private final int highCount;
    private final int[][] template;

    /**
     * @param kb information columns, at least 1
     * @param mb parity columns (= rows), at least 3
     * @param highDegree degree of the first {@code highCount} information columns, 3 to mb
     * @param highCount information columns of the high degree, 0 to kb
     */
    Protograph(int kb, int mb, int highDegree, int highCount) {
        if (kb < 1 || mb < 3 || highDegree < LOW_DEGREE || highDegree > mb || highCount < 0 || highCount > kb) {
            throw new IllegalArgumentException("protograph " + kb + " + " + mb + " columns, " + highCount
                    + " of degree " + highDegree + "; valid: kb >= 1, mb >= 3, degree 3 to mb, count 0 to kb");
        }
        this.kb = kb;
        this.mb = mb;
        this.highDegree = highDegree;
        this.highCount = highCount;
        this.template = place();
    }

    private int[][] place() {
        int nb = kb + mb;
        int[][] t = new int[mb][nb];
        for (int[] row : t) {
            Arrays.fill(row, ZERO);
        }
        int[] degree = new int[mb];
        int[][] shared = new int[mb][mb];
        t[0][kb] = CORNER_SHIFT;
        t[middleRow()][kb] = 0;
        t[mb - 1][kb] = CORNER_SHIFT;
        for (int c = 1; c < mb; c++) {
            t[c - 1][kb + c] = 0;
            t[c][kb + c] = 0;
        }
        for (int j = kb; j < nb; j++) {
            count(t, j, degree, shared);
        }
        for (int j = 0; j < kb; j++) {
            int d = j < highCount ? highDegree : LOW_DEGREE;
            for (int chosen = 0; chosen < d; chosen++) {
                int best = -1;
                long bestKey = Long.MAX_VALUE;
                for (int q = 0; q < mb; q++) {
                    int r = (q + j * LOW_DEGREE) % mb; // rotate where ties start
                    if (t[r][j] != ZERO) {
                        continue;
                    }
                    int overlap = 0;
                    for (int r2 = 0; r2 < mb; r2++) {
                        overlap += t[r2][j] == FREE ? shared[r][r2] : 0;
                    }
                    long key = (long) degree[r] * 1_000_000L + overlap;
                    if (key < bestKey) {
                        bestKey = key;
                        best = r;
                    }
                }
                t[best][j] = FREE;
            }
            count(t, j, degree, shared);
        }
        return t;
    }

    private void count(int[][] t, int j, int[] degree, int[][] shared) {
        for (int r = 0; r < mb; r++) {
            if (t[r][j] == ZERO) {
                continue;
            }
            degree[r]++;
            for (int r2 = 0; r2 < mb; r2++) {
                shared[r][r2] += r2 != r && t[r2][j] != ZERO ? 1 : 0;
            }
        }
    }

    /** The row of parity column 0's middle one. */
    int middleRow() {
        return mb / 2;
    }

    int infoColumns() {
        return kb;
    }

    int parityColumns() {
        return mb;
    }

    int highDegree() {
        return highDegree;
    }

    int highCount() {
        return highCount;
    }

    /** The base matrix template: {@link #ZERO}, {@link #FREE} or a fixed shift per entry; a copy. */
    int[][] template() {
        int[][] copy = new int[mb][];
        for (int i = 0; i < mb; i++) {
            copy[i] = template[i].clone();
        }
        return copy;
    }

    /** The ensemble of the protograph: λ and ρ from its column and row degrees (edge perspective). */
    DegreeDistribution ensemble() {
        int[][] ones = new int[mb][kb + mb];
        for (int i = 0; i < mb; i++) {
            for (int j = 0; j < kb + mb; j++) {
                ones[i][j] = template[i][j] == ZERO ? 0 : 1;
            }
        }
        ParityCheckMatrix pattern = ParityCheckMatrix.of(ones);
        return DegreeDistribution.ofEdges(pattern.variableDegrees().edgeFractions(),
                pattern.checkDegrees().edgeFractions());
    }

    /** The ensemble's Gaussian-approximation threshold σ* on the BI-AWGN channel. */
    double thresholdSigma() {
        return new DensityEvolution(ensemble()).thresholdSigma();
    }

    /**
     * The design search: over every high degree from 4 to min(mb, maxDegree) and every count from 1
     * to kb, the protograph with the largest threshold σ* (the first found on a tie, searching
     * degrees then counts upwards) among those that {@link ShiftSearch} lifts without 4-cycles at
     * lifting size {@code smallLifting} (a dense protograph cannot be: two base rows sharing c
     * columns need c distinct shift differences mod Z). A few hundred milliseconds per profile.
     */
    static Protograph search(int kb, int mb, int maxDegree, int smallLifting) {
        Protograph best = null;
        double bestSigma = 0;
        for (int d = LOW_DEGREE + 1; d <= Math.min(mb, maxDegree); d++) {
            for (int count = 1; count <= kb; count++) {
                Protograph p = new Protograph(kb, mb, d, count);
                if (new QcBaseMatrix(new ShiftSearch(p.template).shifts(smallLifting), smallLifting).hasFourCycle()) {
                    continue;
                }
                double sigma = p.thresholdSigma();
                if (sigma > bestSigma) {
                    best = p;
                    bestSigma = sigma;
                }
            }
        }
        return best;
    }
}
