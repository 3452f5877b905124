package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;
import org.fadebench.coding.fec.Lanes;

/**
 * The floating-point reference decoder, for all three {@link LdpcAlgorithm}s on the row-layered
 * schedule (D. E. Hocevar, "A reduced complexity decoder architecture via layered decoding of LDPC
 * codes", SiPS 2004): the posterior LLR P of every column starts at the channel LLR; check row i
 * takes Q_e = P_j − R_e on each of its edges e (column j), computes new check-to-variable messages
 * R_e from the other edges' Q, and sets P_j = Q_e + R_e. An iteration is one pass over the rows in
 * order. Lanes are decoded one after the other, each from its own LLRs.
 *
 * <p>Check messages: sum-product in the ±log domain, |R_e| = φ(Σ_{e'≠e} φ(|Q_e'|)) with
 * φ(x) = ln((e^x + 1)/(e^x − 1)) = −ln tanh(x/2), its own inverse, and the sign the product of the
 * other signs (R. G. Gallager, "Low-density parity-check codes", 1963, Section 4.1, from memory;
 * F. R. Kschischang, B. J. Frey, H.-A. Loeliger, "Factor graphs and the sum-product algorithm",
 * IEEE Trans. Inf. Theory 47(2), 2001). φ is computed as ln(1 + 2/(e^x − 1)) with
 * {@code log1p}/{@code expm1}, accurate at both ends. Message magnitudes are held at most
 * {@value #LIMIT}, and so is φ's argument: every φ is then a positive normal number and every
 * message finite, also for a check on a single bit, whose message has no other edge to come from
 * (an LLR of 700 is a probability of e^−700: nothing to double precision). Min-sum: |R_e| = the least
 * |Q_e'| of the other edges, times α (normalised) or less β and at least 0 (offset), after J. Chen,
 * M. P. C. Fossorier, IEEE Trans. Commun. 50(3), 2002. A Q of 0 counts as positive.
 *
 * <p>Early stop (if the settings ask for it): after each iteration, a lane whose hard decisions
 * (P &lt; 0 gives 1) satisfy every check stops. Allocates nothing after construction.
 */
final class FloatingPointDecoder extends RowDecoder {

    /** The most |R| of a message, and the most |Q| passed to φ. */
    static final double LIMIT = 700;

    private final double[][] channel;
    private final double[][] posterior;
    private final double[] check;
    private final double[] q;
    private final double[] terms;
    private final double[] before;

    FloatingPointDecoder(ParityCheckMatrix h, LdpcDecoding decoding, int lanes) {
        super(h, decoding, lanes);
        channel = new double[lanes][columns];
        posterior = new double[lanes][columns];
        check = new double[edgeColumn.length];
        int degree = largestRowDegree(h);
        q = new double[degree];
        terms = new double[degree];
        before = new double[degree];
    }

    /** Bytes the buffers of a decoder take. */
    static long bytes(ParityCheckMatrix h, int lanes) {
        int degree = largestRowDegree(h);
        return sharedBytes(h, lanes) + 2 * tableBytes(lanes, 8L * h.columns()) + Lanes.rowBytes(8L * h.edges())
                + 3 * Lanes.rowBytes(8L * degree);
    }

    @Override
    public void load(int lane, double[] llr, int off) {
        Lanes.checkLane(lane, lanes);
        checkFinite(lane, llr, off);
        System.arraycopy(llr, off, channel[lane], 0, columns);
    }

    @Override
    public void decode(int frames) {
        Lanes.checkFrames(frames, lanes);
        for (int lane = 0; lane < frames; lane++) {
            decodeLane(lane);
        }
        decodedLanes = frames;
    }

    /** The posterior LLR of a column of a lane after the last {@link #decode}. */
    double posterior(int lane, int column) {
        Lanes.checkLane(lane, decodedLanes);
        checkColumn(column);
        return posterior[lane][column];
    }

    @Override
    int decision(int lane, int column) {
        return posterior[lane][column] < 0 ? 1 : 0;
    }

    private void decodeLane(int lane) {
        double[] p = posterior[lane];
        System.arraycopy(channel[lane], 0, p, 0, columns);
        Arrays.fill(check, 0);
        int limit = decoding.iterations();
        int done = 0;
        boolean ok = false;
        while (done < limit) {
            for (int i = 0; i < rows; i++) {
                updateRow(i, p);
            }
            done++;
            if (decoding.earlyStop() || done == limit) {
                ok = satisfies(p);
                if (ok) {
                    break;
                }
            }
        }
        iterations[lane] = done;
        satisfied[lane] = ok;
    }

    private void updateRow(int row, double[] p) {
        int from = rowStart[row];
        int degree = rowStart[row + 1] - from;
        boolean negative = false;
        for (int k = 0; k < degree; k++) {
            q[k] = p[edgeColumn[from + k]] - check[from + k];
            negative ^= q[k] < 0;
        }
        if (decoding.algorithm() == LdpcAlgorithm.SUM_PRODUCT) {
            sumProduct(from, degree);
        } else {
            minSum(from, degree);
        }
        for (int k = 0; k < degree; k++) {
            double r = negative ^ q[k] < 0 ? -check[from + k] : check[from + k];
            check[from + k] = r;
            p[edgeColumn[from + k]] = q[k] + r;
        }
    }

    /**
     * The magnitudes of the row's new messages into {@code check[from ..]}, by sum-product. The sum
     * of the others' φ is a sum before the edge plus a sum after it (running sums from both ends),
     * not the total less the own term, which would cancel digits (and φ(0) is infinite).
     */
    private void sumProduct(int from, int degree) {
        double sum = 0;
        for (int k = 0; k < degree; k++) {
            before[k] = sum;
            terms[k] = phi(Math.abs(q[k]));
            sum += terms[k];
        }
        double after = 0;
        for (int k = degree - 1; k >= 0; k--) {
            check[from + k] = Math.min(phi(before[k] + after), LIMIT);
            after += terms[k];
        }
    }

    /** The magnitudes of the row's new messages into {@code check[from ..]}, by corrected min-sum. */
    private void minSum(int from, int degree) {
        double least = LIMIT;
        double second = LIMIT;
        int at = -1;
        for (int k = 0; k < degree; k++) {
            double a = Math.abs(q[k]);
            if (a < least) {
                second = least;
                least = a;
                at = k;
            } else if (a < second) {
                second = a;
            }
        }
        double c = decoding.correction();
        boolean normalised = decoding.algorithm() == LdpcAlgorithm.MIN_SUM;
        for (int k = 0; k < degree; k++) {
            double m = k == at ? second : least;
            check[from + k] = normalised ? c * m : Math.max(m - c, 0);
        }
    }

    /** Whether the hard decisions of {@code p} satisfy every check. */
    private boolean satisfies(double[] p) {
        for (int i = 0; i < rows; i++) {
            boolean odd = false;
            for (int e = rowStart[i]; e < rowStart[i + 1]; e++) {
                odd ^= p[edgeColumn[e]] < 0;
            }
            if (odd) {
                return false;
            }
        }
        return true;
    }

    /** φ(x) = ln(1 + 2/(e^x − 1)) for x ≥ 0, with x held at most {@value #LIMIT}. */
    static double phi(double x) {
        return Math.log1p(2 / Math.expm1(Math.min(x, LIMIT)));
    }
}
