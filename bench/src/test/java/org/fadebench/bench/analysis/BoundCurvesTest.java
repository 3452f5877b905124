package org.fadebench.bench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.apache.commons.math3.util.CombinatoricsUtils;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Fading;
import org.fadebench.channel.MimoOutageSimulator;
import org.fadebench.channel.OutageEstimate;
import org.fadebench.channel.RayleighFading;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation.Kind;
import org.junit.jupiter.api.Test;

class BoundCurvesTest {

    private static BoundSettings settings(int nr, int mt, double codeRate, Modulation mod, double rate) {
        return new BoundSettings(nr, mt, codeRate, mod, rate, Kind.CODED_MODULATION, 20_000, 5L, null, null);
    }

    private static double linear(double snrDb) {
        return Math.pow(10.0, snrDb / 10.0);
    }

    /**
     * SISO Rayleigh outage p_out = 1 − exp(−(2^R−1)/SNR) (D. Tse and P. Viswanath, Fundamentals of
     * Wireless Communication, 2005, Sec. 5.4.1; section from memory), for every bound that reduces
     * to it: the MIMO bound (1x1, exact) and the STBC bound without a code (r = 1).
     */
    @Test
    void sisoOutageMatchesClosedForm() {
        double rate = 2.0;
        BoundCurves c = BoundCurves.compute(settings(1, 1, 1.0, Modulation.QPSK, rate), new double[] {0, 5, 10, 20});
        for (BoundPoint p : c.points()) {
            double expected = -Math.expm1(-(Math.pow(2, rate) - 1) / linear(p.snrDb()));
            assertEquals(expected, p.value(Bound.MIMO), 1e-12 * expected, "mimo at " + p.snrDb());
            assertEquals(expected, p.value(Bound.STBC), 1e-12 * expected, "stbc at " + p.snrDb());
            assertTrue(p.mimo().isExact());
            assertEquals(p.value(Bound.MIMO), p.mimo().lower());
            assertEquals(p.value(Bound.MIMO), p.mimo().upper());
        }
    }

    /**
     * High-SNR asymptotes (Tse and Viswanath 2005, ch. 5): SISO p_out ≈ (2^R−1)/SNR and, with L-fold
     * diversity, p_out ≈ (2^R−1)^L / (L!·SNR^L). Our bound is P(L, x), the regularized lower
     * incomplete gamma function at x = Mt·r·(2^(R/r)−1)/SNR (the SNR split over Mt antennas and the
     * symbol rate r; Mt = r = 1 gives the book's x). Its series P(L, x) = x^L e^(−x) Σ_k x^k/(L+k)!
     * (M. Abramowitz and I. Stegun, Handbook of Mathematical Functions, 1964, 6.5.29; from memory)
     * puts the ratio P(L, x)·L!/x^L between e^(−x) and 1, which is the tolerance checked.
     */
    @Test
    void highSnrAsymptoteIsLFoldDiversity() {
        double rate = 2.0;
        double snrDb = 30.0;
        int[][] links = {{1, 1}, {1, 3}, {2, 1}, {2, 2}};
        for (int[] l : links) {
            int mt = l[0];
            int nr = l[1];
            int order = mt * nr;
            BoundSettings s = settings(nr, mt, 1.0, Modulation.QPSK, rate);
            double x = mt * (Math.pow(2, rate) - 1) / linear(snrDb);
            double asymptote = Math.pow(x, order) / CombinatoricsUtils.factorialDouble(order);
            double ratio = s.stbcOutage(snrDb) / asymptote;
            assertTrue(ratio <= 1.0 && ratio >= Math.exp(-x), mt + "x" + nr + ": ratio " + ratio);
        }
    }

