package org.fadebench.coding.fec.conv;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.fadebench.coding.fec.CrcTest;
import org.junit.jupiter.api.Test;

class PuncturerTest {

    private static final ConvolutionalCode K7 = ConvolutionalCode.K7_133_171;

    /**
     * Coded lengths, tail included: rate 1/2 sends 2 (k+6); rate 2/3 sends 3 bits per 2 steps and
     * rate 3/4 4 bits per 3 steps, the pattern running on through the tail (arithmetic on the
     * patterns in {@link PuncturedCode}).
     */
    @Test
    void codedBitsFollowThePatterns() {
        assertEquals(2 * 106, PuncturedCode.CONV_R12.codedBits(100));
        assertEquals(2 * 103, PuncturedCode.CONV_SMALL.codedBits(101));
        assertEquals(3 * 51, PuncturedCode.CONV_R23.codedBits(96));       // 102 steps = 51 periods
        assertEquals(3 * 51 + 2, PuncturedCode.CONV_R23.codedBits(97));   // one step into a period: 2 bits
        assertEquals(4 * 34, PuncturedCode.CONV_R34.codedBits(96));       // 102 steps = 34 periods
        assertEquals(4 * 34 + 2, PuncturedCode.CONV_R34.codedBits(97));
        assertEquals(4 * 34 + 3, PuncturedCode.CONV_R34.codedBits(98));
        assertEquals(0.75, PuncturedCode.CONV_R34.rate(), 0);
        assertEquals(2.0 / 3, PuncturedCode.CONV_R23.rate(), 1e-15);
    }

    /** Puncturing keeps exactly the pattern's positions; depuncturing puts them back, zeros elsewhere. */
    @Test
    void depuncturingInvertsPuncturing() {
        Puncturer p = PuncturedCode.CONV_R34.puncturer();
        int k = 20;
        byte[] mother = CrcTest.randomBits(new java.util.Random(2), K7.codedBits(k));
        byte[] sent = new byte[p.codedBits(k)];
        assertEquals(sent.length, p.puncture(mother, 0, k, sent, 0));
        double[] received = new double[sent.length];
        for (int i = 0; i < sent.length; i++) {
            received[i] = (i + 1) * (1 - 2 * sent[i]);
        }
        double[] llr = new double[mother.length];
        p.depuncture(received, 0, k, llr, 0);
        int next = 1;
        for (int m = 0; m < mother.length; m++) {
            boolean kept = p.keeps((m / 2) % 3, m % 2);
            double expected = kept ? next++ * (1 - 2 * mother[m]) : 0;
            assertEquals(expected, llr[m], 0, "position " + m);
        }
        assertEquals(sent.length + 1, next);
        assertEquals("[1 1 0; 1 0 1]", p.toString());
        assertEquals("[1 1; 1 0]", PuncturedCode.CONV_R23.puncturer().toString());
    }

    /**
     * Every built-in code, unpunctured ones (copied whole) included, with the streams at offsets and
     * sizes that end inside a period: puncturing sends exactly the pattern's kept bits in order,
     * depuncturing puts each LLR back at its bit and 0 at every removed one.
     */
    @Test
    void everyCodeSendsThePatternsBitsInOrder() {
        java.util.Random random = new java.util.Random(3);
        for (PuncturedCode code : new PuncturedCode[] {PuncturedCode.CONV_R12, PuncturedCode.CONV_R23,
            PuncturedCode.CONV_R34, PuncturedCode.CONV_SMALL}) {
            Puncturer p = code.puncturer();
            int n = p.code().outputs();
            for (int k : new int[] {20, 21, 22, 1024}) {
                int motherBits = p.code().codedBits(k);
                byte[] mother = CrcTest.randomBits(random, 3 + motherBits);
                byte[] sent = new byte[5 + p.codedBits(k)];
                assertEquals(p.codedBits(k), p.puncture(mother, 3, k, sent, 5));
                double[] received = new double[2 + p.codedBits(k)];
                for (int i = 0; i < p.codedBits(k); i++) {
                    received[2 + i] = (i + 1) * (1 - 2 * sent[5 + i]);
                }
                double[] llr = new double[4 + motherBits];
                p.depuncture(received, 2, k, llr, 4);
                int next = 0;
                for (int m = 0; m < motherBits; m++) {
                    String where = code + " k " + k + " position " + m;
                    if (p.keeps((m / n) % p.period(), m % n)) {
                        assertEquals(mother[3 + m], sent[5 + next], where);
                        next++;
                        assertEquals(next * (1 - 2 * mother[3 + m]), llr[4 + m], 0, where);
                    } else {
                        assertEquals(0, llr[4 + m], 0, where);
                    }
                }
                assertEquals(p.codedBits(k), next, code + " k " + k);
            }
        }
    }

    @Test
    void patternsThatDoNotFitAreNamed() {
        assertEquals("puncturing pattern has 3 rows but code K=7 (133, 171)_8 has 2 outputs; need one row per output",
                assertThrows(IllegalArgumentException.class,
                        () -> new Puncturer(K7, new int[][] {{1}, {1}, {1}})).getMessage());
        assertEquals("puncturing pattern row 1 has 2 columns, row 0 has 3; need a rectangular pattern",
                assertThrows(IllegalArgumentException.class,
                        () -> new Puncturer(K7, new int[][] {{1, 1, 0}, {1, 0}})).getMessage());
        assertEquals("puncturing pattern entry 2 at row 1, column 0; valid: 0 (remove) or 1 (keep)",
                assertThrows(IllegalArgumentException.class,
                        () -> new Puncturer(K7, new int[][] {{1}, {2}})).getMessage());
        assertEquals("puncturing pattern column 1 removes every output of its step; keep at least one bit per column",
                assertThrows(IllegalArgumentException.class,
                        () -> new Puncturer(K7, new int[][] {{1, 0}, {1, 0}})).getMessage());
        assertEquals("puncturing pattern has no columns; need a period of at least 1",
                assertThrows(IllegalArgumentException.class,
                        () -> new Puncturer(K7, new int[][] {{}, {}})).getMessage());
    }
}
