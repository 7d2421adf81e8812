package org.fabspread.cli;

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
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every malformed study under {@code src/test/resources/malformed} (one error each, listed with its
 * exact expected error line in {@code cases.tsv}) makes {@code check} fail with exit code 2, that one
 * line on stderr, nothing on stdout, and no output folder; {@code run} refuses it with the same line
 * (check and run share one validation pass) and leaves no output folder either.
 */
class MalformedStudiesTest {

    static final Path DIR = Path.of("src/test/resources/malformed");

    /** One row of cases.tsv: file, level (schema | reader), expected error line. */
    record Case(String file, String level, String expected) {
        @Override public String toString() {
            return file;
        }
    }

    static List<Case> cases() throws IOException {
        List<Case> out = new ArrayList<>();
        for (String line : Files.readAllLines(DIR.resolve("cases.tsv"), StandardCharsets.UTF_8)) {
            if (line.isBlank() || line.startsWith("#")) {
                continue;
            }
            String[] f = line.split("\t", 3);
            out.add(new Case(f[0], f[1], f[2]));
        }
        return out;
    }

    static Stream<Case> all() throws IOException {
        return cases().stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("all")
    void checkRejectsWithOneExactLine(Case c, @TempDir Path tmp) {
        Path out = tmp.resolve("out");
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"check", DIR.resolve(c.file()).toString(), "--out", out.toString()},
                new PrintWriter(so), new PrintWriter(se));
        assertEquals(ExitCodes.BAD_INPUT, code, () -> "stderr: " + se);
        assertEquals(c.expected(), se.toString().strip(), "the error line");
        assertFalse(se.toString().strip().contains("\n"), "one line only");
        assertFalse(se.toString().contains("\tat "), "no stack trace");
        assertEquals("", so.toString(), "nothing on stdout");
        assertFalse(Files.exists(out), "no output folder may be created for a bad study");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("all")
    void runRefusesWithTheSameLineAndLeavesNoFolder(Case c, @TempDir Path tmp) {
        Path out = tmp.resolve("out");
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"run", DIR.resolve(c.file()).toString(), "--out", out.toString()},
                new PrintWriter(so), new PrintWriter(se));
        assertEquals(ExitCodes.BAD_INPUT, code, () -> "stderr: " + se);
        assertEquals(c.expected(), se.toString().strip(), "the error line");
        assertFalse(Files.exists(out), "no output folder may remain for a bad study");
    }

    /**
     * The refusals that once came only while running (exit 1 or 2 after the Monte Carlo run, a folder left
     * behind), or from {@code run} but not {@code check}, or not at all: each has its case above, so
     * {@code check} and {@code run} both give its one line, exit 2 and no folder.
     */
    @Test
    void everyRefusalOnceMadeOnlyWhileRunningHasACase() throws IOException {
        Set<String> listed = cases().stream().map(Case::file).collect(Collectors.toSet());
        for (String file : List.of(
                "target-unknown-output.yaml",                 // a target on an output the model does not have
                "no-uncertain-input.yaml",                    // nothing to sample
                "plan-max-runs-too-small.yaml",               // the listed factors do not fit max_runs
                "plan-max-runs-too-small-for-ranking.yaml",   // the factors the ranking may choose do not fit
                "plan-precision-coarser-than-levels.yaml",    // the run sheet cannot show the plan's levels
                "sobol-base-huge.yaml",                       // sobol_base: 1e8
                "two-substrates.yaml",
                "samples-huge.yaml",                          // samples: 1e12
                "grid-step-tiny.yaml", "grid-step-absurd.yaml",
                "coverage-spread-past-full.yaml",             // a coverage spread reaching past 100 %
                "what-if-shift-reaches-negative.yaml",        // a shift that makes a thickness negative
                "too-many-layers.yaml")) {
            assertTrue(listed.contains(file), file);
        }
    }

    @Test
    void everyMalformedFileIsInTheTableAndThereAreEnough() throws IOException {
        Set<String> listed = cases().stream().map(Case::file).collect(Collectors.toCollection(TreeSet::new));
        Set<String> files;
        try (Stream<Path> s = Files.list(DIR)) {
            files = s.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(".yaml"))
                    .collect(Collectors.toCollection(TreeSet::new));
        }
        assertEquals(files, listed);
        assertTrue(listed.size() >= 150, "at least 150 malformed cases");
        for (Case c : cases()) {
            assertTrue(c.level().equals("schema") || c.level().equals("reader"), c.file());
            assertTrue(c.expected().startsWith("fabspread: " + c.file() + ":"),
                    "the line starts with the prefix, then names the file: " + c.expected());
        }
    }
}
