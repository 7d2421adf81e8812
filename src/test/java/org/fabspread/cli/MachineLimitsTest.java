package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The up-front refusals that depend on the machine — {@code samples.csv} against the free space of the
 * results folder's file system, the Sobol design against the Java heap, the run's time against 30 days —
 * through {@code check} and {@code run}, made deterministic with the hidden test properties of
 * {@code pipeline.MachineLimits} (a faked free space per folder, heap, seconds per model run). Each gives its
 * one located line, exit 2 and no folder. The disk checked is the one {@code --out} is on (or the default
 * results folder's, under the current folder, when {@code --out} is absent), not the current folder's.
 */
class MachineLimitsTest {

    static final Path STUDY = Path.of("src/test/resources/limits/limits-study.yaml");
    static final String FREE_DISK = "fabspread.test.free-disk-bytes";
    static final String HEAP = "fabspread.test.heap-bytes";
    static final String SECONDS_PER_RUN = "fabspread.test.seconds-per-run";
    /** The line of analysis.samples in the study, and its value's column. */
    static final String SAMPLES_AT = "limits-study.yaml:66:12: analysis.samples: ";

    @TempDir
    Path tmp;

    @AfterEach
    void clear() {
        System.clearProperty(FREE_DISK);
        System.clearProperty(HEAP);
        System.clearProperty(SECONDS_PER_RUN);
    }

    /** The error line, with the program's prefix (added by newer versions to every line) taken off. */
    static String line(OutputFolderTest.Run r) {
        String e = r.err().strip();
        assertFalse(e.contains("\n"), "one line: " + e);
        return e.replaceFirst("^fabspread: ", "");
    }

    /** {@code check STUDY MORE…} or {@code run STUDY MORE… --threads 2 --no-report}. */
    static OutputFolderTest.Run cli(String command, String... more) {
        java.util.List<String> args = new java.util.ArrayList<>(java.util.List.of(command, STUDY.toString()));
        args.addAll(java.util.List.of(more));
        if (command.equals("run")) {
            args.addAll(java.util.List.of("--threads", "2", "--no-report"));
        }
        return OutputFolderTest.cli(args.toArray(String[]::new));
    }

    @Test
    void samplesThatDoNotFitTheDiskOfTheResultsFolderAreRefused() throws IOException {
        Path small = Files.createDirectories(tmp.resolve("small"));
        Path other = Files.createDirectories(tmp.resolve("other"));
        Path out = small.resolve("results");
        // 4000 samples of 9 inputs and 15 outputs at 24 bytes a number and 32 a row: 2.43 MB (Preflight's estimate)
        String expected = SAMPLES_AT + "4000 samples would write about 2.43 MB of samples.csv; the disk of " + small
                + " has 1.00 kB free";
        // the current folder is "full" too: a check of the current folder's disk would refuse the other folder
        System.setProperty(FREE_DISK, small + "=1000," + Path.of("").toAbsolutePath() + "=1000");
        for (String command : new String[] {"check", "run"}) {
            OutputFolderTest.Run r = cli(command, "--out", out.toString());
            assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
            assertEquals(expected, line(r), command);
            assertFalse(Files.exists(out) || Files.exists(small.resolve("results.incomplete")), "no folder");
        }
        OutputFolderTest.Run r = OutputFolderTest.cli("check", STUDY.toString(), "--out", other.resolve("results")
                .toString());
        assertEquals(0, r.code(), "the other folder's disk (real free space) has room: " + r.err());
    }

    @Test
    void withoutOutTheDiskOfTheDefaultResultsFolderIsChecked() {
        Path cwd = Path.of("").toAbsolutePath();
        Path defaultRoot = cwd.resolve(DefaultFolder.ROOT);
        boolean rootExisted = Files.exists(defaultRoot);
        Path nearest = Files.isDirectory(defaultRoot.resolve("Machine-limits")) ? defaultRoot.resolve("Machine-limits")
                : rootExisted ? defaultRoot : cwd;
        System.setProperty(FREE_DISK, cwd + "=1000");
        String expected = SAMPLES_AT + "4000 samples would write about 2.43 MB of samples.csv; the disk of " + nearest
                + " has 1.00 kB free";
        for (String command : new String[] {"check", "run"}) {
            OutputFolderTest.Run r = cli(command);
            assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
            assertEquals(expected, line(r), command);
        }
        assertEquals(rootExisted, Files.exists(defaultRoot), "nothing written under the current folder");
    }

    @Test
    void aSobolDesignLargerThanTheHeapAllowsIsRefused() {
        // 8 bytes x N (2k + m(k + 2) + 1) = 8 x 32 x (18 + 15 x 11 + 1) = 47 104 bytes, over 60 % of a 10 kB heap
        System.setProperty(HEAP, "10000");
        Path out = tmp.resolve("results");
        for (String command : new String[] {"check", "run"}) {
            OutputFolderTest.Run r = cli(command, "--out", out.toString());
            assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
            assertEquals("limits-study.yaml:70:15: analysis.sobol_base: 32 needs about 47.1 kB of memory for the Sobol"
                    + " design's 352 model runs, more than this Java heap allows (10.0 kB); use a smaller sobol_base or"
                    + " give Java more memory (-Xmx)", line(r), command);
            assertFalse(Files.exists(out) || Files.exists(tmp.resolve("results.incomplete")), "no folder");
        }
    }

    @Test
    void aRunLongerThanThirtyDaysIsRefused() {
        // 24 080 model runs x 1000 s / 2 threads = 1.204e7 s = 139 days
        System.setProperty(SECONDS_PER_RUN, "1000");
        Path out = tmp.resolve("results");
        OutputFolderTest.Run r = OutputFolderTest.cli("run", STUDY.toString(), "--out", out.toString(), "--threads",
                "2", "--no-report");
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals(SAMPLES_AT + "24080 model runs would take about 139 days on 2 threads; use fewer samples",
                line(r));
        assertFalse(Files.exists(out) || Files.exists(tmp.resolve("results.incomplete")), "no folder");
        // check assumes every processor of this machine: the same refusal, its days depending on their number
        r = OutputFolderTest.cli("check", STUDY.toString(), "--out", out.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertTrue(line(r).startsWith(SAMPLES_AT + "24080 model runs would take about ") && line(r)
                .endsWith("; use fewer samples"), r.err());
        assertFalse(Files.exists(out), "no folder");
    }
}
