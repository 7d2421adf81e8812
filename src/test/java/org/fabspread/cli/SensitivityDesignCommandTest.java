package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The sensitivity defects of the main job, through the command a user types: the Sobol base size set on
 * the command line, both designs exported, Shapley effects and the correlated pair's group in the
 * summary, and a yield goal called reached only on its interval's lower bound.
 */
class SensitivityDesignCommandTest {

    @Test
    void sobolBaseOptionDesignsExportedShapleyAndGroupsInTheSummary(@TempDir Path tmp) throws IOException {
        Path out = tmp.resolve("run");
        StringWriter log = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"run", PipelineCommandsTest.DEMO.toString(), "--out", out.toString(),
            "--samples", "300", "--sobol-base", "32", "--threads", "2", "--no-report"}, new PrintWriter(log),
                new PrintWriter(err));
        assertEquals(0, code, err.toString());
        JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        int k = 9;
        // the option sets N; the design is N(k + 2 + 1 group) runs (Saltelli et al. 2010 plus one group matrix)
        assertEquals(32, s.get("sobol").get("n").asInt());
        assertEquals(32L * (k + 3), s.get("sobol").get("model_runs").asLong());
        assertEquals(1 + 32 * (k + 3), Files.readAllLines(out.resolve("sobol_design.csv")).size());
        // Shapley design: N_v + m (k − 1) N_o N_i rows with m = 4N, N_v = 8N (Song, Nelson & Staum 2016)
        assertEquals(1 + 8 * 32 + 4 * 32 * (k - 1) * 3, Files.readAllLines(out.resolve("shapley_design.csv")).size());
        JsonNode jsc = null;
        for (JsonNode o : s.get("shapley").get("outputs")) {
            if (o.get("output").asText().equals("jsc")) {
                jsc = o;
            }
        }
        double sum = 0;
        for (JsonNode e : jsc.get("effects")) {
            sum += e.get("share").asDouble();
        }
        // source: Owen (2014): Shapley effects sum to the variance (shares to 1)
        assertEquals(1.0, sum, 1e-9);
        JsonNode groups = s.get("sobol").get("outputs").get(0).get("groups");
        assertEquals("correlated: stack.etl.thickness + stack.absorber.thickness", groups.get(0).get("group").asText());
        assertTrue(s.get("sobol").get("note").asText().contains("depend on the order of the inputs"));
        assertTrue(s.has("sensitivity_not_converged"));
        JsonNode al = s.get("tolerance_allocation");
        // a goal is reached only when the lower bound of the predicted yield's interval meets it
        assertEquals(al.get("predicted_low").asDouble() >= al.get("goal").asDouble(), al.get("reached").asBoolean());
        JsonNode w = s.get("what_ifs").get(0).get("yields").get(0);
        assertTrue(w.get("change").has("low") && w.get("change").has("high"), w.toString());
        assertTrue(log.toString().contains("Shapley design"), log.toString());
    }

    private static Path withGroups(Path dir, String group) throws IOException {
        String text = Files.readString(PipelineCommandsTest.DEMO);
        String anchor = "  yield_goal: 95 %\n";
        assertTrue(text.contains(anchor));
        Path f = dir.resolve("study.yaml");
        Files.writeString(f, text.replace(anchor, anchor + "  groups:\n    particle process: " + group + "\n"));
        return f;
    }

    @Test
    void studyGroupsGetTheirOwnIndicesAndABadGroupIsOneLineExitTwo(@TempDir Path tmp) throws IOException {
        Path good = withGroups(tmp, "[particles.diameter, particles.size_cv, particles.coverage]");
        Path out = tmp.resolve("run");
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"run", good.toString(), "--out", out.toString(), "--samples", "200",
            "--sobol-base", "16", "--threads", "2", "--no-report"}, new PrintWriter(new StringWriter()),
                new PrintWriter(err));
        assertEquals(0, code, err.toString());
        JsonNode groups = new ObjectMapper().readTree(out.resolve("summary.json").toFile()).get("sobol").get("outputs")
                .get(0).get("groups");
        assertEquals("particle process", groups.get(0).get("group").asText());
        assertEquals(3, groups.get(0).get("inputs").size());
        assertEquals("correlated: stack.etl.thickness + stack.absorber.thickness", groups.get(1).get("group").asText());

        Path badDir = Files.createDirectory(tmp.resolve("bad"));
        Path bad = withGroups(badDir, "[particles.diameter, particles.sise_cv]");
        Path badOut = tmp.resolve("bad-run");
        StringWriter err2 = new StringWriter();
        int code2 = Main.run(new String[] {"run", bad.toString(), "--out", badOut.toString()},
                new PrintWriter(new StringWriter()), new PrintWriter(err2));
        assertEquals(2, code2);
        String line = err2.toString().strip();
        assertTrue(line.startsWith("fabspread: study.yaml:") && line.contains("analysis.groups.particle process[1]: unknown input"
                + " 'particles.sise_cv'"), line);
        assertEquals(1, line.lines().count(), line);
        assertTrue(!Files.exists(badOut), "no output folder for bad input");
    }
}
