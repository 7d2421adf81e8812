package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Base64;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.fabspread.analysis.SobolResult;
import org.fabspread.analysis.YieldResult;
import org.fabspread.device.Spectra;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.pipeline.StudyRun;
import org.fabspread.sampling.RunSummary;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/**
 * The whole pipeline on the pilot-line demo study at small sizes (256 samples, Sobol base 32, 100
 * bootstrap resamples, 2 threads): the report's key numbers are the run's, every chart has data, the
 * HTML parses and embeds every chart, and a hostile study name shows only escaped.
 */
class DemoReportTest {

    private static final String EVIL = "<script>alert(1)</script>";

    @TempDir
    static Path dir;

    private static StudyResults results;
    private static ReportDocument doc;
    private static String html;
    private static JsonNode summaryJson;
    private static RunSummary summary;

    @BeforeAll
    static void run() throws Exception {
        Path file = Path.of("demo-studies/pilot-line-inverted.yaml");
        Study s = StudyReader.read(file);
        AnalysisSettings a = s.analysis();
        AnalysisSettings small = new AnalysisSettings(256, a.seed(), a.sampler(), a.sensitivity(), 32, 100,
                a.onFailure(), a.whatIfs(), a.yieldGoal(), a.confidence(), a.planarReference());
        Study study = new Study(s.file(), s.name(), s.description(), s.grid(), s.stack(), s.particles(),
                s.collection(), s.diode(), s.targets(), small, s.plan(), s.costs(), s.correlations());
        Path out = dir.resolve("run");
        StudyRun.Outcome o = new StudyRun(study, file, out,
                StudyRun.Options.of(256, null, 2, false, "fabspread run " + file), new PrintWriter(Writer.nullWriter()))
                .run();
        assertTrue(o.completed());
        results = o.results();
        doc = StudyReport.build(results);
        html = new HtmlRenderer().render(doc);
        summary = RunSummary.read(out.resolve("summary.json"));
        summaryJson = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
    }

    private static Section section(ReportDocument d, String id) {
        return d.sections().stream().filter(x -> x.id().equals(id)).findFirst().orElseThrow();
    }

    private static String value(Section s, String key) {
        for (Block b : s.blocks()) {
            if (b instanceof KeyValues kv) {
                for (KeyValues.Pair p : kv.pairs()) {
                    if (p.key().equals(key)) {
                        return p.value();
                    }
                }
            }
        }
        throw new AssertionError("no key '" + key + "' in section " + s.id());
    }

    private static Table table(Section s, String captionStart) {
        for (Block b : s.blocks()) {
            if (b instanceof Table t && t.caption().startsWith(captionStart)) {
                return t;
            }
        }
        throw new AssertionError("no table '" + captionStart + "' in section " + s.id());
    }

    @Test
    void opensWithTheAnswer() {
        // common practice: a design review opens with the decision and its uncertainty, then the evidence
        Section v = doc.sections().get(0);
        assertEquals(StudyReport.VERDICT, v.id());
        Section f = section(doc, StudyReport.FINDINGS);
        String key = "Yield, " + StudyReport.target(results.study().targets().get(0));
        YieldResult.YieldLine line = results.yield().perTarget().get(0);
        assertTrue(value(v, key).startsWith(Numbers.pct(line.yield()) + " of devices"), value(v, key));
        assertTrue(value(v, key).contains(Numbers.pctRange(line.wilsonLow(), line.wilsonHigh())), value(v, key));
        assertTrue(value(f, key).startsWith(Numbers.pct(line.yield())));
        // the particles against the planar stack, from the same samples: sign and interval
        double[] jsc = results.table().output("jsc");
        double[] planar = results.table().output("jsc_planar");
        PlanarComparison c = PlanarComparison.of(jsc, planar, results.summary().confidence());
        String buy = value(v, "What the particles buy");
        assertTrue(buy.startsWith(c.mean() >= 0 ? "the particles add " : "the particles cost "), buy);
        assertTrue(buy.contains(Numbers.num3(Math.abs(c.mean())) + " mA/cm²"), buy);
        assertTrue(c.low() <= c.mean() && c.mean() <= c.high());
        // only contributors whose interval excludes zero are named
        String drivers = value(v, "What drives the spread");
        for (SobolResult.IndexEstimate e : results.sobol().output("jsc").indices()) {
            if (drivers.contains(e.input() + " ")) {
                assertTrue(e.totalLow() > 0, e.input() + " is named but its interval reaches zero");
            }
        }
        assertTrue(value(v, "Proposed experiments").contains(results.plan().runs() + " runs"));
    }

