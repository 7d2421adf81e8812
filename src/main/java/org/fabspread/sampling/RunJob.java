package org.fabspread.sampling;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;

import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.AnalysisSettings.FailurePolicy;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;

/**
 * One Monte Carlo run of a study, start to finish: validates everything before touching the output
 * folder, streams {@code samples.csv.part} chunk by chunk, keeps a checkpoint, and at the end
 * computes quantiles, writes {@code summary.json} and publishes {@code samples.csv} by an atomic
 * rename.
 *
 * <p>Output folder: {@code samples.csv} (see {@link SamplesCsv}), {@code summary.json}
 * ({@link RunSummary}); while running or after an interruption {@code samples.csv.part} and
 * {@code checkpoint.json} ({@link Checkpoint}). {@link Options#resume()} continues from the last
 * complete chunk: the part file is cut back to the checkpoint's byte count, its rows are read back
 * into the statistics (numbers round-trip exactly), and the run goes on from the next chunk, so the
 * final files are byte-identical to an uninterrupted run.
 *
 * <p>Quantiles: exact sample quantiles from sorting each output column — from the in-memory table
 * when it holds every sample, otherwise by passes over {@code samples.csv} that load as many output
 * columns as fit in a quarter of the heap (8 bytes per good sample per column: 80 MB for 10^7).
 */
public final class RunJob {

    /** Quantile levels reported for every output. */
    public static final double[] QUANTILES = {0.01, 0.05, 0.25, 0.5, 0.75, 0.95, 0.99};
    /** Default largest table kept in memory. */
    public static final long DEFAULT_TABLE_LIMIT = 2_000_000L;

    /**
     * @param samples      sample count; 0 takes the study's
     * @param seed         master seed; null takes the study's
     * @param threads      worker threads (≥ 1)
     * @param resume       continue from {@code checkpoint.json}
     * @param chunkSize    samples per chunk (results depend on it; keep the default)
     * @param tableLimit   largest number of samples kept in memory (further capped so the table
     *                     takes at most a quarter of the heap)
     * @param checkpointEveryMillis least time between checkpoints while running (0, the default: after every chunk,
     *                     so even a kill -9 loses at most one chunk)
     * @param progress     progress listener, or null
     * @param engine       where the chunks run; null: this machine's engine with {@code threads} threads
     */
    public record Options(long samples, Long seed, int threads, boolean resume, int chunkSize, long tableLimit,
                          long checkpointEveryMillis, Runner.Listener progress, Engine engine) {

        public static Options defaults() {
            return new Options(0, null, Runtime.getRuntime().availableProcessors(), false, Runner.DEFAULT_CHUNK,
                    DEFAULT_TABLE_LIMIT, 0, null, null);
        }

        public Options withSamples(long n) {
            return new Options(n, seed, threads, resume, chunkSize, tableLimit, checkpointEveryMillis, progress, engine);
        }

        public Options withSeed(Long s) {
            return new Options(samples, s, threads, resume, chunkSize, tableLimit, checkpointEveryMillis, progress, engine);
        }

        public Options withThreads(int t) {
            return new Options(samples, seed, t, resume, chunkSize, tableLimit, checkpointEveryMillis, progress, engine);
        }

        public Options withResume(boolean r) {
            return new Options(samples, seed, threads, r, chunkSize, tableLimit, checkpointEveryMillis, progress, engine);
        }

        public Options withChunkSize(int c) {
            return new Options(samples, seed, threads, resume, c, tableLimit, checkpointEveryMillis, progress, engine);
        }

        public Options withTableLimit(long l) {
            return new Options(samples, seed, threads, resume, chunkSize, l, checkpointEveryMillis, progress, engine);
        }

        public Options withEngine(Engine e) {
            return new Options(samples, seed, threads, resume, chunkSize, tableLimit, checkpointEveryMillis, progress, e);
        }

        public Options withProgress(Runner.Listener p) {
            return new Options(samples, seed, threads, resume, chunkSize, tableLimit, checkpointEveryMillis, p, engine);
        }
    }

    /**
     * @param completed   false when cancelled (a checkpoint was left)
     * @param summary     null unless completed
     * @param table       samples in memory (every {@code tableStride}-th one), null unless completed
     * @param chunksDone  chunks written
     * @param samplesSha256 SHA-256 of {@code samples.csv} (null unless completed)
     */
    public record Result(boolean completed, RunSummary summary, SampleTable table, long tableStride, long chunksDone,
                         double seconds, String samplesSha256) {
    }

