package org.fabspread.sampling;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;

import org.apache.commons.rng.UniformRandomProvider;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.study.AnalysisSettings.FailurePolicy;

/**
 * Runs a {@link Model} over the points of a {@link PointSet}.
 *
 * <p>The sample index range is cut into fixed chunks of {@link Config#chunkSize()} samples. Chunk c
 * draws from its own stream {@link Streams#chunkStream(long, long) (seed, c)}, is evaluated whole by
 * one worker thread with that thread's own {@link Evaluator}, and is handed to the sink on the
 * calling thread strictly in chunk order by an {@link Engine} (the chunks are the engine's
 * {@link ChunkPlan}; {@link LocalEngine} keeps at most {@code 2T + 2} in flight, so memory is bounded). Every number therefore depends on (seed, index) only: results are bit-identical for any
 * thread count.
 *
 * <p>A failed sample ({@link ModelException}, or a NaN or infinite output) keeps its row with its
 * reason as status. Under {@link FailurePolicy#STOP} the first failure in sample order ends the run
 * with a {@link RunFailedException}. Any other exception from the model is a bug and ends the run.
 *
 * <p>{@link #cancel()} (from any thread) stops the run after the chunk being handed over; the sink
 * has then seen exactly the chunks {@code from .. returned − 1}.
 */
public final class Runner {

    /** Default samples per chunk. Part of the reproducibility contract: results depend on it. */
    public static final int DEFAULT_CHUNK = 1024;

    /**
     * @param threads   worker threads (≥ 1)
     * @param chunkSize samples per chunk
     * @param policy    what a failed sample does
     */
    public record Config(int threads, int chunkSize, FailurePolicy policy) {
        public Config {
            if (threads < 1 || chunkSize < 1) {
                throw new IllegalArgumentException("threads and chunk size must be >= 1");
            }
        }
    }

    /** Receives the chunks in order, on the calling thread. */
    @FunctionalInterface
    public interface ChunkSink {
        void accept(Chunk chunk) throws IOException;
    }

    /** Told after each chunk is handed over. */
    @FunctionalInterface
    public interface Listener {
        void chunkDone(long chunksDone, long samplesDone);
    }

    private final Model model;
    private final InputSpace space;
    private final PointSet points;
    private final long seed;
    private final Config config;
    private final int[] modelToSpace;
    private final int k;
    private final int m;
    private volatile boolean cancelled;
    private volatile ChunkStore store;

    public Runner(Model model, InputSpace space, PointSet points, long seed, Config config) {
        this.model = model;
        this.space = space;
        this.points = points;
        this.seed = seed;
        this.config = config;
        this.k = space.dimension();
        this.m = model.outputs().size();
        if (points.dimension() != k) {
            throw new IllegalArgumentException("point set has " + points.dimension() + " dimensions, inputs " + k);
        }
        List<String> need = model.inputIds();
        this.modelToSpace = new int[need.size()];
        for (int i = 0; i < need.size(); i++) {
            int at = space.ids().indexOf(need.get(i));
            if (at < 0) {
                throw new IllegalArgumentException("the model needs input '" + need.get(i)
                        + "' which the study does not sample (sampled: " + space.ids() + ")");
            }
            modelToSpace[i] = at;
        }
    }

    public long chunkCount() {
        return (points.size() + config.chunkSize() - 1) / config.chunkSize();
    }

    public Config config() {
        return config;
    }

    /** Asks the run to stop after the chunk being handed over. Safe from any thread. */
    public void cancel() {
        cancelled = true;
    }

    public boolean cancelled() {
        return cancelled;
    }

    /**
     * Runs chunks {@code fromChunk ..} until the end or a cancellation, on the engine of this machine
     * with {@link Config#threads()} threads.
     *
     * @return the index of the first chunk not handed over (== {@link #chunkCount()} when complete)
     */
    public long run(long fromChunk, ChunkSink sink, Listener listener) throws IOException {
        return run(new LocalEngine(config.threads()), fromChunk, sink, listener);
    }

