package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.apache.commons.math3.special.Erf;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.ModelRows;
import org.fabspread.sampling.RowBatch;
import org.fabspread.sampling.RowInputs;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;

/**
 * Rare failures (yields above 99.9 %) by importance sampling in the standard-normal space of the inputs.
 *
 * <p>The input space maps independent uniforms u to inputs; here u = Φ(z) with z standard normal, so the
 * inputs are a function x(z) and a target's limit state g(z) = margin of its output (y − t for
 * {@code y >= t}, t − y for {@code y <= t}; g ≤ 0 fails). For each target the most probable failure point
 * z* (the point of g = 0 nearest the origin) is found on the model itself by the Hasofer–Lind /
 * Rackwitz–Fiessler iteration (Hasofer &amp; Lind, J. Eng. Mech. Div. 100, 111 (1974); Rackwitz &amp;
 * Fiessler, Comput. Struct. 9, 489 (1978))
 * z ← [(∇g·z − g)/|∇g|²] ∇g, with gradients by forward differences and the step halved until the merit
 * ½|z|² + c|g| decreases (the improved HL-RF of Zhang &amp; Der Kiureghian, Proc. IFIP WG 7.5 (1995)).
 *
 * <p>The draws come from N(z*, I), or with several targets from the mixture Σ α_c N(z*_c, I) with α_c ∝ Φ(−β_c)
 * (targets whose Φ(−β) is below 1e-3 of the largest get no component), and are weighted by w = φ(z)/q(z),
 * q = Σ α_c φ(z − s_c); for a single shift s this is φ(z)/φ(z − s) = exp(−s·z + |s|²/2). The estimator
 * p̂ = mean(w·I_fail) is unbiased for any shift; its standard error is sd(w·I_fail)/√n and the interval
 * p̂ ± z·se. Kish's effective sample size (Σw)²/Σw² is shown (e.g. Owen, Monte Carlo theory, methods and
 * examples (2013), ch. 9); for a rare event it is small by design (the draws avoid the bulk), and the effective
 * number of failing draws (Σ w I)²/Σ (w I)² is the one that measures the estimate. Draws whose model run fails
 * count as passing; the weighted probability of such inputs is reported beside the estimate.
 *
 * <p>Reproducible: the draws are cut into fixed chunks, each with its own Commons RNG stream seeded by
 * (seed, chunk), and sums are formed in draw order, so the result is bit-identical for any thread count.
 */
public final class TailYield {

    /** Draws per random stream. */
    static final int CHUNK = 512;
    private static final long SALT = 0x7a11_f00d_5eedL;
    private static final double SQRT2 = Math.sqrt(2);
    /** Components whose Φ(−β) is below this fraction of the largest get no draws. */
    private static final double DROP_COMPONENT = 1e-3;
    private static final double U_MAX = 1 - 0x1.0p-53;

    private TailYield() {
    }

    /**
     * @param runs          importance-sampling draws
     * @param seed          seed of the draws
     * @param confidence    confidence level of the intervals
     * @param threads       worker threads (0 = all processors); the result does not depend on it
     * @param maxIterations design-point iterations per target
     * @param tolerance     convergence tolerance of the design point (in z, relative to max(1, |z|), and of
     *                      |g| relative to |g(0)|)
     * @param gradientStep  forward-difference step in z
     */
    public record Options(int runs, long seed, double confidence, int threads, int maxIterations, double tolerance,
                          double gradientStep) {

        public Options {
            if (runs < 2) {
                throw new IllegalArgumentException("importance sampling needs at least 2 runs, got " + runs);
            }
            if (!(confidence > 0 && confidence < 1)) {
                throw new IllegalArgumentException("confidence must lie in (0, 1), got " + confidence);
            }
            if (maxIterations < 1 || !(tolerance > 0) || !(gradientStep > 0)) {
                throw new IllegalArgumentException("design-point search needs iterations >= 1, tolerance > 0, step > 0");
            }
        }

        public static Options defaults() {
            return new Options(4000, 1, 0.95, 1, 50, 1e-4, 1e-4);
        }

        public Options withRuns(int r) {
            return new Options(r, seed, confidence, threads, maxIterations, tolerance, gradientStep);
        }

        public Options withSeed(long s) {
            return new Options(runs, s, confidence, threads, maxIterations, tolerance, gradientStep);
        }

        public Options withConfidence(double c) {
            return new Options(runs, seed, c, threads, maxIterations, tolerance, gradientStep);
        }

        public Options withThreads(int t) {
            return new Options(runs, seed, confidence, t, maxIterations, tolerance, gradientStep);
        }
    }

