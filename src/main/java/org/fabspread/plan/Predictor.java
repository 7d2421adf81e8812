package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.ModelRows;
import org.fabspread.sampling.RowBatch;
import org.fabspread.sampling.RowInputs;

/**
 * What the model expects a plan to show. Each design point is evaluated with the factors at their
 * levels and every other input at its nominal value; the estimable terms ({@link Term#estimable}) are
 * fitted by least squares, which for an orthogonal two-level plan is exactly the contrast
 * (mean at + minus mean at −). The noise the uncontrolled inputs add is estimated by Monte Carlo:
 * at a set of design points, {@code draws} points of the input space (seeded, mapped through the
 * study's marginals and copula) with the factors then set to the point's levels; σ_noise is the root
 * mean of the per-point variances.
 */
public final class Predictor {

    /**
     * @param terms       the estimable terms, in order
     * @param effects     predicted effect of each term (response unit)
     * @param pointValues predicted response at each design point (standard order, no centre points)
     * @param centreValue predicted response at the centre
     * @param sigmaNoise  run-to-run standard deviation from the uncontrolled inputs
     * @param noisePoints design points the Monte Carlo used
     * @param draws       draws per point
     * @param failedDraws draws the model refused (outside its domain), left out
     */
    public record Result(List<Term> terms, double[] effects, double[] pointValues, double centreValue,
                         double sigmaNoise, int noisePoints, int draws, int failedDraws) {
    }

    private Predictor() {
    }

    public static Result predict(Model model, InputSpace space, CodedDesign design, List<Factor> factors,
                                 String response, int draws, int maxNoisePoints, long seed) {
        return predict(Engine.local(1), model, space, design, factors, response, draws, maxNoisePoints, seed);
    }

    /**
     * As {@link #predict(Model, InputSpace, CodedDesign, List, String, int, int, long)}, the noise draws
     * (drawn here from one stream, in order) evaluated on {@code engine}, one chunk per design point.
     */
    public static Result predict(Engine engine, Model model, InputSpace space, CodedDesign design,
                                 List<Factor> factors, String response, int draws, int maxNoisePoints, long seed) {
        int out = model.outputIndex(response);
        if (out < 0) {
            throw new IllegalArgumentException("the model has no output " + response);
        }
        int nIn = model.inputIds().size();
        int[] factorIdx = new int[factors.size()];
        for (int i = 0; i < factors.size(); i++) {
            factorIdx[i] = model.inputIndex(factors.get(i).id());
            if (factorIdx[i] < 0) {
                throw new IllegalArgumentException("the model has no input " + factors.get(i).id());
            }
        }
        double[] nominal = new double[nIn];
        for (int i = 0; i < nIn; i++) {
            int s = space.ids().indexOf(model.inputIds().get(i));
            nominal[i] = space.marginals().get(s).nominal();
        }
        Evaluator ev = model.newEvaluator();
        double[] x = new double[nIn];
        double[] y = new double[model.outputs().size()];
        double[][] pts = design.points();
        double[] values = new double[pts.length];
        for (int p = 0; p < pts.length; p++) {
            values[p] = evaluate(ev, nominal, x, y, out, pts[p], factors, factorIdx);
        }
        double centre = evaluate(ev, nominal, x, y, out, new double[factors.size()], factors, factorIdx);

        List<Term> terms = Term.estimable(design);
        LeastSquares fit = LeastSquares.fit(terms, fitPoints(design, factors), fitValues(design, values, centre));
        double[] effects = new double[terms.size()];
        for (int t = 0; t < terms.size(); t++) {
            effects[t] = fit.effect(terms, t);
        }

        // noise: Monte Carlo over the uncontrolled inputs at up to maxNoisePoints design points
        int[] spaceToModel = new int[space.dimension()];
        for (int s = 0; s < space.dimension(); s++) {
            spaceToModel[s] = model.inputIndex(space.ids().get(s));
        }
        int nPts = Math.min(Math.max(1, maxNoisePoints), pts.length);
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        double[] u = new double[space.dimension()];
        double[] v = new double[space.dimension()];
        double[] rows = new double[nPts * draws * nIn];
        for (int q = 0; q < nPts; q++) {
            int p = (int) ((long) q * pts.length / nPts);
            for (int d = 0; d < draws; d++) {
                for (int s = 0; s < u.length; s++) {
                    u[s] = (rng.nextLong() >>> 11) * 0x1.0p-53 + 0x1.0p-54;
                }
                space.map(u, v);
                System.arraycopy(nominal, 0, x, 0, nIn);
                for (int s = 0; s < v.length; s++) {
                    if (spaceToModel[s] >= 0) {
                        x[spaceToModel[s]] = v[s];
                    }
                }
                set(x, pts[p], factors, factorIdx);
                System.arraycopy(x, 0, rows, (q * draws + d) * nIn, nIn);
            }
        }
        double[] varSum = {0};
        int[] failed = {0};
        ModelRows.run(engine, new NoiseRows(model, rows, draws * nIn, nIn), (in, res) -> {
            double sum = 0;
            double sum2 = 0;
            int ok = 0;
            for (int d = 0; d < in.rows(); d++) {
                double value = res.value(d, out);
                if (!res.ran(d) || !Double.isFinite(value)) {
                    failed[0]++;
                    continue;
                }
                sum += value;
                sum2 += value * value;
                ok++;
            }
            if (ok > 1) {
                double mean = sum / ok;
                varSum[0] += Math.max(0, (sum2 - ok * mean * mean) / (ok - 1));
            }
        });
        double sigma = Math.sqrt(varSum[0] / nPts);
        return new Result(terms, effects, values, centre, sigma, nPts, draws, failed[0]);
    }

