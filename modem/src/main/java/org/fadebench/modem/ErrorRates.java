package org.fadebench.modem;

import org.apache.commons.math3.special.Erf;
import org.apache.commons.math3.util.CombinatoricsUtils;

/**
 * Closed-form error rates used as references for the simulator. All SNR arguments are linear
 * (not dB) and named for what they are: {@code ebN0} energy per bit over N0, {@code esN0} energy
 * per symbol over N0, {@code gammaBar} average SNR per diversity branch.
 */
public final class ErrorRates {

    private ErrorRates() {
    }

    /** Gaussian tail probability Q(x) = erfc(x/√2)/2, with Commons Math's erfc. */
    public static double q(double x) {
        return 0.5 * Erf.erfc(x / Math.sqrt(2.0));
    }

    /**
     * BPSK (and Gray QPSK per bit) in AWGN: P_b = Q(√(2 Eb/N0)). J. G. Proakis and M. Salehi,
     * Digital Communications, 5th ed., McGraw-Hill, 2008, Sec. 4.2 (binary antipodal signalling).
     */
    public static double bpskBitErrorRate(double ebN0) {
        return q(Math.sqrt(2.0 * ebN0));
    }

    /**
     * Symbol error rate of square M-QAM in AWGN (exact):
     * P_s = 1 - (1 - P_√M)², P_√M = 2 (1 - 1/√M) Q(√(3 Es/N0 / (M-1))). Proakis and Salehi,
     * Digital Communications, 5th ed., 2008, Sec. 4.3 (square QAM as two √M-PAM; equation number
     * from memory, not cited). M = 2 gives BPSK, P_s = Q(√(2 Es/N0)).
     */
    public static double squareQamSymbolErrorRate(int order, double esN0) {
        if (order == 2) {
            return bpskBitErrorRate(esN0);
        }
        double sqrtM = Math.sqrt(order);
        double pam = 2.0 * (1.0 - 1.0 / sqrtM) * q(Math.sqrt(3.0 * esN0 / (order - 1)));
        return 1.0 - (1.0 - pam) * (1.0 - pam);
    }

    /**
     * Exact bit error rate of Gray-labelled square M-QAM in AWGN, K. Cho and D. Yoon, "On the
     * general BER expression of one- and two-dimensional amplitude modulations", IEEE Trans.
     * Commun. 50(7), 2002, eqs. (14)-(16) (equation numbers from memory). Per √M-PAM axis:
     * <pre>
     * P_b(k) = (1/√M) Σ_{i=0}^{(1-2^-k)√M - 1} (-1)^⌊i 2^(k-1)/√M⌋ (2^(k-1) - ⌊i 2^(k-1)/√M + 1/2⌋)
     *          · erfc((2i+1) √(3 log2(M) Eb/N0 / (2(M-1))))
     * </pre>
     * averaged over k = 1..log2 √M. M = 2 gives BPSK.
     */
    public static double squareQamBitErrorRate(int order, double ebN0) {
        if (order == 2) {
            return bpskBitErrorRate(ebN0);
        }
        int sqrtM = (int) Math.round(Math.sqrt(order));
        int bitsPerAxis = Integer.numberOfTrailingZeros(sqrtM);
        double log2M = 2.0 * bitsPerAxis;
        double arg = Math.sqrt(3.0 * log2M * ebN0 / (2.0 * (order - 1)));
        double sum = 0.0;
        for (int k = 1; k <= bitsPerAxis; k++) {
            int pow = 1 << (k - 1);
            int last = (int) ((1.0 - Math.pow(2.0, -k)) * sqrtM) - 1;
            double pk = 0.0;
            for (int i = 0; i <= last; i++) {
                long f = (long) i * pow / sqrtM;
                double sign = (f & 1L) == 0 ? 1.0 : -1.0;
                double weight = pow - Math.floor((double) i * pow / sqrtM + 0.5);
                pk += sign * weight * Erf.erfc((2 * i + 1) * arg);
            }
            sum += pk / sqrtM;
        }
        return sum / bitsPerAxis;
    }

    /**
     * BPSK with L-branch maximal-ratio combining over i.i.d. Rayleigh branches of average SNR
     * {@code gammaBar} each:
     * P_b = ((1-μ)/2)^L Σ_{k=0}^{L-1} C(L-1+k, k) ((1+μ)/2)^k, μ = √(γ̄/(1+γ̄)).
     * Proakis and Salehi, Digital Communications, 5th ed., 2008, Sec. 13.4 (diversity with
     * binary signals; section number from memory).
     */
    public static double rayleighMrcBpskBitErrorRate(int branches, double gammaBar) {
        double mu = Math.sqrt(gammaBar / (1.0 + gammaBar));
        double lo = 0.5 * (1.0 - mu);
        double hi = 0.5 * (1.0 + mu);
        double sum = 0.0;
        for (int k = 0; k < branches; k++) {
            sum += CombinatoricsUtils.binomialCoefficientDouble(branches - 1 + k, k) * Math.pow(hi, k);
        }
        return Math.pow(lo, branches) * sum;
    }
}
