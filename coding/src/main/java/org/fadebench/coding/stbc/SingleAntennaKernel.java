package org.fadebench.coding.stbc;

/**
 * One transmit antenna, no space-time code (SISO and SIMO): maximal-ratio combining over the
 * receive antennas, z = Σ_r h_r* y_r, ŝ = z / ‖h‖², gain ‖h‖² (D. G. Brennan, "Linear diversity
 * combining techniques", Proc. IRE 47(6), 1959).
 */
public final class SingleAntennaKernel implements Combiner {

    private final int nr;
    private final double[] h;
    private double inv;
    private double gain;

    public SingleAntennaKernel(int nr) {
        this.nr = nr;
        this.h = new double[2 * nr];
    }

    /** The grid is the symbol sequence itself. */
    public static void encode(double[] s, int symOffset, int blocks, double[] x, int gridRow) {
        System.arraycopy(s, 2 * symOffset, x, 2 * gridRow, 2 * blocks);
    }

    @Override
    public void setChannel(double[] hIn) {
        System.arraycopy(hIn, 0, h, 0, 2 * nr);
        double norm2 = 0;
        for (int i = 0; i < 2 * nr; i++) {
            norm2 += hIn[i] * hIn[i];
        }
        gain = norm2;
        inv = norm2 > 0 ? 1.0 / norm2 : 0.0;
    }

    @Override
    public void combine(double[] y, int yRow, int blocks, double[] est, double[] gainOut, int symOffset) {
        final int nr = this.nr;
        final double[] h = this.h;
        for (int n = 0; n < blocks; n++) {
            int yo = 2 * (yRow + n) * nr;
            double zr = 0;
            double zi = 0;
            for (int r = 0; r < nr; r++) {
                double hr = h[2 * r];
                double hi = h[2 * r + 1];
                double ar = y[yo + 2 * r];
                double ai = y[yo + 2 * r + 1];
                zr += hr * ar + hi * ai;
                zi += hr * ai - hi * ar;
            }
            int so = symOffset + n;
            est[2 * so] = zr * inv;
            est[2 * so + 1] = zi * inv;
            gainOut[so] = gain;
        }
    }
}
