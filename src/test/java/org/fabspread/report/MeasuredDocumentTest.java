package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;

import org.fabspread.plan.EffectAnalysis;
import org.fabspread.plan.Factor;
import org.fabspread.plan.MeasuredReport;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;

/** The measured-results document from analyses of synthetic two-level runs with known effects. */
class MeasuredDocumentTest {

    private static final List<String> IDS = List.of("stack.absorber.thickness", "stack.etl.thickness",
            "particles.coverage", "particles.diameter");
    private static Study study;

    @BeforeAll
    static void read() {
        study = StudyReader.read(Path.of("demo-studies/pilot-line-inverted.yaml"));
    }

    private static List<Factor> factors(int k) {
        List<Factor> f = new ArrayList<>();
        f.add(new Factor(IDS.get(0), "nm", 100, 5, 90, 110, "nominal -/+ 2 sigma"));
        f.add(new Factor(IDS.get(1), "nm", 40, 2, 34, 46, "limits"));
        f.add(new Factor(IDS.get(2), "fraction", 0.06, 0.0075, 0.045, 0.075, "nominal -/+ 2 sigma"));
        f.add(new Factor(IDS.get(3), "nm", 20, 1.6, 16.8, 23.2, "nominal -/+ 2 sigma"));
        return f.subList(0, k);
    }

    /**
     * Runs of a full 2^k factorial, {@code reps} replicates, y = 10 + 1.5 A − 0.8 B + 0.6 AB + noise, so that
     * the effects (high mean minus low mean) are 3.0, −1.6 and 1.2.
     */
    private static MeasuredReport report(int k, int reps, long seed) {
        int n = (1 << k) * reps;
        double[][] x = new double[n][k];
        double[] y = new double[n];
        Random rng = new Random(seed);
        for (int r = 0; r < n; r++) {
            int p = r % (1 << k);
            for (int i = 0; i < k; i++) {
                x[r][i] = ((p >> i) & 1) == 1 ? 1 : -1;
            }
            y[r] = 10 + 1.5 * x[r][0] - 0.8 * x[r][1] + 0.6 * x[r][0] * x[r][1] + 0.05 * rng.nextGaussian();
        }
        EffectAnalysis.Result a = EffectAnalysis.analyse(x, y, IDS.subList(0, k), Map.of("A", 3.0, "B", -1.6, "AB", 1.2),
                0.05);
        return new MeasuredReport(study.name(), "plan-measured.csv", "jsc", "mA/cm^2", factors(k), a, null,
                List.of("calibration: none asked for in this test"));
    }

    private static Table table(ReportDocument d, String start) {
        for (Section s : d.sections()) {
            for (Block b : s.blocks()) {
                if (b instanceof Table t && t.caption().startsWith(start)) {
                    return t;
                }
            }
        }
        throw new AssertionError("no table " + start);
    }

    @Test
    void unreplicatedPlanShowsLenthAndTheHalfNormalPlot() throws Exception {
        MeasuredReport m = report(4, 1, 11);
        ReportDocument d = MeasuredDocument.build(study, m, null);
        assertEquals(List.of(MeasuredDocument.MEASURED, MeasuredDocument.EFFECTS, MeasuredDocument.CALIBRATION,
                MeasuredDocument.LIMITS), d.sections().stream().map(Section::id).toList());
        Table effects = table(d, "Effects on J_sc");
        List<String> a = effects.rows().stream().filter(r -> r.get(0).equals("A")).findFirst().orElseThrow();
        // source: Box, Hunter & Hunter, Statistics for Experimenters (2005), ch. 5: effect = 2 × coefficient of the ±1 coding
        double estA = m.analysis().effects().stream().filter(e -> e.label().equals("A")).findFirst().orElseThrow().estimate();
        assertEquals(3.0, estA, 0.1);
        assertEquals(Numbers.num3(estA), a.get(2));
        assertEquals(Numbers.num3(3.0), a.get(3));
        assertEquals("yes", a.get(7));
        // Lenth's statistics, as computed by the analysis (Lenth, Technometrics 31, 469 (1989))
        assertTrue(m.analysis().lenth() != null);
        Section eff = d.sections().get(1);
        String me = eff.blocks().stream().filter(b -> b instanceof KeyValues).map(b -> (KeyValues) b)
                .flatMap(kv -> kv.pairs().stream()).filter(p -> p.key().startsWith("Margin of error ME"))
                .findFirst().orElseThrow().value();
        assertEquals(Numbers.num3(m.analysis().lenth().me()) + " mA/cm²", me);
        Figure hn = d.figures().get(0);
        assertEquals("half-normal", hn.chart().name());
        assertEquals(15, hn.chart().pointCount());
        assertTrue(hn.chart().seriesCount() >= 3, hn.chart().seriesNames().toString());
        assertFalse(hn.caption().contains("for reference"));
        Document parsed = HtmlRendererTest.parse(new HtmlRenderer().render(d));
        assertEquals(1, parsed.getElementsByTagName("img").getLength());
    }

    @Test
    void replicatedPlanShowsAnovaAndStatesTheLimits() {
        MeasuredReport m = report(3, 2, 12);
        assertTrue(m.analysis().lenth() == null);
        ReportDocument d = MeasuredDocument.build(study, m, null);
        Table anova = table(d, "Analysis of variance");
        assertEquals(m.analysis().anova().size(), anova.rows().size());
        // the half-normal plot still shows Lenth's margins, and says they are for reference only
        Figure hn = d.figures().get(0);
        assertTrue(hn.caption().contains("for reference"));
        Section limits = d.sections().get(3);
        long cautions = limits.blocks().stream().filter(b -> b instanceof Caution).count();
        // common practice: every report ends with the model's limits and the safety cautions
        assertEquals(3, cautions);
        assertTrue(limits.blocks().stream().anyMatch(b -> b instanceof BulletList l
                && l.items().stream().anyMatch(s -> s.contains("laterally homogeneous"))));
        Paragraph summary = (Paragraph) d.sections().get(1).blocks().get(0);
        assertTrue(summary.text().contains("The model predicted the direction of"), summary.text());
    }
}
