package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.PermutationSampler;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.Interval;
import org.fabspread.study.AnalysisSettings;

/**
 * Shapley effects of every model output by the random-permutation estimator of Song, Nelson &amp; Staum,
 * SIAM/ASA J. Uncertain. Quantif. 4, 1060 (2016), Algorithm 1, with exact conditional sampling from the
 * study's Gaussian copula ({@link GaussianCopula}).
 *
 * <p>The Shapley effect of input i (Owen, SIAM/ASA J. Uncertain. Quantif. 2, 245 (2014)) is the average,
 * over all orders π of the inputs, of the variance added when i joins the inputs before it:
 * Sh_i = (1/k!) Σ_π [c(P_i(π) ∪ {i}) − c(P_i(π))] with the cost c(J) = E[Var(Y | X_−J)], the variance
 * left when only the inputs J vary. c(∅) = 0 and c(all) = Var(Y), so the effects sum to the variance
 * whatever the dependence, and an order of the inputs in the study file plays no part.
 *
 * <p>Estimator: m random orders; for order π and each of its first k − 1 prefixes J, N_o outer draws of
 * x_−J from its marginal law and, for each, N_i draws of x_J from its conditional law given x_−J;
 * ĉ(J) = mean over the outer draws of the inner sample variance (divisor N_i − 1, unbiased); the last
 * prefix is the whole set, ĉ = V̂ from N_v independent samples. The increments of one order then sum
 * exactly to V̂ and the shares Sh_i / V̂ to 1. Song et al. recommend N_o = 1, N_i = 3 for a given budget.
 * Cost N_v + m (k − 1) N_o N_i model runs.
 *
 * <p>Intervals: percentile bootstrap that resamples the orders and the N_v rows together (the orders are
 * independent, so their increments are too).
 *
 * <p>Deterministic: every order's draws come from a stream seeded by (seed, order), the variance rows from
 * (seed, −1); runs are evaluated in fixed chunks and stored by row, so any thread count gives the same bits.
 */
public final class ShapleyEffects {

    private static final long SALT = 0x3c6ef372fe94f82bL;
    private static final long BOOTSTRAP_SALT = 0xa54ff53a5f1d36f1L;

    /**
     * @param permutations random orders m (at least 2)
     * @param outer        N_o (at least 1)
     * @param inner        N_i (at least 2)
     * @param variance     N_v (at least 4)
     * @param bootstrap    resamples for the intervals (0 = none)
     * @param seed         master seed
     * @param confidence   two-sided level of the intervals
     * @param threads      worker threads, 0 = all processors
     */
    public record Options(int permutations, int outer, int inner, int variance, int bootstrap, long seed,
                          double confidence, int threads) {
        public Options {
            if (permutations < 2 || outer < 1 || inner < 2 || variance < 4 || bootstrap < 0) {
                throw new IllegalArgumentException("Shapley design needs m >= 2, N_o >= 1, N_i >= 2, N_v >= 4,"
                        + " bootstrap >= 0; got " + permutations + ", " + outer + ", " + inner + ", " + variance
                        + ", " + bootstrap);
            }
            if (!(confidence > 0 && confidence < 1)) {
                throw new IllegalArgumentException("confidence must lie in (0, 1), got " + confidence);
            }
        }

        /** m orders with N_o = 1, N_i = 3 (Song et al.'s choice) and N_v = 1000; 300 resamples, 95 %. */
        public static Options of(int permutations, long seed) {
            return new Options(permutations, 1, 3, 1000, 300, seed, 0.95, 0);
        }

        /**
         * From a study's settings: m = 4N orders for a Sobol base size N, so the design costs about
         * 12(k − 1)N runs beside the Sobol design's (k + 2)N (the inner variances of three runs are noisy);
         * N_v = 8N.
         */
        public static Options from(AnalysisSettings a, int base, long seed, int threads) {
            int m = base > 0 ? base : a.sobolBase();
            return new Options(4 * m, 1, 3, 8 * m, Math.max(a.bootstrap(), 100), seed, a.confidence(), threads);
        }

        public Options withPermutations(int p) {
            return new Options(p, outer, inner, variance, bootstrap, seed, confidence, threads);
        }

        public Options withVariance(int v) {
            return new Options(permutations, outer, inner, v, bootstrap, seed, confidence, threads);
        }

        public Options withSeed(long s) {
            return new Options(permutations, outer, inner, variance, bootstrap, s, confidence, threads);
        }

        public Options withThreads(int t) {
            return new Options(permutations, outer, inner, variance, bootstrap, seed, confidence, t);
        }
    }

