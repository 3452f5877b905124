package org.fadebench.bench.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicReference;

/**
 * The default executor: a fixed number of threads on this machine, each with its own
 * {@link BatchWorker}, each taking the next wanted batch as soon as it is free (so every core
 * stays busy until the last point). The threads meet only in the feed, once per batch.
 */
public final class LocalThreadExecutor implements BatchExecutor {

    private final int threads;

    public LocalThreadExecutor(int threads) {
        if (threads <= 0) {
            throw new IllegalArgumentException("--threads must be positive, got " + threads);
        }
        this.threads = threads;
    }

    @Override
    public void execute(SweepPlan plan, Feed feed) {
        List<BatchWorker> workers = new ArrayList<>(threads);
        for (int i = 0; i < threads; i++) {
            workers.add(new BatchWorker(plan));
        }
        AtomicReference<Throwable> failure = new AtomicReference<>();
        List<Thread> running = new ArrayList<>(threads);
        for (int i = 0; i < threads; i++) {
            BatchWorker worker = workers.get(i);
            Thread t = new Thread(() -> {
                try {
                    BatchId id;
                    while (failure.get() == null && (id = feed.next()) != null) {
                        feed.done(worker.compute(id));
                    }
                } catch (RuntimeException | Error e) {
                    failure.compareAndSet(null, e);
                }
            }, "fadebench-worker-" + i);
            t.setDaemon(true);
            running.add(t);
            t.start();
        }
        boolean interrupted = false;
        for (Thread t : running) {
            while (t.isAlive()) {
                try {
                    t.join();
                } catch (InterruptedException e) {
                    // the sweep stops through its feed; the threads end after their batch
                    interrupted = true;
                }
            }
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
        }
        Throwable f = failure.get();
        if (f instanceof Error e) {
            throw e;
        }
        if (f != null) {
            throw (RuntimeException) f;
        }
    }
}
