package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

/**
 * {@link BlockFadingOutage} against a numerical integral. For a single antenna over i.i.d.
 * Rayleigh fading the block SNRs γ_f = snr·|h_f|² are independent Exp(snr), and the frame is in
 * outage when Σ_f w_f·log2(1 + γ_f) < R (R. Knopp and P. A. Humblet, "On coding for block fading
 * channels", IEEE Trans. Inf. Theory 46(1), 2000). For two blocks of shares a and 1 − a this is
 * (1 + γ_1)^a·(1 + γ_2)^(1−a) < 2^R, so
 * <pre>  P = ∫_0^{2^(R/a)−1} (1/snr)·e^(−x/snr)·(1 − exp(−((2^R/(1+x)^a)^(1/(1−a)) − 1)/snr)) dx,</pre>
 * derived here from that definition and integrated with Commons Math's
 * {@code IterativeLegendreGaussIntegrator}. The Monte Carlo count must hold the integral within its
 * Wilson interval at 99.99 % (E. B. Wilson, J. Amer. Statist. Assoc. 22, 1927).
 */
class BlockFadingOutageTest {

    private static final double CONFIDENCE = 0.9999;
    private static final int FRAMES = 60_000;

    /** The integral above for block shares a and 1 − a. */
    private static double twoBlockSiso(double snrDb, double rate, double a) {
        double snr = Math.pow(10, 0.1 * snrDb);
        double top = Math.pow(2, rate / a) - 1;
        DoubleUnaryOperator second = x -> Math.pow(Math.pow(2, rate) / Math.pow(1 + x, a), 1 / (1 - a)) - 1;
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(16, 1e-9, 1e-12);
        return integrator.integrate(1_000_000, x -> Math.exp(-x / snr) / snr
                * -Math.expm1(-Math.max(0.0, second.applyAsDouble(x)) / snr), 0, top);
    }

    private static void assertInInterval(double exact, OutageEstimate e, String what) {
        assertTrue(e.lower(CONFIDENCE) <= exact && exact <= e.upper(CONFIDENCE),
                what + ": integral " + exact + ", " + e);
    }

    @Test
    void twoEqualBlocksMatchTheIntegral() {
        for (double[] point : new double[][] {{5, 1}, {10, 2}, {15, 3}}) {
            double exact = twoBlockSiso(point[0], point[1], 0.5);
            BlockFadingOutage.Estimates e = new BlockFadingOutage(new RayleighFading(), 1, 1, 2, 1)
                    .estimate(point[0], point[1], 1.0, g -> 0, 1, FRAMES, 7, () -> false);
            assertInInterval(exact, e.mimo(), "MIMO 1x1 at " + point[0] + " dB, R = " + point[1]);
            assertEquals(e.mimo().outages(), e.stbc().outages(), "one antenna, r = 1: the same information");
            // the block-fading outage is far below the quasi-static one, 1 − exp(−(2^R − 1)/snr)
            double quasiStatic = -Math.expm1(-(Math.pow(2, point[1]) - 1) / Math.pow(10, 0.1 * point[0]));
            assertTrue(e.mimo().upper() < quasiStatic, e.mimo() + " vs " + quasiStatic);
        }
    }

    /** Three slots in blocks of two: the last block is one slot, so the shares are 2/3 and 1/3. */
    @Test
    void aShorterLastBlockWeighsLess() {
        BlockFadingOutage outage = new BlockFadingOutage(new RayleighFading(), 1, 1, 3, 2);
        assertEquals(2, outage.blocks());
        double exact = twoBlockSiso(8, 1.5, 2.0 / 3);
        assertInInterval(exact, outage.estimate(8, 1.5, 1.0, g -> 0, 1, FRAMES, 8, () -> false).mimo(),
                "shares 2/3, 1/3");
        double equalShares = twoBlockSiso(8, 1.5, 0.5);
        assertTrue(Math.abs(exact - equalShares) > 0.01, exact + " vs " + equalShares + ": the shares matter");
    }

    /** A finite alphabet carries less than Gaussian symbols on every block: never fewer outages. */
    @Test
    void alphabetBoundIsAboveTheGaussianOneOnTheSameDraws() {
        DoubleUnaryOperator bpsk = g -> Math.min(1.0, Math.log1p(g) / Math.log(2)) * 0.9;
        BlockFadingOutage outage = new BlockFadingOutage(new RayleighFading(), 1, 2, 16, 4);
        BlockFadingOutage.Estimates e = outage.estimate(6, 0.5, 1.0, bpsk, 1.0, 20_000, 3, () -> false);
        assertTrue(e.qam().outages() >= e.stbc().outages(), e.toString());
        assertTrue(outage.estimate(6, 1.0, 1.0, bpsk, 1.0, 10, 3, () -> false).qam().isExact());
        assertEquals(1.0, outage.estimate(6, 1.0, 1.0, bpsk, 1.0, 10, 3, () -> false).qam().probability());
    }

    /** A stop request ends the count at the next frame. */
    @Test
    void stopsPromptly() {
        AtomicInteger polls = new AtomicInteger();
        BlockFadingOutage outage = new BlockFadingOutage(new RayleighFading(), 2, 2, 64, 8);
        assertThrows(CancellationException.class, () -> outage.estimate(10, 4, 1.0, g -> 0, 2, 100_000_000, 1,
                () -> polls.incrementAndGet() > 5));
        assertEquals(6, polls.get());
        AtomicInteger mimoPolls = new AtomicInteger();
        assertThrows(CancellationException.class, () -> new MimoOutageSimulator(new RayleighFading(), 2, 2)
                .estimate(10, 4, 100_000_000, 1, () -> mimoPolls.incrementAndGet() > 2));
        assertEquals(3, mimoPolls.get());
    }

    /** A count of no outages is not resolved; an exact value always is. */
    @Test
    void resolution() {
        assertTrue(!OutageEstimate.counted(0, 1000).resolved());
        assertTrue(!OutageEstimate.counted(3, 1000).resolved());
        assertTrue(OutageEstimate.counted(100, 1000).resolved());
        assertTrue(OutageEstimate.exact(0.0).resolved());
    }
}
