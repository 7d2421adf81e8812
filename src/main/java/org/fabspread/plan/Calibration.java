package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;

import org.apache.commons.math3.distribution.TDistribution;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;

/**
 * Fits one to three model inputs to measured runs by least squares: residual_i = y_i − f(run i's
 * factor settings, θ) with the other inputs at nominal.
 *
 * <ol>
 * <li>Identifiability first ({@link Identifiability}): from the Jacobian at the nominal values, the
 * inputs the runs cannot tell apart are reduced to an identifiable subset, and the report says so
 * in one sentence.</li>
 * <li>The fit keeps every input inside its physical range ({@link BoundedFit}).</li>
 * <li>Intervals are profile-likelihood intervals (Bates &amp; Watts, Nonlinear Regression Analysis
 * and Its Applications, 1988, §6.1): the values t of input j whose profile sum of squares S_j(t)
 * (the others refitted) satisfies S_j(t) − S(θ̂) ≤ s² t²_{ν, (1+c)/2}, s² = S(θ̂)/ν, ν = n − q. They
 * are searched only inside the physical range, so an end that reaches a limit is that limit, and
 * says so.</li>
 * </ol>
 * The standard errors are the asymptotic ones, s·sqrt((JᵀJ)⁻¹_jj) with J at θ̂ (Seber &amp; Wild,
 * Nonlinear Regression, ch. 2), for reference beside the profile intervals.
 */
public final class Calibration {

    /**
     * @param ids            fitted inputs
     * @param start          starting values (nominal)
     * @param estimates      fitted values
     * @param stdErrors      asymptotic standard errors
     * @param lower          lower profile-likelihood limits (never below the physical range)
     * @param upper          upper limits (never above it)
     * @param lowerAtLimit   true where the lower limit is the physical range's end
     * @param upperAtLimit   true where the upper limit is the physical range's end
     * @param rangeLow       physical range of each fitted input, lower end
     * @param rangeHigh      upper end
     * @param confidence     confidence level
     * @param residualSd     sqrt(RSS/(n − q))
     * @param dof            n − q
     * @param evaluations    model evaluations of fit and intervals
     * @param heldAtNominal  inputs offered but not identifiable from these runs, held at nominal
     * @param identifiability one sentence on what was reduced and why (empty when nothing was)
     * @param conditionIndex condition index of the inputs offered (NaN for one input)
     * @param maxCorrelation largest |estimate correlation| of the inputs offered (NaN for one input)
     */
    public record Result(List<String> ids, double[] start, double[] estimates, double[] stdErrors, double[] lower,
                         double[] upper, boolean[] lowerAtLimit, boolean[] upperAtLimit, double[] rangeLow,
                         double[] rangeHigh, double confidence, double residualSd, int dof, int evaluations,
                         List<String> heldAtNominal, String identifiability, double conditionIndex,
                         double maxCorrelation) {
        public Result {
            ids = List.copyOf(ids);
            heldAtNominal = List.copyOf(heldAtNominal);
        }

        /** True when input j's interval leaves out the study's nominal value. */
        public boolean excludesNominal(int j) {
            return start[j] < lower[j] || start[j] > upper[j];
        }
    }

    private Calibration() {
    }

