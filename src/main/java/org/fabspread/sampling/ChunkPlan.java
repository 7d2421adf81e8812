package org.fabspread.sampling;

import java.io.IOException;

/**
 * One batch of model evaluations cut into numbered chunks: the unit an {@link Engine} distributes.
 * Chunk {@code c}'s result must depend on the plan and {@code c} only (its random stream comes from
 * (seed, c), never from the worker or the order of execution), so any engine, on any number of
 * threads or machines, hands over the same results.
 *
 * @param <W> the per-worker state (an evaluator and its scratch arrays); one per thread, never shared
 * @param <R> one chunk's result, handed to the caller in chunk order
 */
public interface ChunkPlan<W, R> {

    /** Number of chunks. */
    long chunkCount();

    /** A fresh worker state, made once per worker thread. */
    W newWorker();

    /** Evaluates chunk {@code chunk} with the calling worker's own state. */
    R evaluate(W worker, long chunk);

    /** Receives chunk results in chunk order, on the calling thread. */
    @FunctionalInterface
    interface Sink<R> {
        void accept(long chunk, R result) throws IOException;
    }
}
