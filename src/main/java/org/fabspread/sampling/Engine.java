package org.fabspread.sampling;

import java.io.IOException;
import java.util.function.BooleanSupplier;

/**
 * Where every batch of model evaluations runs: the main Monte Carlo, what-if re-runs, the Sobol design,
 * importance sampling. An engine evaluates the chunks of a {@link ChunkPlan} (on threads, or on another
 * machine) and hands their results to the caller strictly in chunk order, so sums taken in the sink are
 * taken in sample order and the outcome does not depend on the engine. {@link LocalEngine} is the
 * engine of one machine.
 */
public interface Engine {

    /**
     * Evaluates chunks {@code fromChunk ..} of {@code plan} until the end or until {@code stop} answers
     * true (checked before each hand-over).
     *
     * @return the index of the first chunk not handed over ({@code plan.chunkCount()} when complete); an
     *         unchecked exception of a chunk's evaluation reaches the caller unchanged
     */
    <W, R> long run(ChunkPlan<W, R> plan, long fromChunk, ChunkPlan.Sink<R> sink, BooleanSupplier stop)
            throws IOException;

    /** Runs every chunk, with no way to stop early. */
    default <W, R> void runAll(ChunkPlan<W, R> plan, ChunkPlan.Sink<R> sink) throws IOException {
        run(plan, 0, sink, () -> false);
    }

    /** The engine of this machine with {@code threads} worker threads (0: all processors). */
    static Engine local(int threads) {
        return new LocalEngine(threads > 0 ? threads : Math.max(1, Runtime.getRuntime().availableProcessors()));
    }
}
