package org.fadebench.coding.fec.ldpc;

import java.io.Serializable;
import java.util.Arrays;
import java.util.OptionalInt;

/**
 * A sparse binary parity-check matrix H (m rows = check nodes, n columns = variable nodes), held
 * both by rows and by columns in compressed form: {@code rowStart[i] .. rowStart[i + 1]} index the
 * ascending columns of row i in {@code rowColumns}, and likewise {@code columnStart} and
 * {@code columnRows} by column. No entry is an object. Immutable and serialisable (a run plan may hold one).
 */
public final class ParityCheckMatrix implements Serializable {

    private static final long serialVersionUID = 1L;


    private final int rows;
    private final int columns;
    private final int[] rowStart;
    private final int[] rowColumns;
    private final int[] columnStart;
    private final int[] columnRows;

    private ParityCheckMatrix(int rows, int columns, int[] rowStart, int[] rowColumns, int[] columnStart,
            int[] columnRows) {
        this.rows = rows;
        this.columns = columns;
        this.rowStart = rowStart;
        this.rowColumns = rowColumns;
        this.columnStart = columnStart;
        this.columnRows = columnRows;
    }

    /**
     * The matrix with ones at ({@code entryRows[e]}, {@code entryColumns[e]}), e = 0 .. count − 1,
     * 0-based, in any order.
     *
     * @throws IllegalArgumentException if a size is not positive, an index is out of range or an
     *         entry is given twice
     */
    public static ParityCheckMatrix of(int rows, int columns, int[] entryRows, int[] entryColumns, int count) {
        if (rows < 1 || columns < 1) {
            throw new IllegalArgumentException("parity-check matrix of " + rows + " x " + columns
                    + "; valid: at least one row and one column");
        }
        int[] rowStart = new int[rows + 1];
        for (int e = 0; e < count; e++) {
            int r = entryRows[e];
            int c = entryColumns[e];
            if (r < 0 || r >= rows || c < 0 || c >= columns) {
                throw new IllegalArgumentException("parity-check entry (" + r + ", " + c + ") outside the "
                        + rows + " x " + columns + " matrix");
            }
            rowStart[r + 1]++;
        }
        for (int r = 0; r < rows; r++) {
            rowStart[r + 1] += rowStart[r];
        }
        int[] rowColumns = new int[count];
        int[] fill = Arrays.copyOf(rowStart, rows);
        for (int e = 0; e < count; e++) {
            rowColumns[fill[entryRows[e]]++] = entryColumns[e];
        }
        int[] columnStart = new int[columns + 1];
        for (int r = 0; r < rows; r++) {
            Arrays.sort(rowColumns, rowStart[r], rowStart[r + 1]);
            for (int p = rowStart[r]; p < rowStart[r + 1]; p++) {
                if (p > rowStart[r] && rowColumns[p] == rowColumns[p - 1]) {
                    throw new IllegalArgumentException("parity-check entry (" + r + ", " + rowColumns[p]
                            + ") given twice; valid: each entry once");
                }
                columnStart[rowColumns[p] + 1]++;
            }
        }
        for (int c = 0; c < columns; c++) {
            columnStart[c + 1] += columnStart[c];
        }
        int[] columnRows = new int[count];
        fill = Arrays.copyOf(columnStart, columns);
        for (int r = 0; r < rows; r++) {
            for (int p = rowStart[r]; p < rowStart[r + 1]; p++) {
                columnRows[fill[rowColumns[p]]++] = r; // rows visited in order: ascending per column
            }
        }
        return new ParityCheckMatrix(rows, columns, rowStart, rowColumns, columnStart, columnRows);
    }

    /** The matrix with ones where {@code dense[i][j]} is 1 (every other value 0); for small matrices. */
    public static ParityCheckMatrix of(int[][] dense) {
        int count = 0;
        for (int[] row : dense) {
            for (int v : row) {
                count += v == 1 ? 1 : 0;
            }
        }
        int[] r = new int[count];
        int[] c = new int[count];
        int e = 0;
        for (int i = 0; i < dense.length; i++) {
            for (int j = 0; j < dense[i].length; j++) {
                if (dense[i][j] == 1) {
                    r[e] = i;
                    c[e++] = j;
                }
            }
        }
        return of(dense.length, dense.length == 0 ? 0 : dense[0].length, r, c, count);
    }

    /** Rows m (check nodes). */
    public int rows() {
        return rows;
    }

    /** Columns n (variable nodes, the code length). */
    public int columns() {
        return columns;
    }

    /** Ones in the matrix (edges of the Tanner graph). */
    public int edges() {
        return rowColumns.length;
    }

    /** Ones in row i. */
    public int rowDegree(int i) {
        return rowStart[i + 1] - rowStart[i];
    }

    /** Ones in column j. */
    public int columnDegree(int j) {
        return columnStart[j + 1] - columnStart[j];
    }

