package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

class FloatingPointDecoderTest {

    /**
     * A parity-check matrix whose Tanner graph is a tree: 12 variables, 5 checks, 16 edges
     * (= 12 + 5 − 1, and connected), so 2^7 codewords.
     */
    static final int[][] TREE = {
        {1, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0},
        {0, 0, 1, 1, 1, 0, 0, 0, 0, 0, 0, 0},
        {0, 0, 0, 0, 1, 1, 1, 1, 0, 0, 0, 0},
        {0, 1, 0, 0, 0, 0, 0, 0, 1, 1, 0, 0},
        {0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 1, 1},
    };

    /**
     * On a cycle-free factor graph the sum-product algorithm computes the exact marginals (F. R.
     * Kschischang, B. J. Frey, H.-A. Loeliger, "Factor graphs and the sum-product algorithm", IEEE
     * Trans. Inf. Theory 47(2), 2001, Section II): here the a-posteriori LLR of every bit,
     * ln Σ_{c: c_j = 0} exp(−Σ_i c_i L_i) − ln Σ_{c: c_j = 1} exp(−Σ_i c_i L_i) over the codewords c,
     * summed by brute force over all 2^12 words. Random LLRs, some of them 0 (punctured bits);
     * 30 layered iterations, far more than the tree's depth needs to converge.
     */
    @Test
    void sumProductOnATreeGivesTheExactPosteriors() {
        ParityCheckMatrix h = ParityCheckMatrix.of(TREE);
        assertTrue(h.girth().isEmpty());
        int n = h.columns();
        Random random = new Random(11);
        double[] llr = new double[n];
        byte[] word = new byte[n];
        FloatingPointDecoder decoder = new FloatingPointDecoder(h,
                new LdpcDecoding(LdpcAlgorithm.SUM_PRODUCT, 30, false, Double.NaN), 1);
        for (int trial = 0; trial < 40; trial++) {
            for (int j = 0; j < n; j++) {
                llr[j] = random.nextInt(6) == 0 ? 0 : 1 + 3 * random.nextGaussian();
            }
            double[][] logSum = new double[n][2];
            for (double[] s : logSum) {
                s[0] = Double.NEGATIVE_INFINITY;
                s[1] = Double.NEGATIVE_INFINITY;
            }
            for (int w = 0; w < 1 << n; w++) {
                double metric = 0;
                for (int j = 0; j < n; j++) {
                    word[j] = (byte) ((w >>> j) & 1);
                    metric -= word[j] * llr[j];
                }
                if (h.isCodeword(word, 0)) {
                    for (int j = 0; j < n; j++) {
                        double[] s = logSum[j];
                        double a = s[word[j]];
                        s[word[j]] = Math.max(a, metric) + Math.log1p(Math.exp(-Math.abs(a - metric)));
                    }
                }
            }
            decoder.load(0, llr, 0);
            decoder.decode(1);
            for (int j = 0; j < n; j++) {
                assertEquals(logSum[j][0] - logSum[j][1], decoder.posterior(0, j), 1e-9, "trial " + trial + " bit " + j);
            }
            assertEquals(30, decoder.iterations(0));
        }
    }

    /** φ(x) = −ln tanh(x/2) is its own inverse (Gallager 1963, from memory), and finite at the limit. */
    @Test
    void phiIsItsOwnInverse() {
        for (double x : new double[] {1e-6, 0.01, 0.5, 1, 3, 10, 30}) {
            assertEquals(-Math.log(Math.tanh(x / 2)), FloatingPointDecoder.phi(x), 1e-12 * Math.max(1, -Math.log(Math.tanh(x / 2))));
            assertEquals(x, FloatingPointDecoder.phi(FloatingPointDecoder.phi(x)), 1e-9 * Math.max(1, x));
        }
        assertEquals(Double.POSITIVE_INFINITY, FloatingPointDecoder.phi(0));
        double least = FloatingPointDecoder.phi(1e9);
        assertTrue(least > 0 && least >= Double.MIN_NORMAL);
        assertTrue(FloatingPointDecoder.phi(least) < 710);
    }
}
