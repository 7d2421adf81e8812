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
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The study side of the shared validation pass, driven through the command line as a user meets it:
 * encodings, data files and their folder, what an error may show of a file, control characters,
 * and the nominal device against each target in {@code check}.
 */
class StudyValidationTest {

    static final Path DEMO = Path.of("demo-studies/pilot-line-inverted.yaml");

    record Result(int code, String out, String err) {
    }

    static Result run(String... args) {
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(args, new PrintWriter(so), new PrintWriter(se));
        return new Result(code, so.toString(), se.toString());
    }

    /** The demo study with its MoO3 layer read from {@code tableRef} (an n,k table file). */
    static String demoWithTable(String tableRef) throws IOException {
        String s = Files.readString(DEMO, StandardCharsets.UTF_8);
        String with = s.replace("    material: moo3-stelling", "    material: {file: " + tableRef + "}");
        assertFalse(with.equals(s), "the demo names moo3-stelling");
        return with;
    }

    /** A plausible flat n,k table (invented test data) over 300 to 900 nm, with the given line end. */
    static String table(String eol) {
        StringBuilder b = new StringBuilder("# invented test table" + eol + "wavelength_nm,n,k" + eol);
        for (int w = 300; w <= 900; w += 50) {
            b.append(w).append(",2.0,0.01").append(eol);
        }
        return b.toString();
    }

    @Test
    void aStudyAndATableWithByteOrderMarkAndCrlfAreRead(@TempDir Path tmp) throws IOException {
        // source: The Unicode Standard 15.0, §23.8 — U+FEFF at the start of a UTF-8 file is a signature,
        // not text; RFC 4180 §2 — CSV records end in CRLF
        byte[] bom = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};
        Path table = tmp.resolve("moo3.csv");
        Files.write(table, concat(bom, table("\r\n").getBytes(StandardCharsets.UTF_8)));
        Path study = tmp.resolve("study.yaml");
        Files.write(study, concat(bom, demoWithTable("moo3.csv").replace("\n", "\r\n").getBytes(StandardCharsets.UTF_8)));
        Result r = run("check", study.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        assertTrue(r.out().contains("study is valid"));
    }