    /** Column of the p-th one of row i (p from 0 to {@link #rowDegree} − 1; ascending in p). */
    public int rowEntry(int i, int p) {
        return rowColumns[rowStart[i] + p];
    }

    /** Row of the p-th one of column j (p from 0 to {@link #columnDegree} − 1; ascending in p). */
    public int columnEntry(int j, int p) {
        return columnRows[columnStart[j] + p];
    }

    /** Whether the entry (i, j) is one. */
    public boolean get(int i, int j) {
        return Arrays.binarySearch(rowColumns, rowStart[i], rowStart[i + 1], j) >= 0;
    }

    /** Whether H·c = 0 over GF(2) for the n bits (one per byte, 0 or 1) at {@code bits[off ..]}. */
    public boolean isCodeword(byte[] bits, int off) {
        for (int i = 0; i < rows; i++) {
            int parity = 0;
            for (int p = rowStart[i]; p < rowStart[i + 1]; p++) {
                parity ^= bits[off + rowColumns[p]];
            }
            if ((parity & 1) != 0) {
                return false;
            }
        }
        return true;
    }

    /** Degree distribution of the variable nodes (columns). */
    public Degrees variableDegrees() {
        return Degrees.of(columnStart);
    }

    /** Degree distribution of the check nodes (rows). */
    public Degrees checkDegrees() {
        return Degrees.of(rowStart);
    }

    /**
     * A degree distribution in both perspectives, indexed by degree d (0 .. the largest): the
     * fraction of nodes of degree d (node perspective, L_d / R_d), and the fraction of edges
     * attached to a node of degree d (edge perspective, λ_d / ρ_d = d·L_d / Σ_d' d'·L_d'). The
     * definitions are those of T. Richardson, R. Urbanke, "Modern Coding Theory", 2008, Section 3.3
     * (from memory).
     */
    public record Degrees(double[] nodeFractions, double[] edgeFractions) {

        /** From the compressed start offsets of the nodes (degree of node v = start[v+1] − start[v]). */
        static Degrees of(int[] start) {
            int nodes = start.length - 1;
            int max = 0;
            for (int v = 0; v < nodes; v++) {
                max = Math.max(max, start[v + 1] - start[v]);
            }
            long[] count = new long[max + 1];
            for (int v = 0; v < nodes; v++) {
                count[start[v + 1] - start[v]]++;
            }
            double edges = start[nodes];
            double[] node = new double[max + 1];
            double[] edge = new double[max + 1];
            for (int d = 0; d <= max; d++) {
                node[d] = (double) count[d] / nodes;
                edge[d] = edges == 0 ? 0 : d * count[d] / edges;
            }
            return new Degrees(node, edge);
        }
    }

    /**
     * The girth of the Tanner graph: the length of its shortest cycle (even, at least 4), or empty
     * if the graph has no cycle. Every cycle passes through a variable node, so a breadth-first
     * search from each variable node finds it: in the search from root v, an edge (u, w) that does
     * not lead back to u's parent, to a node w already reached, closes a walk of length
     * dist(u) + dist(w) + 1 through v that contains a cycle no longer than that; when v lies on a
     * shortest cycle the search meets one of exactly its length (common practice, no source).
     * Costs one search per variable node, each cut off once it cannot beat the best found.
     */
    public OptionalInt girth() {
        int nodes = columns + rows; // variable node j is j, check node i is columns + i
        int[] dist = new int[nodes];
        int[] parent = new int[nodes];
        int[] queue = new int[nodes];
        Arrays.fill(dist, -1);
        int best = Integer.MAX_VALUE;
        for (int root = 0; root < columns && best > 4; root++) {
            int head = 0;
            int tail = 0;
            queue[tail++] = root;
            dist[root] = 0;
            parent[root] = -1;
            while (head < tail) {
                int u = queue[head++];
                if (2 * dist[u] + 2 >= best) {
                    break; // any cycle found from here on has length at least 2·dist(u) + 2
                }
                boolean variable = u < columns;
                int from = variable ? columnStart[u] : rowStart[u - columns];
                int to = variable ? columnStart[u + 1] : rowStart[u - columns + 1];
                for (int p = from; p < to; p++) {
                    int w = variable ? columns + columnRows[p] : rowColumns[p];
                    if (w == parent[u]) {
                        continue;
                    }
                    if (dist[w] < 0) {
                        dist[w] = dist[u] + 1;
                        parent[w] = u;
                        queue[tail++] = w;
                    } else {
                        best = Math.min(best, dist[u] + dist[w] + 1);
                    }
                }
            }
            for (int q = 0; q < tail; q++) {
                dist[queue[q]] = -1;
            }
        }
        return best == Integer.MAX_VALUE ? OptionalInt.empty() : OptionalInt.of(best);
    }
}
