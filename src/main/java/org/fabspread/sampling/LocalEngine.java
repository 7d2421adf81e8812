package org.fabspread.sampling;

import java.io.IOException;
import java.util.ArrayDeque;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.function.BooleanSupplier;

/**
 * The engine of one machine: a fixed pool of daemon worker threads, each with its own worker state;
 * at most {@code 2T + 2} chunks in flight (so memory is bounded), results handed over in chunk order on
 * the calling thread. With one thread the chunks run on the calling thread itself.
 *
 * @param threads worker threads (≥ 1)
 */
public record LocalEngine(int threads) implements Engine {

    public LocalEngine {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be >= 1, got " + threads);
        }
    }

    @Override
    public <W, R> long run(ChunkPlan<W, R> plan, long fromChunk, ChunkPlan.Sink<R> sink, BooleanSupplier stop)
            throws IOException {
        long total = plan.chunkCount();
        if (threads == 1 || total - fromChunk <= 1) {
            return runHere(plan, fromChunk, sink, stop);
        }
        ExecutorService pool = WorkerPool.fixed(threads, "fabspread-worker");
        ThreadLocal<W> workers = ThreadLocal.withInitial(plan::newWorker);
        ArrayDeque<Future<R>> inflight = new ArrayDeque<>();
        int window = 2 * threads + 2;
        long next = fromChunk;
        long done = fromChunk;
        try {
            while (inflight.size() < window && next < total) {
                long c = next++;
                inflight.add(pool.submit(() -> plan.evaluate(workers.get(), c)));
            }
            while (!inflight.isEmpty()) {
                if (stop.getAsBoolean()) {
                    break;
                }
                R r = take(inflight.poll());
                sink.accept(done, r);
                done++;
                if (!stop.getAsBoolean() && next < total) {
                    long c = next++;
                    inflight.add(pool.submit(() -> plan.evaluate(workers.get(), c)));
                }
            }
        } finally {
            for (Future<R> f : inflight) {
                f.cancel(false);
            }
            pool.shutdown();
            try {
                pool.awaitTermination(1, TimeUnit.MINUTES);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
        return done;
    }

    private static <W, R> long runHere(ChunkPlan<W, R> plan, long fromChunk, ChunkPlan.Sink<R> sink,
                                       BooleanSupplier stop) throws IOException {
        long total = plan.chunkCount();
        W worker = null;
        long c = fromChunk;
        for (; c < total && !stop.getAsBoolean(); c++) {
            if (worker == null) {
                worker = plan.newWorker();
            }
            sink.accept(c, plan.evaluate(worker, c));
        }
        return c;
    }

    private static <R> R take(Future<R> f) throws IOException {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted while waiting for a chunk", e);
        } catch (ExecutionException e) {
            Throwable t = WorkerPool.rethrowUnchecked(e);
            throw new RunFailedException("model evaluation failed: " + t, t);
        }
    }
}
