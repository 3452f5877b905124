package org.fadebench.bench.link;

import org.fadebench.channel.Draws;
import org.fadebench.channel.LinkChannel;
import org.fadebench.coding.stbc.PlanarKernel;

/**
 * One link, end to end:
 * <pre>
 * info bits → (CRC, channel code, interleaver) → QAM map → space-time encode
 *   → per fading block: its channel (model, Doppler or trace), Y = X Hᵀ + N, the receiver's
 *     estimate Ĥ (perfect, noisy or from pilots) → combine with Ĥ
 *   → uncoded: slice; coded: LLRs → deinterleave, channel decoder, CRC
 *   → count bit, symbol and frame errors
 * </pre>
 * The chain only chooses the {@link FramePath} for its link and the {@link Transmission} under it:
 * <ul>
 *   <li>{@link CodedPath} when the frame carries a CRC or a channel code;</li>
 *   <li>else {@link PlanarPath} when the transmission is planar;</li>
 *   <li>else {@link GeneralPath}.</li>
 * </ul>
 * The transmission is planar ({@link PlanarTransmission}) when the space-time code has a
 * {@link PlanarKernel} and the channel stays constant within a fading block, else interleaved.
 * Random draws are taken in a fixed order (bits, padding, then per fading block H and noise), so
 * a frame depends only on the stream it is given. Each worker thread has its own chain.
 */
public final class LinkChain implements FramePath {

    private final LinkSettings settings;
    private final Transmission transmission;
    private final FramePath path;

    public LinkChain(LinkSettings settings) {
        this(settings, true);
    }

    /** A chain that takes the planar path where it applies ({@code planar}) or never. */
    LinkChain(LinkSettings settings, boolean planar) {
        this.settings = settings;
        LinkChannel channel = settings.channel().newLinkChannel(settings.receiveAntennas(),
                settings.transmitAntennas(), settings.effectiveCoherenceSlots());
        if (planar && planarApplies(settings)) {
            PlanarKernel kernel = settings.code().newPlanarKernel(settings.receiveAntennas()).orElseThrow();
            PlanarTransmission planes = new PlanarTransmission(settings, channel, kernel);
            this.transmission = planes;
            this.path = settings.coding().coded() ? new CodedPath(settings, planes) : new PlanarPath(settings, planes);
        } else {
            InterleavedTransmission interleaved = new InterleavedTransmission(settings, channel);
            this.transmission = interleaved;
            this.path = settings.coding().coded() ? new CodedPath(settings, interleaved)
                    : new GeneralPath(settings, interleaved);
        }
    }

    /**
     * Whether a chain of {@code settings} sends on planes: a space-time code with a
     * {@link PlanarKernel}, a channel constant within each fading block.
     */
    private static boolean planarApplies(LinkSettings settings) {
        return settings.code().hasPlanarKernel() && !settings.channel().varies();
    }

    /**
     * Bytes one chain's buffers take: what its transmission and frame path allocate, the channel's
     * matrices and the codec's buffers (array headers aside), so that a run can check the memory it
     * needs, chains times threads, before it starts.
     */
    public static long bufferBytes(LinkSettings settings) {
        long bytes = Transmission.channelBytes(settings);
        boolean planar = planarApplies(settings);
        bytes += planar ? PlanarTransmission.bufferBytes(settings) : InterleavedTransmission.bufferBytes(settings);
        if (settings.coding().coded()) {
            return bytes + CodedPath.bufferBytes(settings);
        }
        return bytes + (planar ? PlanarPath.bufferBytes(settings) : GeneralPath.bufferBytes(settings));
    }

    public LinkSettings settings() {
        return settings;
    }

    /** Records the channels of the following frames into {@code recorder} (null to stop). */
    public void recordChannels(ChannelRecorder recorder) {
        transmission.recordChannels(recorder);
    }

    @Override
    public void runFrames(Draws draws, double n0, long first, int count, FrameCounters counters) {
        path.runFrames(draws, n0, first, count, counters);
    }

    /**
     * Importance sampling of deep fades: draws the following frames' fades with every independent
     * entry's power scaled by {@code scale}, each frame weighted by its likelihood ratio in the
     * counters (see {@link org.fadebench.channel.LinkChannel#fadeScale}); NaN returns to plain draws.
     */
    public void fadeScale(double scale) {
        transmission.channel.fadeScale(scale);
    }

    /** Whether this chain sends on planes. */
    boolean planar() {
        return transmission instanceof PlanarTransmission;
    }

    /** The last frame's symbol estimates, interleaved complex, into {@code out} (for tests). */
    void copyEstimates(double[] out) {
        transmission.copyEstimates(out);
    }
}
