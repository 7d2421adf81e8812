package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.util.CombinatoricsUtils;
import org.fabspread.sampling.Distribution;
import org.fabspread.sampling.Distributions;
import org.fabspread.study.DistributionSpec;
import org.junit.jupiter.api.Test;

class ShapleyEffectsTest {

    private static GaussianCopula normals(double[] sd, double[][] r) {
        List<Distribution> m = new ArrayList<>();
        for (double s : sd) {
            m.add(Distributions.of(new DistributionSpec.Normal(0, s)));
        }
        return new GaussianCopula(TestModels.ids(sd.length), m, r);
    }

    private static double[][] pairCorrelation(double rho) {
        return new double[][] {{1, 0, 0}, {0, 1, rho}, {0, rho, 1}};
    }

    /**
     * Closed-form Shapley effects of Y = β1 X1 + β2 X2 + β3 X3 with X Gaussian, X1 independent of the
     * others and corr(X2, X3) = ρ. source: Owen &amp; Prieur, SIAM/ASA J. Uncertain. Quantif. 5, 986 (2017);
     * Iooss &amp; Prieur, Int. J. Uncertain. Quantif. 9, 493 (2019), sec. 3.1 (written from memory).
     */
    private static double[] linearTruth(double[] b, double[] s, double rho) {
        double t2 = b[1] * b[1] * s[1] * s[1];
        double t3 = b[2] * b[2] * s[2] * s[2];
        double cross = rho * b[1] * b[2] * s[1] * s[2];
        return new double[] {b[0] * b[0] * s[0] * s[0],
                t2 * (1 - rho * rho / 2) + rho * rho * t3 / 2 + cross,
                t3 * (1 - rho * rho / 2) + rho * rho * t2 / 2 + cross};
    }

    /**
     * The same effects a second way, exactly: Shapley's subset formula Sh_i = Σ_{J ∌ i} |J|! (k − |J| − 1)!/k!
     * [c(J ∪ i) − c(J)] with the Gaussian cost c(J) = β_Jᵀ (Σ_JJ − Σ_JK Σ_KK⁻¹ Σ_KJ) β_J, K the rest
     * (source: Shapley, Contrib. Theory of Games II, 307 (1953); Anderson (2003), thm. 2.5.1).
     */
    private static double[] exactShapley(double[] b, double[] s, double[][] r) {
        int k = b.length;
        double[] sh = new double[k];
        for (int i = 0; i < k; i++) {
            for (int mask = 0; mask < 1 << k; mask++) {
                if ((mask & 1 << i) != 0) {
                    continue;
                }
                int size = Integer.bitCount(mask);
                double w = CombinatoricsUtils.factorialDouble(size) * CombinatoricsUtils.factorialDouble(k - size - 1)
                        / CombinatoricsUtils.factorialDouble(k);
                sh[i] += w * (cost(b, s, r, mask | 1 << i) - cost(b, s, r, mask));
            }
        }
        return sh;
    }