    @Test
    void anEllipsometryExportInElectronvoltsWithPermittivityIsReadAndCheckSaysSo(@TempDir Path tmp) throws IOException {
        // N = 2.0 + 0.01i as eps1 = n^2 - k^2 = 3.9999, eps2 = 2nk = 0.04 (source: Born and Wolf, Principles
        // of Optics, §14.1), at photon energies E = hc/lambda, hc = 1239.841984 eV nm (CODATA 2018)
        StringBuilder b = new StringBuilder("# invented test table\r\nPhoton energy (eV)\tε1\tε2\r\n");
        for (int w = 900; w >= 300; w -= 50) {
            b.append(String.format(Locale.ROOT, "%.6f\t3.9999\t0.04\r\n", 1239.841984 / w));
        }
        Files.writeString(tmp.resolve("moo3-ellipsometry.txt"), b.toString());
        Path study = tmp.resolve("study.yaml");
        Files.writeString(study, demoWithTable("moo3-ellipsometry.txt"));
        Result r = run("check", study.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        assertTrue(r.out().contains("table moo3-ellipsometry.txt (layer 'htl'): tab-separated, photon energy in eV"
                + " (converted to wavelength), ε1 and ε2 (converted to n and k)"), r.out());
    }

    @Test
    void aDataFileOutsideTheStudyFolderIsRefusedUnlessAllowed(@TempDir Path tmp) throws IOException {
        Path dir = Files.createDirectories(tmp.resolve("studies"));
        Files.writeString(tmp.resolve("moo3.csv"), table("\n"));
        Path study = dir.resolve("study.yaml");
        Files.writeString(study, demoWithTable("../moo3.csv"));
        Result refused = run("check", study.toString());
        assertEquals(ExitCodes.BAD_INPUT, refused.code());
        assertTrue(refused.err().strip().matches("fabspread: study\\.yaml:\\d+:\\d+:"
                + " stack\\[4\\]\\.material\\.file: '\\.\\./moo3\\.csv'"
                + " lies outside the study's folder; .*--allow-outside-files.*"), refused.err());
        assertEquals("", refused.out());
        Result allowed = run("check", study.toString(), "--allow-outside-files");
        assertEquals(ExitCodes.OK, allowed.code(), allowed.err());
    }

    @Test
    void anErrorShowsAtMostAShortExcerptOfAFile(@TempDir Path tmp) throws IOException {
        String canary = "FABSPREAD_CANARY_" + "x".repeat(200);
        Files.writeString(tmp.resolve("secret.csv"), canary + "=value\n1,2,3\n");
        Path dir = Files.createDirectories(tmp.resolve("s"));
        Path study = dir.resolve("study.yaml");
        Files.writeString(study, demoWithTable("../secret.csv"));
        Result r = run("check", study.toString(), "--allow-outside-files");
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertFalse(r.err().contains(canary), "the file's line must not be echoed whole: " + r.err());
        Matcher m = Pattern.compile("got '([^']*)'").matcher(r.err());
        assertTrue(m.find(), r.err());
        assertTrue(m.group(1).length() <= 40, "excerpt of at most 40 characters: " + m.group(1));
        // without the option the file is not opened at all
        Result closed = run("check", study.toString());
        assertFalse(closed.err().contains("FABSPREAD_CANARY"), closed.err());
    }

    @Test
    void controlCharactersInTheStudysStringsAreShownEscaped(@TempDir Path tmp) throws IOException {
        String s = Files.readString(DEMO, StandardCharsets.UTF_8);
        // YAML double-quoted escapes: \e is ESC, \a is BEL (source: YAML 1.2.2, §5.7 escaped characters)
        String evil = s.replaceFirst("(?m)^name: .*$", Matcher.quoteReplacement("name: \"evil\\e[2J\\a name\""));
        Path study = tmp.resolve("study.yaml");
        Files.writeString(study, evil);
        Result r = run("check", study.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        assertFalse(r.out().contains("\u001b"), "no raw escape character on the terminal");
        assertFalse(r.out().contains("\u0007"), "no raw bell character on the terminal");
        assertTrue(r.out().contains("study: evil\\e[2J\\u0007 name"), r.out());
    }

    @Test
    void checkShowsTheNominalResultAgainstEachTargetWithItsMargin() {
        Result r = run("check", DEMO.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        Matcher jsc = Pattern.compile("(?m)^  jsc\\s+([0-9.]+) mA/cm\\^2").matcher(r.out());
        assertTrue(jsc.find(), r.out());
        double nominal = Double.parseDouble(jsc.group(1));
        Matcher t = Pattern.compile("(?m)^  jsc >= 13\\.3 mA/cm\\^2\\s+nominal ([0-9.]+) mA/cm\\^2\\s+margin ([+-][0-9.]+)"
                + " mA/cm\\^2\\s+met$").matcher(r.out());
        assertTrue(t.find(), r.out());
        // the margin is the nominal minus the limit of an at-least target (definition of a one-sided
        // specification margin, common practice), to the 4 significant digits shown
        double margin = Double.parseDouble(t.group(2));
        assertEquals(nominal - 13.3, margin, 1e-3);
        assertEquals(String.format(Locale.ROOT, "%.4g", nominal), t.group(1));
    }

    @org.junit.jupiter.params.ParameterizedTest
    @org.junit.jupiter.params.provider.ValueSource(strings = {"studies/conventional-particles-in-htl.yaml",
            "studies/inverted-particles-in-etl.yaml", "studies/particles-in-absorber.yaml"})
    void everyTemplatesNominalDeviceMeetsEachOfItsTargets(String template) {
        Result r = run("check", template);
        assertEquals(ExitCodes.OK, r.code(), r.err());
        String block = r.out().substring(r.out().indexOf("nominal against the targets:"));
        long targets = block.lines().filter(l -> l.startsWith("  ")).count();
        assertTrue(targets >= 2, block);
        assertEquals(targets, block.lines().filter(l -> l.startsWith("  ") && l.endsWith(" met")).count(), block);
        assertFalse(block.contains("-"), "every margin is positive: " + block);
    }

    @Test
    void anErrorAtTheNominalPointIsTheOnlyLineCheckPrints(@TempDir Path tmp) throws IOException {
        String s = Files.readString(DEMO, StandardCharsets.UTF_8)
                .replace("    material: ito-konig\n", "    material: ito-konig\n    n_shift: -3\n");
        Path study = tmp.resolve("study.yaml");
        Files.writeString(study, s);
        Result r = run("check", study.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals("", r.out(), "nothing printed before the error");
        assertTrue(r.err().strip().startsWith("fabspread: study.yaml:"), r.err());
        assertFalse(r.err().strip().contains("\n"), "one line");
    }

    @Test
    void runRefusesTooManySamplesOnTheCommandLine(@TempDir Path tmp) {
        Path out = tmp.resolve("out");
        Result r = run("run", DEMO.toString(), "--samples", "1000000000000", "--out", out.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertTrue(r.err().strip().startsWith("fabspread: --samples: at most 1000000"), r.err());
        assertFalse(Files.exists(out));
    }

    private static byte[] concat(byte[] a, byte[] b) {
        byte[] c = new byte[a.length + b.length];
        System.arraycopy(a, 0, c, 0, a.length);
        System.arraycopy(b, 0, c, a.length, b.length);
        return c;
    }
}