    /**
     * Alamouti's code has the outage of the 2x1 Gaussian MISO channel (S. Sandhu and A. Paulraj,
     * "Space-time block codes: a capacity perspective", IEEE Commun. Letters 4(12), 2000), and loses
     * to the MIMO channel with two or more receive antennas. The MISO and MIMO references here are
     * the general Monte Carlo log-det count (not the closed form our bound uses); 200 000 draws,
     * fixed seed, compared against the 99.9 % Wilson interval.
     */
    @Test
    void alamoutiMatchesMisoAndLosesToMimo() {
        double rate = 2.0;
        double snrDb = 10.0;
        BoundSettings alamouti = BoundSettings.of(link(Modulation.QPSK, 1)).withSpectralEfficiency(rate);
        OutageEstimate miso = new MimoOutageSimulator(new RayleighFading(), 1, 2).estimate(snrDb, rate, 200_000, 11L);
        double stbc = alamouti.stbcOutage(snrDb);
        assertTrue(stbc >= miso.lower(0.999) && stbc <= miso.upper(0.999), "Alamouti " + stbc + " vs " + miso);

        BoundSettings twoByTwo = BoundSettings.of(link(Modulation.QPSK, 2)).withSpectralEfficiency(rate);
        OutageEstimate mimo = twoByTwo.mimoOutage(snrDb);
        assertFalse(mimo.isExact());
        assertTrue(twoByTwo.stbcOutage(snrDb) > mimo.upper(0.999), "Alamouti 2x2 should lose to 2x2 MIMO: "
                + twoByTwo.stbcOutage(snrDb) + " vs " + mimo);
    }

    /**
     * A finite alphabet carries at most what Gaussian symbols carry, I_CM(γ) ≤ log2(1+γ), and BICM
     * at most what coded modulation carries (G. Caire, G. Taricco and E. Biglieri, "Bit-interleaved
     * coded modulation", IEEE Trans. Inf. Theory 44(3), 1998): so Gaussian ≤ CM ≤ BICM outage.
     * At R ≥ r·log2 M no channel state carries R: the QAM bound is 1.
     */
    @Test
    void qamBoundOrdering() {
        BoundSettings cm = settings(1, 2, 1.0, Modulation.QAM16, 3.0);
        BoundSettings bicm = cm.withInformation(Kind.BICM);
        for (double snrDb : new double[] {5, 10, 15, 20, 25}) {
            double gauss = cm.stbcOutage(snrDb);
            double qam = cm.qamOutage(snrDb);
            assertTrue(gauss < qam && qam < 1.0, snrDb + " dB: gaussian " + gauss + ", CM " + qam);
            assertTrue(qam <= bicm.qamOutage(snrDb), snrDb + " dB: CM " + qam + " > BICM " + bicm.qamOutage(snrDb));
        }
        BoundSettings full = cm.withSpectralEfficiency(cm.qamLimit());
        assertEquals(4.0, full.qamLimit());
        assertEquals(1.0, full.qamOutage(40.0));
    }

    @Test
    void settingsFollowTheLink() {
        BoundSettings s = BoundSettings.of(link(Modulation.QAM16, 2));
        assertEquals(2, s.transmitAntennas());
        assertEquals(2, s.receiveAntennas());
        assertEquals(1.0, s.codeRate());
        assertEquals(4.0, s.spectralEfficiency());
        assertEquals(Kind.CODED_MODULATION, s.information());
        assertEquals(BoundSettings.DEFAULT_MIMO_DRAWS, s.mimoDraws());
        assertFalse(s.mimoExact());
    }

    /** The Monte Carlo MIMO curve: a count with its interval, reproducible, never rising (shared draws). */
    @Test
    void monteCarloCurveIsCountedAndMonotone() {
        BoundSettings s = settings(2, 2, 1.0, Modulation.QPSK, 2.0);
        double[] snrDb = {12, 0, 4, 8};
        BoundCurves a = BoundCurves.compute(s, snrDb);
        BoundCurves b = BoundCurves.compute(s, snrDb);
        assertEquals(a, b);
        List<BoundPoint> p = a.points();
        assertEquals(12.0, p.get(0).snrDb());
        for (BoundPoint q : p) {
            assertEquals(20_000, q.mimo().draws());
            assertEquals((double) q.mimo().outages() / q.mimo().draws(), q.value(Bound.MIMO));
            assertTrue(q.mimo().lower() < q.value(Bound.MIMO) && q.value(Bound.MIMO) < q.mimo().upper(), q.toString());
        }
        double[] mimo = a.values(Bound.MIMO);
        assertTrue(mimo[1] >= mimo[2] && mimo[2] >= mimo[3] && mimo[3] >= mimo[0], java.util.Arrays.toString(mimo));
    }

