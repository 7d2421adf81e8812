package org.fabspread.spark;

import java.io.IOException;
import java.util.ArrayDeque;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.function.BooleanSupplier;
import java.util.function.IntFunction;

import org.fabspread.sampling.RunFailedException;
import org.fabspread.sampling.WorkerPool;

/**
 * A sliding window of blocking partition jobs, consumed in partition order: up to {@code window} jobs
 * run at once, each on its own driver thread, and the results of partition p are handed over only after
 * those of p − 1, so the consumer sees the same order as a sequential pass while the cluster works on
 * the following ones. The next job is started as soon as the oldest is taken, so at most
 * {@code window + 1} partitions' results are held on the driver at any time (the one being handed over,
 * and the jobs in flight or finished ahead of their turn). This is the bounded reorder buffer of a
 * pipelined processor applied to jobs (common practice).
 *
 * @param <T> one element of a partition's result (a chunk)
 */
final class InOrderJobs<T> {

    /** Receives the elements in partition order, then element order. */
    @FunctionalInterface
    interface Consumer<T> {
        void accept(T element) throws IOException;
    }

    private final int partitions;
    private final int window;
    private final IntFunction<List<T>> job;
    private final Runnable cancelAll;

    /**
     * @param partitions the number of partitions, 0 .. partitions − 1
     * @param window     jobs in flight at most (≥ 1)
     * @param job        runs the job of one partition and returns its elements (blocking; called on a driver
     *                   thread, several at once)
     * @param cancelAll  cancels the running jobs (called when the consumer stops early or a job fails)
     */
    InOrderJobs(int partitions, int window, IntFunction<List<T>> job, Runnable cancelAll) {
        if (window < 1) {
            throw new IllegalArgumentException("window must be >= 1, got " + window);
        }
        this.partitions = partitions;
        this.window = window;
        this.job = job;
        this.cancelAll = cancelAll;
    }

    /**
     * Runs every partition's job and hands the elements over in order until the end or until {@code stop}
     * answers true (asked before each element).
     *
     * @return the number of elements handed over
     */
    long drain(Consumer<T> consumer, BooleanSupplier stop) throws IOException {
        ExecutorService pool = WorkerPool.fixed(window, "fabspread-spark-job");
        ArrayDeque<Future<List<T>>> inflight = new ArrayDeque<>();
        int next = 0;
        long handed = 0;
        boolean finished = false;
        try {
            while (inflight.size() < window && next < partitions) {
                int p = next++;
                inflight.add(pool.submit(() -> job.apply(p)));
            }
            outer:
            while (!inflight.isEmpty()) {
                List<T> result = take(inflight.poll());
                if (next < partitions) {
                    int p = next++;
                    inflight.add(pool.submit(() -> job.apply(p)));
                }
                for (T t : result) {
                    if (stop.getAsBoolean()) {
                        break outer;
                    }
                    consumer.accept(t);
                    handed++;
                }
            }
            finished = inflight.isEmpty();
        } finally {
            if (!finished) {
                cancelAll.run();
                for (Future<List<T>> f : inflight) {
                    f.cancel(true);
                }
            }
            pool.shutdown();
            try {
                pool.awaitTermination(1, TimeUnit.MINUTES);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
        return handed;
    }

    private static <R> R take(Future<R> f) throws IOException {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted while waiting for a Spark job", e);
        } catch (ExecutionException e) {
            Throwable t = WorkerPool.rethrowUnchecked(e);
            throw new RunFailedException("Spark job failed: " + t, t);
        }
    }
}
