package org.fadebench.bench.link;

import java.io.Serializable;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Error counts over a number of frames, and the channel decoder's iterations summed over them.
 * Mutable; one per batch, merged in batch order.
 */
public final class FrameCounters implements Serializable {

    /**
     * The name of the decoder iterations' sum in {@link #byName()}, present only when the sum is not
     * 0 (a code whose decoder iterates), so that the files of every other link read as before.
     */
    public static final String FEC_ITERATIONS = "fec_iterations_sum";

    /**
     * The name of the fade scale in {@link #byName()}; it and the weighted sums are present only for
     * frames weighted by importance sampling, so that plain runs' files read as before.
     */
    public static final String FADE_SCALE = "fade_scale";

    /** The names of the fade scale and the weighted sums in {@link #byName()}, in order. */
    public static final java.util.List<String> WEIGHT_NAMES = java.util.List.of(FADE_SCALE, "weight_sum",
            "weight_squares", "error_weight", "error_weight_squares", "bit_error_weight", "bit_error_weight_squares",
            "symbol_error_weight");

    private long frames;
    private long frameErrors;
    private long bits;
    private long bitErrors;
    private long symbols;
    private long symbolErrors;
    private double bitErrorsSquared;
    private long crcFailures;
    private long undetectedErrors;
    private long fecIterations;
    /**
     * Importance sampling of deep fades (present when {@link #weighted()}): the scale of the fades
     * drawn, Σ w and Σ w² over frames, the same over frames in error, Σ w·(bit errors) and its
     * squares, Σ w·(symbol errors). Sums in frame order, merged in batch order: deterministic.
     */
    private boolean weighted;
    private double fadeScale = Double.NaN;
    private double weightSum;
    private double weightSquares;
    private double errorWeight;
    private double errorWeightSquares;
    private double bitErrorWeight;
    private double bitErrorWeightSquares;
    private double symbolErrorWeight;
    /** Per-frame weights, error flags and fade energies of a pilot run, or null. */
    private transient FrameLog log;

    /** The frames one pilot run of importance sampling records: weight, error, fade energy. */
    public static final class FrameLog {
        private final double[] weight;
        private final boolean[] error;
        private final double[] energy;
        private int size;

        FrameLog(int capacity) {
            weight = new double[capacity];
            error = new boolean[capacity];
            energy = new double[capacity];
        }

        public int size() {
            return size;
        }

        public double weight(int i) {
            return weight[i];
        }

        public boolean error(int i) {
            return error[i];
        }

        public double energy(int i) {
            return energy[i];
        }
    }

    /** Counters that also log up to {@code capacity} weighted frames (see {@link #log()}). */
    public static FrameCounters logging(int capacity) {
        FrameCounters c = new FrameCounters();
        c.log = new FrameLog(capacity);
        return c;
    }

    /** The frames logged, or null. */
    public FrameLog log() {
        return log;
    }

    /**
     * Records one coded frame.
     *
     * @param crcFailed     the frame's CRC did not check
     * @param undetected    the frame has wrong bits but its CRC checked
     * @param fecIterations the channel decoder's iterations on the frame (0 for a decoder that does not iterate)
     */
    public void addFrame(int frameBits, int frameBitErrors, int frameSymbols, int frameSymbolErrors, boolean crcFailed,
                         boolean undetected, int fecIterations) {
        addFrame(frameBits, frameBitErrors, frameSymbols, frameSymbolErrors);
        crcFailures += crcFailed ? 1 : 0;
        undetectedErrors += undetected ? 1 : 0;
        this.fecIterations += fecIterations;
    }

    /** Records one frame. */
    public void addFrame(int frameBits, int frameBitErrors, int frameSymbols, int frameSymbolErrors) {
        frames++;
        bits += frameBits;
        bitErrors += frameBitErrors;
        symbols += frameSymbols;
        symbolErrors += frameSymbolErrors;
        bitErrorsSquared += (double) frameBitErrors * frameBitErrors;
        if (frameBitErrors > 0) {
            frameErrors++;
        }
    }

