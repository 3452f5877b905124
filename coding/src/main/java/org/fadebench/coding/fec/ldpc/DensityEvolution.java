package org.fadebench.coding.fec.ldpc;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.analysis.solvers.BrentSolver;

/**
 * Belief-propagation decoding threshold of an LDPC ensemble on the binary-input AWGN channel
 * (y = ±1 + n, n ~ N(0, σ²)) by density evolution under the Gaussian approximation of S.-Y. Chung,
 * T. J. Richardson, R. L. Urbanke, "Analysis of sum-product decoding of low-density parity-check
 * codes using a Gaussian approximation", IEEE Trans. Inf. Theory 47(2), 2001: every message is
 * taken as a consistent Gaussian LLR N(m, 2m), so one mean per iteration describes it.
 *
 * <p>With s = 2/σ² (the channel LLR mean) and m_u the check-to-variable mean, one iteration is
 * <pre>
 *   m_u ← Σ_j ρ_j φ⁻¹( 1 − [1 − Σ_i λ_i φ(s + (i − 1) m_u)]^(j−1) )
 * </pre>
 * (the variable-node mean of degree i is s + (i − 1) m_u; the check update through φ, mixed over
 * ρ), from m_u = 0. Decoding succeeds when m_u grows past {@link #MEAN_LIMIT} and fails when it
 * stops growing (a fixed point). The threshold σ* is the largest σ that succeeds, found by
 * bisection to {@link #SIGMA_PRECISION}.
 *
 * <p>φ(x) = 1 − E[tanh(u/2)], u ~ N(x, 2x), is evaluated exactly in the form
 * φ(x) = e^(−x/4) / √(4πx) · ∫ sech(u/2) e^(−u²/(4x)) du (from 1 − tanh(u/2) = 2/(1 + e^u) and
 * completing the square; no cancellation for large x), by composite Gauss–Legendre quadrature;
 * φ⁻¹ by Brent's method on ln φ. Instances are immutable.
 *
 * <p>Note: the paper's tabulated thresholds come out of the recursion when φ is replaced by the
 * paper's closed-form fit (tested); with the exact φ the thresholds are slightly lower (about
 * 0.003 in σ for the regular (3,6) ensemble).
 */
public final class DensityEvolution {

    /** Check-to-variable mean beyond which the recursion is taken to diverge (φ ≈ 10⁻¹¹ there). */
    static final double MEAN_LIMIT = 100.0;
    /** Growth of m_u per iteration below which the recursion has stalled at a fixed point. */
    static final double STALL = 1e-10;
    /** Iteration cap; reaching it counts as failure (only ever hit right at the threshold). */
    static final int MAX_ITERATIONS = 20_000;
    /** Width of the final bisection interval on σ. */
    public static final double SIGMA_PRECISION = 1e-5;

    /** Gauss–Legendre points per panel, and panel width in u (sech has poles at ±iπ). */
    private static final int POINTS = 16;
    private static final double PANEL = 8.0;
    private static final double[] NODE = new double[POINTS];
    private static final double[] WEIGHT = new double[POINTS];

    static {
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(POINTS, 0.0, 1.0);
        for (int k = 0; k < POINTS; k++) {
            NODE[k] = rule.getPoint(k);
            WEIGHT[k] = rule.getWeight(k);
        }
    }

    private final DegreeDistribution ensemble;
    private final DoubleUnaryOperator phi;
    private final DoubleUnaryOperator inversePhi;

    /** The recursion with the exact φ ({@link #phi(double)}, {@link #inversePhi(double)}). */
    public DensityEvolution(DegreeDistribution ensemble) {
        this(ensemble, DensityEvolution::phi, DensityEvolution::inversePhi);
    }

    /** The recursion with another φ and its inverse (tests: the paper's closed-form fit). */
    DensityEvolution(DegreeDistribution ensemble, DoubleUnaryOperator phi, DoubleUnaryOperator inversePhi) {
        this.ensemble = ensemble;
        this.phi = phi;
        this.inversePhi = inversePhi;
    }

    public DegreeDistribution ensemble() {
        return ensemble;
    }

