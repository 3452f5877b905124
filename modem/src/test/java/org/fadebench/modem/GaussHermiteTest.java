package org.fadebench.modem;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class GaussHermiteTest {

    /**
     * Positive nodes and their weights, from M. Abramowitz and I. A. Stegun, Handbook of
     * Mathematical Functions, 1964, Table 25.10 (abscissas and weight factors for Hermite
     * integration; values from memory, 15 significant digits). The rules are symmetric, so the
     * negative nodes mirror these with equal weights. For n = 2 and 3 they are also the exact
     * values 1/√2, √π/2 and √(3/2), √π/6, 2√π/3.
     */
    private static final double[][][] TABLE = {
        {{0.707106781186548, 0.886226925452758}},
        {{0.0, 1.181635900603677}, {1.224744871391589, 0.295408975150919}},
        {{0.524647623275290, 0.804914090005513}, {1.650680123885785, 0.081312835447245}},
        {{0.0, 0.945308720482942}, {0.958572464613819, 0.393619323152241},
            {2.020182870456086, 0.019953242059046}},
        {{0.342901327223705, 0.610862633735326}, {1.036610829789514, 0.240138611082315},
            {1.756683649299882, 0.033874394455481}, {2.532731674232790, 0.001343645746781},
            {3.436159118837738, 0.000007640432855}},
    };
    private static final int[] TABLE_SIZES = {2, 3, 4, 5, 10};

    @Test
    void matchesAbramowitzStegunTable() {
        for (int t = 0; t < TABLE.length; t++) {
            int n = TABLE_SIZES[t];
            GaussHermite rule = GaussHermite.of(n);
            assertEquals(n, rule.size());
            double[][] rows = TABLE[t];
            for (int r = 0; r < rows.length; r++) {
                // rows are listed from the centre outwards; node index from the top end
                int i = n - rows.length + r;
                assertEquals(rows[r][0], rule.node(i), 1e-14, "n=" + n + " node " + i);
                assertEquals(rows[r][1], rule.weight(i), 1e-14, "n=" + n + " weight " + i);
                int mirror = n - 1 - i;
                assertEquals(-rows[r][0], rule.node(mirror), 1e-14, "n=" + n + " node " + mirror);
                assertEquals(rows[r][1], rule.weight(mirror), 1e-14, "n=" + n + " weight " + mirror);
            }
        }
    }

    /**
     * Exactness for polynomials of degree ≤ 2n − 1: ∫ x^(2k) e^(−x²) dx = Γ(k + 1/2) (the Gaussian
     * moments, common practice; Γ from Commons Math) and the odd moments vanish.
     */
    @ParameterizedTest
    @ValueSource(ints = {1, 7, 20, 96, GaussHermite.MAX_NODES})
    void integratesPolynomialsExactly(int n) {
        GaussHermite rule = GaussHermite.of(n);
        int maxK = Math.min(n - 1, 60);
        for (int k = 0; k <= maxK; k++) {
            double even = 0;
            double odd = 0;
            double scale = 0;
            for (int i = 0; i < n; i++) {
                double x = rule.node(i);
                double term = rule.weight(i) * Math.pow(x, 2 * k);
                even += term;
                odd += term * x;
                scale += Math.abs(term * x);
            }
            double exact = Math.exp(Gamma.logGamma(k + 0.5));
            assertEquals(exact, even, 1e-12 * exact, "n=" + n + " moment x^" + 2 * k);
            if (2 * k + 1 <= 2 * n - 1) {
                assertEquals(0.0, odd, 1e-13 * Math.max(scale, 1.0), "n=" + n + " moment x^" + (2 * k + 1));
            }
        }
    }

    @Test
    void nodesAscendAndWeightsArePositive() {
        GaussHermite rule = GaussHermite.of(96);
        for (int i = 0; i < rule.size(); i++) {
            assertTrue(rule.weight(i) > 0);
            if (i > 0) {
                assertTrue(rule.node(i) > rule.node(i - 1));
            }
        }
    }

    @Test
    void rejectsBadNodeCounts() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> GaussHermite.of(0));
        assertTrue(e.getMessage().contains("1..200"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> GaussHermite.of(GaussHermite.MAX_NODES + 1));
    }
}