    /**
     * Weighs the frame just added (importance sampling): its likelihood ratio {@code weight}, its fade
     * energy (for the cross-entropy update of the scale), its bit and symbol errors.
     */
    public void addWeight(double weight, double fadeEnergy, int frameBitErrors, int frameSymbolErrors) {
        weighted = true;
        weightSum += weight;
        weightSquares += weight * weight;
        if (frameBitErrors > 0) {
            errorWeight += weight;
            errorWeightSquares += weight * weight;
            double wb = weight * frameBitErrors;
            bitErrorWeight += wb;
            bitErrorWeightSquares += wb * wb;
        }
        symbolErrorWeight += weight * frameSymbolErrors;
        if (log != null && log.size < log.weight.length) {
            log.weight[log.size] = weight;
            log.error[log.size] = frameBitErrors > 0;
            log.energy[log.size++] = fadeEnergy;
        }
    }

    /** Notes the scale of the fades these frames were drawn with. */
    public void fadeScale(double scale) {
        fadeScale = scale;
    }

    public void add(FrameCounters o) {
        if (o.weighted) {
            weighted = true;
            if (fadeScale != fadeScale) {
                fadeScale = o.fadeScale;
            }
            weightSum += o.weightSum;
            weightSquares += o.weightSquares;
            errorWeight += o.errorWeight;
            errorWeightSquares += o.errorWeightSquares;
            bitErrorWeight += o.bitErrorWeight;
            bitErrorWeightSquares += o.bitErrorWeightSquares;
            symbolErrorWeight += o.symbolErrorWeight;
        }
        frames += o.frames;
        frameErrors += o.frameErrors;
        bits += o.bits;
        bitErrors += o.bitErrors;
        symbols += o.symbols;
        symbolErrors += o.symbolErrors;
        bitErrorsSquared += o.bitErrorsSquared;
        crcFailures += o.crcFailures;
        undetectedErrors += o.undetectedErrors;
        fecIterations += o.fecIterations;
    }

    /** Counts given one by one. */
    public static FrameCounters of(long frames, long frameErrors, long bits, long bitErrors, long symbols,
                                   long symbolErrors, double bitErrorsSquared, long crcFailures, long undetectedErrors) {
        FrameCounters c = new FrameCounters();
        c.frames = frames;
        c.frameErrors = frameErrors;
        c.bits = bits;
        c.bitErrors = bitErrors;
        c.symbols = symbols;
        c.symbolErrors = symbolErrors;
        c.bitErrorsSquared = bitErrorsSquared;
        c.crcFailures = crcFailures;
        c.undetectedErrors = undetectedErrors;
        return c;
    }

    /**
     * Every count by name, in one fixed order: the names results.json and checkpoint.json give them
     * and the order of the checkpoint's checksum. Whole counts are {@link Long}s, the one sum of
     * squares a {@link Double}; {@link #of(Map)} reads them back.
     */
    public Map<String, Number> byName() {
        Map<String, Number> m = new LinkedHashMap<>();
        m.put("frames", frames);
        m.put("frame_errors", frameErrors);
        m.put("bits", bits);
        m.put("bit_errors", bitErrors);
        m.put("symbols", symbols);
        m.put("symbol_errors", symbolErrors);
        m.put("bit_errors_squared", bitErrorsSquared);
        m.put("crc_failures", crcFailures);
        m.put("undetected_errors", undetectedErrors);
        if (fecIterations != 0) {
            m.put(FEC_ITERATIONS, fecIterations);
        }
        if (weighted) {
            double[] sums = {fadeScale, weightSum, weightSquares, errorWeight, errorWeightSquares, bitErrorWeight,
                    bitErrorWeightSquares, symbolErrorWeight};
            for (int i = 0; i < sums.length; i++) {
                m.put(WEIGHT_NAMES.get(i), sums[i]);
            }
        }
        return m;
    }

