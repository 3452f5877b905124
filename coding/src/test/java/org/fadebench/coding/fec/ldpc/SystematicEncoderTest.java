package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.HashSet;
import java.util.Random;
import java.util.Set;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;

class SystematicEncoderTest {

    @Test
    void rankOfKnownMatrices() {
        assertEquals(3, Gf2Elimination.rank(ParityCheckMatrix.of(new int[][] {{1, 0, 0}, {0, 1, 0}, {0, 0, 1}})));
        assertEquals(1, Gf2Elimination.rank(ParityCheckMatrix.of(new int[][] {{1, 1, 1}, {1, 1, 1}, {1, 1, 1}})));
        // the third row is the sum of the first two
        assertEquals(2, Gf2Elimination.rank(ParityCheckMatrix.of(new int[][] {{1, 1, 0, 1}, {0, 1, 1, 1}, {1, 0, 1, 0}})));
        // a ring of 5 (row i checks columns i and i+1 mod 5): the rows sum to zero, any 4 are independent
        int[][] ring = new int[5][5];
        for (int i = 0; i < 5; i++) {
            ring[i][i] = 1;
            ring[i][(i + 1) % 5] = 1;
        }
        assertEquals(4, Gf2Elimination.rank(ParityCheckMatrix.of(ring)));
        assertEquals(3, Gf2Elimination.rank(ParityCheckMatrix.of(ParityCheckMatrixTest.HAMMING_7_4)));
    }

    /**
     * Matrices of known rank r across word boundaries: r rows [I_r | random] with columns permuted,
     * mixed by random row additions (which keep the rank), plus rows that are sums of others.
     */
    @Test
    void rankOfMixedMatricesOfKnownRank() {
        Random random = new Random(3);
        for (int trial = 0; trial < 20; trial++) {
            int n = 60 + random.nextInt(150);
            int r = 1 + random.nextInt(Math.min(n, 100));
            int m = r + random.nextInt(20);
            int[] perm = shuffled(n, random);
            int[][] dense = new int[m][n];
            for (int i = 0; i < r; i++) {
                dense[i][perm[i]] = 1;
                for (int j = r; j < n; j++) {
                    dense[i][perm[j]] = random.nextInt(2);
                }
            }
            for (int step = 0; step < 3 * r; step++) {
                int a = random.nextInt(r);
                int b = random.nextInt(r);
                if (a != b) {
                    add(dense[a], dense[b]);
                }
            }
            for (int i = r; i < m; i++) {
                add(dense[i], dense[random.nextInt(r)]);
                add(dense[i], dense[random.nextInt(r)]);
            }
            assertEquals(r, Gf2Elimination.rank(ParityCheckMatrix.of(shuffleRows(dense, random))), "trial " + trial);
        }
    }

    /**
     * Rank of small random matrices against the null space counted by brute force:
     * rank = n − log2 |{c : H·c = 0}| (rank–nullity, common practice, no source).
     */
    @Test
    void rankAgreesWithTheNullSpaceSize() {
        Random random = new Random(8);
        for (int trial = 0; trial < 30; trial++) {
            int n = 3 + random.nextInt(11);
            int m = 1 + random.nextInt(10);
            int[][] dense = new int[m][n];
            for (int[] row : dense) {
                for (int j = 0; j < n; j++) {
                    row[j] = random.nextInt(3) == 0 ? 1 : 0;
                }
            }
            dense[0][random.nextInt(n)] = 1;
            ParityCheckMatrix h = ParityCheckMatrix.of(dense);
            int size = nullSpace(h).size();
            assertEquals(Integer.bitCount(size), 1);
            assertEquals(n - Integer.numberOfTrailingZeros(size), Gf2Elimination.rank(h), "trial " + trial);
        }
    }

    /**
     * Hamming (7,4): k = 4, the 16 encoded words are exactly the null space found by exhaustive
     * enumeration of the 128 words, with weights 0 (once), 3 (7 times), 4 (7 times), 7 (once) (the
     * weight enumerator 1 + 7x³ + 7x⁴ + x⁷, F. J. MacWilliams, N. J. A. Sloane, "The Theory of
     * Error-Correcting Codes", 1977, Chapter 1, from memory). Its weights are not all even; the
     * extended (8,4) code's are (next test).
     */
    @Test
    void hammingCodewordsAreItsNullSpace() {
        ParityCheckMatrix h = ParityCheckMatrix.of(ParityCheckMatrixTest.HAMMING_7_4);
        SystematicEncoder encoder = new SystematicEncoder(h);
        assertEquals(4, encoder.informationBits());
        Set<String> encoded = allCodewords(encoder, h);
        assertEquals(nullSpace(h), encoded);
        int[] weights = new int[8];
        for (String word : encoded) {
            weights[(int) word.chars().filter(ch -> ch == '1').count()]++;
        }
        assertArrayEquals(new int[] {1, 0, 0, 7, 7, 0, 0, 1}, weights);
    }

