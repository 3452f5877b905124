package org.fadebench.bench.sweep;

import java.io.Serializable;
import java.util.Arrays;
import java.util.Objects;
import org.fadebench.bench.link.LinkSettings;

/**
 * Everything that fixes a sweep's numbers, and all a worker needs to compute any batch of it: the
 * link, the SNR points, the stop rules, the seed and which channels to record. A plain value that
 * is built without the command line and is {@link Serializable}, so that an executor may ship it to
 * other processes or machines (see {@link BatchExecutor}).
 *
 * <p>The frames of a point are cut into batches of {@link #batchFrames()} frames, a size that
 * depends only on the link; batch b holds frames {@code b·batchFrames ..} and draws from
 * {@code Draws.of(seed, point, b)}. The last batch of a point is cut at {@code maxFrames}.
 *
 * @param recordedBlocks how many fading blocks of the first SNR point keep their true channel in
 *                       the batch results (for {@code --trace-out}); 0 for none
 */
public record SweepPlan(LinkSettings link, double[] snrDb, StopRules rules, long seed, int recordedBlocks)
        implements Serializable {

    /** Target number of symbols per batch; batches are whole frames. */
    static final int BATCH_SYMBOLS = 1 << 15;

    public SweepPlan {
        Objects.requireNonNull(link, "link");
        Objects.requireNonNull(rules, "rules");
        snrDb = snrDb.clone();
        if (snrDb.length == 0) {
            throw new IllegalArgumentException("a sweep needs at least one SNR point");
        }
        if (recordedBlocks < 0) {
            throw new IllegalArgumentException("recorded blocks must be 0 or more, got " + recordedBlocks);
        }
    }

    /** A plan that records no channels. */
    public SweepPlan(LinkSettings link, double[] snrDb, StopRules rules, long seed) {
        this(link, snrDb, rules, seed, 0);
    }

    @Override
    public double[] snrDb() {
        return snrDb.clone();
    }

    public int points() {
        return snrDb.length;
    }

    public double snrDb(int point) {
        return snrDb[point];
    }

    /** Noise level N0 of a point (SNR = 1/N0). */
    public double n0(int point) {
        return Math.pow(10.0, -snrDb[point] / 10.0);
    }

    /** Frames per batch. */
    public int batchFrames() {
        return batchFrames(link);
    }

    /**
     * About {@link #BATCH_SYMBOLS} symbols of whole frames, rounded up to a whole number of the
     * link's {@link LinkSettings#lanes() lanes}, so that no group decoded together is cut short.
     */
    static int batchFrames(LinkSettings link) {
        int frames = Math.max(1, BATCH_SYMBOLS / link.symbolsPerFrame());
        int lanes = link.lanes();
        return (frames + lanes - 1) / lanes * lanes;
    }

    /** Batches that hold {@code maxFrames}: its quotient by the batch size, rounded up, for any long. */
    public long maxBatches() {
        return batches(rules.maxFrames(), batchFrames());
    }

    /** {@code frames / batchFrames} rounded up, without overflow for any positive long. */
    static long batches(long frames, int batchFrames) {
        long whole = frames / batchFrames;
        return frames % batchFrames == 0 ? whole : whole + 1;
    }

    /** Number of the batch's first frame within its point (numbers the fading blocks). */
    public long firstFrame(long batch) {
        return batch * batchFrames();
    }

    /** Frames in a batch: {@link #batchFrames()}, less in the last batch when maxFrames is not a multiple. */
    public int framesIn(long batch) {
        return (int) Math.min(batchFrames(), rules.maxFrames() - firstFrame(batch));
    }

    /** Fading blocks of a batch whose channels are recorded: its first ones, up to {@link #recordedBlocks}. */
    public int recordedBlocksIn(int point, long batch) {
        long first = firstFrame(batch);
        if (point != 0 || first >= recordedBlocks) {
            return 0;
        }
        long perFrame = link.fadingBlocksPerFrame();
        return (int) Math.max(0, Math.min(recordedBlocks - first * perFrame, framesIn(batch) * perFrame));
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof SweepPlan p && link.equals(p.link) && Arrays.equals(snrDb, p.snrDb)
                && rules.equals(p.rules) && seed == p.seed && recordedBlocks == p.recordedBlocks;
    }

    @Override
    public int hashCode() {
        return Objects.hash(link, Arrays.hashCode(snrDb), rules, seed, recordedBlocks);
    }

    @Override
    public String toString() {
        return "SweepPlan[" + link.describe() + ", snrDb=" + Arrays.toString(snrDb) + ", " + rules + ", seed=" + seed
                + ", recordedBlocks=" + recordedBlocks + "]";
    }
}
