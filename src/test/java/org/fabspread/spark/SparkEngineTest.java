package org.fabspread.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
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
 * The Spark engine against the local engine on the demo study (reduced to 2100 samples, three chunks):
 * the result files must be byte-identical (summary.json without the build's provenance and the command
 * line, as the golden-digest test canonicalises it). Reference: the local engine, whose results the
 * golden digests hold; the contract (results depend on (seed, chunk) only) is the project's.
 */
class SparkEngineTest {

    static final String STUDY = "demo-studies/pilot-line-inverted.yaml";
    static final String SAMPLES = "2100";
    static final List<String> FILES = List.of("summary.json", "samples.csv", "sensitivity.csv",
            "plan/plan.csv", "plan/plan.json", "plan/plan.txt");

    @TempDir
    static Path tmp;

    static Path local;

    @BeforeAll
    static void runLocally() {
        local = tmp.resolve("local");
        run("--out", local.toString());
    }

    private static String run(String... extra) {
        String[] base = {"run", STUDY, "--samples", SAMPLES, "--threads", "2", "--no-report"};
        String[] args = new String[base.length + extra.length];
        System.arraycopy(base, 0, args, 0, base.length);
        System.arraycopy(extra, 0, args, base.length, extra.length);
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(new StringWriter()), new PrintWriter(err));
        assertEquals(0, code, err.toString());
        return err.toString();
    }

    @Test
    void sparkLocalTwoGivesTheLocalEnginesFilesByteForByte() throws IOException {
        Path spark = tmp.resolve("spark");
        String log = run("--out", spark.toString(), "--engine", "spark", "--master", "local[2]");
        assertTrue(log.contains("spark engine: 3 chunks in 3 tasks"), log);
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
        Path file = Path.of(STUDY);
        Study study = StudyReader.read(file, ReadOptions.forRun());
        StringWriter log = new StringWriter();
        TaskProbe failFirstAttempts = (chunk, attempt) -> {
            if (attempt == 0 && chunk != 1) {
                throw new IllegalStateException("injected fault in chunk " + chunk);
            }
        };
        SparkEngine engine = new SparkEngine("local[2,2]", StudySource.of(file, study), 2, failFirstAttempts,
                new PrintWriter(log, true));
        StudyRun.Options options = StudyRun.Options.of(Long.parseLong(SAMPLES), null, 2, false, "test")
                .withEngine(engine);
        StudyRun.Outcome o = new StudyRun(study, file, retried, options, new PrintWriter(new StringWriter())).run();
        assertTrue(o.completed());
        assertSameFiles(local, retried);
    }

    /** Released by chunk 1's task; chunk 0's task waits for it. */
    static final CountDownLatch CHUNK_ONE_STARTED = new CountDownLatch(1);

    @Test
    void partitionJobsRunAtOnceNotOneAfterTheOther() throws IOException {
        // chunk 0's task waits until chunk 1's task has started: with one partition job at a time (the old
        // toLocalIterator) chunk 1 never starts while chunk 0 waits, and the wait runs out
        Path concurrent = tmp.resolve("concurrent");
        Path file = Path.of(STUDY);
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
        SparkEngine engine = new SparkEngine("local[2]", StudySource.of(file, study), 2, chunkZeroWaitsForChunkOne,
                new PrintWriter(log, true));
        StudyRun.Options options = StudyRun.Options.of(Long.parseLong(SAMPLES), null, 2, false, "test")
                .withEngine(engine);
        StudyRun.Outcome o = new StudyRun(study, file, concurrent, options, new PrintWriter(new StringWriter())).run();
        assertTrue(o.completed());
        assertTrue(log.toString().contains("3 in flight"), log.toString());
        assertSameFiles(local, concurrent);
    }

    @Test
    void withoutRetriesTheInjectedFaultEndsTheRun() {
        // the check above could pass without any fault; with one attempt per task it must fail
        Path failed = tmp.resolve("failed");
        Path file = Path.of(STUDY);
        Study study = StudyReader.read(file, ReadOptions.forRun());
        TaskProbe failChunkTwo = (chunk, attempt) -> {
            if (attempt == 0 && chunk == 2) {
                throw new IllegalStateException("injected fault in chunk " + chunk);
            }
        };
        SparkEngine engine = new SparkEngine("local[2]", StudySource.of(file, study), 2, failChunkTwo,
                new PrintWriter(new StringWriter()));
        StudyRun.Options options = StudyRun.Options.of(Long.parseLong(SAMPLES), null, 2, false, "test")
                .withEngine(engine);
        RunFailedException e = org.junit.jupiter.api.Assertions.assertThrows(RunFailedException.class,
                () -> new StudyRun(study, file, failed, options, new PrintWriter(new StringWriter())).run());
        assertTrue(String.valueOf(e.getMessage()).contains("injected fault in chunk 2"), e.toString());
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
