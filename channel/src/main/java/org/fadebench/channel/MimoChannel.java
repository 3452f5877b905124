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
     * element, the sum of the interleaved {@code addGeneral}, 0 + p_0 + … + p_Mt−1 in that order,
     * added to the noise. The sum runs in {@code sum}, a work plane of at least {@code from + rows}
     * entries, two antennas a pass: a loop of four planes, which C2 vectorises (one of eight
     * planes, four antennas a pass, it does not); the last pass adds the sum to the noise.
     */
    public static void applyPlanar(double[] h, int nr, int mt, double[][] x, int from, int rows, double n0,
                                   Draws draws, double[][] y, double[] sum) {
        int slots = x.length / (2 * mt);
        if (mt == 2 || x.length != 2 * mt * slots || y.length != 2 * slots * nr || sum.length < from + rows) {
            throw new IllegalArgumentException("planes: x needs 2·T·Mt, y 2·T·Nr (Mt ≠ 2), got " + x.length
                    + " and " + y.length);
        }
        draws.fillGaussian(y, from, rows, Math.sqrt(0.5 * n0));
        int end = from + rows;
        for (int tau = 0; tau < slots; tau++) {
            for (int r = 0; r < nr; r++) {
                for (int part = 0; part < 2; part++) {
                    double[] yp = y[2 * (tau * nr + r) + part];
                    for (int t = 0; t < mt; t += 2) {
                        // the sum's last pass adds it to the noise, unless it is also the first
                        double[] into = t > 0 && t + 2 >= mt ? yp : null;
                        addTwo(sum, t == 0, into, h, 2 * (r * mt + t), x, 2 * (tau * mt + t), Math.min(2, mt - t),
                                part, from, end);
                    }
                    if (mt <= 2) {
                        for (int i = from; i < end; i++) {
                            yp[i] += sum[i];
                        }
                    }
                }
            }
        }
    }

    /**
     * Adds the products p_t (real part for part 0, imaginary for 1) of {@code count} (1 or 2)
     * antennas to the sum {@code acc}, or to 0 when {@code start}, and keeps the sum in
     * {@code acc}, or adds it to {@code into} when that is not null (and not {@code start}): h from
     * {@code h[ho]}, x in planes {@code xp, xp+1, …}. The real part hr·xr − hi·xi is summed as
     * hr·xr + (−hi)·xi, the same number. A missing second antenna counts as h = 0, whose products
     * are exact zeros and change no sum (which never is −0, having started from +0).
     */
    private static void addTwo(double[] acc, boolean start, double[] into, double[] h, int ho, double[][] x, int xp,
                               int count, int part, int from, int end) {
        // real part: hr·xr + (−hi)·xi, a = xr, b = xi; imaginary: hr·xi + hi·xr, a = xi, b = xr
        double sign = part == 0 ? -1.0 : 1.0;
        double c0 = h[ho];
        double d0 = sign * h[ho + 1];
        double c1 = count > 1 ? h[ho + 2] : 0.0;
        double d1 = count > 1 ? sign * h[ho + 3] : 0.0;
        double[] a0 = x[xp + part];
        double[] b0 = x[xp + 1 - part];
        double[] a1 = count > 1 ? x[xp + 2 + part] : a0;
        double[] b1 = count > 1 ? x[xp + 3 - part] : b0;
        if (start) {
            for (int i = from; i < end; i++) {
                acc[i] = 0.0 + (c0 * a0[i] + d0 * b0[i]) + (c1 * a1[i] + d1 * b1[i]);
            }
        } else if (into != null) {
            for (int i = from; i < end; i++) {
                into[i] = into[i] + (acc[i] + (c0 * a0[i] + d0 * b0[i]) + (c1 * a1[i] + d1 * b1[i]));
            }
        } else {
            for (int i = from; i < end; i++) {
                acc[i] = acc[i] + (c0 * a0[i] + d0 * b0[i]) + (c1 * a1[i] + d1 * b1[i]);
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
