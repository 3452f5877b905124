package org.fadebench.bench.analysis;

/**
 * The three outage bounds at one SNR.
 *
 * @param mimo        MIMO outage: the exact value, or the fraction of draws in outage
 * @param mimoLow     lower end of its 95 % Wilson interval (= {@code mimo} when exact)
 * @param mimoHigh    upper end of that interval (= {@code mimo} when exact)
 * @param mimoOutages draws in outage (0 when exact)
 * @param mimoDraws   draws counted (0 when exact)
 * @param stbc        outage of the space-time code with Gaussian symbols
 * @param qam         outage of the space-time code with the link's QAM symbols
 */
public record BoundPoint(double snrDb, double mimo, double mimoLow, double mimoHigh, int mimoOutages,
                         int mimoDraws, double stbc, double qam) {

    /** True when the MIMO value is a closed form rather than a count. */
    public boolean mimoExact() {
        return mimoDraws == 0;
    }

    /** The value of one bound. */
    public double value(Bound bound) {
        switch (bound) {
            case MIMO:
                return mimo;
            case STBC:
                return stbc;
            default:
                return qam;
        }
    }
}