    @Test
    void everyOutputHasItsStatisticsAndTheDeviceOutputsTheirSpread() {
        Section o = section(doc, StudyReport.OUTPUTS);
        Table t = table(o, "Every output");
        assertEquals(results.outputs().size(), t.rows().size());
        List<String> charts = new ArrayList<>();
        for (Block b : o.blocks()) {
            if (b instanceof Figure fig) {
                charts.add(fig.chart().name());
            }
        }
        for (String id : List.of("voc", "ff", "efficiency", "enhancement")) {
            assertTrue(charts.contains("distribution-" + id), charts.toString());
        }
    }

    @Test
    void yieldCurveMeetsTheCountedYieldAtTheTarget() {
        // the curve at the study's target is the counted yield (same samples, same rule)
        YieldResult.YieldLine line = results.yield().perTarget().get(0);
        double target = results.study().targets().get(0).value();
        double[] sorted = java.util.Arrays.stream(results.table().output("jsc")).filter(Double::isFinite).sorted().toArray();
        YieldCurve yc = YieldCurve.at(sorted, true, new double[] {target}, results.summary().confidence());
        assertEquals(line.yield(), yc.yield()[0], 1e-12);
        assertTrue(doc.figures().stream().anyMatch(fig -> fig.chart().name().equals("yield-curve-jsc")));
        assertTrue(doc.figures().stream().anyMatch(fig -> fig.chart().name().equals("tolerance-gain-per-cost")));
    }

    @Test
    void sectionsComeInReadingOrder() {
        // common practice: a design-review document reads from the question to the evidence
        assertEquals(List.of(StudyReport.VERDICT, StudyReport.STUDIED, StudyReport.FINDINGS, StudyReport.OUTPUTS,
                StudyReport.TIGHTEN, StudyReport.EXPERIMENTS, StudyReport.OPTICS, StudyReport.LIMITS,
                StudyReport.PROVENANCE),
                doc.sections().stream().map(Section::id).toList());
        assertEquals(results.study().name(), doc.title());
    }

    @Test
    void keyNumbersAreTheRunSummaryAsFormatted() {
        // source: summary.json written by the same run (RunSummary), formatted by Numbers
        Section f = section(doc, StudyReport.FINDINGS);
        RunSummary.OutputStats jsc = summary.outputs().stream().filter(o -> o.id().equals("jsc")).findFirst().orElseThrow();
        assertEquals(Numbers.num(jsc.mean()) + " ± " + Numbers.num3(jsc.sd()) + " mA/cm²", value(f, "J_sc mean ± sd"));
        assertEquals(jsc.mean(), summaryJson.get("outputs").get(0).get("mean").asDouble(), 0);
        RunSummary.YieldStats y = results.summary().yields().get(0);
        String yieldText = value(f, "Yield, " + StudyReport.target(results.study().targets().get(0)));
        assertTrue(yieldText.startsWith(Numbers.pct(y.yield()) + " (" + y.met() + " of " + y.n() + ";"), yieldText);
        assertTrue(yieldText.contains("Wilson " + Numbers.pctRange(y.lower(), y.upper())), yieldText);
        RunSummary.YieldStats all = results.summary().allTargets();
        assertTrue(value(f, "Yield, all targets").startsWith(Numbers.pct(all.yield())));
        String q = value(f, "J_sc 5 % / 50 % / 95 % quantiles");
        assertEquals(Numbers.num(StudyReport.quantile(jsc, 0.05)) + " / " + Numbers.num(StudyReport.quantile(jsc, 0.5))
                + " / " + Numbers.num(StudyReport.quantile(jsc, 0.95)) + " mA/cm²", q);
        double nominal = results.nominal("jsc");
        assertEquals(Numbers.num3(nominal - jsc.mean()) + " mA/cm²", value(f, "Current the scatter costs (nominal − mean)"));
        long failed = summary.samplesRequested() - summary.samplesOk();
        assertTrue(value(f, "Failed samples").startsWith(failed == 0 ? "none" : Long.toString(failed)),
                value(f, "Failed samples"));
    }

