package org.fadebench.modem;

/**
 * Gray-labelled square QAM (and BPSK) with unit average symbol energy, with the three operations
 * the link needs: bit-to-symbol mapping, hard decisions by per-axis slicing, and max-log LLRs.
 *
 * <p>Layout (common practice, no source): a symbol carries {@code bitsPerSymbol} bits; the first
 * half select the in-phase amplitude and the second half the quadrature amplitude (BPSK uses the
 * in-phase axis only). On each axis the {@code L = 2^m} amplitudes {@code (L-1-2i)·scale},
 * {@code i = 0..L-1}, carry the binary-reflected Gray code of {@code i}, most significant bit
 * first, so neighbouring amplitudes differ in exactly one bit and the all-zero label sits at the
 * most positive amplitude. {@code scale = sqrt(3 / (2 (M-1)))} gives unit average energy for square
 * M-QAM; BPSK uses amplitudes ±1.
 *
 * <p>Complex numbers are interleaved in {@code double[]} arrays: element {@code 2k} is the real part
 * and {@code 2k+1} the imaginary part of entry {@code k}. Bits are one per {@code byte}, 0 or 1.
 * No method allocates.
 */
public final class QamConstellation {

    private final Modulation modulation;
    private final int bitsPerSymbol;
    private final int bitsPerAxis;
    private final int levels;
    private final double scale;
    private final double invScale;
    private final boolean twoAxes;
    /** Amplitude of the level whose Gray label (as an integer, MSB first) is the index. */
    private final double[] amplitudeOfLabel;
    /** Gray label (integer) of level index i, where level i has amplitude (L-1-2i)·scale. */
    private final int[] labelOfLevel;
    /** Amplitude of level index i. */
    private final double[] amplitudeOfLevel;
    /** Estimates are clamped to ± this (half a spacing beyond the outermost amplitudes) before the check. */
    private final double clampEdge;
    /** Estimates within this of their sent amplitude are surely sliced to it. */
    private final double surelyInside;

    QamConstellation(Modulation modulation) {
        this.modulation = modulation;
        this.bitsPerSymbol = modulation.bitsPerSymbol();
        this.twoAxes = modulation != Modulation.BPSK;
        this.bitsPerAxis = twoAxes ? bitsPerSymbol / 2 : 1;
        this.levels = 1 << bitsPerAxis;
        int order = modulation.order();
        this.scale = twoAxes ? Math.sqrt(3.0 / (2.0 * (order - 1))) : 1.0;
        this.invScale = 1.0 / scale;
        this.amplitudeOfLabel = new double[levels];
        this.labelOfLevel = new int[levels];
        this.amplitudeOfLevel = new double[levels];
        for (int i = 0; i < levels; i++) {
            int gray = i ^ (i >>> 1);
            double amplitude = (levels - 1 - 2 * i) * scale;
            labelOfLevel[i] = gray;
            amplitudeOfLevel[i] = amplitude;
            amplitudeOfLabel[gray] = amplitude;
        }
        this.clampEdge = (levels - 0.5) * scale;
        this.surelyInside = (1.0 - 1e-9) * scale;
    }

    public Modulation modulation() {
        return modulation;
    }

    public int bitsPerSymbol() {
        return bitsPerSymbol;
    }

    /** Number of amplitude levels per axis (2 for BPSK and QPSK). */
    public int levelsPerAxis() {
        return levels;
    }

    /** Distance from a level to the decision boundary halfway to its neighbour. */
    public double halfSpacing() {
        return scale;
    }

    /**
     * Maps {@code count} symbols' worth of bits to symbols.
     *
     * @param bits       one bit per byte, read from {@code bitOffset}
     * @param symbols    interleaved complex output, written from complex index {@code symOffset}
     */
    public void map(byte[] bits, int bitOffset, double[] symbols, int symOffset, int count) {
        for (int n = 0, b = bitOffset, o = symOffset << 1; n < count; n++, b += bitsPerSymbol, o += 2) {
            int label = label(bits, b);
            symbols[o] = amplitudeOfLabel[twoAxes ? label >>> bitsPerAxis : label];
            symbols[o + 1] = twoAxes ? amplitudeOfLabel[label & (levels - 1)] : 0.0;
        }
    }