    /** The counts of {@link #byName()}'s map (every name must be there; {@link #FEC_ITERATIONS} may be missing, for 0). */
    public static FrameCounters of(Map<String, ? extends Number> byName) {
        FrameCounters c = of(byName.get("frames").longValue(), byName.get("frame_errors").longValue(),
                byName.get("bits").longValue(), byName.get("bit_errors").longValue(),
                byName.get("symbols").longValue(), byName.get("symbol_errors").longValue(),
                byName.get("bit_errors_squared").doubleValue(), byName.get("crc_failures").longValue(),
                byName.get("undetected_errors").longValue());
        Number iterations = byName.get(FEC_ITERATIONS);
        c.fecIterations = iterations == null ? 0 : iterations.longValue();
        Number scale = byName.get(FADE_SCALE);
        if (scale != null) {
            double[] sums = new double[WEIGHT_NAMES.size()];
            for (int i = 0; i < sums.length; i++) {
                sums[i] = byName.get(WEIGHT_NAMES.get(i)).doubleValue();
            }
            c.weighted = true;
            c.fadeScale = sums[0];
            c.weightSum = sums[1];
            c.weightSquares = sums[2];
            c.errorWeight = sums[3];
            c.errorWeightSquares = sums[4];
            c.bitErrorWeight = sums[5];
            c.bitErrorWeightSquares = sums[6];
            c.symbolErrorWeight = sums[7];
        }
        return c;
    }

    /** A copy of these counts. */
    public FrameCounters copy() {
        FrameCounters c = new FrameCounters();
        c.add(this);
        return c;
    }

    public long frames() {
        return frames;
    }

    public long frameErrors() {
        return frameErrors;
    }

    public long bits() {
        return bits;
    }

    public long bitErrors() {
        return bitErrors;
    }

    public long symbols() {
        return symbols;
    }

    public long symbolErrors() {
        return symbolErrors;
    }

    /** Σ over frames of (bit errors in the frame)², for the clustered BER interval. */
    public double bitErrorsSquared() {
        return bitErrorsSquared;
    }

    /** Frames whose CRC did not check (0 without a CRC). */
    public long crcFailures() {
        return crcFailures;
    }

    /** Frames with wrong information bits whose CRC checked all the same (0 without a CRC). */
    public long undetectedErrors() {
        return undetectedErrors;
    }

    /** The channel decoder's iterations summed over the frames (0 for a decoder that does not iterate). */
    public long fecIterations() {
        return fecIterations;
    }

    /** Mean decoder iterations per frame; NaN for a decoder that does not iterate (or no frame). */
    public double fecIterationsMean() {
        return fecIterations == 0 ? Double.NaN : (double) fecIterations / frames;
    }

    /** The FER: errors over frames, or for weighted frames the mean of weight × error. */
    public double fer() {
        return frames == 0 ? Double.NaN : (weighted ? errorWeight : frameErrors) / frames;
    }

    /** The BER: bit errors over bits, or for weighted frames Σ weight × bit errors over bits. */
    public double ber() {
        return bits == 0 ? Double.NaN : (weighted ? bitErrorWeight : bitErrors) / bits;
    }

    /** The SER, weighted like {@link #ber()}. */
    public double ser() {
        return symbols == 0 ? Double.NaN : (weighted ? symbolErrorWeight : symbolErrors) / symbols;
    }

    /** Whether the frames carry importance-sampling weights (then the rates are weighted means). */
    public boolean weighted() {
        return weighted;
    }

    /** The scale of the fades the weighted frames were drawn with (NaN for plain frames). */
    public double fadeScale() {
        return fadeScale;
    }

    /** Σ w over weighted frames. */
    public double weightSum() {
        return weightSum;
    }

    /** Σ w² over weighted frames. */
    public double weightSquares() {
        return weightSquares;
    }

    /** Σ w over weighted frames in error. */
    public double errorWeight() {
        return errorWeight;
    }

    /** Σ w² over weighted frames in error. */
    public double errorWeightSquares() {
        return errorWeightSquares;
    }

    /** Σ w·e over weighted frames, e the frame's bit errors. */
    public double bitErrorWeight() {
        return bitErrorWeight;
    }

    /** Σ (w·e)² over weighted frames. */
    public double bitErrorWeightSquares() {
        return bitErrorWeightSquares;
    }
}
