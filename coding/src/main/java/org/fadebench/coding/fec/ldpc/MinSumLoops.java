package org.fadebench.coding.fec.ldpc;

/**
 * The loops of the fixed-point min-sum check update, shared by both kernels ({@link FixedPointDecoder}
 * on rows over lanes, {@link QcDecoder} on the Z rows of a block row over lanes): each runs over
 * elements 0 to {@code len} − 1 of its arrays, branch-free (sign masks from arithmetic shifts), a
 * body short enough for C2's loop vectoriser (Java 17 vectorises only short bodies, and no loop
 * whose arrays are indexed from different offsets).
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
     * r = Q = p − r, and the sign parity, the least and the second least |Q| updated (one loop:
     * Math.abs on ints vectorises, Math.min and Math.max do not, so the minima use sign masks).
     */
    static void subtractAndMinima(int[] p, int[] r, int[] sign, int[] least, int[] second, int len) {
        for (int x = 0; x < len; x++) {
            int q = p[x] - r[x];
            r[x] = q;
            sign[x] ^= q;
            int a = Math.abs(q);
            int low = least[x];
            int d = a - low;
            int cut = d & (d >> 31);
            least[x] = low + cut;
            int high = a - cut - second[x];
            second[x] += high & (high >> 31);
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
