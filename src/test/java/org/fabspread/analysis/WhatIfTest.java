package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.apache.commons.math3.analysis.integration.SimpsonIntegrator;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.AnalysisSettings.WhatIf.Kind;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;

class WhatIfTest {

    private static final double[] C = {3, 1, 1};
    private static final DistributionSpec[] SPECS = {new DistributionSpec.Normal(10, 1),
        new DistributionSpec.Normal(2, 1), new DistributionSpec.Normal(-1, 1)};
    // y = 3 x1 + x2 + x3: μ_y = 31, σ_y² = 9 + 1 + 1
    private static final double MU = 31;
    private static final double T = 29.5;
    private static final InputSpace SPACE = TestSpaces.Independent.of(SPECS);
    private static final SampleTable TABLE = TestSpaces.monteCarlo(new TestModels.Linear(C), SPACE, 20000, 2024);
    private static final List<Target> TARGETS = List.of(
            new Target("y", true, T, "mA/cm^2", SourceLocation.unknown("targets[0]")));

    private static WhatIf.Change change(int i, Kind kind, double amount) {
        return WhatIf.change("x" + (i + 1), SPECS[i], kind, amount, null);
    }

    private static double gaussianYield(double mu, double var) {
        // source: statistics-and-doe.md: linear-Gaussian yield Φ((μ_y − t)/σ_y)
        return new NormalDistribution(0, 1).cumulativeProbability((mu - T) / Math.sqrt(var));
    }

    @Test
    void halvingASigmaMatchesTheClosedForm() {
        WhatIfResult r = WhatIf.evaluate(TABLE, SPACE, TARGETS, List.of(change(0, Kind.SCALE_SIGMA, 0.5)),
                WhatIf.Options.defaults().withConfidence(0.99));
        assertTrue(r.reweighted());
        assertFalse(r.rerunNeeded(), r.message());
        double truth = gaussianYield(MU, 9 * 0.25 + 2);
        WhatIfResult.WeightedYield y = r.allTargets();
        assertTrue(y.afterLow() <= truth && truth <= y.afterHigh(), y + " truth " + truth);
        assertEquals(gaussianYield(MU, 11), y.before(), 0.015);
        // the weighted sd of y follows the changed distribution: sqrt(9/4 + 2)
        assertEquals(Math.sqrt(4.25), r.output("y").sdAfter(), 0.05);
        assertEquals(Math.sqrt(11), r.output("y").sdBefore(), 0.05);
    }

    @Test
    void halvingOneSigmaLeavesAboutTwoThirdsOfTheSamples() {
        // Derivation: w = p1/p0 with p_k = N(μ, σ_k); E_0[w²] = ∫ p1²/p0 dx
        //   = (σ0/σ1²) (1/sqrt(2π)) ∫ exp(−x²(2/σ1² − 1/σ0²)/2) dx = σ0² / (σ1 sqrt(2σ0² − σ1²)).
        // σ1 = σ0/2: E[w²] = 1/(0.5 sqrt(1.75)) = 1.5119, so ESS/n → 1/E[w²] = 0.6614.
        double s0 = 1;
        double s1 = 0.5;
        double closed = s0 * s0 / (s1 * Math.sqrt(2 * s0 * s0 - s1 * s1));
        // second route: Simpson quadrature of p1²/p0 over ±12 σ0
        NormalDistribution p0 = new NormalDistribution(0, s0);
        NormalDistribution p1 = new NormalDistribution(0, s1);
        double numeric = new SimpsonIntegrator(1e-10, 1e-12, 3, 30)
                .integrate(1_000_000, x -> p1.density(x) * p1.density(x) / p0.density(x), -12, 12);
        assertEquals(closed, numeric, 1e-8);
        // source: statistics-and-doe.md: halving one σ leaves about 0.66 n effective samples
        assertEquals(0.66, 1 / closed, 0.005);
        WhatIf.Change c = change(0, Kind.SCALE_SIGMA, 0.5);
        assertEquals(closed, c.secondMoment(), 1e-12);
        WhatIfResult r = WhatIf.evaluate(TABLE, SPACE, TARGETS, List.of(c), WhatIf.Options.defaults());
        assertEquals(1 / closed, r.expectedEssFraction(), 1e-12);
        assertEquals(1 / closed, r.essFraction(), 0.02);
        // two inputs halved: (0.66)^2 (statistics-and-doe.md)
        WhatIfResult r2 = WhatIf.evaluate(TABLE, SPACE, TARGETS,
                List.of(change(0, Kind.SCALE_SIGMA, 0.5), change(1, Kind.SCALE_SIGMA, 0.5)), WhatIf.Options.defaults());
        assertEquals(1 / (closed * closed), r2.essFraction(), 0.03);
        double truth = gaussianYield(MU, 9 * 0.25 + 0.25 + 1);
        assertTrue(r2.allTargets().afterLow() <= truth && truth <= r2.allTargets().afterHigh());
    }