    public static final String SAMPLES = "samples.csv";
    public static final String PART = "samples.csv.part";
    public static final String CHECKPOINT = "checkpoint.json";
    public static final String SUMMARY = "summary.json";

    private final Study study;
    private final Model model;
    private final Options options;
    private final Path out;
    private final StudyInputSpace space;
    private final long samples;
    private final long seed;
    private final AnalysisSettings.Sampler sampler;
    private final FailurePolicy policy;
    private final Runner runner;
    private final PointSet points;
    private final Checkpoint identity;
    private final Checkpoint resumeFrom;
    private final MessageDigest resumeDigest;
    private volatile boolean cancelRequested;

    /** Validates the study, model and options (and the checkpoint when resuming); writes nothing. */
    /**
     * Adds a consumer fed every row in sample order beside the statistics, on a fresh run, a resumed run
     * (the kept rows first) and a reload alike (for counts the pipeline keeps of its own, such as the
     * validity envelope's). Call before running.
     */
    public RunJob observe(RowSink sink) {
        this.observer = java.util.Objects.requireNonNull(sink, "sink");
        return this;
    }

    private RowSink observer = (j, x, ox, y, oy, st) -> { };

    /**
     * Has each chunk's samples also written to {@code store} by the worker (or executor) that evaluated it,
     * beside {@code samples.csv}. Call before running.
     */
    public RunJob storeChunks(ChunkStore store) {
        runner.storeChunks(store);
        return this;
    }

    public RunJob(Study study, Model model, Options options, Path outDir) throws IOException {
        this.study = study;
        this.model = model;
        this.options = options;
        this.out = outDir;
        AnalysisSettings a = study.analysis();
        SourceLocation where = SourceLocation.unknown("analysis");
        this.space = StudyInputSpace.of(study);
        if (space.dimension() == 0) {
            throw StudyException.at(where, "the study has no uncertain inputs to sample");
        }
        this.samples = options.samples() > 0 ? options.samples() : (a == null ? 0 : a.samples());
        if (samples < 1) {
            throw StudyException.at(SourceLocation.unknown("analysis.samples"), "need at least 1 sample, got " + samples);
        }
        this.seed = options.seed() != null ? options.seed() : (a == null ? 0 : a.seed());
        this.sampler = a == null || a.sampler() == null ? AnalysisSettings.Sampler.RANDOM : a.sampler();
        this.policy = a == null || a.onFailure() == null ? FailurePolicy.REJECT : a.onFailure();
        if (options.threads() < 1) {
            throw new StudyException("--threads must be at least 1, got " + options.threads());
        }
        List<String> outs = new ArrayList<>();
        for (OutputDef o : model.outputs()) {
            outs.add(o.id());
        }
        for (Target t : study.targets()) {
            if (!outs.contains(t.output())) {
                throw StudyException.at(t.where(), "no model output '" + t.output() + "' (outputs: "
                        + String.join(", ", outs) + ")");
            }
        }
        for (String id : model.inputIds()) {
            if (!space.ids().contains(id)) {
                throw new StudyException(studyName() + ": the model needs input '" + id
                        + "', which is not an uncertain input of the study");
            }
        }
        try {
            this.points = PointSets.of(sampler, space.dimension(), samples, seed);
        } catch (IllegalArgumentException e) {
            throw StudyException.at(SourceLocation.unknown("analysis.sampler"), e.getMessage());
        }
        this.runner = new Runner(model, space, points, seed, new Runner.Config(options.threads(), options.chunkSize(), policy));
        this.identity = new Checkpoint(Checkpoint.VERSION, StudyDigest.of(study, model), seed, samples,
                options.chunkSize(), points.name(), policy.name(), 0, 0, "");
        if (options.resume()) {
            Path ck = out.resolve(CHECKPOINT);
            Path part = out.resolve(PART);
            if (!Files.isRegularFile(ck) || !Files.isRegularFile(part)) {
                throw new StudyException(out + ": nothing to resume (no " + CHECKPOINT + " and " + PART + ")");
            }
            Checkpoint c = Checkpoint.read(ck);
            if (!c.sameRunAs(identity)) {
                throw new StudyException(ck + ": the checkpoint belongs to a different run (study, model, seed, "
                        + "sample count, sampler or failure policy changed)");
            }
            if (Files.size(part) < c.partBytes()) {
                throw new StudyException(part + ": shorter than its checkpoint says (cut short); cannot resume;"
                        + " run again without --resume");
            }
            MessageDigest md = FileDigest.prefix(part, c.partBytes());
            if (!FileDigest.peek(md).equals(c.partSha256())) {
                throw new StudyException(part + ": changed since its checkpoint was written (SHA-256 differs);"
                        + " cannot resume; run again without --resume");
            }
            this.resumeFrom = c;
            this.resumeDigest = md;
        } else {
            this.resumeFrom = null;
            this.resumeDigest = null;
        }
    }

