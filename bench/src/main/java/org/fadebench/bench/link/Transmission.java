package org.fadebench.bench.link;

import org.fadebench.channel.Draws;
import org.fadebench.channel.LinkChannel;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.QamConstellation;

/**
 * The middle of a link, from a frame's symbols to their estimates: per fading block, space-time
 * encoding, the block's channel (Y = X Hᵀ + N), the receiver's channel estimate and combining with
 * it. The subclasses keep symbols and estimates in one layout each (planar or interleaved); the
 * order of the random draws is the same in both: per fading block the channel, the noise, then
 * the estimate.
 */
abstract class Transmission {

    final LinkChannel channel;
    /** The receiver's estimate of the current fading block's channel, Nr x Mt interleaved complex. */
    final double[] hHat;
    private final int slotsPerBlock;
    private final int blocksPerFrame;
    private final int blocksPerFade;
    private final int fadesPerFrame;
    /** Where the true channel of each fading block is copied, or null (the default). */
    private ChannelRecorder recorder;
    /** The frame's log likelihood ratio and fade energy, summed over its fading blocks, when fades are scaled. */
    private double frameLogWeight;
    private double frameFadeEnergy;

    Transmission(LinkSettings settings, LinkChannel channel) {
        this.channel = channel;
        this.hHat = new double[2 * settings.receiveAntennas() * settings.transmitAntennas()];
        this.slotsPerBlock = settings.code().slotsPerBlock();
        this.blocksPerFrame = settings.blocksPerFrame();
        this.blocksPerFade = settings.effectiveCoherenceSlots() / slotsPerBlock;
        this.fadesPerFrame = settings.fadingBlocksPerFrame();
    }

    /** Bytes of the channel's matrices and the estimate: H (one per slot when it varies within a block) and Ĥ. */
    static long channelBytes(LinkSettings settings) {
        long nr = settings.receiveAntennas();
        long mt = settings.transmitAntennas();
        return 8 * 2 * nr * mt * (settings.channel().varies() ? settings.effectiveCoherenceSlots() + 2L : 3);
    }

    /** Records the channels of the following frames into {@code recorder} (null to stop). */
    final void recordChannels(ChannelRecorder recorder) {
        this.recorder = recorder;
    }

    /** Sends the symbols of frame {@code frame} at noise level {@code n0}: symbols → estimates. */
    final void transmit(Draws draws, double n0, long frame) {
        prepare(n0);
        frameLogWeight = 0.0;
        frameFadeEnergy = 0.0;
        long fade = frame * fadesPerFrame;
        for (int first = 0; first < blocksPerFrame; first += blocksPerFade, fade++) {
            int blocks = Math.min(blocksPerFade, blocksPerFrame - first);
            channel.startBlock(draws, fade, blocks * slotsPerBlock);
            frameLogWeight += channel.blockLogWeight();
            frameFadeEnergy += channel.blockFadeEnergy();
            sendBlocks(draws, n0, first, blocks);
            if (recorder != null) {
                recorder.record(channel, fade);
            }
        }
    }

    /** Whether fades are drawn scaled, so that each frame carries a weight (see {@link LinkChannel#fadeScale}). */
    final boolean weighted() {
        return channel.scaled();
    }

    /** The last frame's weight p/q: the product of its fading blocks' likelihood ratios. */
    final double frameWeight() {
        return Math.exp(frameLogWeight);
    }

    /** The last frame's fade energy: its blocks' {@link LinkChannel#blockFadeEnergy()} summed. */
    final double frameFadeEnergy() {
        return frameFadeEnergy;
    }

    /** Adds the last frame's weight to {@code counters} when fades are scaled (after its {@code addFrame}). */
    final void weigh(FrameCounters counters, int bitErrors, int symbolErrors) {
        if (channel.scaled()) {
            counters.addWeight(frameWeight(), frameFadeEnergy, bitErrors, symbolErrors);
        }
    }

    /** Called before each frame with its noise level (the interleaved path's MMSE depends on it). */
    void prepare(double n0) {
    }

    /**
     * Code blocks {@code first .. first+blocks)}, all in the current fading block: encode, send
     * through {@link #channel}, estimate the channel into {@link #hHat}, combine.
     */
    abstract void sendBlocks(Draws draws, double n0, int first, int blocks);

    /** The last frame's symbol estimates, interleaved complex, into {@code out} (for tests). */
    abstract void copyEstimates(double[] out);

    /** Maps a frame's bits, {@code bitsPerSymbol} per symbol in frame order, to the symbols to send. */
    abstract void map(QamConstellation constellation, byte[] bits);

    /** The LLRs of the last frame's symbol estimates at noise level {@code n0}, in the order of {@link #map}'s bits. */
    abstract void demap(QamConstellation constellation, LlrMethod method, double n0, double[] llr);
}
