package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;
import org.fadebench.coding.fec.Lanes;

/**
 * The loops of the fixed-point min-sum check update, shared by both kernels ({@link FixedPointDecoder}
 * on rows over lanes, {@link QcDecoder} on the Z rows of a block row over lanes): each runs over
 * elements 0 to {@code len} − 1 of its arrays, branch-free (sign masks from arithmetic shifts), a
 * body C2's loop vectoriser takes (Java 17 vectorises no loop whose arrays are indexed from
 * different offsets or from a start other than 0; Q and the minima of four edges in one loop it
 * does, the messages of two edges in one loop it does not).
 * Element x of the per-check rows ({@code sign}, {@code least}, {@code second}, {@code leastOut},
 * {@code gap}) belongs to the check whose message is element x of the edge's row. Numbers are in
 * the steps of {@link FixedPointDecoder}.
 */
final class MinSumLoops {

    /** Above any |Q|: the starting value of the minima. */
    static final int ABOVE = 1 << 30;

    private MinSumLoops() {
    }

    /**
     * A min-sum decoding's correction in steps, and the loop that applies it: the normalisation
     * factor α as a multiple of 1/16 ({@link #scale}), or the offset β as a multiple of a step
     * ({@link #lessOffset}).
     */
    record Correction(boolean normalised, int amount) {

        /** @throws IllegalArgumentException for sum-product, which has no fixed-point kernel */
        static Correction of(LdpcDecoding decoding) {
            if (decoding.algorithm() == LdpcAlgorithm.SUM_PRODUCT) {
                throw new IllegalArgumentException("sum-product runs in floating point only");
            }
            boolean normalised = decoding.algorithm() == LdpcAlgorithm.MIN_SUM;
            int amount = (int) Math.round(decoding.correction() * (normalised ? 16 : FixedPointDecoder.SCALE));
            return new Correction(normalised, amount);
        }

        /** The minima corrected, into {@code leastOut} and {@code gap} (see {@link #scale} and {@link #lessOffset}). */
        void apply(int[] least, int[] second, int[] sign, int[] leastOut, int[] gap, int len) {
            if (normalised) {
                scale(least, second, sign, leastOut, gap, amount, len);
            } else {
                lessOffset(least, second, sign, leastOut, gap, amount, len);
            }
        }
    }

    /**
     * The minima corrected, m ↦ ⌊min(m, MESSAGE_LIMIT)·factor/16⌋: the corrected least into
     * {@code leastOut} and the corrected second less it into {@code gap}, both negated where the
     * sign parity is negative.
     */
    static void scale(int[] least, int[] second, int[] sign, int[] leastOut, int[] gap, int factor, int len) {
        final int limit = FixedPointDecoder.MESSAGE_LIMIT;
        for (int x = 0; x < len; x++) {
            int low = ((least[x] - limit >> 31 & least[x] - limit) + limit) * factor >> 4;
            int high = ((second[x] - limit >> 31 & second[x] - limit) + limit) * factor >> 4;
            int s = sign[x] >> 31;
            leastOut[x] = (low ^ s) - s;
            gap[x] = (high - low ^ s) - s;
        }
    }

    /**
     * The minima corrected, m ↦ max(min(m, MESSAGE_LIMIT) − offset, 0): the corrected least into
     * {@code leastOut} and the corrected second less it into {@code gap}, both negated where the
     * sign parity is negative.
     */
    static void lessOffset(int[] least, int[] second, int[] sign, int[] leastOut, int[] gap, int offset, int len) {
        final int limit = FixedPointDecoder.MESSAGE_LIMIT;
        final int b = limit - offset;
        for (int x = 0; x < len; x++) {
            int low = (least[x] - limit >> 31 & least[x] - limit) + b;
            int high = (second[x] - limit >> 31 & second[x] - limit) + b;
            low &= ~(low >> 31);
            high &= ~(high >> 31);
            int s = sign[x] >> 31;
            leastOut[x] = (low ^ s) - s;
            gap[x] = (high - low ^ s) - s;
        }
    }

    /**
     * Edge of a check with its Q in {@code r}: R = ±(the corrected least |Q| of the others) into
     * {@code r}, P = Q + R into {@code p}; the sign is the parity's (already on {@code leastOut}
     * and {@code gap}) times Q's. An edge whose |Q| equals the least takes the second least (on a
     * tie the same value), so the edge of the least need not be kept.
     */
    static void scatter(int[] p, int[] r, int[] least, int[] leastOut, int[] gap, int len) {
        for (int x = 0; x < len; x++) {
            int q = r[x];
            int own = ((Math.abs(q) ^ least[x]) - 1) >> 31;
            int s = q >> 31;
            int v = (leastOut[x] + (gap[x] & own) ^ s) - s;
            r[x] = v;
            p[x] = q + v;
        }
    }

    /** Edges of a check row per call of {@link #subtractAndMinima}. */
    static final int GROUP = 4;

