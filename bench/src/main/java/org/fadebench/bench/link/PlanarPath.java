package org.fadebench.bench.link;

import org.fadebench.channel.Draws;
import org.fadebench.modem.QamConstellation;

/**
 * Uncoded frames on planes ({@link PlanarTransmission}): the same draws and the same arithmetic as
 * the {@link GeneralPath}, laid out so that the JIT vectorises every loop. Symbol k of code block i
 * is label K·i + k of the frame, kept in label plane k.
 */
final class PlanarPath implements FramePath {

    private final PlanarTransmission transmission;
    private final QamConstellation constellation;
    private final int frameBits;
    private final int symbols;
    private final int blocks;
    private final int bitsPerSymbol;
    /** K planes: the label of each symbol of a code block. */
    private final int[][] sent;
    /** The frame being counted: wrong bits and wrong labels so far. */
    private final int[] labelErrors = new int[2];

    PlanarPath(LinkSettings settings, PlanarTransmission transmission) {
        this.transmission = transmission;
        this.constellation = settings.modulation().constellation();
        this.frameBits = settings.frameBits();
        this.symbols = settings.symbolsPerFrame();
        this.blocks = settings.blocksPerFrame();
        this.bitsPerSymbol = settings.modulation().bitsPerSymbol();
        this.sent = new int[settings.code().symbolsPerBlock()][blocks];
    }

    /** Bytes of the label planes the constructor allocates. */
    static long bufferBytes(LinkSettings settings) {
        return 4L * settings.code().symbolsPerBlock() * settings.blocksPerFrame();
    }

    @Override
    public void runFrames(Draws draws, double n0, long first, int count, FrameCounters counters) {
        double[][] tx = transmission.symbols;
        double[][] est = transmission.estimates;
        for (int f = 0; f < count; f++) {
            labelErrors[0] = 0;
            labelErrors[1] = 0;
            draws.fillLabels(sent, 0, blocks, bitsPerSymbol);
            for (int k = 0; k < sent.length; k++) {
                constellation.mapLabels(sent[k], tx[2 * k], tx[2 * k + 1], 0, blocks);
            }
            transmission.transmit(draws, n0, first + f);
            for (int k = 0; k < sent.length; k++) {
                constellation.countHardErrors(sent[k], tx[2 * k], tx[2 * k + 1], est[2 * k], est[2 * k + 1], 0,
                        blocks, labelErrors);
            }
            counters.addFrame(frameBits, labelErrors[0], symbols, labelErrors[1]);
            transmission.weigh(counters, labelErrors[0], labelErrors[1]);
        }
    }
}
