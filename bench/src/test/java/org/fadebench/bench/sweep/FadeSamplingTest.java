package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.statistics.distribution.GammaDistribution;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
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
     * γ = ‖H‖²·SNR/(Mt·rate) (our power convention), so FER = E[1 − (1 − P(γ))^n] over ‖H‖² ~
     * Gamma(Nr·Mt, 1), the law of the sum of Nr·Mt independent unit exponential powers (M. K. Simon
     * and M.-S. Alouini, Digital Communication over Fading Channels, 2nd ed., Wiley 2005, Sec. 9.2,
     * MRC in Rayleigh fading; from memory). Computed by Gauss-Legendre quadrature (Commons Math) on
     * geometric pieces of the g axis, where the integrand's mass lies.
     */
    static double closedFormFer(LinkSettings link, double snrDb) {
        int l = link.receiveAntennas() * link.transmitAntennas();
        GammaDistribution gain = GammaDistribution.of(l, 1.0);
        double snr = Math.pow(10, snrDb / 10);
        double perGain = snr / (link.transmitAntennas() * link.code().rate());
        int n = link.symbolsPerFrame();
        UnivariateFunction f = g -> {
            double p = symbolError(link.modulation(), g * perGain);
            return -Math.expm1(n * Math.log1p(-p)) * gain.density(g);
        };
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-30);
        double sum = 0;
        double from = 0;
        for (double to = 1e-6; to < 80; to *= 2) {
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

    /**
     * At FER 1e-7 the estimate's 95 % interval covers the closed form, for 1×2 MRC and Alamouti
     * 2×2, BPSK and QPSK, 256-bit quasi-static frames, and the point stopped on its precision
     * (±20 %) with enough effective error frames. Each check fails by chance with probability
     * about 5 % if the interval is honest; the seed is fixed.
     */
    @Test
    void coversTheClosedFormAtFer1e7() {
        for (SpaceTimeCode code : new SpaceTimeCode[] {SpaceTimeCodes.NONE, SpaceTimeCodes.ALAMOUTI}) {
            for (Modulation mod : new Modulation[] {Modulation.BPSK, Modulation.QPSK}) {
                LinkSettings link = link(mod, code, 2, 256);
                double snrDb = snrDbAt(link, 1e-7);
                double theory = closedFormFer(link, snrDb);
                assertEquals(1e-7, theory, 1e-9);
                PointResult r = fadeSampled(link, snrDb, 20261203L, 4_000_000, 0.2);
                String what = link.describe() + " at " + snrDb + " dB: " + r.counts().fer() + " [" + r.ferLow() + ", "
                        + r.ferHigh() + "], closed form " + theory + ", frames " + r.counts().frames();
                assertTrue(r.ferLow() <= theory && theory <= r.ferHigh(), what);
                assertTrue(r.trusted() && r.ferRelativeHalfWidth() <= 0.2, what);
            }
        }
    }
}
