package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.atomic.AtomicLong;
import java.util.function.IntFunction;

import org.fabspread.sampling.InputSpace;
import org.fabspread.study.DistributionSpec;
import org.junit.jupiter.api.Test;

class SobolIndicesTest {

    private static final double A = 7;
    private static final double B = 0.1;

    private static InputSpace ishigamiSpace() {
        DistributionSpec u = new DistributionSpec.Uniform(-Math.PI, Math.PI);
        return TestSpaces.Independent.of(u, u, u);
    }

    /** Closed-form Ishigami indices {S1, S2, S3, ST1, ST2, ST3}. */
    private static double[] ishigamiTruth() {
        // source: closed form in /work/shared/docs/statistics-and-doe.md (Ishigami & Homma 1990)
        double pi4 = Math.pow(Math.PI, 4);
        double pi8 = pi4 * pi4;
        double v = A * A / 8 + B * pi4 / 5 + B * B * pi8 / 18 + 0.5;
        double v1 = Math.pow(1 + B * pi4 / 5, 2) / 2;
        double v2 = A * A / 8;
        double v13 = B * B * pi8 * (1.0 / 18 - 1.0 / 50);
        return new double[] {v1 / v, v2 / v, 0, (v1 + v13) / v, v2 / v, v13 / v};
    }

    @Test
    void ishigamiClosedFormMatchesPublishedValues() {
        double[] t = ishigamiTruth();
        // source: Saltelli et al., Global Sensitivity Analysis: The Primer (2008); Ishigami & Homma (1990)
        double[] published = {0.3139, 0.4424, 0, 0.5576, 0.4424, 0.2437};
        for (int i = 0; i < 6; i++) {
            assertEquals(published[i], t[i], 6e-5, "index " + i);
        }
    }

    @Test
    void ishigamiRandomPointsTruthInsideBootstrapIntervals() {
        double[] t = ishigamiTruth();
        TestModels.Ishigami model = new TestModels.Ishigami(A, B);
        SobolIndices.Options o = SobolIndices.Options.random(4096, 11).withBootstrap(200).withConfidence(0.99);
        SobolResult r = SobolIndices.compute(model, ishigamiSpace(), o, ProgressListener.NONE);
        assertEquals(SobolIndices.cost(4096, 3), r.modelRuns());
        // every model run of the design is made exactly once: N (k + 2)
        assertEquals(4096L * 5, model.calls().get());
        SobolResult.OutputIndices f = r.output("f");
        for (int i = 0; i < 3; i++) {
            SobolResult.IndexEstimate e = f.indices().get(i);
            // source: Saltelli et al., The Primer (2008), Ishigami values (closed form above)
            assertTrue(e.firstInterval().contains(t[i]), "S" + (i + 1) + " " + e);
            assertTrue(e.totalInterval().contains(t[3 + i]), "ST" + (i + 1) + " " + e);
            assertEquals(t[i], e.first(), 0.06);
            assertEquals(t[3 + i], e.total(), 0.06);
            assertTrue(e.firstLow() < e.first() && e.first() < e.firstHigh());
        }
        // the second output 2 f has the same indices: every output gets its own, and they are scale free
        SobolResult.OutputIndices twice = r.output("twice");
        for (int i = 0; i < 3; i++) {
            assertEquals(f.indices().get(i).first(), twice.indices().get(i).first(), 1e-12);
            assertEquals(f.indices().get(i).total(), twice.indices().get(i).total(), 1e-12);
        }
        assertEquals("", r.note());
        assertEquals(4, r.convergence().size() / 2);
    }

    @Test
    void ishigamiQuasiRandomPointsTruthInsideTIntervals() {
        double[] t = ishigamiTruth();
        SobolIndices.Options o = SobolIndices.Options.quasiRandom(4096, 5, 8).withConfidence(0.99);
        SobolResult r = SobolIndices.compute(new TestModels.Ishigami(A, B), ishigamiSpace(), o, null);
        SobolResult.OutputIndices f = r.output("f");
        for (int i = 0; i < 3; i++) {
            SobolResult.IndexEstimate e = f.indices().get(i);
            // source: Saltelli et al., The Primer (2008), Ishigami values (closed form above)
            assertTrue(e.firstInterval().contains(t[i]), "S" + (i + 1) + " " + e);
            assertTrue(e.totalInterval().contains(t[3 + i]), "ST" + (i + 1) + " " + e);
            assertEquals(t[i], e.first(), 0.05);
            assertEquals(t[3 + i], e.total(), 0.05);
        }
    }

