package org.fabspread.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;
import org.fabspread.model.Evaluator;
import org.fabspread.study.PlanSettings;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class PlanJobTest {

    @TempDir
    Path dir;

    @Test
    void planJobWritesARunSheetAndPredictsTheClosedFormEffects() throws Exception {
        Study study = Fixtures.study(Fixtures.settings(List.of(), 40, PlanSettings.Kind.AUTO, 0, 2, 1, 0, Double.NaN));
        Fixtures.Space space = new Fixtures.Space(study);
        Fixtures.ClosedForm model = new Fixtures.ClosedForm(space.ids());
        PlanReport r = PlanJob.run(study, model, space, Fixtures.ranking(), dir);
        // 90 % of the summed indices (0.991): absorber, quenching, etl, k_scale -> four factors, resolution IV
        // smallest: 2^(4-1) in 8 runs
        assertEquals(List.of("stack.absorber.thickness", "collection.quenching_distance", "stack.etl.thickness",
                "stack.absorber.k_scale"), r.factors().stream().map(Factor::id).toList());
        assertEquals("IV", r.resolution());
        assertEquals(2, r.leftOut().size());
        // predicted main effects: closed form, factor +/- 2 sigma, others nominal (eta = 0.9):
        // A: absorber 0.9*0.05*16 + 3*(k-1)*... (k nominal 1) = 0.72; B: quenching -0.9*0.4*4 = -1.44;
        // C: etl -0.9*0.03*8 = -0.216; D: k_scale 3*0.2*(t_a/100)^2 averaged over t_a = 92, 108
        double[] expected = {0.72, -1.44, -0.216, 0.6 * (0.92 * 0.92 + 1.08 * 1.08) / 2};
        for (int i = 0; i < 4; i++) {
            assertEquals(expected[i], r.predictions().get(i).effect(), 1e-9, r.predictions().get(i).term());
        }
        // noise: the uncontrolled inputs eta (sd 0.02) and V (sd 0.02) add sd sqrt((0.02*10)^2 + (0.5*0.02)^2)
        // at the centre of the process window (closed form; Monte Carlo within ~10 %)
        double sigma = Math.hypot(0.2, 0.01);
        assertEquals(sigma, r.power().sigmaNoise(), 0.12 * sigma);
        assertTrue(r.power().replicates() >= 1);
        assertEquals(r.runs(), 8 * r.power().replicates() + 2);
        String csv = Files.readString(dir.resolve("plan.csv"), StandardCharsets.UTF_8);
        String header = csv.lines().findFirst().orElseThrow();
        assertEquals("run,std_order,block,stack.absorber.thickness [nm],collection.quenching_distance [nm],"
                + "stack.etl.thickness [nm],stack.absorber.k_scale [1],measured_jsc [mA/cm^2],notes", header);
        assertTrue(csv.contains(",92,") && csv.contains(",108,"), csv);
        JsonNode json = new ObjectMapper().readTree(dir.resolve("plan.json").toFile());
        assertEquals("IV", json.get("resolution").asText());
        assertEquals("I = ABCD", json.get("aliases").get("definingRelation").asText());
        String txt = Files.readString(dir.resolve("plan.txt"));
        assertTrue(txt.contains("AB + CD"));
        assertTrue(txt.contains("Left out"));
    }

    @Test
    void measuredJobAnalysesAFilledSheetAndCalibratesTheInputs() throws Exception {
        // common practice: simulate the measurement with the closed-form model at eta = 0.85 (k at nominal)
        // plus Gaussian noise (sd 0.02, fixed seed). In J_sc alone eta and the k scale act almost alike (both
        // scale the current), so k is held at nominal, said in one sentence, and eta is recovered within
        // its 95 % interval, which stays inside [0, 1]
        Study study = Fixtures.study(Fixtures.settings(List.of("stack.absorber.thickness", "collection.quenching_distance",
                "stack.etl.thickness"), 0, PlanSettings.Kind.FULL_FACTORIAL, 0, 3, 1, 2, Double.NaN));
        Fixtures.Space space = new Fixtures.Space(study);
        Fixtures.ClosedForm model = new Fixtures.ClosedForm(space.ids());
        PlanReport r = PlanJob.run(study, model, space, List.of(), dir);
        assertEquals(19, r.runs());
        Path sheet = dir.resolve("plan.csv");
        List<String> lines = Files.readAllLines(sheet);
        List<String> header = List.of(lines.get(0).split(",", -1));
        int[] fcol = {header.indexOf("stack.absorber.thickness [nm]"), header.indexOf("collection.quenching_distance [nm]"),
                header.indexOf("stack.etl.thickness [nm]")};
        int mcol = header.indexOf("measured_jsc [mA/cm^2]");
        double[] truth = new double[space.dimension()];
        for (int i = 0; i < truth.length; i++) {
            truth[i] = space.marginals().get(i).nominal();
        }
        int iEta = space.ids().indexOf("collection.dissociation");
        int iK = space.ids().indexOf("stack.absorber.k_scale");
        truth[iEta] = 0.85;
        truth[iK] = 1.0;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(2024L);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        Evaluator ev = model.newEvaluator();
        double[] y = new double[2];
        List<String> filled = new ArrayList<>();
        filled.add(lines.get(0));
        for (int l = 1; l < lines.size(); l++) {
            String[] c = lines.get(l).split(",", -1);
            double[] x = truth.clone();
            x[space.ids().indexOf("stack.absorber.thickness")] = Double.parseDouble(c[fcol[0]]);
            x[space.ids().indexOf("collection.quenching_distance")] = Double.parseDouble(c[fcol[1]]);
            x[space.ids().indexOf("stack.etl.thickness")] = Double.parseDouble(c[fcol[2]]);
            ev.evaluate(x, y);
            c[mcol] = Double.toString(y[0] + 0.02 * g.sample());
            filled.add(String.join(",", c));
        }
        Path measured = dir.resolve("filled.csv");
        Files.write(measured, filled);
        MeasuredReport m = MeasuredJob.run(study, model, space, measured, dir);
        EffectAnalysis.Result a = m.analysis();
        assertEquals(2 * 8 - 8 + 2, a.pureErrorDof(), 1e-12);
        // the absorber effect at eta = 0.85: 0.85*0.05*16 = 0.68
        EffectAnalysis.Estimate eA = a.effects().get(0);
        assertEquals("A", eA.label());
        assertEquals(0.68, eA.estimate(), 0.03);
        assertEquals(0.72, eA.predicted(), 1e-9);
        assertTrue(eA.active());
        Calibration.Result c = m.calibration();
        assertNotNull(c);
        assertEquals(List.of("collection.dissociation"), c.ids());
        assertEquals(List.of("stack.absorber.k_scale"), c.heldAtNominal());
        assertTrue(c.identifiability().startsWith("The runs cannot tell collection.dissociation from "
                + "stack.absorber.k_scale in jsc alone"), c.identifiability());
        assertTrue(c.maxCorrelation() > Identifiability.MAX_CORRELATION, "correlation " + c.maxCorrelation());
        assertTrue(c.lower()[0] < 0.85 && 0.85 < c.upper()[0], c.lower()[0] + " " + c.upper()[0]);
        assertTrue(c.lower()[0] >= 0 && c.upper()[0] <= 1);
        assertTrue(c.excludesNominal(0), "0.85 is far from the nominal 0.9 with sd 0.02 noise");
        assertEquals(0.02, c.residualSd(), 0.01);
        assertTrue(Files.readString(dir.resolve("measured.txt")).contains("Calibrated inputs"));
        assertNotNull(new ObjectMapper().readTree(dir.resolve("measured.json").toFile()).get("analysis"));
    }

    @Test
    void aMissingMeasuredValueNamesFileLineAndColumn() throws Exception {
        Study study = Fixtures.study(Fixtures.settings(List.of("stack.absorber.thickness", "stack.etl.thickness"), 0,
                PlanSettings.Kind.FULL_FACTORIAL, 0, 0, 1, 1, Double.NaN));
        Fixtures.Space space = new Fixtures.Space(study);
        Fixtures.ClosedForm model = new Fixtures.ClosedForm(space.ids());
        PlanJob.run(study, model, space, List.of(), dir);
        List<String> lines = Files.readAllLines(dir.resolve("plan.csv"));
        List<String> out = new ArrayList<>();
        out.add(lines.get(0));
        for (int l = 1; l < lines.size(); l++) {
            String[] c = lines.get(l).split(",", -1);
            c[5] = l == 3 ? "" : "12.5";
            out.add(String.join(",", c));
        }
        Path f = dir.resolve("sheet.csv");
        Files.write(f, out);
        StudyException e = assertThrows(StudyException.class, () -> MeasuredJob.run(study, model, space, f, dir));
        assertEquals("sheet.csv:4: measured_jsc [mA/cm^2]: missing value", e.getMessage());
        out.set(2, out.get(2).replaceFirst(",12.5,", ",12.5x,"));
        Files.write(f, out);
        e = assertThrows(StudyException.class, () -> MeasuredJob.run(study, model, space, f, dir));
        assertEquals("sheet.csv:3: measured_jsc [mA/cm^2]: not a number: '12.5x'", e.getMessage());
    }

    @Test
    void advisorShrinksToTheBudgetAndExplains() {
        // budget 10 runs, resolution V wanted: 2^(5-1) needs 16, so factors are dropped to four... a 2^4 needs 16
        // too, three factors give a 2^3 full factorial in 8 runs
        PlanSettings s = Fixtures.settings(List.of(), 10, PlanSettings.Kind.AUTO, 5, 0, 1, 0, Double.NaN);
        PlanAdvisor.Advice a = PlanAdvisor.advise(Fixtures.ranking(), s);
        assertEquals(3, a.factorIds().size());
        assertEquals(8, a.design().size());
        assertTrue(a.explanation().contains("dropped to fit the budget of 10 runs"), a.explanation());
        // no wish, large budget, seven factors -> resolution IV in 16 runs
        List<RankedInput> seven = new ArrayList<>();
        for (int i = 0; i < 7; i++) {
            seven.add(new RankedInput("x" + i, 1.0 / (i + 2)));
        }
        PlanSettings s2 = new PlanSettings(List.of(), 0, 2, List.of(), PlanSettings.Kind.AUTO, 0, 0, 1, 0, Double.NaN,
                "jsc", 0.05, 0.8, 1);
        PlanAdvisor.Advice a2 = PlanAdvisor.advise(seven, s2);
        int k = a2.factorIds().size();
        assertEquals(a2.design().regular().resolution() >= 4, true);
        assertEquals(MinimumAberrationCatalog.smallest(k, 4).orElseThrow().runs(), a2.design().size());
        // a tight budget lowers the resolution to III
        PlanSettings s3 = new PlanSettings(List.of("a", "b", "c", "d", "e"), 8, 2, List.of(), PlanSettings.Kind.AUTO, 0, 0,
                1, 0, Double.NaN, "jsc", 0.05, 0.8, 1);
        PlanAdvisor.Advice a3 = PlanAdvisor.advise(List.of(), s3);
        assertEquals(3, a3.resolution());
        assertTrue(a3.explanation().contains("resolution III"));
    }
}
