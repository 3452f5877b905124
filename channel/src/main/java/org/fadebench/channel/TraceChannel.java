package org.fadebench.channel;

/**
 * Channel matrices replayed from a recorded {@link ChannelTrace}: fading block b gets matrix
 * {@code b mod N}, with no random draws, so a replay is the same on any number of threads.
 */
public record TraceChannel(ChannelTrace trace) implements ChannelModel {

    public TraceChannel {
        java.util.Objects.requireNonNull(trace, "trace");
    }

    @Override
    public String name() {
        return "trace";
    }

    @Override
    public void check(int nr, int mt) {
        try {
            trace.requireShape(nr, mt);
            trace.requireLinkRange();
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("--trace " + e.getMessage(), e);
        }
    }

    /** The matrices in order, one per call (see {@link TraceFading}). */
    @Override
    public FadingModel newModel(int nr, int mt) {
        return new TraceFading(trace);
    }

    @Override
    public BlockChannel newBlockChannel(int nr, int mt) {
        return (draws, blockIndex, slots, h) -> trace.matrix(blockIndex, h);
    }

    @Override
    public String describe() {
        return "trace " + trace.source() + " (" + trace.size() + " matrices)";
    }
}
