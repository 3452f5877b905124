package org.fadebench.bench.link;

import org.fadebench.channel.Draws;
import org.fadebench.channel.FadingModel;
import org.fadebench.channel.MimoChannel;
import org.fadebench.coding.stbc.Combiner;
import org.fadebench.coding.stbc.Decoder;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.StbcEncoder;
import org.fadebench.modem.QamConstellation;

/**
 * One link, end to end, for one frame at a time:
 * <pre>
 * info bits (as symbol labels) → QAM map → space-time encode → per fading block: draw H, Y = X Hᵀ + N
 *   → combine with H (perfect CSI) → slice → count bit, symbol and frame errors
 * </pre>
 * A chain owns all its buffers and allocates nothing per frame; each worker thread has its own.
 * Random draws are taken in a fixed order (bits, then per fading block H and noise), so a frame
 * depends only on the stream it is given.
 */
public final class LinkChain {

    private final LinkSettings settings;
    private final QamConstellation constellation;
    private final StbcEncoder encoder;
    private Combiner combiner;
    /** The noise level the combiner was made for (only MMSE depends on it). */
    private double combinerN0 = Double.NaN;
    private final FadingModel fading;
    private final int mt;
    private final int nr;
    private final int k;
    private final int t;
    private final int frameBits;
    private final int symbols;
    private final int blocksPerFrame;
    private final int blocksPerFade;
    private final int bitsPerSymbol;

    private final int[] sent;
    private final int[] decided;
    private final double[] txSymbols;
    private final double[] estimates;
    private final double[] gain;
    private final double[] h;
    private final double[] grid;
    private final double[] received;

    public LinkChain(LinkSettings settings) {
        this.settings = settings;
        SpaceTimeCode code = settings.code();
        this.constellation = settings.modulation().constellation();
        this.encoder = code.newEncoder();
        this.nr = settings.receiveAntennas();
        this.mt = settings.transmitAntennas();
        this.combiner = code.newCombiner(nr, settings.decoder(), 1.0);
        this.combinerN0 = 1.0;
        this.fading = settings.fading().model();
        this.k = code.symbolsPerBlock();
        this.t = code.slotsPerBlock();
        this.frameBits = settings.frameBits();
        this.symbols = settings.symbolsPerFrame();
        this.blocksPerFrame = settings.blocksPerFrame();
        this.blocksPerFade = settings.effectiveCoherenceSlots() / t;
        this.bitsPerSymbol = settings.modulation().bitsPerSymbol();
        this.sent = new int[symbols];
        this.decided = new int[symbols];
        this.txSymbols = new double[2 * symbols];
        this.estimates = new double[2 * symbols];
        this.gain = new double[symbols];
        this.h = new double[2 * nr * mt];
        int fadeSlots = blocksPerFade * t;
        this.grid = new double[2 * fadeSlots * mt];
        this.received = new double[2 * fadeSlots * nr];
    }

    public LinkSettings settings() {
        return settings;
    }

    /** Simulates one frame at noise level {@code n0} (SNR = 1/n0) and adds it to {@code counters}. */
    public void runFrame(Draws draws, double n0, FrameCounters counters) {
        if (n0 != combinerN0 && settings.decoder() == Decoder.MMSE) {
            // MMSE weights depend on the noise level: a new combiner when the SNR point changes
            combiner = settings.code().newCombiner(nr, Decoder.MMSE, n0);
            combinerN0 = n0;
        }
        draws.fillLabels(sent, 0, symbols, bitsPerSymbol);
        constellation.mapLabels(sent, 0, txSymbols, 0, symbols);
        for (int first = 0; first < blocksPerFrame; first += blocksPerFade) {
            int blocks = Math.min(blocksPerFade, blocksPerFrame - first);
            fading.draw(draws, nr, mt, h);
            encoder.encode(txSymbols, first * k, blocks, grid, 0);
            MimoChannel.apply(h, nr, mt, grid, 0, blocks * t, n0, draws, received, 0);
            combiner.setChannel(h);
            combiner.combine(received, 0, blocks, estimates, gain, first * k);
        }
        constellation.demapLabels(estimates, 0, decided, 0, symbols);
        int bitErrors = 0;
        int symbolErrors = 0;
        for (int s = 0; s < symbols; s++) {
            int wrong = sent[s] ^ decided[s];
            bitErrors += Integer.bitCount(wrong);
            symbolErrors += wrong != 0 ? 1 : 0;
        }
        counters.addFrame(frameBits, bitErrors, symbols, symbolErrors);
    }
}
