package org.fabspread.analysis;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.function.Supplier;

import org.fabspread.sampling.ChunkPlan;
import org.fabspread.sampling.Engine;

/**
 * Runs numbered tasks as one batch on an {@link Engine} (by default the engine of this machine). Each
 * worker thread owns one state object (an evaluator and its scratch arrays); tasks write their results by
 * index, so the outcome does not depend on the number of threads or on scheduling.
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

    /** Runs tasks 0..tasks-1 on {@code threads} workers of this machine and waits; the first failure is rethrown. */
    static <S> void run(int tasks, int threads, Supplier<S> state, Body<S> body) {
        run(Engine.local(Math.max(1, Math.min(threads(threads), tasks))), tasks, state, body);
    }

    /**
     * Runs tasks 0..tasks-1 as the chunks of one batch on {@code engine} and waits; the first failure is
     * rethrown. Each task writes its results by index.
     */
    static <S> void run(Engine engine, int tasks, Supplier<S> state, Body<S> body) {
        ChunkPlan<S, Boolean> plan = new ChunkPlan<>() {
            @Override
            public long chunkCount() {
                return tasks;
            }

            @Override
            public S newWorker() {
                return state.get();
            }

            @Override
            public Boolean evaluate(S worker, long chunk) {
                body.run(worker, (int) chunk);
                return Boolean.TRUE;
            }
        };
        try {
            engine.runAll(plan, (c, done) -> { });
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
