package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;
import org.fadebench.coding.fec.Lanes;

/**
 * The fast decoder: layered normalised or offset min-sum (the schedule and messages of
 * {@link FloatingPointDecoder}) on integer messages, many frames at once in lanes.
 *
 * <p>Quantisation: a channel LLR L becomes round(L/Δ) with Δ = 1/{@value #SCALE} LLR units, held
 * within ±{@value #CHANNEL_LIMIT} (±63.9 LLR units). Channel LLRs of BPSK on AWGN near a rate-1/2
 * code's threshold are about 2/σ² ≈ 3 in mean with a spread of 2/σ ≈ 2.4, and those of QAM at the
 * SNRs where codes work rarely pass 30, so Δ resolves them finely and the limit rarely cuts (common
 * practice, no source). The two least |Q| of a check are held within ±{@value #MESSAGE_LIMIT}
 * (±256 LLR units), so every message |R| is too, and a posterior P, the channel value plus one
 * message per edge of its column, stays within CHANNEL_LIMIT + degree · MESSAGE_LIMIT: no
 * arithmetic overflows (32-bit ints). The factor α is rounded to a multiple of 1/16 and applied as
 * ⌊m·16α⌋/16; the offset β is rounded to a multiple of Δ and applied as max(m − β, 0).
 *
 * <p>Layout: every quantity is a row over lanes, lane index innermost ({@code check[e][lane]} per
 * edge e in row order, {@code posterior[j][lane]} per column j), and the check update is a few
 * short loops over lanes with branch-free selects ({@link MinSumLoops}, shared with the block-row
 * kernel {@link QcDecoder}; C2 in Java 17 vectorises only short loop bodies, and no 16-bit min, so
 * the messages are ints). Per check row, four edges per loop: Q = P − R into the message row with
 * the sign parity and the least and second least |Q| per lane; one loop corrects the two minima (the
 * parity's sign put on them); then per edge R = ±(the corrected least of the others) and P = Q + R.
 * The edge of the least is not kept: an edge whose |Q| equals the least takes the second least,
 * which on a tie is the same value. This kernel decodes any H; for a quasi-cyclic code
 * {@link QcDecoder} gives the same numbers faster.
 *
 * <p>Early stop: after each iteration every lane's syndrome is computed from the signs of P (one
 * exclusive-or per edge and lane). A lane whose checks all hold is done: its hard decisions are
 * copied out then, with its iteration count. Its arithmetic goes on with the other lanes, unseen,
 * so each frame's result is that of decoding it alone; the decode ends once every lane is done or
 * at the iteration limit. Without early stop the syndrome is computed once, at the end.
 * Allocates nothing after construction.
 */
final class FixedPointDecoder extends RowDecoder {

    /** Quantisation steps per LLR unit. */
    static final int SCALE = 16;
    /** The most |channel LLR|, in steps. */
    static final int CHANNEL_LIMIT = 1023;
    /** The most |R|, in steps. */
    static final int MESSAGE_LIMIT = 4095;

    private final MinSumLoops.Correction correction;
    private final MinSumLoops.Group edges;
    private final int[][] channel;
    private final int[][] posterior;
    private final int[][] check;
    private final int[][] decided;
    private final int[] least;
    private final int[] second;
    private final int[] leastOut;
    private final int[] gap;
    private final int[] parity;
    private final int[] syndrome;
    private final int[] failed;
    private final int[] finished;
    private final boolean[] active;

    FixedPointDecoder(ParityCheckMatrix h, LdpcDecoding decoding, int lanes) {
        super(h, decoding, lanes);
        correction = MinSumLoops.Correction.of(decoding);
        edges = new MinSumLoops.Group(lanes);
        channel = new int[columns][lanes];
        posterior = new int[columns][lanes];
        check = new int[edgeColumn.length][lanes];
        decided = new int[columns][lanes];
        least = new int[lanes];
        second = new int[lanes];
        leastOut = new int[lanes];
        gap = new int[lanes];
        parity = new int[lanes];
        syndrome = new int[lanes];
        failed = new int[lanes];
        finished = new int[lanes];
        active = new boolean[lanes];
    }

