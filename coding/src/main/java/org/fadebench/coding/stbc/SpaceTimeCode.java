package org.fadebench.coding.stbc;

import java.io.Serializable;
import java.util.Objects;
import java.util.Optional;

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
public final class SpaceTimeCode implements Serializable {

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
    private final boolean orthogonal;

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
        this.orthogonal = CodeChecks.orthogonal(this);
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

    /**
     * Whether X^H X = c·(Σ_k |s_k|²)·I for one constant c, checked numerically on random symbols
     * when the code is made (see {@link CodeChecks#orthogonal}). An orthogonal code is decoded
     * exactly (ML) by the matched filter and per-symbol slicing.
     */
    public boolean isOrthogonal() {
        return orthogonal;
    }

    /**
     * The rank criterion for full transmit diversity, checked numerically: X(d) has rank Mt for
     * every single-symbol difference d and for random complex differences (see
     * {@link CodeChecks#fullDiversity} for exactly what is and is not covered). Computed afresh
     * on each call.
     */
    public boolean hasFullDiversity() {
        return CodeChecks.fullDiversity(this);
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
        checkReceiveAntennas(nr);
        switch (kernel) {
            case SINGLE_ANTENNA:
                return new SingleAntennaKernel(nr);
            case ALAMOUTI:
                return new AlamoutiKernel(nr);
            default:
                return new MatchedFilterCombiner(this, nr);
        }
    }

    /**
     * The combiner for {@code nr} receive antennas and the given equaliser. For an orthogonal code
     * ZF and MMSE give exactly the matched filter's estimates and gains, so the matched filter
     * (the fast kernel where there is one) serves every equaliser.
     *
     * @param n0 noise density (complex noise variance per receive entry); read by MMSE only, which
     *           needs it finite and not negative, and a new combiner per value
     * @throws IllegalArgumentException for nr < 1, a bad n0 for MMSE, or ZF on a code it cannot
     *                                  separate with nr antennas
     */
    public Combiner newCombiner(int nr, Equaliser equaliser, double n0) {
        checkReceiveAntennas(nr);
        if (equaliser == Equaliser.MMSE) {
            LinearEqualiser.checkNoise(n0);
        }
        if (equaliser == Equaliser.MF || orthogonal) {
            return newCombiner(nr);
        }
        return equaliser == Equaliser.ZF ? LinearEqualiser.zeroForcing(this, nr) : LinearEqualiser.mmse(this, nr, n0);
    }

    /**
     * The kernel that runs this code on planar arrays for {@code nr} receive antennas (see
     * {@link PlanarKernel}), or empty when the code has none: Alamouti's own kernel, else the
     * {@link DesignKernel} of an orthogonal code whose grid entries are each ±s_k, ±s_k* or 0 up
     * to the power scale (the single-antenna code and the other codes have none).
     */
    public Optional<PlanarKernel> newPlanarKernel(int nr) {
        checkReceiveAntennas(nr);
        switch (kernel) {
            case ALAMOUTI:
                return Optional.of(new AlamoutiKernel(nr));
            case GENERAL:
                return Optional.ofNullable(DesignKernel.of(this, nr));
            default:
                return Optional.empty();
        }
    }

    /** Whether {@link #newPlanarKernel} gives a kernel. */
    public boolean hasPlanarKernel() {
        return newPlanarKernel(1).isPresent();
    }

    static void checkReceiveAntennas(int nr) {
        if (nr < 1) {
            throw new IllegalArgumentException("receive antennas must be at least 1, got " + nr + "; valid: 1, 2, 3, ...");
        }
    }

    /**
     * Average total energy per slot, E‖X‖²_F / T, for symbols whose real and imaginary parts are
     * independent, zero-mean, of variance 1/2: (1/T)·Σ_k (‖A_k‖² + ‖B_k‖²)/2.
     */
    static double averageSlotEnergy(double[][] a, double[][] b, int t) {
        double sum = 0;
        for (int i = 0; i < a.length; i++) {
            for (int c = 0; c < a[i].length; c++) {
                sum += a[i][c] * a[i][c] + b[i][c] * b[i][c];
            }
        }
        return sum / (2.0 * t);
    }

    /**
     * The factor 1/√E that brings a code to unit average energy per slot (E as in
     * {@link #averageSlotEnergy}), without overflow or underflow on the way: the entries are first
     * multiplied by 2^−e, 2^e the power of two at or below their largest magnitude. That product is
     * exact, so wherever E itself is a normal number the factor has the very bits of
     * {@code 1 / Math.sqrt(E)}. 0 when every entry is zero; infinite or below
     * {@link Double#MIN_NORMAL} when the entries are too small or too large to be scaled.
     */
    static double unitEnergyScale(double[][] a, double[][] b, int t) {
        double largest = 0;
        for (int i = 0; i < a.length; i++) {
            for (int c = 0; c < a[i].length; c++) {
                largest = Math.max(largest, Math.max(Math.abs(a[i][c]), Math.abs(b[i][c])));
            }
        }
        if (largest == 0) {
            return 0;
        }
        double down = Math.scalb(1.0, -Math.getExponent(largest));
        double sum = 0;
        for (int i = 0; i < a.length; i++) {
            for (int c = 0; c < a[i].length; c++) {
                double re = a[i][c] * down;
                double im = b[i][c] * down;
                sum += re * re + im * im;
            }
        }
        return down / Math.sqrt(sum / (2.0 * t));
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
