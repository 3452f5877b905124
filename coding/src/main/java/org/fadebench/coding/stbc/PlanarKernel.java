package org.fadebench.coding.stbc;

/**
 * A space-time code's encoder and matched-filter combiner on planar arrays: one array (plane) per
 * real or imaginary part of each symbol, slot and antenna of a code block, element i of every
 * plane belonging to code block i. Symbols and estimates take 2K planes (Re s_k, Im s_k for
 * k = 0 .. K−1), the transmit grid 2·T·Mt (slot τ, antenna t: planes 2·(τ·Mt + t) and the next)
 * and the received signal 2·T·Nr (slot τ, receive antenna r: planes 2·(τ·Nr + r) and the next).
 * Every loop then runs over code blocks with unit stride, which the JIT vectorises. A planar
 * kernel gives exactly the numbers of the code's interleaved encoder and combiner; it writes no
 * gains (an orthogonal code's gain is the same for every code block of a fading block: {@link #gain}). Made by
 * {@link SpaceTimeCode#newPlanarKernel}, for the codes that have one; implementations own their
 * work buffers and do not allocate after construction.
 */
public interface PlanarKernel {

    /** Encodes code blocks {@code from .. from+blocks)} of the symbol planes into the grid planes. */
    void encode(double[][] symbols, int from, int blocks, double[][] grid);

    /**
     * Grid planes for {@code blocks} code blocks, for {@link #encode}. A kernel may let grid planes
     * that always hold the same values share one array, which {@code encode} then writes once: the
     * grid reads the same, in fewer bytes. Every plane its own array by default.
     */
    default double[][] newGrid(int gridPlanes, int blocks) {
        return new double[gridPlanes][blocks];
    }

    /** How many arrays {@link #newGrid} makes for {@code gridPlanes} planes. */
    default int gridArrays(int gridPlanes) {
        return gridPlanes;
    }

    /** Takes the channel matrix (Nr x Mt, interleaved complex, row-major) for the blocks that follow. */
    void setChannel(double[] h);

    /**
     * The post-combining gain of symbol k (0 .. K−1) of every code block under the channel last
     * set, the value the code's interleaved combiner writes for it.
     */
    double gain(int symbol);

    /** Combines code blocks {@code from .. from+blocks)} of the received planes into estimate planes. */
    void combine(double[][] received, int from, int blocks, double[][] estimates);
}
