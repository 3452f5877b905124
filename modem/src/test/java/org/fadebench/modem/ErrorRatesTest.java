package org.fadebench.modem;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;

class ErrorRatesTest {

    /** Q(x) against Commons Math's normal distribution (reference library) and a tabulated value. */
    @Test
    void qFunction() {
        NormalDistribution n = new NormalDistribution(0, 1);
        for (double x = -3; x <= 8; x += 0.25) {
            double ref = x < 0 ? n.cumulativeProbability(-x) : 1 - n.cumulativeProbability(x);
            assertEquals(ref, ErrorRates.q(x), 1e-12 + 1e-10 * ref);
        }
        // Q(3) = 1.3499e-3: M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions,
        // 1964, Table 26.1 (P(3) = 0.99865010).
        assertEquals(1.3499e-3, ErrorRates.q(3), 1e-7);
    }

    /** BPSK at Eb/N0 = 9.6 dB gives about 1e-5 (common practice, no source; from memory). */
    @Test
    void bpskTenToTheMinusFive() {
        double ber = ErrorRates.bpskBitErrorRate(Math.pow(10, 0.96));
        assertEquals(1.0e-5, ber, 0.1e-5);
    }

    /**
     * Cho-Yoon Gray QAM BER against a first-principles computation: per √M-PAM axis, for each sent
     * level and each bit, sum the Gaussian probability of the decision intervals whose label
     * differs in that bit.
     */
    @Test
    void choYoonMatchesDirectSum() {
        for (Modulation mod : new Modulation[] {Modulation.QPSK, Modulation.QAM16, Modulation.QAM64,
                Modulation.QAM256}) {
            QamConstellation c = mod.constellation();
            int l = c.levelsPerAxis();
            int m = c.bitsPerSymbol() / 2;
            double d = c.halfSpacing();
            for (double ebN0Db = 0; ebN0Db <= 16; ebN0Db += 4) {
                double ebN0 = Math.pow(10, ebN0Db / 10);
                double n0 = 1.0 / (c.bitsPerSymbol() * ebN0); // Es = 1
                double sigma = Math.sqrt(n0 / 2);
                double errors = 0;
                for (int sent = 0; sent < l; sent++) {
                    double a = (l - 1 - 2 * sent) * d;
                    int sentLabel = sent ^ (sent >>> 1);
                    for (int dec = 0; dec < l; dec++) {
                        double hi = dec == 0 ? Double.POSITIVE_INFINITY : (l - 2 * dec) * d;
                        double lo = dec == l - 1 ? Double.NEGATIVE_INFINITY : (l - 2 - 2 * dec) * d;
                        double p = ErrorRates.q((lo - a) / sigma) - ErrorRates.q((hi - a) / sigma);
                        int decLabel = dec ^ (dec >>> 1);
                        errors += p * Integer.bitCount(sentLabel ^ decLabel);
                    }
                }
                double direct = errors / (l * m);
                double formula = ErrorRates.squareQamBitErrorRate(mod.order(), ebN0);
                assertEquals(direct, formula, 1e-12 + 1e-9 * direct, mod + " at " + ebN0Db + " dB");
            }
        }
    }

    /** Gray QPSK has exactly the BPSK bit error rate at the same Eb/N0 (common practice). */
    @Test
    void qpskEqualsBpskPerBit() {
        for (double e = 0.5; e < 20; e *= 1.7) {
            assertEquals(ErrorRates.bpskBitErrorRate(e), ErrorRates.squareQamBitErrorRate(4, e), 1e-15);
        }
    }

    /**
     * L = 1 MRC in Rayleigh reduces to P_b = (1 - √(γ/(1+γ)))/2 (Proakis and Salehi, Sec. 13.3,
     * from memory), and the high-SNR asymptote C(2L-1, L)/(4γ)^L (same source) holds.
     */
    @Test
    void mrcRayleighSpecialCasesAndAsymptote() {
        for (double g = 0.1; g < 1e4; g *= 3) {
            assertEquals(0.5 * (1 - Math.sqrt(g / (1 + g))), ErrorRates.rayleighMrcBpskBitErrorRate(1, g), 1e-15);
        }
        double g = 1e5;
        for (int l = 1; l <= 4; l++) {
            double asym = org.apache.commons.math3.util.CombinatoricsUtils.binomialCoefficientDouble(2 * l - 1, l)
                    / Math.pow(4 * g, l);
            assertEquals(1.0, ErrorRates.rayleighMrcBpskBitErrorRate(l, g) / asym, 1e-3, "L=" + l);
        }
    }

    /** Square-QAM SER: the 16-QAM value at Es/N0 = 20 dB from the formula by hand, and M=4 vs BPSK. */
    @Test
    void qamSer() {
        double es = 100;
        double p = 2 * (1 - 0.25) * ErrorRates.q(Math.sqrt(3 * es / 15));
        assertEquals(1 - (1 - p) * (1 - p), ErrorRates.squareQamSymbolErrorRate(16, es), 1e-15);
        double pb = ErrorRates.bpskBitErrorRate(3.0 / 2);
        assertEquals(1 - (1 - pb) * (1 - pb), ErrorRates.squareQamSymbolErrorRate(4, 3.0), 1e-15);
    }
}
