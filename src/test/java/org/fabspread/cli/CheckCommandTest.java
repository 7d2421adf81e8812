package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.fabspread.study.MaterialCatalog;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** {@code check} on the shipped templates and demos, and its inputs table. */
class CheckCommandTest {

    static Stream<Path> shippedStudies() throws IOException {
        return Stream.concat(Files.list(Path.of("studies")), Files.list(Path.of("demo-studies")))
                .filter(p -> p.toString().endsWith(".yaml")).sorted();
    }

    private record Result(int code, String out, String err) {
    }

    private static Result run(String... args) {
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(args, new PrintWriter(so), new PrintWriter(se));
        return new Result(code, so.toString(), se.toString());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("shippedStudies")
    void everyShippedStudyIsValid(Path study) {
        Result r = run("check", study.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        assertEquals("", r.err());
        assertTrue(r.out().startsWith("study: "), r.out());
        assertTrue(r.out().contains("grid: "), r.out());
        assertTrue(r.out().contains("uncertain inputs ("), r.out());
        assertTrue(r.out().strip().endsWith("study is valid"), r.out());
    }

    @Test
    void thereAreThreeTemplatesAndThreeDemos() throws IOException {
        try (Stream<Path> s = shippedStudies()) {
            assertEquals(List.of("demo-studies/gold-rods-conventional.yaml", "demo-studies/pilot-line-inverted.yaml",
                    "demo-studies/silver-crescents-conventional.yaml",
                    "studies/conventional-particles-in-htl.yaml", "studies/inverted-particles-in-etl.yaml",
                    "studies/particles-in-absorber.yaml"), s.map(p -> p.toString().replace('\\', '/')).toList());
        }
    }

    @Test
    void outWritesTheUncertainInputs(@TempDir Path tmp) throws IOException {
        Path out = tmp.resolve("run1");
        Result r = run("check", "demo-studies/pilot-line-inverted.yaml", "--out", out.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        List<String> lines = Files.readAllLines(out.resolve("inputs.csv"), StandardCharsets.UTF_8);
        assertEquals("id,unit,nominal,distribution", lines.get(0));
        assertEquals(10, lines.size(), "header and nine uncertain inputs");
        // "120 nm ± 9 nm at 3 sigma": sigma = 9 / 3 = 3 nm
        assertEquals("stack.ito.thickness,nm,120,\"normal(mean 120 nm, sigma 3 nm)\"", lines.get(1));
        assertEquals("particles.coverage,fraction,0.06,\"normal(mean 6 %, sigma 0.75 %)\"", lines.get(8));
        assertTrue(r.out().contains("stack.absorber.k_scale"), r.out());
        try (Stream<Path> s = Files.list(out)) {
            assertEquals(1, s.count(), "only inputs.csv, no temporary files left");
        }
    }

    @Test
    void missingStudyFileIsBadInput(@TempDir Path tmp) {
        Result r = run("check", tmp.resolve("nope.yaml").toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(tmp.resolve("nope.yaml") + ": study file not found", r.err().strip());
    }

    @Test
    void checkIsRegisteredInTheTopLevelHelp() {
        Result r = run("--help");
        assertEquals(ExitCodes.OK, r.code());
        assertTrue(r.out().contains("check"), r.out());
    }

    /** The study reader's own view of the bundled tables must agree with the optics library's. */
    @Test
    void materialCatalogAgreesWithTheMaterialLibrary() {
        MaterialLibrary lib = MaterialLibrary.bundled();
        MaterialCatalog cat = MaterialCatalog.bundled();
        assertEquals(lib.ids(), cat.ids());
        for (String id : lib.ids()) {
            NkTable t = lib.get(id);
            assertArrayEquals(new double[] {t.minWavelength(), t.maxWavelength()}, cat.range(id), 0.0, id);
        }
    }

    @Test
    void checkPrintsTheNominalPointsEnvelopeStatus(@TempDir Path dir) throws IOException {
        // the demo's 20 nm Ag spheres at 6 % in 40 nm ZnO are inside; 60 % coverage of spheres gives f = 2θ/3 = 0.4 (derived) above the 0.3 of Maxwell Garnett
        // (ValidityEnvelope javadoc)
        Result in = run("check", "demo-studies/pilot-line-inverted.yaml");
        assertTrue(in.out().contains("nominal particles: inside the validity envelope"), in.out());
        String text = Files.readString(Path.of("demo-studies/pilot-line-inverted.yaml"))
                .replace("coverage: 6 % ± 1.5 % at 2 sigma", "coverage: 60 % ± 1.5 % at 2 sigma");
        Path study = dir.resolve("outside.yaml");
        Files.writeString(study, text);
        Result out = run("check", study.toString());
        assertEquals(ExitCodes.OK, out.code(), out.err());
        assertTrue(out.out().contains("nominal particles outside the validity envelope: volume fraction beyond the"
                + " effective-medium limit"), out.out());
        assertTrue(!out.out().contains("inside the validity envelope"), out.out());
    }
}
