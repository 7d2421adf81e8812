package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.stat.correlation.SpearmansCorrelation;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.DistributionSpec;
import org.junit.jupiter.api.Test;

class ScreeningTest {

    @Test
    void binnedFirstOrderIndicesOfIshigami() {
        DistributionSpec u = new DistributionSpec.Uniform(-Math.PI, Math.PI);
        SampleTable t = TestSpaces.monteCarlo(new TestModels.Ishigami(7, 0.1), TestSpaces.Independent.of(u, u, u),
                20000, 42);
        ScreeningResult r = Screening.of(t);
        assertEquals(50, r.bins());
        assertEquals(49.0 / 19999, r.binBias(), 1e-15);
        ScreeningResult.OutputScreening f = r.output("f");
        // source: Saltelli et al., The Primer (2008): Ishigami S1 = 0.3139, S2 = 0.4424, S3 = 0
        assertEquals(0.3139, f.input("x1").firstOrder(), 0.03);
        assertEquals(0.4424, f.input("x2").firstOrder(), 0.03);
        assertEquals(0.0, f.input("x3").firstOrder(), 0.02);
        // sin² x2 is not monotone: the rank regression sees almost nothing of x2
        assertTrue(Math.abs(f.input("x2").srrc()) < 0.05, f.toString());
        assertTrue(f.rankRSquared() < 0.5);
    }

    @Test
    void rankRegressionOfALinearGaussianModel() {
        double[] c = {1, 2, 3, 0};
        InputSpace space = TestSpaces.Independent.of(new DistributionSpec.Normal(0, 1),
                new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1));
        SampleTable t = TestSpaces.monteCarlo(new TestModels.Linear(c), space, 5000, 7);
        ScreeningResult r = Screening.of(t, 35);
        ScreeningResult.OutputScreening y = r.output("y");
        SpearmansCorrelation sp = new SpearmansCorrelation();
        for (int i = 0; i < 4; i++) {
            double rho = c[i] / Math.sqrt(14);
            // from memory: Spearman correlation of a bivariate normal = (6/π) asin(ρ/2) (Pearson 1907);
            // with independent inputs the SRRC equals that rank correlation. Cross-checked against the
            // Spearman correlation measured directly on the same sample.
            double expected = 6 / Math.PI * Math.asin(rho / 2);
            double measured = sp.correlation(t.inputs()[i], t.outputs()[0]);
            assertEquals(expected, measured, 0.03, "Spearman of x" + (i + 1));
            assertEquals(measured, y.inputs().get(i).srrc(), 0.03, "SRRC of x" + (i + 1));
            assertEquals(expected, y.inputs().get(i).srrc(), 0.03, "SRRC of x" + (i + 1));
            // source: statistics-and-doe.md, linear model: S_i = c_i² σ_i² / Σ c_j² σ_j²
            assertEquals(c[i] * c[i] / 14, y.inputs().get(i).firstOrder(), 0.03);
        }
        assertTrue(y.rankRSquared() > 0.95 && y.rankRSquared() < 1);
    }

    @Test
    void binningBiasIsSubtracted() {
        // an input with no effect: one-way analysis of variance gives E[η²] = (M − 1)/(n − 1) under no
        // effect (common practice), and sd about sqrt(2(M − 1))/n
        double[] c = {1, 0};
        InputSpace space = TestSpaces.Independent.of(new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1));
        int n = 5000;
        int bins = 35;
        SampleTable t = TestSpaces.monteCarlo(new TestModels.Linear(c), space, n, 3);
        ScreeningResult.InputScreening e = Screening.of(t, bins).output("y").input("x2");
        double sd = Math.sqrt(2.0 * (bins - 1)) / n;
        assertEquals((bins - 1.0) / (n - 1.0), e.firstOrderRaw(), 5 * sd);
        assertEquals(0, e.firstOrder(), 5 * sd);
        assertEquals(e.firstOrderRaw() - (bins - 1.0) / (n - 1.0), e.firstOrder(), 1e-15);
    }

    @Test
    void correlationRatioOfAStepIsExact() {
        // common practice: a step in the middle of the input range explains all of the variance with 2 bins
        double[] y = {0, 0, 1, 1};
        assertEquals(1.0, Screening.correlationRatio(y, new int[] {0, 1, 2, 3}, 2), 1e-15);
        assertEquals(0.0, Screening.correlationRatio(y, new int[] {0, 2, 1, 3}, 2), 1e-15);
    }
}