    @Test
    void shiftingANominalMatchesTheClosedForm() {
        WhatIf.Change c = change(0, Kind.SHIFT_NOMINAL, -0.3);
        // Derivation as above with a mean shift δ: E[w²] = exp(δ²/σ²) for equal σ
        assertEquals(Math.exp(0.09), c.secondMoment(), 1e-12);
        WhatIfResult r = WhatIf.evaluate(TABLE, SPACE, TARGETS, List.of(c), WhatIf.Options.defaults().withConfidence(0.99));
        double truth = gaussianYield(MU - 0.9, 11);
        assertTrue(r.allTargets().afterLow() <= truth && truth <= r.allTargets().afterHigh(), r.allTargets() + " " + truth);
    }

    @Test
    void truncatingAnInputMatchesNumericalIntegration() {
        WhatIf.Change c = change(0, Kind.TRUNCATE_SIGMAS, 1);
        assertTrue(c.afterSpec() instanceof DistributionSpec.TruncatedNormal);
        WhatIfResult r = WhatIf.evaluate(TABLE, SPACE, TARGETS, List.of(c), WhatIf.Options.defaults().withConfidence(0.99));
        // common practice: P(3 x1 + R ≥ t) with x1 ~ N(10, 1) cut to [9, 11] and R ~ N(1, sqrt 2):
        // ∫ p_TN(x1) Φ((3 x1 + 1 − t)/sqrt 2) dx1 by Simpson quadrature
        NormalDistribution std = new NormalDistribution(0, 1);
        double mass = std.cumulativeProbability(1) - std.cumulativeProbability(-1);
        double truth = new SimpsonIntegrator(1e-10, 1e-12, 3, 30).integrate(1_000_000,
                x -> std.density(x - 10) / mass * std.cumulativeProbability((3 * x + 1 - T) / Math.sqrt(2)), 9, 11);
        assertTrue(r.allTargets().afterLow() <= truth && truth <= r.allTargets().afterHigh(), r.allTargets() + " " + truth);
        // the truncated normal's weights are bounded: E[w²] = 1/mass (numerical route against this closed form)
        assertEquals(1 / mass, c.secondMoment(), 1e-3);
    }

    @Test
    void wideningPastSqrtTwoIsRefused() {
        WhatIf.Change c = change(0, Kind.SCALE_SIGMA, 1.5);
        assertFalse(c.reweightable());
        assertEquals(Double.POSITIVE_INFINITY, c.secondMoment());
        WhatIfResult r = WhatIf.evaluate(TABLE, SPACE, TARGETS, List.of(c), WhatIf.Options.defaults());
        assertFalse(r.reweighted());
        assertTrue(r.rerunNeeded());
        assertTrue(r.message().contains("sqrt(2)"), r.message());
        assertTrue(Double.isNaN(r.allTargets().after()));
        // just below √2 the variance is finite (and the ESS small)
        assertTrue(change(0, Kind.SCALE_SIGMA, 1.4).reweightable());
    }

    @Test
    void supportOutsideTheOldIsRefused() {
        WhatIf.Change c = WhatIf.change("x1", new DistributionSpec.Uniform(0, 1), Kind.SCALE_SIGMA, 1.2, null);
        assertFalse(c.reweightable());
        assertTrue(c.refusal().contains("outside the sampled range"), c.refusal());
        WhatIf.Change shrink = WhatIf.change("x1", new DistributionSpec.Uniform(0, 1), Kind.SCALE_SIGMA, 0.5, null);
        assertEquals(0.25, shrink.after().supportLower(), 1e-15);
        // uniform → uniform of half the width: w = 2 inside, E[w²] = 2 (common practice)
        assertEquals(2, shrink.secondMoment(), 1e-9);
        WhatIf.Change shift = WhatIf.change("x1", new DistributionSpec.Triangular(0, 1, 3), Kind.SHIFT_NOMINAL, 0.5, null);
        assertFalse(shift.reweightable());
    }

