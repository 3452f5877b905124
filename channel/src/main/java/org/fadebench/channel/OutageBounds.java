package org.fadebench.channel;

import java.util.function.BooleanSupplier;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.special.Gamma;

/**
 * Outage limits of a block-fading link over i.i.d. Rayleigh fading (every entry of the Nr x Mt
 * channel H is CN(0, 1), constant over a codeword, unknown to the transmitter). A rate R in bits
 * per channel use is in outage when the channel's mutual information falls below R.
 *
 * <p>SNR convention: {@code snrDb} is the total transmitted energy per channel use over N0 at each
 * receive antenna, split equally over the Mt transmit antennas.
 *
 * <p>Orthogonal space-time block codes of rate r = K/T turn the link into K scalar channels per
 * block with per-symbol SNR γ = snr·‖H‖²_F/(Mt·r) (V. Tarokh, H. Jafarkhani and A. R. Calderbank,
 * "Space-time block codes from orthogonal designs", IEEE Trans. Inf. Theory 45(5), 1999). Since
 * ‖H‖²_F is the sum of L = Mt·Nr independent Exp(1) powers, it is Gamma(L, 1), and any outage event
 * of the form γ < γ_th has probability P(L, γ_th·Mt·r/snr), the regularized lower incomplete gamma
 * function (Commons Math {@code Gamma.regularizedGammaP}). For a MIMO channel with min(Mt, Nr) = 1
 * the capacity log2(1 + snr/Mt·‖H‖²_F) is the r = 1 case, so its outage is the same closed form.
 */
public final class OutageBounds {

    /** Largest antenna count accepted on either side (see {@link Antennas}). */
    public static final int MAX_ANTENNAS = Antennas.MAX;

    /** Searches over SNR stop at ±500 dB (the messages quote this number). */
    private static final double SEARCH_LIMIT_DB = 500.0;
    private static final double SEARCH_STEP_DB = 50.0;

    private OutageBounds() {
    }

    /**
     * Outage probability of the Nr x Mt MIMO channel with Gaussian inputs, equal power and no
     * transmit channel knowledge, P(log2 det(I + snr/Mt·H Hᴴ) < R). Exact (closed form, no draws)
     * when min(Mt, Nr) = 1 (draws and seed unused); otherwise a Monte Carlo estimate over {@code draws} Rayleigh channel
     * draws of the stream {@code Draws.of(seed)} with its interval (see {@link MimoOutageSimulator}).
     */
    public static OutageEstimate mimoOutage(double snrDb, int nr, int mt, double spectralEfficiency,
                                            int draws, long seed) {
        return mimoOutage(snrDb, nr, mt, spectralEfficiency, draws, seed, () -> false);
    }

    /** As above, the Monte Carlo estimate polling {@code stop} (see {@link MimoOutageSimulator}). */
    public static OutageEstimate mimoOutage(double snrDb, int nr, int mt, double spectralEfficiency,
                                            int draws, long seed, BooleanSupplier stop) {
        checkDraws(draws);
        if (Math.min(mt, nr) == 1) {
            return OutageEstimate.exact(stbcOutage(snrDb, nr, mt, 1.0, spectralEfficiency));
        }
        return new MimoOutageSimulator(new RayleighFading(), nr, mt)
                .estimate(snrDb, spectralEfficiency, draws, seed, stop);
    }

    /**
     * Outage probability of an orthogonal space-time block code of rate {@code codeRate} = K/T with
     * Gaussian symbols: P(r·log2(1 + snr·‖H‖²_F/(Mt·r)) < R), in closed form.
     */
    public static double stbcOutage(double snrDb, int nr, int mt, double codeRate,
                                    double spectralEfficiency) {
        return stbcOutage(snrDb, nr, mt, codeRate, spectralEfficiency, rayleighGainCdf(nr, mt));
    }

    /**
     * As {@link #stbcOutage(double, int, int, double, double)} for any fading: {@code gainCdf} is
     * the distribution function of ‖H‖²_F (e.g. {@link ChannelGainSamples#cdf}).
     */
    public static double stbcOutage(double snrDb, int nr, int mt, double codeRate, double spectralEfficiency,
                                    DoubleUnaryOperator gainCdf) {
        checkLink(snrDb, nr, mt, codeRate, spectralEfficiency);
        double thresholdSnr = Math.expm1(spectralEfficiency / codeRate * Math.log(2.0));
        return outage(snrDb, mt, codeRate, thresholdSnr, gainCdf);
    }

    /** The distribution function of ‖H‖²_F ~ Gamma(Mt·Nr, 1) under i.i.d. Rayleigh fading. */
    public static DoubleUnaryOperator rayleighGainCdf(int nr, int mt) {
        return x -> Gamma.regularizedGammaP(mt * nr, x);
    }

    /**
     * Outage probability of an orthogonal space-time block code of rate {@code codeRate} carrying
     * symbols of a finite input alphabet: P(r·I(snr·‖H‖²_F/(Mt·r)) < R), where
     * {@code bitsPerSymbol} is the alphabet's mutual information I(γ) in bits per symbol on the
     * scalar AWGN channel at linear symbol SNR γ (increasing, from 0 to {@code maxBitsPerSymbol}).
     * The threshold γ_th with r·I(γ_th) = R is found by bisection; the outage is 1 when
     * R ≥ r·maxBitsPerSymbol.
     */
    public static double stbcOutage(double snrDb, int nr, int mt, double codeRate,
                                    double spectralEfficiency, DoubleUnaryOperator bitsPerSymbol,
                                    double maxBitsPerSymbol) {
        return stbcOutage(snrDb, nr, mt, codeRate, spectralEfficiency, bitsPerSymbol, maxBitsPerSymbol,
                rayleighGainCdf(nr, mt));
    }

