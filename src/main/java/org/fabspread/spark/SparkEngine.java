package org.fabspread.spark;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.IdentityHashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.BooleanSupplier;
import java.util.function.ToLongFunction;

import org.apache.spark.SparkConf;
import org.apache.spark.SparkException;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import org.fabspread.device.DeviceModel;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.Chunk;
import org.fabspread.sampling.ChunkPlan;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.LocalEngine;
import org.fabspread.sampling.ModelRows;
import org.fabspread.sampling.RowBatch;
import org.fabspread.sampling.RowInputs;
import org.fabspread.sampling.RowOutputs;
import org.fabspread.sampling.RunFailedException;
import org.fabspread.sampling.Runner;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * The cluster engine: every batch of the study's model runs as Spark tasks (Zaharia et al., "Resilient
 * distributed datasets", NSDI 2012). The study's files ({@link StudySource}) travel to the executors once
 * per Spark context, as a broadcast; each executor rebuilds the same device model once
 * ({@link StudyModels}). The main Monte Carlo's tasks rebuild its runner ({@link MonteCarloRecipe}, one more
 * broadcast per run) and evaluate a group of consecutive chunks each, every chunk from its own stream
 * (seed, c) as on one machine. A {@link RowBatch} (the Sobol and Shapley designs, what-if re-runs, importance
 * sampling, the plan's noise estimate) has its chunks' input rows drawn on the driver and shipped with the
 * task; the task returns the rows' outputs as plain arrays ({@link RowOutputs}).
 *
 * <p>Each task (a range of consecutive chunks) is a job of its own; total cores + 1 such jobs are in flight
 * ({@link InOrderJobs}), so every core has a task and the next one is queued, and the results are handed to
 * the sink strictly in chunk order, so everything the driver computes from them is bit-identical to the
 * local engine. The driver holds at most cores + 2 tasks' results at a time. A batch whose model is not the
 * study's (checked once per model: class, inputs, outputs and the bits of one evaluation beside the model
 * rebuilt from the study's files) runs on the driver's local engine, and the engine says so on its log.
 * One Spark context serves every batch of a run; {@link #close()} stops it.
 */
public final class SparkEngine implements Engine, AutoCloseable {

    /** Chunk groups per Spark core: small enough to balance, large enough that task overhead stays small. */
    static final int TASKS_PER_CORE = 4;

    /** Chunks per task at most: 16 chunks of 1024 samples are about 5 MB of results, samples text included. */
    static final int MAX_CHUNKS_PER_TASK = 16;

    private final String master;
    private final StudySource source;
    private final LocalEngine driver;
    private final TaskProbe probe;
    private final PrintWriter log;
    private final Map<Model, Boolean> portable = new IdentityHashMap<>();
    private final Set<String> toldLocal = new HashSet<>();
    private JavaSparkContext sc;
    private Broadcast<StudySource> sharedSource;
    private String mainFingerprint;

    /**
     * @param master  the Spark master URL ({@code local[2]}, {@code spark://host:7077}), or null to take it
     *                from {@code spark-submit}'s configuration
     * @param source  the study the batches come from
     * @param threads driver threads for the batches that stay on the driver
     * @param probe   called before each chunk in the tasks ({@link TaskProbe#NONE} outside tests)
     * @param log     where the engine says what it runs where
     */
    public SparkEngine(String master, StudySource source, int threads, TaskProbe probe, PrintWriter log) {
        this.master = master;
        this.source = source;
        this.driver = new LocalEngine(Math.max(1, threads));
        this.probe = probe;
        this.log = log;
    }

    /** The engine for the study read from {@code file}. */
    public static SparkEngine of(String master, Path file, Study study, int threads, PrintWriter log) {
        try {
            Class.forName("org.apache.spark.SparkConf", false, SparkEngine.class.getClassLoader());
        } catch (ClassNotFoundException e) {
            throw new StudyException("--engine spark: Apache Spark is not on the class path; start through the"
                    + " ./fabspread launcher (which adds it) or spark-submit");
        }
        return new SparkEngine(master, StudySource.of(file, study), threads, TaskProbe.NONE, log);
    }

    @Override
    public <W, R> long run(ChunkPlan<W, R> plan, long fromChunk, ChunkPlan.Sink<R> sink, BooleanSupplier stop)
            throws IOException {
        if (plan instanceof Runner.Plan p && isMainRun(p.runner())) {
            @SuppressWarnings("unchecked")
            ChunkPlan.Sink<Chunk> chunks = (ChunkPlan.Sink<Chunk>) sink;
            return runMonteCarlo(MonteCarloRecipe.of(source, p.runner()), p.chunkCount(), fromChunk, chunks, stop);
        }
        if (plan instanceof ModelRows.Plan rp && portable(rp.batch())) {
            @SuppressWarnings("unchecked")
            ChunkPlan.Sink<ModelRows.Done> rows = (ChunkPlan.Sink<ModelRows.Done>) sink;
            return runRows(rp.batch(), fromChunk, rows, stop);
        }
        String what = plan instanceof ModelRows.Plan rp ? rp.batch().name() : "a batch of another study";
        if (toldLocal.add(what)) {
            log.println("spark engine: " + what + " runs on the driver's local engine (its model is not the"
                    + " study's)");
            log.flush();
        }
        return driver.run(plan, fromChunk, sink, stop);
    }

    /** Stops the Spark context this engine started (if any). */
    @Override
    public synchronized void close() {
        if (sc != null) {
            sc.close();
            sc = null;
            sharedSource = null;
        }
    }

    private synchronized JavaSparkContext context() {
        if (sc == null) {
            SparkConf conf = new SparkConf().setAppName("fabspread " + source.studyFile())
                    .setIfMissing("spark.ui.enabled", "false");
            if (master != null) {
                conf.setMaster(master);
            }
            sc = new JavaSparkContext(conf);
            sc.setLogLevel("WARN");
            sharedSource = sc.broadcast(source);
        }
        return sc;
    }

    /** True when the runner is the study's main Monte Carlo, as an executor would rebuild it. */
    private boolean isMainRun(Runner r) {
        if (mainFingerprint == null) {
            MonteCarloRecipe probeRecipe = new MonteCarloRecipe(source, r.points().size(), r.seed(),
                    r.config().chunkSize(), r.config().policy(), null, null);
            mainFingerprint = RunnerFingerprint.of(probeRecipe.runner());
        }
        return mainFingerprint.equals(RunnerFingerprint.of(r));
    }

    /**
     * True when the batch's model is the study's model as an executor rebuilds it: the same object, or the same
     * class, inputs and outputs and the same bits for the batch's first row. Asked once per model.
     */
    private boolean portable(RowBatch b) {
        return portable.computeIfAbsent(b.model(), m -> {
            DeviceModel rebuilt = StudyModels.of(source).model();
            if (m == rebuilt) {
                return true;
            }
            if (m.getClass() != rebuilt.getClass() || !m.inputIds().equals(rebuilt.inputIds())
                    || !m.outputs().stream().map(OutputDef::id).toList()
                    .equals(rebuilt.outputs().stream().map(OutputDef::id).toList())) {
                return false;
            }
            if (b.chunkCount() == 0 || b.inputs(0).rows() == 0) {
                return true;
            }
            RowInputs first = b.inputs(0);
            RowInputs one = RowInputs.of(0, first.width(), Arrays.copyOf(first.x(), first.width()));
            RowOutputs mine = ModelRows.evaluate(m, one);
            RowOutputs theirs = ModelRows.evaluate(rebuilt, one);
            return Arrays.equals(mine.y(), theirs.y()) && Arrays.equals(mine.outcome(), theirs.outcome());
        });
    }

    /** Blocking: the results of chunks {@code from .. to − 1} from a Spark job of one task. */
    @FunctionalInterface
    private interface TaskJob<T> {
        List<T> run(JavaSparkContext sc, long from, long to);
    }

    private long runMonteCarlo(MonteCarloRecipe recipe, long total, long fromChunk, ChunkPlan.Sink<Chunk> sink,
                               BooleanSupplier stop) throws IOException {
        if (fromChunk >= total) {
            return total;
        }
        Broadcast<MonteCarloRecipe> shared = context().broadcast(recipe);
        TaskProbe pr = probe;
        long done = spread("", total, fromChunk, (ctx, a, b) -> {
            ctx.setJobDescription("Monte Carlo chunks " + a + "-" + (b - 1));
            return ctx.parallelize(List.of(new long[] {a, b}), 1)
                    .mapPartitions(it -> evaluateChunks(shared.value(), it, pr)).collect();
        }, Chunk::index, sink, stop);
        shared.destroy();
        return done;
    }

    private long runRows(RowBatch batch, long fromChunk, ChunkPlan.Sink<ModelRows.Done> sink, BooleanSupplier stop)
            throws IOException {
        long total = batch.chunkCount();
        if (fromChunk >= total) {
            return total;
        }
        Broadcast<StudySource> src = sourceBroadcast();
        TaskProbe pr = probe;
        return spread(batch.name() + ": ", total, fromChunk, (ctx, a, b) -> {
            List<RowInputs> in = new ArrayList<>();
            for (long c = a; c < b; c++) {
                in.add(batch.inputs(c));
            }
            ctx.setJobDescription(batch.name() + " chunks " + a + "-" + (b - 1));
            List<RowOutputs> out = ctx.parallelize(in, 1).mapPartitions(it -> evaluateRows(src.value(), it, pr))
                    .collect();
            List<ModelRows.Done> done = new ArrayList<>(in.size());
            for (int i = 0; i < in.size(); i++) {
                done.add(new ModelRows.Done(in.get(i), out.get(i)));
            }
            return done;
        }, d -> d.outputs().chunk(), sink, stop);
    }

    /** The study's files as a broadcast of this engine's context, made once per context. */
    private synchronized Broadcast<StudySource> sourceBroadcast() {
        context();
        return sharedSource;
    }

    /**
     * Cuts chunks {@code fromChunk .. total − 1} into tasks, runs cores + 1 of them at once as jobs of their
     * own and hands their results to {@code sink} in chunk order (each result's {@code index} checked).
     */
    private <T> long spread(String what, long total, long fromChunk, TaskJob<T> job, ToLongFunction<T> index,
                            ChunkPlan.Sink<T> sink, BooleanSupplier stop) throws IOException {
        JavaSparkContext ctx = context();
        try {
            long chunks = total - fromChunk;
            int cores = Math.max(1, ctx.defaultParallelism());
            int groups = taskCount(chunks, cores);
            int window = Math.min(groups, cores + 1);
            log.printf("spark engine: %s%d chunks in %d tasks on %s, %d in flight%n", what, chunks, groups,
                    ctx.master(), window);
            log.flush();
            long[] done = {fromChunk};
            InOrderJobs<T> jobs = new InOrderJobs<>(groups, window, g -> {
                try {
                    return job.run(ctx, fromChunk + chunks * g / groups, fromChunk + chunks * (g + 1) / groups);
                } catch (Exception e) {
                    // a failed job reaches here as a SparkException, thrown from Scala code without a throws clause
                    throw unwrap(e);
                }
            }, ctx::cancelAllJobs);
            jobs.drain(t -> {
                long c = index.applyAsLong(t);
                if (c != done[0]) {
                    throw new IllegalStateException("chunk " + c + " arrived where chunk " + done[0] + " was due");
                }
                sink.accept(done[0], t);
                done[0]++;
            }, stop);
            return done[0];
        } catch (IOException | RunFailedException e) {
            throw e;
        } catch (Exception e) {
            throw unwrap(e);
        }
    }

    /**
     * Tasks for {@code chunks} chunks on {@code cores} cores: {@link #TASKS_PER_CORE} per core, more when a
     * task would otherwise exceed {@link #MAX_CHUNKS_PER_TASK} chunks (which bounds what one task's result
     * holds on the driver), never more than one per chunk.
     */
    static int taskCount(long chunks, int cores) {
        long byCores = (long) TASKS_PER_CORE * cores;
        long bySize = (chunks + MAX_CHUNKS_PER_TASK - 1) / MAX_CHUNKS_PER_TASK;
        return (int) Math.min(chunks, Math.min(Integer.MAX_VALUE, Math.max(byCores, bySize)));
    }

    private static int attempt() {
        return TaskContext.get() == null ? 0 : TaskContext.get().attemptNumber();
    }

    /** The chunks of the task's ranges, evaluated with one worker of the executor's rebuilt runner. */
    private static Iterator<Chunk> evaluateChunks(MonteCarloRecipe recipe, Iterator<long[]> ranges, TaskProbe probe) {
        Runner.Plan plan = recipe.runner().plan();
        Object worker = plan.newWorker();
        int attempt = attempt();
        List<Chunk> out = new ArrayList<>();
        while (ranges.hasNext()) {
            long[] r = ranges.next();
            for (long c = r[0]; c < r[1]; c++) {
                probe.before(c, attempt);
                out.add(plan.evaluate(worker, c));
            }
        }
        return out.iterator();
    }

    /** The outputs of the task's chunks of input rows, with one evaluator of the executor's rebuilt model. */
    private static Iterator<RowOutputs> evaluateRows(StudySource source, Iterator<RowInputs> chunks,
                                                     TaskProbe probe) {
        DeviceModel model = StudyModels.of(source).model();
        Evaluator evaluator = model.newEvaluator();
        int outputs = model.outputs().size();
        int attempt = attempt();
        List<RowOutputs> out = new ArrayList<>();
        while (chunks.hasNext()) {
            RowInputs in = chunks.next();
            probe.before(in.chunk(), attempt);
            out.add(ModelRows.evaluate(evaluator, in, outputs));
        }
        return out.iterator();
    }

    /** A failed Spark job as the local engine reports a failed chunk; other exceptions unchanged. */
    private static RuntimeException unwrap(Exception e) {
        Throwable t = e;
        while (t != null && !(t instanceof SparkException)) {
            t = t.getCause();
        }
        if (t == null) {
            return e instanceof RuntimeException r ? r : new RunFailedException("Spark run failed: " + e, e);
        }
        return new RunFailedException("model evaluation failed on Spark: " + t.getMessage(), t);
    }
}
