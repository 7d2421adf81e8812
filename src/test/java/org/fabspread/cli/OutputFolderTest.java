package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The results folder is owned by the run (common practice for batch tools that publish a folder): unusable
 * names are refused in one line, foreign content is never touched, results of another study or seed are
 * replaced only with {@code --force}, and a rerun leaves no file of the earlier run behind.
 */
class OutputFolderTest {

    static final String DEMO = "demo-studies/pilot-line-inverted.yaml";

    @TempDir
    Path tmp;

    record Run(int code, String out, String err) {
    }

    static Run cli(String... args) {
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = Main.run(args, new PrintWriter(o), new PrintWriter(e));
        return new Run(code, o.toString(), e.toString());
    }

    static Run run(Path out, String... extra) {
        String[] base = {"run", DEMO, "--out", out.toString(), "--samples", "60", "--threads", "2", "--no-report"};
        String[] all = new String[base.length + extra.length];
        System.arraycopy(base, 0, all, 0, base.length);
        System.arraycopy(extra, 0, all, base.length, extra.length);
        return cli(all);
    }

    private static void oneLine(Run r, String expected) {
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals(expected, r.err().strip());
        assertFalse(r.err().contains("\tat "), "no stack trace");
    }

    @Test
    void unusableFolderNamesAreRefusedInOneLine() throws IOException {
        oneLine(cli("run", DEMO, "--out", ""), "fabspread: --out: the folder name is empty; name a folder for the results");
        oneLine(cli("run", DEMO, "--out", "/"),
                "fabspread: --out /: the root folder cannot hold results; name a folder of its own");
        Path file = Files.writeString(tmp.resolve("notes.txt"), "mine");
        oneLine(cli("run", DEMO, "--out", file.toString()), "fabspread: --out " + file + ": is a file, not a folder");
        assertEquals("mine", Files.readString(file));
    }

    @Test
    void aFolderWithOtherFilesIsRefusedAndLeftAlone() throws IOException {
        Path out = Files.createDirectories(tmp.resolve("thesis"));
        Files.writeString(out.resolve("chapter1.tex"), "text");
        oneLine(run(out), "fabspread: --out " + out + ": holds files that are not fabspread results (chapter1.tex);"
                + " name a new or empty folder");
        assertEquals("text", Files.readString(out.resolve("chapter1.tex")));
        assertFalse(Files.exists(tmp.resolve("thesis.incomplete")), "nothing written beside it");
    }

    @Test
    void aRerunReplacesTheEarlierResultsWholeAndSaysSo() throws IOException {
        Path out = tmp.resolve("res");
        assertEquals(0, run(out).code());
        Files.writeString(out.resolve("old-chart.svg"), "<svg/>");
        Run again = run(out);
        assertEquals(0, again.code(), again.err());
        assertTrue(again.out().contains("replacing the results of study '"), again.out());
        assertFalse(Files.exists(out.resolve("old-chart.svg")), "a file of the earlier run stayed behind");
        assertTrue(Files.exists(out.resolve("summary.json")));
    }

    @Test
    void resultsOfAnotherSeedNeedForce() throws IOException {
        Path out = tmp.resolve("res");
        assertEquals(0, run(out).code());
        byte[] before = Files.readAllBytes(out.resolve("summary.json"));
        Run refused = run(out, "--seed", "5");
        assertEquals(ExitCodes.BAD_INPUT, refused.code());
        assertTrue(refused.err().strip().startsWith("fabspread: --out " + out + ": holds the results of study '"),
                refused.err());
        assertTrue(refused.err().strip().endsWith("seed 5; use --force to replace them or name another folder"),
                refused.err());
        assertEquals(new String(before), Files.readString(out.resolve("summary.json")), "left as it was");
        assertEquals(0, run(out, "--seed", "5", "--force").code());
    }

    @Test
    void resumeWithNothingToResumeSaysSo() {
        Path out = tmp.resolve("never");
        oneLine(run(out, "--resume"), "fabspread: --out " + out + ": nothing to resume (no unfinished run"
                + " never.incomplete beside it)");
    }

    @Test
    void theDefaultFolderIsNamedAfterTheStudy() {
        assertEquals(Path.of("fabspread-out", "Pilot-line-inverted-PTB7-PC71BM-with-Ag-spheres-in-the-ZnO"),
                DefaultFolder.of(org.fabspread.study.StudyReader.read(Path.of(DEMO))));
        assertEquals("study", DefaultFolder.name("../"));
    }

    @Test
    void aMistypedCommandGetsASuggestionOnOneLine() {
        Run r = cli("rnu", DEMO);
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertFalse(r.err().strip().contains("\n"), r.err());
        assertEquals("fabspread: unknown command or argument 'rnu' (did you mean 'run'?); see 'fabspread --help'",
                r.err().strip());
        Run o = cli("run", DEMO, "--sampels", "5");
        assertTrue(o.err().strip().startsWith("fabspread: unknown option '--sampels' (did you mean '--samples'?)"),
                o.err());
        // source: the textbook example of Levenshtein distance, kitten -> sitting is 3 (from memory; checked by
        // hand: k->s, e->i, insert g)
        assertEquals(3, org.fabspread.study.Suggestions.distance("kitten", "sitting"));
        assertEquals(0, org.fabspread.study.Suggestions.distance("run", "run"));
    }

    @Test
    void shellCompletionIsGenerated() {
        Run r = cli("generate-completion");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("complete -F") && r.out().contains("fabspread"), r.out().substring(0, 200));
    }
}