    /** As the finite-alphabet outage above for any fading, with {@code gainCdf} the distribution of ‖H‖²_F. */
    public static double stbcOutage(double snrDb, int nr, int mt, double codeRate,
                                    double spectralEfficiency, DoubleUnaryOperator bitsPerSymbol,
                                    double maxBitsPerSymbol, DoubleUnaryOperator gainCdf) {
        checkLink(snrDb, nr, mt, codeRate, spectralEfficiency);
        if (!(maxBitsPerSymbol > 0.0)) {
            throw new IllegalArgumentException("maxBitsPerSymbol must be > 0, got " + maxBitsPerSymbol);
        }
        if (spectralEfficiency >= codeRate * maxBitsPerSymbol) {
            return 1.0;
        }
        double thresholdSnr = thresholdSnr(bitsPerSymbol, spectralEfficiency / codeRate);
        return outage(snrDb, mt, codeRate, thresholdSnr, gainCdf);
    }

    /**
     * The SNR in dB at which {@code outageOfSnrDb}, a closed-form outage decreasing in SNR (e.g.
     * {@code s -> stbcOutage(s, 1, 2, 1.0, 2.0)}), equals {@code targetProbability}; by bisection
     * to 1e-10 dB. Not for Monte Carlo estimates, which are not smooth in SNR.
     *
     * @throws IllegalArgumentException if the target is outside (0, 1) or not reached within ±500 dB
     */
    public static double snrDbForOutage(DoubleUnaryOperator outageOfSnrDb, double targetProbability) {
        if (!(targetProbability > 0.0 && targetProbability < 1.0)) {
            throw new IllegalArgumentException("target outage probability must be in (0, 1), got "
                    + targetProbability);
        }
        double snrDb = crossingDb(db -> -outageOfSnrDb.applyAsDouble(db), -targetProbability);
        if (Double.isInfinite(snrDb)) {
            throw new IllegalArgumentException("outage does not cross the target " + targetProbability
                    + " between -500 and 500 dB");
        }
        return snrDb;
    }

    /**
     * The linear SNR at which an increasing information curve reaches {@code bits}; 0 or ∞ when
     * that happens beyond ∓500 dB.
     */
    static double thresholdSnr(DoubleUnaryOperator bitsPerSymbol, double bits) {
        return fromDb(crossingDb(db -> bitsPerSymbol.applyAsDouble(fromDb(db)), bits));
    }

    /**
     * Where a function of dB, increasing, reaches {@code level}: bracketed in steps of 50 dB from
     * ±50 dB, then bisected to 1e-10 dB; −∞ if reached already at −500 dB, +∞ if not by +500 dB.
     */
    private static double crossingDb(DoubleUnaryOperator increasing, double level) {
        double lo = -SEARCH_STEP_DB;
        double hi = SEARCH_STEP_DB;
        while (increasing.applyAsDouble(lo) >= level) {
            lo -= SEARCH_STEP_DB;
            if (lo < -SEARCH_LIMIT_DB) {
                return Double.NEGATIVE_INFINITY;
            }
        }
        while (increasing.applyAsDouble(hi) < level) {
            hi += SEARCH_STEP_DB;
            if (hi > SEARCH_LIMIT_DB) {
                return Double.POSITIVE_INFINITY;
            }
        }
        while (hi - lo > 1e-10) {
            double mid = 0.5 * (lo + hi);
            if (increasing.applyAsDouble(mid) < level) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    /** P(γ < γ_th) for γ = snr·‖H‖²_F/(Mt·r), with ‖H‖²_F distributed by {@code gainCdf}. */
    private static double outage(double snrDb, int mt, double codeRate, double thresholdSnr,
                                 DoubleUnaryOperator gainCdf) {
        double x = thresholdSnr * mt * codeRate / fromDb(snrDb);
        if (x == Double.POSITIVE_INFINITY) {
            return 1.0;
        }
        return gainCdf.applyAsDouble(x);
    }

    private static double fromDb(double db) {
        return Math.pow(10.0, 0.1 * db);
    }

    private static void checkLink(double snrDb, int nr, int mt, double codeRate, double spectralEfficiency) {
        checkSnrDb(snrDb);
        Antennas.check(nr, mt);
        if (!(codeRate > 0.0 && codeRate <= 1.0)) {
            throw new IllegalArgumentException("code rate K/T must be in (0, 1], got " + codeRate);
        }
        checkSpectralEfficiency(spectralEfficiency);
    }

    static void checkSnrDb(double snrDb) {
        if (!Double.isFinite(snrDb)) {
            throw new IllegalArgumentException("snrDb must be a finite number of dB, got " + snrDb);
        }
    }

    static void checkDraws(int draws) {
        if (draws < 1) {
            throw new IllegalArgumentException("draws must be >= 1, got " + draws);
        }
    }

    static void checkSpectralEfficiency(double spectralEfficiency) {
        if (!(spectralEfficiency > 0.0 && spectralEfficiency < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("spectral efficiency R must be a finite number of bits"
                    + " per channel use > 0, got " + spectralEfficiency);
        }
    }
}
