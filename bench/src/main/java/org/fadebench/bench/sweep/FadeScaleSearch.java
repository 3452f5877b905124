package org.fadebench.bench.sweep;

import java.util.Arrays;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkChain;
import org.fadebench.channel.Draws;

/**
 * The cross-entropy choice of the fade scale s of one SNR point (R. Y. Rubinstein and D. P.
 * Kroese, The Cross-Entropy Method, Springer 2004; the multi-level update of their rare-event
 * algorithm, from memory). Starting from s = 1, each of {@link #STAGES} pilot runs of
 * {@link #PILOT_FRAMES} frames, drawn with the current s from the point's own pilot streams
 * {@code Draws.of(seed, point, −1 − stage)} (the batches use keys 0, 1, …), picks its elite frames
 * and sets s to the weighted mean power of their entries: for the scaled Gamma law of each entry's
 * power, that maximises Σ_elite w·ln q(H; s), the cross-entropy program. The elite frames are the
 * frames in error when at least a fraction {@link #ELITE} of the run is; otherwise the frames in
 * error and the frames with the weakest fades, up to that fraction (the level steps towards the rare
 * event). Then s is frozen for the point; pilot frames are not counted.
 *
 * <p>The result depends only on the plan and the point, so every worker (any thread, any machine,
 * a resumed run) finds the same s.
 */
final class FadeScaleSearch {

    static final int STAGES = 8;
    static final int PILOT_FRAMES = 1000;
    static final double ELITE = 0.1;
    /** Bounds of s: no smaller than this, and never above 1 (fades are made deeper, not shallower). */
    static final double MIN_SCALE = 1e-4;

    private FadeScaleSearch() {
    }

    /** The frozen scale of {@code point}, found with {@code chain} (which is left at the last pilot's scale). */
    static double scale(SweepPlan plan, LinkChain chain, int point) {
        int entries = plan.link().receiveAntennas() * plan.link().transmitAntennas() * plan.link().fadingBlocksPerFrame();
        double s = 1.0;
        for (int stage = 0; stage < STAGES; stage++) {
            FrameCounters pilot = FrameCounters.logging(PILOT_FRAMES);
            chain.fadeScale(s);
            chain.runFrames(Draws.of(plan.seed(), point, -1L - stage), plan.n0(point), 0, PILOT_FRAMES, pilot);
            s = update(pilot.log(), entries, s);
        }
        return s;
    }

    /** The cross-entropy update from one pilot run's log; {@code s} if the run says nothing. */
    static double update(FrameCounters.FrameLog log, int entries, double s) {
        int n = log.size();
        int want = (int) Math.ceil(ELITE * n);
        int errors = 0;
        for (int i = 0; i < n; i++) {
            errors += log.error(i) ? 1 : 0;
        }
        double level = Double.NEGATIVE_INFINITY;
        if (errors < want) {
            double[] weak = new double[n - errors];
            for (int i = 0, k = 0; i < n; i++) {
                if (!log.error(i)) {
                    weak[k++] = log.energy(i);
                }
            }
            Arrays.sort(weak);
            level = weak[want - errors - 1];
        }
        double weights = 0;
        double energy = 0;
        for (int i = 0; i < n; i++) {
            if (log.error(i) || log.energy(i) <= level) {
                weights += log.weight(i);
                energy += log.weight(i) * log.energy(i);
            }
        }
        double next = energy / (entries * weights);
        return next > 0 && Double.isFinite(next) ? Math.min(1.0, Math.max(MIN_SCALE, next)) : s;
    }
}
