package org.fadebench.coding.fec.conv;

import java.util.Arrays;
import org.fadebench.coding.fec.Lanes;

/**
 * Soft-input Viterbi decoder for a zero-tail terminated {@link ConvolutionalCode}: maximum
 * likelihood sequence decision for LLR inputs (A. J. Viterbi, "Error bounds for convolutional codes
 * and an asymptotically optimum decoding algorithm", IEEE Trans. Inf. Theory 13(2), 1967), for up
 * to {@link #lanes()} frames of the same length at once.
 *
 * <p>Input LLRs follow the modem's convention, L = ln P(b=0)/P(b=1), finite, with 0 for punctured
 * positions. The path metric is the correlation Σ L·(1−2c), maximised: with independent bits this
 * is maximum likelihood. Each frame's LLRs are scaled so that the largest magnitude becomes
 * {@value #LEVELS} and rounded to integers (a positive scale leaves the maximum likelihood decision
 * unchanged; rounding moves each term of a path metric by at most half a level, one part in 2^21 of
 * the frame's largest LLR). Metrics are 32-bit integers compared by their wrapping difference,
 * which stays exact because the metrics of one step never spread by more than 2^31 (once every
 * state is reachable they spread by at most 2(K−1) times the largest branch metric); they need no
 * renormalisation.
 *
 * <p>Layout, chosen so that the JIT's loop vectoriser handles the work: frames are lanes, and
 * every per-state quantity is a row over lanes. Each trellis step computes the branch metric of
 * every output label per lane, then runs add-compare-select for each state as one short loop over
 * lanes (states 2j and 2j+1 lead to states j and j + 2^(K−2)). A decision bit per state and lane
 * records which predecessor survived (1: the odd one; ties go to the even one); the traceback
 * starts from the zero state the tail forces.
 *
 * <p>Use: {@link #load} each frame into a lane, {@link #decode(int)} the lanes loaded, then
 * read each lane's bits with {@link #decided}; or {@link #decode(double[], int, byte[], int)} for a
 * single frame. All storage is allocated by the constructor; decoding allocates nothing. An
 * instance is not thread-safe: give each thread its own.
 */
public final class ViterbiDecoder {

    /** The magnitude the largest LLR of a frame is scaled to. */
    public static final int LEVELS = 1 << 20;

    /** Starting metric of the states other than zero: far below any real path, far from wrapping. */
    private static final int UNREACHED = -(1 << 29);

    private final ConvolutionalCode code;
    private final int infoBits;
    private final int lanes;
    private final int outputs;
    private final int steps;
    private final int half;
    /** Decision words per step: one bit per state. */
    private final int words;
    /** Per butterfly j: labels of 2j→j, 2j+1→j, 2j→j+half, 2j+1→j+half. */
    private final int[] butterflyLabels;

    /** Row i (LLR i of the terminated frame): the rounded, scaled LLR of each lane. */
    private final int[][] soft;
    /** Row c: the branch metric Σ q·(1−2c) of output label c, per lane, for the current step. */
    private final int[][] branch;
    private int[][] metric;
    private int[][] nextMetric;
    /** Row t·words + w: decision bits of states 32w .. 32w+31 at step t, per lane. */
    private final int[][] decisions;
    private final int[] state;
    /** Row l: the decided information bits of lane l. */
    private final byte[][] decided;
    private int decodedLanes;

    /**
     * Bytes the buffers of a decoder for {@code infoBits} in {@code lanes} lanes take (the rows the
     * constructor below allocates, each with its array header), for a memory check before a run.
     */
    static long bufferBytes(ConvolutionalCode code, int infoBits, int lanes) {
        long steps = code.steps(infoBits);
        long rows = steps * code.outputs() + (1L << code.outputs()) + 2L * code.states()
                + steps * ((code.states() + 31) / 32);
        return rows * Lanes.rowBytes(4L * lanes) + lanes * Lanes.rowBytes(infoBits) + 4L * lanes + 8L * code.states();
    }

