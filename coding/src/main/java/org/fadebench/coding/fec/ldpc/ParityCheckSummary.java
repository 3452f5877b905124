package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;
import java.util.OptionalInt;
import java.util.function.IntUnaryOperator;

/**
 * The facts of a parity-check matrix a listing shows: its shape, ones, the degree distribution of
 * its variable nodes (columns) and check nodes (rows) as counts, and the girth of its Tanner graph,
 * measured ({@link ParityCheckMatrix#girth()}).
 *
 * @param variableCounts {@code variableCounts[d]}: columns with d ones
 * @param checkCounts {@code checkCounts[d]}: rows with d ones
 */
public record ParityCheckSummary(int rows, int columns, int edges, int[] variableCounts, int[] checkCounts,
        OptionalInt girth) {

    /** Measures {@code h}. */
    public static ParityCheckSummary of(ParityCheckMatrix h) {
        return new ParityCheckSummary(h.rows(), h.columns(), h.edges(), counts(h.columns(), h::columnDegree),
                counts(h.rows(), h::rowDegree), h.girth());
    }

    /** How many of the {@code nodes} nodes have each degree. */
    private static int[] counts(int nodes, IntUnaryOperator degree) {
        int[] counts = new int[1];
        for (int v = 0; v < nodes; v++) {
            int d = degree.applyAsInt(v);
            if (d >= counts.length) {
                counts = Arrays.copyOf(counts, d + 1);
            }
            counts[d]++;
        }
        return counts;
    }

    /** The variable degrees as "degree:count" pairs, ascending, e.g. {@code 2:1023 3:1025}. */
    public String variableDegrees() {
        return pairs(variableCounts);
    }

    /** The check degrees as "degree:count" pairs, ascending. */
    public String checkDegrees() {
        return pairs(checkCounts);
    }

    /** The girth as text: the length of the shortest cycle, or "none" for a graph without cycles. */
    public String girthText() {
        return girth.isPresent() ? Integer.toString(girth.getAsInt()) : "none";
    }

    private static String pairs(int[] counts) {
        StringBuilder sb = new StringBuilder();
        for (int d = 0; d < counts.length; d++) {
            if (counts[d] > 0) {
                sb.append(sb.length() == 0 ? "" : " ").append(d).append(':').append(counts[d]);
            }
        }
        return sb.toString();
    }
}
