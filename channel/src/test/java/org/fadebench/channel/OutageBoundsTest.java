package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.util.CombinatoricsUtils;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;

class OutageBoundsTest {

    private static final double LN2 = Math.log(2);

    private static double fromDb(double db) {
        return Math.pow(10, 0.1 * db);
    }

    /**
     * P(‖H‖² < x) for ‖H‖² a sum of L i.i.d. Exp(1) powers, the Erlang distribution (chi-square
     * with 2L degrees of freedom; common practice, e.g. J. G. Proakis and M. Salehi, Digital
     * Communications, 5th ed., 2008, Sec. 2.3, section from memory): 1 − e^(−x) Σ_{k<L} x^k/k!,
     * summed as the tail e^(−x) Σ_{k≥L} x^k/k! when x ≤ L so that small values keep their
     * precision. Summed directly here, independent of Commons Math.
     */
    private static double erlangCdf(int branches, double x) {
        double term = Math.exp(-x);
        double sum = 0;
        if (x > branches) {
            for (int k = 0; k < branches; k++) {
                sum += term;
                term *= x / (k + 1);
            }
            return 1 - sum;
        }
        for (int k = 1; k <= branches; k++) {
            term *= x / k;
        }
        for (int k = branches; term > 1e-18 * sum; k++) {
            sum += term;
            term *= x / (k + 1);
        }
        return sum;
    }

    /**
     * SISO Rayleigh: P_out = 1 − exp(−(2^R − 1)/SNR), D. Tse and P. Viswanath, Fundamentals of
     * Wireless Communication, 2005, Sec. 5.4.1 (eq. (5.57); equation number from memory).
     */
    @Test
    void sisoMatchesTseViswanath() {
        for (double r : new double[] {0.25, 1, 2, 4, 8}) {
            for (double db = -10; db <= 40; db += 5) {
                double expected = -Math.expm1(-(Math.pow(2, r) - 1) / fromDb(db));
                double stbc = OutageBounds.stbcOutage(db, 1, 1, 1.0, r);
                OutageEstimate mimo = OutageBounds.mimoOutage(db, 1, 1, r, 1, 0);
                assertEquals(expected, stbc, 1e-12 * expected, "R=" + r + " at " + db + " dB");
                assertTrue(mimo.isExact());
                assertEquals(stbc, mimo.probability(), 0.0);
            }
        }
    }

    /**
     * SIMO, MISO and rate-r codes: P(L, x) with x = (2^(R/r) − 1)·Mt·r/SNR equals the Erlang CDF
     * summed independently.
     */
    @Test
    void diversityBranchesFollowErlang() {
        int[][] shapes = {{1, 2}, {1, 4}, {2, 1}, {4, 1}, {2, 2}, {4, 3}};
        double[] rates = {1.0, 1.0, 1.0, 0.5, 1.0, 0.75};
        for (int s = 0; s < shapes.length; s++) {
            int mt = shapes[s][0];
            int nr = shapes[s][1];
            double rate = rates[s];
            for (double bits : new double[] {0.5, 2, 6}) {
                for (double db = -5; db <= 40; db += 5) {
                    double x = Math.expm1(bits / rate * LN2) * mt * rate / fromDb(db);
                    double expected = erlangCdf(mt * nr, x);
                    double actual = OutageBounds.stbcOutage(db, nr, mt, rate, bits);
                    assertEquals(expected, actual, 1e-11 * expected, mt + "x" + nr + " r=" + rate + " R=" + bits
                            + " at " + db + " dB");
                }
            }
        }
    }