    /**
     * @param code     the code to decode
     * @param infoBits information bits per frame, k ≥ 1 (the frame has k + K − 1 trellis steps)
     * @param lanes    how many frames one {@link #decode(int)} call can take, ≥ 1
     * @throws IllegalArgumentException if {@code infoBits} or {@code lanes} is below 1
     */
    public ViterbiDecoder(ConvolutionalCode code, int infoBits, int lanes) {
        if (infoBits < 1) {
            throw new IllegalArgumentException("frame of " + infoBits + " information bits; need at least 1");
        }
        if (lanes < 1) {
            throw new IllegalArgumentException(lanes + " lanes; need at least 1");
        }
        this.code = code;
        this.infoBits = infoBits;
        this.lanes = lanes;
        this.outputs = code.outputs();
        this.steps = code.steps(infoBits);
        int states = code.states();
        this.half = states / 2;
        this.words = (states + 31) / 32;
        this.butterflyLabels = new int[4 * half];
        for (int j = 0; j < half; j++) {
            butterflyLabels[4 * j] = code.label(2 * j, 0);
            butterflyLabels[4 * j + 1] = code.label(2 * j + 1, 0);
            butterflyLabels[4 * j + 2] = code.label(2 * j, 1);
            butterflyLabels[4 * j + 3] = code.label(2 * j + 1, 1);
        }
        this.soft = new int[steps * outputs][lanes];
        this.branch = new int[1 << outputs][lanes];
        this.metric = new int[states][lanes];
        this.nextMetric = new int[states][lanes];
        this.decisions = new int[steps * words][lanes];
        this.state = new int[lanes];
        this.decided = new byte[lanes][infoBits];
    }

    /**
     * Bytes of the rows one lane holds for frames of {@code infoBits}: a 4-byte soft input per
     * mother-code bit and a 4-byte decision word per 32 states, per trellis step.
     */
    public static long bytesPerLane(ConvolutionalCode code, int infoBits) {
        return 4L * code.steps(infoBits) * (code.outputs() + (code.states() + 31) / 32);
    }

    /** The code this decoder decodes. */
    public ConvolutionalCode code() {
        return code;
    }

    /** Information bits per frame. */
    public int infoBits() {
        return infoBits;
    }

    /** The most frames one {@link #decode(int)} call takes. */
    public int lanes() {
        return lanes;
    }

    /** Mother-code LLRs per frame: n (k + K − 1). */
    public int llrsPerFrame() {
        return soft.length;
    }

