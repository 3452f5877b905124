package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;

/**
 * {@link MimoOutageSimulator} over the new fading models against closed forms. With one receive or
 * transmit antenna the capacity is log2(1 + snr/Mt·‖H‖²_F), so the outage is P(‖H‖²_F &lt; x) with
 * x = Mt·(2^R − 1)/snr (E. Telatar, Eur. Trans. Telecommun. 10(6), 1999). We accept the closed form
 * when it lies in the Monte Carlo's Wilson interval at 99.99 % (E. B. Wilson, J. Amer. Statist.
 * Assoc. 22, 1927).
 */
class OutageOverModelsTest {

    private static final double CONFIDENCE = 0.9999;
    private static final int DRAWS = 40_000;

    private static double threshold(double snrDb, int mt, double rate) {
        return mt * (Math.pow(2, rate) - 1) / Math.pow(10, 0.1 * snrDb);
    }

    private static void assertInInterval(double exact, OutageEstimate e, String what) {
        assertTrue(e.lower(CONFIDENCE) <= exact && exact <= e.upper(CONFIDENCE),
                what + ": closed form " + exact + ", " + e);
    }

    /** Nakagami m = 1 and Rician K = 0 are Rayleigh: OutageBounds' exact value for 2 x 1 and 1 x 3. */
    @Test
    void nakagamiOneAndRicianZeroAreRayleigh() {
        for (int[] link : new int[][] {{2, 1}, {1, 3}}) {
            int mt = link[0];
            int nr = link[1];
            double exact = OutageBounds.mimoOutage(8, nr, mt, 2, 1, 1).probability();
            assertInInterval(exact, new MimoOutageSimulator(new NakagamiFading(1), nr, mt).estimate(8, 2, DRAWS, 61),
                    "Nakagami m=1, " + mt + " x " + nr);
            assertInInterval(exact, new MimoOutageSimulator(new RicianFading(0), nr, mt).estimate(8, 2, DRAWS, 62),
                    "Rician K=0, " + mt + " x " + nr);
        }
    }

    /**
     * Nakagami m, one entry: |h|² ~ Gamma(m, 1/m), so P(|h|² &lt; x) = P(m, m·x), the regularized lower
     * incomplete gamma function (Commons Math); with L independent entries ‖H‖² ~ Gamma(L·m, 1/m).
     */
    @Test
    void nakagamiOutageIsTheGammaDistribution() {
        for (double m : new double[] {0.6, 2.5}) {
            double x = threshold(6, 2, 1.5);
            double exact = Gamma.regularizedGammaP(2 * m, m * x);
            assertInInterval(exact, new MimoOutageSimulator(new NakagamiFading(m), 1, 2).estimate(6, 1.5, DRAWS, 63),
                    "Nakagami m=" + m);
        }
    }

    /**
     * Correlated receive antennas, 1 x 2 with exponential coefficient r: ‖h‖² = λ1·E1 + λ2·E2 with
     * λ = 1 ± r (the eigenvalues of [[1, r], [r, 1]]) and E independent Exp(1), whose distribution is
     * P(‖h‖² &lt; x) = 1 − (λ1·e^{−x/λ1} − λ2·e^{−x/λ2})/(λ1 − λ2) (the hypoexponential law, S. M. Ross,
     * Introduction to Probability Models, Sec. 5.2.4; section number from memory).
     */
    @Test
    void correlatedRayleighOutageIsHypoexponential() {
        double r = 0.8;
        double l1 = 1 + r;
        double l2 = 1 - r;
        double x = threshold(5, 1, 2);
        double exact = 1 - (l1 * Math.exp(-x / l1) - l2 * Math.exp(-x / l2)) / (l1 - l2);
        FadingModel model = new RayleighFading(KroneckerCorrelation.exponential(2, 1, r, 0));
        assertInInterval(exact, new MimoOutageSimulator(model, 2, 1).estimate(5, 2, DRAWS, 64), "rx-corr 0.8");
        // correlation costs diversity: more outage than independent antennas at this rate
        assertTrue(exact > OutageBounds.mimoOutage(5, 2, 1, 2, 1, 1).probability());
    }

    /** A trace in the simulator: outages are counted over its matrices in order, cycling. */
    @Test
    void traceOutageCountsItsMatrices() {
        // |h|² = 4, 0.25, 1, 0.01: at 0 dB and rate 1 (x = 1) only |h|² < 1 is out, 2 of every 4
        double[] m = {2, 0, 0, 0.5, 1, 0, 0, 0.1};
        TraceFading model = new TraceFading(ChannelTrace.of("four", 1, 1, m));
        OutageEstimate e = new MimoOutageSimulator(model, 1, 1).estimate(0, 1, 8, 1);
        assertEquals(4, e.outages());
        assertTrue(model.cycled());
    }
}