    @Test
    void measuredValuesAndFixedInputsAreRefusedWithAMessage() {
        SourceLocation where = new SourceLocation(java.nio.file.Path.of("study.yaml"), 40, 5, "what_if[0]");
        StudyException e = assertThrows(StudyException.class, () -> WhatIf.change("stack.etl.thickness",
                new DistributionSpec.Empirical(new double[] {1, 2, 3}, false, "m.csv:t"), Kind.SCALE_SIGMA, 0.5, where));
        assertTrue(e.getMessage().startsWith("study.yaml:40:5: what_if[0]: "), e.getMessage());
        assertTrue(e.getMessage().contains("measured values"));
        assertThrows(StudyException.class, () -> WhatIf.change("x", new DistributionSpec.Fixed(1), Kind.SCALE_SIGMA,
                0.5, where));
        assertThrows(StudyException.class, () -> WhatIf.change("x", new DistributionSpec.Normal(1, 1), Kind.SCALE_SIGMA,
                -1, where));
    }

    @Test
    void lognormalUniformAndTriangularAreScaledAsDocumented() {
        WhatIf.Change l = WhatIf.change("d", new DistributionSpec.LogNormal(40, 0.2), Kind.SCALE_SIGMA, 0.5, null);
        DistributionSpec.LogNormal after = (DistributionSpec.LogNormal) l.afterSpec();
        // σ_ln = sqrt(ln(1 + cv²)) is halved, median kept
        assertEquals(0.5 * Math.sqrt(Math.log1p(0.04)), Math.sqrt(Math.log1p(after.cv() * after.cv())), 1e-12);
        assertEquals(40, after.median(), 0);
        assertEquals(1 / 0.66143782776614768, l.secondMoment(), 1e-9);
        DistributionSpec.Triangular t = (DistributionSpec.Triangular) WhatIf.change("a",
                new DistributionSpec.Triangular(0, 1, 3), Kind.SCALE_SIGMA, 0.5, null).afterSpec();
        assertEquals(new DistributionSpec.Triangular(0.5, 1, 2), t);
        WhatIf.Change cut = WhatIf.change("u", new DistributionSpec.Uniform(0, 1), Kind.TRUNCATE_SIGMAS, 1, null);
        assertNull(cut.afterSpec());
        // U(0,1): sd = 1/sqrt(12); cut to 0.5 ± 0.2887 and renormalised (common practice)
        assertEquals(0.5 - 1 / Math.sqrt(12), cut.after().supportLower(), 1e-9);
        assertEquals(1 / (2 / Math.sqrt(12)), cut.after().density(0.5), 1e-9);
    }

