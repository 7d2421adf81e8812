package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;

import org.apache.commons.math3.random.SobolSequenceGenerator;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.ModelRows;
import org.fabspread.sampling.RowBatch;
import org.fabspread.sampling.RowInputs;
import org.fabspread.sampling.RowOutputs;
import org.fabspread.sampling.Interval;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.StudyException;

/**
 * First-order and total Sobol indices of every model output on the design of Saltelli et al.,
 * Comput. Phys. Commun. 181, 259 (2010).
 *
 * <p>A and B are the two halves of one 2k-dimensional point set (independent random points, or a
 * 2k-dimensional Sobol sequence with a random Cranley–Patterson shift); A_B^(i) is A with its column i
 * taken from B. With outputs centred on their mean f0 and V the sample variance of the 2N values f(A),
 * f(B):
 * <ul>
 *   <li>first order S_i = (1/N) Σ_j (f(B)_j − f0) (f(A_B^(i))_j − f(A)_j) / V (Saltelli et al. 2010);</li>
 *   <li>total S_Ti = (1/2N) Σ_j (f(A)_j − f(A_B^(i))_j)² / V (Jansen, Comput. Phys. Commun. 117, 35 (1999)).</li>
 * </ul>
 * Intervals: for random points a percentile bootstrap that resamples the same rows j of f(A), f(B) and
 * every f(A_B^(i)) together and recomputes f0 and V each time; for quasi-random points R independent
 * randomisations and a Student t interval across their estimates. Estimates are reported raw.
 *
 * <p>The indices are computed on the independent uniforms that {@link InputSpace#map} turns into inputs;
 * with correlated inputs they describe those underlying variables, and the result says so.
 *
 * <p>Model runs are a {@link RowBatch} of fixed chunks of design rows, evaluated on the caller's engine
 * and stored by row index in chunk order; the point set and every bootstrap stream derive from the seed alone, so
 * the result is bit-identical for any thread count.
 */
public final class SobolIndices {

    /** Rows per unit of parallel work. */
    private static final int CHUNK_ROWS = 32;
    private static final long SHIFT_SALT = 0xbb67ae8584caa73bL;
    private static final double TINY = 0x1.0p-53;

    /** How A and B are drawn. */
    public enum Points { RANDOM, QUASI_RANDOM }

    /**
     * Settings of one Sobol computation.
     *
     * @param n          base sample size N; for quasi-random points N/replicates must be a power of two
     * @param points     random or randomised quasi-random points
     * @param seed       master seed of the points, shifts and bootstrap
     * @param bootstrap  bootstrap resamples (random points; 0 = no intervals)
     * @param replicates independent randomisations (quasi-random points, at least 2)
     * @param confidence two-sided confidence level of the intervals
     * @param threads    worker threads, 0 = all processors
     */
    public record Options(int n, Points points, long seed, int bootstrap, int replicates, double confidence,
                          int threads) {
        public Options {
            if (n < 8) {
                throw new IllegalArgumentException("Sobol base sample size must be at least 8, got " + n);
            }
            if (!(confidence > 0 && confidence < 1)) {
                throw new IllegalArgumentException("confidence must lie in (0, 1), got " + confidence);
            }
            if (bootstrap < 0) {
                throw new IllegalArgumentException("bootstrap resamples must be >= 0, got " + bootstrap);
            }
            if (points == Points.QUASI_RANDOM) {
                if (replicates < 2 || n % replicates != 0 || Integer.bitCount(n / replicates) != 1
                        || n / replicates < 4) {
                    throw new IllegalArgumentException("quasi-random Sobol indices need N = R * 2^m with R >= 2"
                            + " randomisations of at least 4 points each, got N = " + n + ", R = " + replicates);
                }
            }
        }

        /** Random points, 200 bootstrap resamples, 95 % intervals, all processors. */
        public static Options random(int n, long seed) {
            return new Options(n, Points.RANDOM, seed, 200, 0, 0.95, 0);
        }

        /** Randomised Sobol points in {@code replicates} independent shifts, 95 % intervals. */
        public static Options quasiRandom(int n, long seed, int replicates) {
            return new Options(n, Points.QUASI_RANDOM, seed, 0, replicates, 0.95, 0);
        }

        public Options withBootstrap(int b) {
            return new Options(n, points, seed, b, replicates, confidence, threads);
        }

        public Options withConfidence(double c) {
            return new Options(n, points, seed, bootstrap, replicates, c, threads);
        }

        public Options withThreads(int t) {
            return new Options(n, points, seed, bootstrap, replicates, confidence, t);
        }

        public Options withSeed(long s) {
            return new Options(n, points, s, bootstrap, replicates, confidence, threads);
        }

        /**
         * From a study's analysis settings: Sobol points when the study samples with Sobol points (8
         * randomisations, fewer when N is small), random points with a bootstrap otherwise.
         *
         * @throws StudyException when the base size does not fit the chosen points
         */
        public static Options from(AnalysisSettings a, int threads) {
            return from(a, 0, threads);
        }

        /** As {@link #from(AnalysisSettings, int)} with base size {@code base} (0: the study's {@code sobol_base}). */
        public static Options from(AnalysisSettings a, int base, int threads) {
            int n = base > 0 ? base : a.sobolBase();
            try {
                if (a.sampler() == AnalysisSettings.Sampler.SOBOL) {
                    int r = 8;
                    while (r > 2 && n / r < 16) {
                        r /= 2;
                    }
                    if (Integer.bitCount(n) != 1) {
                        throw new IllegalArgumentException("must be a power of two with Sobol points, got "
                                + n);
                    }
                    return new Options(n, Points.QUASI_RANDOM, a.seed(), 0, r, a.confidence(), threads);
                }
                return new Options(n, Points.RANDOM, a.seed(), a.bootstrap(), 0, a.confidence(), threads);
            } catch (IllegalArgumentException e) {
                throw new StudyException("<study>: analysis.sobol_base: " + e.getMessage());
            }
        }
    }

