package org.fabspread.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;

import org.fabspread.cli.Main;
import org.fabspread.pipeline.StudyRun;
import org.fabspread.sampling.RunFailedException;
import org.fabspread.study.ReadOptions;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;

/**
 * The Spark engine against the local engine on the demo study (reduced to 2100 samples, three chunks; its
 * target lowered to 10 mA/cm² so that the yield is above 99.9 % and importance sampling runs, and a what-if
 * that widens a spread, which reweighting cannot answer, so that a what-if re-run runs):
 * the result files must be byte-identical (summary.json without the build's provenance and the command
 * line, as the golden-digest test canonicalises it). Reference: the local engine, whose results the
 * golden digests hold; the contract (results depend on (seed, chunk) only) is the project's.
 */
class SparkEngineTest {

    static final String DEMO = "demo-studies/pilot-line-inverted.yaml";
    static final String SAMPLES = "2100";
    static final List<String> FILES = List.of("summary.json", "samples.csv", "sensitivity.csv",
            "plan/plan.csv", "plan/plan.json", "plan/plan.txt");

    @TempDir
    static Path tmp;

    static Path local;

    /** The reduced demo study with every batch of model runs in it. */
    static String studyFile;

    @BeforeAll
    static void runLocally() throws IOException {
        String text = Files.readString(Path.of(DEMO));
        String changed = text.replace("  - jsc >= 13.3 mA/cm^2", "  - jsc >= 10 mA/cm^2")
                .replace("    - truncate particles.coverage at 2 sigma\n",
                        "    - truncate particles.coverage at 2 sigma\n    - scale sigma of stack.htl.thickness by 1.5\n");
        assertFalse(changed.contains("13.3 mA") || !changed.contains("by 1.5"), "the demo study changed");
        Path study = Files.createDirectories(tmp.resolve("study")).resolve("pilot-line-every-batch.yaml");
        Files.writeString(study, changed);
        studyFile = study.toString();
        local = tmp.resolve("local");
        run("--out", local.toString(), "--samples-format", "parquet");
    }

    private static String sparkLog;

    /** The study on Spark local[2], once for the tests that read its files; a listener counts each batch's tasks. */
    private static synchronized String sparkRun() {
        if (sparkLog == null) {
            TaskCounter.reset();
            System.setProperty("spark.extraListeners", TaskCounter.class.getName());
            try {
                sparkLog = run("--out", tmp.resolve("spark").toString(), "--engine", "spark", "--master", "local[2]",
                        "--samples-format", "parquet");
            } finally {
                System.clearProperty("spark.extraListeners");
            }
        }
        return sparkLog;
    }

