package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;

class TailYieldTest {

    private static final NormalDistribution STD = new NormalDistribution(null, 0, 1);

    /** y = x1 + q x1² + x2 (mildly nonlinear for q = 0.1); throws for x2 above {@code breakAbove}. */
    record Quadratic(double q, double breakAbove) implements Model {
        @Override public List<String> inputIds() {
            return TestModels.ids(2);
        }

        @Override public List<OutputDef> outputs() {
            return List.of(new OutputDef("y", "1", "x1 + q x1^2 + x2"), new OutputDef("x2", "1", "x2"));
        }

        @Override public Evaluator newEvaluator() {
            return (x, out) -> {
                if (x[1] > breakAbove) {
                    throw new ModelException("out-of-range", "x2 above " + breakAbove);
                }
                out[0] = x[0] + q * x[0] * x[0] + x[1];
                out[1] = x[1];
            };
        }
    }

    private static Target atLeast(String out, double v) {
        return new Target(out, true, v, "mA/cm^2", SourceLocation.unknown("targets[0]"));
    }

    private static Target atMost(String out, double v) {
        return new Target(out, false, v, "1", SourceLocation.unknown("targets[1]"));
    }

    // y = x1 + 2 x2 + 3 x3 with x1 ~ N(10, 1), x2 ~ N(2, 0.5), x3 ~ N(0, 0.4)
    private static final double[] C = {1, 2, 3};
    private static final double[] SIGMA = {1, 0.5, 0.4};
    private static final InputSpace LINEAR_SPACE = TestSpaces.Independent.of(new DistributionSpec.Normal(10, 1),
            new DistributionSpec.Normal(2, 0.5), new DistributionSpec.Normal(0, 0.4));
    private static final double MU_Y = 14;
    private static final double SIGMA_Y = Math.sqrt(1 + 1 + 1.44);

    @Test
    void designPointOfTheLinearModelIsExact() {
        double beta = 4.265;
        double t = MU_Y - beta * SIGMA_Y;
        TailYieldResult.DesignPoint d = TailYield.designPoint(new TestModels.Linear(C), LINEAR_SPACE, atLeast("y", t),
                TailYield.Options.defaults());
        // derivation: x_i = μ_i + σ_i z_i, so g(z) = y − t = (μ_y − t) + a·z with a_i = c_i σ_i and |a| = σ_y;
        // the point of g = 0 nearest the origin is z* = −(μ_y − t) a/|a|², |z*| = (μ_y − t)/σ_y = β
        // source: Hasofer & Lind, J. Eng. Mech. Div. 100, 111 (1974) (the reliability index of a linear limit state)
        assertTrue(d.converged(), d.note());
        assertEquals(beta, d.beta(), 1e-6);
        for (int i = 0; i < 3; i++) {
            double a = C[i] * SIGMA[i];
            assertEquals(-beta * a / SIGMA_Y, d.coordinates().get(i).z(), 1e-6);
            assertEquals(-a / SIGMA_Y, d.coordinates().get(i).cosine(), 1e-6);
        }
        // the design point lies on the limit state: Σ c_i x_i* = t
        double y = 0;
        for (int i = 0; i < 3; i++) {
            y += C[i] * d.coordinates().get(i).value();
        }
        assertEquals(t, y, 1e-6);
        // source: closed form, P = Φ(−β) for a linear-Gaussian limit state
        assertEquals(STD.cumulativeProbability(-beta), d.formProbability(), 1e-12);
        // a linear limit state is solved by the first HL-RF step; the second confirms it
        assertTrue(d.iterations() <= 3, "iterations " + d.iterations());

        // the upper tail, y <= t: the design point flips to +β a/|a|
        TailYieldResult.DesignPoint up = TailYield.designPoint(new TestModels.Linear(C), LINEAR_SPACE,
                atMost("y", MU_Y + 3 * SIGMA_Y), TailYield.Options.defaults());
        assertEquals(3, up.beta(), 1e-6);
        assertEquals(3 * C[2] * SIGMA[2] / SIGMA_Y, up.coordinates().get(2).z(), 1e-6);
    }

    @Test
    void linearTailProbabilityOfOneInAHundredThousandIsRecovered() {
        double beta = 4.265;
        double t = MU_Y - beta * SIGMA_Y;
        // source: closed form, linear-Gaussian yield Φ((μ_y − t)/σ_y) (statistics-and-doe.md, "Yield against a
        // target"); Φ(−4.265) ≈ 1.0e-5 (from memory), cross-checked below by a numerical integral of φ
        double truth = STD.cumulativeProbability(-beta);
        double integral = new IterativeLegendreGaussIntegrator(8, 1e-12, 1e-20)
                .integrate(100_000, z -> Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI), beta, beta + 12);
        assertEquals(truth, integral, 1e-9 * truth);
        assertEquals(1.0e-5, truth, 0.01e-5);

