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
 */
final class DualDiagonalEncoder implements LdpcEncoder {

    private final int z;
    private final int kb;
    private final int mb;
    private final int middleRow;
    private final int corner;
    private final int[] blockRow; // information blocks: row, column, shift
    private final int[] blockColumn;
    private final int[] blockShift;
    private final int[] infoPosition;
    private final byte[] info;     // kb·Z, fillers zero
    private final byte[] syndrome; // mb·Z

    DualDiagonalEncoder(QcBaseMatrix base, int middleRow, int[] infoPosition) {
        z = base.lifting();
        mb = base.baseRows();
        kb = base.baseColumns() - mb;
        this.middleRow = middleRow;
        this.corner = base.shift(0, kb);
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
        this.infoPosition = infoPosition.clone();
        info = new byte[kb * z];
        syndrome = new byte[mb * z];
    }

    @Override
    public void encode(byte[] bits, int off, byte[] word, int wordOff) {
        int k = infoPosition.length;
        for (int t = 0; t < k; t++) {
            byte b = (byte) (bits[off + t] & 1);
            info[infoPosition[t]] = b;
            word[wordOff + t] = b;
        }
        Arrays.fill(syndrome, (byte) 0);
        for (int b = 0; b < blockRow.length; b++) {
            int row = blockRow[b] * z;
            int col = blockColumn[b] * z;
            int s = blockShift[b];
            for (int x = 0; x < z - s; x++) {
                syndrome[row + x] ^= info[col + x + s];
            }
            for (int x = z - s; x < z; x++) {
                syndrome[row + x] ^= info[col + x + s - z];
            }
        }
        int p0 = wordOff + k;
        for (int x = 0; x < z; x++) {
            byte v = 0;
            for (int i = 0; i < mb; i++) {
                v ^= syndrome[i * z + x];
            }
            word[p0 + x] = v;
        }
        int p1 = p0 + z;
        for (int x = 0; x < z; x++) {
            word[p1 + x] = (byte) (syndrome[x] ^ word[p0 + (x + corner) % z]);
        }
        for (int i = 1; i < mb - 1; i++) {
            int p = p0 + i * z;
            for (int x = 0; x < z; x++) {
                word[p + z + x] = (byte) (word[p + x] ^ syndrome[i * z + x] ^ (i == middleRow ? word[p0 + x] : 0));
            }
        }
    }
}
