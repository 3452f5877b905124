package org.fadebench.coding.fec.conv;

import java.util.Arrays;
import java.util.PriorityQueue;

/** Searches over a code's trellis for the distance tests and the union bound. */
final class TrellisSearch {

    private TrellisSearch() {
    }

    /**
     * Free distance of a punctured code: the least output weight of a path that leaves state 0 (with
     * input 1, at any phase of the puncturing period) and first returns to state 0, counting only
     * the sent bits. Dijkstra's shortest path over (state, phase) with branch weight = number of
     * sent ones (E. W. Dijkstra, "A note on two problems in connexion with graphs", Numer. Math. 1,
     * 1959).
     */
    static int freeDistance(Puncturer punctured) {
        ConvolutionalCode code = punctured.code();
        int states = code.states();
        int period = punctured.period();
        int[] dist = new int[states * period];
        Arrays.fill(dist, Integer.MAX_VALUE);
        PriorityQueue<int[]> queue = new PriorityQueue<>((x, y) -> Integer.compare(x[0], y[0]));
        for (int phase = 0; phase < period; phase++) {
            int next = nextState(code, 0, 1);
            int node = next * period + (phase + 1) % period;
            int w = sentWeight(punctured, phase, code.label(0, 1));
            if (w < dist[node]) {
                dist[node] = w;
                queue.add(new int[] {w, node});
            }
        }
        while (!queue.isEmpty()) {
            int[] top = queue.poll();
            int w = top[0];
            int state = top[1] / period;
            int phase = top[1] % period;
            if (w > dist[top[1]]) {
                continue;
            }
            if (state == 0) {
                return w;
            }
            for (int u = 0; u < 2; u++) {
                int nw = w + sentWeight(punctured, phase, code.label(state, u));
                int node = nextState(code, state, u) * period + (phase + 1) % period;
                if (nw < dist[node]) {
                    dist[node] = nw;
                    queue.add(new int[] {nw, node});
                }
            }
        }
        throw new AssertionError("no path returns to state 0");
    }

    /**
     * Distance spectrum of an unpunctured code up to output weight {@code maxWeight}: {@code [0][d]}
     * is the number a_d of error events (paths leaving state 0 and first re-merging with it) of
     * weight d, {@code [1][d]} the total number c_d of information ones on them. Counted by
     * dynamic programming over (state, weight so far), step by step, until every open path is
     * heavier than {@code maxWeight}; this ends for codes without zero-weight cycles.
     */
    static long[][] spectrum(ConvolutionalCode code, int maxWeight) {
        int states = code.states();
        long[] a = new long[maxWeight + 1];
        long[] c = new long[maxWeight + 1];
        long[][] paths = new long[states][maxWeight + 1];
        long[][] ones = new long[states][maxWeight + 1];
        int w0 = Integer.bitCount(code.label(0, 1));
        paths[nextState(code, 0, 1)][w0] = 1;
        ones[nextState(code, 0, 1)][w0] = 1;
        for (int step = 0; step < 100 * (maxWeight + 1); step++) {
            long[][] nextPaths = new long[states][maxWeight + 1];
            long[][] nextOnes = new long[states][maxWeight + 1];
            boolean open = false;
            for (int s = 1; s < states; s++) {
                for (int w = 0; w <= maxWeight; w++) {
                    if (paths[s][w] == 0) {
                        continue;
                    }
                    for (int u = 0; u < 2; u++) {
                        int nw = w + Integer.bitCount(code.label(s, u));
                        if (nw > maxWeight) {
                            continue;
                        }
                        int ns = nextState(code, s, u);
                        if (ns == 0) {
                            a[nw] += paths[s][w];
                            c[nw] += ones[s][w];
                        } else {
                            nextPaths[ns][nw] += paths[s][w];
                            nextOnes[ns][nw] += ones[s][w] + u * paths[s][w];
                            open = true;
                        }
                    }
                }
            }
            if (!open) {
                return new long[][] {a, c};
            }
            paths = nextPaths;
            ones = nextOnes;
        }
        throw new AssertionError("paths of weight <= " + maxWeight + " never close: zero-weight cycle?");
    }

    static int nextState(ConvolutionalCode code, int state, int u) {
        return ((u << (code.constraintLength() - 1)) | state) >>> 1;
    }

    private static int sentWeight(Puncturer punctured, int phase, int label) {
        int w = 0;
        for (int i = 0; i < punctured.code().outputs(); i++) {
            if (punctured.keeps(phase, i)) {
                w += (label >>> i) & 1;
            }
        }
        return w;
    }
}
