package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;

/**
 * The degree distribution pair of an LDPC ensemble in the edge perspective: λ(x) = Σ λ_i x^(i−1)
 * and ρ(x) = Σ ρ_j x^(j−1), where λ_i (ρ_j) is the fraction of edges attached to variable
 * (check) nodes of degree i (j) (T. J. Richardson, M. A. Shokrollahi, R. L. Urbanke, "Design of
 * capacity-approaching irregular low-density parity-check codes", IEEE Trans. Inf. Theory 47(2),
 * 2001, Section I). Coefficients are indexed by degree; index 0 and 1 must be zero (a degree-1
 * check node or an isolated node carries no constraint this design tool models). Immutable.
 */
public final class DegreeDistribution {

    /** Allowed deviation of the coefficient sums from 1 (rounding of typed-in tables). */
    static final double SUM_TOLERANCE = 1e-9;

    private final double[] lambda;
    private final double[] rho;

    private DegreeDistribution(double[] lambda, double[] rho) {
        this.lambda = lambda;
        this.rho = rho;
    }

    /**
     * The pair from edge-perspective coefficients, {@code lambda[i]} = λ_i and {@code rho[j]} = ρ_j.
     *
     * @throws IllegalArgumentException if a coefficient is negative or not finite, a degree below 2
     *     has weight, or a side does not sum to 1
     */
    public static DegreeDistribution ofEdges(double[] lambda, double[] rho) {
        return new DegreeDistribution(checked(lambda, "variable"), checked(rho, "check"));
    }

    /**
     * The pair from node-perspective coefficients, {@code variableNodes[i]} = Λ_i (fraction of
     * variable nodes of degree i) and {@code checkNodes[j]} = P_j, converted by λ_i = iΛ_i / Σ_k kΛ_k
     * (likewise ρ). The node fractions are validated as the edge fractions are.
     */
    public static DegreeDistribution ofNodes(double[] variableNodes, double[] checkNodes) {
        return ofEdges(toEdges(checked(variableNodes, "variable-node")),
                toEdges(checked(checkNodes, "check-node")));
    }

    /** The regular ensemble: every variable node of degree dv, every check node of degree dc. */
    public static DegreeDistribution regular(int variableDegree, int checkDegree) {
        return ofEdges(single(variableDegree), single(checkDegree));
    }

    private static double[] single(int degree) {
        if (degree < 2) {
            throw new IllegalArgumentException("node degree must be at least 2, got " + degree);
        }
        double[] c = new double[degree + 1];
        c[degree] = 1.0;
        return c;
    }

    private static double[] toEdges(double[] nodes) {
        double edges = 0.0;
        for (int d = 0; d < nodes.length; d++) {
            edges += d * nodes[d];
        }
        double[] e = new double[nodes.length];
        for (int d = 0; d < nodes.length; d++) {
            e[d] = d * nodes[d] / edges;
        }
        return e;
    }

    private static double[] checked(double[] c, String side) {
        double sum = 0.0;
        for (int d = 0; d < c.length; d++) {
            if (!(c[d] >= 0.0) || Double.isInfinite(c[d])) {
                throw new IllegalArgumentException(side + " degree " + d
                        + " has weight " + c[d] + "; weights must be finite and non-negative");
            }
            if (d < 2 && c[d] != 0.0) {
                throw new IllegalArgumentException(side + " degree " + d
                        + " has weight " + c[d] + "; degrees must be at least 2");
            }
            sum += c[d];
        }
        if (Math.abs(sum - 1.0) > SUM_TOLERANCE) {
            throw new IllegalArgumentException(side + " degree weights sum to " + sum
                    + "; they must sum to 1");
        }
        int top = c.length;
        while (top > 0 && c[top - 1] == 0.0) {
            top--;
        }
        return Arrays.copyOf(c, top);
    }

    /** Largest variable-node degree with weight. */
    public int maxVariableDegree() {
        return lambda.length - 1;
    }

    /** Largest check-node degree with weight. */
    public int maxCheckDegree() {
        return rho.length - 1;
    }

    /** λ_i, the fraction of edges at variable nodes of degree i (0 beyond the largest degree). */
    public double lambda(int degree) {
        return degree < lambda.length ? lambda[degree] : 0.0;
    }

    /** ρ_j, the fraction of edges at check nodes of degree j (0 beyond the largest degree). */
    public double rho(int degree) {
        return degree < rho.length ? rho[degree] : 0.0;
    }

    /** Design rate 1 − ∫₀¹ρ / ∫₀¹λ = 1 − Σ ρ_j/j / Σ λ_i/i (the rate if all checks are independent). */
    public double designRate() {
        return 1.0 - integral(rho) / integral(lambda);
    }

    private static double integral(double[] c) {
        double s = 0.0;
        for (int d = 2; d < c.length; d++) {
            s += c[d] / d;
        }
        return s;
    }

    @Override
    public String toString() {
        return "lambda=" + polynomial(lambda) + " rho=" + polynomial(rho);
    }

    private static String polynomial(double[] c) {
        StringBuilder b = new StringBuilder();
        for (int d = 2; d < c.length; d++) {
            if (c[d] > 0.0) {
                b.append(b.length() == 0 ? "" : " + ").append(c[d]).append(" x^").append(d - 1);
            }
        }
        return b.toString();
    }
}