    private SobolIndices() {
    }

    /** Model runs of the design: N (k + 2). */
    public static long cost(int n, int k) {
        return (long) n * (k + 2);
    }

    /** Model runs of the design with g group columns: N (k + 2 + g). */
    public static long cost(int n, int k, int groups) {
        return (long) n * (k + 2 + groups);
    }

    /** Indices with the design they came from (for export and audit). */
    public record Run(SobolResult result, SobolDesign design) {
    }

    /**
     * Runs the design and estimates the indices of every output.
     *
     * @param model    the model; its input ids must equal the input space's, in order
     * @param space    maps independent uniforms to inputs
     * @param options  sizes, seed and interval method
     * @param progress told the number of model runs done (may be called from worker threads)
     */
    public static SobolResult compute(Model model, InputSpace space, Options options, ProgressListener progress) {
        return compute(Engine.local(Parallel.threads(options.threads())), model, space, options, progress);
    }

    /** As {@link #compute(Model, InputSpace, Options, ProgressListener)}, the design's runs on {@code engine}. */
    public static SobolResult compute(Engine engine, Model model, InputSpace space, Options options,
                                      ProgressListener progress) {
        return run(engine, model, space, options, List.of(), progress).result();
    }

    /**
     * Runs the design with one further matrix A_B^(G) per group (A with all of G's columns from B) and
     * estimates the inputs' and the groups' indices; returns the design too.
     */
    public static Run run(Engine engine, Model model, InputSpace space, Options options, List<InputGroup> groups,
                          ProgressListener progress) {
        if (!model.inputIds().equals(space.ids())) {
            throw new IllegalArgumentException("model inputs " + model.inputIds() + " differ from input space "
                    + space.ids());
        }
        int k = space.dimension();
        if (k < 1) {
            throw new IllegalArgumentException("no uncertain inputs: nothing to attribute variance to");
        }
        int n = options.n();
        List<OutputDef> outs = model.outputs();
        int nOut = outs.size();
        double[] u = points(options, k);
        int[][] members = members(space, groups);
        Runs runs = evaluate(engine, model, space, u, n, k, nOut, members,
                progress == null ? ProgressListener.NONE : progress);
        SobolResult result = estimateAll(runs, options, space, model, groups);
        return new Run(result, new SobolDesign(space.ids(), groups, options.points() == Points.QUASI_RANDOM
                ? options.replicates() : 1, n, u, members, runs.fA(), runs.fB(), runs.fAB(), space));
    }