    @Test
    void badInputIsNamed() {
        assertMessage(() -> settings(1, 0, 1.0, Modulation.QPSK, 1.0), "transmit antennas must be in 1..64, got 0");
        assertMessage(() -> settings(65, 1, 1.0, Modulation.QPSK, 1.0), "receive antennas must be in 1..64, got 65");
        assertMessage(() -> settings(1, 1, 1.5, Modulation.QPSK, 1.0), "code rate K/T must be in (0, 1], got 1.5");
        assertMessage(() -> settings(1, 1, 1.0, Modulation.QPSK, 0.0), "spectral efficiency R must be");
        assertMessage(() -> settings(1, 1, 1.0, Modulation.QPSK, Double.NaN), "got NaN");
        assertMessage(() -> settings(1, 1, 1.0, Modulation.QPSK, 1.0).withMimoDraws(0, 1L),
                "MIMO outage draws must be >= 1, got 0");
        BoundSettings ok = settings(1, 1, 1.0, Modulation.QPSK, 1.0);
        assertMessage(() -> BoundCurves.compute(ok, new double[0]), "need at least one SNR point");
        assertMessage(() -> BoundCurves.compute(ok, new double[] {1, Double.POSITIVE_INFINITY}),
                "SNR points must be finite numbers of dB, got Infinity");
    }

    static void assertMessage(Runnable call, String expected) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call::run);
        assertTrue(e.getMessage().contains(expected), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), e.getMessage());
    }

    static LinkSettings link(Modulation mod, int nr) {
        return new LinkSettings(mod, SpaceTimeCodes.ALAMOUTI, nr, 2, Fading.RAYLEIGH, 64 * mod.bitsPerSymbol(), 0);
    }

    /**
     * Over another fading model the bounds are Monte Carlo: Nakagami m = 1 is Rayleigh (Simon and
     * Alouini, 2005, ch. 2), so its empirical code bound matches the Gamma closed form within the
     * counting error (4.5 binomial standard errors of 20 000 draws), and the MIMO bound is counted.
     * A Rician channel with K = 5 has a steeper outage curve than Rayleigh at high SNR: lower
     * outage at 20 dB (its gain varies less).
     */
    @Test
    void boundsOverOtherChannels() {
        BoundSettings rayleigh = settings(1, 2, 1.0, Modulation.QPSK, 2.0);
        BoundSettings nakagami = rayleigh.withChannel(
                org.fadebench.channel.ChannelSpec.of(org.fadebench.channel.Fading.NAKAGAMI).withNakagamiM(1));
        assertFalse(nakagami.mimoExact());
        for (double snrDb : new double[] {5, 10, 15}) {
            double exact = rayleigh.stbcOutage(snrDb);
            double mc = nakagami.stbcOutage(snrDb);
            assertEquals(exact, mc, 4.5 * Math.sqrt(exact * (1 - exact) / 20_000) + 1e-12, snrDb + " dB");
        }
        BoundSettings rician = rayleigh.withChannel(
                org.fadebench.channel.ChannelSpec.of(org.fadebench.channel.Fading.RICIAN).withKFactor(5));
        assertTrue(rician.stbcOutage(20) < rayleigh.stbcOutage(20) / 2);
        assertTrue(rician.mimoOutage(20).draws() == 20_000);
        assertThrows(IllegalArgumentException.class, () -> rayleigh.withChannel(
                org.fadebench.channel.ChannelSpec.of(org.fadebench.channel.Fading.RAYLEIGH).withDoppler(0.01)));
    }
}