    /**
     * Failure probability (any target violated) and yield by importance sampling.
     *
     * @throws StudyException when a target names an output the model does not have
     */
    public static TailYieldResult estimate(Model model, InputSpace space, List<Target> targets, Options o) {
        return estimate(Engine.local(Parallel.threads(o.threads())), model, space, targets, o);
    }

    /** As {@link #estimate(Model, InputSpace, List, Options)}, the importance-sampling runs on {@code engine}. */
    public static TailYieldResult estimate(Engine engine, Model model, InputSpace space, List<Target> targets,
                                           Options o) {
        if (targets.isEmpty()) {
            throw new IllegalArgumentException("no targets to compute a failure probability against");
        }
        checkDimensions(model, space);
        int[] col = columns(model, targets);
        List<TailYieldResult.DesignPoint> points = new ArrayList<>();
        int searchRuns = 0;
        for (Target t : targets) {
            TailYieldResult.DesignPoint p = designPoint(model, space, t, o);
            points.add(p);
            searchRuns += p.modelRuns();
        }
        Proposal proposal = Proposal.of(points, space.dimension());
        Draws d = draw(engine, model, space, targets, col, proposal, o);
        return summarise(targets, points, proposal, d, searchRuns, o);
    }

    /**
     * The most probable failure point of one target, by the improved HL-RF iteration on the model.
     *
     * @throws StudyException        when the target names an output the model does not have
     * @throws IllegalStateException when the model fails at the median point (z = 0)
     */
    public static TailYieldResult.DesignPoint designPoint(Model model, InputSpace space, Target target, Options o) {
        checkDimensions(model, space);
        int c = columns(model, List.of(target))[0];
        return new Search(model, space, target, c, o).run();
    }

    private static void checkDimensions(Model model, InputSpace space) {
        if (!model.inputIds().equals(space.ids())) {
            throw new IllegalArgumentException("input space " + space.ids() + " does not match the model's inputs "
                    + model.inputIds());
        }
    }

    static int[] columns(Model model, List<Target> targets) {
        int[] col = new int[targets.size()];
        for (int t = 0; t < targets.size(); t++) {
            Target g = targets.get(t);
            col[t] = model.outputIndex(g.output());
            if (col[t] < 0) {
                List<String> ids = new ArrayList<>();
                model.outputs().forEach(d -> ids.add(d.id()));
                throw StudyException.at(g.where(), "unknown output '" + g.output() + "'; the model gives "
                        + String.join(", ", ids));
            }
        }
        return col;
    }

    /** Φ(z), accurate in both tails, clamped to the open interval (0, 1). */
    static double phiCdf(double z) {
        double u = z < 0 ? 0.5 * Erf.erfc(-z / SQRT2) : 1 - 0.5 * Erf.erfc(z / SQRT2);
        return Math.max(Double.MIN_NORMAL, Math.min(U_MAX, u));
    }

    /** Upper tail Φ(−b) without cancellation. */
    static double upperTail(double b) {
        return 0.5 * Erf.erfc(b / SQRT2);
    }

    static void toUniform(double[] z, double[] u) {
        for (int i = 0; i < z.length; i++) {
            u[i] = phiCdf(z[i]);
        }
    }

    /** Margin of a target: ≥ 0 met, < 0 violated; NaN stays NaN. */
    static double margin(Target t, double y) {
        return t.atLeast() ? y - t.value() : t.value() - y;
    }

    /** The design-point search for one target, with its scratch arrays. */
    private static final class Search {
        private final InputSpace space;
        private final Target target;
        private final int col;
        private final Options o;
        private final Evaluator ev;
        private final int k;
        private final double[] u;
        private final double[] x;
        private final double[] y;
        private final double[] zh;
        private int runs;

        Search(Model model, InputSpace space, Target target, int col, Options o) {
            this.space = space;
            this.target = target;
            this.col = col;
            this.o = o;
            this.ev = model.newEvaluator();
            this.k = space.dimension();
            this.u = new double[k];
            this.x = new double[k];
            this.y = new double[model.outputs().size()];
            this.zh = new double[k];
        }

        /** g(z), NaN when the model fails there. */
        double g(double[] z) {
            toUniform(z, u);
            space.map(u, x);
            runs++;
            try {
                ev.evaluate(x, y);
            } catch (ModelException e) {
                return Double.NaN;
            }
            return margin(target, y[col]);
        }

        /** Forward-difference gradient; false when a perturbed run failed. */
        boolean gradient(double[] z, double g0, double[] grad) {
            double h = o.gradientStep();
            for (int i = 0; i < k; i++) {
                System.arraycopy(z, 0, zh, 0, k);
                zh[i] += h;
                double gi = g(zh);
                if (Double.isNaN(gi)) {
                    return false;
                }
                grad[i] = (gi - g0) / h;
            }
            return true;
        }