    private String studyName() {
        return study.file() == null ? "<study>" : study.file().getFileName().toString();
    }

    public StudyInputSpace inputSpace() {
        return space;
    }

    /** Stops the run after the current chunk and leaves a checkpoint. Safe from any thread. */
    public void cancel() {
        cancelRequested = true;
        runner.cancel();
    }

    /**
     * Runs with a shutdown hook, so Ctrl-C leaves a checkpoint: the hook cancels the run and waits (up
     * to a minute) for the checkpoint to be written.
     */
    public Result runWithInterruptHook() throws IOException {
        CountDownLatch finished = new CountDownLatch(1);
        Thread hook = new Thread(() -> {
            cancel();
            try {
                finished.await(1, TimeUnit.MINUTES);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "fabspread-interrupt");
        Runtime.getRuntime().addShutdownHook(hook);
        try {
            return run();
        } finally {
            finished.countDown();
            try {
                Runtime.getRuntime().removeShutdownHook(hook);
            } catch (IllegalStateException shuttingDown) {
                // the JVM is exiting: the hook is running and has just been released
            }
        }
    }

    /** Runs (or resumes) the job. */
    public Result run() throws IOException {
        long t0 = System.nanoTime();
        Files.createDirectories(out);
        Path part = out.resolve(PART);
        Path ck = out.resolve(CHECKPOINT);
        List<String> outputIds = new ArrayList<>();
        for (OutputDef o : model.outputs()) {
            outputIds.add(o.id());
        }
        StreamingStatistics stats = new StreamingStatistics(model.outputs(), study.targets());
        TableBuilder table = new TableBuilder(space.ids(), outputIds, samples, tableLimit(outputIds.size()));
        RowSink both = (j, x, ox, y, oy, st) -> {
            stats.row(j, x, ox, y, oy, st);
            table.row(j, x, ox, y, oy, st);
            observer.row(j, x, ox, y, oy, st);
        };
        long from;
        long[] bytes = new long[1];
        MessageDigest md;
        if (resumeFrom != null) {
            md = resumeDigest;
            try (FileChannel ch = FileChannel.open(part, StandardOpenOption.WRITE)) {
                ch.truncate(resumeFrom.partBytes());
            }
            long rows = SamplesCsv.read(part, resumeFrom.partBytes(), space.dimension(), outputIds.size(), both);
            long expected = Math.min(resumeFrom.chunksDone() * (long) resumeFrom.chunkSize(), samples);
            if (rows != expected) {
                throw new StudyException(ck + ": says " + resumeFrom.chunksDone() + " chunks of "
                        + resumeFrom.chunkSize() + " samples are done, but " + PART + " holds " + rows
                        + " samples (damaged or changed); cannot resume; run again without --resume");
            }
            from = resumeFrom.chunksDone();
            bytes[0] = resumeFrom.partBytes();
        } else {
            Files.deleteIfExists(ck);
            byte[] header = SamplesCsv.header(space.ids(), outputIds).getBytes(StandardCharsets.UTF_8);
            Files.write(part, header);
            md = FileDigest.sha256();
            md.update(header);
            from = 0;
            bytes[0] = header.length;
        }
        long done;
        long[] lastCheckpoint = {System.nanoTime()};
        try (OutputStream os = new BufferedOutputStream(Files.newOutputStream(part, StandardOpenOption.APPEND), 1 << 20)) {
            try {
                Engine engine = options.engine() != null ? options.engine() : new LocalEngine(options.threads());
                done = runner.run(engine, from, chunk -> {
                    os.write(chunk.csv());
                    md.update(chunk.csv());
                    bytes[0] += chunk.csv().length;
                    both.chunk(chunk);
                    long now = System.nanoTime();
                    if (now - lastCheckpoint[0] > options.checkpointEveryMillis() * 1_000_000L) {
                        os.flush();
                        checkpoint(chunk.index() + 1, bytes[0], md).write(ck);
                        lastCheckpoint[0] = now;
                    }
                }, options.progress());
            } catch (RunFailedException e) {
                os.close();
                Files.deleteIfExists(part);
                Files.deleteIfExists(ck);
                throw e;
            }
            os.flush();
            if (done < runner.chunkCount()) {
                checkpoint(done, bytes[0], md).write(ck);
                return new Result(false, null, null, table.stride(), done, (System.nanoTime() - t0) * 1e-9, null);
            }
        }
        SampleTable t = table.build();
        RunSummary summary = summarise(stats, t, table.stride(), part);
        move(part, out.resolve(SAMPLES));
        summary.write(out.resolve(SUMMARY), Map.of());
        Files.deleteIfExists(ck);
        return new Result(true, summary, t, table.stride(), done, (System.nanoTime() - t0) * 1e-9,
                FileDigest.peek(md));
    }

    /**
     * The result of a finished run read back from its {@code samples.csv} (whose SHA-256 must be
     * {@code expectedSha256}), without evaluating the model: the same statistics, table and summary as the
     * run that wrote it, since the numbers read back exactly.
     */
    public Result reload(String expectedSha256) throws IOException {
        long t0 = System.nanoTime();
        Path file = out.resolve(SAMPLES);
        if (!Files.isRegularFile(file)) {
            throw new StudyException(file + ": missing from the unfinished run; cannot resume; run again without"
                    + " --resume");
        }
        String sha = FileDigest.of(file);
        if (!sha.equals(expectedSha256)) {
            throw new StudyException(file + ": changed since the run wrote it (SHA-256 differs); cannot resume;"
                    + " run again without --resume");
        }
        List<String> outputIds = new ArrayList<>();
        for (OutputDef o : model.outputs()) {
            outputIds.add(o.id());
        }
        StreamingStatistics stats = new StreamingStatistics(model.outputs(), study.targets());
        TableBuilder table = new TableBuilder(space.ids(), outputIds, samples, tableLimit(outputIds.size()));
        long rows = SamplesCsv.read(file, Files.size(file), space.dimension(), outputIds.size(), (j, x, ox, y, oy, st) -> {
            stats.row(j, x, ox, y, oy, st);
            table.row(j, x, ox, y, oy, st);
            observer.row(j, x, ox, y, oy, st);
        });
        if (rows != samples) {
            throw new StudyException(file + ": holds " + rows + " samples, the run has " + samples
                    + "; cannot resume; run again without --resume");
        }
        SampleTable t = table.build();
        RunSummary summary = summarise(stats, t, table.stride(), file);
        return new Result(true, summary, t, table.stride(), runner.chunkCount(), (System.nanoTime() - t0) * 1e-9,
                sha);
    }

    private long tableLimit(int outputs) {
        long perRow = 8L * (space.dimension() + outputs) + 1;
        return Math.max(1, Math.min(options.tableLimit(), Runtime.getRuntime().maxMemory() / 4 / perRow));
    }

    private Checkpoint checkpoint(long chunksDone, long partBytes, MessageDigest md) {
        return new Checkpoint(identity.version(), identity.digest(), seed, samples, options.chunkSize(),
                points.name(), policy.name(), chunksDone, partBytes, FileDigest.peek(md));
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    private RunSummary summarise(StreamingStatistics s, SampleTable table, long stride, Path part) throws IOException {
        double conf = study.analysis() != null && study.analysis().confidence() > 0 && study.analysis().confidence() < 1
                ? study.analysis().confidence() : 0.95;
        List<OutputDef> defs = model.outputs();
        List<List<RunSummary.QuantileStats>> quantiles = quantileStats(s, table, stride, part, conf);
        List<RunSummary.OutputStats> outs = new ArrayList<>();
        for (int o = 0; o < defs.size(); o++) {
            long n = s.count(o);
            double var = s.variance(o);
            List<RunSummary.QuantileStats> qs = quantiles.get(o);
            double sd = Math.sqrt(var);
            outs.add(new RunSummary.OutputStats(defs.get(o).id(), defs.get(o).unit(), n, s.mean(o), sd,
                    sd / Math.sqrt(n), s.min(o), s.max(o), s.skewness(o), qs));
        }
        List<RunSummary.YieldStats> ys = new ArrayList<>();
        List<Target> targets = study.targets();
        for (int t = 0; t < targets.size(); t++) {
            ys.add(yieldStats(targets.get(t).describe(), s.met(t), s.good(), conf));
        }
        RunSummary.YieldStats all = targets.isEmpty() ? null : yieldStats("all targets", s.allMet(), s.good(), conf);
        List<RunSummary.InputTruncation> trunc = new ArrayList<>();
        for (int i = 0; i < space.dimension(); i++) {
            double mass = space.marginals().get(i).truncatedMass();
            if (mass > 0) {
                trunc.add(new RunSummary.InputTruncation(space.ids().get(i), mass));
            }
        }
        long failed = samples - s.good();
        Double byModel = policy == FailurePolicy.TRUNCATE ? (double) failed / samples : null;
        return new RunSummary(study.name(), seed, points.name(), options.chunkSize(), samples, s.good(), s.failures(),
                policy.name(), byModel, conf, outs, ys, all, trunc, space.repaired(),
                "type 7 sample quantile; distribution-free order-statistic interval (binomial)");
    }

    private static RunSummary.YieldStats yieldStats(String name, long met, long n, double conf) {
        Interval w = Intervals.wilson(met, n, conf);
        return new RunSummary.YieldStats(name, met, n, n > 0 ? (double) met / n : Double.NaN, w.low(), w.high());
    }

    /**
     * Each output's quantiles with their intervals, from its good values sorted: from the table when it
     * holds every sample, else from the file, a batch of columns at a time (at most a quarter of the heap,
     * beside the in-memory table's quarter); each batch is released before the next is read, so a run of
     * any size needs one sorted column at a time.
     */
    private List<List<RunSummary.QuantileStats>> quantileStats(StreamingStatistics s, SampleTable table, long stride,
                                                               Path part, double conf) throws IOException {
        int m = model.outputs().size();
        List<List<RunSummary.QuantileStats>> out = new ArrayList<>();
        if (stride == 1) {
            for (int o = 0; o < m; o++) {
                double[] c = good(table.outputs()[o], table.ok(), s.count(o));
                Arrays.sort(c);
                out.add(quantiles(c, conf));
            }
            return out;
        }
        long per = 8L * Math.max(1, s.good());
        int batch = (int) Math.max(1, Math.min(m, Runtime.getRuntime().maxMemory() / 4 / per));
        for (int start = 0; start < m; start += batch) {
            int lo = start;
            int hi = Math.min(m, start + batch);
            double[][] cols = new double[hi - lo][];
            int[] fill = new int[hi - lo];
            for (int o = lo; o < hi; o++) {
                cols[o - lo] = new double[(int) s.count(o)];
            }
            SamplesCsv.readOutputs(part, space.dimension(), m, lo, hi,
                    (o, v) -> cols[o - lo][fill[o - lo]++] = v);
            for (int o = lo; o < hi; o++) {
                Arrays.sort(cols[o - lo]);
                out.add(quantiles(cols[o - lo], conf));
                cols[o - lo] = null;
            }
        }
        return out;
    }

    /** Type-7 quantiles of sorted values with distribution-free order-statistic intervals. */
    private static List<RunSummary.QuantileStats> quantiles(double[] v, double conf) {
        List<RunSummary.QuantileStats> qs = new ArrayList<>();
        long n = v.length;
        if (n > 0) {
            for (double p : QUANTILES) {
                long[] rs = Intervals.quantileRanks(n, p, conf);
                qs.add(new RunSummary.QuantileStats(p, Intervals.quantile7(v, (int) n, p),
                        rs[0] >= 1 ? v[(int) rs[0] - 1] : null, rs[1] <= n ? v[(int) rs[1] - 1] : null));
            }
        }
        return qs;
    }

    private static double[] good(double[] col, boolean[] ok, long n) {
        double[] out = new double[(int) n];
        int f = 0;
        for (int j = 0; j < col.length; j++) {
            if (ok[j]) {
                out[f++] = col[j];
            }
        }
        return out;
    }

    /** Progress on stderr for a person at a terminal, else none. */
    public static Runner.Listener consoleProgress(long samples) {
        return Progress.forConsole(samples);
    }
}
