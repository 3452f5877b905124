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

    /** Short name for tables and file headers, e.g. {@code rayleigh}. */
    String name();
}