    /**
     * φ(x) = 1 − E[tanh(u/2)] for u ~ N(x, 2x); φ(0) = 1, decreasing to 0.
     *
     * @throws IllegalArgumentException if x is negative or NaN
     */
    public static double phi(double x) {
        if (!(x >= 0.0)) {
            throw new IllegalArgumentException("phi needs a non-negative mean, got " + x);
        }
        if (x == 0.0) {
            return 1.0;
        }
        if (Double.isInfinite(x)) {
            return 0.0;
        }
        // the integrand is even: 2 ∫_0^U, with U where both sech (≤ 2e^(−u/2)) and the
        // Gaussian (e^(−36) at 12√x) have fallen far below double precision of the integral
        double upper = Math.min(64.0, 12.0 * Math.sqrt(x));
        int panels = (int) Math.ceil(upper / PANEL);
        double width = upper / panels;
        double sum = 0.0;
        for (int p = 0; p < panels; p++) {
            for (int k = 0; k < POINTS; k++) {
                double u = (p + NODE[k]) * width;
                double e = Math.exp(-u);
                // sech(u/2) e^(−u²/(4x)) = 2 e^(−u/2 − u²/(4x)) / (1 + e^(−u))
                sum += WEIGHT[k] * 2.0 * Math.exp(-0.5 * u - u * u / (4.0 * x)) / (1.0 + e);
            }
        }
        return Math.exp(-0.25 * x) / Math.sqrt(4.0 * Math.PI * x) * 2.0 * width * sum;
    }

    /**
     * φ⁻¹(y) for y in (0, 1]: the x ≥ 0 with φ(x) = y (relative accuracy about 10⁻¹²).
     *
     * @throws IllegalArgumentException if y is outside (0, 1]
     */
    public static double inversePhi(double y) {
        if (!(y > 0.0 && y <= 1.0)) {
            throw new IllegalArgumentException("inverse phi needs a value in (0, 1], got " + y);
        }
        double lo = 1e-12;
        if (y == 1.0 || y >= phi(lo)) {
            return 0.0;
        }
        // φ(x) ≤ √(π/x) e^(−x/4) (sech integral ≤ 2π), so φ(−4 ln y + 10) < y
        double hi = -4.0 * Math.log(y) + 10.0;
        double logY = Math.log(y);
        BrentSolver solver = new BrentSolver(1e-13, 1e-12);
        double s = solver.solve(200, t -> Math.log(phi(Math.exp(t))) - logY,
                Math.log(lo), Math.log(hi));
        return Math.exp(s);
    }

    /**
     * Whether the Gaussian-approximation recursion at noise standard deviation σ drives the
     * check-to-variable mean past {@link #MEAN_LIMIT}.
     */
    public boolean converges(double sigma) {
        if (!(sigma > 0.0) || Double.isInfinite(sigma)) {
            throw new IllegalArgumentException("noise standard deviation must be positive, got " + sigma);
        }
        double channel = 2.0 / (sigma * sigma);
        double mean = 0.0;
        for (int it = 0; it < MAX_ITERATIONS; it++) {
            double next = checkMean(channel, mean);
            if (next >= MEAN_LIMIT) {
                return true;
            }
            if (next - mean <= STALL) {
                return false;
            }
            mean = next;
        }
        return false;
    }

    /** One iteration: the new check-to-variable mean from the previous one. */
    double checkMean(double channel, double mean) {
        double variableError = 0.0;
        for (int i = 2; i <= ensemble.maxVariableDegree(); i++) {
            double w = ensemble.lambda(i);
            if (w > 0.0) {
                variableError += w * phi.applyAsDouble(channel + (i - 1) * mean);
            }
        }
        if (variableError <= 0.0) {
            return Double.POSITIVE_INFINITY;
        }
        double logGood = Math.log1p(-variableError);
        double next = 0.0;
        for (int j = 2; j <= ensemble.maxCheckDegree(); j++) {
            double w = ensemble.rho(j);
            if (w > 0.0) {
                // 1 − (1 − p)^(j−1), without cancellation for small p
                double y = -Math.expm1((j - 1) * logGood);
                next += w * (y > 0.0 ? inversePhi.applyAsDouble(y) : Double.POSITIVE_INFINITY);
            }
        }
        return next;
    }

    /**
     * The threshold σ*: the largest noise standard deviation at which the recursion converges,
     * to within {@link #SIGMA_PRECISION} (the midpoint of the final bisection interval).
     */
    public double thresholdSigma() {
        double good = 0.05;
        double bad = 4.0;
        if (!converges(good)) {
            throw new IllegalStateException("ensemble does not converge even at sigma " + good + ": " + ensemble);
        }
        while (converges(bad)) {
            good = bad;
            bad *= 2.0;
        }
        while (bad - good > SIGMA_PRECISION) {
            double mid = 0.5 * (good + bad);
            if (converges(mid)) {
                good = mid;
            } else {
                bad = mid;
            }
        }
        return 0.5 * (good + bad);
    }

    /** The threshold as Eb/N0 in dB at the design rate R: 10 log10(1 / (2 R σ*²)). */
    public double thresholdEbN0Db() {
        return ebN0Db(thresholdSigma(), ensemble.designRate());
    }

    /** Eb/N0 in dB of BPSK (±1) at noise standard deviation σ carrying R information bits per symbol. */
    public static double ebN0Db(double sigma, double rate) {
        return 10.0 * Math.log10(1.0 / (2.0 * rate * sigma * sigma));
    }
}
