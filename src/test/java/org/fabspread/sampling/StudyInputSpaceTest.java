package org.fabspread.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.stat.correlation.SpearmansCorrelation;
import org.apache.commons.math3.util.FastMath;
import org.apache.commons.rng.UniformRandomProvider;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.junit.jupiter.api.Test;

class StudyInputSpaceTest {

    private static Study correlatedStudy(double r12, double r13, double r23) {
        return TestStudies.study("corr", List.of(
                        TestStudies.input("a", new DistributionSpec.LogNormal(50, 0.3)),
                        TestStudies.input("b", new DistributionSpec.Uniform(0, 2)),
                        TestStudies.input("free", new DistributionSpec.Normal(0, 1)),
                        TestStudies.input("c", new DistributionSpec.TruncatedNormal(100, 5, 95, 120))),
                List.of(), List.of(TestStudies.spearman("a", "b", r12), TestStudies.spearman("a", "c", r13),
                        TestStudies.spearman("b", "c", r23)),
                TestStudies.settings(10, 1, AnalysisSettings.Sampler.RANDOM, AnalysisSettings.FailurePolicy.REJECT));
    }

    @Test
    void spearmanTargetBecomesNormalCorrelation() {
        // from memory: 2 sin(π·0.6/6) = 2 sin(18°) = (√5 − 1)/2 = 0.6180339887…; cross-checked by the
        // closed form of sin 18° and by inverting ρ_S = (6/π) asin(r/2) (Pearson 1907, as quoted in
        // Kruskal, JASA 53, 814 (1958))
        double r = StudyInputSpace.normalCorrelation(0.6);
        assertEquals((Math.sqrt(5) - 1) / 2, r, 1e-15);
        assertEquals(0.6180339887, r, 1e-10);
        assertEquals(0.6, 6 / Math.PI * FastMath.asin(r / 2), 1e-15);
    }

    @Test
    void achievedSpearmanMatchesTargetsWithinSamplingError() {
        StudyInputSpace space = StudyInputSpace.of(correlatedStudy(0.6, -0.3, 0.0));
        assertTrue(space.correlated());
        assertFalse(space.repaired());
        assertEquals(List.of("a", "b", "c"), space.correlatedIds());
        int n = 20000;
        double[][] cols = new double[4][n];
        double[] u = new double[4];
        double[] x = new double[4];
        UniformRandomProvider rng = Streams.chunkStream(42, 0);
        for (int j = 0; j < n; j++) {
            for (int d = 0; d < 4; d++) {
                u[d] = Streams.uniform(rng);
            }
            space.map(u, x);
            for (int d = 0; d < 4; d++) {
                cols[d][j] = x[d];
            }
        }
        // source: Fieller, Hartley & Pearson, Biometrika 44, 470 (1957): Fisher-z standard error of
        // Spearman's ρ ≈ sqrt(1.06/(n − 3)); 4 standard errors
        double se = Math.sqrt(1.06 / (n - 3));
        SpearmansCorrelation sp = new SpearmansCorrelation();
        assertEquals(FastMath.atanh(0.6), FastMath.atanh(sp.correlation(cols[0], cols[1])), 4 * se);
        assertEquals(FastMath.atanh(-0.3), FastMath.atanh(sp.correlation(cols[0], cols[3])), 4 * se);
        assertEquals(0.0, FastMath.atanh(sp.correlation(cols[1], cols[3])), 4 * se);
        assertEquals(0.0, FastMath.atanh(sp.correlation(cols[0], cols[2])), 4 * se);
        // marginals are kept: sample means within 4 standard errors, supports respected
        Distribution a = space.marginals().get(0);
        double mean = 0;
        for (double v : cols[0]) {
            mean += v / n;
        }
        assertEquals(a.mean(), mean, 4 * a.standardDeviation() / Math.sqrt(n));
        for (double v : cols[3]) {
            assertTrue(v >= 95 && v <= 120);
        }
    }

    @Test
    void inconsistentTargetsAreRepairedAndReported() {
        StudyInputSpace space = StudyInputSpace.of(correlatedStudy(0.9, 0.9, -0.9));
        assertTrue(space.repaired());
        double[][] r = space.normalCorrelation();
        for (int i = 0; i < r.length; i++) {
            assertEquals(1.0, r[i][i], 0.0);
            for (int j = 0; j < r.length; j++) {
                assertEquals(r[i][j], r[j][i], 0.0);
            }
        }
        // common practice: a repaired correlation matrix must be positive semidefinite
        double[] lam = new EigenDecomposition(new Array2DRowRealMatrix(r)).getRealEigenvalues();
        for (double l : lam) {
            assertTrue(l > 0, "eigenvalue " + l);
        }
        double[] x = new double[4];
        space.map(new double[] {0.3, 0.6, 0.5, 0.9}, x);
        for (double v : x) {
            assertTrue(Double.isFinite(v));
        }
    }

    @Test
    void uncorrelatedMapIsTheMarginalInverseCdf() {
        Study s = TestStudies.study("plain", List.of(TestStudies.input("t", new DistributionSpec.Normal(10, 2))),
                List.of(), List.of(), TestStudies.settings(1, 1, AnalysisSettings.Sampler.RANDOM,
                        AnalysisSettings.FailurePolicy.REJECT));
        StudyInputSpace space = StudyInputSpace.of(s);
        assertFalse(space.correlated());
        double[] x = new double[1];
        space.map(new double[] {0.975}, x);
        assertEquals(10 + 2 * StandardNormal.quantile(0.975), x[0], 0.0);
        space.map(new double[] {0.0}, x);
        assertTrue(Double.isFinite(x[0]), "0 is clamped to 2^-53");
        assertEquals(10.0, space.nominal()[0]);
    }

    @Test
    void badCorrelationsNameTheirLocation() {
        Study s = TestStudies.study("bad", List.of(TestStudies.input("t", new DistributionSpec.Normal(10, 2))),
                List.of(), List.of(TestStudies.spearman("t", "nope", 0.5)),
                TestStudies.settings(1, 1, AnalysisSettings.Sampler.RANDOM, AnalysisSettings.FailurePolicy.REJECT));
        StudyException e = assertThrows(StudyException.class, () -> StudyInputSpace.of(s));
        assertTrue(e.getMessage().contains("correlations") && e.getMessage().contains("nope"), e.getMessage());
    }
}
