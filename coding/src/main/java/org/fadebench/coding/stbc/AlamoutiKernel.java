package org.fadebench.coding.stbc;

/**
 * Alamouti's two-antenna code, specialised. Grid (rows = slots, columns = antennas), scaled by 1/√2
 * so the two antennas share unit total energy per slot:
 * <pre>
 *   X = 1/√2 · [  s1    s2  ]
 *              [ -s2*   s1* ]
 * </pre>
 * Combining, summed over receive antennas r: z1 = Σ h1r* y1r + h2r y2r*, z2 = Σ h2r* y1r - h1r y2r*,
 * which equal (‖H‖²/√2) s_k + noise; estimates ŝ_k = √2 z_k / ‖H‖² and gain ‖H‖²/2 (S. M. Alamouti,
 * "A simple transmit diversity technique for wireless communications", IEEE JSAC 16(8), 1998).
 */
public final class AlamoutiKernel implements Combiner, PlanarKernel {

    private static final double INV_SQRT2 = Math.sqrt(0.5);

    private final int nr;
    private final double[] h;
    private double scale;
    private double gain;

    public AlamoutiKernel(int nr) {
        this.nr = nr;
        this.h = new double[4 * nr];
    }

    /** Encodes {@code blocks} pairs of symbols into 2 x 2 grids. */
    public static void encode(double[] s, int symOffset, int blocks, double[] x, int gridRow) {
        for (int blk = 0; blk < blocks; blk++) {
            int so = 2 * (symOffset + 2 * blk);
            int xo = 4 * (gridRow + 2 * blk);
            double s1r = s[so] * INV_SQRT2;
            double s1i = s[so + 1] * INV_SQRT2;
            double s2r = s[so + 2] * INV_SQRT2;
            double s2i = s[so + 3] * INV_SQRT2;
            x[xo] = s1r;
            x[xo + 1] = s1i;
            x[xo + 2] = s2r;
            x[xo + 3] = s2i;
            x[xo + 4] = -s2r;
            x[xo + 5] = s2i;
            x[xo + 6] = s1r;
            x[xo + 7] = -s1i;
        }
    }

    /**
     * {@link #encode(double[], int, int, double[], int)} on planar arrays, the same values in the
     * same places: {@code s} holds four planes (Re s1, Im s1, Re s2, Im s2 of each block), {@code x}
     * eight (slot τ, antenna t, real and imaginary parts in plane 2·(2τ + t) and the next), element
     * i of each plane belonging to block i. Blocks {@code from .. from+blocks)} are encoded.
     */
    @Override
    public void encode(double[][] s, int from, int blocks, double[][] x) {
        // slot 1: (s1, s2)/√2 in planes 0-3; slot 2: (-s2*, s1*)/√2 in planes 4-7
        spread(s[0], from, blocks, x[0], x[6], 1.0);
        spread(s[1], from, blocks, x[1], x[7], -1.0);
        spread(s[2], from, blocks, x[2], x[4], -1.0);
        spread(s[3], from, blocks, x[3], x[5], 1.0);
    }

    /** a = s/√2 and b = sign·s/√2 over {@code from .. from+n)}; sign ±1, so b is exactly ±a. */
    private static void spread(double[] s, int from, int n, double[] a, double[] b, double sign) {
        for (int i = from, end = from + n; i < end; i++) {
            double v = s[i] * INV_SQRT2;
            a[i] = v;
            b[i] = v * sign;
        }
    }

    @Override
    public void setChannel(double[] hIn) {
        System.arraycopy(hIn, 0, h, 0, 4 * nr);
        double norm2 = 0;
        for (int i = 0; i < 4 * nr; i++) {
            norm2 += hIn[i] * hIn[i];
        }
        gain = 0.5 * norm2;
        scale = norm2 > 0 ? Math.sqrt(2.0) / norm2 : 0.0;
    }

    @Override
    public double gain(int symbol) {
        return gain;
    }

