package org.fadebench.coding.fec.ldpc;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Chooses the circulant shifts of a protograph's free entries for a lifting size Z so that the
 * lifted Tanner graph avoids 4-cycles and, as far as it can, 6-cycles. It works in the base
 * domain with the cycle condition of M. P. C. Fossorier, "Quasi-cyclic low-density parity-check
 * codes from circulant permutation matrices", IEEE Trans. Inf. Theory 50(8), 2004: a closed path
 * through base rows i0, i1, (i2) and columns j0, j1, (j2), consecutive ones distinct, lifts to
 * cycles of its length iff the alternating sum of its shifts is 0 mod Z. A 4-cycle uses 2 rows and
 * 2 columns, a 6-cycle 3 distinct rows and 3 distinct columns.
 *
 * <p>Greedy and deterministic: the free entries are given shifts one by one (column by column);
 * each base cycle whose entries are then all set forbids one value of the entry that completes it
 * (the value making its sum 0); the entry takes the value that completes the fewest 4-cycles, then
 * the fewest 6-cycles, the first such in a pseudo-random order of 0 .. Z − 1 seeded by Z and the
 * attempt number. Up to {@link #ATTEMPTS} attempts; the first without completed 4- or 6-cycles
 * wins, else the one with the fewest (4-cycles first). The cost of an attempt is the number of
 * base 4- and 6-cycles plus Z per free entry. Immutable; the cycles are enumerated once.
 */
final class ShiftSearch {

    /** Attempts before settling for the best found. */
    static final int ATTEMPTS = 16;

    private final int[][] template;
    private final int[] entryRow;
    private final int[] entryColumn;
    private final int fixed; // entries 0 .. fixed − 1 have fixed shifts
    /** Per entry e, groups of cycle length L: e's sign, then the other entries as ±(index + 1). */
    private final int[][] fourCycles;
    private final int[][] sixCycles;

    /** @param template base matrix: {@link Protograph#ZERO}, {@link Protograph#FREE} or a fixed shift */
    ShiftSearch(int[][] template) {
        this.template = template;
        int rows = template.length;
        int columns = template[0].length;
        int[][] index = new int[rows][columns];
        List<int[]> order = new ArrayList<>();
        for (int pass = 0; pass < 2; pass++) { // fixed entries first, then free ones column by column
            for (int j = 0; j < columns; j++) {
                for (int i = 0; i < rows; i++) {
                    int v = template[i][j];
                    if (v != Protograph.ZERO && (v == Protograph.FREE) == (pass == 1)) {
                        index[i][j] = order.size();
                        order.add(new int[] {i, j});
                    }
                }
            }
        }
        int count = order.size();
        entryRow = new int[count];
        entryColumn = new int[count];
        int f = 0;
        for (int e = 0; e < count; e++) {
            entryRow[e] = order.get(e)[0];
            entryColumn[e] = order.get(e)[1];
            f += template[entryRow[e]][entryColumn[e]] == Protograph.FREE ? 0 : 1;
        }
        fixed = f;
        List<List<Integer>> four = lists(count);
        List<List<Integer>> six = lists(count);
        for (int i0 = 0; i0 < rows; i0++) {
            for (int i1 = i0 + 1; i1 < rows; i1++) {
                for (int j0 = 0; j0 < columns; j0++) {
                    for (int j1 = j0 + 1; j1 < columns; j1++) {
                        if (both(i0, i1, j0) && both(i0, i1, j1)) { // s(i0,j1) − s(i1,j1) + s(i1,j0) − s(i0,j0)
                            add(four, index, new int[] {i0, j1, i1, j1, i1, j0, i0, j0});
                        }
                    }
                }
                for (int i2 = i1 + 1; i2 < rows; i2++) {
                    // i0 −j1− i1 −j2− i2 −j0− i0; each hexagon once (i0 < i1 < i2 fixes the
                    // orientation, the columns in every order give the distinct hexagons)
                    for (int j1 = 0; j1 < columns; j1++) {
                        if (!both(i0, i1, j1)) {
                            continue;
                        }
                        for (int j2 = 0; j2 < columns; j2++) {
                            if (j2 == j1 || !both(i1, i2, j2)) {
                                continue;
                            }
                            for (int j0 = 0; j0 < columns; j0++) {
                                if (j0 != j1 && j0 != j2 && both(i2, i0, j0)) {
                                    add(six, index, new int[] {i0, j1, i1, j1, i1, j2, i2, j2, i2, j0, i0, j0});
                                }
                            }
                        }
                    }
                }
            }
        }
        fourCycles = flatten(four);
        sixCycles = flatten(six);
    }

    private static List<List<Integer>> lists(int count) {
        List<List<Integer>> l = new ArrayList<>();
        for (int e = 0; e < count; e++) {
            l.add(new ArrayList<>());
        }
        return l;
    }

    private boolean both(int rowA, int rowB, int column) {
        return template[rowA][column] != Protograph.ZERO && template[rowB][column] != Protograph.ZERO;
    }

    /** Adds the closed path (row, column pairs of nonzero blocks; signs alternate +, −). */
    private void add(List<List<Integer>> cycles, int[][] index, int[] path) {
        int length = path.length / 2;
        int[] entries = new int[length];
        int last = -1;
        for (int p = 0; p < length; p++) {
            entries[p] = index[path[2 * p]][path[2 * p + 1]];
            last = Math.max(last, entries[p]);
        }
        if (last < fixed) {
            return; // fixed entries only: nothing to choose
        }
        List<Integer> group = cycles.get(last);
        for (int p = 0; p < length; p++) {
            if (entries[p] == last) {
                group.add(p % 2 == 0 ? 1 : -1);
            }
        }
        for (int p = 0; p < length; p++) {
            if (entries[p] != last) {
                group.add((entries[p] + 1) * (p % 2 == 0 ? 1 : -1));
            }
        }
    }

    private static int[][] flatten(List<List<Integer>> lists) {
        int[][] a = new int[lists.size()][];
        for (int e = 0; e < a.length; e++) {
            a[e] = lists.get(e).stream().mapToInt(Integer::intValue).toArray();
        }
        return a;
    }

    /** The base matrix of shifts for lifting size Z (−1 for zero blocks). */
    int[][] shifts(int lifting) {
        int[] best = null;
        long bestScore = Long.MAX_VALUE;
        int[] value = new int[entryRow.length];
        int[] forbidFour = new int[lifting];
        int[] forbidSix = new int[lifting];
        int[] candidates = new int[lifting];
        for (int attempt = 0; attempt < ATTEMPTS && bestScore > 0; attempt++) {
            SplittableRandom random = new SplittableRandom(lifting * 1_000_003L + attempt);
            long four = 0;
            long six = 0;
            for (int e = 0; e < value.length; e++) {
                if (e < fixed) {
                    value[e] = template[entryRow[e]][entryColumn[e]];
                    continue;
                }
                forbid(fourCycles[e], 4, value, lifting, forbidFour);
                forbid(sixCycles[e], 6, value, lifting, forbidSix);
                for (int v = 0; v < lifting; v++) { // Fisher–Yates shuffle of 0 .. Z − 1
                    int w = random.nextInt(v + 1);
                    candidates[v] = candidates[w];
                    candidates[w] = v;
                }
                int choice = candidates[0];
                for (int c = 1; c < lifting; c++) {
                    int v = candidates[c];
                    if (forbidFour[v] < forbidFour[choice]
                            || forbidFour[v] == forbidFour[choice] && forbidSix[v] < forbidSix[choice]) {
                        choice = v;
                    }
                }
                value[e] = choice;
                four += forbidFour[choice];
                six += forbidSix[choice];
            }
            long score = four * (1L << 32) + six;
            if (score < bestScore) {
                bestScore = score;
                best = value.clone();
            }
        }
        int[][] shifts = new int[template.length][template[0].length];
        for (int[] row : shifts) {
            Arrays.fill(row, -1);
        }
        for (int e = 0; e < best.length; e++) {
            shifts[entryRow[e]][entryColumn[e]] = best[e];
        }
        return shifts;
    }

    /**
     * Base cycles of length 4 (or 6) whose shift sum is 0 mod Z in the given shifts of this
     * template, counting those of free entries only (each lifts to Z cycles of that length).
     */
    long closedCycles(int[][] shifts, int lifting, int length) {
        int[] value = new int[entryRow.length];
        for (int e = 0; e < value.length; e++) {
            value[e] = shifts[entryRow[e]][entryColumn[e]];
        }
        int[] forbidden = new int[lifting];
        long closed = 0;
        for (int e = fixed; e < value.length; e++) {
            forbid(length == 4 ? fourCycles[e] : sixCycles[e], length, value, lifting, forbidden);
            closed += forbidden[value[e]];
        }
        return closed;
    }

    /** Counts, for each value of the entry, the cycles in {@code groups} it would complete. */
    private static void forbid(int[] groups, int length, int[] value, int lifting, int[] forbidden) {
        Arrays.fill(forbidden, 0);
        for (int g = 0; g < groups.length; g += length) {
            long rest = 0;
            for (int p = 1; p < length; p++) {
                int code = groups[g + p];
                rest += code > 0 ? value[code - 1] : -value[-code - 1];
            }
            // own sign · s + rest ≡ 0
            forbidden[(int) Math.floorMod(-groups[g] * rest, (long) lifting)]++;
        }
    }
}
