package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.apache.commons.math3.special.BesselJ;
import org.apache.commons.math3.stat.descriptive.SummaryStatistics;
import org.junit.jupiter.api.Test;

/**
 * The sum-of-sinusoids process against the Clarke/Jakes autocorrelation J0(2π·f_D·T_s·τ) (R. H.
 * Clarke, Bell Syst. Tech. J. 47(6), 1968; W. C. Jakes, Microwave Mobile Communications, 1974),
 * with Commons Math's Bessel function.
 *
 * <p>The model's autocorrelation is J0 as an ensemble average over its random angles and phases
 * (Zheng and Xiao, 2003), not within one realisation. Each fading block is an independent
 * realisation, so we average one time-averaged estimate per block over B blocks and accept a
 * deviation of 5 standard errors, the standard error being the sample standard deviation of the
 * per-block estimates over √B (central limit theorem; a correct generator leaves this two-sided
 * interval with probability 6e-7 per check).
 */
class DopplerFadingTest {

    private static final int BLOCKS = 3_000;
    private static final int SLOTS = 64;
    private static final int MAX_LAG = 40;

    @Test
    void autocorrelationIsBesselJ0() {
        double fd = 0.03;
        int nr = 1;
        int mt = 2;
        DopplerFading process = new DopplerFading(nr, mt, fd, 0.0, null);
        SummaryStatistics[] re = new SummaryStatistics[MAX_LAG + 1];
        SummaryStatistics[] im = new SummaryStatistics[MAX_LAG + 1];
        SummaryStatistics cross = new SummaryStatistics();
        for (int lag = 0; lag <= MAX_LAG; lag++) {
            re[lag] = new SummaryStatistics();
            im[lag] = new SummaryStatistics();
        }
        double[] h = new double[2 * nr * mt * SLOTS];
        Draws draws = Draws.of(41);
        for (int b = 0; b < BLOCKS; b++) {
            process.drawBlock(draws, SLOTS, h);
            for (int lag = 0; lag <= MAX_LAG; lag++) {
                double sr = 0;
                double si = 0;
                int terms = 0;
                for (int e = 0; e < 2; e++) {
                    for (int t = 0; t + lag < SLOTS; t++, terms++) {
                        // h(t + lag) · conj(h(t))
                        double ar = h[4 * (t + lag) + 2 * e];
                        double ai = h[4 * (t + lag) + 2 * e + 1];
                        double br = h[4 * t + 2 * e];
                        double bi = h[4 * t + 2 * e + 1];
                        sr += ar * br + ai * bi;
                        si += ai * br - ar * bi;
                    }
                }
                re[lag].addValue(sr / terms);
                im[lag].addValue(si / terms);
            }
            // the two antennas' generators are independent: E[h_1(t)·conj(h_2(t))] = 0
            double c = 0;
            for (int t = 0; t < SLOTS; t++) {
                c += h[4 * t] * h[4 * t + 2] + h[4 * t + 1] * h[4 * t + 3];
            }
            cross.addValue(c / SLOTS);
        }
        for (int lag = 0; lag <= MAX_LAG; lag++) {
            double target = BesselJ.value(0, 2 * Math.PI * fd * lag);
            assertEquals(target, re[lag].getMean(), 5 * standardError(re[lag]), "Re R(" + lag + ")");
            assertEquals(0.0, im[lag].getMean(), 5 * standardError(im[lag]), "Im R(" + lag + ")");
        }
        assertEquals(0.0, cross.getMean(), 5 * standardError(cross), "cross-correlation of two entries");
    }

