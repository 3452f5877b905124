package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.statistics.distribution.GammaDistribution;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/**
 * Importance sampling of deep fades ({@link Estimator#FADE_SAMPLING}) against the closed form of
 * uncoded quasi-static frames, and its intervals' honesty.
 */
class FadeSamplingTest {

    private static final NormalDistribution NORMAL = NormalDistribution.of(0, 1);

    /** One fade-sampling point: precision {@code relPrecision}, at most {@code maxFrames}. */
    static PointResult fadeSampled(LinkSettings link, double snrDb, long seed, long maxFrames, double relPrecision) {
        StopRules rules = new StopRules(0, maxFrames, 0, 0, Estimator.FADE_SAMPLING, relPrecision);
        return new SweepEngine(link, rules, seed, 2, 0.95).run(new double[] {snrDb}, p -> { }).results().get(0);
    }

    /** Q(x), the standard normal tail. */
    private static double q(double x) {
        return NORMAL.survivalProbability(x);
    }

    /**
     * Symbol error probability at symbol SNR γ = Es/N0 (J. G. Proakis and M. Salehi, Digital
     * Communications, 5th ed., McGraw-Hill 2008, Sec. 4.2 and 4.3): BPSK Q(√(2γ)); Gray QPSK,
     * square 4-QAM, 1 − (1 − Q(√γ))².
     */
    private static double symbolError(Modulation mod, double gamma) {
        if (mod == Modulation.BPSK) {
            return q(Math.sqrt(2 * gamma));
        }
        double p = q(Math.sqrt(gamma));
        return p * (2 - p);
    }

    /**
     * FER of uncoded frames of n symbols in quasi-static Rayleigh fading with an orthogonal code
     * (MRC for one transmit antenna): given H the symbols fail independently at post-combining SNR
     * γ = ‖H‖²·SNR/(Mt·rate) (our power convention), so FER = E[1 − (1 − P(γ))^n] over ‖H‖², the
     * sum of Nr·Mt independent powers: Gamma(Nr·Mt, 1) in Rayleigh fading, Gamma(m·Nr·Mt, 1/m) in
     * Nakagami-m fading (M. K. Simon and M.-S. Alouini, Digital Communication over Fading Channels,
     * 2nd ed., Wiley 2005, Sec. 2.2.1 for the laws, Sec. 9.2 for MRC; section numbers from memory).
     */
    static double closedFormFer(LinkSettings link, double snrDb) {
        return overFades(link, snrDb, g -> 0);
    }

    /**
     * The relative variance per frame of the fade-sampling FER estimate with scale {@code s}, from
     * the same closed form: E_q[(w·1{error})²]/FER² − 1 = E_p[1{error}·w]/FER² − 1, with the
     * weight of a frame of fade energy g = ‖H‖², w = p/q = s^(m·L)·exp(m (1/s − 1) g) (the README's
     * likelihood ratio, L = Nr·Mt).
     */
    static double relativeVariance(LinkSettings link, double snrDb, double s) {
        int l = link.receiveAntennas() * link.transmitAntennas();
        double m = link.channel().model().fadeShape();
        double fer = closedFormFer(link, snrDb);
        return overFades(link, snrDb, g -> m * (l * Math.log(s) + (1 / s - 1) * g)) / (fer * fer) - 1;
    }

    /**
     * E[P(frame error | g)·exp(logFactor(g))] over the law of g = ‖H‖², by Gauss-Legendre quadrature
     * (Commons Math) on geometric pieces of the g axis, where the integrand's mass lies; the factor
     * is taken in logs so that a large weight meets a vanishing error probability as 0, not NaN.
     */
    private static double overFades(LinkSettings link, double snrDb, DoubleUnaryOperator logFactor) {
        int l = link.receiveAntennas() * link.transmitAntennas();
        double m = link.channel().model().fadeShape();
        GammaDistribution gain = GammaDistribution.of(m * l, 1.0 / m);
        double snr = Math.pow(10, snrDb / 10);
        double perGain = snr / (link.transmitAntennas() * link.code().rate());
        int n = link.symbolsPerFrame();
        DoubleUnaryOperator given = g -> {
            double error = -Math.expm1(n * Math.log1p(-symbolError(link.modulation(), g * perGain)));
            double factor = logFactor.applyAsDouble(g);
            return factor == 0 ? error : error == 0 ? 0 : Math.exp(Math.log(error) + factor);
        };
        UnivariateFunction f = g -> given.applyAsDouble(g) * gain.density(g);
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(16, 1e-10, 1e-30);
        // below 1e-6 the density may have a singular derivative (shape < 2): there, over u = F(g)
        double from = 1e-6;
        double sum = integrator.integrate(1_000_000, u -> given.applyAsDouble(gain.inverseCumulativeProbability(u)), 0,
                gain.cumulativeProbability(from));
        for (double to = 2 * from; to < 80; to *= 2) {
            sum += integrator.integrate(1_000_000, f, from, to);
            from = to;
        }
        return sum;
    }

