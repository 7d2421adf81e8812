package org.fabspread.plan;

import java.util.List;

import org.apache.commons.math3.distribution.TDistribution;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.util.Pair;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;

/**
 * Fits one to three model inputs to measured runs by nonlinear least squares: residual_i =
 * y_i − f(run i's factor settings, θ) with the other inputs at nominal, minimised by Commons Math's
 * Levenberg–Marquardt optimiser (Moré's implementation) with a central finite-difference Jacobian
 * through the model. Intervals from the asymptotic covariance σ² (JᵀJ)⁻¹, σ² = RSS/(n − q), and
 * t quantiles with n − q degrees of freedom (Seber &amp; Wild, Nonlinear Regression, ch. 2).
 */
public final class Calibration {

    /**
     * @param ids        fitted inputs
     * @param start      starting values (nominal)
     * @param estimates  fitted values
     * @param stdErrors  standard errors
     * @param lower      lower confidence limits
     * @param upper      upper confidence limits
     * @param confidence confidence level
     * @param residualSd sqrt(RSS/(n − q))
     * @param dof        n − q
     * @param evaluations model evaluations of the optimiser
     */
    public record Result(List<String> ids, double[] start, double[] estimates, double[] stdErrors, double[] lower,
                         double[] upper, double confidence, double residualSd, int dof, int evaluations) {
    }

    private Calibration() {
    }

    /**
     * @param nominal    every model input at nominal, model order
     * @param factorIdx  model index of each factor
     * @param settings   factor settings of each run, real units [run][factor]
     * @param y          measured response per run
     * @param fitIdx     model indices of the inputs to fit (1–3, not factors)
     * @param scale      a typical size of each fitted input (its σ or nominal) for the finite-difference step
     */
    public static Result fit(Model model, String response, double[] nominal, int[] factorIdx, double[][] settings,
                             double[] y, int[] fitIdx, double[] scale, double confidence) {
        int q = fitIdx.length;
        int n = y.length;
        if (q < 1 || q > 3) {
            throw new IllegalArgumentException("calibrate one to three inputs, not " + q);
        }
        if (n <= q) {
            throw new IllegalArgumentException("calibrating " + q + " inputs needs more than " + q + " measured runs");
        }
        int out = model.outputIndex(response);
        Evaluator ev = model.newEvaluator();
        double[] x = new double[nominal.length];
        double[] o = new double[model.outputs().size()];
        double[] start = new double[q];
        for (int j = 0; j < q; j++) {
            start[j] = nominal[fitIdx[j]];
        }
        int[] evals = {0};
        java.util.function.Function<double[], double[]> f = theta -> {
            double[] v = new double[n];
            for (int r = 0; r < n; r++) {
                System.arraycopy(nominal, 0, x, 0, x.length);
                for (int i = 0; i < factorIdx.length; i++) {
                    x[factorIdx[i]] = settings[r][i];
                }
                for (int j = 0; j < q; j++) {
                    x[fitIdx[j]] = theta[j];
                }
                ev.evaluate(x, o);
                v[r] = o[out];
            }
            evals[0] += n;
            return v;
        };
        MultivariateJacobianFunction fn = point -> {
            double[] theta = point.toArray();
            double[] v = f.apply(theta);
            double[][] jac = new double[n][q];
            for (int j = 0; j < q; j++) {
                double h = 1e-6 * Math.max(Math.abs(theta[j]), Math.abs(scale[j]) > 0 ? Math.abs(scale[j]) : 1);
                double[] tp = theta.clone();
                double[] tm = theta.clone();
                tp[j] += h;
                tm[j] -= h;
                double[] vp = f.apply(tp);
                double[] vm = f.apply(tm);
                for (int r = 0; r < n; r++) {
                    jac[r][j] = (vp[r] - vm[r]) / (2 * h);
                }
            }
            return new Pair<>(new ArrayRealVector(v, false), new Array2DRowRealMatrix(jac, false));
        };
        LeastSquaresOptimizer.Optimum opt = new LevenbergMarquardtOptimizer().optimize(new LeastSquaresBuilder()
                .start(start).model(fn).target(y).maxEvaluations(10_000).maxIterations(1_000)
                .checkerPair(new org.apache.commons.math3.optim.SimpleVectorValueChecker(1e-12, 1e-12))
                .lazyEvaluation(false).build());
        double[] est = opt.getPoint().toArray();
        RealMatrix jac = opt.getJacobian();
        double rss = opt.getResiduals().dotProduct(opt.getResiduals());
        int dof = n - q;
        double s2 = rss / dof;
        RealMatrix cov = new QRDecomposition(jac.transpose().multiply(jac)).getSolver().getInverse().scalarMultiply(s2);
        double tq = new TDistribution(null, dof).inverseCumulativeProbability(0.5 + confidence / 2);
        double[] se = new double[q];
        double[] lo = new double[q];
        double[] hi = new double[q];
        for (int j = 0; j < q; j++) {
            se[j] = Math.sqrt(cov.getEntry(j, j));
            lo[j] = est[j] - tq * se[j];
            hi[j] = est[j] + tq * se[j];
        }
        List<String> ids = new java.util.ArrayList<>();
        for (int j : fitIdx) {
            ids.add(model.inputIds().get(j));
        }
        return new Result(ids, start, est, se, lo, hi, confidence, Math.sqrt(s2), dof, evals[0]);
    }
}