    private static int[][] members(InputSpace space, List<InputGroup> groups) {
        int[][] m = new int[groups.size()][];
        for (int g = 0; g < m.length; g++) {
            List<String> in = groups.get(g).inputs();
            m[g] = new int[in.size()];
            for (int a = 0; a < in.size(); a++) {
                m[g][a] = space.ids().indexOf(in.get(a));
                if (m[g][a] < 0) {
                    throw new IllegalArgumentException("group '" + groups.get(g).name() + "' names '" + in.get(a)
                            + "', not an uncertain input");
                }
            }
        }
        return m;
    }

    /** The raw model outputs of the design: f(A), f(B) and f(A_B^(i)), per output. */
    record Runs(double[][] fA, double[][] fB, double[][][] fAB, boolean[] ok) {
    }

    /** The 2k-dimensional point set, row-major: row j holds A_j in [0, k) and B_j in [k, 2k). */
    static double[] points(Options o, int k) {
        int n = o.n();
        int d = 2 * k;
        double[] u = new double[n * d];
        if (o.points() == Points.RANDOM) {
            UniformRandomProvider rng = RandomSource.XO_SHI_RO_256_PP.create(new long[] {o.seed(), 1});
            for (int i = 0; i < u.length; i++) {
                u[i] = openUniform(rng);
            }
            return u;
        }
        if (d > 1000) {
            throw new IllegalArgumentException("Sobol points support at most 500 inputs, got " + k);
        }
        int r = o.replicates();
        int m = n / r;
        SobolSequenceGenerator gen = new SobolSequenceGenerator(d);
        double[][] base = new double[m][];
        for (int t = 0; t < m; t++) {
            base[t] = gen.nextVector();
        }
        UniformRandomProvider rng = RandomSource.XO_SHI_RO_256_PP.create(new long[] {o.seed() ^ SHIFT_SALT, 2});
        double[] shift = new double[d];
        for (int rep = 0; rep < r; rep++) {
            for (int c = 0; c < d; c++) {
                shift[c] = openUniform(rng);
            }
            for (int t = 0; t < m; t++) {
                int row = rep * m + t;
                for (int c = 0; c < d; c++) {
                    double v = base[t][c] + shift[c];
                    if (v >= 1) {
                        v -= 1;
                    }
                    u[row * d + c] = Math.max(TINY, Math.min(1 - TINY, v));
                }
            }
        }
        return u;
    }

    /** A uniform in the open interval (0, 1): (integer + 1/2) 2^-53. */
    static double openUniform(UniformRandomProvider rng) {
        return ((rng.nextLong() >>> 11) + 0.5) * TINY;
    }

    /** The design's runs; column k + g of f(A_B) is group g's matrix. */
    private static Runs evaluate(Engine engine, Model model, InputSpace space, double[] u, int n, int k, int nOut,
                                 int[][] members, ProgressListener progress) {
        double[][] fA = new double[nOut][n];
        double[][] fB = new double[nOut][n];
        int ng = members.length;
        double[][][] fAB = new double[nOut][k + ng][n];
        boolean[] ok = new boolean[n];
        long total = cost(n, k, ng);
        long[] done = {0};
        int per = k + 2 + ng;
        ModelRows.run(engine, new DesignRows(model, space, u, n, k, members), (in, out) -> {
            int from = (int) in.chunk() * CHUNK_ROWS;
            int rows = in.rows() / per;
            for (int t = 0; t < rows; t++) {
                int row = from + t;
                int base = t * per;
                boolean good = out.finite(base);
                store(out, base, fA, row, good);
                if (good) {
                    good = out.finite(base + 1);
                    store(out, base + 1, fB, row, good);
                }
                for (int i = 0; i < k + ng && good; i++) {
                    good = out.finite(base + 2 + i);
                    for (int m = 0; m < nOut; m++) {
                        fAB[m][i][row] = good ? out.value(base + 2 + i, m) : Double.NaN;
                    }
                }
                ok[row] = good;
            }
            done[0] += (long) rows * per;
            progress.progress(done[0], total);
        });
        return new Runs(fA, fB, fAB, ok);
    }

