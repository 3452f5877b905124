package org.fadebench.coding.fec.ldpc;

import java.util.Arrays;
import org.fadebench.coding.fec.Lanes;

/**
 * The fixed-point min-sum decoder of {@link FixedPointDecoder} (same quantisation, messages and
 * schedule, the same result for every frame bit for bit) for a quasi-cyclic H: vectorised over the
 * Z rows of a block row and {@value #WIDTH} lanes, rather than over lanes alone.
 *
 * <p>In a block row every column is touched at most once (each circulant is a permutation), so its
 * Z rows are independent and updating them together gives exactly the row-by-row layered result.
 * Layout: the posteriors of a base column as one row [z][lane], the messages of a block edge as
 * [z][lane] (a row per block edge), and the per-check quantities as [z][lane]. Row z of block
 * (i, j) with shift s reads column (z + s) mod Z of block j, so each base column's row is kept
 * turned: row z holds column z + t mod Z, t the column's turn. Before block (i, j) is updated,
 * column j is brought to turn s unless it is there already: turned into a spare row (two
 * {@code System.arraycopy}) that then takes its place. It is not turned back; between iterations
 * every column rests at the turn of its last block in the schedule (its home turn, in which
 * channel values and decisions are kept too). So each step of the check update
 * ({@link MinSumLoops}) is one loop over Z·{@value #WIDTH} ints with every array indexed from 0
 * (C2 in Java 17 does not vectorise a loop whose arrays are indexed from different offsets),
 * instead of one short loop per row and edge, and a block edge costs one turned copy or none (a
 * column whose blocks in a row share a shift, as the 0 shifts of the dual-diagonal part do).
 *
 * <p>Lanes: up to {@code lanes} frames are loaded; they are decoded in groups of {@value #WIDTH},
 * one group after another through one working set (posteriors and messages), so the lane count
 * a link chooses costs only the channel values and decisions of each lane. Shortened columns keep
 * their slots with a posterior of {@value #SHORTENED}: above every |Q| (at most CHANNEL_LIMIT +
 * degree · MESSAGE_LIMIT) and positive, it is never a least value nor flips a sign, and the minima
 * are held at MESSAGE_LIMIT anyway, so this equals removing the column. Early stop per lane, as in
 * {@link FixedPointDecoder}; a group ends when all its lanes are done. Allocates nothing after
 * construction.
 */
final class QcDecoder extends LayeredDecoder {

    /** Lanes decoded together (one 512-bit vector of ints per row of a block). */
    static final int WIDTH = 16;
    /** The posterior of a shortened column. */
    static final int SHORTENED = 1 << 29;

    private final int lifting;
    private final int slice;
    private final int baseColumns;
    private final int blockRows;
    private final int[] blockStart;
    private final int[] blockColumn;
    private final int[] blockShift;
    /**
     * Per base column: the turn its posterior row has now; between iterations its home turn (the
     * shift of its last block in the schedule), the turn channel values and decisions are kept at.
     */
    private final int[] turn;
    /** Per column of H: its base column, whose rows hold it. */
    private final int[] columnBlock;
    /** Per column of H: its place in its base column's rows (turned row · WIDTH, at the home turn). */
    private final int[] columnAt;
    private final MinSumLoops.Correction correction;
    /** Per group and base column: the channel values of its lanes as [turned row][lane], at the home turn. */
    private final int[][][] channel;
    /** Per group and base column: the posteriors of its lanes when they finished, at the home turn. */
    private final int[][][] decided;
    /** Per base column: its posteriors as [turned row][lane] (row z holds position z + turn mod Z). */
    private final int[][] posterior;
    /** A row the next turned posteriors are copied into; swapped with the row it was turned from. */
    private int[] spare;
    private final MinSumLoops.Group edges;
    private final int[][] check;
    private final int[] least;
    private final int[] second;
    private final int[] leastOut;
    private final int[] gap;
    private final int[] parity;
    private final int[] syndrome;
    private final int[] failedRows;
    private final int[] mask;
    private final boolean[] active;
    /** Per lane of the working set: iterations done so far. */
    private final int[] done;
    /** Per lane of group 0: loaded since it last started (continuous decoding). */
    private final boolean[] loaded;

