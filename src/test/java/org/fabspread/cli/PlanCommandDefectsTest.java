package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.fabspread.plan.MinimumAberrationCatalog;
import org.fabspread.plan.TwoLevelDesign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code fabspread plan} on the demo study with its plan section changed, through {@link Main#run}:
 * the plans the command once got wrong in ordinary use.
 */
class PlanCommandDefectsTest {

    static final Path DEMO = Path.of("demo-studies/pilot-line-inverted.yaml");
    static final List<String> INPUTS = List.of("stack.absorber.thickness", "stack.etl.thickness", "particles.coverage",
            "particles.diameter", "stack.ito.thickness", "stack.absorber.k_scale", "particles.size_cv",
            "collection.dissociation", "stack.htl.thickness");

    @TempDir
    Path tmp;

    record Result(int code, String out, String err, JsonNode json, List<String> sheet) {
    }

    /** Runs the plan command on the demo with the plan section's factors, budget, kind, resolution and centre points. */
    Result plan(List<String> factors, int maxRuns, String kind, int resolution, int centre) throws IOException {
        String study = Files.readString(DEMO)
                .replace("factors: [stack.absorber.thickness, stack.etl.thickness, particles.coverage, particles.diameter]",
                        "factors: [" + String.join(", ", factors) + "]")
                .replace("max_runs: 16", "max_runs: " + maxRuns)
                .replace("kind: auto", "kind: " + kind)
                .replace("resolution: 4", "resolution: " + resolution)
                .replace("centre_points: 2", "centre_points: " + centre);
        Path file = tmp.resolve("study-" + factors.size() + "-" + kind + "-" + maxRuns + ".yaml");
        Files.writeString(file, study);
        Path out = tmp.resolve("out-" + file.getFileName());
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"plan", file.toString(), "--out", out.toString(), "--screening-samples", "60",
                "--threads", "1"}, new PrintWriter(so), new PrintWriter(se));
        JsonNode json = code == 0 ? new ObjectMapper().readTree(out.resolve("plan.json").toFile()) : null;
        List<String> sheet = code == 0 ? Files.readAllLines(out.resolve("plan.csv")) : List.of();
        return new Result(code, so.toString(), se.toString(), json, sheet);
    }

    @Test
    void resolutionFiveOutOfReachGivesTheBestResolutionThatFits() throws IOException {
        // source: NIST/SEMATECH e-Handbook 5.3.3.4.7 (summary table of fractional factorials): 7 factors
        // reach resolution V only in 64 runs (2^(7-1) VII); in 16 and 32 runs they are resolution IV
        // (2^(7-3), 2^(7-2)); 8 factors: 2^(8-4) IV in 16, 2^(8-3) IV in 32, 2^(8-2) V in 64. The
        // old advisor gave the 8-run resolution III plan for 7 factors and a 12-run Plackett-Burman for 8.
        Result r7 = plan(INPUTS.subList(0, 7), 32, "auto", 5, 0);
        assertEquals(0, r7.code(), r7.err());
        assertEquals("IV", r7.json().get("resolution").asText());
        assertEquals(32, r7.json().get("runs").asInt() / r7.json().get("replicates").asInt());
        // 15 of 21 interactions clear in the 32-run plan (from memory: Wu & Hamada's table of 32-run
        // designs), cross-checked by counting from the design itself
        assertEquals(15, MinimumAberrationCatalog.design(7, 32).clearTwoFactorInteractions().size());
        assertTrue(r7.out().contains("cannot hold resolution V for these 7 factors (that needs the 2^(7-1)"), r7.out());
        assertTrue(r7.out().contains("in 64 runs: a budget of 64"), r7.out());
        assertTrue(r7.out().contains("keeping 15 of the 21 two-factor interactions clear"), r7.out());

        Result r8 = plan(INPUTS.subList(0, 8), 32, "auto", 5, 0);
        assertEquals(0, r8.code(), r8.err());
        assertTrue(r8.json().get("design").asText().startsWith("2^(8-3) fractional factorial"), r8.json().toString());
        assertEquals("IV", r8.json().get("resolution").asText());
        // the resolutions the table gives, recomputed from the design matrices (second route)
        for (int[] c : new int[][] {{7, 16, 4}, {7, 32, 4}, {7, 64, 7}, {8, 16, 4}, {8, 32, 4}, {8, 64, 5}}) {
            TwoLevelDesign d = MinimumAberrationCatalog.design(c[0], c[1]);
            assertEquals(c[2], d.resolution(), c[0] + " factors in " + c[1]);
            int[] wlp = TwoLevelDesign.wordLengthPatternFromMatrix(d.matrix());
            int first = 1;
            while (first < wlp.length && wlp[first] == 0) {
                first++;
            }
            assertEquals(c[2], first, "shortest word of the pattern from the matrix (index = word length)");
        }
    }

    @Test
    void fractionalKindNeverFallsToPlackettBurman() throws IOException {
        // kind: fractional with 9 factors and a 16-run budget: the regular 2^(9-5) III fraction (source:
        // NIST/SEMATECH e-Handbook 5.3.3.4.7: 16 runs hold up to 15 factors at resolution III); the old
        // advisor returned a 12-run Plackett-Burman design
        Result r = plan(INPUTS, 16, "fractional", 3, 0);
        assertEquals(0, r.code(), r.err());
        assertEquals("FRACTIONAL", r.json().get("kind").asText());
        assertTrue(r.json().get("design").asText().startsWith("2^(9-5) fractional factorial"), r.json().toString());
    }

    @Test
    void boxBehnkenOfSevenFactorsRunsFromTheCommandLine() throws IOException {
        // source: Box & Behnken (1960): 56 runs for 7 factors before centre points; the old command exited 1
        Result r = plan(INPUTS.subList(0, 7), 0, "box-behnken", 0, 6);
        assertEquals(0, r.code(), r.err());
        assertEquals(62, r.json().get("runs").asInt() - 56 * (r.json().get("replicates").asInt() - 1));
    }

    @Test
    void axialPointsStayInsideAUniformInputsRange() throws IOException {
        // htl thickness is uniform 8-12 nm; its levels sit on the ends of the range, and the rotatable
        // alpha = 2 of a 2^4 cube (source: Box & Hunter 1957, alpha = (2^4)^(1/4)) would run it at 6 and 14 nm.
        Result r = plan(List.of("stack.htl.thickness", "stack.absorber.thickness", "stack.etl.thickness",
                "particles.coverage"), 0, "central-composite", 0, 3);
        assertEquals(0, r.code(), r.err());
        assertTrue(r.json().get("design").asText().contains("face-centred"), r.json().get("design").asText());
        assertTrue(r.out().contains("stack.htl.thickness at 6 and 14 nm (its range is 8 to 12 nm)"), r.out());
        List<String> header = List.of(r.sheet().get(0).split(","));
        int htl = header.indexOf("stack.htl.thickness [nm]");
        for (String line : r.sheet().subList(1, r.sheet().size())) {
            double v = Double.parseDouble(line.split(",", -1)[htl]);
            assertTrue(v >= 8 && v <= 12, line);
        }
    }

    @Test
    void theRunSheetIsInSettableUnitsAndPercentStaysPercent() throws IOException {
        // common practice: a film thickness is set to 0.1 nm and a coverage to 0.1 %; the demo writes
        // coverage as 6 % +/- 1.5 % at 2 sigma, so its levels are 4.5 % and 7.5 %, not 0.045 and 0.075
        Result r = plan(INPUTS.subList(0, 4), 16, "auto", 4, 2);
        assertEquals(0, r.code(), r.err());
        List<String> header = List.of(r.sheet().get(0).split(","));
        int cov = header.indexOf("particles.coverage [%]");
        int dia = header.indexOf("particles.diameter [nm]");
        assertTrue(cov > 0 && dia > 0, header.toString());
        for (String line : r.sheet().subList(1, r.sheet().size())) {
            String[] f = line.split(",", -1);
            assertTrue(List.of("4.5", "6", "7.5").contains(f[cov]), line);
            assertTrue(!f[dia].contains(".") || f[dia].length() - f[dia].indexOf('.') <= 2, line);
        }
    }

    @Test
    void failedSamplesNeverRemoveTheExperimentsSectionSilently() throws IOException {
        // particles of median 36 nm in a 34-46 nm ZnO layer: some samples fail (the particles no longer fit
        // their layer), and the plan's corner at the thinnest ZnO and the largest particles is refused too.
        // The old report dropped its "Suggested experiments" section without a word and still told the
        // reader to verify with the suggested experiments.
        // Particles taller than the ZnO stick out into the layer in front of it; a 2 nm ITO leaves them no
        // room there, so those samples still fail.
        String study = Files.readString(DEMO).replace("median: 20 nm, cv: 8 %", "median: 36 nm, cv: 8 %")
                .replace("sensitivity: sobol", "sensitivity: screening")
                .replace("thickness: 120 nm ± 9 nm at 3 sigma", "thickness: 2 nm ± 0.3 nm at 3 sigma");
        Path file = tmp.resolve("big-particles.yaml");
        Files.writeString(file, study);
        Path out = tmp.resolve("big-out");
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"run", file.toString(), "--out", out.toString(), "--samples", "100",
                "--threads", "1"}, new PrintWriter(so), new PrintWriter(se));
        assertEquals(0, code, se.toString());
        assertTrue(so.toString().contains("samples failed in the model"), so.toString());
        String report = Files.readString(out.resolve("report.md"));
        int at = report.indexOf("Suggested experiments");
        assertTrue(at >= 0, "the section is there");
        String section = report.substring(at);
        assertTrue(section.contains("No experiment plan could be proposed for this study: the device model refuses "
                + "the plan's run at stack.absorber.thickness"), section);
        assertTrue(section.contains("give plan.limits for"), section);
        assertTrue(!report.contains("Verify with the suggested experiments"), "no caution pointing at a missing plan");
        // the plan command says the same in one line, exit 2
        StringWriter pe = new StringWriter();
        int pc = Main.run(new String[] {"plan", file.toString(), "--out", tmp.resolve("big-plan").toString(),
                "--screening-samples", "60", "--threads", "1"}, new PrintWriter(new StringWriter()), new PrintWriter(pe));
        assertEquals(2, pc, pe.toString());
        assertTrue(pe.toString().contains("give plan.limits for"), pe.toString());
    }

    @Test
    void runSheetPrecisionIsASettingOfTheStudy() throws IOException {
        // plan.precision: 0.5 nm for the absorber, 0.5 % for the coverage: every setting on those grids
        String study = Files.readString(DEMO).replace("  seed: 7", "  seed: 7\n  precision:\n"
                + "    stack.absorber.thickness: 0.5 nm\n    particles.coverage: 0.5 %");
        Path file = tmp.resolve("precision.yaml");
        Files.writeString(file, study);
        Path out = tmp.resolve("precision-out");
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"plan", file.toString(), "--out", out.toString(), "--screening-samples", "60",
                "--threads", "1"}, new PrintWriter(new StringWriter()), new PrintWriter(se));
        assertEquals(0, code, se.toString());
        List<String> sheet = Files.readAllLines(out.resolve("plan.csv"));
        List<String> header = List.of(sheet.get(0).split(","));
        int abs = header.indexOf("stack.absorber.thickness [nm]");
        int cov = header.indexOf("particles.coverage [%]");
        for (String line : sheet.subList(1, sheet.size())) {
            String[] f = line.split(",", -1);
            for (int c : new int[] {abs, cov}) {
                double twice = 2 * Double.parseDouble(f[c]);
                assertEquals(Math.rint(twice), twice, 1e-9, line);
            }
        }
        // a step of zero is bad input: one line naming the key, exit 2
        Path bad = tmp.resolve("precision-zero.yaml");
        Files.writeString(bad, study.replace("stack.absorber.thickness: 0.5 nm", "stack.absorber.thickness: 0 nm"));
        StringWriter be = new StringWriter();
        int bc = Main.run(new String[] {"plan", bad.toString(), "--out", tmp.resolve("never").toString()},
                new PrintWriter(new StringWriter()), new PrintWriter(be));
        assertEquals(2, bc, be.toString());
        assertTrue(be.toString().startsWith("precision-zero.yaml:") && be.toString().contains(
                "plan.precision.stack.absorber.thickness"), be.toString());
    }
}