    /**
     * High SNR, L = Mt·Nr-fold diversity: P(L, x) = e^(−x) Σ_{k≥0} x^(L+k)/(L+k)! (M. Abramowitz
     * and I. A. Stegun, Handbook of Mathematical Functions, 1964, eq. 6.5.29; from memory), and
     * (L+k)! ≥ L!·k! gives e^(−x) ≤ P·L!/x^L ≤ 1, i.e. P ≈ ((2^R − 1)·Mt)^L / (L!·SNR^L) with
     * relative error below x = (2^R − 1)·Mt/SNR; the outage falls by L decades per 10 dB (Tse and
     * Viswanath 2005, Sec. 3.1 and 5.4; from memory).
     */
    @Test
    void highSnrDiversityOrder() {
        int[][] shapes = {{1, 1}, {1, 2}, {2, 1}, {2, 2}, {1, 6}, {4, 2}};
        double bits = 2;
        for (int[] shape : shapes) {
            int mt = shape[0];
            int l = mt * shape[1];
            for (double db = 20; db <= 60; db += 10) {
                double x = (Math.pow(2, bits) - 1) * mt / fromDb(db);
                double ratio = OutageBounds.stbcOutage(db, shape[1], mt, 1.0, bits)
                        * CombinatoricsUtils.factorialDouble(l) / Math.pow(x, l);
                assertTrue(ratio <= 1 + 1e-12 && ratio >= Math.exp(-x) - 1e-12,
                        mt + "x" + shape[1] + " at " + db + " dB: ratio " + ratio);
            }
            double slope = Math.log10(OutageBounds.stbcOutage(50, shape[1], mt, 1.0, bits))
                    - Math.log10(OutageBounds.stbcOutage(40, shape[1], mt, 1.0, bits));
            assertEquals(-l, slope, 1e-3, "decades per 10 dB for L = " + l);
        }
    }

    /**
     * The rate factor of a rate-1/2 code on 4 x 2 against an independent Monte Carlo count in the
     * test (java.util.SplittableRandom Gaussians, not the project's stream): the closed form lies
     * inside the 99.9 % Wilson interval of the count.
     */
    @Test
    void halfRateCodeMatchesDirectCount() {
        int mt = 4;
        int nr = 2;
        double rate = 0.5;
        double bits = 2;
        SplittableRandom random = new SplittableRandom(20240601L);
        for (double db : new double[] {6, 9}) {
            double snr = fromDb(db);
            int draws = 40_000;
            int outages = 0;
            for (int i = 0; i < draws; i++) {
                double norm = 0;
                for (int e = 0; e < 2 * mt * nr; e++) {
                    double g = random.nextGaussian();
                    norm += 0.5 * g * g;
                }
                if (rate * Math.log1p(snr * norm / (mt * rate)) / LN2 < bits) {
                    outages++;
                }
            }
            OutageEstimate count = OutageEstimate.counted(outages, draws);
            double closed = OutageBounds.stbcOutage(db, nr, mt, rate, bits);
            assertTrue(count.lower(0.999) <= closed && closed <= count.upper(0.999), count + " vs " + closed);
        }
    }

    /** With the Gaussian input's own curve log2(1 + γ) the alphabet form reproduces the closed form. */
    @Test
    void alphabetFormWithGaussianCurveIsTheClosedForm() {
        DoubleUnaryOperator gaussian = g -> Math.log1p(g) / LN2;
        for (double bits : new double[] {0.1, 1, 3, 7}) {
            for (double db = -10; db <= 30; db += 10) {
                double closed = OutageBounds.stbcOutage(db, 2, 2, 1.0, bits);
                double viaCurve = OutageBounds.stbcOutage(db, 2, 2, 1.0, bits, gaussian, Double.POSITIVE_INFINITY);
                assertEquals(closed, viaCurve, 1e-9 * closed, "R=" + bits + " at " + db + " dB");
            }
        }
    }

