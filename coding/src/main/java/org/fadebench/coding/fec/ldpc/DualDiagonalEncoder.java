package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;

/**
 * Linear-time encoder of a lifted protograph with a dual-diagonal parity part ({@link Protograph}):
 * with λ_i = Σ_j P^(s_ij) u_j the syndrome of the information part in row block i, adding all row
 * blocks cancels the staircase and leaves parity block 0, p_0 = Σ_i λ_i; then row 0 gives
 * p_1 = λ_0 + P^a p_0 and row i = 1 .. mb − 2 gives p_(i+1) = p_i + λ_i (+ p_0 in the middle row)
 * (common practice, no source). Here (P^s v)[x] = v[(x + s) mod Z], the block convention of
 * {@link QcBaseMatrix}. Writes the k information bits then the mb·Z parity bits, the column order
 * of {@link LiftedLayout}. Allocates nothing per codeword; one per thread.
 *
 * <p>Blocks are worked on as bits packed 64 to a {@code long} (bit x of a block in word x / 64 at
 * bit x mod 64; the bits above Z of a block's last word are never read). A block that is turned
 * (P^s) is kept twice in a row, bits Z .. 2Z − 1 repeating 0 .. Z − 1, so P^s v is the run of Z
 * bits from bit s: {@link #addTurned} reads it a word at a time.
 */
final class DualDiagonalEncoder implements LdpcEncoder {

    private final int z;
    private final int mb;
    private final int middleRow;
    private final int corner;
    /** Words of a block of Z bits. */
    private final int words;
    /** Words of a block kept twice (2Z bits), with one spare word so that a run is read in pairs. */
    private final int twiceWords;
    private final int[] blockRow; // information blocks: row, column, shift
    private final int[] blockColumn;
    private final int[] blockShift;
    /** The bits of a block's last word (below Z). */
    private final long lastMask;
    private final int[] infoPosition;
    private final byte[] info;     // kb·Z, fillers zero
    private final long[] block;    // one block, packed
    /** The kb information blocks, then parity block 0, each kept twice. */
    private final long[] twice;
    private final long[] syndrome; // mb blocks
    private final long[] parity;   // mb blocks

    DualDiagonalEncoder(QcBaseMatrix base, int middleRow, int[] infoPosition) {
        z = base.lifting();
        mb = base.baseRows();
        int kb = base.baseColumns() - mb;
        this.middleRow = middleRow;
        this.corner = base.shift(0, kb);
        words = (z + 63) >>> 6;
        twiceWords = ((2 * z + 63) >>> 6) + 1;
        int count = 0;
        for (int i = 0; i < mb; i++) {
            for (int j = 0; j < kb; j++) {
                count += base.shift(i, j) >= 0 ? 1 : 0;
            }
        }
        blockRow = new int[count];
        blockColumn = new int[count];
        blockShift = new int[count];
        for (int i = 0, b = 0; i < mb; i++) {
            for (int j = 0; j < kb; j++) {
                if (base.shift(i, j) >= 0) {
                    blockRow[b] = i;
                    blockColumn[b] = j;
                    blockShift[b++] = base.shift(i, j);
                }
            }
        }
        lastMask = -1L >>> (64 * words - z);
        this.infoPosition = infoPosition.clone();
        info = new byte[kb * z];
        block = new long[words];
        twice = new long[(kb + 1) * twiceWords];
        syndrome = new long[mb * words];
        parity = new long[mb * words];
    }

    @Override
    public void encode(byte[] bits, int off, byte[] word, int wordOff) {
        int k = infoPosition.length;
        for (int t = 0; t < k; t++) {
            byte b = (byte) (bits[off + t] & 1);
            info[infoPosition[t]] = b;
            word[wordOff + t] = b;
        }
        Arrays.fill(twice, 0L);
        for (int j = 0, kb = info.length / z; j < kb; j++) {
            for (int w = 0; w < words; w++) {
                long v = 0;
                for (int x = 64 * w, end = Math.min(x + 64, z); x < end; x++) {
                    v |= (long) info[j * z + x] << x;
                }
                block[w] = v;
            }
            putTwice(block, 0, j * twiceWords);
        }
        Arrays.fill(syndrome, 0L);
        for (int b = 0; b < blockRow.length; b++) {
            addTurned(blockColumn[b] * twiceWords, blockShift[b], syndrome, blockRow[b] * words);
        }
        // p_0 = Σ_i λ_i, kept twice for the turn of row 0
        for (int w = 0; w < words; w++) {
            long v = 0;
            for (int i = 0; i < mb; i++) {
                v ^= syndrome[i * words + w];
            }
            parity[w] = v;
        }
        int p0Twice = twice.length - twiceWords;
        putTwice(parity, 0, p0Twice);
        // p_1 = λ_0 + P^corner p_0; p_(i+1) = p_i + λ_i (+ p_0 in the middle row)
        System.arraycopy(syndrome, 0, parity, words, words);
        addTurned(p0Twice, corner, parity, words);
        for (int i = 1; i < mb - 1; i++) {
            for (int w = 0; w < words; w++) {
                parity[(i + 1) * words + w] = parity[i * words + w] ^ syndrome[i * words + w]
                        ^ (i == middleRow ? parity[w] : 0L);
            }
        }
        for (int c = 0, p = wordOff + k; c < mb; c++) {
            for (int w = 0; w < words; w++) {
                long v = parity[c * words + w];
                for (int x = 64 * w, end = Math.min(x + 64, z); x < end; x++, v >>>= 1) {
                    word[p++] = (byte) (v & 1);
                }
            }
        }
    }

    /** Writes the Z bits at {@code src[srcOff ..]} twice in a row at {@code twice[to ..]}, which is zero there. */
    private void putTwice(long[] src, int srcOff, int to) {
        for (int w = 0; w < words; w++) {
            long v = w == words - 1 ? src[srcOff + w] & lastMask : src[srcOff + w];
            twice[to + w] |= v;
            int at = z + 64 * w;
            int q = to + (at >>> 6);
            int r = at & 63;
            twice[q] |= v << r;
            twice[q + 1] |= (v >>> 1) >>> (63 - r);
        }
    }

    /**
     * Adds P^s v to the block at {@code out[outOff ..]}, v the block kept twice at
     * {@code twice[from ..]}: its bits s .. s + Z − 1, a word at a time.
     */
    private void addTurned(int from, int s, long[] out, int outOff) {
        for (int w = 0; w < words; w++) {
            int bit = s + 64 * w;
            int q = from + (bit >>> 6);
            int r = bit & 63;
            // the next word's low bits above the r-bit shift; (x << 1) << (63 − r) is 0 when r = 0
            out[outOff + w] ^= (twice[q] >>> r) | ((twice[q + 1] << 1) << (63 - r));
        }
    }
}