    /**
     * The design's model runs in chunks of {@link #CHUNK_ROWS} design rows: per design row j the inputs of
     * A_j, B_j, each A_B^(i)_j and each group's A_B^(G)_j, mapped through the input space, one group of
     * rows (a failed run ends the design row, as the estimators drop it).
     */
    private record DesignRows(Model model, InputSpace space, double[] u, int n, int k, int[][] members)
            implements RowBatch {

        @Override
        public String name() {
            return "Sobol design";
        }

        @Override
        public long chunkCount() {
            return (n + CHUNK_ROWS - 1) / CHUNK_ROWS;
        }

        @Override
        public RowInputs inputs(long chunk) {
            int from = (int) chunk * CHUNK_ROWS;
            int to = Math.min(n, from + CHUNK_ROWS);
            int per = k + 2 + members.length;
            int d = 2 * k;
            double[] x = new double[(to - from) * per * k];
            double[] ua = new double[k];
            double[] xi = new double[k];
            int r = 0;
            for (int row = from; row < to; row++) {
                int off = row * d;
                for (int col = 0; col < per; col++) {
                    System.arraycopy(u, col == 1 ? off + k : off, ua, 0, k);
                    if (col >= 2 && col < k + 2) {
                        int i = col - 2;
                        ua[i] = u[off + k + i];
                    } else if (col >= k + 2) {
                        for (int i : members[col - k - 2]) {
                            ua[i] = u[off + k + i];
                        }
                    }
                    space.map(ua, xi);
                    System.arraycopy(xi, 0, x, r++ * k, k);
                }
            }
            return new RowInputs(chunk, (to - from) * per, k, per, x, new double[0]);
        }
    }

    private static void store(RowOutputs out, int r, double[][] dest, int row, boolean good) {
        for (int m = 0; m < dest.length; m++) {
            dest[m][row] = good ? out.value(r, m) : Double.NaN;
        }
    }

    /**
     * The estimators on a list of rows (with repeats, for the bootstrap): fills {@code first} and
     * {@code total} and returns V. Outputs are centred on the mean of the 2·count values of f(A), f(B).
     *
     * @param rows  row indices; the first {@code count} are used
     */
    static double estimate(double[] fA, double[] fB, double[][] fAB, int[] rows, int count, double[] first,
                           double[] total) {
        double s = 0;
        for (int t = 0; t < count; t++) {
            int r = rows[t];
            s += fA[r] + fB[r];
        }
        double mu = s / (2.0 * count);
        double ss = 0;
        for (int t = 0; t < count; t++) {
            int r = rows[t];
            double a = fA[r] - mu;
            double b = fB[r] - mu;
            ss += a * a + b * b;
        }
        double v = ss / (2.0 * count - 1);
        for (int i = 0; i < fAB.length; i++) {
            double[] fi = fAB[i];
            double sf = 0;
            double st = 0;
            for (int t = 0; t < count; t++) {
                int r = rows[t];
                double diff = fi[r] - fA[r];
                sf += (fB[r] - mu) * diff;
                st += diff * diff;
            }
            first[i] = v > 0 ? sf / count / v : Double.NaN;
            total[i] = v > 0 ? st / (2.0 * count) / v : Double.NaN;
        }
        return v;
    }

    static int[] okRows(boolean[] ok, int from, int to) {
        int c = 0;
        for (int j = from; j < to; j++) {
            if (ok[j]) {
                c++;
            }
        }
        int[] rows = new int[c];
        c = 0;
        for (int j = from; j < to; j++) {
            if (ok[j]) {
                rows[c++] = j;
            }
        }
        return rows;
    }

