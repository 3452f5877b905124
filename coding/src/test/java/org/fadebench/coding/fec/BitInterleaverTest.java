package org.fadebench.coding.fec;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.apache.commons.statistics.distribution.ChiSquaredDistribution;
import org.junit.jupiter.api.Test;

class BitInterleaverTest {

    private static BitInterleaver[] samples(int length) {
        return new BitInterleaver[] {
            BitInterleaver.random(length, 42), BitInterleaver.block(4, length / 4, length), BitInterleaver.identity(length)};
    }

    @Test
    void eachIsAPermutation() {
        for (BitInterleaver b : samples(1000)) {
            boolean[] seen = new boolean[b.length()];
            for (int i = 0; i < b.length(); i++) {
                assertFalse(seen[b.source(i)]);
                seen[b.source(i)] = true;
            }
        }
    }

    /** Bits interleaved, turned into LLRs, deinterleaved: back in the original order, at any offsets. */
    @Test
    void deinterleavingUndoesInterleaving() {
        Random random = new Random(8);
        for (BitInterleaver b : samples(1000)) {
            byte[] bits = CrcTest.randomBits(random, 1003);
            byte[] sent = new byte[1001];
            b.interleave(bits, 3, sent, 1);
            double[] llr = new double[1005];
            for (int i = 0; i < 1000; i++) {
                llr[5 + i] = (i + 1) * (1 - 2 * sent[1 + i]);
            }
            double[] back = new double[1002];
            b.deinterleave(llr, 5, back, 2);
            for (int i = 0; i < 1000; i++) {
                assertEquals(1 - 2 * bits[3 + i], Math.signum(back[2 + i]), 0, "bit " + i);
                assertEquals(llr[5 + i], back[2 + b.source(i)], 0, "LLR " + i);
            }
        }
    }

    @Test
    void randomPermutationIsFixedBySeed() {
        assertArrayEquals(permutation(BitInterleaver.random(500, 7)), permutation(BitInterleaver.random(500, 7)));
        assertFalse(Arrays.equals(permutation(BitInterleaver.random(500, 7)), permutation(BitInterleaver.random(500, 8))));
    }

    /**
     * The shuffle is uniform: over 6000 seeds each of the 6 permutations of 3 elements appears about
     * 1000 times. Pearson's chi-square statistic with 5 degrees of freedom stays below its 0.999
     * quantile (K. Pearson, Philos. Mag. 50(302), 1900; quantile from Commons Statistics); the seeds
     * are fixed, so the check is deterministic and would fail by chance for 1 in 1000 seed sets.
     */
    @Test
    void randomPermutationsAreUniform() {
        int[] counts = new int[6];
        int seeds = 6000;
        for (int seed = 0; seed < seeds; seed++) {
            BitInterleaver b = BitInterleaver.random(3, seed);
            counts[b.source(0) * 2 + (b.source(1) > b.source(2) ? 1 : 0)]++;
        }
        double expected = seeds / 6.0;
        double chi2 = 0;
        for (int c : counts) {
            chi2 += (c - expected) * (c - expected) / expected;
        }
        assertTrue(chi2 < ChiSquaredDistribution.of(5).inverseCumulativeProbability(0.999),
                "chi-square " + chi2 + " counts " + Arrays.toString(counts));
    }

    /** Written row by row into 2 x 3, read column by column: 0 1 2 / 3 4 5 -> 0 3 1 4 2 5. */
    @Test
    void blockInterleaverSmallExample() {
        byte[] in = {0, 1, 2, 3, 4, 5};
        byte[] out = new byte[6];
        BitInterleaver.block(2, 3, 6).interleave(in, 0, out, 0);
        assertArrayEquals(new byte[] {0, 3, 1, 4, 2, 5}, out);
        // neighbours in a row leave `rows` positions apart
        BitInterleaver b = BitInterleaver.block(16, 12, 192);
        int[] where = new int[192];
        for (int i = 0; i < 192; i++) {
            where[b.source(i)] = i;
        }
        for (int j = 0; j + 1 < 192; j++) {
            if ((j + 1) % 12 != 0) {
                assertEquals(16, where[j + 1] - where[j]);
            }
        }
    }

    @Test
    void sizesThatDoNotFitAreNamed() {
        assertEquals("block interleaver of 3 x 4 does not fit a frame of 13 coded bits; need rows x cols = 13",
                assertThrows(IllegalArgumentException.class, () -> BitInterleaver.block(3, 4, 13)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> BitInterleaver.random(0, 1));
        assertThrows(IllegalArgumentException.class, () -> Interleaving.BLOCK.create(12, 0, 0, 12));
    }

    @Test
    void namesAndFactory() {
        assertEquals("random, block, none", Interleaving.choices());
        assertEquals(Interleaving.BLOCK, Interleaving.fromCliName("Block"));
        assertEquals("unknown interleaver 'helical'; valid: random, block, none",
                assertThrows(IllegalArgumentException.class, () -> Interleaving.fromCliName("helical")).getMessage());
        assertArrayEquals(permutation(BitInterleaver.random(24, 3)), permutation(Interleaving.RANDOM.create(24, 3, 0, 0)));
        assertArrayEquals(permutation(BitInterleaver.block(4, 6, 24)), permutation(Interleaving.BLOCK.create(24, 3, 4, 6)));
        assertArrayEquals(permutation(BitInterleaver.identity(24)), permutation(Interleaving.NONE.create(24, 3, 0, 0)));
    }

    private static int[] permutation(BitInterleaver b) {
        int[] p = new int[b.length()];
        for (int i = 0; i < p.length; i++) {
            p[i] = b.source(i);
        }
        return p;
    }
}