    /**
     * {@link #map(byte[], int, double[], int, int)} into planes of real and imaginary parts, the
     * symbols' bits {@code bitStride} apart: the bits at {@code bits[bitOffset + i·bitStride ..]}
     * to {@code re[i]}, {@code im[i]} for i in {@code 0 .. count)}.
     */
    public void map(byte[] bits, int bitOffset, int bitStride, double[] re, double[] im, int count) {
        for (int i = 0, b = bitOffset; i < count; i++, b += bitStride) {
            int label = label(bits, b);
            re[i] = amplitudeOfLabel[twoAxes ? label >>> bitsPerAxis : label];
            im[i] = twoAxes ? amplitudeOfLabel[label & (levels - 1)] : 0.0;
        }
    }

    /** The label of a symbol (see {@link #mapLabels}): its {@link #bitsPerSymbol} bits from {@code bits[b]}, the first most significant. */
    private int label(byte[] bits, int b) {
        int label = 0;
        for (int j = 0; j < bitsPerSymbol; j++) {
            label = (label << 1) | bits[b + j];
        }
        return label;
    }

    /**
     * Maps symbol labels to symbols: label bits are the symbol's bits, its first bit most
     * significant (so the label of bits b0 b1 b2 b3 is b0·8 + b1·4 + b2·2 + b3), exactly as
     * {@link #map} would map those bits.
     */
    public void mapLabels(int[] labels, int labelOffset, double[] symbols, int symOffset, int count) {
        final int m = bitsPerAxis;
        final int mask = (1 << m) - 1;
        final double[] amp = amplitudeOfLabel;
        int o = symOffset << 1;
        if (twoAxes) {
            for (int n = 0; n < count; n++) {
                int label = labels[labelOffset + n];
                symbols[o++] = amp[label >>> m];
                symbols[o++] = amp[label & mask];
            }
        } else {
            for (int n = 0; n < count; n++) {
                symbols[o++] = amp[labels[labelOffset + n]];
                symbols[o++] = 0.0;
            }
        }
    }

    /**
     * {@link #mapLabels(int[], int, double[], int, int)} into planes of real and imaginary parts:
     * the label {@code labels[i]} to {@code re[i]}, {@code im[i]} for i in {@code from .. from+count)}.
     */
    public void mapLabels(int[] labels, double[] re, double[] im, int from, int count) {
        final int m = bitsPerAxis;
        final int mask = (1 << m) - 1;
        final double[] amp = amplitudeOfLabel;
        final int end = from + count;
        if (twoAxes) {
            for (int i = from; i < end; i++) {
                re[i] = amp[labels[i] >>> m];
                im[i] = amp[labels[i] & mask];
            }
        } else {
            for (int i = from; i < end; i++) {
                re[i] = amp[labels[i]];
                im[i] = 0.0;
            }
        }
    }

    /**
     * {@link #demapLabels(double[], int, int[], int, int)} from planes of real and imaginary parts:
     * the estimate {@code re[i]}, {@code im[i]} to {@code labels[i]} for i in {@code from ..
     * from+count)}.
     */
    public void demapLabels(double[] re, double[] im, int[] labels, int from, int count) {
        for (int i = from, end = from + count; i < end; i++) {
            labels[i] = decide(re[i], im[i]);
        }
    }