    /** The extended (8,4) Hamming code (an overall parity check added): all 16 codewords of even weight, 14 of weight 4. */
    @Test
    void extendedHammingCodewordsHaveEvenWeight() {
        int[][] dense = new int[4][8];
        for (int i = 0; i < 3; i++) {
            System.arraycopy(ParityCheckMatrixTest.HAMMING_7_4[i], 0, dense[i], 0, 7);
        }
        Arrays.fill(dense[3], 1);
        ParityCheckMatrix h = ParityCheckMatrix.of(dense);
        SystematicEncoder encoder = new SystematicEncoder(h);
        Set<String> encoded = allCodewords(encoder, h);
        assertEquals(nullSpace(h), encoded);
        int[] weights = new int[9];
        encoded.forEach(word -> weights[(int) word.chars().filter(ch -> ch == '1').count()]++);
        assertArrayEquals(new int[] {1, 0, 0, 0, 14, 0, 0, 0, 1}, weights);
    }

    /** Random information into random rank-deficient matrices longer than a word: H·c = 0, information bits in place. */
    @Test
    void everyEncodedWordSatisfiesTheChecks() {
        Random random = new Random(21);
        for (int trial = 0; trial < 10; trial++) {
            int n = 100 + random.nextInt(200);
            int m = 20 + random.nextInt(n / 2);
            int[][] dense = new int[m][n];
            for (int[] row : dense) {
                for (int j = 0; j < n; j++) {
                    row[j] = random.nextInt(8) == 0 ? 1 : 0;
                }
            }
            dense[m - 1] = dense[0].clone(); // at least one dependent row
            ParityCheckMatrix h = ParityCheckMatrix.of(dense);
            SystematicEncoder encoder = new SystematicEncoder(h);
            int k = encoder.informationBits();
            assertEquals(n - Gf2Elimination.rank(h), k);
            assertTrue(k >= n - m + 1);
            int[] order = encoder.columnOrder();
            assertArrayEquals(IntStream.range(0, n).toArray(), IntStream.of(order).sorted().toArray());
            byte[] info = new byte[k + 3];
            byte[] coded = new byte[n + 5];
            for (int word = 0; word < 20; word++) {
                for (int t = 0; t < k; t++) {
                    info[3 + t] = (byte) random.nextInt(2);
                }
                encoder.encode(info, 3, coded, 5);
                assertTrue(h.isCodeword(coded, 5), "trial " + trial + " word " + word);
                for (int t = 0; t < k; t++) {
                    assertEquals(info[3 + t], coded[5 + order[t]]);
                }
            }
        }
    }

    /** A dual-diagonal parity part on the right keeps the identity order: the codeword is [info | parity] as written. */
    @Test
    void independentLastColumnsGiveTheIdentityOrder() {
        int[][] dense = {
            {1, 0, 1, 1, 1, 0, 0},
            {0, 1, 1, 0, 1, 1, 0},
            {1, 1, 0, 1, 0, 1, 1},
        };
        SystematicEncoder encoder = new SystematicEncoder(ParityCheckMatrix.of(dense));
        assertArrayEquals(new int[] {0, 1, 2, 3, 4, 5, 6}, encoder.columnOrder());
    }

    @Test
    void refusesFullColumnRank() {
        assertThrows(IllegalArgumentException.class,
                () -> new SystematicEncoder(ParityCheckMatrix.of(new int[][] {{1, 0}, {1, 1}})));
    }

    private static Set<String> allCodewords(SystematicEncoder encoder, ParityCheckMatrix h) {
        int k = encoder.informationBits();
        Set<String> words = new HashSet<>();
        byte[] info = new byte[k];
        byte[] coded = new byte[h.columns()];
        for (int u = 0; u < 1 << k; u++) {
            for (int t = 0; t < k; t++) {
                info[t] = (byte) (u >>> t & 1);
            }
            encoder.encode(info, 0, coded, 0);
            assertTrue(h.isCodeword(coded, 0));
            words.add(text(coded));
        }
        assertEquals(1 << k, words.size(), "the encoder is one-to-one");
        return words;
    }

    /** Every word c of length n with H·c = 0, by trying all 2^n. */
    private static Set<String> nullSpace(ParityCheckMatrix h) {
        int n = h.columns();
        Set<String> words = new HashSet<>();
        byte[] c = new byte[n];
        for (int v = 0; v < 1 << n; v++) {
            for (int j = 0; j < n; j++) {
                c[j] = (byte) (v >>> j & 1);
            }
            boolean zero = true;
            for (int i = 0; i < h.rows() && zero; i++) {
                int s = 0;
                for (int j = 0; j < n; j++) {
                    s ^= h.get(i, j) ? c[j] : 0;
                }
                zero = s == 0;
            }
            if (zero) {
                words.add(text(c));
            }
        }
        return words;
    }

    private static String text(byte[] bits) {
        StringBuilder sb = new StringBuilder();
        for (byte b : bits) {
            sb.append(b);
        }
        return sb.toString();
    }

    private static void add(int[] target, int[] row) {
        for (int j = 0; j < target.length; j++) {
            target[j] ^= row[j];
        }
    }

    private static int[] shuffled(int n, Random random) {
        int[] p = IntStream.range(0, n).toArray();
        for (int i = n - 1; i > 0; i--) {
            int j = random.nextInt(i + 1);
            int t = p[i];
            p[i] = p[j];
            p[j] = t;
        }
        return p;
    }

    private static int[][] shuffleRows(int[][] dense, Random random) {
        int[] p = shuffled(dense.length, random);
        int[][] out = new int[dense.length][];
        for (int i = 0; i < dense.length; i++) {
            out[i] = dense[p[i]];
        }
        return out;
    }
}