    /** Effects with the design they came from (for export and audit). */
    public record Run(ShapleyResult result, ShapleyDesign design) {
    }

    private ShapleyEffects() {
    }

    /** Model runs: N_v + m (k − 1) N_o N_i. */
    public static long cost(Options o, int k) {
        return o.variance() + (long) o.permutations() * (k - 1) * o.outer() * o.inner();
    }

    /** Runs the design and estimates the effects of every output. */
    public static Run compute(Model model, GaussianCopula copula, Options o, ProgressListener progress) {
        return compute(Engine.local(Parallel.threads(o.threads())), model, copula, o, progress);
    }

    /** As {@link #compute(Model, GaussianCopula, Options, ProgressListener)}, the runs on {@code engine}. */
    public static Run compute(Engine engine, Model model, GaussianCopula copula, Options o,
                              ProgressListener progress) {
        if (!model.inputIds().equals(copula.ids())) {
            throw new IllegalArgumentException("model inputs " + model.inputIds() + " differ from " + copula.ids());
        }
        int k = copula.dimension();
        if (k < 2) {
            throw new IllegalArgumentException("Shapley effects need at least two inputs, got " + k);
        }
        ShapleyDesign design = draw(copula, o);
        double[][] y = DesignRuns.evaluate(engine, "Shapley design", model, design.inputs(), k, cost(o, k),
                progress == null ? ProgressListener.NONE : progress);
        design = design.withOutputs(y);
        return new Run(estimate(design, model.outputs(), o), design);
    }

    /** Draws every row of the design (inputs only). */
    static ShapleyDesign draw(GaussianCopula copula, Options o) {
        int k = copula.dimension();
        int m = o.permutations();
        int steps = k - 1;
        int per = steps * o.outer() * o.inner();
        int rows = o.variance() + m * per;
        double[] x = new double[rows * k];
        int[] order = new int[m * k];
        double[] z = new double[k];
        double[] eps = new double[k];
        double[] xi = new double[k];
        GaussianCopula.Conditional full = copula.conditional(all(k));
        UniformRandomProvider rv = RandomStreams.of(o.seed(), SALT, -1);
        ZigguratSampler.NormalizedGaussian gv = ZigguratSampler.NormalizedGaussian.of(rv);
        for (int r = 0; r < o.variance(); r++) {
            fill(eps, gv);
            full.draw(z, eps);
            copula.toInputs(z, xi);
            System.arraycopy(xi, 0, x, r * k, k);
        }
        Map<Long, GaussianCopula.Conditional> cache = new HashMap<>();
        boolean[] vary = new boolean[k];
        int[] pi = new int[k];
        for (int l = 0; l < m; l++) {
            UniformRandomProvider rng = RandomStreams.of(o.seed(), SALT, l);
            ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
            for (int i = 0; i < k; i++) {
                pi[i] = i;
            }
            PermutationSampler.shuffle(rng, pi);
            System.arraycopy(pi, 0, order, l * k, k);
            java.util.Arrays.fill(vary, false);
            long mask = 0;
            for (int s = 0; s < steps; s++) {
                vary[pi[s]] = true;
                mask |= 1L << pi[s];
                final boolean[] v = vary.clone();
                GaussianCopula.Conditional c = k <= 63 ? cache.computeIfAbsent(mask, key -> copula.conditional(v))
                        : copula.conditional(v);
                for (int out = 0; out < o.outer(); out++) {
                    fill(eps, g);
                    full.draw(z, eps);
                    for (int in = 0; in < o.inner(); in++) {
                        fill(eps, g);
                        c.draw(z, eps);
                        copula.toInputs(z, xi);
                        int row = o.variance() + ((l * steps + s) * o.outer() + out) * o.inner() + in;
                        System.arraycopy(xi, 0, x, row * k, k);
                    }
                }
            }
        }
        return new ShapleyDesign(copula.ids(), o.permutations(), o.outer(), o.inner(), o.variance(), order, x, null);
    }