    /**
     * Counts the errors of hard decisions on the estimates {@code re[i]}, {@code im[i]} of symbols
     * sent with labels {@code labels[i]}, which {@link #mapLabels(int[], double[], double[], int, int)}
     * mapped to {@code sentRe[i]}, {@code sentIm[i]}, for i in {@code from .. from+count)}: adds the
     * wrong bits to {@code counts[0]} and the wrong symbols to {@code counts[1]}. The counts equal
     * those of {@link #demapLabels(double[], double[], int[], int, int)} compared label by label;
     * only estimates not surely decided on both axes (see surelyDecided) are sliced.
     */
    public void countHardErrors(int[] labels, double[] sentRe, double[] sentIm, double[] re, double[] im,
                                int from, int count, int[] counts) {
        int bitErrors = 0;
        int symbolErrors = 0;
        for (int i = from, end = from + count; i < end; i++) {
            // one branch per symbol: & evaluates both axes
            if (!(surelyDecided(re[i], sentRe[i]) & (!twoAxes || surelyDecided(im[i], sentIm[i])))) {
                int wrong = labels[i] ^ decide(re[i], im[i]);
                bitErrors += Integer.bitCount(wrong);
                symbolErrors += wrong != 0 ? 1 : 0;
            }
        }
        counts[0] += bitErrors;
        counts[1] += symbolErrors;
    }

    /**
     * {@link #countHardErrors(int[], double[], double[], double[], double[], int, int, int[])} on
     * interleaved complex arrays: labels from {@code labelOffset}, the symbols sent ({@code sent})
     * and their estimates from complex index {@code symOffset}.
     */
    public void countHardErrors(int[] labels, int labelOffset, double[] sent, double[] estimates, int symOffset,
                                int count, int[] counts) {
        int bitErrors = 0;
        int symbolErrors = 0;
        for (int n = 0, e = symOffset << 1; n < count; n++, e += 2) {
            if (!(surelyDecided(estimates[e], sent[e]) & (!twoAxes || surelyDecided(estimates[e + 1], sent[e + 1])))) {
                int wrong = labels[labelOffset + n] ^ decide(estimates[e], estimates[e + 1]);
                bitErrors += Integer.bitCount(wrong);
                symbolErrors += wrong != 0 ? 1 : 0;
            }
        }
        counts[0] += bitErrors;
        counts[1] += symbolErrors;
    }

    /**
     * Whether the estimate {@code y} of an amplitude {@code sent} of this constellation is surely
     * sliced to {@code sent}: {@code |clamp(y) - sent| < (1 - 1e-9)·halfSpacing}, where clamp
     * limits y to half a spacing beyond the outermost amplitudes (every estimate beyond an outermost
     * amplitude is sliced to it). The margin of 1e-9 covers the rounding of the slicer's
     * arithmetic, below 1e-13 of a spacing for up to 16 levels per axis; NaN is never surely
     * decided.
     */
    private boolean surelyDecided(double y, double sent) {
        double clamped = y > clampEdge ? clampEdge : y < -clampEdge ? -clampEdge : y;
        return Math.abs(clamped - sent) < surelyInside;
    }

    /** Hard decisions as labels (see {@link #mapLabels}), by per-axis slicing. */
    public void demapLabels(double[] estimates, int symOffset, int[] labels, int labelOffset, int count) {
        for (int n = 0, e = symOffset << 1; n < count; n++, e += 2) {
            labels[labelOffset + n] = decide(estimates[e], estimates[e + 1]);
        }
    }

    /**
     * Hard decisions by per-axis slicing (minimum Euclidean distance, no search over points).
     *
     * @param estimates interleaved complex symbol estimates on the unit-energy scale
     * @param bits      decided bits, one per byte, written from {@code bitOffset}
     */
    public void demapHard(double[] estimates, int symOffset, byte[] bits, int bitOffset, int count) {
        int b = bitOffset;
        int e = symOffset << 1;
        for (int n = 0; n < count; n++) {
            b = writeLabel(labelOfLevel[slice(estimates[e])], bits, b);
            if (twoAxes) {
                b = writeLabel(labelOfLevel[slice(estimates[e + 1])], bits, b);
            }
            e += 2;
        }
    }

    /** The label of the hard decision on the estimate (re, im) (BPSK: on re alone). */
    private int decide(double re, double im) {
        if (twoAxes) {
            return (labelOfLevel[slice(re)] << bitsPerAxis) | labelOfLevel[slice(im)];
        }
        return labelOfLevel[slice(re)];
    }