    @Test
    void sobolGFunctionMatchesClosedForm() {
        double[] a = {0, 1, 4.5, 9, 99, 99, 99, 99};
        int k = a.length;
        // source: Saltelli & Sobol (1995): V_i = 1/(3(1 + a_i)^2), V = Π(1 + V_i) − 1
        double[] vi = new double[k];
        double prod = 1;
        for (int i = 0; i < k; i++) {
            vi[i] = 1.0 / (3 * (1 + a[i]) * (1 + a[i]));
            prod *= 1 + vi[i];
        }
        double v = prod - 1;
        // source: published check values in /work/shared/docs/statistics-and-doe.md (Saltelli & Sobol 1995)
        assertEquals(0.465424, v, 1e-6);
        double[] s = new double[k];
        double[] st = new double[k];
        for (int i = 0; i < k; i++) {
            s[i] = vi[i] / v;
            st[i] = vi[i] * prod / (1 + vi[i]) / v;
        }
        assertEquals(0.71619, s[0], 1e-5);
        assertEquals(0.17905, s[1], 1e-5);
        assertEquals(0.78714, st[0], 1e-5);
        assertEquals(0.24220, st[1], 1e-5);
        assertEquals(0.034317, st[2], 1e-6);
        assertEquals(1.049e-4, st[7], 1e-7);

        DistributionSpec u01 = new DistributionSpec.Uniform(0, 1);
        DistributionSpec[] specs = new DistributionSpec[k];
        java.util.Arrays.fill(specs, u01);
        SobolIndices.Options o = SobolIndices.Options.random(4096, 3).withBootstrap(200).withConfidence(0.99);
        SobolResult r = SobolIndices.compute(new TestModels.SobolG(a), TestSpaces.Independent.of(specs), o, null);
        for (int i = 0; i < k; i++) {
            SobolResult.IndexEstimate e = r.output("g").indices().get(i);
            // source: Saltelli & Sobol (1995) closed form above
            assertTrue(e.firstInterval().contains(s[i]), "S" + (i + 1) + " " + e + " truth " + s[i]);
            assertTrue(e.totalInterval().contains(st[i]), "ST" + (i + 1) + " " + e + " truth " + st[i]);
        }
    }

    @Test
    void linearModelIndicesAreVarianceShares() {
        double[] c = {1, 2, 3};
        double[] sd = {1, 0.5, 0.4};
        InputSpace space = TestSpaces.Independent.of(new DistributionSpec.Normal(5, sd[0]),
                new DistributionSpec.Normal(-1, sd[1]), new DistributionSpec.Normal(0, sd[2]));
        double tot = 0;
        for (int i = 0; i < 3; i++) {
            tot += c[i] * c[i] * sd[i] * sd[i];
        }
        SobolIndices.Options o = SobolIndices.Options.random(2048, 17).withConfidence(0.99);
        SobolResult r = SobolIndices.compute(new TestModels.Linear(c), space, o, null);
        for (int i = 0; i < 3; i++) {
            // source: linear model with independent inputs, S_i = S_Ti = c_i² σ_i² / Σ c_j² σ_j² (statistics-and-doe.md)
            double truth = c[i] * c[i] * sd[i] * sd[i] / tot;
            SobolResult.IndexEstimate e = r.output("y").indices().get(i);
            assertTrue(e.firstInterval().contains(truth), e + " truth " + truth);
            assertTrue(e.totalInterval().contains(truth), e + " truth " + truth);
        }
        assertEquals(1.0, r.output("y").sumFirst(), 0.1);
        assertEquals(tot, r.output("y").variance(), 0.1 * tot);
    }

