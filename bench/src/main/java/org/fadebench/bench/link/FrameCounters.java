package org.fadebench.bench.link;

import java.io.Serializable;

/** Error counts over a number of frames. Mutable; one per batch, merged in batch order. */
public final class FrameCounters implements Serializable {

    private long frames;
    private long frameErrors;
    private long bits;
    private long bitErrors;
    private long symbols;
    private long symbolErrors;
    private double bitErrorsSquared;
    private long crcFailures;
    private long undetectedErrors;

    /**
     * Records one coded frame.
     *
     * @param crcFailed  the frame's CRC did not check
     * @param undetected the frame has wrong bits but its CRC checked
     */
    public void addFrame(int frameBits, int frameBitErrors, int frameSymbols, int frameSymbolErrors, boolean crcFailed,
                         boolean undetected) {
        addFrame(frameBits, frameBitErrors, frameSymbols, frameSymbolErrors);
        crcFailures += crcFailed ? 1 : 0;
        undetectedErrors += undetected ? 1 : 0;
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
    }

    /** Restores counts saved in a checkpoint. */
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
