package org.fadebench.bench.sweep;

import java.util.Arrays;
import org.fadebench.bench.link.ChannelRecorder;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.channel.Draws;

/**
 * Computes batches of one plan on the calling thread: batch b of point p is frames
 * {@code plan.firstFrame(b) ..} simulated from the stream {@code Draws.of(seed, p, b)}. Owns a
 * {@link LinkChain} and its buffers, so each thread needs its own worker. With importance sampling
 * ({@link Estimator#FADE_SAMPLING}) a point's fades are drawn with the scale {@link FadeScaleSearch}
 * finds for it, searched once per worker and point (the same on every worker).
 */
public final class BatchWorker {

    private static final double[] NONE = new double[0];

    private final SweepPlan plan;
    private final LinkChain chain;
    /** With importance sampling: each point's fade scale, NaN until this worker first needs it. */
    private final double[] fadeScales;

    public BatchWorker(SweepPlan plan) {
        this.plan = plan;
        this.chain = new LinkChain(plan.link());
        this.fadeScales = new double[plan.points()];
        Arrays.fill(fadeScales, Double.NaN);
    }

    public BatchResult compute(BatchId id) {
        int recorded = plan.recordedBlocksIn(id.point(), id.batch());
        long first = plan.firstFrame(id.batch());
        ChannelRecorder recorder = recorded == 0 ? null : new ChannelRecorder(plan.link().receiveAntennas(),
                plan.link().transmitAntennas(), first * plan.link().fadingBlocksPerFrame(), recorded);
        chain.recordChannels(recorder);
        FrameCounters counts = new FrameCounters();
        if (plan.rules().fadeSampling()) {
            int p = id.point();
            if (Double.isNaN(fadeScales[p])) {
                fadeScales[p] = FadeScaleSearch.scale(plan, chain, p);
            }
            chain.fadeScale(fadeScales[p]);
            counts.fadeScale(fadeScales[p]);
        }
        chain.runFrames(Draws.of(plan.seed(), id.point(), id.batch()), plan.n0(id.point()), first,
                plan.framesIn(id.batch()), counts);
        return new BatchResult(id, counts, recorder == null ? NONE : recorder.matrices());
    }
}
