package org.fadebench.bench.link;

import org.fadebench.channel.Draws;
import org.fadebench.modem.QamConstellation;

/**
 * Uncoded frames on interleaved arrays ({@link InterleavedTransmission}), for every code and
 * channel. A frame carries its bits as symbol labels (the bits of a symbol as one integer), which
 * is the same data and lets errors be counted per symbol; the receiver slices each estimate.
 */
final class GeneralPath implements FramePath {

    private final InterleavedTransmission transmission;
    private final QamConstellation constellation;
    private final int frameBits;
    private final int symbols;
    private final int bitsPerSymbol;
    private final int[] sent;
    /** The frame being counted: wrong bits and wrong labels so far. */
    private final int[] labelErrors = new int[2];

    GeneralPath(LinkSettings settings, InterleavedTransmission transmission) {
        this.transmission = transmission;
        this.constellation = settings.modulation().constellation();
        this.frameBits = settings.frameBits();
        this.symbols = settings.symbolsPerFrame();
        this.bitsPerSymbol = settings.modulation().bitsPerSymbol();
        this.sent = new int[symbols];
    }

    /** Bytes of the labels the constructor allocates. */
    static long bufferBytes(LinkSettings settings) {
        return 4L * settings.symbolsPerFrame();
    }

    @Override
    public void runFrames(Draws draws, double n0, long first, int count, FrameCounters counters) {
        for (int f = 0; f < count; f++) {
            labelErrors[0] = 0;
            labelErrors[1] = 0;
            draws.fillLabels(sent, 0, symbols, bitsPerSymbol);
            constellation.mapLabels(sent, 0, transmission.symbols, 0, symbols);
            transmission.transmit(draws, n0, first + f);
            constellation.countHardErrors(sent, 0, transmission.symbols, transmission.estimates, 0, symbols,
                    labelErrors);
            counters.addFrame(frameBits, labelErrors[0], symbols, labelErrors[1]);
            transmission.weigh(counters, labelErrors[0], labelErrors[1]);
        }
    }
}