    /** As {@link #run(long, ChunkSink, Listener)}, on the given engine. */
    public long run(Engine engine, long fromChunk, ChunkSink sink, Listener listener) throws IOException {
        ChunkPlan<?, Chunk> plan = plan();
        return engine.run(plan, fromChunk, (c, chunk) -> {
            if (config.policy() == FailurePolicy.STOP) {
                stopOnFailure(chunk);
            }
            sink.accept(chunk);
            long done = chunk.index() + 1;
            if (listener != null) {
                listener.chunkDone(done, Math.min(points.size(), done * config.chunkSize()));
            }
        }, () -> cancelled);
    }

    /**
     * Has every chunk's samples written to {@code chunks} by the worker that evaluated it, before it is
     * handed over (null: none). Call before running.
     */
    public void storeChunks(ChunkStore chunks) {
        this.store = chunks;
    }

    /** Where the workers write each chunk's samples, or null. */
    public ChunkStore store() {
        return store;
    }

    /** The master seed. */
    public long seed() {
        return seed;
    }

    /** The model evaluated. */
    public Model model() {
        return model;
    }

    /** The input space the points are mapped through. */
    public InputSpace space() {
        return space;
    }

    /** The point set the samples come from. */
    public PointSet points() {
        return points;
    }

    /**
     * This run's chunks as a plan an {@link Engine} runs; a cluster engine rebuilds the same runner on
     * each machine and evaluates its plan there ({@link Plan#runner()} tells it which run this is).
     */
    public Plan plan() {
        return new Plan();
    }

    /** The chunks of this runner: chunk c is samples {@code c * chunkSize ..}, drawn from stream (seed, c). */
    public final class Plan implements ChunkPlan<Object, Chunk> {
        private Plan() {
        }

        /** The runner whose chunks these are. */
        public Runner runner() {
            return Runner.this;
        }

        @Override
        public long chunkCount() {
            return Runner.this.chunkCount();
        }

        @Override
        public Object newWorker() {
            return new Worker();
        }

        @Override
        public Chunk evaluate(Object worker, long chunk) {
            Chunk c = ((Worker) worker).evaluate(chunk);
            ChunkStore s = store;
            if (s != null) {
                try {
                    s.write(c);
                } catch (IOException e) {
                    throw new UncheckedIOException("chunk " + chunk + ": " + e.getMessage(), e);
                }
            }
            return c;
        }
    }

    private void stopOnFailure(Chunk c) {
        for (int r = 0; r < c.count(); r++) {
            if (!c.ok(r)) {
                throw new RunFailedException("sample " + (c.first() + r) + " failed (" + c.status()[r]
                        + ") and the study's failure policy is stop");
            }
        }
    }

    /** Per-thread state: the evaluator and scratch vectors. */
    private final class Worker {
        private final Evaluator evaluator = model.newEvaluator();
        private final double[] u = new double[k];
        private final double[] xs = new double[k];
        private final double[] xm = new double[modelToSpace.length];
        private final double[] ym = new double[m];
        private final StringBuilder text = new StringBuilder(1 << 16);

        Chunk evaluate(long c) {
            long first = c * config.chunkSize();
            int count = (int) Math.min(config.chunkSize(), points.size() - first);
            double[] x = new double[count * k];
            double[] y = new double[count * m];
            String[] status = new String[count];
            UniformRandomProvider rng = Streams.chunkStream(seed, c);
            text.setLength(0);
            for (int r = 0; r < count; r++) {
                long j = first + r;
                points.point(j, rng, u);
                space.map(u, xs);
                for (int i = 0; i < xm.length; i++) {
                    xm[i] = xs[modelToSpace[i]];
                }
                String st = null;
                try {
                    evaluator.evaluate(xm, ym);
                    for (int o = 0; o < m; o++) {
                        if (Double.isNaN(ym[o])) {
                            st = "nan-output";
                            break;
                        }
                        if (Double.isInfinite(ym[o])) {
                            st = "infinite-output";
                            break;
                        }
                    }
                } catch (ModelException e) {
                    st = SamplesCsv.reasonKey(e.reason());
                }
                System.arraycopy(xs, 0, x, r * k, k);
                if (st == null) {
                    System.arraycopy(ym, 0, y, r * m, m);
                } else {
                    java.util.Arrays.fill(y, r * m, (r + 1) * m, Double.NaN);
                }
                status[r] = st;
                SamplesCsv.appendRow(text, j, x, r * k, k, y, r * m, m, st);
            }
            return new Chunk(c, first, count, k, m, x, y, status, text.toString().getBytes(StandardCharsets.UTF_8));
        }
    }
}
