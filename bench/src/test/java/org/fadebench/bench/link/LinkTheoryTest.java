package org.fadebench.bench.link;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.ErrorRates;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/**
 * The whole link against closed forms. Tolerances: an error count from n independent trials with
 * probability p has standard error √(p(1-p)/n); we accept |simulated - theory| ≤ 4.5 standard
 * errors of the theoretical p (a 4.5-sigma band is crossed by chance with probability 7e-6; the
 * seeds are fixed, so each check is deterministic). Where c trials share one channel draw (e.g.
 * the two symbols of an Alamouti block), their errors are dependent; the variance of a sum of c
 * dependent Bernoulli(p) variables is at most c²·p(1-p), so the standard error is widened by √c.
 */
class LinkTheoryTest {

    private static final double Z = 4.5;

    private static FrameCounters simulate(LinkSettings link, double snrDb, long frames) {
        SweepEngine engine = new SweepEngine(link, new StopRules(0, frames), 20261201L, 2, 0.95);
        PointResult r = engine.run(new double[] {snrDb}, p -> { }).results().get(0);
        return r.counts();
    }

    private static void assertRate(double theory, long errors, long trials, int cluster, String what) {
        double sim = (double) errors / trials;
        double se = Math.sqrt(theory * (1 - theory) / trials) * Math.sqrt(cluster);
        assertTrue(errors >= 100, what + ": too few errors (" + errors + ") for a meaningful check");
        assertEquals(theory, sim, Z * se, what + String.format(" sim %.4e theory %.4e (%d/%d)",
                sim, theory, errors, trials));
    }

    private static LinkSettings link(Modulation mod, SpaceTimeCode code, int rx, Fading fading, int frameBits,
                                     int coherence) {
        return new LinkSettings(mod, code, rx, code.transmitAntennas(), fading, frameBits, coherence);
    }

    /** BPSK in AWGN: P_b = Q(√(2 Eb/N0)) (Proakis and Salehi, Digital Communications, 5th ed., Sec. 4.2). */
    @Test
    void bpskAwgn() {
        LinkSettings l = link(Modulation.BPSK, SpaceTimeCodes.NONE, 1, Fading.NONE, 1024, 0);
        for (double snrDb : new double[] {0, 4, 7}) {
            FrameCounters c = simulate(l, snrDb, 1500);
            double theory = ErrorRates.bpskBitErrorRate(Math.pow(10, l.ebN0Db(snrDb) / 10));
            assertRate(theory, c.bitErrors(), c.bits(), 1, "BPSK AWGN " + snrDb + " dB");
        }
    }

    /**
     * Square 16- and 64-QAM symbol error rate in AWGN (Proakis and Salehi, 5th ed., Sec. 4.3):
     * P_s = 1 - (1 - 2(1 - 1/√M) Q(√(3 Es/N0/(M-1))))². SISO, so Es/N0 = SNR.
     */
    @Test
    void squareQamSymbolErrorRate() {
        for (Modulation mod : new Modulation[] {Modulation.QAM16, Modulation.QAM64}) {
            LinkSettings l = link(mod, SpaceTimeCodes.NONE, 1, Fading.NONE, 1536, 0);
            for (double snrDb : new double[] {10, 16, mod == Modulation.QAM16 ? 18 : 22}) {
                FrameCounters c = simulate(l, snrDb, 800);
                double theory = ErrorRates.squareQamSymbolErrorRate(mod.order(), Math.pow(10, snrDb / 10));
                assertRate(theory, c.symbolErrors(), c.symbols(), 1, mod + " SER " + snrDb + " dB");
            }
        }
    }

    /**
     * Gray 16-QAM bit error rate in AWGN, exact (K. Cho and D. Yoon, IEEE Trans. Commun. 50(7),
     * 2002). The bits of one symbol share its noise: clusters of 4.
     */
    @Test
    void grayQamBitErrorRate() {
        LinkSettings l = link(Modulation.QAM16, SpaceTimeCodes.NONE, 1, Fading.NONE, 1024, 0);
        double snrDb = 14;
        FrameCounters c = simulate(l, snrDb, 1500);
        double theory = ErrorRates.squareQamBitErrorRate(16, Math.pow(10, l.ebN0Db(snrDb) / 10));
        assertRate(theory, c.bitErrors(), c.bits(), 4, "16-QAM BER");
    }

    /**
     * 1 x L maximal-ratio combining of BPSK over i.i.d. Rayleigh branches, closed form (Proakis and
     * Salehi, 5th ed., Sec. 13.4). The channel changes every symbol (--coherence 1), so bits are
     * independent and the branch SNR equals the link SNR.
     */
    @Test
    void mrcBpskRayleigh() {
        for (int l = 1; l <= 4; l *= 2) {
            LinkSettings s = link(Modulation.BPSK, SpaceTimeCodes.NONE, l, Fading.RAYLEIGH, 512, 1);
            for (double snrDb : new double[] {0, l == 4 ? 4 : 8}) {
                FrameCounters c = simulate(s, snrDb, 1000);
                double theory = ErrorRates.rayleighMrcBpskBitErrorRate(l, Math.pow(10, snrDb / 10));
                assertRate(theory, c.bitErrors(), c.bits(), 1, "1x" + l + " MRC at " + snrDb + " dB");
            }
        }
    }