    private static double cost(double[] b, double[] s, double[][] r, int mask) {
        int k = b.length;
        List<Integer> j = new ArrayList<>();
        List<Integer> kk = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            (((mask >> i) & 1) == 1 ? j : kk).add(i);
        }
        if (j.isEmpty()) {
            return 0;
        }
        RealMatrix sjj = cov(j, j, s, r);
        if (!kk.isEmpty()) {
            RealMatrix sjk = cov(j, kk, s, r);
            RealMatrix skk = cov(kk, kk, s, r);
            sjj = sjj.subtract(sjk.multiply(new LUDecomposition(skk).getSolver().getInverse()).multiply(sjk.transpose()));
        }
        double c = 0;
        for (int a = 0; a < j.size(); a++) {
            for (int d = 0; d < j.size(); d++) {
                c += b[j.get(a)] * sjj.getEntry(a, d) * b[j.get(d)];
            }
        }
        return c;
    }

    private static RealMatrix cov(List<Integer> rows, List<Integer> cols, double[] s, double[][] r) {
        double[][] m = new double[rows.size()][cols.size()];
        for (int a = 0; a < rows.size(); a++) {
            for (int d = 0; d < cols.size(); d++) {
                m[a][d] = r[rows.get(a)][cols.get(d)] * s[rows.get(a)] * s[cols.get(d)];
            }
        }
        return new Array2DRowRealMatrix(m);
    }

    @Test
    void linearGaussianWithCorrelatedPairMatchesTheClosedForm() {
        double[] beta = {1, 2, 1.5};
        double[] sd = {1, 0.8, 1.2};
        for (double rho : new double[] {-0.6, 0.3, 0.9}) {
            double[] truth = linearTruth(beta, sd, rho);
            // cross-check of the closed form (from memory) by exact enumeration of the subsets
            assertArrayEquals(truth, exactShapley(beta, sd, pairCorrelation(rho)), 1e-12, "rho " + rho);
            double var = truth[0] + truth[1] + truth[2];
            ShapleyEffects.Options o = new ShapleyEffects.Options(600, 1, 3, 6000, 300, 11, 0.99, 0);
            ShapleyResult r = ShapleyEffects.compute(new TestModels.Linear(beta), normals(sd, pairCorrelation(rho)), o,
                    null).result();
            ShapleyResult.OutputEffects y = r.output("y");
            double sum = 0;
            for (int i = 0; i < 3; i++) {
                ShapleyResult.Effect e = y.effects().get(i);
                assertTrue(e.interval().contains(truth[i] / var), "rho " + rho + " " + e + " truth " + truth[i] / var);
                sum += e.share();
            }
            assertEquals(1.0, sum, 1e-12, "shares sum to 1 exactly");
            assertEquals(var, y.variance(), 0.06 * var);
        }
    }

    @Test
    void ishigamiIndependentInputsGiveThePublishedEffects() {
        double a = 7;
        double b = 0.1;
        // source: Iooss & Prieur (2019), table for the Ishigami function (from memory): 0.4358, 0.4424, 0.1218
        double[] published = {0.4358, 0.4424, 0.1218};
        // cross-check: with independent inputs Sh_i = Σ_{u ∋ i} V_u / |u| (Owen 2014), and the Ishigami variance
        // components V_1, V_2, V_13 in closed form (Ishigami & Homma 1990; Saltelli et al., Primer (2008))
        double pi4 = Math.pow(Math.PI, 4);
        double v = a * a / 8 + b * pi4 / 5 + b * b * pi4 * pi4 / 18 + 0.5;
        double v1 = Math.pow(1 + b * pi4 / 5, 2) / 2;
        double v2 = a * a / 8;
        double v13 = b * b * pi4 * pi4 * (1.0 / 18 - 1.0 / 50);
        double[] exact = {(v1 + v13 / 2) / v, v2 / v, v13 / 2 / v};
        assertArrayEquals(published, exact, 1e-4);
        List<Distribution> m = new ArrayList<>();
        for (int i = 0; i < 3; i++) {
            m.add(Distributions.of(new DistributionSpec.Uniform(-Math.PI, Math.PI)));
        }
        GaussianCopula c = new GaussianCopula(TestModels.ids(3), m, new double[][] {{1, 0, 0}, {0, 1, 0}, {0, 0, 1}});
        ShapleyEffects.Options o = new ShapleyEffects.Options(3000, 1, 3, 10000, 300, 5, 0.99, 0);
        ShapleyResult r = ShapleyEffects.compute(new TestModels.Ishigami(a, b), c, o, null).result();
        for (int i = 0; i < 3; i++) {
            ShapleyResult.Effect e = r.output("f").effects().get(i);
            assertTrue(e.interval().contains(exact[i]), e + " truth " + exact[i]);
        }
    }

    @Test
    void effectsDoNotDependOnTheOrderOfTheInputs() {
        // source: Owen (2014): the Shapley value is symmetric in its players; a relabelling of the inputs
        // relabels the effects. Inputs (X1, X2, X3) against (X3, X1, X2) with corr(X2, X3) = 0.7.
        double[] beta = {1, 2, 1.5};
        double[] sd = {1, 0.8, 1.2};
        double rho = 0.7;
        int[] perm = {2, 0, 1};
        double[] pb = new double[3];
        double[] ps = new double[3];
        double[][] pr = new double[3][3];
        double[][] r = pairCorrelation(rho);
        for (int a = 0; a < 3; a++) {
            pb[a] = beta[perm[a]];
            ps[a] = sd[perm[a]];
            for (int d = 0; d < 3; d++) {
                pr[a][d] = r[perm[a]][perm[d]];
            }
        }
        ShapleyEffects.Options o = new ShapleyEffects.Options(600, 1, 3, 6000, 300, 23, 0.99, 0);
        ShapleyResult first = ShapleyEffects.compute(new TestModels.Linear(beta), normals(sd, r), o, null).result();
        ShapleyResult second = ShapleyEffects.compute(new TestModels.Linear(pb), normals(ps, pr), o.withSeed(24), null)
                .result();
        for (int a = 0; a < 3; a++) {
            ShapleyResult.Effect e2 = second.output("y").effects().get(a);
            ShapleyResult.Effect e1 = first.output("y").effects().get(perm[a]);
            double half = 0.5 * (e1.interval().width() + e2.interval().width());
            assertEquals(e1.share(), e2.share(), half, "input " + perm[a]);
        }
        // and both agree with the exact effects of the same joint law
        double[] exact = exactShapley(beta, sd, r);
        double var = exact[0] + exact[1] + exact[2];
        for (int i = 0; i < 3; i++) {
            assertTrue(first.output("y").effects().get(i).interval().contains(exact[i] / var));
        }
    }

    @Test
    void bitIdenticalForAnyThreadCountAndCostAsStated() {
        double[] beta = {1, 2, 1.5};
        double[] sd = {1, 0.8, 1.2};
        ShapleyEffects.Options o = new ShapleyEffects.Options(50, 2, 3, 200, 50, 3, 0.95, 1);
        GaussianCopula c = normals(sd, pairCorrelation(0.5));
        TestModels.Linear model = new TestModels.Linear(beta);
        ShapleyEffects.Run one = ShapleyEffects.compute(model, c, o, null);
        ShapleyEffects.Run two = ShapleyEffects.compute(model, c, o.withThreads(2), null);
        assertEquals(one.result(), two.result());
        // source: Song, Nelson & Staum (2016): N_v + m (k − 1) N_o N_i model runs
        assertEquals(200 + 50 * 2 * 2 * 3, ShapleyEffects.cost(o, 3));
        assertEquals(ShapleyEffects.cost(o, 3), one.design().rows());
        assertEquals(ShapleyEffects.cost(o, 3), one.result().modelRuns());
    }
}