    private static SobolResult estimateAll(Runs runs, Options o, InputSpace space, Model model,
                                           List<InputGroup> groups) {
        int n = o.n();
        int k = space.dimension();
        int kg = k + groups.size();
        List<OutputDef> outs = model.outputs();
        int nOut = outs.size();
        int[] all = okRows(runs.ok(), 0, n);
        int failed = n - all.length;
        if (all.length < 4) {
            throw new IllegalStateException("only " + all.length + " of " + n
                    + " Sobol rows evaluated without failure: no indices can be estimated");
        }
        StringBuilder note = new StringBuilder();
        if (space.correlated()) {
            note.append("Inputs are correlated: the indices of a correlated input are those of the independent"
                    + " uniforms behind the input space (before the copula) and depend on the order of the inputs;"
                    + " the indices of a group holding all of a correlated set, and the Shapley effects, do not. ");
        }
        if (failed > 0) {
            note.append(failed).append(" of ").append(n).append(" rows had a failed model run and were dropped. ");
        }
        double[][] first = new double[nOut][kg];
        double[][] total = new double[nOut][kg];
        double[][] lowF = new double[nOut][kg];
        double[][] highF = new double[nOut][kg];
        double[][] lowT = new double[nOut][kg];
        double[][] highT = new double[nOut][kg];
        double[] variance = new double[nOut];
        double[] mean = new double[nOut];
        for (int m = 0; m < nOut; m++) {
            variance[m] = estimate(runs.fA()[m], runs.fB()[m], runs.fAB()[m], all, all.length, first[m], total[m]);
            double s = 0;
            for (int r : all) {
                s += runs.fA()[m][r] + runs.fB()[m][r];
            }
            mean[m] = s / (2.0 * all.length);
            if (!(variance[m] > 0)) {
                note.append("Output ").append(outs.get(m).id()).append(" does not vary: no indices. ");
            }
        }
        String method;
        if (o.points() == Points.RANDOM) {
            method = "Saltelli et al. 2010 design; first order: Saltelli 2010 estimator on centred outputs;"
                    + " total: Jansen 1999; random points; percentile bootstrap over rows, " + o.bootstrap()
                    + " resamples";
            SobolIntervals.bootstrap(runs, all, o, first, total, lowF, highF, lowT, highT);
        } else {
            method = "Saltelli et al. 2010 design; first order: Saltelli 2010 estimator on centred outputs;"
                    + " total: Jansen 1999; Sobol points with " + o.replicates()
                    + " independent Cranley-Patterson shifts; mean of the replicates with a Student t interval";
            SobolIntervals.replicates(runs, o, first, total, lowF, highF, lowT, highT);
        }
        List<SobolResult.OutputIndices> result = new ArrayList<>();
        for (int m = 0; m < nOut; m++) {
            List<SobolResult.IndexEstimate> list = new ArrayList<>();
            double sum = 0;
            for (int i = 0; i < k; i++) {
                list.add(new SobolResult.IndexEstimate(space.ids().get(i), first[m][i], lowF[m][i], highF[m][i],
                        total[m][i], lowT[m][i], highT[m][i]));
                sum += first[m][i];
            }
            List<SobolResult.GroupEstimate> gl = new ArrayList<>();
            for (int g = 0; g < groups.size(); g++) {
                int c = k + g;
                gl.add(new SobolResult.GroupEstimate(groups.get(g).name(), groups.get(g).inputs(), first[m][c],
                        new Interval(lowF[m][c], highF[m][c]), total[m][c], new Interval(lowT[m][c], highT[m][c])));
            }
            result.add(new SobolResult.OutputIndices(outs.get(m).id(), mean[m], variance[m], sum, list, gl));
        }
        return new SobolResult(method, o.points(), n, space.ids(), cost(n, k, groups.size()), failed, o.confidence(),
                note.toString().trim(), result, convergence(runs, o, k, kg, outs));
    }

    /** Estimates from the first N/8, N/4, N/2 and N rows (per randomisation, for quasi-random points). */
    private static List<SobolResult.ConvergenceStep> convergence(Runs runs, Options o, int k, int kg,
                                                                 List<OutputDef> outs) {
        List<SobolResult.ConvergenceStep> steps = new ArrayList<>();
        int n = o.n();
        boolean quasi = o.points() == Points.QUASI_RANDOM;
        int r = quasi ? o.replicates() : 1;
        int per = n / r;
        for (int div = 8; div >= 1; div /= 2) {
            int use = per / div;
            if (use < 4) {
                continue;
            }
            for (int q = 0; q < outs.size(); q++) {
                double[] f = new double[k];
                double[] t = new double[k];
                double[] fr = new double[kg];
                double[] tr = new double[kg];
                int good = 0;
                for (int rep = 0; rep < r; rep++) {
                    int[] rows = okRows(runs.ok(), rep * per, rep * per + use);
                    if (rows.length < 2) {
                        continue;
                    }
                    estimate(runs.fA()[q], runs.fB()[q], runs.fAB()[q], rows, rows.length, fr, tr);
                    for (int i = 0; i < k; i++) {
                        f[i] += fr[i];
                        t[i] += tr[i];
                    }
                    good++;
                }
                for (int i = 0; i < k; i++) {
                    f[i] = good > 0 ? f[i] / good : Double.NaN;
                    t[i] = good > 0 ? t[i] / good : Double.NaN;
                }
                steps.add(new SobolResult.ConvergenceStep(use * r, outs.get(q).id(), f, t));
            }
        }
        return steps;
    }
}