    /** The SNR in dB at which the closed form gives {@code fer}, by bisection. */
    static double snrDbAt(LinkSettings link, double fer) {
        double lo = -10;
        double hi = 80;
        for (int i = 0; i < 60; i++) {
            double mid = 0.5 * (lo + hi);
            if (closedFormFer(link, mid) > fer) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    private static LinkSettings link(Modulation mod, SpaceTimeCode code, int rx, int frameBits) {
        return new LinkSettings(mod, code, rx, code.transmitAntennas(), Fading.RAYLEIGH, frameBits, 0);
    }

    /** At the closed form's FER 1e-7: the ±20 % estimate's interval covers it, with enough effective error frames. */
    private static void assertCoversClosedFormAtFer1e7(LinkSettings link, long seed) {
        double snrDb = snrDbAt(link, 1e-7);
        double theory = closedFormFer(link, snrDb);
        assertEquals(1e-7, theory, 1e-9);
        PointResult r = fadeSampled(link, snrDb, seed, 4_000_000, 0.2);
        String what = link.describe() + " at " + snrDb + " dB: " + r.counts().fer() + " [" + r.ferLow() + ", "
                + r.ferHigh() + "], closed form " + theory + ", frames " + r.counts().frames();
        assertTrue(r.ferLow() <= theory && theory <= r.ferHigh(), what);
        assertTrue(r.trusted() && r.ferRelativeHalfWidth() <= 0.2, what);
    }

    /** Nakagami-m 1×2 MRC, BPSK, 256-bit quasi-static frames, m = 2 and m = 0.7: the same check at FER 1e-7. */
    @Test
    void coversTheNakagamiClosedFormAtFer1e7() {
        for (double m : new double[] {2.0, 0.7}) {
            LinkSettings link = new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, 2, 1,
                    ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(m), 256, 0, Equaliser.MF, FrameCoding.NONE);
            assertCoversClosedFormAtFer1e7(link, 20261204L);
        }
    }

    /**
     * Same seed, same numbers: on 1 and 3 threads, and interrupted then resumed from the states a
     * checkpoint keeps (which hold the weighted sums and the scale; the scale is searched again from
     * the point's pilot streams and must come out the same).
     */
    @Test
    void sameNumbersOnAnyThreadCountAndAfterResume() {
        LinkSettings link = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, 2,
                ChannelSpec.of(Fading.RAYLEIGH).withTxCorr(0.5), 128, 0, Equaliser.MF, FrameCoding.NONE);
        double[] snrDb = {14, 20};
        StopRules rules = new StopRules(0, 200_000, 0, 0, Estimator.FADE_SAMPLING, 0.05);
        List<PointResult> one = new SweepEngine(link, rules, 9, 1, 0.95).run(snrDb, p -> { }).results();
        List<PointResult> three = new SweepEngine(link, rules, 9, 3, 0.95).run(snrDb, p -> { }).results();
        SweepEngine first = new SweepEngine(link, rules, 9, 2, 0.95);
        SweepOutcome cut = first.run(snrDb, r -> first.requestStop());
        assertTrue(cut.interrupted());
        List<PointResult> resumed = new SweepEngine(link, rules, 9, 2, 0.95).run(snrDb, cut.states(), p -> { })
                .results();
        for (List<PointResult> other : List.of(three, resumed)) {
            assertEquals(one.size(), other.size());
            for (int i = 0; i < one.size(); i++) {
                assertEquals(one.get(i).counts().byName(), other.get(i).counts().byName());
                assertEquals(one.get(i).ferHigh(), other.get(i).ferHigh(), 0.0);
            }
        }
        assertTrue(one.get(0).counts().weighted() && one.get(0).counts().fadeScale() < 1);
    }

