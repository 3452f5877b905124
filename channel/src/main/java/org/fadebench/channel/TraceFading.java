package org.fadebench.channel;

/**
 * A {@link FadingModel} that hands out the matrices of a {@link ChannelTrace} in order, one per
 * {@code draw}, starting over when the trace ends (no random draws). The position is this
 * instance's own counter, so this suits one sequential consumer such as {@link MimoOutageSimulator};
 * a multi-threaded link selects matrices by block index with {@link ChannelTrace#matrix} instead.
 */
public final class TraceFading implements FadingModel {

    private final ChannelTrace trace;
    private long next;

    public TraceFading(ChannelTrace trace) {
        this.trace = trace;
    }

    @Override
    public void draw(Draws draws, int nr, int mt, double[] h) {
        trace.requireShape(nr, mt);
        trace.matrix(next++, h);
    }

    /** Whether some matrix has been handed out more than once. */
    public boolean cycled() {
        return trace.cyclesOver(next);
    }

    @Override
    public String name() {
        return "trace";
    }
}