    /** Bytes the buffers of a decoder take. */
    static long bytes(ParityCheckMatrix h, int lanes) {
        long row = 4L * lanes;
        return sharedBytes(h, lanes) + 3 * tableBytes(h.columns(), row) + tableBytes(h.edges(), row)
                + 8 * Lanes.rowBytes(row) + Lanes.rowBytes(lanes) + MinSumLoops.Group.bytes(lanes);
    }

    /**
     * The quantised value of a channel LLR: round(L·SCALE) held within ±CHANNEL_LIMIT (rounded
     * first, then held as an int: the conversion saturates, so this equals holding the double).
     */
    static int quantise(double llr) {
        return Math.max(-CHANNEL_LIMIT, Math.min(CHANNEL_LIMIT, (int) Math.rint(llr * SCALE)));
    }

    @Override
    public void load(int lane, double[] llr, int off) {
        Lanes.checkLane(lane, lanes);
        checkFinite(lane, llr, off);
        for (int j = 0; j < columns; j++) {
            channel[j][lane] = quantise(llr[off + j]);
        }
    }

    @Override
    int decision(int lane, int column) {
        return decided[column][lane] >>> 31;
    }

    @Override
    public void decode(int frames) {
        Lanes.checkFrames(frames, lanes);
        for (int j = 0; j < columns; j++) {
            System.arraycopy(channel[j], 0, posterior[j], 0, frames);
        }
        for (int[] row : check) {
            Arrays.fill(row, 0, frames, 0);
        }
        Arrays.fill(active, 0, frames, true);
        int limit = decoding.iterations();
        int running = frames;
        int done = 0;
        while (done < limit && running > 0) {
            for (int i = 0; i < rows; i++) {
                updateRow(i, frames);
            }
            done++;
            if (decoding.earlyStop() && done < limit) {
                running -= finish(frames, done, false);
            }
        }
        if (running > 0) {
            finish(frames, done, true);
        }
        decodedLanes = frames;
    }

    /**
     * Computes the syndromes and finishes the lanes still running whose checks all hold (all
     * running lanes if {@code last}): iterations, satisfied, decisions. Returns how many it finished.
     */
    private int finish(int n, int done, boolean last) {
        computeSyndromes(n);
        int count = 0;
        for (int l = 0; l < n; l++) {
            boolean ok = failed[l] >= 0;
            boolean stop = active[l] && (ok || last);
            finished[l] = stop ? -1 : 0;
            if (stop) {
                active[l] = false;
                iterations[l] = done;
                satisfied[l] = ok;
                count++;
            }
        }
        if (count > 0) {
            for (int j = 0; j < columns; j++) {
                MinSumLoops.keep(posterior[j], decided[j], finished, n);
            }
        }
        return count;
    }

    /** failed[l] negative iff some check of lane l fails on the signs of P. */
    private void computeSyndromes(int n) {
        Arrays.fill(failed, 0, n, 0);
        for (int i = 0; i < rows; i++) {
            int e = rowStart[i];
            System.arraycopy(posterior[edgeColumn[e]], 0, syndrome, 0, n);
            for (e++; e < rowStart[i + 1]; e++) {
                MinSumLoops.exclusiveOr(syndrome, posterior[edgeColumn[e]], n);
            }
            MinSumLoops.or(failed, syndrome, n);
        }
    }

    private void updateRow(int row, int n) {
        int from = rowStart[row];
        int to = rowStart[row + 1];
        for (int e = from; e < to; e += MinSumLoops.GROUP) {
            for (int k = 0; k < MinSumLoops.GROUP; k++) {
                if (e + k < to) {
                    edges.edge(k, posterior[edgeColumn[e + k]], check[e + k]);
                } else {
                    edges.filler(k);
                }
            }
            MinSumLoops.subtractAndMinima(edges, e == from, parity, least, second, n);
        }
        correction.apply(least, second, parity, leastOut, gap, n);
        for (int e = from; e < to; e++) {
            MinSumLoops.scatter(posterior[edgeColumn[e]], check[e], least, leastOut, gap, n);
        }
    }
}
