package org.fadebench.coding.stbc;

import java.util.Objects;

/**
 * A linear space-time block code in dispersion-matrix form: K complex symbols s_k = a_k + j b_k are
 * sent over T slots on Mt antennas as the T x Mt grid
 * <pre>  X = Σ_k (a_k · A_k + b_k · B_k)  </pre>
 * with complex T x Mt matrices A_k, B_k (B_k absorbs the factor j). Every linear code, including
 * those with conjugated symbols, has this form (B. Hassibi and B. M. Hochwald, "High-rate codes that
 * are linear in space and time", IEEE Trans. Inf. Theory 48(7), 2002).
 *
 * <p>Matrices are stored interleaved complex, row-major (slot, antenna), and already include the
 * code's power scale, chosen so that with unit-energy symbols the average total energy per slot,
 * summed over antennas, is 1 (the SNR convention: see README). A code object is immutable.
 */
public final class SpaceTimeCode {

    /** Which specialised kernel may stand in for the general encoder and combiner. */
    public enum Kernel { SINGLE_ANTENNA, ALAMOUTI, GENERAL }

    private final String name;
    private final int mt;
    private final int k;
    private final int t;
    private final double[][] a;
    private final double[][] b;
    private final String scaleNote;
    private final Kernel kernel;

    SpaceTimeCode(String name, int mt, int k, int t, double[][] a, double[][] b, String scaleNote,
                  Kernel kernel) {
        this.name = Objects.requireNonNull(name);
        this.mt = mt;
        this.k = k;
        this.t = t;
        this.a = deepCopy(a);
        this.b = deepCopy(b);
        this.scaleNote = scaleNote;
        this.kernel = kernel;
        if (a.length != k || b.length != k) {
            throw new IllegalArgumentException("code " + name + ": expected " + k + " dispersion matrices");
        }
        for (int i = 0; i < k; i++) {
            if (a[i].length != 2 * t * mt || b[i].length != 2 * t * mt) {
                throw new IllegalArgumentException("code " + name + ": dispersion matrix " + i
                        + " is not " + t + " x " + mt);
            }
        }
    }

    private static double[][] deepCopy(double[][] m) {
        double[][] c = new double[m.length][];
        for (int i = 0; i < m.length; i++) {
            c[i] = m[i].clone();
        }
        return c;
    }

    public String name() {
        return name;
    }

    /** Transmit antennas Mt. */
    public int transmitAntennas() {
        return mt;
    }

    /** Complex symbols per code block K. */
    public int symbolsPerBlock() {
        return k;
    }

    /** Slots (channel uses) per code block T. */
    public int slotsPerBlock() {
        return t;
    }

    /** Symbol rate K/T. */
    public double rate() {
        return (double) k / t;
    }

    /** How the power scale was chosen, for the catalogue listing. */
    public String scaleNote() {
        return scaleNote;
    }

    public Kernel kernel() {
        return kernel;
    }

    /** Copy of A_k (coefficient of Re s_k), interleaved complex T x Mt. */
    public double[] realDispersion(int symbol) {
        return a[symbol].clone();
    }

    /** Copy of B_k (coefficient of Im s_k), interleaved complex T x Mt. */
    public double[] imagDispersion(int symbol) {
        return b[symbol].clone();
    }

    /** The encoder for this code: the specialised kernel where there is one. */
    public StbcEncoder newEncoder() {
        switch (kernel) {
            case SINGLE_ANTENNA:
                return SingleAntennaKernel::encode;
            case ALAMOUTI:
                return AlamoutiKernel::encode;
            default:
                return new LinearEncoder(this);
        }
    }

    /** The matched-filter combiner for {@code nr} receive antennas: the fast kernel where there is one. */
    public Combiner newCombiner(int nr) {
        switch (kernel) {
            case SINGLE_ANTENNA:
                return new SingleAntennaKernel(nr);
            case ALAMOUTI:
                return new AlamoutiKernel(nr);
            default:
                return new MatchedFilterCombiner(this, nr);
        }
    }

    /** Encodes with the general dispersion-matrix formula (reference path; allocation-free). */
    void encodeGeneral(double[] symbols, int symOffset, int blocks, double[] grid, int gridRow) {
        int cells = t * mt;
        for (int blk = 0; blk < blocks; blk++) {
            int go = 2 * (gridRow + blk * t) * mt;
            for (int c = 0; c < 2 * cells; c++) {
                grid[go + c] = 0.0;
            }
            for (int i = 0; i < k; i++) {
                int so = 2 * (symOffset + blk * k + i);
                double re = symbols[so];
                double im = symbols[so + 1];
                double[] ai = a[i];
                double[] bi = b[i];
                for (int c = 0; c < 2 * cells; c++) {
                    grid[go + c] += re * ai[c] + im * bi[c];
                }
            }
        }
    }
}
