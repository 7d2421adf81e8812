package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every error line the program prints starts with {@code fabspread: } exactly once, whatever kind of bad input
 * caused it (the project's rule for bad input: one line, exit code 2). The old code left lines that began with
 * a file location ({@code study.yaml:3:5: key: …}) unprefixed; these cases drive {@link Main} as the user does.
 */
class ErrorPrefixTest {

    private static final String DEMO = "demo-studies/pilot-line-inverted.yaml";

    private record Outcome(int code, String out, String err) {
    }

    private static Outcome cli(String... args) {
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = Main.run(args, new PrintWriter(o), new PrintWriter(e));
        return new Outcome(code, o.toString(), e.toString());
    }

    private static void prefixedOnce(Outcome r, String what) {
        assertEquals(ExitCodes.BAD_INPUT, r.code(), what + ": " + r.err());
        List<String> lines = r.err().strip().lines().toList();
        assertEquals(1, lines.size(), what + ": one line: " + r.err());
        for (String line : lines) {
            assertTrue(line.startsWith("fabspread: "), what + ": " + line);
            assertFalse(line.substring("fabspread: ".length()).contains("fabspread: "),
                    what + ": the prefix once: " + line);
        }
        assertFalse(r.err().contains("\tat "), what + ": no stack trace");
    }

    @Test
    void everyKindOfBadInputGivesOnePrefixedLineAndExitTwo(@TempDir Path tmp) throws IOException {
        Path bad = tmp.resolve("study.yaml");
        Files.writeString(bad, Files.readString(Path.of(DEMO)).replace("thickness: 120 nm", "thickness: -120 nm"));
        List<String[]> cases = new ArrayList<>();
        cases.add(new String[] {"check", bad.toString()});
        cases.add(new String[] {"run", bad.toString(), "--out", tmp.resolve("a").toString()});
        cases.add(new String[] {"check", tmp.resolve("missing.yaml").toString()});
        cases.add(new String[] {"run", DEMO, "--samples", "-5", "--out", tmp.resolve("b").toString()});
        cases.add(new String[] {"run", DEMO, "--samples", "1000000000000", "--out", tmp.resolve("c").toString()});
        cases.add(new String[] {"run", DEMO, "--threads", "0", "--out", tmp.resolve("d").toString()});
        cases.add(new String[] {"run", DEMO, "--samples", "many", "--out", tmp.resolve("e").toString()});
        cases.add(new String[] {"demo", "--samples", "-5", "--out", tmp.resolve("f").toString()});
        cases.add(new String[] {"frobnicate"});
        cases.add(new String[] {"rnu", DEMO});
        cases.add(new String[] {"run", DEMO, "--sampels", "5"});
        cases.add(new String[] {"run", DEMO, "--engine", "cloud", "--out", tmp.resolve("g").toString()});
        for (String[] c : cases) {
            prefixedOnce(cli(c), String.join(" ", c));
        }
        for (String d : List.of("a", "b", "c", "d", "e", "f", "g")) {
            assertFalse(Files.exists(tmp.resolve(d)), "no output folder for bad input: " + d);
        }
    }

    @Test
    void aLocatedStudyErrorKeepsItsLocationAfterThePrefix(@TempDir Path tmp) throws IOException {
        Path bad = tmp.resolve("study.yaml");
        Files.writeString(bad, Files.readString(Path.of(DEMO)).replace("thickness: 120 nm", "thickness: -120 nm"));
        Outcome r = cli("check", bad.toString());
        prefixedOnce(r, "check");
        assertTrue(r.err().strip().matches("fabspread: study\\.yaml:\\d+:\\d+: stack\\[\\d+\\]\\.thickness: .*"),
                r.err());
    }

    @Test
    void aNegativeSampleCountNamesTheOptionAndTheValue() {
        Outcome r = cli("run", DEMO, "--samples", "-5");
        prefixedOnce(r, "--samples -5");
        assertEquals("fabspread: --samples: must be >= 0 (0 takes the study's), got -5", r.err().strip());
        assertEquals("", r.out());
    }

    @Test
    void demoAcceptsQuietAndPrintsNothingOnSuccess(@TempDir Path tmp) {
        Outcome r = cli("demo", "--quiet", "--samples", "40", "--sobol-base", "8", "--threads", "2",
                "--out", tmp.resolve("q").toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        assertEquals("", r.out(), "--quiet prints nothing but errors");
        assertTrue(Files.isRegularFile(tmp.resolve("q").resolve("summary.json")), "the demo still ran");
    }
}
