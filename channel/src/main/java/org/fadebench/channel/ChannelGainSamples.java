package org.fadebench.channel;

import java.util.Arrays;

/**
 * The distribution of the channel's total power gain ‖H‖²_F under a fading model, as the empirical
 * distribution of a fixed set of draws: what the outage of an orthogonal space-time code needs
 * when the model has no closed form (Rician, Nakagami-m, correlated fading). The draws come from
 * {@code Draws.of(seed)}, so the same seed gives the same distribution.
 */
public final class ChannelGainSamples {

    private final double[] sorted;

    private ChannelGainSamples(double[] sorted) {
        this.sorted = sorted;
    }

    /**
     * Draws {@code draws} channel matrices of {@code nr} x {@code mt} from {@code model} and keeps
     * their ‖H‖²_F.
     *
     * @throws IllegalArgumentException if {@code draws} is below 1 or an antenna count is outside 1..64
     */
    public static ChannelGainSamples draw(FadingModel model, int nr, int mt, int draws, long seed) {
        Antennas.check(nr, mt);
        OutageBounds.checkDraws(draws);
        Draws stream = Draws.of(seed);
        double[] h = new double[2 * nr * mt];
        double[] gains = new double[draws];
        for (int i = 0; i < draws; i++) {
            model.draw(stream, nr, mt, h);
            double g = 0;
            for (double v : h) {
                g += v * v;
            }
            gains[i] = g;
        }
        Arrays.sort(gains);
        return new ChannelGainSamples(gains);
    }

    /** The fraction of draws with ‖H‖²_F strictly below {@code x}. */
    public double cdf(double x) {
        return (double) countBelow(x) / sorted.length;
    }

    /** The number of draws with ‖H‖²_F strictly below {@code x}. */
    public int countBelow(double x) {
        int lo = 0;
        int hi = sorted.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] < x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** Number of draws. */
    public int size() {
        return sorted.length;
    }

    /** Mean of ‖H‖²_F over the draws (Mt·Nr for a model with E|h|² = 1). */
    public double mean() {
        double s = 0;
        for (double v : sorted) {
            s += v;
        }
        return s / sorted.length;
    }
}