        TestModels.Linear model = new TestModels.Linear(C);
        TailYieldResult r = TailYield.estimate(model, LINEAR_SPACE, List.of(atLeast("y", t)),
                TailYield.Options.defaults().withRuns(2000).withSeed(11).withConfidence(0.99));
        TailYieldResult.FailureLine all = r.all();
        assertTrue(all.low() <= truth && truth <= all.high(), all + " truth " + truth);
        assertTrue(all.relativeError() < 0.06, "relative error " + all.relativeError());
        assertEquals(1 - all.probability(), r.yield(), 0);
        assertTrue(r.yield() > 0.9999);
        assertTrue(r.all().failingDraws() > 500, "about half the shifted draws fail");
        assertTrue(r.searchRuns() < 30, "search runs " + r.searchRuns());
        assertTrue(r.plainRunsForSameError() > 1e7, "plain MC would need " + r.plainRunsForSameError());
        assertTrue(r.ess() > 1 && r.ess() < r.runs());

        // plain Monte Carlo with the same number of runs sees no failure at all (expected 0.02)
        SampleTable plain = TestSpaces.monteCarlo(model, LINEAR_SPACE, r.totalRuns(), 11);
        long fails = 0;
        for (double y : plain.output("y")) {
            fails += y < t ? 1 : 0;
        }
        assertEquals(0, fails);
    }

    @Test
    void mildlyNonlinearModelAgreesWithBruteForceMonteCarlo() {
        Quadratic model = new Quadratic(0.1, Double.POSITIVE_INFINITY);
        InputSpace space = TestSpaces.Independent.standard(2);
        double t = 5.0;
        // truth by a 1-D integral: P(y > t) = ∫ φ(x1) Φ̄(t − x1 − 0.1 x1²) dx1 (closed form in x2)
        double quad = new IterativeLegendreGaussIntegrator(8, 1e-10, 1e-16).integrate(100_000,
                x -> STD.density(x) * STD.cumulativeProbability(-(t - x - 0.1 * x * x)), -12, 12);
        TailYieldResult r = TailYield.estimate(model, space, List.of(atMost("y", t)),
                TailYield.Options.defaults().withRuns(4000).withSeed(5));
        // brute force: one million plain Monte Carlo runs (about 960 failures)
        int n = 1_000_000;
        SampleTable mc = TestSpaces.monteCarlo(model, space, n, 77);
        long fails = 0;
        for (double y : mc.output("y")) {
            fails += y > t ? 1 : 0;
        }
        double pMc = fails / (double) n;
        double seMc = Math.sqrt(pMc * (1 - pMc) / n);
        TailYieldResult.FailureLine is = r.all();
        double z = Stats.zFor(0.99);
        // source: two independent unbiased estimators of one probability differ by less than
        // z·sqrt(se1² + se2²) at the stated confidence (common practice)
        assertTrue(Math.abs(is.probability() - pMc) <= z * Math.hypot(is.se(), seMc),
                "IS " + is + " plain " + pMc + " ± " + seMc);
        assertTrue(Math.abs(is.probability() - quad) <= z * is.se(), "IS " + is + " integral " + quad);
        assertTrue(Math.abs(pMc - quad) <= z * seMc, "plain " + pMc + " integral " + quad);
        assertTrue(is.relativeError() < 0.05, "relative error " + is.relativeError());
        // the design point: minimise z1² + z2² on the limit state z2 = t − z1 − 0.1 z1², by a fine scan over z1
        TailYieldResult.DesignPoint d = r.designPoints().get(0);
        assertTrue(d.converged(), d.note());
        double best = Double.POSITIVE_INFINITY;
        double bestZ1 = 0;
        for (double z1 = -6; z1 <= 6; z1 += 1e-5) {
            double z2 = t - z1 - 0.1 * z1 * z1;
            double r2 = z1 * z1 + z2 * z2;
            if (r2 < best) {
                best = r2;
                bestZ1 = z1;
            }
        }
        assertEquals(Math.sqrt(best), d.beta(), 1e-6);
        assertEquals(bestZ1, d.coordinates().get(0).z(), 1e-4);
        // the limit state curves toward the origin, so the first-order Φ(−β) understates the failures
        assertTrue(d.formProbability() < quad, d.formProbability() + " vs " + quad);
    }

    @Test
    void intervalCoversTheTruthNearItsNominalRate() {
        double beta = 3.5;
        double t = MU_Y - beta * SIGMA_Y;
        double truth = STD.cumulativeProbability(-beta); // source: closed form Φ(−β)
        TestModels.Linear model = new TestModels.Linear(C);
        int reps = 300;
        int covered = 0;
        for (int s = 0; s < reps; s++) {
            TailYieldResult r = TailYield.estimate(model, LINEAR_SPACE, List.of(atLeast("y", t)),
                    TailYield.Options.defaults().withRuns(200).withSeed(1000 + s));
            covered += r.all().low() <= truth && truth <= r.all().high() ? 1 : 0;
        }
        // 95 % nominal; 300 replicates give a binomial sd of 1.3 %, so [0.91, 0.99] is about ±3 sd
        // source: binomial standard deviation sqrt(p(1 − p)/n) (common practice)
        double rate = covered / (double) reps;
        assertTrue(rate >= 0.91 && rate <= 0.99, "coverage " + rate);
    }

    @Test
    void twoTargetsGetTwoProposalComponentsAndTheUnionIsRight() {
        // outputs y = x1 + q x1² + x2 with q = 0 (so y ~ N(0, 2)) and x2 ~ N(0, 1): failure modes in different
        // directions, y > 4.5·√2 and x2 < −4.2
        Quadratic model = new Quadratic(0, Double.POSITIVE_INFINITY);
        InputSpace space = TestSpaces.Independent.standard(2);
        double b1 = 4.5;
        double b2 = 4.2;
        List<Target> targets = List.of(atMost("y", b1 * Math.sqrt(2)), atLeast("x2", -b2));
        TailYieldResult r = TailYield.estimate(model, space, targets,
                TailYield.Options.defaults().withRuns(6000).withSeed(3));
        double p1 = STD.cumulativeProbability(-b1); // source: closed form, y/√2 is standard normal
        double p2 = STD.cumulativeProbability(-b2); // source: closed form
        // P(A ∪ B) = p1 + p2 − P(A ∩ B); the intersection {x1 + x2 > 6.36, x2 < −4.2} needs x1 > 10.5, so its
        // probability is below Φ(−10.5) < 1e-25: negligible
        double union = p1 + p2;
        assertEquals(2, r.proposal().size());
        assertTrue(r.proposal().get(0).draws() > 0 && r.proposal().get(1).draws() > 0);
        assertEquals(b1, r.designPoints().get(0).beta(), 1e-5);
        assertEquals(b2, r.designPoints().get(1).beta(), 1e-5);
        double z = Stats.zFor(0.99);
        assertTrue(Math.abs(r.perTarget().get(0).probability() - p1) <= z * r.perTarget().get(0).se(),
                r.perTarget().get(0) + " vs " + p1);
        assertTrue(Math.abs(r.perTarget().get(1).probability() - p2) <= z * r.perTarget().get(1).se(),
                r.perTarget().get(1) + " vs " + p2);
        assertTrue(Math.abs(r.all().probability() - union) <= z * r.all().se(), r.all() + " vs " + union);
        assertEquals("any target", r.all().spec());
    }

    @Test
    void boundedAndCorrelatedInputsAreHandledThroughTheInputSpace() {
        // x1 ~ U(0, 1), x2 ~ N(0, 1), y = x1 + x2 (Quadratic with q = 0); P(y > t) = ∫₀¹ Φ̄(t − x1) dx1
        InputSpace mixed = TestSpaces.Independent.of(new DistributionSpec.Uniform(0, 1), new DistributionSpec.Normal(0, 1));
        double t = 4.8;
        double truth = new IterativeLegendreGaussIntegrator(8, 1e-12, 1e-18).integrate(100_000,
                x -> STD.cumulativeProbability(-(t - x)), 0, 1); // source: closed form in x2, integral over x1
        TailYieldResult r = TailYield.estimate(new Quadratic(0, Double.POSITIVE_INFINITY), mixed,
                List.of(atMost("y", t)), TailYield.Options.defaults().withRuns(3000).withSeed(2));
        double z = Stats.zFor(0.99);
        assertTrue(Math.abs(r.all().probability() - truth) <= z * r.all().se(), r.all() + " vs " + truth);
        assertTrue(truth < 1e-4 && r.all().relativeError() < 0.1, r.all().toString());

        // Gaussian copula with normal-score correlation 0.6 between two standard normals: y = x1 + x2 has
        // variance 2 + 2·0.6 = 3.2, P(y > t) = Φ(−t/√3.2)
        InputSpace corr = TestSpaces.Copula2.of(new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1),
                0.6);
        double tc = 4.3 * Math.sqrt(3.2);
        double truthC = STD.cumulativeProbability(-4.3); // source: closed form, variance of a sum
        TailYieldResult rc = TailYield.estimate(new Quadratic(0, Double.POSITIVE_INFINITY), corr,
                List.of(atMost("y", tc)), TailYield.Options.defaults().withRuns(3000).withSeed(2));
        // the copula maps independent z to x2 = 0.6 z1 + 0.8 z2, so y = 1.6 z1 + 0.8 z2, a linear limit state
        // in the independent space with β = tc/|(1.6, 0.8)| = 4.3
        assertEquals(4.3, rc.designPoints().get(0).beta(), 1e-5);
        assertTrue(Math.abs(rc.all().probability() - truthC) <= z * rc.all().se(), rc.all() + " vs " + truthC);
    }

    @Test
    void sameSeedSameResultWhateverTheThreads() {
        TestModels.Linear model = new TestModels.Linear(C);
        List<Target> targets = List.of(atLeast("y", MU_Y - 4 * SIGMA_Y));
        TailYield.Options o = TailYield.Options.defaults().withRuns(3000).withSeed(42);
        TailYieldResult a = TailYield.estimate(model, LINEAR_SPACE, targets, o.withThreads(1));
        TailYieldResult b = TailYield.estimate(model, LINEAR_SPACE, targets, o.withThreads(2));
        TailYieldResult c = TailYield.estimate(model, LINEAR_SPACE, targets, o.withThreads(1).withSeed(43));
        assertEquals(a, b);
        assertTrue(a.all().probability() != c.all().probability());
    }

    @Test
    void medianPointFailingMeansNoShift() {
        TestModels.Linear model = new TestModels.Linear(C);
        double t = MU_Y + 0.5 * SIGMA_Y;
        TailYieldResult r = TailYield.estimate(model, LINEAR_SPACE, List.of(atLeast("y", t)),
                TailYield.Options.defaults().withRuns(2000).withSeed(8));
        TailYieldResult.DesignPoint d = r.designPoints().get(0);
        assertEquals(0, d.beta(), 0);
        assertTrue(d.note().contains("not rare"), d.note());
        // unshifted draws: every weight is 1, so the ESS is n
        assertEquals(2000, r.ess(), 1e-9);
        double truth = STD.cumulativeProbability(0.5); // source: closed form Φ((t − μ_y)/σ_y)
        assertTrue(r.all().low() <= truth && truth <= r.all().high(), r.all() + " vs " + truth);
    }

    @Test
    void failedModelRunsAreCountedAndReported() {
        // y = x1 + x2 > 4√2 fails (β = 4, design point (2√2, 2√2)); the model throws for x2 > 3, which the draws
        // shifted to x2 = 2.83 reach about 43 % of the time
        Quadratic model = new Quadratic(0, 3);
        InputSpace space = TestSpaces.Independent.standard(2);
        TailYieldResult r = TailYield.estimate(model, space, List.of(atMost("y", 4 * Math.sqrt(2))),
                TailYield.Options.defaults().withRuns(4000).withSeed(9));
        assertTrue(r.failedRuns() > 1000, "failed runs " + r.failedRuns());
        // the weighted estimate of the failing region's probability P(x2 > 3) = Φ(−3)
        double pErr = STD.cumulativeProbability(-3); // source: closed form
        assertTrue(Math.abs(r.errorProbability() - pErr) <= 4 * r.errorSe(), r.errorProbability() + " ± " + r.errorSe()
                + " vs " + pErr);
        assertTrue(r.note().contains("failed to evaluate"), r.note());
        // the violations hidden in the failing region: y > 5.66 and x2 > 3; p̂ misses them and the note says so
        double pFail = STD.cumulativeProbability(-4);
        assertTrue(r.all().probability() < pFail);
    }

    @Test
    void unknownOutputIsABadInput() {
        StudyException e = assertThrows(StudyException.class, () -> TailYield.estimate(new TestModels.Linear(C),
                LINEAR_SPACE, List.of(atLeast("jsc", 1)), TailYield.Options.defaults()));
        assertTrue(e.getMessage().contains("targets[0]") && e.getMessage().contains("unknown output 'jsc'"),
                e.getMessage());
    }

    @Test
    void resultSerialisesToJsonAndRendersAsText() throws Exception {
        TailYieldResult r = TailYield.estimate(new TestModels.Linear(C), LINEAR_SPACE,
                List.of(atLeast("y", MU_Y - 4 * SIGMA_Y)), TailYield.Options.defaults().withRuns(1000));
        ObjectMapper json = new ObjectMapper();
        String text = json.writeValueAsString(r);
        JsonNode n = json.readTree(text);
        assertEquals(1000, n.get("runs").asInt());
        assertEquals(r.all().probability(), n.get("all").get("probability").asDouble(), 0);
        assertEquals("x3", n.get("designPoints").get(0).get("coordinates").get(2).get("input").asText());
        assertEquals(r.ess(), n.get("ess").asDouble(), 0);
        TailYieldResult back = json.readValue(text, TailYieldResult.class);
        assertEquals(r, back);
        String s = TailText.render(r, 2);
        assertTrue(s.contains("Kish effective sample size"), s);
        assertTrue(s.contains("design point y >= "), s);
        assertTrue(s.contains("yield 99.99"), s);
        assertEquals(6, s.lines().count(), s);
    }
}
