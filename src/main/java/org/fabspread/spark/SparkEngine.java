package org.fabspread.spark;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.function.BooleanSupplier;

import org.apache.spark.SparkConf;
import org.apache.spark.SparkException;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.JavaRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import org.fabspread.sampling.Chunk;
import org.fabspread.sampling.ChunkPlan;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.LocalEngine;
import org.fabspread.sampling.RunFailedException;
import org.fabspread.sampling.Runner;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * The cluster engine: the chunks of the study's main Monte Carlo run as Spark tasks (Zaharia et al.,
 * "Resilient distributed datasets", NSDI 2012). The {@link MonteCarloRecipe} (the study's files and the
 * run's numbers) travels to the executors once, as a broadcast; each executor rebuilds the same runner
 * and evaluates a group of consecutive chunks per task, each chunk from its own stream (seed, c) as on
 * one machine. Each partition (a range of consecutive chunks) is collected by a job of its own; total
 * cores + 1 such jobs are in flight ({@link InOrderJobs}), so every core has a task and the next one is
 * queued, and the results are handed to the sink strictly in chunk order, so everything the driver
 * computes from them is bit-identical to the local engine. The driver holds at most cores + 2
 * partitions' results at a time.
 *
 * <p>A batch whose plan cannot be rebuilt from the study alone (the Sobol design, what-if re-runs, the
 * rare-failure estimators: their tasks write into the driver's memory) runs on the driver's local engine,
 * and the engine says so once on its log.
 */
public final class SparkEngine implements Engine {

    /** Chunk groups per Spark core: small enough to balance, large enough that task overhead stays small. */
    static final int TASKS_PER_CORE = 4;

    /** Chunks per task at most: 16 chunks of 1024 samples are about 5 MB of results, samples text included. */
    static final int MAX_CHUNKS_PER_TASK = 16;

    private final String master;
    private final StudySource source;
    private final LocalEngine driver;
    private final TaskProbe probe;
    private final PrintWriter log;
    private String mainFingerprint;
    private boolean toldLocal;

    /**
     * @param master  the Spark master URL ({@code local[2]}, {@code spark://host:7077}), or null to take it
     *                from {@code spark-submit}'s configuration
     * @param source  the study the main Monte Carlo run comes from
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
            return runOnSpark(MonteCarloRecipe.of(source, p.runner()), p.chunkCount(), fromChunk, chunks, stop);
        }
        if (!toldLocal) {
            log.println("spark engine: the Sobol, what-if and rare-failure batches run on the driver's local engine"
                    + " (their plans are not portable yet); the main Monte Carlo runs on Spark");
            log.flush();
            toldLocal = true;
        }
        return driver.run(plan, fromChunk, sink, stop);
    }

    /** True when the runner is the study's main Monte Carlo, as an executor would rebuild it. */
    private boolean isMainRun(Runner r) {
        if (mainFingerprint == null) {
            MonteCarloRecipe probeRecipe = new MonteCarloRecipe(source, r.points().size(), r.seed(),
                    r.config().chunkSize(), r.config().policy(), null);
            mainFingerprint = RunnerFingerprint.of(probeRecipe.runner());
        }
        return mainFingerprint.equals(RunnerFingerprint.of(r));
    }

    private long runOnSpark(MonteCarloRecipe recipe, long total, long fromChunk, ChunkPlan.Sink<Chunk> sink,
                            BooleanSupplier stop) throws IOException {
        if (fromChunk >= total) {
            return total;
        }
        SparkConf conf = new SparkConf().setAppName("fabspread " + recipe.source().studyFile())
                .setIfMissing("spark.ui.enabled", "false");
        if (master != null) {
            conf.setMaster(master);
        }
        try (JavaSparkContext sc = new JavaSparkContext(conf)) {
            sc.setLogLevel("WARN");
            long chunks = total - fromChunk;
            int cores = Math.max(1, sc.defaultParallelism());
            int groups = taskCount(chunks, cores);
            List<long[]> ranges = new ArrayList<>(groups);
            for (int g = 0; g < groups; g++) {
                ranges.add(new long[] {fromChunk + chunks * g / groups, fromChunk + chunks * (g + 1) / groups});
            }
            Broadcast<MonteCarloRecipe> shared = sc.broadcast(recipe);
            TaskProbe pr = probe;
            JavaRDD<Chunk> rdd = sc.parallelize(ranges, groups).mapPartitions(it -> evaluate(shared.value(), it, pr));
            int window = Math.min(groups, cores + 1);
            log.printf("spark engine: %d chunks in %d tasks on %s, %d in flight%n", chunks, groups, sc.master(), window);
            log.flush();
            long[] done = {fromChunk};
            InOrderJobs<Chunk> jobs = new InOrderJobs<>(groups, window, p -> collect(rdd, p), sc::cancelAllJobs);
            jobs.drain(c -> {
                if (c.index() != done[0]) {
                    throw new IllegalStateException("chunk " + c.index() + " arrived where chunk " + done[0] + " was due");
                }
                sink.accept(done[0], c);
                done[0]++;
            }, stop);
            shared.destroy();
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

    /** The chunks of partition {@code p}, by a job of its own (blocking); a failed job as a failed run. */
    private static List<Chunk> collect(JavaRDD<Chunk> rdd, int p) {
        try {
            return rdd.collectPartitions(new int[] {p})[0];
        } catch (Exception e) {
            // a failed job reaches here as a SparkException, thrown from Scala code without a throws clause
            throw unwrap(e);
        }
    }

    /** The chunks of the task's ranges, evaluated with one worker of the executor's rebuilt runner. */
    private static Iterator<Chunk> evaluate(MonteCarloRecipe recipe, Iterator<long[]> ranges, TaskProbe probe) {
        Runner.Plan plan = recipe.runner().plan();
        Object worker = plan.newWorker();
        int attempt = TaskContext.get() == null ? 0 : TaskContext.get().attemptNumber();
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
