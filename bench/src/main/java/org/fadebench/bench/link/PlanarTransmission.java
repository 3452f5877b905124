package org.fadebench.bench.link;

import java.util.Arrays;
import org.fadebench.channel.Draws;
import org.fadebench.channel.LinkChannel;
import org.fadebench.coding.stbc.PlanarKernel;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.QamConstellation;

/**
 * {@link Transmission} on planes (see {@link PlanarKernel}): symbols, grid, received signal and
 * estimates are kept as one array per real or imaginary part of each symbol, slot and antenna of a
 * code block, indexed by code block, so that encoder, channel and combiner run as short
 * unit-stride loops. It needs a channel that stays constant within a fading block. Symbol k of
 * code block i is symbol K·i + k of the frame, in planes 2k and 2k + 1.
 */
final class PlanarTransmission extends Transmission {

    private final PlanarKernel kernel;
    /** 2K planes: Re and Im of each symbol of a code block. */
    final double[][] symbols;
    /** 2K planes: Re and Im of each symbol estimate. */
    final double[][] estimates;
    /** K planes: the post-combining gain of each symbol of a code block. */
    private final double[][] gain;
    private final int bitsPerSymbol;
    private final double[][] grid;
    private final double[][] received;

    PlanarTransmission(LinkSettings settings, LinkChannel channel, PlanarKernel kernel) {
        super(settings, channel);
        SpaceTimeCode code = settings.code();
        int blocks = settings.blocksPerFrame();
        int slots = code.slotsPerBlock();
        this.kernel = kernel;
        this.symbols = new double[2 * code.symbolsPerBlock()][blocks];
        this.estimates = new double[2 * code.symbolsPerBlock()][blocks];
        this.gain = new double[code.symbolsPerBlock()][blocks];
        this.bitsPerSymbol = settings.modulation().bitsPerSymbol();
        this.grid = kernel.newGrid(2 * slots * settings.transmitAntennas(), blocks);
        this.received = new double[2 * slots * settings.receiveAntennas()][blocks];
    }

    /** Bytes of the planes and gains the constructor allocates (the grid's as its kernel makes them). */
    static long bufferBytes(LinkSettings settings) {
        SpaceTimeCode code = settings.code();
        int gridPlanes = 2 * code.slotsPerBlock() * settings.transmitAntennas();
        long grid = code.newPlanarKernel(settings.receiveAntennas()).orElseThrow().gridArrays(gridPlanes);
        long planes = 5L * code.symbolsPerBlock() + grid + 2L * code.slotsPerBlock() * settings.receiveAntennas();
        return 8 * planes * settings.blocksPerFrame();
    }

    @Override
    void sendBlocks(Draws draws, double n0, int first, int blocks) {
        kernel.encode(symbols, first, blocks, grid);
        channel.transmit(grid, first, n0, draws, received);
        channel.estimate(n0, draws, hHat);
        kernel.setChannel(hHat);
        kernel.combine(received, first, blocks, estimates);
        for (int k = 0; k < gain.length; k++) {
            Arrays.fill(gain[k], first, first + blocks, kernel.gain(k));
        }
    }

    @Override
    void copyEstimates(double[] out) {
        int parts = estimates.length;
        for (int i = 0; i < estimates[0].length; i++) {
            for (int j = 0; j < parts; j++) {
                out[parts * i + j] = estimates[j][i];
            }
        }
    }

    @Override
    void map(QamConstellation constellation, byte[] bits) {
        int k = estimates.length / 2;
        for (int j = 0; j < k; j++) {
            constellation.map(bits, j * bitsPerSymbol, k * bitsPerSymbol, symbols[2 * j], symbols[2 * j + 1], gain[j].length);
        }
    }

    @Override
    void demap(QamConstellation constellation, LlrMethod method, double n0, double[] llr) {
        int k = estimates.length / 2;
        for (int j = 0; j < k; j++) {
            constellation.demap(method, estimates[2 * j], estimates[2 * j + 1], gain[j], n0, llr, j * bitsPerSymbol,
                    k * bitsPerSymbol, gain[j].length);
        }
    }
}