    @Test
    void topSobolIndexIsSummaryJsonsAsFormatted() {
        // source: the "sobol" section of summary.json written by the same run
        JsonNode out = null;
        for (JsonNode o : summaryJson.get("sobol").get("outputs")) {
            if (o.get("output").asText().equals("jsc")) {
                out = o;
            }
        }
        assertNotNull(out);
        JsonNode top = null;
        for (JsonNode e : out.get("indices")) {
            if (top == null || e.get("total").asDouble() > top.get("total").asDouble()) {
                top = e;
            }
        }
        Table t = table(section(doc, StudyReport.FINDINGS), "Variance contributions to J_sc");
        List<String> row = t.rows().get(0);
        assertEquals(top.get("input").asText(), row.get(0));
        assertEquals(Numbers.pct(top.get("first").asDouble()) + " (" + Numbers.pctRange(top.get("first_low").asDouble(),
                top.get("first_high").asDouble()) + ")", row.get(1));
        assertEquals(Numbers.pct(top.get("total").asDouble()) + " (" + Numbers.pctRange(top.get("total_low").asDouble(),
                top.get("total_high").asDouble()) + ")", row.get(2));
        assertTrue(row.get(3).startsWith(top.get("input").asText()), row.get(3));
        // the scatter plots follow the same order
        List<SobolResult.IndexEstimate> e = new ArrayList<>(results.sobol().output("jsc").indices());
        e.sort(Comparator.comparingDouble(SobolResult.IndexEstimate::total).reversed());
        assertTrue(doc.figures().stream().anyMatch(f -> f.chart().name().equals("scatter-jsc-1")
                && f.chart().xAxisTitle().startsWith(e.get(0).input())));
    }

    @Test
    void nominalCurrentAgreesWithTheSpectra() {
        // source: device-model.md §5, J_sc = q Σ Φ(λ) EQE(λ) over the grid (photons m⁻² s⁻¹ · C = A/m² = 0.1 mA/cm²)
        Spectra s = results.nominalSpectra();
        double sum = 0;
        for (int i = 0; i < s.size(); i++) {
            sum += s.photonFlux()[i] * s.absorberEqe()[i];
        }
        double jsc = 0.1 * 1.602176634e-19 * sum;
        assertEquals(results.nominal("jsc"), jsc, 2e-3 * jsc);
        Table budget = table(section(doc, StudyReport.OPTICS), "Photon budget");
        assertTrue(budget.rows().stream().anyMatch(r -> r.get(0).equals("jsc") && r.get(2).equals(Numbers.num(results.nominal("jsc")))));
    }

    @Test
    void everyChartHasDataAndTheExpectedOnesAreThere() {
        // common practice: a figure without data must not reach a design review
        List<String> names = doc.figures().stream().map(f -> f.chart().name()).toList();
        for (String n : List.of("histogram-jsc", "scatter-jsc-1", "scatter-jsc-2", "scatter-jsc-3", "sobol-jsc",
                "sobol-convergence-jsc", "tolerance-ranking", "allocation-tradeoff", "plan-predicted-effects",
                "absorption-spectra", "generation-profile", "particle-cross-sections")) {
            assertTrue(names.contains(n), n + " missing from " + names);
        }
        for (Figure f : doc.figures()) {
            assertTrue(f.chart().pointCount() > 0, f.chart().name());
            assertTrue(f.chart().png().length > 1000, f.chart().name());
            assertFalse(f.caption().isBlank());
        }
    }

    @Test
    void htmlParsesAndEmbedsEveryChart() throws Exception {
        // common practice: one self-contained, well-formed file
        Document d = HtmlRendererTest.parse(html);
        NodeList imgs = d.getElementsByTagName("img");
        assertEquals(doc.figures().size(), imgs.getLength());
        for (int i = 0; i < imgs.getLength(); i++) {
            String src = ((Element) imgs.item(i)).getAttribute("src");
            assertTrue(src.startsWith("data:image/png;base64,"));
            assertArrayEquals(doc.figures().get(i).chart().png(),
                    Base64.getDecoder().decode(src.substring("data:image/png;base64,".length())));
        }
        Path written = ReportWriter.write(doc, dir.resolve("report"));
        assertTrue(Files.size(written) > 0);
        for (Figure f : doc.figures()) {
            assertTrue(Files.exists(dir.resolve("report/charts/" + f.chart().name() + ".png")));
        }
    }

