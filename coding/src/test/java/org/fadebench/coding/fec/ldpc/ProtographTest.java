package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;

class ProtographTest {

    /**
     * The parity part is dual-diagonal (common practice, no source): parity column 0 has degree 3
     * (first, middle and last row, shifts a, 0, a), parity column c a 0 in rows c − 1 and c; the
     * information columns have the profile's degrees; check degrees differ by at most one.
     */
    @Test
    void familyProtographsHaveTheDualDiagonalPartTheirProfileAndEvenChecks() {
        for (LdpcFamily code : LdpcFamily.values()) {
            Protograph p = code.protograph();
            int kb = p.infoColumns();
            int mb = p.parityColumns();
            int[][] t = p.template();
            assertEquals(LdpcFamily.BASE_COLUMNS, kb + mb, code.cliName());
            for (int i = 0; i < mb; i++) {
                int corner = i == 0 || i == mb - 1 ? Protograph.CORNER_SHIFT : i == p.middleRow() ? 0 : Protograph.ZERO;
                assertEquals(corner, t[i][kb], code + " row " + i);
                for (int c = 1; c < mb; c++) {
                    assertEquals(i == c - 1 || i == c ? 0 : Protograph.ZERO, t[i][kb + c], code + " row " + i);
                }
            }
            int[] rowDegree = new int[mb];
            for (int j = 0; j < kb; j++) {
                int degree = 0;
                for (int i = 0; i < mb; i++) {
                    degree += t[i][j] == Protograph.ZERO ? 0 : 1;
                }
                assertEquals(j < p.highCount() ? p.highDegree() : Protograph.LOW_DEGREE, degree, code + " column " + j);
            }
            for (int i = 0; i < mb; i++) {
                for (int j = 0; j < kb + mb; j++) {
                    rowDegree[i] += t[i][j] == Protograph.ZERO ? 0 : 1;
                }
            }
            int spread = Arrays.stream(rowDegree).max().getAsInt() - Arrays.stream(rowDegree).min().getAsInt();
            assertTrue(spread <= 1, code + " check degrees " + Arrays.toString(rowDegree));
            // the protograph's ensemble has the family's rate as design rate (mb checks on kb + mb columns)
            assertEquals(code.rate(), code.ensemble().designRate(), 1e-12, code.cliName());
        }
    }

    /**
     * The thresholds of the chosen profiles by Gaussian-approximation density evolution (S.-Y.
     * Chung, T. J. Richardson, R. L. Urbanke, "Analysis of sum-product decoding of low-density
     * parity-check codes using a Gaussian approximation", IEEE Trans. Inf. Theory 47(2), 2001), as
     * the family's javadoc states them, to the bisection's precision; each lies beyond the
     * BPSK-constrained capacity limit at its rate (C. E. Shannon's coding theorem: no ensemble
     * decodes below it), computed with the project's coded-modulation information.
     */
    @Test
    void chosenProfilesHaveThePinnedThresholdsAboveTheCapacityLimit() {
        double[] pinned = {0.92976, 0.72937, 0.64062, 0.55512};
        for (LdpcFamily code : LdpcFamily.values()) {
            double sigma = code.protograph().thresholdSigma();
            assertEquals(pinned[code.ordinal()], sigma, DensityEvolution.SIGMA_PRECISION, code.cliName());
            assertTrue(sigma < DensityEvolutionTest.capacityLimitSigma(code.rate()), code.cliName());
        }
    }

    /**
     * The design search reproduces the rate-5/6 profile (the smallest space: degree 4 only) and
     * skips the denser profiles of larger threshold that cannot be lifted at Z = 13 (k = 256)
     * without 4-cycles (M. P. C. Fossorier, IEEE Trans. Inf. Theory 50(8), 2004: two base rows
     * sharing more than Z columns always close one).
     */
    @Test
    void searchFindsTheRateFiveSixthsProfile() {
        Protograph p = LdpcFamily.R56.protograph();
        int small = LdpcFamily.R56.lifting(256);
        Protograph found = Protograph.search(p.infoColumns(), p.parityColumns(), 8, small);
        assertEquals(p.highDegree(), found.highDegree());
        assertEquals(p.highCount(), found.highCount());
        Protograph denser = new Protograph(p.infoColumns(), p.parityColumns(), 4, 10);
        assertTrue(denser.thresholdSigma() > found.thresholdSigma());
        assertTrue(new QcBaseMatrix(new ShiftSearch(denser.template()).shifts(small), small).hasFourCycle());
    }
}
