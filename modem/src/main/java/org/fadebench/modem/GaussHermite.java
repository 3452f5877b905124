package org.fadebench.modem;

import java.util.Arrays;
import org.apache.commons.math3.linear.EigenDecomposition;

/**
 * An n-point Gauss–Hermite rule: {@code ∫ f(x) e^(−x²) dx ≈ Σ w_i f(x_i)}, exact for polynomials
 * of degree up to 2n − 1 (physicists' weight e^(−x²); nodes ascending).
 *
 * <p>Construction: the nodes are the eigenvalues of the symmetric tridiagonal Jacobi matrix of
 * the Hermite recurrence (zero diagonal, off-diagonal √(k/2)), G. H. Golub and J. H. Welsch,
 * "Calculation of Gauss quadrature rules", Math. Comp. 23 (1969). Each node is then polished by
 * Newton's method on the orthonormal Hermite polynomial p_n, and the weights are the Christoffel
 * numbers {@code w_i = 1 / Σ_{k<n} p_k(x_i)²}, which avoids the loss of accuracy of squared
 * eigenvector components for the small weights.
 */
public final class GaussHermite {

    /** Largest supported number of nodes (the orthonormal polynomials stay well inside double range). */
    public static final int MAX_NODES = 200;

    private static final double P0 = Math.pow(Math.PI, -0.25);

    private final double[] nodes;
    private final double[] weights;

    private GaussHermite(double[] nodes, double[] weights) {
        this.nodes = nodes;
        this.weights = weights;
    }

    /**
     * The rule with {@code n} nodes.
     *
     * @throws IllegalArgumentException if n is outside 1..{@value #MAX_NODES}
     */
    public static GaussHermite of(int n) {
        if (n < 1 || n > MAX_NODES) {
            throw new IllegalArgumentException(
                    "Gauss-Hermite node count must be in 1.." + MAX_NODES + ", got " + n);
        }
        double[] offDiagonal = new double[n - 1];
        for (int k = 1; k < n; k++) {
            offDiagonal[k - 1] = Math.sqrt(0.5 * k);
        }
        double[] x = new EigenDecomposition(new double[n], offDiagonal).getRealEigenvalues();
        Arrays.sort(x);
        double[] w = new double[n];
        double[] p = new double[n + 1];
        for (int i = 0; i < n; i++) {
            double xi = x[i];
            for (int iter = 0; iter < 8; iter++) {
                orthonormal(xi, p);
                // p_n'(x) = √(2n) p_{n-1}(x)
                double step = p[n] / (Math.sqrt(2.0 * n) * p[n - 1]);
                xi -= step;
                if (Math.abs(step) <= 1e-16 * Math.max(1.0, Math.abs(xi))) {
                    break;
                }
            }
            orthonormal(xi, p);
            double sum = 0;
            for (int k = 0; k < n; k++) {
                sum += p[k] * p[k];
            }
            x[i] = xi;
            w[i] = 1.0 / sum;
        }
        return new GaussHermite(x, w);
    }

    /**
     * Fills {@code p[0..p.length-1]} with the orthonormal Hermite polynomials at x:
     * p_0 = π^(−1/4), p_1 = √2 x p_0, p_(k+1) = √(2/(k+1)) x p_k − √(k/(k+1)) p_(k−1).
     */
    private static void orthonormal(double x, double[] p) {
        p[0] = P0;
        if (p.length > 1) {
            p[1] = Math.sqrt(2.0) * x * P0;
        }
        for (int k = 1; k + 1 < p.length; k++) {
            p[k + 1] = Math.sqrt(2.0 / (k + 1)) * x * p[k] - Math.sqrt((double) k / (k + 1)) * p[k - 1];
        }
    }

    public int size() {
        return nodes.length;
    }

    public double node(int i) {
        return nodes[i];
    }

    public double weight(int i) {
        return weights[i];
    }
}