    /**
     * BPSK information on the complex AWGN channel at symbol SNR γ, computed here by Commons Math
     * integration: I = 1 − E[log2(1 + e^(−Λ))] with Λ = 2y/σ² the log-likelihood ratio of y = 1 + n,
     * n ~ N(0, σ² = 1/(2γ)) (common practice, no source).
     */
    private static double bpskBits(double snr) {
        double sigma = Math.sqrt(0.5 / snr);
        DoubleUnaryOperator softplus = z -> z > 0 ? Math.log1p(Math.exp(-z)) : -z + Math.log1p(Math.exp(z));
        double loss = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-14).integrate(1_000_000,
                n -> Math.exp(-0.5 * n * n / (sigma * sigma)) / (sigma * Math.sqrt(2 * Math.PI))
                        * softplus.applyAsDouble(2 * (1 + n) / (sigma * sigma)),
                -12 * sigma, 12 * sigma);
        return 1 - loss / LN2;
    }

    /**
     * A finite alphabet cannot beat Gaussian symbols (the Gaussian input maximises the information
     * at a given power, T. M. Cover and J. A. Thomas, Elements of Information Theory, 2nd ed., 2006,
     * Sec. 9.1), and at R ≥ r·log2 M the outage is 1. At R/r = 1/2 the BPSK threshold is the
     * binary-input limit Es/N0 = 0.187 − 3.0103 dB (widely quoted; from memory, three decimals),
     * so the outage lies between the closed forms at thresholds 0.1865 and 0.1875 dB − 3.0103 dB.
     */
    @Test
    void alphabetOutageAboveGaussianOutage() {
        for (double db = 0; db <= 20; db += 5) {
            for (double bits : new double[] {0.2, 0.5, 0.9}) {
                double gaussian = OutageBounds.stbcOutage(db, 1, 2, 1.0, bits);
                double bpsk = OutageBounds.stbcOutage(db, 1, 2, 1.0, bits, OutageBoundsTest::bpskBits, 1.0);
                assertTrue(bpsk >= gaussian, "R=" + bits + " at " + db + " dB: " + bpsk + " < " + gaussian);
            }
            assertEquals(1.0, OutageBounds.stbcOutage(db, 1, 2, 1.0, 1.0, OutageBoundsTest::bpskBits, 1.0), 0.0);
            assertEquals(1.0, OutageBounds.stbcOutage(db, 1, 4, 0.5, 0.5, OutageBoundsTest::bpskBits, 1.0), 0.0);
            double p = OutageBounds.stbcOutage(db, 1, 2, 1.0, 0.5, OutageBoundsTest::bpskBits, 1.0);
            double snr = fromDb(db);
            double low = erlangCdf(2, fromDb(0.1865 - 10 * Math.log10(2)) * 2 / snr);
            double high = erlangCdf(2, fromDb(0.1875 - 10 * Math.log10(2)) * 2 / snr);
            assertTrue(low <= p && p <= high, low + " <= " + p + " <= " + high + " at " + db + " dB");
        }
    }

    /** Inverting the SISO form: SNR = (2^R − 1)/(−ln(1 − p)) (Tse and Viswanath 2005, Sec. 5.4.1). */
    @Test
    void snrForTargetOutage() {
        for (double bits : new double[] {0.5, 2, 6}) {
            for (double target : new double[] {0.5, 1e-2, 1e-5}) {
                double expectedDb = 10 * Math.log10((Math.pow(2, bits) - 1) / -Math.log1p(-target));
                double db = OutageBounds.snrDbForOutage(s -> OutageBounds.stbcOutage(s, 1, 1, 1.0, bits), target);
                assertEquals(expectedDb, db, 1e-9, "R=" + bits + " p=" + target);
                double db4 = OutageBounds.snrDbForOutage(s -> OutageBounds.stbcOutage(s, 2, 2, 1.0, bits), target);
                assertEquals(target, OutageBounds.stbcOutage(db4, 2, 2, 1.0, bits), 1e-8 * target);
            }
        }
        assertRejects(() -> OutageBounds.snrDbForOutage(
                s -> OutageBounds.stbcOutage(s, 1, 1, 1.0, 2, OutageBoundsTest::bpskBits, 1.0), 0.1),
                "does not cross the target");
        assertRejects(() -> OutageBounds.snrDbForOutage(s -> 0.5, 1.0), "(0, 1)");
    }

    @Test
    void rejectsBadInput() {
        assertRejects(() -> OutageBounds.stbcOutage(Double.NaN, 1, 1, 1, 1), "snrDb");
        assertRejects(() -> OutageBounds.stbcOutage(10, 1, 0, 1, 1), "1..64");
        assertRejects(() -> OutageBounds.stbcOutage(10, 65, 1, 1, 1), "1..64");
        assertRejects(() -> OutageBounds.stbcOutage(10, 1, 2, 0, 1), "(0, 1]");
        assertRejects(() -> OutageBounds.stbcOutage(10, 1, 2, 1.5, 1), "(0, 1]");
        assertRejects(() -> OutageBounds.stbcOutage(10, 1, 2, 1, 0), "> 0");
        assertRejects(() -> OutageBounds.stbcOutage(10, 1, 2, 1, Double.POSITIVE_INFINITY), "> 0");
        assertRejects(() -> OutageBounds.stbcOutage(10, 1, 2, 1, 1, g -> g, 0), "maxBitsPerSymbol");
        assertRejects(() -> OutageBounds.mimoOutage(10, 2, 2, 1, 0, 1), "draws");
    }

    static void assertRejects(Executable call, String fragment) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call);
        assertTrue(e.getMessage().contains(fragment), e.getMessage());
        assertTrue(!e.getMessage().contains("\n"), "one-line message");
    }
}