        TailYieldResult.DesignPoint run() {
            double[] z = new double[k];
            double g0 = g(z);
            if (Double.isNaN(g0)) {
                throw new IllegalStateException("the model fails at the median point of the inputs ("
                        + target.describe() + "): no design point can be searched");
            }
            if (g0 <= 0) {
                return result(z, 0, true, "the median point already violates " + target.describe()
                        + ": the failure is not rare, draws are not shifted");
            }
            double[] grad = new double[k];
            double[] d = new double[k];
            double[] zNew = new double[k];
            double g = g0;
            String note = "";
            boolean converged = false;
            int it = 0;
            while (it < o.maxIterations()) {
                it++;
                if (!gradient(z, g, grad)) {
                    note = "the model failed next to the search point; the search stopped early";
                    break;
                }
                double gg = dot(grad, grad);
                if (!(gg > 0) || !Double.isFinite(gg)) {
                    note = "the output does not change with the inputs near the search point; the search stopped";
                    break;
                }
                double a = (dot(grad, z) - g) / gg;
                for (int i = 0; i < k; i++) {
                    d[i] = a * grad[i] - z[i];
                }
                double zn = norm(z);
                double full = norm(linear(z, d, 1, zNew));
                double cPen = 2 * Math.max(zn, full) / Math.sqrt(gg) + 1e-12;
                double merit = 0.5 * zn * zn + cPen * Math.abs(g);
                double lambda = 1;
                double gNew = Double.NaN;
                boolean accepted = false;
                for (int half = 0; half < 12; half++, lambda *= 0.5) {
                    linear(z, d, lambda, zNew);
                    gNew = g(zNew);
                    if (Double.isNaN(gNew)) {
                        continue;
                    }
                    double nn = norm(zNew);
                    if (0.5 * nn * nn + cPen * Math.abs(gNew) < merit) {
                        accepted = true;
                        break;
                    }
                }
                if (!accepted) {
                    if (Double.isNaN(gNew)) {
                        note = "the model failed along the search direction; the search stopped early";
                    } else {
                        converged = Math.abs(g) <= o.tolerance() * g0
                                && norm(d) <= Math.sqrt(o.tolerance()) * Math.max(1, zn);
                        if (!converged) {
                            note = "no step improved the design point; the search stopped early";
                        }
                    }
                    break;
                }
                double step = 0;
                for (int i = 0; i < k; i++) {
                    step = Math.max(step, Math.abs(zNew[i] - z[i]));
                }
                System.arraycopy(zNew, 0, z, 0, k);
                g = gNew;
                if (step <= o.tolerance() * Math.max(1, norm(z)) && Math.abs(g) <= o.tolerance() * g0) {
                    converged = true;
                    break;
                }
            }
            if (!converged && note.isEmpty()) {
                note = "the design-point search did not converge in " + o.maxIterations() + " iterations";
            }
            return result(z, it, converged, note);
        }

        private TailYieldResult.DesignPoint result(double[] z, int iterations, boolean converged, String note) {
            double beta = norm(z);
            toUniform(z, u);
            space.map(u, x);
            List<TailYieldResult.Coordinate> cs = new ArrayList<>();
            for (int i = 0; i < k; i++) {
                cs.add(new TailYieldResult.Coordinate(space.ids().get(i), z[i], x[i], beta > 0 ? z[i] / beta : 0));
            }
            return new TailYieldResult.DesignPoint(target.describe(), target.output(), beta, upperTail(beta),
                    converged, iterations, runs, cs, note);
        }
    }