    /**
     * At FER 1e-7 the estimate's 95 % interval covers the closed form, for 1×2 MRC and Alamouti
     * 2×2, BPSK and QPSK, 256-bit quasi-static frames, and the point stopped on its precision
     * (±20 %) with enough effective error frames. Each check fails by chance with probability
     * about 5 % if the interval is honest; the seed is fixed. History: with the noise order of
     * version 0.2.0 and the cross-entropy scale as frozen scale, seed 20261203 gave Alamouti 2×2
     * QPSK [6.59e-8, 9.87e-8], which misses 1e-7, and the seed was moved to 20261205; a scan of 200
     * seeds (1000 to 1199) then showed that interval too narrow, not unlucky: 166 of 200 covered,
     * every miss below. With the scale widened to twice the cross-entropy one
     * ({@link FadeScaleSearch#WIDEN}) the same seeds cover 189 of 200 (fresh seeds 2000 to 2199:
     * 188), 1×2 QPSK 190 (before 185; fresh seeds 189), in the binomial band 184-196 of an honest
     * 95 % interval, so the check is back on seed 20261203, whose Alamouti 2×2 QPSK interval is
     * now [7.09e-8, 1.05e-7]: this check fails with the cross-entropy scale and passes with the
     * widened one.
     */
    @Test
    void coversTheClosedFormAtFer1e7() {
        for (SpaceTimeCode code : new SpaceTimeCode[] {SpaceTimeCodes.NONE, SpaceTimeCodes.ALAMOUTI}) {
            for (Modulation mod : new Modulation[] {Modulation.BPSK, Modulation.QPSK}) {
                assertCoversClosedFormAtFer1e7(link(mod, code, 2, 256), 20261203L);
            }
        }
    }

    /**
     * The frozen scale is the cross-entropy one widened by {@link FadeScaleSearch#WIDEN}, and that
     * puts it near the least variance of the estimate, computed from the closed form
     * ({@link #relativeVariance}) at the scale the search finds for seed 20261203 at FER 1e-7,
     * 256-bit quasi-static QPSK frames: within 30 % of the least relative variance over the scales
     * s·2^(k/4), k = −4 … 8 (from the cross-entropy scale to 4s), for Alamouti 2×2 and 1×2 MRC;
     * and, for Alamouti 2×2, at least 4 times below the variance at the cross-entropy scale. That
     * variance is the cause of the cross-entropy scale's too narrow intervals: seeds 1000 to 1199
     * covered 166 of 200 at ±20 %, every miss below, while a point stopped after about 1 200
     * frames, far too few to draw the frames that make the variance up. Values for this seed:
     * Alamouti 2×2 s = 0.0193, relative variance 15.1, least 14.2, 285 at s/2; 1×2 2.54, least
     * 2.15, 3.24 at s/2. Deterministic: fixed seed, quadrature.
     */
    @Test
    void frozenScaleIsNearTheLeastVariance() {
        for (SpaceTimeCode code : new SpaceTimeCode[] {SpaceTimeCodes.ALAMOUTI, SpaceTimeCodes.NONE}) {
            LinkSettings link = link(Modulation.QPSK, code, 2, 256);
            double snrDb = snrDbAt(link, 1e-7);
            SweepPlan plan = new SweepPlan(link, new double[] {snrDb}, new StopRules(0, 1000, 0, 0,
                    Estimator.FADE_SAMPLING, 0.2), 20261203L);
            double s = FadeScaleSearch.scale(plan, new LinkChain(link), 0);
            double at = relativeVariance(link, snrDb, s);
            double least = Double.POSITIVE_INFINITY;
            for (int k = -4; k <= 8; k++) {
                least = Math.min(least, relativeVariance(link, snrDb, s * Math.pow(2, k / 4.0)));
            }
            double crossEntropy = relativeVariance(link, snrDb, s / FadeScaleSearch.WIDEN);
            String what = link.describe() + ": s " + s + ", relative variance " + at + ", least " + least
                    + ", at the cross-entropy scale " + crossEntropy;
            assertTrue(at <= 1.3 * least, what);
            assertTrue(code != SpaceTimeCodes.ALAMOUTI || crossEntropy >= 4 * at, what);
        }
    }

