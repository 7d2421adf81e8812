package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.sampling.Distribution;
import org.fabspread.sampling.Distributions;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.DistributionSpec;

/** Input spaces and a plain Monte Carlo sampler for tests. */
final class TestSpaces {

    private TestSpaces() {
    }

    /** Independent marginals: x_i = F_i⁻¹(u_i). */
    record Independent(List<String> ids, List<Distribution> marginals) implements InputSpace {
        static Independent of(DistributionSpec... specs) {
            List<Distribution> d = new ArrayList<>();
            for (DistributionSpec s : specs) {
                d.add(Distributions.of(s));
            }
            return new Independent(TestModels.ids(specs.length), d);
        }

        /** k independent standard normal inputs. */
        static Independent standard(int k) {
            DistributionSpec[] s = new DistributionSpec[k];
            Arrays.fill(s, new DistributionSpec.Normal(0, 1));
            return of(s);
        }

        @Override public boolean correlated() {
            return false;
        }

        @Override public void map(double[] u, double[] x) {
            for (int i = 0; i < x.length; i++) {
                x[i] = marginals.get(i).inverseCdf(u[i]);
            }
        }
    }

    /** Two inputs joined by a Gaussian copula with normal-score correlation r. */
    record Copula2(List<String> ids, List<Distribution> marginals, double r) implements InputSpace {
        private static final NormalDistribution STD = new NormalDistribution(null, 0, 1);

        static Copula2 of(DistributionSpec a, DistributionSpec b, double r) {
            return new Copula2(TestModels.ids(2), List.of(Distributions.of(a), Distributions.of(b)), r);
        }

        @Override public boolean correlated() {
            return true;
        }

        @Override public void map(double[] u, double[] x) {
            double z1 = STD.inverseCumulativeProbability(u[0]);
            double z2 = r * z1 + Math.sqrt(1 - r * r) * STD.inverseCumulativeProbability(u[1]);
            x[0] = marginals.get(0).inverseCdf(STD.cumulativeProbability(z1));
            x[1] = marginals.get(1).inverseCdf(STD.cumulativeProbability(z2));
        }
    }

    /** Plain Monte Carlo: n independent points mapped through the space and evaluated. */
    static SampleTable monteCarlo(Model model, InputSpace space, int n, long seed) {
        UniformRandomProvider rng = RandomSource.XO_SHI_RO_256_PP.create(seed);
        int k = space.dimension();
        int nOut = model.outputs().size();
        double[][] in = new double[k][n];
        double[][] out = new double[nOut][n];
        boolean[] ok = new boolean[n];
        double[] u = new double[k];
        double[] x = new double[k];
        double[] y = new double[nOut];
        Evaluator e = model.newEvaluator();
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < k; i++) {
                u[i] = SobolIndices.openUniform(rng);
            }
            space.map(u, x);
            boolean good = true;
            try {
                e.evaluate(x, y);
            } catch (ModelException ex) {
                good = false;
            }
            ok[j] = good;
            for (int i = 0; i < k; i++) {
                in[i][j] = x[i];
            }
            for (int m = 0; m < nOut; m++) {
                out[m][j] = good ? y[m] : Double.NaN;
            }
        }
        List<String> outIds = new ArrayList<>();
        model.outputs().forEach(o -> outIds.add(o.id()));
        return new SampleTable(space.ids(), outIds, in, out, ok);
    }
}
