package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.junit.jupiter.api.Test;

/**
 * Scaled fades with their likelihood ratio ({@link LinkChannel#fadeScale}): the weighted draws of
 * the scaled law q give the probabilities of the model's own law p, E_q[w·1{‖H‖² < t}] = P_p(‖H‖² < t),
 * checked against the law of ‖H‖² (Commons Math). Tolerance: each estimate is the mean of n
 * independent weighted values; it must lie within 4 of its own standard errors (sample variance) of
 * the exact value (a 4-sigma band, crossed by chance with probability 6e-5; fixed seed).
 */
class ScaledFadesTest {

    private static final int DRAWS = 200_000;

    /** {estimate, standard error} of P_p(‖H‖² < t) from {@code DRAWS} blocks drawn at scale {@code s}. */
    private static double[] weighted(ChannelSpec spec, int nr, int mt, double s, double t) {
        LinkChannel channel = spec.newLinkChannel(nr, mt, 1);
        channel.fadeScale(s);
        Draws draws = Draws.of(20261203L);
        double[] h = new double[2 * nr * mt];
        double sum = 0;
        double squares = 0;
        for (int i = 0; i < DRAWS; i++) {
            channel.startBlock(draws, i, 1);
            channel.trueChannel(0, h);
            double g = 0;
            for (double v : h) {
                g += v * v;
            }
            double x = g < t ? Math.exp(channel.blockLogWeight()) : 0.0;
            sum += x;
            squares += x * x;
        }
        double mean = sum / DRAWS;
        return new double[] {mean, Math.sqrt((squares / DRAWS - mean * mean) / (DRAWS - 1))};
    }

    private static void assertWithin(double exact, double[] estimate, String what) {
        assertTrue(estimate[1] > 0, what);
        assertEquals(exact, estimate[0], 4 * estimate[1], what + ": " + estimate[0] + " ± " + estimate[1]);
    }

    /**
     * I.i.d. Rayleigh 2×2: ‖H‖² is Gamma(4, 1), the sum of four unit exponential powers (M. K.
     * Simon and M.-S. Alouini, Digital Communication over Fading Channels, 2nd ed., 2005, Sec. 2.2.1.1);
     * a deep-fade event of probability about 1e-6.
     */
    @Test
    void rayleighWeightsGiveTheGammaLaw() {
        double t = 0.05;
        double exact = new GammaDistribution(4, 1).cumulativeProbability(t);
        assertWithin(exact, weighted(ChannelSpec.of(Fading.RAYLEIGH), 2, 2, 0.02, t), "rayleigh");
    }

    /**
     * Nakagami-m, m = 2 and m = 0.7, 1×2: each entry's power is Gamma(m, 1/m), so ‖H‖² is
     * Gamma(2m, 1/m) (same reference, Sec. 2.2.1.4).
     */
    @Test
    void nakagamiWeightsGiveTheGammaLaw() {
        for (double m : new double[] {2.0, 0.7}) {
            double t = 0.05;
            double exact = new GammaDistribution(2 * m, 1 / m).cumulativeProbability(t);
            assertWithin(exact, weighted(ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(m), 2, 1, 0.05, t),
                    "nakagami m=" + m);
        }
    }

    /**
     * Rayleigh with receive correlation r (2×2, exponential profile): H = R^{1/2}·W, so ‖H‖² =
     * Σ_i λ_i·X_i with λ = 1 ± r the eigenvalues of R and X_i independent Gamma(Mt, 1) (common
     * practice, no source); its CDF at t is ∫ f_1(x)·F_2(t − x) dx, by quadrature.
     */
    @Test
    void correlatedRayleighWeightsGiveTheLawOfTheCorrelatedGain() {
        double r = 0.7;
        double t = 0.05;
        GammaDistribution first = new GammaDistribution(2, 1 + r);
        GammaDistribution second = new GammaDistribution(2, 1 - r);
        double exact = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-20).integrate(100_000,
                x -> first.density(x) * second.cumulativeProbability(t - x), 0, t);
        assertWithin(exact, weighted(ChannelSpec.of(Fading.RAYLEIGH).withRxCorr(r), 2, 2, 0.02, t), "correlated");
    }

    /** A model without a scaled law refuses, naming itself. */
    @Test
    void ricianCannotDrawScaledFades() {
        LinkChannel channel = ChannelSpec.of(Fading.RICIAN).withKFactor(3).newLinkChannel(2, 2, 1);
        IllegalStateException e = assertThrows(IllegalStateException.class, () -> channel.fadeScale(0.1));
        assertTrue(e.getMessage().contains("rician"), e.getMessage());
    }
}