    private static String run(String... extra) {
        String[] base = {"run", studyFile, "--samples", SAMPLES, "--threads", "2", "--no-report"};
        String[] args = new String[base.length + extra.length];
        System.arraycopy(base, 0, args, 0, base.length);
        System.arraycopy(extra, 0, args, base.length, extra.length);
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(new StringWriter()), new PrintWriter(err));
        assertEquals(0, code, err.toString());
        return err.toString();
    }

    /**
     * Every batch of model runs, not only the main Monte Carlo, runs as Spark tasks: a listener counts the
     * successful tasks of each batch's jobs (the demo's Sobol design: N = 128 rows in chunks of 32, 4 tasks;
     * the what-if re-run: 2000 samples in chunks of 1024; the plan's noise estimate: 8 design points, one
     * chunk each), and the files stay the local engine's.
     */
    @Test
    void sparkLocalTwoRunsEveryBatchAsSparkTasksAndGivesTheLocalEnginesFilesByteForByte() throws IOException {
        String log = sparkRun();
        Path spark = tmp.resolve("spark");
        assertTrue(log.contains("spark engine: 3 chunks in 3 tasks"), log);
        assertTrue(log.contains("spark engine: Sobol design: 4 chunks in 4 tasks"), log);
        assertFalse(log.contains("local engine"), log);
        assertEquals(3, TaskCounter.tasks("Monte Carlo"), TaskCounter.TASKS.toString());
        assertEquals(4, TaskCounter.tasks("Sobol design"), TaskCounter.TASKS.toString());
        assertTrue(TaskCounter.tasks("Shapley design") >= 8, TaskCounter.TASKS.toString());
        assertEquals(2, TaskCounter.tasks("what-if re-run"), TaskCounter.TASKS.toString());
        assertTrue(TaskCounter.tasks("importance sampling") >= 8, TaskCounter.TASKS.toString());
        assertEquals(8, TaskCounter.tasks("plan noise estimate"), TaskCounter.TASKS.toString());
        assertSameFiles(local, spark);
    }

    /**
     * A real multi-process cluster: a standalone master and two one-core workers as separate JVMs on
     * 127.0.0.1; the study is submitted through the command with {@code --master spark://…}, and each
     * worker must have started an executor JVM for it (its work folder holds the application's folder).
     */
    @Test
    @Tag("cluster")
    void aStandaloneClusterOfTwoWorkersGivesTheLocalEnginesFiles() throws Exception {
        Path folder = Files.createDirectories(tmp.resolve("cluster"));
        List<String> keys = List.of("spark.executor.extraClassPath", "spark.executor.extraJavaOptions",
                "spark.driver.host", "spark.driver.bindAddress", "spark.executor.memory", "spark.cores.max");
        try (StandaloneCluster cluster = StandaloneCluster.start(folder, 2, 120)) {
            System.setProperty(keys.get(0), StandaloneCluster.executorClassPath());
            System.setProperty(keys.get(1), String.join(" ", StandaloneCluster.javaOptions()));
            System.setProperty(keys.get(2), "127.0.0.1");
            System.setProperty(keys.get(3), "127.0.0.1");
            System.setProperty(keys.get(4), "512m");
            System.setProperty(keys.get(5), "2");
            Path out = tmp.resolve("standalone");
            String log = run("--out", out.toString(), "--engine", "spark", "--master", cluster.url());
            assertTrue(log.contains("spark engine: 3 chunks in 3 tasks on " + cluster.url()), log);
            assertSameFiles(local, out);
            for (int w = 1; w <= 2; w++) {
                try (var apps = Files.list(cluster.workFolder(w))) {
                    assertTrue(apps.anyMatch(a -> a.getFileName().toString().startsWith("app-")),
                            "worker " + w + " started no executor; see " + folder);
                }
            }
        } finally {
            keys.forEach(System::clearProperty);
        }
    }

    @Test
    void aChunkWhoseFirstAttemptFailsIsRetriedToTheSameBits() throws IOException {
        Path retried = tmp.resolve("retried");
        Path file = Path.of(studyFile);
        Study study = StudyReader.read(file, ReadOptions.forRun());
        StringWriter log = new StringWriter();
        TaskProbe failFirstAttempts = (chunk, attempt) -> {
            if (attempt == 0 && chunk != 1) {
                throw new IllegalStateException("injected fault in chunk " + chunk);
            }
        };
        try (SparkEngine engine = new SparkEngine("local[2,2]", StudySource.of(file, study), 2, failFirstAttempts,
                new PrintWriter(log, true))) {
            StudyRun.Options options = StudyRun.Options.of(Long.parseLong(SAMPLES), null, 2, false, "test")
                    .withEngine(engine);
            StudyRun.Outcome o = new StudyRun(study, file, retried, options, new PrintWriter(new StringWriter())).run();
            assertTrue(o.completed());
        }
        assertSameFiles(local, retried);
    }

    /** Released by chunk 1's task; chunk 0's task waits for it. */
    static final CountDownLatch CHUNK_ONE_STARTED = new CountDownLatch(1);

    @Test
    void partitionJobsRunAtOnceNotOneAfterTheOther() throws IOException {
        // chunk 0's task waits until chunk 1's task has started: with one partition job at a time (the old
        // toLocalIterator) chunk 1 never starts while chunk 0 waits, and the wait runs out
        Path concurrent = tmp.resolve("concurrent");
        Path file = Path.of(studyFile);
        Study study = StudyReader.read(file, ReadOptions.forRun());
        TaskProbe chunkZeroWaitsForChunkOne = (chunk, attempt) -> {
            if (chunk == 1) {
                CHUNK_ONE_STARTED.countDown();
            } else if (chunk == 0) {
                try {
                    if (!CHUNK_ONE_STARTED.await(20, TimeUnit.SECONDS)) {
                        throw new IllegalStateException("chunk 1 did not start while chunk 0 was running");
                    }
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new IllegalStateException(e);
                }
            }
        };
        StringWriter log = new StringWriter();
        try (SparkEngine engine = new SparkEngine("local[2]", StudySource.of(file, study), 2,
                chunkZeroWaitsForChunkOne, new PrintWriter(log, true))) {
            StudyRun.Options options = StudyRun.Options.of(Long.parseLong(SAMPLES), null, 2, false, "test")
                    .withEngine(engine);
            StudyRun.Outcome o = new StudyRun(study, file, concurrent, options, new PrintWriter(new StringWriter()))
                    .run();
            assertTrue(o.completed());
        }
        assertTrue(log.toString().contains("3 in flight"), log.toString());
        assertSameFiles(local, concurrent);
    }

    @Test
    void withoutRetriesTheInjectedFaultEndsTheRun() {
        // the check above could pass without any fault; with one attempt per task it must fail
        Path failed = tmp.resolve("failed");
        Path file = Path.of(studyFile);
        Study study = StudyReader.read(file, ReadOptions.forRun());
        TaskProbe failChunkTwo = (chunk, attempt) -> {
            if (attempt == 0 && chunk == 2) {
                throw new IllegalStateException("injected fault in chunk " + chunk);
            }
        };
        try (SparkEngine engine = new SparkEngine("local[2]", StudySource.of(file, study), 2, failChunkTwo,
                new PrintWriter(new StringWriter()))) {
            StudyRun.Options options = StudyRun.Options.of(Long.parseLong(SAMPLES), null, 2, false, "test")
                    .withEngine(engine);
            RunFailedException e = org.junit.jupiter.api.Assertions.assertThrows(RunFailedException.class,
                    () -> new StudyRun(study, file, failed, options, new PrintWriter(new StringWriter())).run());
            assertTrue(String.valueOf(e.getMessage()).contains("injected fault in chunk 2"), e.toString());
        }
    }

    /**
     * {@code --samples-format parquet}: the local engine's workers and the Spark executors wrote one Parquet
     * file per chunk; read back with parquet-hadoop's own reader (the reference implementation of the
     * format), they hold samples.csv value for value (doubles bit for bit, NaN for a failed row's outputs),
     * and the two engines' files are byte-identical.
     */
    @Test
    void parquetSamplesOfBothEnginesReadBackEqualToTheCsvSamples() throws IOException {
        sparkRun();
        Path spark = tmp.resolve("spark");
        List<String> csv = Files.readAllLines(local.resolve("samples.csv"));
        for (Path run : List.of(local, spark)) {
            Path folder = run.resolve("samples.parquet");
            List<Path> files;
            try (var walk = Files.walk(folder)) {
                files = walk.filter(Files::isRegularFile).sorted().toList();
            }
            assertEquals(List.of(folder.resolve("chunk=00000/part-0.parquet"), folder.resolve("chunk=00001/part-0.parquet"),
                    folder.resolve("chunk=00002/part-0.parquet")), files, "one file per chunk, nothing else");
            List<String> header = ParquetRows.columns(files.get(0));
            assertEquals(List.of(csv.get(0).split(",")), header, run + ": the columns of samples.csv");
            int line = 1;
            for (Path f : files) {
                for (Object[] row : ParquetRows.read(f)) {
                    String[] cells = csv.get(line).split(",");
                    assertEquals(Long.parseLong(cells[0]), row[0], f + " row " + line);
                    for (int c = 1; c < cells.length - 1; c++) {
                        assertEquals(Double.doubleToLongBits(Double.parseDouble(cells[c])),
                                Double.doubleToLongBits((Double) row[c]), f + " row " + line + " " + header.get(c));
                    }
                    assertEquals(cells[cells.length - 1], row[cells.length - 1], f + " row " + line + " status");
                    line++;
                }
            }
            assertEquals(csv.size(), line, run + ": every sample of samples.csv");
        }
        for (int c = 0; c < 3; c++) {
            String f = String.format("samples.parquet/chunk=%05d/part-0.parquet", c);
            assertArrayEquals(Files.readAllBytes(local.resolve(f)), Files.readAllBytes(spark.resolve(f)), f);
        }
    }

    private static void assertSameFiles(Path expected, Path actual) throws IOException {
        for (String f : FILES) {
            assertArrayEquals(canonical(expected.resolve(f), f), canonical(actual.resolve(f), f), f);
        }
    }

    /** summary.json without what names the build and the command line; other files as they are. */
    private static byte[] canonical(Path file, String name) throws IOException {
        byte[] bytes = Files.readAllBytes(file);
        if (!name.equals("summary.json")) {
            return bytes;
        }
        ObjectMapper json = new ObjectMapper();
        JsonNode tree = json.readTree(bytes);
        if (tree.get("provenance") instanceof ObjectNode p) {
            p.remove(List.of("version", "commit", "build_date", "command"));
        }
        return json.writerWithDefaultPrettyPrinter().writeValueAsBytes(tree);
    }
}