    /**
     * Puts one frame's LLRs into a lane for the next {@link #decode(int)}.
     *
     * @param lane from 0 to {@link #lanes()} − 1
     * @param llr  {@link #llrsPerFrame()} mother-code LLRs from {@code llr[off]}, step by step,
     *             outputs in generator order (see {@link Puncturer#depuncture} for punctured codes)
     * @throws IllegalArgumentException if the lane is out of range or an LLR is not finite
     */
    public void load(int lane, double[] llr, int off) {
        Lanes.checkLane(lane, lanes);
        final int n = soft.length;
        double peak = 0;
        for (int i = 0; i < n; i++) {
            peak = Math.max(peak, Math.abs(llr[off + i]));
        }
        if (!(peak < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("LLRs of lane " + lane + " are not all finite");
        }
        double scale = peak > 0 ? LEVELS / peak : 0;
        final int[][] rows = soft;
        for (int i = 0; i < n; i++) {
            rows[i][lane] = (int) Math.rint(llr[off + i] * scale);
        }
    }

    /**
     * Decodes lanes 0 .. {@code frames} − 1, as loaded; their bits are then read with {@link #decided}.
     *
     * @throws IllegalArgumentException if {@code frames} is not from 1 to {@link #lanes()}
     */
    public void decode(int frames) {
        Lanes.checkFrames(frames, lanes);
        start(frames);
        for (int t = 0; t < steps; t++) {
            branchMetrics(t, frames);
            addCompareSelect(t, frames);
        }
        traceBack(frames);
        decodedLanes = frames;
    }

    /**
     * Copies the {@link #infoBits()} decided bits of a lane of the last {@link #decode(int)}, one per
     * byte, to {@code out[outOff ..]}.
     */
    public void decided(int lane, byte[] out, int outOff) {
        Lanes.checkLane(lane, decodedLanes);
        System.arraycopy(decided[lane], 0, out, outOff, infoBits);
    }

    /** Decodes a single frame: {@link #load} into lane 0, {@link #decode(int)}, {@link #decided}. */
    public void decode(double[] llr, int off, byte[] out, int outOff) {
        load(0, llr, off);
        decode(1);
        decided(0, out, outOff);
    }

    private void start(int n) {
        for (int[] row : metric) {
            Arrays.fill(row, 0, n, UNREACHED);
        }
        Arrays.fill(metric[0], 0, n, 0);
    }

    /** branch[c] = Σ_i q_i (1 − 2 c_i), built label by label from smaller labels. */
    private void branchMetrics(int t, int n) {
        final int[][] q = soft;
        final int at = t * outputs;
        int[] all = branch[0];
        System.arraycopy(q[at], 0, all, 0, n);
        for (int i = 1; i < outputs; i++) {
            accumulate(all, q[at + i], n);
        }
        for (int label = 1; label < branch.length; label++) {
            int i = 31 - Integer.numberOfLeadingZeros(label);
            flip(branch[label ^ (1 << i)], q[at + i], branch[label], n);
        }
    }

    private static void accumulate(int[] sum, int[] q, int n) {
        for (int l = 0; l < n; l++) {
            sum[l] += q[l];
        }
    }

    /** out = from − 2q: the metric with one more output bit set. */
    private static void flip(int[] from, int[] q, int[] out, int n) {
        for (int l = 0; l < n; l++) {
            out[l] = from[l] - 2 * q[l];
        }
    }

    /** One trellis step for every lane: new metrics and the decision words of step t. */
    private void addCompareSelect(int t, int n) {
        final int[][] cur = metric;
        final int[][] nxt = nextMetric;
        metric = nxt;
        nextMetric = cur;
        final int[][] bm = branch;
        final int[] lab = butterflyLabels;
        final int base = t * words;
        for (int w = 0; w < words; w++) {
            Arrays.fill(decisions[base + w], 0, n, 0);
        }
        for (int j = 0; j < half; j++) {
            int[] even = cur[2 * j];
            int[] odd = cur[2 * j + 1];
            int upper = j + half;
            select(even, bm[lab[4 * j]], odd, bm[lab[4 * j + 1]], nxt[j], decisions[base + (j >>> 5)], j & 31, n);
            select(even, bm[lab[4 * j + 2]], odd, bm[lab[4 * j + 3]], nxt[upper],
                    decisions[base + (upper >>> 5)], upper & 31, n);
        }
    }

    /**
     * Per lane: out = max(even + be, odd + bo), and bit {@code bit} of the decision word set when
     * the odd path is strictly better. Branch-free so that the loop vectorises.
     */
    private static void select(int[] even, int[] be, int[] odd, int[] bo, int[] out, int[] decision, int bit,
                               int n) {
        for (int l = 0; l < n; l++) {
            int x = even[l] + be[l];
            int y = odd[l] + bo[l];
            int d = x - y;
            out[l] = x - (d & (d >> 31));
            decision[l] |= (d >>> 31) << bit;
        }
    }

    /** Follows each lane's survivors back from state 0; the newest state bit is the step's input bit. */
    private void traceBack(int n) {
        final int top = code.constraintLength() - 2;
        final int mask = 2 * half - 1;
        final int[] s = state;
        Arrays.fill(s, 0, n, 0);
        for (int t = steps - 1; t >= infoBits; t--) {
            back(t, s, mask, n);
        }
        for (int t = infoBits - 1; t >= 0; t--) {
            for (int l = 0; l < n; l++) {
                decided[l][t] = (byte) (s[l] >>> top);
            }
            back(t, s, mask, n);
        }
    }

    /** Steps each lane's state to its survivor predecessor at step t. */
    private void back(int t, int[] s, int mask, int n) {
        final int base = t * words;
        for (int l = 0; l < n; l++) {
            int st = s[l];
            int word = decisions[base + (st >>> 5)][l];
            s[l] = ((st << 1) & mask) | ((word >>> (st & 31)) & 1);
        }
    }
}