    private static boolean[] all(int k) {
        boolean[] b = new boolean[k];
        java.util.Arrays.fill(b, true);
        return b;
    }

    private static void fill(double[] eps, ZigguratSampler.NormalizedGaussian g) {
        for (int i = 0; i < eps.length; i++) {
            eps[i] = g.sample();
        }
    }

    /** The per-order increments of one output, before the last step's V̂ is added. */
    private record Increments(double[][] d, int[] last, double[] lastCost, boolean[] ok) {
    }

    private static Increments increments(ShapleyDesign des, double[] y) {
        int k = des.ids().size();
        int m = des.permutations();
        int steps = k - 1;
        int no = des.outer();
        int ni = des.inner();
        double[][] d = new double[m][k];
        int[] last = new int[m];
        double[] lastCost = new double[m];
        boolean[] ok = new boolean[m];
        for (int l = 0; l < m; l++) {
            boolean good = true;
            double prev = 0;
            for (int s = 0; s < steps; s++) {
                double c = 0;
                for (int out = 0; out < no; out++) {
                    int base = des.variance() + ((l * steps + s) * no + out) * ni;
                    double mean = 0;
                    for (int in = 0; in < ni; in++) {
                        mean += y[base + in];
                    }
                    mean /= ni;
                    double ss = 0;
                    for (int in = 0; in < ni; in++) {
                        double e = y[base + in] - mean;
                        ss += e * e;
                    }
                    c += ss / (ni - 1);
                }
                c /= no;
                good &= Double.isFinite(c);
                d[l][des.order()[l * k + s]] = c - prev;
                prev = c;
            }
            last[l] = des.order()[l * k + steps];
            lastCost[l] = prev;
            ok[l] = good;
        }
        return new Increments(d, last, lastCost, ok);
    }

    private static double variance(double[] y, int[] rows, int count) {
        double s = 0;
        for (int t = 0; t < count; t++) {
            s += y[rows[t]];
        }
        double mu = s / count;
        double ss = 0;
        for (int t = 0; t < count; t++) {
            double e = y[rows[t]] - mu;
            ss += e * e;
        }
        return ss / (count - 1);
    }

    /** Sh_i in variance units from the orders {@code perms} (with repeats) and variance V. */
    private static void effects(Increments inc, int[] perms, int count, double v, double[] sh) {
        java.util.Arrays.fill(sh, 0);
        for (int t = 0; t < count; t++) {
            int l = perms[t];
            double[] dl = inc.d()[l];
            for (int i = 0; i < sh.length; i++) {
                sh[i] += dl[i];
            }
            sh[inc.last()[l]] += v - inc.lastCost()[l];
        }
        for (int i = 0; i < sh.length; i++) {
            sh[i] /= count;
        }
    }