    QcDecoder(QcStructure qc, LdpcDecoding decoding, int lanes) {
        super(qc.columns(), decoding, lanes);
        QcBaseMatrix base = qc.base();
        lifting = base.lifting();
        slice = lifting * WIDTH;
        baseColumns = base.baseColumns();
        blockRows = base.baseRows();
        int blocks = blocks(base);
        blockStart = new int[blockRows + 1];
        blockColumn = new int[blocks];
        blockShift = new int[blocks];
        for (int i = 0, b = 0; i < blockRows; i++) {
            for (int j = 0; j < baseColumns; j++) {
                if (base.shift(i, j) >= 0) {
                    blockColumn[b] = j;
                    blockShift[b++] = base.shift(i, j);
                }
            }
            blockStart[i + 1] = b;
        }
        // each column's home turn: the shift of its last block in the schedule
        turn = new int[baseColumns];
        for (int b = 0; b < blocks; b++) {
            turn[blockColumn[b]] = blockShift[b];
        }
        columnBlock = new int[columns];
        columnAt = new int[columns];
        for (int c = 0; c < columns; c++) {
            int j = qc.position(c) / lifting;
            int z = qc.position(c) % lifting;
            columnBlock[c] = j;
            columnAt[c] = Math.floorMod(z - turn[j], lifting) * WIDTH;
        }
        correction = MinSumLoops.Correction.of(decoding);
        int groups = groups(lanes);
        channel = new int[groups][baseColumns][slice];
        for (int[][] group : channel) {
            for (int[] row : group) {
                Arrays.fill(row, SHORTENED);
            }
            for (int c = 0; c < columns; c++) {
                Arrays.fill(group[columnBlock[c]], columnAt[c], columnAt[c] + WIDTH, 0);
            }
        }
        decided = new int[groups][baseColumns][slice];
        posterior = new int[baseColumns][slice];
        mask = new int[slice];
        spare = new int[slice];
        edges = new MinSumLoops.Group(slice);
        check = new int[blocks][slice];
        least = new int[slice];
        second = new int[slice];
        leastOut = new int[slice];
        gap = new int[slice];
        parity = new int[slice];
        syndrome = new int[slice];
        failedRows = new int[slice];
        active = new boolean[WIDTH];
        done = new int[WIDTH];
        loaded = new boolean[WIDTH];
    }

    private static int blocks(QcBaseMatrix base) {
        int count = 0;
        for (int i = 0; i < base.baseRows(); i++) {
            for (int j = 0; j < base.baseColumns(); j++) {
                count += base.shift(i, j) >= 0 ? 1 : 0;
            }
        }
        return count;
    }

    private static int groups(int lanes) {
        return (lanes + WIDTH - 1) / WIDTH;
    }

    /** Bytes the buffers of a decoder take. */
    static long bytes(QcStructure qc, int lanes) {
        QcBaseMatrix base = qc.base();
        long slice = 4L * base.lifting() * WIDTH;
        long columnRows = Lanes.rowBytes(4L * base.baseColumns()) + base.baseColumns() * Lanes.rowBytes(slice);
        int blocks = blocks(base);
        int groups = groups(lanes);
        return sharedBytes(lanes) + Lanes.rowBytes(4L * (base.baseRows() + 1)) + 2 * Lanes.rowBytes(4L * blocks)
                + 2 * Lanes.rowBytes(4L * base.baseColumns()) + 2 * Lanes.rowBytes(4L * qc.columns())
                + 2 * (Lanes.rowBytes(4L * groups) + groups * columnRows) + columnRows
                + Lanes.rowBytes(4L * blocks) + blocks * Lanes.rowBytes(slice) + 9 * Lanes.rowBytes(slice)
                + MinSumLoops.Group.bytes(base.lifting() * WIDTH)
                + 2 * Lanes.rowBytes(WIDTH) + Lanes.rowBytes(4L * WIDTH);
    }

