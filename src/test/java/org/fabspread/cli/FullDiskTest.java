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
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A disk that fills up during a run, through the command a user types: a child JVM started under
 * {@code ulimit -f N} (the shell's limit on the size of one file, in blocks of 1024 bytes in bash — source:
 * GNU Bash Reference Manual, "Bash Builtins", {@code ulimit}: "-f ... in 1024-byte increments"). HotSpot
 * ignores SIGXFSZ, so a write past the limit fails with EFBIG, "File too large" (source: POSIX
 * {@code write()}, "[EFBIG] An attempt was made to write a file that exceeds the ... maximum file size"),
 * the same path through the program as ENOSPC "No space left on device" on a full disk. The run ends with
 * one line and exit 1 (a fault of the surroundings, not of the input), the earlier complete results in the
 * folder stay byte for byte as they were, the unfinished run stays in the labelled staging folder, and
 * {@code --resume} once the space is back finishes to files byte-identical to an uninterrupted run.
 */
class FullDiskTest {

    @TempDir
    static Path shared;
    static Path reference;

    @TempDir
    Path tmp;

    /** One uninterrupted run, the reference for every case. */
    @BeforeAll
    static void uninterrupted() {
        reference = shared.resolve("reference");
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"run", InterruptedRunTest.STUDY.toString(), "--out", reference.toString(),
            "--threads", "2", "--no-report"}, new PrintWriter(new StringWriter()), new PrintWriter(err));
        assertEquals(0, code, err::toString);
    }

    /**
     * @param blocks the file size limit in 1024-byte blocks: 1000 stops the Monte Carlo's samples file
     *               (about 1.80 MB whole, 0.46 MB a chunk) in its third chunk; 2000 lets it finish and stops
     *               the Shapley design file (about 2.18 MB) after the Monte Carlo phase
     * @param phase  where the run is stopped, for the messages
     */
    @ParameterizedTest(name = "limit {0} KiB: {1}")
    @CsvSource({"1000, the Monte Carlo run", "2000, the design files"})
    void aFullDiskEndsInOneLineAndTheRunResumesToTheSameFiles(int blocks, String phase) throws Exception {
        Path out = tmp.resolve("results");
        Path staging = tmp.resolve("results.incomplete");
        copy(reference, out);
        Map<String, byte[]> before = contents(out);

        Process p = start(blocks, out, "--force");
        assertTrue(p.waitFor(180, TimeUnit.SECONDS), "the run on a full disk did not end");
        String err = Files.readString(tmp.resolve("err.txt"), StandardCharsets.UTF_8);
        assertEquals(ExitCodes.FAILURE, p.exitValue(), err);
        List<String> lines = err.lines().toList();
        assertEquals(1, lines.size(), "one line on stderr: " + err);
        String line = lines.get(0);
        assertTrue(line.startsWith("fabspread: the disk is full"), line);
        assertTrue(line.contains("File too large"), "says what the system said: " + line);
        assertTrue(line.contains(staging.toString()) && line.contains(out.toString()), "names the folders: " + line);
        assertTrue(line.contains("--resume"), "says how to continue: " + line);

        assertEquals(before.keySet(), contents(out).keySet(), "the results folder keeps its files (" + phase + ")");
        for (Map.Entry<String, byte[]> e : before.entrySet()) {
            assertArrayEquals(e.getValue(), contents(out).get(e.getKey()), "unchanged: " + e.getKey());
        }
        assertTrue(Files.isRegularFile(staging.resolve("INCOMPLETE.txt")), "the unfinished run is labelled");
        if (blocks == 1000) {
            assertTrue(Files.isRegularFile(staging.resolve("checkpoint.json")), "stopped inside the Monte Carlo run");
        } else {
            assertTrue(InterruptedRunTest.state(staging).contains("monte_carlo"), "stopped after the Monte Carlo run");
        }

        Process resumed = start(0, out, "--resume");
        assertTrue(resumed.waitFor(180, TimeUnit.SECONDS), "the resumed run did not end");
        assertEquals(0, resumed.exitValue(), Files.readString(tmp.resolve("err.txt"), StandardCharsets.UTF_8));
        assertFalse(Files.exists(staging), "the staging folder is gone once the run is published");
        Map<String, byte[]> whole = contents(reference);
        Map<String, byte[]> after = contents(out);
        assertEquals(whole.keySet(), after.keySet(), "the same files as an uninterrupted run");
        for (String f : InterruptedRunTest.COMPARED) {
            assertArrayEquals(whole.get(f), after.get(f), f);
        }
    }

    /** A child JVM under {@code ulimit -f blocks} (0: no limit), stderr to err.txt. */
    private Process start(int blocks, Path out, String... more) throws IOException {
        List<String> cmd = new ArrayList<>(List.of("bash", "-c", "ulimit -f \"$1\"; shift; exec \"$@\"", "bash",
                blocks > 0 ? Integer.toString(blocks) : "unlimited",
                Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-XX:-UsePerfData",
                "-cp", System.getProperty("java.class.path"), "org.fabspread.cli.Main", "run",
                InterruptedRunTest.STUDY.toString(), "--out", out.toString(), "--threads", "2", "--no-report"));
        cmd.addAll(List.of(more));
        return new ProcessBuilder(cmd).redirectOutput(tmp.resolve("out.txt").toFile())
                .redirectError(tmp.resolve("err.txt").toFile()).start();
    }

    private static void copy(Path from, Path to) throws IOException {
        try (Stream<Path> s = Files.walk(from)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                Path q = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(q);
                } else {
                    Files.copy(p, q);
                }
            }
        }
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
