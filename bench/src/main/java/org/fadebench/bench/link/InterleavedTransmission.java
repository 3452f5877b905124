package org.fadebench.bench.link;

import org.fadebench.channel.Draws;
import org.fadebench.channel.LinkChannel;
import org.fadebench.coding.stbc.Combiner;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.StbcEncoder;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.QamConstellation;

/**
 * {@link Transmission} on interleaved complex arrays, for every code, channel and equaliser: the
 * code's encoder and combiner (its specialised kernel where it has one), one fading block's grid
 * and received signal at a time.
 */
final class InterleavedTransmission extends Transmission {

    private final SpaceTimeCode code;
    private final Equaliser equaliser;
    private final int nr;
    private final int symbolsPerBlock;
    /** Slots per code block: the rows in which the noise is drawn. */
    private final int slotsPerBlock;
    private final StbcEncoder encoder;
    private Combiner combiner;
    /** The noise level the combiner was made for (only MMSE depends on it). */
    private double combinerN0;
    private final double[] grid;
    private final double[] received;
    /** The frame's symbols, interleaved complex. */
    final double[] symbols;
    /** The frame's symbol estimates, interleaved complex, and the post-combining gain of each. */
    final double[] estimates;
    final double[] gain;

    InterleavedTransmission(LinkSettings settings, LinkChannel channel) {
        super(settings, channel);
        this.code = settings.code();
        this.equaliser = settings.equaliser();
        this.nr = settings.receiveAntennas();
        this.symbolsPerBlock = code.symbolsPerBlock();
        this.slotsPerBlock = code.slotsPerBlock();
        this.encoder = code.newEncoder();
        this.combinerN0 = 1.0;
        this.combiner = code.newCombiner(nr, equaliser, combinerN0);
        int fadeSlots = settings.effectiveCoherenceSlots() / code.slotsPerBlock() * code.slotsPerBlock();
        this.grid = new double[2 * fadeSlots * settings.transmitAntennas()];
        this.received = new double[2 * fadeSlots * nr];
        int n = settings.symbolsPerFrame();
        this.symbols = new double[2 * n];
        this.estimates = new double[2 * n];
        this.gain = new double[n];
    }

    /** Bytes of the buffers the constructor allocates: symbols, estimates, gains, one fading block's grid and signal. */
    static long bufferBytes(LinkSettings settings) {
        long fadeSlots = settings.effectiveCoherenceSlots();
        return 8 * 5L * settings.symbolsPerFrame()
                + 8 * 2 * fadeSlots * (settings.transmitAntennas() + settings.receiveAntennas());
    }

    @Override
    void prepare(double n0) {
        if (n0 != combinerN0 && equaliser == Equaliser.MMSE) {
            // MMSE weights depend on the noise level: a new combiner when the SNR point changes
            combiner = code.newCombiner(nr, Equaliser.MMSE, n0);
            combinerN0 = n0;
        }
    }

    @Override
    void sendBlocks(Draws draws, double n0, int first, int blocks) {
        encoder.encode(symbols, first * symbolsPerBlock, blocks, grid, 0);
        channel.transmit(grid, 0, slotsPerBlock, n0, draws, received, 0);
        channel.estimate(n0, draws, hHat);
        combiner.setChannel(hHat);
        combiner.combine(received, 0, blocks, estimates, gain, first * symbolsPerBlock);
    }

    @Override
    void copyEstimates(double[] out) {
        System.arraycopy(estimates, 0, out, 0, estimates.length);
    }

    @Override
    void map(QamConstellation constellation, byte[] bits) {
        constellation.map(bits, 0, symbols, 0, gain.length);
    }

    @Override
    void demap(QamConstellation constellation, LlrMethod method, double n0, double[] llr) {
        constellation.demap(method, estimates, gain, 0, n0, llr, 0, gain.length);
    }
}
