package org.fadebench.channel;

/**
 * The flat MIMO channel over a run of slots with one channel matrix: for each slot τ and receive
 * antenna r, {@code y[τ][r] = Σ_t H[r][t] · x[τ][t] + n}, with n ~ CN(0, n0). In matrix form
 * Y = X Hᵀ + N with X of T x Mt and Y of T x Nr, all interleaved complex and row-major.
 *
 * <p>SNR convention (see README): the transmitter's grid carries unit average total energy per
 * slot summed over its antennas, E|h_rt|² = 1, so the SNR per receive antenna is 1/n0.
 */
public final class MimoChannel {

    private MimoChannel() {
    }

    /**
     * Passes {@code slots} rows of {@code x} (from row {@code xRow}) through {@code h} and adds
     * complex Gaussian noise of variance {@code n0}, writing rows of {@code y} from {@code yRow}.
     */
    public static void apply(double[] h, int nr, int mt, double[] x, int xRow, int slots,
                             double n0, Draws draws, double[] y, int yRow) {
        double sigma = Math.sqrt(0.5 * n0);
        for (int s = 0; s < slots; s++) {
            int xo = 2 * (xRow + s) * mt;
            int yo = 2 * (yRow + s) * nr;
            for (int r = 0; r < nr; r++) {
                int ho = 2 * r * mt;
                double re = 0;
                double im = 0;
                for (int t = 0; t < mt; t++) {
                    double hr = h[ho + 2 * t];
                    double hi = h[ho + 2 * t + 1];
                    double xr = x[xo + 2 * t];
                    double xi = x[xo + 2 * t + 1];
                    re += hr * xr - hi * xi;
                    im += hr * xi + hi * xr;
                }
                y[yo + 2 * r] = re + sigma * draws.gaussian();
                y[yo + 2 * r + 1] = im + sigma * draws.gaussian();
            }
        }
    }
}
