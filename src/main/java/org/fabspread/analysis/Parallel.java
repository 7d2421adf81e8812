package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Supplier;

import org.fabspread.sampling.WorkerPool;

/**
 * Runs numbered tasks on a fixed pool. Each worker thread owns one state object (an evaluator and its
 * scratch arrays); tasks write their results by index, so the outcome does not depend on the number of
 * threads or on scheduling.
 */
final class Parallel {

    private Parallel() {
    }

    /** The body of one task, given the calling worker's own state. */
    @FunctionalInterface
    interface Body<S> {
        void run(S state, int task);
    }

    static int threads(int requested) {
        return requested > 0 ? requested : Math.max(1, Runtime.getRuntime().availableProcessors());
    }

    /** Runs tasks 0..tasks-1 on {@code threads} workers and waits; the first failure is rethrown. */
    static <S> void run(int tasks, int threads, Supplier<S> state, Body<S> body) {
        int t = Math.max(1, Math.min(threads(threads), tasks));
        if (t == 1) {
            S s = state.get();
            for (int i = 0; i < tasks; i++) {
                body.run(s, i);
            }
            return;
        }
        AtomicInteger next = new AtomicInteger();
        ExecutorService pool = WorkerPool.fixed(t, "fabspread-analysis");
        try {
            List<Future<?>> futures = new ArrayList<>();
            for (int w = 0; w < t; w++) {
                futures.add(pool.submit(() -> {
                    S s = state.get();
                    for (int i = next.getAndIncrement(); i < tasks; i = next.getAndIncrement()) {
                        body.run(s, i);
                    }
                }));
            }
            for (Future<?> f : futures) {
                try {
                    f.get();
                } catch (ExecutionException e) {
                    next.set(tasks);
                    throw new IllegalStateException(WorkerPool.rethrowUnchecked(e));
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    next.set(tasks);
                    throw new IllegalStateException("interrupted", e);
                }
            }
        } finally {
            pool.shutdownNow();
        }
    }
}