    private static double[] linear(double[] z, double[] d, double lambda, double[] out) {
        for (int i = 0; i < z.length; i++) {
            out[i] = z[i] + lambda * d[i];
        }
        return out;
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    private static double norm(double[] a) {
        return Math.sqrt(dot(a, a));
    }

    /** Mixture of N(s_c, I) over the design points, weights ∝ Φ(−β_c). */
    record Proposal(List<String> specs, double[][] shifts, double[] weights, double[] offsets, double[] cumulative) {

        static Proposal of(List<TailYieldResult.DesignPoint> points, int k) {
            double best = 0;
            for (TailYieldResult.DesignPoint p : points) {
                best = Math.max(best, p.formProbability());
            }
            List<TailYieldResult.DesignPoint> kept = new ArrayList<>();
            for (TailYieldResult.DesignPoint p : points) {
                if (p.formProbability() >= DROP_COMPONENT * best && p.formProbability() > 0) {
                    kept.add(p);
                }
            }
            if (kept.isEmpty()) {
                kept.add(points.get(0));
            }
            int m = kept.size();
            double[][] s = new double[m][];
            double[] w = new double[m];
            double[] h = new double[m];
            double[] cum = new double[m];
            List<String> specs = new ArrayList<>();
            double sum = 0;
            for (int c = 0; c < m; c++) {
                s[c] = kept.get(c).standardPoint();
                w[c] = Math.max(kept.get(c).formProbability(), Double.MIN_NORMAL);
                h[c] = 0.5 * dot(s[c], s[c]);
                specs.add(kept.get(c).spec());
                sum += w[c];
            }
            double run = 0;
            for (int c = 0; c < m; c++) {
                w[c] /= sum;
                run += w[c];
                cum[c] = run;
                h[c] = Math.log(w[c]) - h[c];
            }
            cum[m - 1] = 1;
            return new Proposal(specs, s, w, h, cum);
        }

        int pick(double r) {
            for (int c = 0; c < cumulative.length - 1; c++) {
                if (r < cumulative[c]) {
                    return c;
                }
            }
            return cumulative.length - 1;
        }

        /**
         * log w = log φ(z) − log Σ α_c φ(z − s_c) = −log Σ exp(s_c·z + o_c), o_c = log α_c − |s_c|²/2, summed with
         * the largest term factored out.
         */
        double logWeight(double[] z) {
            int m = weights.length;
            if (m == 1) {
                return -(dot(shifts[0], z) + offsets[0]);
            }
            double max = Double.NEGATIVE_INFINITY;
            for (int c = 0; c < m; c++) {
                max = Math.max(max, dot(shifts[c], z) + offsets[c]);
            }
            double s = 0;
            for (int c = 0; c < m; c++) {
                s += Math.exp(dot(shifts[c], z) + offsets[c] - max);
            }
            return -(max + Math.log(s));
        }
    }

    /** Per-draw records, in draw order. */
    record Draws(double[] weight, boolean[][] fail, boolean[] error, int[] component) {
    }

    private static Draws draw(Engine engine, Model model, InputSpace space, List<Target> targets, int[] col,
                              Proposal p, Options o) {
        int n = o.runs();
        int nt = targets.size();
        double[] w = new double[n];
        boolean[][] fail = new boolean[nt][n];
        boolean[] err = new boolean[n];
        int[] comp = new int[n];
        Target[] ts = targets.toArray(new Target[0]);
        ModelRows.run(engine, new DrawRows(model, space, p, n, o.seed()), (in, out) -> {
            int from = (int) in.chunk() * CHUNK;
            for (int t = 0; t < in.rows(); t++) {
                int j = from + t;
                w[j] = in.notes()[2 * t];
                comp[j] = (int) in.notes()[2 * t + 1];
                boolean bad = !out.ran(t);
                for (int q = 0; q < nt && !bad; q++) {
                    bad = Double.isNaN(out.value(t, col[q]));
                }
                err[j] = bad;
                if (!bad) {
                    for (int q = 0; q < nt; q++) {
                        fail[q][j] = !ts[q].isMet(out.value(t, col[q]));
                    }
                }
            }
        });
        return new Draws(w, fail, err, comp);
    }

    /**
     * The importance-sampling draws in chunks of {@link #CHUNK}, each from its own stream (seed, chunk):
     * per draw the mixture component, z, its weight w = φ(z)/q(z) and the inputs x(z); the notes hold
     * (w, component) per draw.
     */
    private record DrawRows(Model model, InputSpace space, Proposal p, int n, long seed) implements RowBatch {

        @Override
        public String name() {
            return "importance sampling";
        }

        @Override
        public long chunkCount() {
            return (n + CHUNK - 1) / CHUNK;
        }

        @Override
        public RowInputs inputs(long chunk) {
            int k = space.dimension();
            UniformRandomProvider rng = RandomSource.XO_SHI_RO_256_PP.create(new long[] {seed, chunk, SALT});
            ZigguratSampler.NormalizedGaussian gauss = ZigguratSampler.NormalizedGaussian.of(rng);
            int first = (int) chunk * CHUNK;
            int rows = Math.min(n, first + CHUNK) - first;
            double[] x = new double[rows * k];
            double[] notes = new double[2 * rows];
            double[] z = new double[k];
            double[] u = new double[k];
            double[] xi = new double[k];
            for (int t = 0; t < rows; t++) {
                int c = p.pick(rng.nextDouble());
                double[] s = p.shifts()[c];
                for (int i = 0; i < k; i++) {
                    z[i] = s[i] + gauss.sample();
                }
                notes[2 * t] = Math.exp(p.logWeight(z));
                notes[2 * t + 1] = c;
                toUniform(z, u);
                space.map(u, xi);
                System.arraycopy(xi, 0, x, t * k, k);
            }
            return new RowInputs(chunk, rows, k, 1, x, notes);
        }
    }

    private static TailYieldResult summarise(List<Target> targets, List<TailYieldResult.DesignPoint> points,
                                             Proposal p, Draws d, int searchRuns, Options o) {
        int n = o.runs();
        int nt = targets.size();
        double zc = Stats.zFor(o.confidence());
        List<TailYieldResult.FailureLine> lines = new ArrayList<>();
        for (int t = 0; t < nt; t++) {
            lines.add(line(targets.get(t).describe(), d.weight(), d.fail()[t], zc));
        }
        boolean[] any = new boolean[n];
        for (int j = 0; j < n; j++) {
            for (int t = 0; t < nt && !any[j]; t++) {
                any[j] = d.fail()[t][j];
            }
        }
        TailYieldResult.FailureLine all = line(nt == 1 ? targets.get(0).describe() : "any target", d.weight(), any, zc);
        TailYieldResult.FailureLine err = line("failed runs", d.weight(), d.error(), zc);
        double sw = 0;
        double sw2 = 0;
        int failedRuns = 0;
        for (int j = 0; j < n; j++) {
            sw += d.weight()[j];
            sw2 += d.weight()[j] * d.weight()[j];
            failedRuns += d.error()[j] ? 1 : 0;
        }
        double ess = sw2 > 0 ? sw * sw / sw2 : 0;
        int[] per = new int[p.weights().length];
        for (int c : d.component()) {
            per[c]++;
        }
        List<TailYieldResult.ProposalComponent> comps = new ArrayList<>();
        for (int c = 0; c < per.length; c++) {
            comps.add(new TailYieldResult.ProposalComponent(p.specs().get(c), p.weights()[c], per[c]));
        }
        double pHat = all.probability();
        double plainRuns = all.se() > 0 ? pHat * (1 - pHat) / (all.se() * all.se()) : Double.NaN;
        List<String> notes = new ArrayList<>();
        for (TailYieldResult.DesignPoint dp : points) {
            if (!dp.note().isEmpty()) {
                notes.add(dp.spec() + ": " + dp.note() + ".");
            }
        }
        if (all.failingDraws() == 0) {
            notes.add(String.format(Locale.ROOT, "No draw violated a target: the failure probability is not"
                    + " estimated (first-order estimate %.3g from the design point).", best(points)));
        } else if (all.essFailing() < 30) {
            notes.add(String.format(Locale.ROOT, "Only %.0f effective failing draws: the interval is rough; use more"
                    + " runs.", all.essFailing()));
        }
        if (failedRuns > 0) {
            notes.add(String.format(Locale.ROOT, "%d of %d draws failed to evaluate and count as passing; their"
                    + " estimated probability is %.3g (se %.2g): counted as failures the failure probability would"
                    + " be %.3g.", failedRuns, n, err.probability(), err.se(), pHat + err.probability()));
        }
        return new TailYieldResult(n, searchRuns, failedRuns, o.seed(), o.confidence(), points, comps, lines, all, ess,
                ess / n, err.probability(), err.se(), 1 - pHat, 1 - all.high(),
                1 - all.low(), plainRuns, String.join(" ", notes));
    }

    private static double best(List<TailYieldResult.DesignPoint> points) {
        double b = 0;
        for (TailYieldResult.DesignPoint p : points) {
            b = Math.max(b, p.formProbability());
        }
        return b;
    }

    /** p̂ = mean(w I), se = sd(w I)/√n (divisor n − 1), interval p̂ ± z se. */
    static TailYieldResult.FailureLine line(String spec, double[] w, boolean[] hit, double zc) {
        int n = w.length;
        double s = 0;
        double s2 = 0;
        long count = 0;
        for (int j = 0; j < n; j++) {
            if (hit[j]) {
                s += w[j];
                s2 += w[j] * w[j];
                count++;
            }
        }
        double p = s / n;
        double var = Math.max(0, (s2 - n * p * p) / (n - 1.0));
        double se = Math.sqrt(var / n);
        double ess = s2 > 0 ? s * s / s2 : 0;
        double high = count == 0 ? Double.NaN : p + zc * se;
        return new TailYieldResult.FailureLine(spec, count, p, se, Math.max(0, p - zc * se), high,
                p > 0 ? se / p : Double.NaN, ess);
    }
}
