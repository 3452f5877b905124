package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;
import java.util.Optional;

/**
 * One code of the built-in family at one information size k: the protograph lifted by Z =
 * ⌈k / kb⌉, shortened to k information bits and punctured to the bits sent.
 *
 * <p>Shortening: the kb·Z − k (fewer than kb) filler bits are the last bit (offset Z − 1) of the
 * last information blocks, one per block; the family puts its degree-3 information columns last,
 * so the high-degree columns stay whole and each removed column lightens three checks. Their
 * columns are removed from H (known zeros, never sent).
 *
 * <p>Puncturing: of the mb·Z parity bits, mb·Z − (sent − k) are not sent; at the family's
 * round(k / R) bits sent that is f·mb / kb rounded, for f fillers: at most mb. They are taken one per
 * staircase column (parity column 1 … mb − 1), at offset 0 in odd and ⌊Z/2⌋ in even columns; when
 * that is not enough, a second round takes one more per column from column 1 on, at ⌊Z/4⌋ in odd
 * and ⌊3Z/4⌋ in even columns (at most 2·(mb − 1) bits in all; the family needs the second round only
 * at rates 3/4 and 5/6, for the largest f, and then one bit of it). Staircase column c has its ones in
 * rows c − 1 and c at its own offset (shift 0), so a check meets the bits of two neighbouring
 * columns at one offset: odd columns use offsets {0, ⌊Z/4⌋}, even ones {⌊Z/2⌋, ⌊3Z/4⌋}, four
 * distinct offsets for Z ≥ 4 (the family's smallest Z is ⌈64 / 20⌉ = 4). So no check sees two
 * punctured bits: each punctured bit has degree 2 and both its checks are otherwise sent, so the
 * first iteration already gives it a message (the idea of recoverable punctured nodes, J. Ha,
 * J. Kim, S. W. McLaughlin, "Rate-compatible puncturing of low-density parity-check codes", IEEE
 * Trans. Inf. Theory 50(11), 2004; from memory). The degree-3 parity column and the information
 * bits are always sent.
 *
 * <p>Columns of H: the k information bits in block order, then the mb·Z parity bits (block c at
 * k + c·Z). Bits sent in column order, the punctured ones left out. Immutable.
 */
final class LiftedLayout implements CodeLayout {

    private final QcBaseMatrix base;
    private final int kb;
    private final int middleRow;
    private final int infoBits;
    private final int[] infoPosition; // information bit t -> its position in the kb·Z lifted information part
    private final int[] sent;
    private final ParityCheckMatrix matrix;
    private final QcStructure structure;

    /**
     * @param base the lifted base matrix (kb information columns, then the dual-diagonal parity part)
     * @param middleRow the row of parity column 0's middle one
     * @param infoBits k, from kb·(Z − 1) + 1 to kb·Z
     * @param sentBits bits sent, from k + mb·Z − 2·(mb − 1) to k + mb·Z (below k + mb·Z − (mb − 1),
     *        the second round of puncturing: Z at least 4)
     */
    LiftedLayout(QcBaseMatrix base, int middleRow, int infoBits, int sentBits) {
        int z = base.lifting();
        int mb = base.baseRows();
        this.base = base;
        this.kb = base.baseColumns() - mb;
        this.middleRow = middleRow;
        this.infoBits = infoBits;
        int fillers = kb * z - infoBits;
        int punctured = infoBits + mb * z - sentBits;
        int staircase = mb - 1;
        if (fillers < 0 || fillers >= kb || punctured < 0 || punctured > (z < 4 ? 1 : 2) * staircase) {
            throw new IllegalArgumentException("layout of " + infoBits + " information and " + sentBits
                    + " sent bits does not fit lifting size " + z);
        }
        int n = infoBits + mb * z;
        int[] column = new int[base.baseColumns() * z]; // lifted column -> column of H, −1 if shortened
        int[] position = new int[n]; // column of H -> lifted column
        for (int p = 0, c = 0; p < column.length; p++) {
            boolean filler = p < kb * z && p % z == z - 1 && p / z >= kb - fillers;
            column[p] = filler ? -1 : c;
            if (!filler) {
                position[c++] = p;
            }
        }
        infoPosition = Arrays.copyOf(position, infoBits);
        boolean[] skip = new boolean[n];
        for (int i = 0; i < punctured; i++) {
            int c = 1 + i % staircase;
            int quarter = (c % 2 == 1 ? 0 : 2) + i / staircase; // 0 or 2 in the first round, 1 or 3 in the second
            skip[infoBits + c * z + quarter * z / 4] = true;
        }
        sent = new int[sentBits];
        for (int j = 0, p = 0; j < n; j++) {
            if (!skip[j]) {
                sent[p++] = j;
            }
        }
        matrix = base.expand(column, n);
        structure = new QcStructure(base, position);
    }

    @Override
    public ParityCheckMatrix matrix() {
        return matrix;
    }

    @Override
    public Optional<QcStructure> quasiCyclic() {
        return Optional.of(structure);
    }

    @Override
    public int infoBits() {
        return infoBits;
    }

    @Override
    public int infoColumn(int t) {
        return t;
    }

    @Override
    public int sentBits() {
        return sent.length;
    }

    @Override
    public int sentColumn(int p) {
        return sent[p];
    }

    @Override
    public LdpcEncoder newEncoder() {
        return new DualDiagonalEncoder(base, middleRow, infoPosition);
    }
}