    /** Level index nearest to amplitude {@code y}: level i sits at (L-1-2i)·scale. */
    private int slice(double y) {
        // i = round(((L-1) - y/scale) / 2), clamped to [0, L-1]
        int i = (int) Math.floor(((levels - 1) - y * invScale) * 0.5 + 0.5);
        if (i < 0) {
            return 0;
        }
        return Math.min(i, levels - 1);
    }

    private int writeLabel(int label, byte[] bits, int b) {
        for (int j = bitsPerAxis - 1; j >= 0; j--) {
            bits[b++] = (byte) ((label >>> j) & 1);
        }
        return b;
    }

    /**
     * Max-log bit log-likelihood ratios, {@code LLR = ln P(b=0|y) / P(b=1|y)} approximated by
     * {@code (min_{s: b=1} |y-s|² - min_{s: b=0} |y-s|²) · gain / n0}: positive favours bit 0.
     *
     * <p>The estimate of symbol k is modelled as {@code s_k + w_k}, {@code w_k ~ CN(0, n0/gain_k)},
     * which is what the combiners deliver. Max-log: the sum over points in each bit's subset is
     * replaced by its largest term (e.g. J. G. Proakis and M. Salehi, Digital Communications, 5th
     * ed.; common practice). With Gray square QAM the two axes separate, so each axis is solved on
     * its own over its L amplitudes.
     *
     * @param gain per-symbol post-combining gain, read from {@code symOffset}
     * @param n0   noise power spectral density (complex noise variance before combining)
     * @param llr  output, {@code bitsPerSymbol} values per symbol, written from {@code llrOffset}
     */
    public void demapMaxLog(double[] estimates, double[] gain, int symOffset, double n0,
                            double[] llr, int llrOffset, int count) {
        demap(estimates, gain, symOffset, n0, llr, llrOffset, count, false);
    }

    /**
     * Exact bit LLRs, {@code LLR = ln Σ_{s: b=0} exp(-|y-s|² g/n0) - ln Σ_{s: b=1} exp(-|y-s|² g/n0)}
     * (the bit LLR with equiprobable symbols and CN(0, n0/g) noise; e.g. Proakis and Salehi,
     * Digital Communications, 5th ed.), each sum evaluated as a log-sum-exp shifted by its largest
     * term. With Gray square QAM the likelihood factors over the two axes and each bit lives on
     * one axis, so the sums run over one axis's L amplitudes. Same layout as {@link #demapMaxLog}.
     */
    public void demapExact(double[] estimates, double[] gain, int symOffset, double n0,
                           double[] llr, int llrOffset, int count) {
        demap(estimates, gain, symOffset, n0, llr, llrOffset, count, true);
    }

    private void demap(double[] estimates, double[] gain, int symOffset, double n0, double[] llr, int llrOffset,
                       int count, boolean exact) {
        for (int n = 0, l = llrOffset; n < count; n++, l += bitsPerSymbol) {
            int k = symOffset + n;
            symbolLlr(estimates[2 * k], estimates[2 * k + 1], gain[k] / n0, exact, llr, l);
        }
    }

    /** The LLRs of the estimate (re, im) at weight w = gain / n0 (BPSK: of re alone), from {@code llr[l]}. */
    private void symbolLlr(double re, double im, double w, boolean exact, double[] llr, int l) {
        int next = axisLlr(re, w, exact, llr, l);
        if (twoAxes) {
            axisLlr(im, w, exact, llr, next);
        }
    }

    /**
     * Bit LLRs by the given method (see {@link #demapMaxLog} and {@link #demapExact}).
     */
    public void demap(LlrMethod method, double[] estimates, double[] gain, int symOffset, double n0,
                      double[] llr, int llrOffset, int count) {
        if (method == LlrMethod.EXACT) {
            demapExact(estimates, gain, symOffset, n0, llr, llrOffset, count);
        } else {
            demapMaxLog(estimates, gain, symOffset, n0, llr, llrOffset, count);
        }
    }

