package org.fadebench.channel;

/**
 * A statistical model of one fading block: it draws the complex Nr x Mt channel matrix H into a
 * caller-owned array, interleaved and row-major: entry (r, t), the gain from transmit antenna t to
 * receive antenna r, has real part at {@code h[2 (r·Mt + t)]} and imaginary part next to it.
 * Models are normalised so that E|h_rt|² = 1.
 */
public interface FadingModel {

    /** Draws one channel matrix of {@code nr} rows and {@code mt} columns into {@code h}. */
    void draw(Draws draws, int nr, int mt, double[] h);

    /**
     * Importance sampling of deep fades: draws H as {@link #draw} does, from the same stream, but with
     * the power of every independent entry (before any spatial correlation) scaled by {@code scale}
     * (for Rayleigh entries CN(0, s), for Nakagami-m the Gamma law of the power with mean s), and
     * returns Σ|h_w|² of the unscaled independent entries h_w. Only models whose
     * {@link ChannelModel#fadeShape()} is finite can.
     */
    default double drawScaled(Draws draws, int nr, int mt, double scale, double[] h) {
        throw new UnsupportedOperationException(name() + " cannot draw scaled fades");
    }

    /** Short name for tables and file headers, e.g. {@code rayleigh}. */
    String name();
}
