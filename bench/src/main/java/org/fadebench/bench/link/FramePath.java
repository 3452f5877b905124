package org.fadebench.bench.link;

import org.fadebench.channel.Draws;

/**
 * How one kind of link runs its frames: the planar path of codes with a {@link
 * org.fadebench.coding.stbc.PlanarKernel planar kernel}, the general interleaved path, and the
 * coded path that decodes frames in lanes. Each path owns its buffers and allocates nothing per
 * frame; each worker thread has its own. {@link LinkChain} chooses the path for a link.
 */
public interface FramePath {

    /**
     * Simulates frames {@code first .. first+count-1} of an SNR point (the frame number numbers the
     * fading blocks, which select a recorded trace's matrices) at noise level {@code n0} (SNR =
     * 1/n0), drawing from {@code draws} frame after frame, and adds them to {@code counters}.
     */
    void runFrames(Draws draws, double n0, long first, int count, FrameCounters counters);
}