    /**
     * {@inheritDoc} Each LLR is checked as it is put: after an error (an LLR not finite) the lane
     * holds part of the frame and is not loaded; load it again.
     */
    @Override
    public void load(int lane, double[] llr, int off) {
        Lanes.checkLane(lane, lanes);
        int[][] group = channel[lane / WIDTH];
        int w = lane % WIDTH;
        if (lane < WIDTH) {
            loaded[lane] = false;
        }
        for (int c = 0; c < columns; c++) {
            double value = llr[off + c];
            if (!Double.isFinite(value)) {
                throw notFinite(lane, c, value);
            }
            group[columnBlock[c]][columnAt[c] + w] = FixedPointDecoder.quantise(value);
        }
        if (lane < WIDTH) {
            loaded[lane] = true;
        }
    }

    @Override
    int decision(int lane, int column) {
        return decided[lane / WIDTH][columnBlock[column]][columnAt[column] + lane % WIDTH] >>> 31;
    }

    @Override
    public void decode(int frames) {
        Lanes.checkFrames(frames, lanes);
        Arrays.fill(loaded, false);
        for (int g = 0; g * WIDTH < frames; g++) {
            int n = Math.min(WIDTH, frames - g * WIDTH);
            for (int j = 0; j < baseColumns; j++) {
                System.arraycopy(channel[g][j], 0, posterior[j], 0, slice);
            }
            for (int[] row : check) {
                Arrays.fill(row, 0);
            }
            Arrays.fill(active, false);
            Arrays.fill(active, 0, n, true);
            Arrays.fill(done, 0);
            int running = n;
            while (running > 0) {
                running -= iterate(g, null);
            }
        }
        decodedLanes = frames;
    }

    /** The first {@value #WIDTH} lanes (one group), or fewer if the decoder has fewer. */
    @Override
    public int continuousLanes() {
        return Math.min(WIDTH, lanes);
    }

    /**
     * Starts the lanes loaded since the last call (their posteriors from the channel, their
     * messages 0, no iteration done), then runs iterations of the group until at least one lane is
     * finished.
     */
    @Override
    public int advance(int[] finished) {
        int started = 0;
        boolean starting = false;
        for (int w = 0; w < WIDTH; w++) {
            mask[w] = loaded[w] ? -1 : 0;
            if (loaded[w]) {
                starting = true;
                loaded[w] = false;
                active[w] = true;
                done[w] = 0;
            }
            started += active[w] ? 1 : 0;
        }
        if (starting) {
            start();
        }
        decodedLanes = continuousLanes();
        int count = 0;
        while (started > 0 && count == 0) {
            count = iterate(0, finished);
        }
        return count;
    }

    /**
     * The lanes of group 0 where {@code mask[0 .. WIDTH)} is −1 from their channel values:
     * posteriors from the channel, messages 0. One pass over each row for all of them, with the
     * mask spread over the row (a lane's values are every {@value #WIDTH}th int, one per cache
     * line, so a pass per lane would touch every line of the working set once per lane).
     */
    private void start() {
        spreadMask();
        for (int j = 0; j < baseColumns; j++) {
            MinSumLoops.keep(channel[0][j], posterior[j], mask, slice);
        }
        for (int[] row : check) {
            clear(row, mask, slice);
        }
    }

    /** {@code mask[0 .. WIDTH)}, one value per lane, repeated over the whole row. */
    private void spreadMask() {
        for (int at = WIDTH; at < slice; at += WIDTH) {
            System.arraycopy(mask, 0, mask, at, WIDTH);
        }
    }

    /** row = 0 where mask is −1, unchanged where 0. */
    private static void clear(int[] row, int[] mask, int len) {
        for (int x = 0; x < len; x++) {
            row[x] &= ~mask[x];
        }
    }