    /** Line of sight and correlation keep E|h|² = 1 and the spatial covariance K/(K+1) + R/(K+1). */
    @Test
    void ricianCorrelatedProcessKeepsPowerAndCovariance() {
        double k = 2.0;
        double r = 0.6;
        DopplerFading process = new DopplerFading(2, 1, 0.01, k, KroneckerCorrelation.exponential(2, 1, r, 0.0));
        SummaryStatistics power = new SummaryStatistics();
        SummaryStatistics covariance = new SummaryStatistics();
        double[] h = new double[4 * 8];
        Draws draws = Draws.of(42);
        for (int b = 0; b < BLOCKS; b++) {
            process.drawBlock(draws, 8, h);
            double p = 0;
            double c = 0;
            for (int t = 0; t < 8; t++) {
                p += 0.5 * (h[4 * t] * h[4 * t] + h[4 * t + 1] * h[4 * t + 1]
                        + h[4 * t + 2] * h[4 * t + 2] + h[4 * t + 3] * h[4 * t + 3]);
                c += h[4 * t] * h[4 * t + 2] + h[4 * t + 1] * h[4 * t + 3];
            }
            power.addValue(p / 8);
            covariance.addValue(c / 8);
        }
        assertEquals(1.0, power.getMean(), 5 * standardError(power));
        assertEquals(k / (k + 1) + r / (k + 1), covariance.getMean(), 5 * standardError(covariance));
    }

    /** f_D = 0 gives a constant channel over the block; blocks differ. */
    @Test
    void zeroDopplerIsBlockFading() {
        DopplerFading process = new DopplerFading(2, 2, 0.0, 0.0, null);
        double[] h = new double[8 * 5];
        Draws draws = Draws.of(43);
        process.drawBlock(draws, 5, h);
        double first = h[0];
        for (int s = 1; s < 5; s++) {
            for (int i = 0; i < 8; i++) {
                assertEquals(h[i], h[8 * s + i], 0.0);
            }
        }
        process.drawBlock(draws, 5, h);
        assertEquals(false, first == h[0]);
    }

    @Test
    void parametersAreChecked() {
        assertEquals("--doppler must be a normalised Doppler f_D·T_s in [0, 0.5], got 0.6",
                assertThrows(IllegalArgumentException.class, () -> new DopplerFading(1, 1, 0.6, 0, null)).getMessage());
        assertEquals("correlation is for Nr x Mt = 2 x 2, not 1 x 2",
                assertThrows(IllegalArgumentException.class, () -> new DopplerFading(1, 2, 0.1, 0,
                        KroneckerCorrelation.identity(2, 2))).getMessage());
    }

    /**
     * The per-slot channel: with the same matrix in every slot it gives exactly {@code apply}'s output
     * for the same stream (same noise order); with different matrices and no noise every slot is its
     * own product.
     */
    @Test
    void perSlotChannelMatchesTheBlockChannel() {
        int nr = 3;
        int mt = 2;
        int slots = 6;
        double[] h = new double[2 * nr * mt];
        new RayleighFading().draw(Draws.of(1), nr, mt, h);
        double[] hSlots = new double[h.length * slots];
        for (int s = 0; s < slots; s++) {
            System.arraycopy(h, 0, hSlots, s * h.length, h.length);
        }
        double[] x = new double[2 * mt * (slots + 1)];
        Draws.of(2).fillGaussian(x, 0, x.length, 1.0);
        double[] a = new double[2 * nr * (slots + 2)];
        double[] b = new double[a.length];
        MimoChannel.apply(h, nr, mt, x, 1, slots, 2, 0.3, Draws.of(5), a, 2);
        MimoChannel.applyPerSlot(hSlots, nr, mt, x, 1, slots, 2, 0.3, Draws.of(5), b, 2);
        assertArrayEquals(a, b, 0.0);

        new RayleighFading().draw(Draws.of(3), nr, mt, h);
        System.arraycopy(h, 0, hSlots, 4 * h.length, h.length);
        MimoChannel.applyPerSlot(hSlots, nr, mt, x, 1, slots, 2, 0.0, Draws.of(6), b, 2);
        double[] one = new double[2 * nr];
        MimoChannel.apply(h, nr, mt, x, 5, 1, 0.0, Draws.of(7), one, 0);
        for (int i = 0; i < one.length; i++) {
            assertEquals(one[i], b[2 * nr * 6 + i], 1e-15);
        }
    }

    private static double standardError(SummaryStatistics s) {
        return s.getStandardDeviation() / Math.sqrt(s.getN());
    }
}