    @Test
    void limitsAndCautionsAreStated() {
        // source: device-model.md §4.5 "Limits to state in every report" and §5 (voltage-independent photocurrent)
        Section s = section(doc, StudyReport.LIMITS);
        StringBuilder text = new StringBuilder();
        int cautions = 0;
        for (Block b : s.blocks()) {
            if (b instanceof BulletList l) {
                l.items().forEach(x -> text.append(x).append('\n'));
            } else if (b instanceof Caution c) {
                cautions++;
                text.append(c.text()).append('\n');
            }
        }
        String t = text.toString().toLowerCase(Locale.ROOT);
        for (String must : List.of("point-dipole", "image field", "laterally homogeneous", "guided-mode",
                "lorentz", "maxwell garnett", "ray optics", "does not depend on voltage", "independent underlying",
                "reweight", "not a certification", "safety", "regulations", "suggested experiments")) {
            assertTrue(t.contains(must), must);
        }
        assertEquals(3, cautions);
        // the recommendation names an input and says how sure it is
        Paragraph rec = (Paragraph) section(doc, StudyReport.TIGHTEN).blocks().get(0);
        assertTrue(rec.text().contains(results.ranking().entries().get(0).input()), rec.text());
        assertTrue(rec.text().contains("effective samples"), rec.text());
    }

    @Test
    void aHostileStudyNameShowsOnlyEscaped() throws Exception {
        // common practice (OWASP XSS prevention): user text is escaped, never interpreted
        Study s = results.study();
        Study evil = new Study(s.file(), EVIL, EVIL, s.grid(), s.stack(), s.particles(), s.collection(), s.diode(),
                s.targets(), s.analysis(), s.plan(), s.costs(), s.correlations());
        StudyResults r = new StudyResults(evil, results.provenance(), results.outputs(), results.summary(),
                results.table(), results.yield(), results.capabilities(), results.screening(), results.sobol(),
                results.whatIfs(), results.ranking(), results.allocation(), null, results.nominalSpectra(), null,
                results.notes(), results.nominalOutputs());
        ReportDocument d = StudyReport.build(r);
        String h = new HtmlRenderer().render(d);
        assertFalse(h.toLowerCase(Locale.ROOT).contains("<script"));
        assertTrue(h.contains("&lt;script&gt;alert(1)&lt;/script&gt;"));
        Document parsed = HtmlRendererTest.parse(h);
        assertEquals(EVIL, parsed.getElementsByTagName("title").item(0).getTextContent());
        assertEquals(0, parsed.getElementsByTagName("script").getLength());
        String md = new MarkdownRenderer().render(d);
        assertFalse(md.contains(EVIL));
    }

    @Test
    void withoutASobolDesignTheScreeningIsShownAndSaysItHasNoIntervals() {
        // source: statistics-and-doe.md (given-data first-order indices carry no interval of their own)
        StudyResults r = new StudyResults(results.study(), results.provenance(), results.outputs(), results.summary(),
                results.table(), results.yield(), results.capabilities(), results.screening(), null,
                results.whatIfs(), results.ranking(), results.allocation(), results.plan(), results.nominalSpectra(),
                results.crossSections(), results.notes(), results.nominalOutputs());
        ReportDocument d = StudyReport.build(r);
        Figure f = d.figures().stream().filter(x -> x.chart().name().equals("screening-jsc")).findFirst().orElseThrow();
        assertTrue(f.caption().contains("no intervals"), f.caption());
        assertEquals(results.screening().output("jsc").inputs().size(), f.chart().pointCount());
        assertTrue(d.figures().stream().noneMatch(x -> x.chart().name().startsWith("sobol")));
    }

    @Test
    void aProcessCentredBelowTheTargetIsCalledOut() {
        // common practice: yield below 50 % with a one-sided spec means the mean misses the target
        RunSummary.OutputStats jsc = StudyReport.stats(summary, "jsc");
        String rec = StudyReport.recommendation(results);
        assertEquals(jsc.mean() < results.study().targets().get(0).value(), rec.contains("misses the target"), rec);
    }
}
