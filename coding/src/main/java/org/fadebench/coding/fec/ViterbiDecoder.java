package org.fadebench.coding.fec;

import java.util.Arrays;

/**
 * Soft-input Viterbi decoder for a zero-tail terminated {@link ConvolutionalCode}: maximum
 * likelihood sequence decision for LLR inputs (A. J. Viterbi, "Error bounds for convolutional codes
 * and an asymptotically optimum decoding algorithm", IEEE Trans. Inf. Theory 13(2), 1967).
 *
 * <p>Input LLRs follow the modem's convention, L = ln P(b=0)/P(b=1), finite, with 0 for punctured
 * positions. The path metric is the correlation Σ L·(1−2c), maximised: with independent bits this
 * is maximum likelihood. Rate-1/2 codes with symmetric butterflies (the catalogue's codes) take a
 * shorter path with one branch metric per butterfly. Each step runs add-compare-select over butterflies
 * (states 2j and 2j+1 both lead to states j and j + 2^(K-2)), keeps one decision bit per state in a
 * 64-bit word, and the final traceback starts from the zero state the tail forces.
 *
 * <p>All storage is allocated by the constructor for frames of up to {@code maxInfoBits}; decoding
 * allocates nothing. An instance is not thread-safe: give each thread its own.
 */
public final class ViterbiDecoder {

    private final ConvolutionalCode code;
    private final int maxInfoBits;
    private final int outputs;
    private final int states;
    private final int half;
    /** Per butterfly j: labels of 2j→j, 2j+1→j, 2j→j+half, 2j+1→j+half. */
    private final int[] butterflyLabels;
    private final double[] branchMetric;
    private double[] metric;
    private double[] nextMetric;
    /**
     * Rate-1/2 codes whose generators all tap both the newest input and the oldest memory bit (the
     * (133, 171) and (5, 7) codes) have symmetric butterflies: the branches 2j+1→j and 2j→j+half
     * carry the complement of 2j→j's output and 2j+1→j+half the same output, so one branch metric b
     * serves all four (+b, −b, −b, +b). Null for other codes.
     */
    private final int[] symmetricLabels;

    /** Bit s of word t: which predecessor (its lowest state bit) survived into state s at step t. */
    private final long[] decisions;

    /**
     * @param code        the code to decode
     * @param maxInfoBits the longest frame, in information bits, this decoder will be given
     * @throws IllegalArgumentException if {@code maxInfoBits < 1}
     */
    public ViterbiDecoder(ConvolutionalCode code, int maxInfoBits) {
        if (maxInfoBits < 1) {
            throw new IllegalArgumentException("maximum frame length " + maxInfoBits
                    + " information bits; need at least 1");
        }
        this.code = code;
        this.maxInfoBits = maxInfoBits;
        this.outputs = code.outputs();
        this.states = code.states();
        this.half = states / 2;
        this.butterflyLabels = new int[4 * half];
        for (int j = 0; j < half; j++) {
            butterflyLabels[4 * j] = code.label(2 * j, 0);
            butterflyLabels[4 * j + 1] = code.label(2 * j + 1, 0);
            butterflyLabels[4 * j + 2] = code.label(2 * j, 1);
            butterflyLabels[4 * j + 3] = code.label(2 * j + 1, 1);
        }
        this.branchMetric = new double[1 << outputs];
        this.symmetricLabels = symmetric(code) ? lowerLabels(code) : null;

        this.metric = new double[states];
        this.nextMetric = new double[states];
        this.decisions = new long[code.steps(maxInfoBits)];
    }

    /** The code this decoder decodes. */
    public ConvolutionalCode code() {
        return code;
    }

    /** The longest frame, in information bits, this decoder accepts. */
    public int maxInfoBits() {
        return maxInfoBits;
    }

    /**
     * Decodes one terminated frame.
     *
     * @param llr      n (k + K - 1) mother-code LLRs from {@code llr[off]}, step by step, outputs in
     *                 generator order (see {@link Puncturer#depuncture} for punctured codes)
     * @param infoBits k, from 1 to {@link #maxInfoBits()}
     * @param out      receives the k decided information bits, one per byte, from {@code out[outOff]}
     * @throws IllegalArgumentException if k is out of range
     */
    public void decode(double[] llr, int off, int infoBits, byte[] out, int outOff) {
        if (infoBits < 1 || infoBits > maxInfoBits) {
            throw new IllegalArgumentException("frame of " + infoBits + " information bits; this decoder takes 1 to "
                    + maxInfoBits);
        }
        int steps = code.steps(infoBits);
        Arrays.fill(metric, Double.NEGATIVE_INFINITY);
        metric[0] = 0;
        if (symmetricLabels != null) {
            for (int t = 0; t < steps; t++) {
                decisions[t] = symmetricStep(llr[off + 2 * t], llr[off + 2 * t + 1]);
            }
        } else {
            for (int t = 0; t < steps; t++) {
                fillBranchMetrics(llr, off + t * outputs);
                decisions[t] = addCompareSelect();
            }
        }
        traceBack(steps, infoBits, out, outOff);
    }