    /** The noise draws, one chunk per design point (its {@code draws} rows, drawn above from one stream). */
    private record NoiseRows(Model model, double[] rows, int perChunk, int width) implements RowBatch {

        @Override
        public String name() {
            return "plan noise estimate";
        }

        @Override
        public long chunkCount() {
            return perChunk == 0 ? 0 : rows.length / perChunk;
        }

        @Override
        public RowInputs inputs(long chunk) {
            int from = (int) chunk * perChunk;
            return RowInputs.of(chunk, width, java.util.Arrays.copyOfRange(rows, from, from + perChunk));
        }
    }

    /**
     * The coded points the prediction is fitted on: each design point at its rounded settings
     * (coded back), and for a second-order design one centre point, without which the squared terms
     * cannot be told from the mean (every Box–Behnken point, and every point of a rotatable composite
     * design in two factors, lies at the same distance from the centre).
     */
    public static double[][] fitPoints(CodedDesign design, List<Factor> factors) {
        double[][] pts = design.points();
        int extra = design.isSecondOrder() ? 1 : 0;
        double[][] out = new double[pts.length + extra][];
        for (int p = 0; p < pts.length; p++) {
            out[p] = new double[pts[p].length];
            for (int i = 0; i < pts[p].length; i++) {
                Factor f = factors.get(i);
                out[p][i] = f.coded(f.setting(pts[p][i]));
            }
        }
        if (extra == 1) {
            out[pts.length] = new double[design.factors()];
            for (int i = 0; i < design.factors(); i++) {
                Factor f = factors.get(i);
                out[pts.length][i] = f.coded(f.setting(0));
            }
        }
        return out;
    }

    private static double[] fitValues(CodedDesign design, double[] values, double centre) {
        if (!design.isSecondOrder()) {
            return values;
        }
        double[] v = java.util.Arrays.copyOf(values, values.length + 1);
        v[values.length] = centre;
        return v;
    }

    /** The response at one design point, the other inputs nominal; a refusal names the run ({@link PlanRefused}). */
    private static double evaluate(Evaluator ev, double[] nominal, double[] x, double[] y, int out, double[] coded,
                                   List<Factor> factors, int[] idx) {
        System.arraycopy(nominal, 0, x, 0, x.length);
        set(x, coded, factors, idx);
        try {
            ev.evaluate(x, y);
        } catch (ModelException e) {
            throw PlanRefused.of(e, factors, coded);
        }
        return y[out];
    }

    private static void set(double[] x, double[] coded, List<Factor> factors, int[] idx) {
        for (int i = 0; i < idx.length; i++) {
            x[idx[i]] = factors.get(i).setting(coded[i]);
        }
    }

    /** Index of the smallest |effect| among main effects, or -1. */
    public static int smallestMainEffect(Result r) {
        int best = -1;
        for (int t = 0; t < r.terms().size(); t++) {
            if (r.terms().get(t).isMain() && (best < 0 || Math.abs(r.effects()[t]) < Math.abs(r.effects()[best]))) {
                best = t;
            }
        }
        return best;
    }

    /** Terms as a list of labels. */
    public static List<String> labels(List<Term> terms) {
        List<String> l = new ArrayList<>();
        for (Term t : terms) {
            l.add(t.label());
        }
        return l;
    }
}