    /**
     * The posteriors and messages of up to {@value #GROUP} edges of a check row, for
     * {@link #subtractAndMinima}: views of the decoder's rows, no copies. A place with no edge holds
     * a filler, whose Q = P − R is {@value #FILLER} and stays so (R becomes Q, and the message
     * loop never runs on it): above every |Q| of an edge, so never a least, and positive, so it
     * flips no sign; if it is taken as a second least it is held at MESSAGE_LIMIT as ABOVE would be.
     */
    static final class Group {
        /** Q of a filler. */
        static final int FILLER = 1 << 29;

        final int[][] p = new int[GROUP][];
        final int[][] r = new int[GROUP][];
        private final int[][] fillerP;
        private final int[][] fillerR;
        /** Where a check's parity and minima start: 0 and {@link #ABOVE}. */
        private final int[] zero;
        private final int[] above;

        /** @param len elements per row */
        Group(int len) {
            fillerP = new int[GROUP][len];
            fillerR = new int[GROUP][len];
            for (int k = 0; k < GROUP; k++) {
                Arrays.fill(fillerP[k], 2 * FILLER);
                Arrays.fill(fillerR[k], FILLER);
            }
            zero = new int[len];
            above = new int[len];
            Arrays.fill(above, ABOVE);
        }

        /** Bytes of a group's fillers and views for rows of {@code len} elements. */
        static long bytes(int len) {
            return 4 * Lanes.rowBytes(4L * GROUP) + (2 * GROUP + 2) * Lanes.rowBytes(4L * len);
        }

        /** Place k: the edge with posteriors p and messages r. */
        void edge(int k, int[] pk, int[] rk) {
            p[k] = pk;
            r[k] = rk;
        }

        /** Place k: a filler. */
        void filler(int k) {
            p[k] = fillerP[k];
            r[k] = fillerR[k];
        }
    }

    /**
     * For each edge k of the group: r = Q = p − r, the sign parity, the least and the second least
     * |Q| updated (one loop over the {@value #GROUP} edges, the parity and minima held in registers
     * between them: Math.abs on ints vectorises, Math.min and Math.max do not, so the minima use
     * sign masks, {@link #below}; the two least of a set do not depend on the order the values
     * come in). The first group of a check ({@code first}) starts the parity at 0 and the minima
     * at {@link #ABOVE} instead of reading them.
     */
    static void subtractAndMinima(Group group, boolean first, int[] sign, int[] least, int[] second, int len) {
        int[][] p = group.p;
        int[][] r = group.r;
        int[] signIn = first ? group.zero : sign;
        int[] leastIn = first ? group.above : least;
        int[] secondIn = first ? group.above : second;
        int[] p0 = p[0], p1 = p[1], p2 = p[2], p3 = p[3];
        int[] r0 = r[0], r1 = r[1], r2 = r[2], r3 = r[3];
        for (int x = 0; x < len; x++) {
            int q0 = p0[x] - r0[x];
            int q1 = p1[x] - r1[x];
            int q2 = p2[x] - r2[x];
            int q3 = p3[x] - r3[x];
            r0[x] = q0;
            r1[x] = q1;
            r2[x] = q2;
            r3[x] = q3;
            sign[x] = signIn[x] ^ q0 ^ q1 ^ q2 ^ q3;
            // the two least of (least, second) and |q0| .. |q3|, one value after another (see below)
            int a0 = Math.abs(q0), a1 = Math.abs(q1), a2 = Math.abs(q2), a3 = Math.abs(q3);
            int low = leastIn[x];
            int high = secondIn[x];
            int c0 = below(a0 - low), l0 = low + c0, h0 = high + below(a0 - c0 - high);
            int c1 = below(a1 - l0), l1 = l0 + c1, h1 = h0 + below(a1 - c1 - h0);
            int c2 = below(a2 - l1), l2 = l1 + c2, h2 = h1 + below(a2 - c2 - h1);
            int c3 = below(a3 - l2);
            least[x] = l2 + c3;
            second[x] = h2 + below(a3 - c3 - h2);
        }
    }

    /**
     * d where negative, else 0 (by a sign mask: Math.min on ints does not vectorise). With
     * c = below(a − low), low + c is min(low, a) and a − c is max(low, a), so the two least of
     * (low, high) and a are low + c and high + below(a − c − high).
     */
    private static int below(int d) {
        return d & (d >> 31);
    }

    /** acc ^= p, element by element. */
    static void exclusiveOr(int[] acc, int[] p, int len) {
        for (int x = 0; x < len; x++) {
            acc[x] ^= p[x];
        }
    }

    /** acc |= s, element by element. */
    static void or(int[] acc, int[] s, int len) {
        for (int x = 0; x < len; x++) {
            acc[x] |= s[x];
        }
    }

    /** to = from where mask is −1, unchanged where 0. */
    static void keep(int[] from, int[] to, int[] mask, int len) {
        for (int x = 0; x < len; x++) {
            to[x] ^= (to[x] ^ from[x]) & mask[x];
        }
    }
}