    @Test
    void bootstrapIntervalsCoverNearNominalRate() {
        // 40 replications of a cheap linear case, 90 % intervals on S_i and S_Ti of three inputs
        InputSpace space = TestSpaces.Independent.of(new DistributionSpec.Normal(0, 1),
                new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1));
        double rate = linearCoverage(space, rep -> SobolIndices.Options.random(256, 1000 + rep).withBootstrap(200)
                .withConfidence(0.90).withThreads(1));
        // common practice: nominal 0.90 with a binomial tolerance; 240 intervals give sd 0.019, and
        // intervals of one replication are correlated, so allow about 4 sd either way
        assertTrue(rate > 0.80 && rate < 0.98, "coverage " + rate);
    }

    @Test
    void quasiRandomIntervalsCoverNearNominalRate() {
        InputSpace space = TestSpaces.Independent.of(new DistributionSpec.Uniform(0, 1),
                new DistributionSpec.Uniform(0, 1), new DistributionSpec.Uniform(0, 1));
        double rate = linearCoverage(space, rep -> SobolIndices.Options.quasiRandom(256, 500 + rep, 8)
                .withConfidence(0.90).withThreads(1));
        // common practice: nominal 0.90, binomial tolerance as above
        assertTrue(rate > 0.80 && rate < 0.98, "coverage " + rate);
    }

    /**
     * Fraction of the S_i and S_Ti intervals of y = x1 + 2 x2 + 3 x3 (three inputs of equal variance)
     * that contain the true indices, over 40 replications with the options of each.
     */
    private static double linearCoverage(InputSpace space, IntFunction<SobolIndices.Options> options) {
        double[] c = {1, 2, 3};
        // source: closed form for a linear model of independent inputs of equal variance, S_i = c_i² / Σ c_j²
        double[] truth = {1 / 14.0, 4 / 14.0, 9 / 14.0};
        int covered = 0;
        int total = 0;
        for (int rep = 0; rep < 40; rep++) {
            SobolResult r = SobolIndices.compute(new TestModels.Linear(c), space, options.apply(rep), null);
            for (int i = 0; i < 3; i++) {
                SobolResult.IndexEstimate e = r.output("y").indices().get(i);
                covered += e.firstInterval().contains(truth[i]) ? 1 : 0;
                covered += e.totalInterval().contains(truth[i]) ? 1 : 0;
                total += 2;
            }
        }
        return covered / (double) total;
    }

    @Test
    void bitIdenticalForAnyThreadCountAndProgressReachesTotal() {
        SobolIndices.Options o = SobolIndices.Options.random(512, 9).withBootstrap(50);
        AtomicLong last = new AtomicLong();
        SobolResult one = SobolIndices.compute(new TestModels.Ishigami(A, B), ishigamiSpace(), o.withThreads(1),
                (done, total) -> last.accumulateAndGet(done, Math::max));
        assertEquals(SobolIndices.cost(512, 3), last.get());
        SobolResult three = SobolIndices.compute(new TestModels.Ishigami(A, B), ishigamiSpace(), o.withThreads(3),
                null);
        for (int i = 0; i < 3; i++) {
            SobolResult.IndexEstimate a = one.output("f").indices().get(i);
            SobolResult.IndexEstimate b = three.output("f").indices().get(i);
            assertEquals(a, b);
        }
    }

    @Test
    void centredEstimatorIsUnaffectedByAnOffset() {
        // source: statistics-and-doe.md pitfall: centre outputs before the first-order sum (offset of 1000)
        SobolIndices.Options o = SobolIndices.Options.random(1024, 21).withBootstrap(0);
        SobolResult plain = SobolIndices.compute(new TestModels.Ishigami(A, B), ishigamiSpace(), o, null);
        SobolResult shifted = SobolIndices.compute(new TestModels.Ishigami(A, B, 1000, new AtomicLong()),
                ishigamiSpace(), o, null);
        for (int i = 0; i < 3; i++) {
            assertEquals(plain.output("f").indices().get(i).first(), shifted.output("f").indices().get(i).first(),
                    1e-8);
        }
        assertTrue(Double.isNaN(plain.output("f").indices().get(0).firstLow()));
    }

    @Test
    void rawEstimatesAreNotClipped() {
        // hand-made design of 2 rows, 1 input: f(A) = (0, 2), f(B) = (2, 0), f(A_B) = (0, 0)
        double[] fA = {0, 2};
        double[] fB = {2, 0};
        double[][] fAB = {{0, 0}};
        double[] first = new double[1];
        double[] total = new double[1];
        double v = SobolIndices.estimate(fA, fB, fAB, new int[] {0, 1}, 2, first, total);
        // common practice: mean 1, V = 4/3; first = (1/2)[(2−1)(0−0) + (0−1)(0−2)]/V = 0.75; total = (1/4)(0 + 4)/V
        assertEquals(4.0 / 3, v, 1e-15);
        assertEquals(0.75, first[0], 1e-15);
        assertEquals(0.75, total[0], 1e-15);
        // swapping B gives a negative first-order estimate that is reported as is
        SobolIndices.estimate(fA, new double[] {0, 2}, fAB, new int[] {0, 1}, 2, first, total);
        assertEquals(-0.75, first[0], 1e-15);
    }

    @Test
    void convergenceTableUsesFirstRowsAndEndsAtFullEstimate() {
        SobolIndices.Options o = SobolIndices.Options.random(1024, 4).withBootstrap(0);
        SobolResult r = SobolIndices.compute(new TestModels.Ishigami(A, B), ishigamiSpace(), o, null);
        int[] sizes = r.convergence().stream().filter(s -> s.output().equals("f"))
                .mapToInt(SobolResult.ConvergenceStep::n).toArray();
        org.junit.jupiter.api.Assertions.assertArrayEquals(new int[] {128, 256, 512, 1024}, sizes);
        SobolResult.ConvergenceStep last = r.convergence().stream()
                .filter(s -> s.output().equals("f") && s.n() == 1024).findFirst().orElseThrow();
        assertEquals(r.output("f").indices().get(1).first(), last.first()[1], 1e-15);
    }

    @Test
    void correlatedInputsAreStatedInTheNote() {
        InputSpace space = TestSpaces.Copula2.of(new DistributionSpec.Normal(0, 1), new DistributionSpec.Normal(0, 1),
                0.5);
        SobolResult r = SobolIndices.compute(new TestModels.Linear(new double[] {1, 1}), space,
                SobolIndices.Options.random(256, 1).withBootstrap(0), null);
        assertTrue(r.note().contains("independent uniforms"), r.note());
    }

    @Test
    void optionsFromStudySettings() {
        org.fabspread.study.AnalysisSettings sobolPts = new org.fabspread.study.AnalysisSettings(1000, 3,
                org.fabspread.study.AnalysisSettings.Sampler.SOBOL, org.fabspread.study.AnalysisSettings.Sensitivity.SOBOL,
                1024, 300, org.fabspread.study.AnalysisSettings.FailurePolicy.REJECT, java.util.List.of(), Double.NaN,
                0.9, false);
        SobolIndices.Options q = SobolIndices.Options.from(sobolPts, 2);
        assertEquals(SobolIndices.Points.QUASI_RANDOM, q.points());
        assertEquals(8, q.replicates());
        assertEquals(0.9, q.confidence(), 0);
        org.fabspread.study.AnalysisSettings bad = new org.fabspread.study.AnalysisSettings(1000, 3,
                org.fabspread.study.AnalysisSettings.Sampler.SOBOL, org.fabspread.study.AnalysisSettings.Sensitivity.SOBOL,
                1000, 300, org.fabspread.study.AnalysisSettings.FailurePolicy.REJECT, java.util.List.of(), Double.NaN,
                0.9, false);
        org.fabspread.study.StudyException e = assertThrows(org.fabspread.study.StudyException.class,
                () -> SobolIndices.Options.from(bad, 2));
        assertTrue(e.getMessage().contains("power of two"), e.getMessage());
        org.fabspread.study.AnalysisSettings rnd = new org.fabspread.study.AnalysisSettings(1000, 3,
                org.fabspread.study.AnalysisSettings.Sampler.LATIN_HYPERCUBE,
                org.fabspread.study.AnalysisSettings.Sensitivity.SOBOL, 1000, 300,
                org.fabspread.study.AnalysisSettings.FailurePolicy.REJECT, java.util.List.of(), Double.NaN, 0.95, false);
        SobolIndices.Options r = SobolIndices.Options.from(rnd, 0);
        assertEquals(SobolIndices.Points.RANDOM, r.points());
        assertEquals(300, r.bootstrap());
    }

    @Test
    void costAndOptionChecks() {
        assertEquals(20480L, SobolIndices.cost(4096, 3));
        assertThrows(IllegalArgumentException.class, () -> SobolIndices.Options.quasiRandom(1000, 1, 8));
        assertThrows(IllegalArgumentException.class, () -> SobolIndices.Options.quasiRandom(1024, 1, 1));
    }
}
