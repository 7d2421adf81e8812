package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;

class ToleranceAdvisorTest {

    // y = 3 x1 + x2 + x3 with unit normal inputs, spec y >= 29.5 (mean 31)
    private static final double[] C = {3, 1, 1};
    private static final Map<String, DistributionSpec> SPECS = Map.of("x1", new DistributionSpec.Normal(10, 1),
            "x2", new DistributionSpec.Normal(2, 1), "x3", new DistributionSpec.Normal(-1, 1));
    private static final InputSpace SPACE = TestSpaces.Independent.of(SPECS.get("x1"), SPECS.get("x2"), SPECS.get("x3"));
    private static final SampleTable TABLE = TestSpaces.monteCarlo(new TestModels.Linear(C), SPACE, 20000, 31);
    private static final double T = 29.5;
    private static final List<Target> TARGETS = List.of(new Target("y", true, T, "mA/cm^2", SourceLocation.unknown("t")));

    private static double closedYield(double s1, double s2, double s3) {
        // source: statistics-and-doe.md: linear-Gaussian yield Φ((μ_y − t)/σ_y)
        double sd = Math.sqrt(9 * s1 * s1 + s2 * s2 + s3 * s3);
        return new NormalDistribution(0, 1).cumulativeProbability((31 - T) / sd);
    }

    @Test
    void rankingPutsTheDominantInputFirstWithClosedFormGains() {
        ToleranceRanking r = ToleranceAdvisor.rank(TABLE, SPACE, TARGETS, SPECS, null,
                WhatIf.Options.defaults().withConfidence(0.99));
        assertEquals("y", r.sdOutput());
        assertEquals("x1", r.entries().get(0).input());
        ToleranceRanking.Entry e = r.entries().get(0);
        double truth = closedYield(0.5, 1, 1);
        assertTrue(e.yieldLow() <= truth && truth <= e.yieldHigh(), e + " truth " + truth);
        // the spread reduction follows the closed form sqrt(11) − sqrt(4.25)
        assertEquals(Math.sqrt(11) - Math.sqrt(4.25), e.sdReduction(), 0.06);
        // source: statistics-and-doe.md: halving one σ leaves about 0.66 n effective samples
        assertEquals(0.66, e.essFraction(), 0.02);
        for (ToleranceRanking.Entry x : r.entries().subList(1, 3)) {
            double t = closedYield(1, 0.5, 1);
            assertTrue(x.yieldLow() <= t && t <= x.yieldHigh(), x + " truth " + t);
            assertTrue(x.yieldGain() < e.yieldGain());
        }
    }

    @Test
    void allocationReachesTheGoalAtACostAlongAMonotoneCurve() {
        double goal = 0.80;
        Map<String, Double> costs = Map.of("x1", 10.0, "x2", 1.0);
        ToleranceAllocation a = ToleranceAdvisor.allocate(TABLE, SPACE, TARGETS, SPECS, costs, goal,
                WhatIf.Options.defaults().withConfidence(0.99));
        assertTrue(a.reached(), a.toString());
        assertTrue(a.predictedYield() >= goal);
        double s1 = a.choice("x1").scale();
        double s2 = a.choice("x2").scale();
        double s3 = a.choice("x3").scale();
        // the chosen tolerances really give the goal: closed form within the reweighting's interval
        double truth = closedYield(s1, s2, s3);
        assertTrue(a.predictedLow() <= truth && truth <= a.predictedHigh(), a + " truth " + truth);
        assertTrue(truth > goal - 0.02, "closed-form yield " + truth);
        // cost = Σ c_i log2(1/scale_i), x3 with no cost given counts 1
        double cost = 10 * log2inv(s1) + log2inv(s2) + log2inv(s3);
        assertEquals(cost, a.totalCost(), 1e-9);
        assertEquals(1.0, a.choice("x3").costOfHalving(), 0);
        // the curve starts at no change, climbs in cost and in predicted yield, and ends at the allocation
        assertEquals(0, a.curve().get(0).cumulativeCost(), 0);
        for (int i = 1; i < a.curve().size(); i++) {
            assertTrue(a.curve().get(i).cumulativeCost() >= a.curve().get(i - 1).cumulativeCost());
            assertTrue(a.curve().get(i).predictedYield() > a.curve().get(i - 1).predictedYield());
        }
        ToleranceAllocation.TradeOffPoint last = a.curve().get(a.curve().size() - 1);
        assertEquals(a.predictedYield(), last.predictedYield(), 1e-12);
        assertEquals(a.confirmationRunNeeded(), a.ess() < 200 || a.essFraction() < 0.10);
    }

    @Test
    void anUnreachableGoalIsReportedAndCollapsedWeightsAskForAConfirmationRun() {
        // the best the scales allow is Φ(1.5/sqrt(9/16 + 2/16)) ≈ 0.965 < 0.999
        ToleranceAllocation a = ToleranceAdvisor.allocate(TABLE, SPACE, TARGETS, SPECS, Map.of(), 0.999,
                WhatIf.Options.defaults());
        assertFalse(a.reached());
        assertTrue(a.note().contains("not reached"), a.note());
        assertTrue(a.confirmationRunNeeded(), a.toString());
    }

    @Test
    void aGoalAlreadyMetNeedsNothing() {
        ToleranceAllocation a = ToleranceAdvisor.allocate(TABLE, SPACE, TARGETS, SPECS, Map.of(), 0.5,
                WhatIf.Options.defaults());
        assertTrue(a.reached());
        assertEquals(0, a.totalCost(), 0);
        assertEquals(1, a.curve().size());
        assertTrue(a.choices().stream().allMatch(c -> c.scale() == 1));
    }

    @Test
    void measuredInputsAreSkipped() {
        Map<String, DistributionSpec> specs = new java.util.HashMap<>(SPECS);
        specs.put("x3", new DistributionSpec.Empirical(new double[] {-2, -1, 0}, false, "m.csv:x3"));
        ToleranceRanking r = ToleranceAdvisor.rank(TABLE, SPACE, TARGETS, specs, "y", WhatIf.Options.defaults());
        ToleranceRanking.Entry last = r.entries().get(2);
        assertEquals("x3", last.input());
        assertTrue(last.rerunNeeded());
        assertTrue(last.note().contains("measured values"));
        ToleranceAllocation a = ToleranceAdvisor.allocate(TABLE, SPACE, TARGETS, specs, Map.of(), 0.8,
                WhatIf.Options.defaults());
        assertEquals(1, a.choice("x3").scale(), 0);
        assertTrue(a.note().contains("x3 cannot be scaled"));
    }

    private static double log2inv(double s) {
        return Math.log(1 / s) / Math.log(2);
    }
}
