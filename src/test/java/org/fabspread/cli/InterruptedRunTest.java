package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import java.util.function.Predicate;
import java.util.stream.Stream;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A run stopped in each of its phases — the Monte Carlo chunks, the Sobol design, the what-if re-runs,
 * importance sampling, the report — by SIGINT (Ctrl-C) or SIGKILL (kill -9) of a child JVM, then continued
 * with {@code --resume}, ends with result files byte-identical to an uninterrupted run. The interruptions
 * form one chain (stop in the Monte Carlo run, resume, stop in the Sobol design, resume, …) per signal, so
 * every resume starts from the state an earlier resume left. The same child runs carry a canary
 * environment variable that must appear in no output (common practice: a program echoes no environment).
 */
class InterruptedRunTest {

    static final Path STUDY = Path.of("src/test/resources/interrupt/resume-study.yaml");
    /** The result files compared byte for byte (the report carries the run's date and is compared by name). */
    static final List<String> COMPARED = List.of("samples.csv", "summary.json", "sensitivity.csv", "plan/plan.csv",
            "plan/plan.json", "plan/plan.txt");

    @TempDir
    static Path shared;
    /** One uninterrupted run, the reference of both chains. */
    static Path whole;

    @TempDir
    Path tmp;

    @BeforeAll
    static void uninterrupted() {
        whole = shared.resolve("whole");
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"run", STUDY.toString(), "--out", whole.toString(), "--threads", "2",
            "--no-report"}, new PrintWriter(new StringWriter()), new PrintWriter(err));
        assertEquals(0, code, err::toString);
    }

    /** A phase of the run, recognised from the staging folder. */
    record Phase(String name, Predicate<Path> running) {
    }

    static String state(Path staging) {
        try {
            return Files.readString(staging.resolve("run-state.json"));
        } catch (IOException e) {
            return "";
        }
    }

    static final List<Phase> PHASES = List.of(
            new Phase("Monte Carlo", s -> Files.exists(s.resolve("checkpoint.json"))),
            new Phase("Sobol design", s -> state(s).contains("monte_carlo") && !state(s).contains("sobol")),
            new Phase("what-if re-runs", s -> state(s).contains("sobol") && !state(s).contains("what_if_3")),
            new Phase("importance sampling", s -> state(s).contains("what_if_3")
                    && !state(s).contains("importance_sampling")));

    static final Phase REPORT = new Phase("report", s -> Files.exists(s.resolve("sensitivity.csv")));

    /** Bookkeeping of an unfinished run, which a published folder never holds. */
    static final List<String> BOOKKEEPING = List.of("INCOMPLETE.txt", "run-state.json", "checkpoint.json",
            "samples.csv.part", "phases");

    @Test
    void sigintInEveryPhaseThenResumeGivesTheSameFiles() throws Exception {
        chain("INT", false);
    }

    /** The chain of the second signal also stops the report (slow to render, so only once). */
    @Test
    void sigkillInEveryPhaseThenResumeGivesTheSameFiles() throws Exception {
        chain("KILL", true);
    }

    private void chain(String signal, boolean report) throws Exception {
        List<Phase> phases = new ArrayList<>(PHASES);
        if (report) {
            phases.add(REPORT);
        }

        String canary = "canary-" + UUID.randomUUID();
        Path out = tmp.resolve("stopped");
        Path staging = tmp.resolve("stopped.incomplete");
        List<String> logs = new ArrayList<>();
        boolean resume = false;
        for (Phase phase : phases) {
            Process p = start(out, resume, canary, phase == REPORT);
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
            while (p.isAlive() && !phase.running().test(staging) && System.nanoTime() < deadline) {
                Thread.sleep(10);
            }
            assertTrue(p.isAlive(), "the run ended before it reached the " + phase.name() + " phase");
            signal(p, signal);
            assertTrue(p.waitFor(60, TimeUnit.SECONDS), "the stopped run did not end");
            assertTrue(phase.running().test(staging), "the signal landed after the " + phase.name() + " phase");
            logs.add(Files.readString(tmp.resolve("log.txt"), StandardCharsets.UTF_8));
            assertFalse(Files.exists(out), "an interrupted run must not publish its folder (" + phase.name() + ")");
            assertTrue(Files.isRegularFile(staging.resolve("INCOMPLETE.txt")), "the unfinished run is labelled");
            resume = true;
        }
        Process last = start(out, true, canary, report);
        assertTrue(last.waitFor(180, TimeUnit.SECONDS), "the resumed run did not end");
        String log = Files.readString(tmp.resolve("log.txt"), StandardCharsets.UTF_8);
        assertEquals(0, last.exitValue(), log);
        logs.add(log);
        assertFalse(Files.exists(staging), "the staging folder is gone once the run is published");

        for (String f : COMPARED) {
            assertArrayEquals(Files.readAllBytes(whole.resolve(f)), Files.readAllBytes(out.resolve(f)), f);
        }
        List<String> names = names(out);
        if (report) {
            assertTrue(names.containsAll(names(whole)) && names.contains("report.html"), names.toString());
        } else {
            assertEquals(names(whole), names, "the same files");
        }
        for (String b : BOOKKEEPING) {
            assertFalse(Files.exists(out.resolve(b)), "bookkeeping left in the results: " + b);
        }
        for (Map.Entry<String, byte[]> e : contents(out).entrySet()) {
            assertFalse(new String(e.getValue(), StandardCharsets.ISO_8859_1).contains(canary),
                    "the environment leaked into " + e.getKey());
        }
        for (String l : logs) {
            assertFalse(l.contains(canary), "the environment leaked into the terminal output");
        }
    }

    /**
     * A child run; the first (stopped in the Monte Carlo run) on one thread, so the signal lands with chunks
     * still to run, and the resumes on two (results do not depend on the thread count).
     */
    private Process start(Path out, boolean resume, String canary, boolean report) throws IOException {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), "org.fabspread.cli.Main", "run", STUDY.toString(),
                "--out", out.toString(), "--threads", resume ? "2" : "1"));
        if (resume) {
            cmd.add("--resume");
        }
        if (!report) {
            cmd.add("--no-report");
        }
        ProcessBuilder pb = new ProcessBuilder(cmd).redirectErrorStream(true)
                .redirectOutput(tmp.resolve("log.txt").toFile());
        pb.environment().put("FABSPREAD_TEST_CANARY", canary);
        return pb.start();
    }

    private static void signal(Process p, String signal) throws Exception {
        if (signal.equals("KILL")) {
            p.destroyForcibly();
        } else {
            Process k = new ProcessBuilder("kill", "-" + signal, Long.toString(p.pid())).inheritIO().start();
            assertEquals(0, k.waitFor());
        }
    }

    private static List<String> names(Path dir) throws IOException {
        return new ArrayList<>(contents(dir).keySet());
    }

    private static Map<String, byte[]> contents(Path dir) throws IOException {
        Map<String, byte[]> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : (Iterable<Path>) s.filter(Files::isRegularFile)::iterator) {
                m.put(dir.relativize(p).toString(), Files.readAllBytes(p));
            }
        }
        return m;
    }
}
