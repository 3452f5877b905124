package org.fadebench.coding.fec.conv;

import java.io.Serializable;

/**
 * Periodic puncturing of a terminated convolutional code. The pattern has one row per code output
 * and one column per trellis step of the period; 1 keeps the output bit, 0 removes it. The pattern
 * repeats over the whole coded stream, tail included, starting with column 0 at the first step.
 * Depuncturing puts a zero LLR (no information) where a bit was removed.
 */
public final class Puncturer implements Serializable {

    private static final long serialVersionUID = 1L;

    private final ConvolutionalCode code;
    private final int period;
    /** keep[c * n + i]: whether output i of a step in column c is sent. */
    private final boolean[] keep;
    /** keptBefore[c]: bits sent by columns 0 .. c-1 of one period. */
    private final int[] keptBefore;
    /** Whether every output bit is sent (the stream is copied as it is). */
    private final boolean keepsAll;

    /**
     * @param code    the mother code
     * @param pattern {@code pattern[i][c]}: 1 keeps output i at column c of the period, 0 removes it
     * @throws IllegalArgumentException if the pattern does not fit the code (naming the problem)
     */
    public Puncturer(ConvolutionalCode code, int[][] pattern) {
        int n = code.outputs();
        if (pattern.length != n) {
            throw new IllegalArgumentException("puncturing pattern has " + pattern.length
                    + " rows but code " + code + " has " + n + " outputs; need one row per output");
        }
        int p = pattern[0].length;
        if (p == 0) {
            throw new IllegalArgumentException("puncturing pattern has no columns; need a period of at least 1");
        }
        this.code = code;
        this.period = p;
        this.keep = new boolean[p * n];
        this.keptBefore = new int[p + 1];
        for (int i = 0; i < n; i++) {
            if (pattern[i].length != p) {
                throw new IllegalArgumentException("puncturing pattern row " + i + " has " + pattern[i].length
                        + " columns, row 0 has " + p + "; need a rectangular pattern");
            }
            for (int c = 0; c < p; c++) {
                int v = pattern[i][c];
                if (v != 0 && v != 1) {
                    throw new IllegalArgumentException("puncturing pattern entry " + v + " at row " + i
                            + ", column " + c + "; valid: 0 (remove) or 1 (keep)");
                }
                keep[c * n + i] = v == 1;
            }
        }
        for (int c = 0; c < p; c++) {
            int kept = 0;
            for (int i = 0; i < n; i++) {
                kept += keep[c * n + i] ? 1 : 0;
            }
            if (kept == 0) {
                throw new IllegalArgumentException("puncturing pattern column " + c
                        + " removes every output of its step; keep at least one bit per column");
            }
            keptBefore[c + 1] = keptBefore[c] + kept;
        }
        this.keepsAll = keptBefore[p] == p * n;
    }

    /** No puncturing: every coded bit is sent. */
    public static Puncturer none(ConvolutionalCode code) {
        int[][] all = new int[code.outputs()][1];
        for (int[] row : all) {
            row[0] = 1;
        }
        return new Puncturer(code, all);
    }

    /** The mother code. */
    public ConvolutionalCode code() {
        return code;
    }

    /** Number of trellis steps in one period of the pattern. */
    public int period() {
        return period;
    }

    /** Whether output {@code output} is sent at column {@code column} of the period. */
    public boolean keeps(int column, int output) {
        return keep[column * code.outputs() + output];
    }

    /** Code rate of the periodic pattern without tail: period / bits kept per period. */
    public double rate() {
        return (double) period / keptBefore[period];
    }

    /** Bits sent for {@code k} information bits, tail and puncturing included. */
    public int codedBits(int infoBits) {
        int steps = code.steps(infoBits);
        return steps / period * keptBefore[period] + keptBefore[steps % period];
    }

    /**
     * Copies the kept bits of the mother-code stream for {@code k} information bits
     * ({@code mother[off ..]}, n (k + K - 1) bits as written by {@link ConvolutionalCode#encode})
     * to {@code out[outOff ..]}.
     *
     * @return the number of bits written, {@link #codedBits(int) codedBits(k)}
     */
    public int puncture(byte[] mother, int off, int infoBits, byte[] out, int outOff) {
        if (keepsAll) {
            int bits = code.codedBits(infoBits);
            System.arraycopy(mother, off, out, outOff, bits);
            return bits;
        }
        int o = outOff;
        int p = 0;
        for (int m = off, end = off + code.codedBits(infoBits); m < end; m++) {
            if (keep[p]) {
                out[o++] = mother[m];
            }
            p = p + 1 == keep.length ? 0 : p + 1;
        }
        return o - outOff;
    }

    /**
     * The inverse of {@link #puncture} for LLRs: reads {@link #codedBits(int) codedBits(k)} LLRs
     * from {@code llr[off ..]} and writes the n (k + K - 1) mother-code LLRs to
     * {@code mother[motherOff ..]}, with 0 at every removed position.
     */
    public void depuncture(double[] llr, int off, int infoBits, double[] mother, int motherOff) {
        if (keepsAll) {
            System.arraycopy(llr, off, mother, motherOff, code.codedBits(infoBits));
            return;
        }
        int l = off;
        int p = 0;
        for (int m = motherOff, end = motherOff + code.codedBits(infoBits); m < end; m++) {
            mother[m] = keep[p] ? llr[l++] : 0.0;
            p = p + 1 == keep.length ? 0 : p + 1;
        }
    }

    @Override
    public String toString() {
        int n = code.outputs();
        StringBuilder sb = new StringBuilder("[");
        for (int i = 0; i < n; i++) {
            sb.append(i == 0 ? "" : "; ");
            for (int c = 0; c < period; c++) {
                sb.append(c == 0 ? "" : " ").append(keep[c * n + i] ? 1 : 0);
            }
        }
        return sb.append(']').toString();
    }
}
