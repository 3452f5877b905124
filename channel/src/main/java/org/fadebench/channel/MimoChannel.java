package org.fadebench.channel;

import java.util.Arrays;

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
     * The noise is drawn first, for runs of {@code rowSlots} slots (a code block; {@code slots} a
     * multiple of it) as rows: the first value (slot, antenna, re/im) of every run, then the second,
     * and so on (see {@link Draws#fillGaussianColumns}), the order in which the planar channel
     * fills its planes.
     */
    public static void apply(double[] h, int nr, int mt, double[] x, int xRow, int slots, int rowSlots,
                             double n0, Draws draws, double[] y, int yRow) {
        int yo = 2 * yRow * nr;
        fillNoise(slots, rowSlots, nr, n0, draws, y, yo);
        addSignal(h, 0, nr, mt, x, 2 * xRow * mt, slots, y, yo);
    }

    /** {@link #apply} with the slots as one run (noise drawn in the order of the receive grid). */
    public static void apply(double[] h, int nr, int mt, double[] x, int xRow, int slots,
                             double n0, Draws draws, double[] y, int yRow) {
        apply(h, nr, mt, x, xRow, slots, slots, n0, draws, y, yRow);
    }

    /**
     * As {@link #apply}, but with a channel matrix per slot: {@code hSlots} holds {@code slots}
     * Nr x Mt matrices one after the other (the matrix of slot s, counted from {@code xRow}, starts at
     * {@code hSlots[2·s·Nr·Mt]}). The noise is drawn first, in the same order as {@code apply}, so a
     * channel that does not change over the slots gives exactly the output of {@code apply}.
     */
    public static void applyPerSlot(double[] hSlots, int nr, int mt, double[] x, int xRow, int slots, int rowSlots,
                                    double n0, Draws draws, double[] y, int yRow) {
        int yo = 2 * yRow * nr;
        fillNoise(slots, rowSlots, nr, n0, draws, y, yo);
        int xo = 2 * xRow * mt;
        int matrix = 2 * nr * mt;
        for (int s = 0; s < slots; s++) {
            addSignal(hSlots, s * matrix, nr, mt, x, xo + 2 * s * mt, 1, y, yo + 2 * s * nr);
        }
    }

    /** The noise of {@code slots} slots from {@code y[yo]}, in runs of {@code rowSlots} (see {@link #apply}). */
    private static void fillNoise(int slots, int rowSlots, int nr, double n0, Draws draws, double[] y, int yo) {
        if (rowSlots < 1 || slots % rowSlots != 0) {
            throw new IllegalArgumentException("slots (" + slots + ") must be whole runs of " + rowSlots);
        }
        draws.fillGaussianColumns(y, yo, slots / rowSlots, 2 * rowSlots * nr, Math.sqrt(0.5 * n0));
    }

    /**
     * {@link #apply} for two transmit antennas on planar arrays: the same noise draws (rows of T
     * slots) and the same
     * arithmetic per element, with the grid and the received signal split into planes of real and
     * imaginary parts so that each product is a unit-stride loop over rows.
     *
     * <p>A row is a run of T slots (a code block): with x of 4·T planes and y of 2·T·Nr planes,
     * plane {@code 2·(τ·Mt + t)} of x holds the real parts of slot τ, antenna t of every row and
     * plane {@code 2·(τ·Mt + t) + 1} the imaginary parts (Mt = 2); y likewise with Nr antennas. That
     * is the interleaved grid read as an array of rows of T·Mt entries, one plane per value of a row,
     * so slot {@code i·T + τ} of the interleaved grid is element {@code i} of the planes of τ. Rows
     * {@code from .. from+rows)} are passed through {@code h} (Nr x 2, interleaved).
     */
    public static void applyTwoTransmittersPlanar(double[] h, int nr, double[][] x, int from, int rows,
                                                  double n0, Draws draws, double[][] y) {
        int slots = x.length / 4;
        if (x.length != 4 * slots || y.length != 2 * slots * nr) {
            throw new IllegalArgumentException("planes: x needs 4·T, y 2·T·Nr, got " + x.length + " and " + y.length);
        }
        draws.fillGaussian(y, from, rows, Math.sqrt(0.5 * n0));
        int end = from + rows;
        for (int tau = 0; tau < slots; tau++) {
            double[] x1r = x[4 * tau];
            double[] x1i = x[4 * tau + 1];
            double[] x2r = x[4 * tau + 2];
            double[] x2i = x[4 * tau + 3];
            for (int r = 0; r < nr; r++) {
                double h1r = h[4 * r];
                double h1i = h[4 * r + 1];
                double h2r = h[4 * r + 2];
                double h2i = h[4 * r + 3];
                // the expressions of addTwoTransmitters, one loop per part (short loops vectorise)
                double[] yr = y[2 * (tau * nr + r)];
                for (int i = from; i < end; i++) {
                    yr[i] = Math.fma(h1r, x1r[i], Math.fma(-h1i, x1i[i], Math.fma(h2r, x2r[i], Math.fma(-h2i, x2i[i], yr[i]))));
                }
                double[] yi = y[2 * (tau * nr + r) + 1];
                for (int i = from; i < end; i++) {
                    yi[i] = Math.fma(h1r, x1i[i], Math.fma(h1i, x1r[i], Math.fma(h2r, x2i[i], Math.fma(h2i, x2r[i], yi[i]))));
                }
            }
        }
    }

    /**
     * {@link #apply} on planar arrays as {@link #applyTwoTransmittersPlanar} lays them out, for any
     * number of transmit antennas but two (which that method serves): the same noise draws and, per
     * element, the sums of the interleaved {@code addGeneral} (with one antenna its sum 0 + p is the
     * single-antenna product p), four antennas a pass. Above four antennas the sum runs in
     * {@code sum}, a work plane of at least {@code from + rows} entries.
     */
    public static void applyPlanar(double[] h, int nr, int mt, double[][] x, int from, int rows, double n0,
                                   Draws draws, double[][] y, double[] sum) {
        int slots = x.length / (2 * mt);
        if (mt == 2 || x.length != 2 * mt * slots || y.length != 2 * slots * nr || sum.length < from + rows) {
            throw new IllegalArgumentException("planes: x needs 2·T·Mt, y 2·T·Nr (Mt ≠ 2), got " + x.length
                    + " and " + y.length);
        }
        draws.fillGaussian(y, from, rows, Math.sqrt(0.5 * n0));
        for (int tau = 0; tau < slots; tau++) {
            for (int r = 0; r < nr; r++) {
                for (int part = 0; part < 2; part++) {
                    double[] yp = y[2 * (tau * nr + r) + part];
                    if (mt <= 4) {
                        addFour(yp, true, h, 2 * r * mt, x, 2 * tau * mt, mt, part, from, rows);
                        continue;
                    }
                    Arrays.fill(sum, from, from + rows, 0.0);
                    for (int t = 0; t < mt; t += 4) {
                        addFour(sum, false, h, 2 * (r * mt + t), x, 2 * (tau * mt + t), Math.min(4, mt - t), part,
                                from, rows);
                    }
                    for (int i = from; i < from + rows; i++) {
                        yp[i] += sum[i];
                    }
                }
            }
        }
    }

    /**
     * The products p_t (real part for part 0, imaginary for 1) of {@code count} (1 to 4) antennas:
     * h from {@code h[ho]}, x in planes {@code xp, xp+1, …}, rows {@code from ..}. Whole: the sum
     * of addGeneral, y += 0 + p_0 + … + p_count−1; else acc += p_0 + … in that order. Missing
     * antennas count as h = 0, whose products are exact zeros and change no sum.
     */
    private static void addFour(double[] acc, boolean whole, double[] h, int ho, double[][] x, int xp, int count,
                                int part, int from, int rows) {
        double h0r = h[ho];
        double h0i = h[ho + 1];
        double h1r = count > 1 ? h[ho + 2] : 0.0;
        double h1i = count > 1 ? h[ho + 3] : 0.0;
        double h2r = count > 2 ? h[ho + 4] : 0.0;
        double h2i = count > 2 ? h[ho + 5] : 0.0;
        double h3r = count > 3 ? h[ho + 6] : 0.0;
        double h3i = count > 3 ? h[ho + 7] : 0.0;
        // real part: hr·xr − hi·xi, a = xr, b = xi; imaginary: hr·xi + hi·xr, a = xi, b = xr
        int own = part;
        int other = 1 - part;
        double[] a0 = x[xp + own];
        double[] b0 = x[xp + other];
        double[] a1 = count > 1 ? x[xp + 2 + own] : a0;
        double[] b1 = count > 1 ? x[xp + 2 + other] : b0;
        double[] a2 = count > 2 ? x[xp + 4 + own] : a0;
        double[] b2 = count > 2 ? x[xp + 4 + other] : b0;
        double[] a3 = count > 3 ? x[xp + 6 + own] : a0;
        double[] b3 = count > 3 ? x[xp + 6 + other] : b0;
        int end = from + rows;
        if (part == 0) {
            if (whole) {
                for (int i = from; i < end; i++) {
                    acc[i] += 0.0 + (h0r * a0[i] - h0i * b0[i]) + (h1r * a1[i] - h1i * b1[i])
                            + (h2r * a2[i] - h2i * b2[i]) + (h3r * a3[i] - h3i * b3[i]);
                }
            } else {
                for (int i = from; i < end; i++) {
                    acc[i] = acc[i] + (h0r * a0[i] - h0i * b0[i]) + (h1r * a1[i] - h1i * b1[i])
                            + (h2r * a2[i] - h2i * b2[i]) + (h3r * a3[i] - h3i * b3[i]);
                }
            }
        } else {
            if (whole) {
                for (int i = from; i < end; i++) {
                    acc[i] += 0.0 + (h0r * a0[i] + h0i * b0[i]) + (h1r * a1[i] + h1i * b1[i])
                            + (h2r * a2[i] + h2i * b2[i]) + (h3r * a3[i] + h3i * b3[i]);
                }
            } else {
                for (int i = from; i < end; i++) {
                    acc[i] = acc[i] + (h0r * a0[i] + h0i * b0[i]) + (h1r * a1[i] + h1i * b1[i])
                            + (h2r * a2[i] + h2i * b2[i]) + (h3r * a3[i] + h3i * b3[i]);
                }
            }
        }
    }

    /** y += x Hᵀ over {@code slots} slots, with H starting at {@code h[ho]}. */
    private static void addSignal(double[] h, int ho, int nr, int mt, double[] x, int xo, int slots,
                                  double[] y, int yo) {
        if (mt == 1) {
            addSingleTransmitter(h, ho, nr, x, xo, slots, y, yo);
        } else if (mt == 2) {
            addTwoTransmitters(h, ho, nr, x, xo, slots, y, yo);
        } else {
            addGeneral(h, ho, nr, mt, x, xo, slots, y, yo);
        }
    }

    private static void addSingleTransmitter(double[] h, int ho, int nr, double[] x, int xo, int slots, double[] y, int yo) {
        for (int s = 0; s < slots; s++) {
            double xr = x[xo + 2 * s];
            double xi = x[xo + 2 * s + 1];
            int o = yo + 2 * s * nr;
            for (int r = 0; r < nr; r++) {
                double hr = h[ho + 2 * r];
                double hi = h[ho + 2 * r + 1];
                y[o + 2 * r] += hr * xr - hi * xi;
                y[o + 2 * r + 1] += hr * xi + hi * xr;
            }
        }
    }

    private static void addTwoTransmitters(double[] h, int ho, int nr, double[] x, int xo, int slots, double[] y, int yo) {
        for (int s = 0; s < slots; s++) {
            int xs = xo + 4 * s;
            double x1r = x[xs];
            double x1i = x[xs + 1];
            double x2r = x[xs + 2];
            double x2i = x[xs + 3];
            int o = yo + 2 * s * nr;
            for (int r = 0; r < nr; r++) {
                double h1r = h[ho + 4 * r];
                double h1i = h[ho + 4 * r + 1];
                double h2r = h[ho + 4 * r + 2];
                double h2i = h[ho + 4 * r + 3];
                double re = Math.fma(h1r, x1r, Math.fma(-h1i, x1i, Math.fma(h2r, x2r, Math.fma(-h2i, x2i, y[o + 2 * r]))));
                double im = Math.fma(h1r, x1i, Math.fma(h1i, x1r, Math.fma(h2r, x2i, Math.fma(h2i, x2r, y[o + 2 * r + 1]))));
                y[o + 2 * r] = re;
                y[o + 2 * r + 1] = im;
            }
        }
    }

    private static void addGeneral(double[] h, int ho, int nr, int mt, double[] x, int xo, int slots, double[] y, int yo) {
        for (int s = 0; s < slots; s++) {
            int xs = xo + 2 * s * mt;
            int o = yo + 2 * s * nr;
            for (int r = 0; r < nr; r++) {
                int hr0 = ho + 2 * r * mt;
                double re = 0;
                double im = 0;
                for (int t = 0; t < mt; t++) {
                    double hr = h[hr0 + 2 * t];
                    double hi = h[hr0 + 2 * t + 1];
                    double xr = x[xs + 2 * t];
                    double xi = x[xs + 2 * t + 1];
                    re += hr * xr - hi * xi;
                    im += hr * xi + hi * xr;
                }
                y[o + 2 * r] += re;
                y[o + 2 * r + 1] += im;
            }
        }
    }
}