    private static boolean symmetric(ConvolutionalCode code) {
        if (code.outputs() != 2) {
            return false;
        }
        int half = code.states() / 2;
        for (int j = 0; j < half; j++) {
            int c = code.label(2 * j, 0);
            if (code.label(2 * j + 1, 0) != (c ^ 3) || code.label(2 * j, 1) != (c ^ 3)
                    || code.label(2 * j + 1, 1) != c) {
                return false;
            }
        }
        return true;
    }

    private static int[] lowerLabels(ConvolutionalCode code) {
        int[] labels = new int[code.states() / 2];
        for (int j = 0; j < labels.length; j++) {
            labels[j] = code.label(2 * j, 0);
        }
        return labels;
    }

    /**
     * One trellis step of a symmetric rate-1/2 code: the four branch metrics are ±l0 ± l1 (label
     * bit i set: output i is 1, metric −l_i), each butterfly uses one of them with both signs.
     */
    private long symmetricStep(double l0, double l1) {
        double[] bm = branchMetric;
        bm[0] = l0 + l1;
        bm[1] = -l0 + l1;
        bm[2] = l0 - l1;
        bm[3] = -l0 - l1;
        double[] cur = metric;
        double[] nxt = nextMetric;
        metric = nxt;
        nextMetric = cur;
        int[] lab = symmetricLabels;
        int half = lab.length;
        long lowerWord = 0;
        long upperWord = 0;
        for (int j = 0; j < half; j++) {
            double m0 = cur[2 * j];
            double m1 = cur[2 * j + 1];
            double b = bm[lab[j]];
            double lower0 = m0 + b;
            double lower1 = m1 - b;
            double upper0 = m0 - b;
            double upper1 = m1 + b;
            nxt[j] = Math.max(lower0, lower1);
            nxt[j + half] = Math.max(upper0, upper1);
            lowerWord |= oddWins(lower0, lower1) << j;
            upperWord |= oddWins(upper0, upper1) << j;
        }
        return lowerWord | upperWord << half;
    }

    /** branchMetric[label] = Σ_i (1 - 2 c_i) L_i, built label by label from smaller labels. */
    private void fillBranchMetrics(double[] llr, int at) {
        double[] bm = branchMetric;
        double all = 0;
        for (int i = 0; i < outputs; i++) {
            all += llr[at + i];
        }
        bm[0] = all;
        for (int label = 1; label < bm.length; label++) {
            int i = 31 - Integer.numberOfLeadingZeros(label);
            bm[label] = bm[label ^ (1 << i)] - 2 * llr[at + i];
        }
    }

    /** One trellis step over all butterflies; returns the decision word and swaps the metrics. */
    private long addCompareSelect() {
        double[] cur = metric;
        double[] nxt = nextMetric;
        metric = nxt;
        nextMetric = cur;
        return butterflies(cur, nxt, branchMetric, butterflyLabels, half);
    }

    /** Bit j of the result decides state j, bit j + half state j + half (1: from state 2j+1). */
    private static long butterflies(double[] cur, double[] nxt, double[] bm, int[] lab, int half) {
        long lowerWord = 0;
        long upperWord = 0;
        for (int j = 0; j < half; j++) {
            double m0 = cur[2 * j];
            double m1 = cur[2 * j + 1];
            double lower0 = m0 + bm[lab[4 * j]];
            double lower1 = m1 + bm[lab[4 * j + 1]];
            double upper0 = m0 + bm[lab[4 * j + 2]];
            double upper1 = m1 + bm[lab[4 * j + 3]];
            nxt[j] = Math.max(lower0, lower1);
            nxt[j + half] = Math.max(upper0, upper1);
            lowerWord |= oddWins(lower0, lower1) << j;
            upperWord |= oddWins(upper0, upper1) << j;
        }
        return lowerWord | upperWord << half;
    }

    /** 1 if the path from the odd predecessor has the larger metric, else 0; without a branch. */
    private static long oddWins(double even, double odd) {
        return Double.doubleToRawLongBits(even - odd) >>> 63;
    }

    /** Follows the survivors back from state 0; the newest state bit is the step's input bit. */
    private void traceBack(int steps, int infoBits, byte[] out, int outOff) {
        int top = code.constraintLength() - 2;
        int mask = states - 1;
        int s = 0;
        for (int t = steps - 1; t >= 0; t--) {
            if (t < infoBits) {
                out[outOff + t] = (byte) (s >>> top);
            }
            s = ((s << 1) & mask) | (int) ((decisions[t] >>> s) & 1);
        }
    }
}