    @Test
    void correlatedInputsUseTheCopulaDensityOrAreRefused() {
        double r = 0.6;
        InputSpace space = TestSpaces.Copula2.of(new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1), r);
        SampleTable table = TestSpaces.monteCarlo(new TestModels.Linear(new double[] {1, 1}), space, 20000, 5);
        List<Target> targets = List.of(new Target("y", true, -1, "1", SourceLocation.unknown("t")));
        WhatIf.Change c = WhatIf.change("x1", new DistributionSpec.Normal(0, 1), Kind.SCALE_SIGMA, 0.5, null);
        WhatIfResult refused = WhatIf.evaluate(table, space, targets, List.of(c), WhatIf.Options.defaults());
        assertFalse(refused.reweighted());
        assertTrue(refused.message().contains("correlated"), refused.message());
        WhatIfResult res = WhatIf.evaluate(table, space, targets, List.of(c),
                WhatIf.Options.defaults().withConfidence(0.99).withCorrelation(new double[][] {{1, r}, {r, 1}}));
        // normal marginals under a Gaussian copula stay bivariate normal: Var = 0.25 + 1 + 2 r 0.5 (common practice)
        double truth = new NormalDistribution(0, 1).cumulativeProbability(1 / Math.sqrt(0.25 + 1 + r));
        assertTrue(res.allTargets().afterLow() <= truth && truth <= res.allTargets().afterHigh(),
                res.allTargets() + " truth " + truth);
        assertEquals(Math.sqrt(1.25 + r), res.output("y").sdAfter(), 0.04);
    }

    @Test
    void farTailSamplesKeepFiniteCopulaWeights() {
        // a sample 5.5 sd below the mean sits 11 sd below once the sd is halved: its new normal score must be
        // -11, not -infinity (erf^-1(2p - 1) loses the tail below p = 1e-16), or its weight turns NaN and the
        // effective sample size collapses; for one halved normal sd the ESS fraction tends to
        // 1 / E[w^2] = 0.5 sqrt(1.75) = 0.661 (derived in the test above; statistics-and-doe.md: about 0.66 n)
        double r = 0.3;
        InputSpace space = TestSpaces.Copula2.of(new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1), r);
        SampleTable table = TestSpaces.monteCarlo(new TestModels.Linear(new double[] {1, 1}), space, 4000, 11);
        // both signs of the partner's score: with an infinite score one of them gives inf − inf
        table.inputs()[0][0] = -5.5;
        table.inputs()[1][0] = -1.0;
        table.inputs()[0][1] = -5.5;
        table.inputs()[1][1] = 1.0;
        table.inputs()[0][2] = 5.5;
        List<Target> targets = List.of(new Target("y", true, -1, "1", SourceLocation.unknown("t")));
        WhatIf.Change c = WhatIf.change("x1", new DistributionSpec.Normal(0, 1), Kind.SCALE_SIGMA, 0.5, null);
        double[] w = WhatIf.weights(table, space, List.of(c),
                WhatIf.Options.defaults().withCorrelation(new double[][] {{1, r}, {r, 1}}));
        for (double v : w) {
            assertTrue(Double.isFinite(v), "weight " + v);
        }
        WhatIfResult res = WhatIf.evaluate(table, space, targets, List.of(c),
                WhatIf.Options.defaults().withCorrelation(new double[][] {{1, r}, {r, 1}}));
        assertTrue(res.essFraction() > 0.5, "ESS fraction " + res.essFraction());
    }

    @Test
    void modifiedSpaceSamplesTheChangedDistribution() {
        WhatIf.Change c = change(0, Kind.SCALE_SIGMA, 1.5);
        InputSpace m = WhatIf.modifiedSpace(SPACE, List.of(c));
        SampleTable t = TestSpaces.monteCarlo(new TestModels.Linear(C), m, 20000, 77);
        assertEquals(1.5, Math.sqrt(Stats.variance(t.input("x1"))), 0.03);
        assertEquals(1.0, Math.sqrt(Stats.variance(t.input("x2"))), 0.03);
        YieldResult y = YieldEstimate.of(t, TARGETS, 0.99);
        double truth = gaussianYield(MU, 9 * 2.25 + 2);
        assertTrue(y.all().wilsonLow() <= truth && truth <= y.all().wilsonHigh());

        InputSpace corr = TestSpaces.Copula2.of(new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1), 0.6);
        WhatIf.Change h = WhatIf.change("x1", new DistributionSpec.Normal(0, 1), Kind.SCALE_SIGMA, 2, null);
        SampleTable tc = TestSpaces.monteCarlo(new TestModels.Linear(new double[] {1, 1}),
                WhatIf.modifiedSpace(corr, List.of(h)), 20000, 8);
        assertEquals(2, Math.sqrt(Stats.variance(tc.input("x1"))), 0.05);
        // the copula is kept: normal marginals keep their Pearson correlation r
        assertEquals(0.6, new PearsonsCorrelation().correlation(tc.input("x1"), tc.input("x2")), 0.03);
    }

    @Test
    void smallEffectiveSampleSizeFlagsARerun() {
        // σ scaled by 0.1 on two inputs: E[w²] = (1/(0.1 sqrt(1.99)))² ≈ 50, ESS ≈ 2 % of n
        WhatIfResult r = WhatIf.evaluate(TABLE, SPACE, TARGETS,
                List.of(change(0, Kind.SCALE_SIGMA, 0.1), change(1, Kind.SCALE_SIGMA, 0.1)), WhatIf.Options.defaults());
        assertTrue(r.reweighted());
        assertTrue(r.rerunNeeded());
        assertTrue(r.essFraction() < 0.1, "" + r.essFraction());
        assertTrue(r.message().contains("effective sample size"));
    }
}
