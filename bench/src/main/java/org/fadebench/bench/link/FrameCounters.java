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

    public void add(FrameCounters o) {
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

    public double fer() {
        return frames == 0 ? Double.NaN : (double) frameErrors / frames;
    }

    public double ber() {
        return bits == 0 ? Double.NaN : (double) bitErrors / bits;
    }

    public double ser() {
        return symbols == 0 ? Double.NaN : (double) symbolErrors / symbols;
    }
}
