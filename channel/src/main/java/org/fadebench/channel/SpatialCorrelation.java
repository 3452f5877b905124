package org.fadebench.channel;

import java.io.Serializable;

/**
 * Spatial correlation of the scattered part of a channel: exponential profiles between neighbouring
 * antennas ({@code --rx-corr}, {@code --tx-corr}), full matrices, or none (all null). A coefficient
 * given as 0 is still given: the channel is then not the i.i.d. Rayleigh one of the closed-form
 * bounds, though it draws the same matrices.
 *
 * @param rx       exponential coefficient r in (−1, 1) between neighbouring receive antennas, or null
 * @param tx       the same between transmit antennas, or null
 * @param matrices full correlation matrices (for Nr x Mt, checked by {@link #check}), or null
 */
public record SpatialCorrelation(Double rx, Double tx, KroneckerCorrelation matrices)
        implements Serializable {

    /** No correlation. */
    public static final SpatialCorrelation NONE = new SpatialCorrelation(null, null, null);

    public SpatialCorrelation {
        if (rx != null) {
            coefficient(ModelOptions.RX_CORR, rx);
        }
        if (tx != null) {
            coefficient(ModelOptions.TX_CORR, tx);
        }
        if (matrices != null && (rx != null || tx != null)) {
            throw new IllegalArgumentException("--tx-corr and --rx-corr cannot be combined with correlation matrices");
        }
    }

    /** {@code r} if it is a correlation coefficient in (−1, 1), else an error naming the setting {@code key}. */
    public static double coefficient(String key, double r) {
        if (!(r > -1.0 && r < 1.0)) {
            throw new IllegalArgumentException(key + " must be an exponential correlation coefficient in (-1, 1), got "
                    + r);
        }
        return r;
    }

    /** Whether nothing was given. */
    public boolean none() {
        return rx == null && tx == null && matrices == null;
    }

    /** Throws unless full matrices, if given, are for an {@code nr} x {@code mt} link. */
    public void check(int nr, int mt) {
        if (matrices != null && (matrices.nr() != nr || matrices.mt() != mt)) {
            throw new IllegalArgumentException("correlation matrices are for Nr x Mt = " + matrices.nr() + " x "
                    + matrices.mt() + " but the link has " + nr + " x " + mt);
        }
    }

    /** The correlation for an {@code nr} x {@code mt} link with its own work array, or null when there is none. */
    public KroneckerCorrelation forLink(int nr, int mt) {
        if (matrices != null) {
            return matrices.copy();
        }
        double r = rx != null ? rx : 0.0;
        double t = tx != null ? tx : 0.0;
        return r == 0.0 && t == 0.0 ? null : KroneckerCorrelation.exponential(nr, mt, r, t);
    }

    /** The label's tail, e.g. {@code , tx-corr 0.5, rx-corr 0.3}; empty for none. */
    public String describe() {
        return (tx != null ? ", tx-corr " + tx : "") + (rx != null ? ", rx-corr " + rx : "")
                + (matrices != null ? ", correlation matrices" : "");
    }
}
