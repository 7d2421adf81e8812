package org.fabspread.plan;

import java.util.function.Function;

import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.optim.SimpleVectorValueChecker;
import org.apache.commons.math3.util.Pair;

/**
 * Least squares with each parameter kept inside its physical range [lo, hi] by a change of variable
 * (the standard transformation method for simple bounds; e.g. Nocedal &amp; Wright, Numerical
 * Optimization, 2nd ed., §17 and the bounded fits of MINUIT's manual): θ = lo + (hi − lo)/(1 + e^{−φ})
 * for two finite bounds, θ = lo + e^φ or θ = hi − e^φ for one, θ = φ for none. The transformed problem
 * is minimised without bounds by Commons Math's Levenberg–Marquardt optimiser with a central
 * finite-difference Jacobian in φ, so every trial point, and the answer, lies inside the range.
 */
final class BoundedFit {

    /**
     * @param theta       the fitted values
     * @param rss         residual sum of squares at theta
     * @param evaluations residual-vector evaluations
     */
    record Result(double[] theta, double rss, int evaluations) {
    }

    private BoundedFit() {
    }

    /** θ from φ. */
    static double toTheta(double phi, double lo, double hi) {
        boolean fl = Double.isFinite(lo);
        boolean fh = Double.isFinite(hi);
        if (fl && fh) {
            return lo + (hi - lo) / (1 + Math.exp(-phi));
        }
        if (fl) {
            return lo + Math.exp(phi);
        }
        if (fh) {
            return hi - Math.exp(phi);
        }
        return phi;
    }

    /** φ from θ, with θ first moved a hair inside the range when it sits on a bound. */
    static double toPhi(double theta, double lo, double hi) {
        boolean fl = Double.isFinite(lo);
        boolean fh = Double.isFinite(hi);
        double eps = fl && fh ? 1e-6 * (hi - lo) : 1e-6 * Math.max(1, Math.abs(theta));
        double t = Math.min(Math.max(theta, fl ? lo + eps : theta), fh ? hi - eps : theta);
        if (fl && fh) {
            return Math.log((t - lo) / (hi - t));
        }
        if (fl) {
            return Math.log(t - lo);
        }
        if (fh) {
            return Math.log(hi - t);
        }
        return t;
    }

    /**
     * Minimises Σ (y − f(θ))² over θ in the box.
     *
     * @param f     the model's prediction of every run for θ (may throw; the fit then fails)
     * @param y     measured values
     * @param start starting values, inside the box
     */
    static Result fit(Function<double[], double[]> f, double[] y, double[] start, double[] lo, double[] hi) {
        int q = start.length;
        int n = y.length;
        int[] evals = {0};
        Function<double[], double[]> g = phi -> {
            double[] theta = new double[q];
            for (int j = 0; j < q; j++) {
                theta[j] = toTheta(phi[j], lo[j], hi[j]);
            }
            evals[0]++;
            return f.apply(theta);
        };
        MultivariateJacobianFunction fn = point -> {
            double[] phi = point.toArray();
            double[] v = g.apply(phi);
            double[][] jac = new double[n][q];
            for (int j = 0; j < q; j++) {
                double h = 1e-6 * Math.max(1, Math.abs(phi[j]));
                double[] pp = phi.clone();
                double[] pm = phi.clone();
                pp[j] += h;
                pm[j] -= h;
                double[] vp = g.apply(pp);
                double[] vm = g.apply(pm);
                for (int r = 0; r < n; r++) {
                    jac[r][j] = (vp[r] - vm[r]) / (2 * h);
                }
            }
            return new Pair<>(new ArrayRealVector(v, false), new Array2DRowRealMatrix(jac, false));
        };
        double[] phi0 = new double[q];
        for (int j = 0; j < q; j++) {
            phi0[j] = toPhi(start[j], lo[j], hi[j]);
        }
        LeastSquaresOptimizer.Optimum opt;
        try {
            opt = new LevenbergMarquardtOptimizer().optimize(new LeastSquaresBuilder()
                    .start(phi0).model(fn).target(y).maxEvaluations(2_000).maxIterations(400)
                    .checkerPair(new SimpleVectorValueChecker(1e-12, 1e-12)).lazyEvaluation(false).build());
        } catch (MathIllegalStateException e) {
            throw new IllegalStateException("the least-squares fit did not converge (" + e.getMessage() + ")", e);
        }
        double[] phi = opt.getPoint().toArray();
        double[] theta = new double[q];
        for (int j = 0; j < q; j++) {
            theta[j] = toTheta(phi[j], lo[j], hi[j]);
        }
        double[] v = f.apply(theta);
        double rss = 0;
        for (int r = 0; r < n; r++) {
            rss += (y[r] - v[r]) * (y[r] - v[r]);
        }
        return new Result(theta, rss, evals[0] + 1);
    }
}
