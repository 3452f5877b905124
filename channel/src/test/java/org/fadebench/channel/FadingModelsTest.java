package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.UniformRealDistribution;
import org.apache.commons.math3.stat.descriptive.SummaryStatistics;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.Test;

/**
 * Marginal statistics of the Rician and Nakagami models against reference distributions (Commons
 * Math). KS tests with a fixed seed have a fixed p-value; we require p &gt; 0.001, which a correct
 * model fails for 0.1 % of seeds. Means are checked within 5 standard errors (estimated from the
 * sample), a two-sided normal interval that a correct model leaves with probability 6e-7.
 */
class FadingModelsTest {

    private static final int DRAWS = 20_000;

    /**
     * Nakagami-m: |h|² ~ Gamma(m, 1/m) (M. Nakagami, 1960; Simon and Alouini 2005, Eq. 2.21), phase
     * uniform, for m below 1 (boosted Marsaglia-Tsang), at 1, and above 1.
     */
    @Test
    void nakagamiPowerIsGammaAndPhaseUniform() {
        for (double m : new double[] {0.5, 0.75, 1.0, 2.5}) {
            int nr = 2;
            int mt = 2;
            double[] power = new double[DRAWS * nr * mt];
            double[] phase = new double[power.length];
            collect(new NakagamiFading(m), nr, mt, 31, power, phase);
            double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new GammaDistribution(m, 1.0 / m), power);
            assertTrue(p > 0.001, "m = " + m + ": KS p-value of |h|² " + p);
            p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new UniformRealDistribution(-Math.PI, Math.PI), phase);
            assertTrue(p > 0.001, "m = " + m + ": KS p-value of the phase " + p);
            assertMean(1.0, power, "E|h|², m = " + m);
        }
    }

    /**
     * Rician: E|h|² = 1 and E|h|⁴ = (K² + 4K + 2)/(K + 1)², from the amount of fading
     * (1 + 2K)/(1 + K)² (Simon and Alouini 2005, Table 2.1; from memory); the phase of an entry is
     * uniform (the line-of-sight phase is); two entries share the line of sight, so with independent
     * scattering E[h_1·conj(h_2)] = K/(K+1). Given the line-of-sight phase the two entries'
     * magnitudes are independent with a law that does not depend on it, so the pooled powers are
     * independent samples; the phases are not, so only the first entry's phase is tested.
     */
    @Test
    void ricianMomentsAndCommonLineOfSight() {
        for (double k : new double[] {0.0, 1.0, 6.0}) {
            int nr = 1;
            int mt = 2;
            double[] power = new double[DRAWS * 2];
            double[] phase = new double[power.length];
            collect(new RicianFading(k), nr, mt, 32, power, phase);
            assertMean(1.0, power, "E|h|², K = " + k);
            double[] fourth = new double[power.length];
            double[] cross = new double[DRAWS];
            for (int i = 0; i < power.length; i++) {
                fourth[i] = power[i] * power[i];
            }
            assertMean((k * k + 4 * k + 2) / ((k + 1) * (k + 1)), fourth, "E|h|⁴, K = " + k);
            double[] firstPhase = new double[DRAWS];
            for (int i = 0; i < DRAWS; i++) {
                firstPhase[i] = phase[2 * i];
            }
            double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new UniformRealDistribution(-Math.PI, Math.PI),
                    firstPhase);
            assertTrue(p > 0.001, "K = " + k + ": KS p-value of the phase " + p);
            for (int i = 0; i < DRAWS; i++) {
                double a = phase[2 * i] - phase[2 * i + 1];
                cross[i] = Math.sqrt(power[2 * i] * power[2 * i + 1]) * Math.cos(a);
            }
            assertMean(k / (k + 1), cross, "Re E[h_1 conj(h_2)], K = " + k);
        }
    }

    @Test
    void parametersAreChecked() {
        assertEquals("--nakagami-m must be a finite Nakagami m >= 0.5, got 0.4",
                assertThrows(IllegalArgumentException.class, () -> new NakagamiFading(0.4)).getMessage());
        assertEquals("--k-factor must be a finite linear K-factor >= 0, got -1.0",
                assertThrows(IllegalArgumentException.class, () -> new RicianFading(-1)).getMessage());
        assertEquals("--k-factor must be a finite linear K-factor >= 0, got NaN",
                assertThrows(IllegalArgumentException.class, () -> new RicianFading(Double.NaN)).getMessage());
    }

    private static void collect(FadingModel model, int nr, int mt, long seed, double[] power, double[] phase) {
        Draws draws = Draws.of(seed);
        double[] h = new double[2 * nr * mt];
        int n = 0;
        while (n < power.length) {
            model.draw(draws, nr, mt, h);
            for (int e = 0; e < nr * mt; e++, n++) {
                power[n] = h[2 * e] * h[2 * e] + h[2 * e + 1] * h[2 * e + 1];
                phase[n] = Math.atan2(h[2 * e + 1], h[2 * e]);
            }
        }
    }

    private static void assertMean(double expected, double[] values, String what) {
        SummaryStatistics s = new SummaryStatistics();
        for (double v : values) {
            s.addValue(v);
        }
        double error = s.getStandardDeviation() / Math.sqrt(s.getN());
        assertEquals(expected, s.getMean(), 5 * error, what);
    }
}