    /**
     * @param nominal    every model input at nominal, model order
     * @param factorIdx  model index of each factor
     * @param settings   factor settings of each run, real units [run][factor]
     * @param y          measured response per run
     * @param fitIdx     model indices of the inputs to fit (1–3, not factors)
     * @param scale      a typical size of each fitted input (its σ or nominal)
     * @param rangeLow   physical range of each input to fit, lower end (may be −∞)
     * @param rangeHigh  upper end (may be +∞)
     * @throws IllegalStateException when the model refuses a trial point or the fit does not converge
     */
    public static Result fit(Model model, String response, double[] nominal, int[] factorIdx, double[][] settings,
                             double[] y, int[] fitIdx, double[] scale, double[] rangeLow, double[] rangeHigh,
                             double confidence) {
        int offered = fitIdx.length;
        int n = y.length;
        if (offered < 1 || offered > 3) {
            throw new IllegalArgumentException("calibrate one to three inputs, not " + offered);
        }
        if (n <= offered) {
            throw new IllegalArgumentException("calibrating " + offered + " inputs needs more than " + offered
                    + " measured runs");
        }
        int out = model.outputIndex(response);
        Evaluator ev = model.newEvaluator();
        double[] x = new double[nominal.length];
        double[] o = new double[model.outputs().size()];
        int[] evals = {0};
        List<String> allIds = new ArrayList<>();
        for (int j : fitIdx) {
            allIds.add(model.inputIds().get(j));
        }
        // predictions of every run with the inputs in `which` set to theta
        java.util.function.BiFunction<int[], double[], double[]> predict = (which, theta) -> {
            double[] v = new double[n];
            for (int r = 0; r < n; r++) {
                System.arraycopy(nominal, 0, x, 0, x.length);
                for (int i = 0; i < factorIdx.length; i++) {
                    x[factorIdx[i]] = settings[r][i];
                }
                for (int j = 0; j < which.length; j++) {
                    x[which[j]] = theta[j];
                }
                try {
                    ev.evaluate(x, o);
                } catch (RuntimeException e) {
                    throw new IllegalStateException("the model refuses a trial value (" + e.getMessage() + ")", e);
                }
                v[r] = o[out];
            }
            evals[0] += n;
            return v;
        };
        double[] start0 = new double[offered];
        for (int j = 0; j < offered; j++) {
            start0[j] = nominal[fitIdx[j]];
        }
        double[][] j0 = jacobian(theta -> predict.apply(fitIdx, theta), start0, scale, rangeLow, rangeHigh);
        Identifiability.Check check = Identifiability.check(j0, scale, allIds, response);
        int q = check.kept().size();
        int[] idx = new int[q];
        double[] start = new double[q];
        double[] lo = new double[q];
        double[] hi = new double[q];
        double[] sc = new double[q];
        List<String> ids = new ArrayList<>();
        for (int c = 0; c < q; c++) {
            int j = check.kept().get(c);
            idx[c] = fitIdx[j];
            start[c] = start0[j];
            lo[c] = rangeLow[j];
            hi[c] = rangeHigh[j];
            sc[c] = scale[j];
            ids.add(allIds.get(j));
        }
        List<String> held = new ArrayList<>();
        for (int j : check.dropped()) {
            held.add(allIds.get(j));
        }
        int dof = n - q;
        if (q == 0) {
            return new Result(ids, start, start, start, start, start, new boolean[0], new boolean[0], lo, hi,
                    confidence, Double.NaN, dof, evals[0], held, check.sentence(), check.condition(),
                    check.maxCorrelation());
        }
        Function<double[], double[]> f = theta -> predict.apply(idx, theta);
        BoundedFit.Result fit = BoundedFit.fit(f, y, start, lo, hi);
        double[] est = fit.theta();
        double s2 = fit.rss() / dof;
        double tq = new TDistribution(null, dof).inverseCumulativeProbability(0.5 + confidence / 2);
        double[] se = stdErrors(jacobian(f, est, sc, lo, hi), s2);
        ProfileInterval.Bounds b = ProfileInterval.of(f, y, est, fit.rss(), s2 * tq * tq, se, sc, lo, hi);
        return new Result(ids, start, est, se, b.lower(), b.upper(), b.lowerAtLimit(), b.upperAtLimit(), lo, hi,
                confidence, Math.sqrt(s2), dof, evals[0], held, check.sentence(), check.condition(),
                check.maxCorrelation());
    }

    /** Central differences, one-sided where a step would leave the range. */
    static double[][] jacobian(Function<double[], double[]> f, double[] theta, double[] scale, double[] lo,
                               double[] hi) {
        int q = theta.length;
        double[][] jac = null;
        for (int j = 0; j < q; j++) {
            double h = 1e-6 * Math.max(Math.abs(theta[j]), Math.abs(scale[j]) > 0 ? Math.abs(scale[j]) : 1);
            double[] tp = theta.clone();
            double[] tm = theta.clone();
            tp[j] = Math.min(theta[j] + h, hi[j]);
            tm[j] = Math.max(theta[j] - h, lo[j]);
            double[] vp = f.apply(tp);
            double[] vm = f.apply(tm);
            if (jac == null) {
                jac = new double[vp.length][q];
            }
            for (int r = 0; r < vp.length; r++) {
                jac[r][j] = (vp[r] - vm[r]) / (tp[j] - tm[j]);
            }
        }
        return jac;
    }

    private static double[] stdErrors(double[][] jac, double s2) {
        int q = jac[0].length;
        List<Integer> all = new ArrayList<>();
        for (int j = 0; j < q; j++) {
            all.add(j);
        }
        org.apache.commons.math3.linear.RealMatrix x = new org.apache.commons.math3.linear.Array2DRowRealMatrix(jac);
        org.apache.commons.math3.linear.QRDecomposition qr =
                new org.apache.commons.math3.linear.QRDecomposition(x.transpose().multiply(x), 0);
        double[] se = new double[q];
        if (!qr.getSolver().isNonSingular()) {
            java.util.Arrays.fill(se, Double.POSITIVE_INFINITY);
            return se;
        }
        org.apache.commons.math3.linear.RealMatrix cov = qr.getSolver().getInverse();
        for (int j = 0; j < q; j++) {
            se[j] = Math.sqrt(s2 * cov.getEntry(j, j));
        }
        return se;
    }
}