    /**
     * One iteration of every block row over the working set (the lanes of {@code group}), then
     * finishes the running lanes whose checks all hold (early stop) or that reached the limit:
     * iterations, satisfied, decisions. Lanes not running are computed too, unseen.
     *
     * @param finished where the lanes finished (within the group) go, or null
     * @return how many lanes it finished
     */
    private int iterate(int group, int[] finished) {
        for (int i = 0; i < blockRows; i++) {
            updateBlockRow(i);
        }
        int limit = decoding.iterations();
        boolean atLimit = false;
        for (int w = 0; w < WIDTH; w++) {
            if (active[w] && ++done[w] >= limit) {
                atLimit = true;
            }
        }
        if (!atLimit && !decoding.earlyStop()) {
            return 0;
        }
        computeSyndromes();
        int count = 0;
        for (int w = 0; w < WIDTH; w++) {
            int failed = 0;
            for (int z = 0; z < lifting; z++) {
                failed |= failedRows[z * WIDTH + w];
            }
            boolean ok = failed >= 0;
            boolean stop = active[w] && (ok && decoding.earlyStop() || done[w] >= limit);
            mask[w] = stop ? -1 : 0;
            if (stop) {
                int lane = group * WIDTH + w;
                active[w] = false;
                iterations[lane] = done[w];
                satisfied[lane] = ok;
                if (finished != null) {
                    finished[count] = w;
                }
                count++;
            }
        }
        if (count > 0) {
            spreadMask();
            for (int j = 0; j < baseColumns; j++) {
                MinSumLoops.keep(posterior[j], decided[group][j], mask, slice);
            }
        }
        return count;
    }

    /**
     * {@code from}, the posteriors of a base column at turn {@code at}, into {@code to} at turn
     * {@code want}: row z of {@code to} is row z + want − at (mod Z) of {@code from} (two copies).
     */
    private void copyTurned(int[] from, int at, int[] to, int want) {
        int d = Math.floorMod(want - at, lifting) * WIDTH;
        System.arraycopy(from, d, to, 0, slice - d);
        System.arraycopy(from, 0, to, slice - d, d);
    }

    /**
     * The posteriors of block b's base column, turned so that row z of the block reads row z
     * (column z + shift mod Z of the block's base column): the row itself if it is at that turn
     * already, else a turned copy that replaces it.
     */
    private int[] turned(int b) {
        int j = blockColumn[b];
        if (turn[j] != blockShift[b]) {
            copyTurned(posterior[j], turn[j], spare, blockShift[b]);
            int[] old = posterior[j];
            posterior[j] = spare;
            spare = old;
            turn[j] = blockShift[b];
        }
        return posterior[j];
    }

    private void updateBlockRow(int i) {
        int end = blockStart[i + 1];
        for (int b = blockStart[i]; b < end; b += MinSumLoops.GROUP) {
            for (int k = 0; k < MinSumLoops.GROUP; k++) {
                if (b + k < end) {
                    edges.edge(k, turned(b + k), check[b + k]);
                } else {
                    edges.filler(k);
                }
            }
            MinSumLoops.subtractAndMinima(edges, b == blockStart[i], parity, least, second, slice);
        }
        correction.apply(least, second, parity, leastOut, gap, slice);
        for (int b = blockStart[i]; b < blockStart[i + 1]; b++) {
            MinSumLoops.scatter(posterior[blockColumn[b]], check[b], least, leastOut, gap, slice);
        }
    }

    /** failedRows[z·WIDTH + w] negative iff a check of row z of some block row fails for lane w, on the signs of P. */
    private void computeSyndromes() {
        Arrays.fill(failedRows, 0);
        for (int i = 0; i < blockRows; i++) {
            Arrays.fill(syndrome, 0);
            for (int b = blockStart[i]; b < blockStart[i + 1]; b++) {
                MinSumLoops.exclusiveOr(syndrome, turned(b), slice);
            }
            MinSumLoops.or(failedRows, syndrome, slice);
        }
    }
}