    /**
     * Interval honesty: over 200 seeds, 5000 weighted frames each (32-bit BPSK frames, 1×2 MRC, at
     * the closed form's FER 1e-3), the 95 % interval covers the closed form 92 to 98 % of the time.
     * If the true coverage is 95 %, the count of 200 is Binomial(200, 0.95): 92-98 % (184-196) holds
     * it with probability above 0.95 (the binomial law from Commons Statistics, checked below). This
     * seed set covers 189 times (190 with the cross-entropy scale, before it was widened).
     */
    @Test
    void intervalsAreHonest() {
        LinkSettings link = link(Modulation.BPSK, SpaceTimeCodes.NONE, 2, 32);
        double snrDb = snrDbAt(link, 1e-3);
        double theory = closedFormFer(link, snrDb);
        int covered = 0;
        int runs = 200;
        for (int seed = 0; seed < runs; seed++) {
            PointResult r = fadeSampled(link, snrDb, 5000L + seed, 5000, 1e-9);
            assertEquals(5000, r.counts().frames());
            covered += r.ferLow() <= theory && theory <= r.ferHigh() ? 1 : 0;
        }
        var binomial = org.apache.commons.statistics.distribution.BinomialDistribution.of(runs, 0.95);
        double chance = binomial.cumulativeProbability(196) - binomial.cumulativeProbability(183);
        assertTrue(chance > 0.95, "band probability " + chance);
        assertTrue(covered >= 184 && covered <= 196, "covered " + covered + " of " + runs);
    }

    /** A plain Monte Carlo point: {@code minErrors} frame errors. */
    private static PointResult plain(LinkSettings link, double snrDb, long minErrors) {
        return new SweepEngine(link, new StopRules(minErrors, 10_000_000), 77L, 2, 0.95)
                .run(new double[] {snrDb}, p -> { }).results().get(0);
    }

    /**
     * The two estimators agree: |FER_is − FER_mc| ≤ z·√(σ_is² + σ_mc²), each σ its 95 % interval's
     * half-width over 1.96, z = 3.29 (a two-sided test at 0.1 %, normal approximation of both).
     */
    private static void assertAgree(LinkSettings link, double snrDb, long minErrors) {
        PointResult is = fadeSampled(link, snrDb, 31L, 2_000_000, 0.1);
        PointResult mc = plain(link, snrDb, minErrors);
        double sigmaIs = (is.ferHigh() - is.ferLow()) / (2 * 1.96);
        double sigmaMc = (mc.ferHigh() - mc.ferLow()) / (2 * 1.96);
        double diff = Math.abs(is.counts().fer() - mc.counts().fer());
        assertTrue(diff <= 3.29 * Math.hypot(sigmaIs, sigmaMc), link.describe() + " at " + snrDb + " dB: fade sampling "
                + is.counts().fer() + " [" + is.ferLow() + ", " + is.ferHigh() + "], plain " + mc.counts().fer() + " ["
                + mc.ferLow() + ", " + mc.ferHigh() + "]");
        assertTrue(is.trusted());
    }

    /** Uncoded: Alamouti 2×2 QPSK, 128-bit quasi-static frames, at FER about 1e-2 and 1e-3. */
    @Test
    void agreesWithPlainMonteCarloUncoded() {
        LinkSettings link = link(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, 128);
        assertAgree(link, snrDbAt(link, 1e-2), 400);
        assertAgree(link, snrDbAt(link, 1e-3), 200);
    }

    /**
     * Coded: Alamouti 2×2 QPSK with the rate-1/2 convolutional code, 128-bit frames, quasi-static,
     * at 4 and 6 dB (FER about 2e-2 and 4e-3 by a plain run).
     */
    @Test
    void agreesWithPlainMonteCarloCoded() {
        FrameCoding coding = new FrameCoding(new FecScheme(Crc.NONE, PuncturedCode.CONV_R12), Interleaving.RANDOM, 0,
                LlrMethod.MAXLOG);
        LinkSettings link = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, 2, Fading.RAYLEIGH, 128, 0,
                Equaliser.MF, coding);
        assertAgree(link, 4, 300);
        assertAgree(link, 6, 150);
    }
}