    /** Estimates the effects of every output from a design with outputs (also the path an audit takes). */
    static ShapleyResult estimate(ShapleyDesign des, List<OutputDef> outs, Options o) {
        int k = des.ids().size();
        int nOut = outs.size();
        int m = des.permutations();
        List<ShapleyResult.OutputEffects> result = new ArrayList<>();
        int failedPerms = 0;
        StringBuilder note = new StringBuilder();
        for (int q = 0; q < nOut; q++) {
            double[] y = des.outputs()[q];
            Increments inc = increments(des, y);
            int[] perms = goodIndices(inc.ok(), m);
            int[] vrows = goodRows(y, des.variance());
            if (q == 0) {
                failedPerms = m - perms.length;
            }
            double v = vrows.length >= 4 ? variance(y, vrows, vrows.length) : Double.NaN;
            List<ShapleyResult.Effect> list = new ArrayList<>();
            if (!(v > 0) || perms.length < 2) {
                if (!(v > 0)) {
                    note.append("Output ").append(outs.get(q).id()).append(" does not vary: no effects. ");
                }
                for (int i = 0; i < k; i++) {
                    list.add(new ShapleyResult.Effect(des.ids().get(i), Double.NaN, Interval.none(), Double.NaN));
                }
                result.add(new ShapleyResult.OutputEffects(outs.get(q).id(), v, list));
                continue;
            }
            double[] sh = new double[k];
            effects(inc, perms, perms.length, v, sh);
            Interval[] ci = bootstrap(inc, perms, vrows, y, o, k, q);
            for (int i = 0; i < k; i++) {
                list.add(new ShapleyResult.Effect(des.ids().get(i), sh[i] / v, ci[i], sh[i]));
            }
            result.add(new ShapleyResult.OutputEffects(outs.get(q).id(), v, list));
        }
        if (failedPerms > 0) {
            note.append(failedPerms).append(" of ").append(m).append(" orders had a failed model run and were dropped. ");
        }
        String method = String.format(java.util.Locale.ROOT, "Shapley effects (Owen 2014) by random permutations"
                + " (Song, Nelson & Staum 2016): m = %d orders, N_o = %d, N_i = %d, N_v = %d; exact conditional"
                + " sampling from the Gaussian copula; percentile bootstrap over orders and variance rows, %d"
                + " resamples", m, des.outer(), des.inner(), des.variance(), o.bootstrap());
        return new ShapleyResult(method, m, des.outer(), des.inner(), des.variance(), des.rows(), failedPerms,
                o.confidence(), note.toString().trim(), result);
    }

    private static int[] goodIndices(boolean[] ok, int m) {
        int c = 0;
        int[] out = new int[m];
        for (int l = 0; l < m; l++) {
            if (ok[l]) {
                out[c++] = l;
            }
        }
        return java.util.Arrays.copyOf(out, c);
    }

    private static int[] goodRows(double[] y, int nv) {
        int c = 0;
        int[] out = new int[nv];
        for (int r = 0; r < nv; r++) {
            if (Double.isFinite(y[r])) {
                out[c++] = r;
            }
        }
        return java.util.Arrays.copyOf(out, c);
    }

    private static Interval[] bootstrap(Increments inc, int[] perms, int[] vrows, double[] y, Options o, int k,
                                        int output) {
        int b = o.bootstrap();
        Interval[] ci = new Interval[k];
        if (b == 0) {
            java.util.Arrays.fill(ci, Interval.none());
            return ci;
        }
        double[][] boot = new double[k][b];
        int[] ps = new int[perms.length];
        int[] vs = new int[vrows.length];
        double[] sh = new double[k];
        for (int rep = 0; rep < b; rep++) {
            UniformRandomProvider rng = RandomStreams.of(o.seed(), BOOTSTRAP_SALT + output,
                    rep);
            for (int t = 0; t < ps.length; t++) {
                ps[t] = perms[rng.nextInt(perms.length)];
            }
            for (int t = 0; t < vs.length; t++) {
                vs[t] = vrows[rng.nextInt(vrows.length)];
            }
            double v = variance(y, vs, vs.length);
            effects(inc, ps, ps.length, v, sh);
            for (int i = 0; i < k; i++) {
                boot[i][rep] = v > 0 ? sh[i] / v : Double.NaN;
            }
        }
        for (int i = 0; i < k; i++) {
            ci[i] = Stats.percentile(boot[i], o.confidence());
        }
        return ci;
    }
}
