package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The sample covariance of generated channels against the target E[h_rt·conj(h_r't')] =
 * R_rx(r, r')·R_tx(t, t') (plus the line of sight for Rician fading).
 *
 * <p>Tolerance: for jointly circular complex Gaussian a, b with unit variances,
 * E|a·conj(b) − E[a·conj(b)]|² = E|a|²·E|b|² = 1 (L. Isserlis, "On a formula for the product-moment
 * coefficient of any order of a normal frequency distribution in any number of variables",
 * Biometrika 12, 1918), so the mean of n independent products has a complex error of mean square
 * 1/n; by the central limit theorem a deviation beyond 5/√n in modulus has probability below 6e-7
 * per entry.
 */
class KroneckerCorrelationTest {

    private static final int DRAWS = 40_000;

    /** Complex exponential profile written out from its definition: r^{i−j} below the diagonal, conj above. */
    private static double[] exponentialTarget(int n, double re, double im) {
        double[] m = new double[2 * n * n];
        double modulus = Math.hypot(re, im);
        double angle = Math.atan2(im, re);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                int d = Math.abs(i - j);
                double sign = i >= j ? 1.0 : -1.0;
                m[2 * (i * n + j)] = Math.pow(modulus, d) * Math.cos(d * angle);
                m[2 * (i * n + j) + 1] = sign * Math.pow(modulus, d) * Math.sin(d * angle);
            }
        }
        return m;
    }

    /** Sample covariance of all pairs of entries, (Nr·Mt)² complex numbers. */
    private static double[] sampleCovariance(FadingModel model, int nr, int mt, long seed) {
        int e = nr * mt;
        double[] h = new double[2 * e];
        double[] c = new double[2 * e * e];
        Draws draws = Draws.of(seed);
        for (int i = 0; i < DRAWS; i++) {
            model.draw(draws, nr, mt, h);
            for (int a = 0; a < e; a++) {
                for (int b = 0; b < e; b++) {
                    // h_a · conj(h_b)
                    c[2 * (a * e + b)] += h[2 * a] * h[2 * b] + h[2 * a + 1] * h[2 * b + 1];
                    c[2 * (a * e + b) + 1] += h[2 * a + 1] * h[2 * b] - h[2 * a] * h[2 * b + 1];
                }
            }
        }
        for (int i = 0; i < c.length; i++) {
            c[i] /= DRAWS;
        }
        return c;
    }

    /** target(a, b) = los + scatter · R_rx(r, r')·R_tx(t, t') for entries a = (r, t), b = (r', t'). */
    private static void assertCovariance(double[] measured, double[] rx, double[] tx, int nr, int mt,
                                         double los, double scatter) {
        int e = nr * mt;
        double bound = 5.0 / Math.sqrt(DRAWS);
        for (int a = 0; a < e; a++) {
            for (int b = 0; b < e; b++) {
                int r = a / mt;
                int t = a % mt;
                int r2 = b / mt;
                int t2 = b % mt;
                double xr = rx[2 * (r * nr + r2)];
                double xi = rx[2 * (r * nr + r2) + 1];
                double yr = tx[2 * (t * mt + t2)];
                double yi = tx[2 * (t * mt + t2) + 1];
                double re = los + scatter * (xr * yr - xi * yi);
                double im = scatter * (xr * yi + xi * yr);
                double dr = measured[2 * (a * e + b)] - re;
                double di = measured[2 * (a * e + b) + 1] - im;
                assertTrue(Math.hypot(dr, di) < bound, "entry pair (" + a + ", " + b + "): measured "
                        + measured[2 * (a * e + b)] + "+" + measured[2 * (a * e + b) + 1] + "j, target " + re + "+" + im + "j");
            }
        }
    }

    @Test
    void exponentialMatrixFollowsItsDefinition() {
        assertArrayEquals(exponentialTarget(4, 0.3, -0.5), KroneckerCorrelation.exponentialMatrix(4, 0.3, -0.5), 1e-15);
        assertArrayEquals(exponentialTarget(3, -0.7, 0.0), KroneckerCorrelation.exponentialMatrix(3, -0.7, 0.0), 1e-15);
    }

    @Test
    void realExponentialProfiles() {
        int nr = 3;
        int mt = 2;
        FadingModel model = new RayleighFading(KroneckerCorrelation.exponential(nr, mt, 0.6, -0.4));
        assertCovariance(sampleCovariance(model, nr, mt, 21), exponentialTarget(nr, 0.6, 0),
                exponentialTarget(mt, -0.4, 0), nr, mt, 0.0, 1.0);
    }

    @Test
    void complexMatricesGivenByTheCaller() {
        int nr = 2;
        int mt = 3;
        double[] rx = exponentialTarget(nr, 0.2, 0.6);
        double[] tx = exponentialTarget(mt, -0.5, -0.4);
        FadingModel model = new RayleighFading(KroneckerCorrelation.of(nr, mt, rx, tx));
        assertCovariance(sampleCovariance(model, nr, mt, 22), rx, tx, nr, mt, 0.0, 1.0);
    }

    /**
     * Rician with correlated scattering: the common all-ones line of sight with uniform phase adds
     * K/(K+1) to every covariance, the scattered part is weighted 1/(K+1).
     */
    @Test
    void ricianWithCorrelatedScattering() {
        int nr = 2;
        int mt = 2;
        double k = 1.5;
        FadingModel model = new RicianFading(k, KroneckerCorrelation.exponential(nr, mt, 0.5, 0.0));
        double[] identity = {1, 0, 0, 0, 0, 0, 1, 0};
        assertCovariance(sampleCovariance(model, nr, mt, 23), exponentialTarget(nr, 0.5, 0), identity, nr, mt,
                k / (k + 1), 1 / (k + 1));
    }

    /**
     * A singular matrix: all-ones (fully correlated receive antennas) has no Cholesky factor, but its
     * square root J/√n makes every row of H the same.
     */
    @Test
    void fullyCorrelatedAntennasAreIdentical() {
        double[] ones = {1, 0, 1, 0, 1, 0, 1, 0};
        FadingModel model = new RayleighFading(KroneckerCorrelation.of(2, 1, ones, null));
        double[] h = new double[4];
        Draws draws = Draws.of(3);
        for (int i = 0; i < 100; i++) {
            model.draw(draws, 2, 1, h);
            assertEquals(h[0], h[2], 1e-12);
            assertEquals(h[1], h[3], 1e-12);
        }
    }

    @Test
    void identityLeavesTheDrawAlone() {
        double[] a = new double[12];
        double[] b = new double[12];
        new RayleighFading().draw(Draws.of(9), 2, 3, a);
        new RayleighFading(KroneckerCorrelation.identity(2, 3)).draw(Draws.of(9), 2, 3, b);
        assertArrayEquals(a, b, 0.0);
    }

    @Test
    void badMatricesAreRefusedWithTheirProblem() {
        assertMessage("rx correlation matrix must be 2 x 2 (8 numbers, re and im interleaved), got 6 numbers",
                new double[6], null);
        assertMessage("tx correlation matrix entry (0, 1) is not finite", null,
                new double[] {1, 0, Double.NaN, 0, 0.5, 0, 1, 0});
        assertMessage("rx correlation matrix must be Hermitian: entry (0, 1) = 0.5+0.1j but conj of (1, 0) = 0.5+0.2j",
                new double[] {1, 0, 0.5, 0.1, 0.5, -0.2, 1, 0}, null);
        assertMessage("rx correlation matrix must have a unit diagonal (E|h|² = 1): entry (1, 1) = 2.0+0.0j",
                new double[] {1, 0, 0.5, 0, 0.5, 0, 2, 0}, null);
        // r(0,1) = r(1,2) = 0.9 but r(0,2) = −0.9: x = (1, −1, −1) gives xᵀRx = 3 − 5.4 < 0
        double[] notPsd = {1, 0, 0.9, 0, -0.9, 0, 0.9, 0, 1, 0, 0.9, 0, -0.9, 0, 0.9, 0, 1, 0};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> KroneckerCorrelation.of(3, 2, notPsd, null));
        assertTrue(e.getMessage().startsWith("rx correlation matrix must be positive semidefinite: it has the eigenvalue -"),
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> KroneckerCorrelation.exponentialMatrix(3, 0.8, 0.6));
        assertTrue(e.getMessage().startsWith("exponential correlation coefficient must have |r| < 1"), e.getMessage());
        KroneckerCorrelation c = KroneckerCorrelation.exponential(2, 2, 0.5, 0.5);
        e = assertThrows(IllegalArgumentException.class, () -> new RayleighFading(c).draw(Draws.of(1), 2, 3, new double[12]));
        assertEquals("correlation is for Nr x Mt = 2 x 2, not 2 x 3", e.getMessage());
    }

    private static void assertMessage(String expected, double[] rx, double[] tx) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> KroneckerCorrelation.of(2, 2, rx, tx));
        assertEquals(expected, e.getMessage());
    }
}
