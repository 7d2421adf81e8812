package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;

class YieldEstimateTest {

    private static Target atLeast(String out, double v) {
        return new Target(out, true, v, "mA/cm^2", SourceLocation.unknown("targets[0]"));
    }

    @Test
    void linearGaussianYieldMatchesClosedForm() {
        double[] c = {1, 2, 3};
        InputSpace space = TestSpaces.Independent.of(new DistributionSpec.Normal(10, 1),
                new DistributionSpec.Normal(2, 0.5), new DistributionSpec.Normal(0, 0.4));
        double mu = 10 + 4;
        double sigma = Math.sqrt(1 + 1 + 1.44);
        double t = 12.5;
        SampleTable table = TestSpaces.monteCarlo(new TestModels.Linear(c), space, 4000, 99);
        YieldResult r = YieldEstimate.of(table, List.of(atLeast("y", t), atLeast("z", 0)), 0.99);
        // source: statistics-and-doe.md: linear-Gaussian yield Φ((μ_y − t)/σ_y) exactly
        double truth = new NormalDistribution(mu, sigma).cumulativeProbability(2 * mu - t);
        YieldResult.YieldLine y = r.perTarget().get(0);
        assertTrue(y.wilsonLow() <= truth && truth <= y.wilsonHigh(), y + " truth " + truth);
        assertTrue(y.exactLow() <= truth && truth <= y.exactHigh(), y + " truth " + truth);
        assertEquals(4000, y.n());
        // z = y + x1² >= y, so "all targets" equals the first target here
        assertEquals(y.passed(), r.all().passed());
        assertEquals("", r.note());

        Capability cap = YieldEstimate.capability(table, atLeast("y", t));
        // source: statistics-and-doe.md: C_pk = (μ − LSL)/(3σ), under normality yield Φ(3 C_pk)
        assertEquals((mu - t) / (3 * sigma), cap.cpk(), 0.03);
        assertEquals(truth, cap.normalYield(), 0.01);
        assertEquals(0, cap.skewness(), 0.15);
        assertEquals("", cap.caveat());
    }

    @Test
    void skewedOutputGetsACaveat() {
        // exponential values: skewness 2 (common practice)
        double[] v = new double[2000];
        for (int i = 0; i < v.length; i++) {
            v[i] = -Math.log(1 - (i + 0.5) / v.length);
        }
        Capability cap = YieldEstimate.capability(v, new Target("eff", false, 3, "%", SourceLocation.unknown("t")));
        assertEquals(2, cap.skewness(), 0.3);
        assertTrue(cap.caveat().contains("overstates"), cap.caveat());
        assertEquals((3 - 1.0) / 3.0, cap.cpk(), 0.05);
    }

    @Test
    void failedSamplesAreLeftOutAndStated() {
        SampleTable t = new SampleTable(List.of("x1"), List.of("y"), new double[][] {{1, 2, 3, 4}},
                new double[][] {{1, Double.NaN, 3, 4}}, new boolean[] {true, false, true, true});
        YieldResult r = YieldEstimate.of(t, List.of(atLeast("y", 2)), 0.95);
        assertEquals(3, r.all().n());
        assertEquals(2, r.all().passed());
        assertEquals(1, r.failedSamples());
        assertTrue(r.note().contains("0.5000"), r.note());
        StudyException e = assertThrows(StudyException.class,
                () -> YieldEstimate.of(t, List.of(atLeast("jsc", 2)), 0.95));
        assertTrue(e.getMessage().contains("unknown output 'jsc'"), e.getMessage());
    }
}
