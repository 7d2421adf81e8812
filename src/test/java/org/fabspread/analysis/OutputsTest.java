package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.AnalysisSettings.WhatIf.Kind;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class OutputsTest {

    private static final Map<String, DistributionSpec> SPECS = Map.of("x1", new DistributionSpec.Normal(10, 1),
            "x2", new DistributionSpec.Normal(2, 0.5));
    private static final InputSpace SPACE = TestSpaces.Independent.of(SPECS.get("x1"), SPECS.get("x2"));
    private static final TestModels.Linear MODEL = new TestModels.Linear(new double[] {2, 1});
    private static final List<Target> TARGETS = List.of(
            new Target("y", true, 21, "mA/cm^2", SourceLocation.unknown("targets[0]")));

    @Test
    void sensitivityCsvHasOneRowPerOutputAndInput(@TempDir Path dir) throws Exception {
        SobolResult sobol = SobolIndices.compute(MODEL, SPACE, SobolIndices.Options.random(256, 1).withBootstrap(50),
                null);
        SampleTable table = TestSpaces.monteCarlo(MODEL, SPACE, 500, 2);
        ScreeningResult screening = Screening.of(table);
        Path f = dir.resolve(SensitivityCsv.FILE_NAME);
        SensitivityCsv.write(f, sobol, screening);
        List<String> lines = Files.readAllLines(f);
        assertEquals(SensitivityCsv.HEADER, lines.get(0));
        // 2 outputs x 2 inputs for each method
        assertEquals(1 + 4 + 4, lines.size());
        String[] row = lines.get(1).split(",", -1);
        assertEquals(9, row.length);
        assertEquals("y", row[0]);
        assertEquals("x1", row[1]);
        assertEquals(sobol.output("y").input("x1").first(), Double.parseDouble(row[2]), 0);
        assertEquals("sobol-saltelli-jansen-bootstrap", row[8]);
        String[] scr = lines.get(5).split(",", -1);
        assertEquals("", scr[3]);
        assertEquals("binned-correlation-ratio", scr[8]);
        assertEquals("\"a,b\"", SensitivityCsv.field("a,b"));
        try (var s = Files.list(dir)) {
            assertEquals(1, s.count(), "no temporary file left behind");
        }
    }

    @Test
    void resultsSerialiseToJsonAndTheSummaryReadsWell() throws Exception {
        SampleTable table = TestSpaces.monteCarlo(MODEL, SPACE, 4000, 3);
        SobolResult sobol = SobolIndices.compute(MODEL, SPACE, SobolIndices.Options.random(256, 1).withBootstrap(50),
                null);
        ScreeningResult screening = Screening.of(table);
        YieldResult yield = YieldEstimate.of(table, TARGETS, 0.95);
        Capability cap = YieldEstimate.capability(table, TARGETS.get(0));
        WhatIfResult ok = WhatIf.evaluate(table, SPACE, TARGETS,
                List.of(WhatIf.change("x1", SPECS.get("x1"), Kind.SCALE_SIGMA, 0.5, null)), WhatIf.Options.defaults());
        WhatIfResult refused = WhatIf.evaluate(table, SPACE, TARGETS,
                List.of(WhatIf.change("x2", SPECS.get("x2"), Kind.SCALE_SIGMA, 2, null)), WhatIf.Options.defaults());
        ToleranceRanking ranking = ToleranceAdvisor.rank(table, SPACE, TARGETS, SPECS, null, WhatIf.Options.defaults());
        ToleranceAllocation alloc = ToleranceAdvisor.allocate(table, SPACE, TARGETS, SPECS, Map.of("x1", 3.0), 0.9,
                WhatIf.Options.defaults());

        ObjectMapper json = new ObjectMapper();
        JsonNode s = json.readTree(json.writeValueAsString(sobol));
        assertEquals(256, s.get("n").asInt());
        assertEquals("x1", s.get("outputs").get(0).get("indices").get(0).get("input").asText());
        assertEquals(2, s.get("convergence").get(0).get("first").size());
        assertEquals(yield.all().yield(), json.readTree(json.writeValueAsString(yield)).get("all").get("yield").asDouble(), 0);
        JsonNode w = json.readTree(json.writeValueAsString(List.of(ok, refused)));
        assertTrue(w.get(1).get("rerunNeeded").asBoolean());
        assertTrue(json.readTree(json.writeValueAsString(ranking)).get("entries").get(0).has("yieldGain"));
        assertTrue(json.readTree(json.writeValueAsString(alloc)).get("curve").size() >= 1);
        assertTrue(json.readTree(json.writeValueAsString(screening)).get("outputs").get(0).has("rankRSquared"));
        assertTrue(json.readTree(json.writeValueAsString(cap)).has("skewness"));

        String text = TextSummary.render(yield, List.of(cap), sobol, screening, ranking, List.of(ok, refused), null, 5);
        assertTrue(text.startsWith("Yield (95 % intervals, n = 4000):"), text);
        assertTrue(text.contains("y >= 21.0 mA/cm^2"), text);
        assertTrue(text.contains("C_pk y >= 21.0"), text);
        assertTrue(text.contains("Variance contributions to y"), text);
        assertTrue(text.contains("Which tolerance to tighten"), text);
        assertTrue(text.contains("1. x1"), text);
        assertTrue(text.contains("x2: sigma x 2: not reweighted"), text);
        assertTrue(text.contains("needs a new run"), text);
    }
}