    /**
     * Alamouti 2 x Nr equals 1 x 2Nr maximal-ratio combining 3 dB later (S. M. Alamouti, IEEE JSAC
     * 16(8), 1998, Sec. IV): BPSK BER of Alamouti at SNR equals the MRC closed form with 2·Nr
     * branches at SNR/2. The channel changes every code block (--coherence 2); the two symbols of
     * a block share it: clusters of 2.
     */
    @Test
    void alamoutiEqualsMrcThreeDbLater() {
        for (int nr = 1; nr <= 2; nr++) {
            LinkSettings s = link(Modulation.BPSK, SpaceTimeCodes.ALAMOUTI, nr, Fading.RAYLEIGH, 512, 2);
            for (double snrDb : new double[] {3, 9}) {
                FrameCounters c = simulate(s, snrDb, nr == 2 ? 4000 : 1000);
                double theory = ErrorRates.rayleighMrcBpskBitErrorRate(2 * nr, Math.pow(10, snrDb / 10) / 2);
                assertRate(theory, c.bitErrors(), c.bits(), 2, "Alamouti 2x" + nr + " at " + snrDb + " dB");
            }
        }
    }

    /** Same as above with QPSK: Gray QPSK is two BPSK streams at half the symbol energy each. */
    @Test
    void alamoutiQpskEqualsMrcOfBpskPerBit() {
        LinkSettings s = link(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, Fading.RAYLEIGH, 512, 2);
        double snrDb = 10;
        FrameCounters c = simulate(s, snrDb, 1000);
        // per-bit SNR on each branch: (SNR/2 per antenna pair) / 2 bits per QPSK symbol
        double theory = ErrorRates.rayleighMrcBpskBitErrorRate(2, Math.pow(10, snrDb / 10) / 4);
        assertRate(theory, c.bitErrors(), c.bits(), 4, "Alamouti 2x1 QPSK");
    }

    /**
     * Every orthogonal design with Mt x Nr antennas equals Mt·Nr-branch MRC at the per-symbol SNR
     * SNR/(Mt·rate) (V. Tarokh, H. Jafarkhani and A. R. Calderbank, IEEE Trans. Inf. Theory 45(5),
     * 1999: orthogonal designs decouple into single-symbol detection with gain ‖H‖²_F; MRC closed
     * form from Proakis and Salehi, 5th ed., Sec. 13.4). BPSK, one channel per code block
     * (--coherence T); the K symbols of a block share it: clusters of K.
     */
    @org.junit.jupiter.params.ParameterizedTest(name = "{0} {2}x{1} at {3} dB")
    @org.junit.jupiter.params.provider.CsvSource({
        "g3, 1, 3, 3", "g3, 1, 3, 6", "g4, 1, 4, 3", "g4, 1, 4, 6", "h3, 1, 3, 6", "h4, 1, 4, 6",
        "r12-8, 1, 8, 3", "g4, 2, 4, 0", "h3, 2, 3, 3"})
    void orthogonalDesignsEqualMrc(String name, int nr, int mt, double snrDb) {
        SpaceTimeCode code = SpaceTimeCodes.byName(name);
        LinkSettings s = link(Modulation.BPSK, code, nr, Fading.RAYLEIGH,
                code.symbolsPerBlock() * 64, code.slotsPerBlock());
        FrameCounters c = simulate(s, snrDb, 8000);
        double theory = ErrorRates.rayleighMrcBpskBitErrorRate(mt * nr, Math.pow(10, snrDb / 10) / (mt * code.rate()));
        assertRate(theory, c.bitErrors(), c.bits(), code.symbolsPerBlock(), s.describe());
    }

    /**
     * High-SNR slope of the FER in quasi-static fading: about one decade per 10 dB with one
     * branch and two decades with 1x2 MRC or Alamouti 2x1 (common practice, no source). Between
     * 15 and 25 dB the curves are close to their asymptotes (bias below 0.1 decade); with 150
     * errors per point the slope's standard error is about 0.05 decade, so we allow 0.25.
     */
    @Test
    void diversitySlopes() {
        assertSlope(link(Modulation.BPSK, SpaceTimeCodes.NONE, 1, Fading.RAYLEIGH, 32, 0), 1);
        assertSlope(link(Modulation.BPSK, SpaceTimeCodes.NONE, 2, Fading.RAYLEIGH, 32, 0), 2);
        assertSlope(link(Modulation.BPSK, SpaceTimeCodes.ALAMOUTI, 1, Fading.RAYLEIGH, 32, 0), 2);
    }

    /**
     * G4 with one receive antenna reaches diversity Mt·Nr = 4 (common practice, no source): the
     * FER falls four decades per 10 dB. Frames of one code block (4 BPSK symbols), measured
     * between 10 and 14 dB: with 150 errors per point the standard error of the slope is about
     * 0.13 decade per 10 dB (0.434/√150 per point, times √2, times 2.5), and the curve there is
     * still about 0.3 below its asymptote (a pre-asymptotic bias seen in longer runs, 3.8 between
     * 12 and 16 dB), so we allow the bias plus three standard errors, 0.7.
     */
    @Test
    void g4DiversityFour() {
        LinkSettings l = link(Modulation.BPSK, SpaceTimeCodes.G4, 1, Fading.RAYLEIGH, 4, 0);
        SweepEngine engine = new SweepEngine(l, new StopRules(150, 40_000_000, 0, 0), 7, 2, 0.95);
        var r = engine.run(new double[] {10, 14}, p -> { }).results();
        double decadesPer10Db = 2.5 * Math.log10(r.get(0).counts().fer() / r.get(1).counts().fer());
        assertEquals(4, decadesPer10Db, 0.7, l.describe());
    }

    private static void assertSlope(LinkSettings l, int diversity) {
        SweepEngine engine = new SweepEngine(l, new StopRules(150, 20_000_000), 7, 2, 0.95);
        var r = engine.run(new double[] {15, 25}, p -> { }).results();
        double slope = Math.log10(r.get(0).counts().fer() / r.get(1).counts().fer());
        assertEquals(diversity, slope, 0.25, l.describe());
    }
}