    @Override
    public void combine(double[] y, int yRow, int blocks, double[] est, double[] gainOut, int symOffset) {
        final int nr = this.nr;
        final double[] h = this.h;
        for (int blk = 0; blk < blocks; blk++) {
            int y1 = 2 * (yRow + 2 * blk) * nr;
            int y2 = y1 + 2 * nr;
            double z1r = 0;
            double z1i = 0;
            double z2r = 0;
            double z2i = 0;
            for (int r = 0; r < nr; r++) {
                double h1r = h[4 * r];
                double h1i = h[4 * r + 1];
                double h2r = h[4 * r + 2];
                double h2i = h[4 * r + 3];
                double a1r = y[y1 + 2 * r];
                double a1i = y[y1 + 2 * r + 1];
                double a2r = y[y2 + 2 * r];
                double a2i = y[y2 + 2 * r + 1];
                // z1 += conj(h1) y1 + h2 conj(y2)
                z1r = Math.fma(h1r, a1r, Math.fma(h1i, a1i, Math.fma(h2r, a2r, Math.fma(h2i, a2i, z1r))));
                z1i = Math.fma(h1r, a1i, Math.fma(-h1i, a1r, Math.fma(h2i, a2r, Math.fma(-h2r, a2i, z1i))));
                // z2 += conj(h2) y1 - h1 conj(y2)
                z2r = Math.fma(h2r, a1r, Math.fma(h2i, a1i, Math.fma(-h1r, a2r, Math.fma(-h1i, a2i, z2r))));
                z2i = Math.fma(h2r, a1i, Math.fma(-h2i, a1r, Math.fma(-h1i, a2r, Math.fma(h1r, a2i, z2i))));
            }
            int so = symOffset + 2 * blk;
            est[2 * so] = z1r * scale;
            est[2 * so + 1] = z1i * scale;
            est[2 * so + 2] = z2r * scale;
            est[2 * so + 3] = z2i * scale;
            gainOut[so] = gain;
            gainOut[so + 1] = gain;
        }
    }

    /**
     * {@link #combine(double[], int, int, double[], double[], int)} on planar arrays, with the same
     * arithmetic per element: {@code y} holds 4·Nr planes (slot τ, receive antenna r, real and
     * imaginary parts in plane 2·(τ·Nr + r) and the next), {@code est} four (Re ŝ1, Im ŝ1, Re ŝ2,
     * Im ŝ2), element i of each plane belonging to block i. Blocks {@code from .. from+blocks)} are
     * combined. No gains are written: every symbol's is ‖Ĥ‖²/2, as the interleaved combine writes.
     */
    @Override
    public void combine(double[][] y, int from, int blocks, double[][] est) {
        final int end = from + blocks;
        // the sums of the interleaved combine, one loop per part and antenna (short loops vectorise);
        // the first antenna starts each sum from 0, the last one applies the scale
        for (int r = 0; r < nr; r++) {
            double h1r = h[4 * r];
            double h1i = h[4 * r + 1];
            double h2r = h[4 * r + 2];
            double h2i = h[4 * r + 3];
            double[] a1r = y[2 * r];
            double[] a1i = y[2 * r + 1];
            double[] a2r = y[2 * (nr + r)];
            double[] a2i = y[2 * (nr + r) + 1];
            boolean add = r > 0;
            double s = r == nr - 1 ? scale : 1.0;
            sumInto(est[0], h1r, a1r, h1i, a1i, h2r, a2r, h2i, a2i, add, s, from, end);
            sumInto(est[1], h1r, a1i, -h1i, a1r, h2i, a2r, -h2r, a2i, add, s, from, end);
            sumInto(est[2], h2r, a1r, h2i, a1i, -h1r, a2r, -h1i, a2i, add, s, from, end);
            sumInto(est[3], h2r, a1i, -h2i, a1r, -h1i, a2r, h1r, a2i, add, s, from, end);
        }
    }

    /**
     * {@code z[i] = (c1·a[i] + c2·b[i] + c3·c[i] + c4·d[i] + (add ? z[i] : 0)) · s} for i in
     * {@code from .. end)}, as the fused multiply-adds of the interleaved combine (s = 1 is exact).
     */
    private static void sumInto(double[] z, double c1, double[] a, double c2, double[] b, double c3, double[] c,
                                double c4, double[] d, boolean add, double s, int from, int end) {
        if (add) {
            for (int i = from; i < end; i++) {
                z[i] = Math.fma(c1, a[i], Math.fma(c2, b[i], Math.fma(c3, c[i], Math.fma(c4, d[i], z[i])))) * s;
            }
        } else {
            for (int i = from; i < end; i++) {
                z[i] = Math.fma(c1, a[i], Math.fma(c2, b[i], Math.fma(c3, c[i], Math.fma(c4, d[i], 0.0)))) * s;
            }
        }
    }
}
