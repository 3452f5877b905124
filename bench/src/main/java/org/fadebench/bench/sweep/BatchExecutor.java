package org.fadebench.bench.sweep;

/**
 * Who computes a sweep's batches. The sweep ({@link SweepEngine}, keeping its books in a
 * {@link SweepLedger}) says which batches it wants through a {@link Feed}; an executor computes
 * each with a {@link BatchWorker} built from the {@link SweepPlan} (one worker per thread, as a
 * worker owns its buffers) and hands the {@link BatchResult} back, in any order and from any
 * thread. The numbers depend only on the plan, never on the executor: the feed merges each point's
 * batches in batch order.
 *
 * <p>The default is {@link LocalThreadExecutor}, a fixed set of threads on this machine. An
 * executor for a cluster takes a few wanted batches at a time, ships the plan (a serialisable
 * value) and the batch ids to its workers, and hands the serialisable results back.
 */
public interface BatchExecutor extends AutoCloseable {

    /**
     * Computes batches until the feed wants no more, then returns. Must hand back every batch it
     * took (unless the sweep was interrupted meanwhile, when results are ignored anyway).
     *
     * @throws RuntimeException when a batch cannot be computed; the sweep then fails with it
     */
    void execute(SweepPlan plan, Feed feed);

    /** Lets go of what the executor holds (a cluster application); the default holds nothing. */
    @Override
    default void close() {
    }

    /**
     * The executor could not compute batches for a reason outside fadebench (a cluster that failed
     * or went away); the message is one line for the user. The sweep fails with it as it is.
     */
    class Failure extends RuntimeException {
        public Failure(String message, Throwable cause) {
            super(message, cause);
        }
    }

    /** The sweep's side: wanted batches out, results in. Both methods are thread-safe. */
    interface Feed {

        /**
         * The next batch the sweep wants, or null when it wants no more (every batch that may
         * count has been handed out, or the sweep was interrupted). Never blocks.
         */
        BatchId next();

        /** Hands back a computed batch; cheap (merges counts), so it may be called per batch. */
        void done(BatchResult result);
    }
}