    /**
     * {@link #demap(LlrMethod, double[], double[], int, double, double[], int, int)} from planes of
     * real and imaginary parts, the symbols' LLRs {@code llrStride} apart: the estimate
     * {@code re[i]}, {@code im[i]} with gain {@code gain[i]} to {@code llr[llrOffset + i·llrStride ..]}
     * for i in {@code 0 .. count)}.
     */
    public void demap(LlrMethod method, double[] re, double[] im, double[] gain, double n0, double[] llr,
                      int llrOffset, int llrStride, int count) {
        boolean exact = method == LlrMethod.EXACT;
        for (int i = 0, l = llrOffset; i < count; i++, l += llrStride) {
            symbolLlr(re[i], im[i], gain[i] / n0, exact, llr, l);
        }
    }

    /**
     * The LLRs of one axis: the max-log term (min1 - min0)·w over the L amplitudes and, when
     * {@code exact}, the log-sum-exp correction ln Σ_{b=0} e^{-(d²-min0)w} - ln Σ_{b=1} e^{-(d²-min1)w}.
     * Max-log with 2 or 4 levels (BPSK, QPSK, 16-QAM) takes each d² once and the minima of the
     * label pattern's fixed subsets without a branch: the same doubles as the search.
     */
    private int axisLlr(double y, double weight, boolean exact, double[] llr, int l) {
        final double[] amp = amplitudeOfLevel;
        if (!exact && levels == 2) {
            // labels 0, 1
            llr[l] = (squared(y - amp[1]) - squared(y - amp[0])) * weight;
            return l + 1;
        }
        if (!exact && levels == 4) {
            // labels 0, 1, 3, 2: the first bit is 0 on levels 0 and 1, the second on levels 0 and 3
            double d0 = squared(y - amp[0]);
            double d1 = squared(y - amp[1]);
            double d2 = squared(y - amp[2]);
            double d3 = squared(y - amp[3]);
            llr[l] = (Math.min(d2, d3) - Math.min(d0, d1)) * weight;
            llr[l + 1] = (Math.min(d1, d2) - Math.min(d0, d3)) * weight;
            return l + 2;
        }
        final int m = bitsPerAxis;
        for (int j = 0; j < m; j++) {
            int shift = m - 1 - j;
            double min0 = Double.POSITIVE_INFINITY;
            double min1 = Double.POSITIVE_INFINITY;
            for (int i = 0; i < levels; i++) {
                double d2 = squared(y - amp[i]);
                if (((labelOfLevel[i] >>> shift) & 1) == 0) {
                    if (d2 < min0) {
                        min0 = d2;
                    }
                } else if (d2 < min1) {
                    min1 = d2;
                }
            }
            double value = (min1 - min0) * weight;
            if (exact) {
                double sum0 = 0;
                double sum1 = 0;
                for (int i = 0; i < levels; i++) {
                    double d2 = squared(y - amp[i]);
                    if (((labelOfLevel[i] >>> shift) & 1) == 0) {
                        sum0 += Math.exp(-(d2 - min0) * weight);
                    } else {
                        sum1 += Math.exp(-(d2 - min1) * weight);
                    }
                }
                value += Math.log(sum0) - Math.log(sum1);
            }
            llr[l++] = value;
        }
        return l;
    }

    private static double squared(double d) {
        return d * d;
    }

    /**
     * Writes the symbol whose label is the integer {@code label} (bit 0 of the symbol is its most
     * significant bit) into {@code out[0..1]}. For tests and tables, not the hot path.
     */
    public void point(int label, double[] out) {
        byte[] bits = new byte[bitsPerSymbol];
        for (int j = 0; j < bitsPerSymbol; j++) {
            bits[j] = (byte) ((label >>> (bitsPerSymbol - 1 - j)) & 1);
        }
        map(bits, 0, out, 0, 1);
    }
}
