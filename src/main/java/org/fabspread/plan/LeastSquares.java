package org.fabspread.plan;

import java.util.List;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * Ordinary least squares of a response on an intercept and model terms, by QR decomposition, with
 * the unscaled covariance (XᵀX)⁻¹ of the coefficients.
 *
 * @param coefficients intercept first, then one per term
 * @param unscaledCov  (XᵀX)⁻¹
 * @param rss          residual sum of squares
 * @param dof          residual degrees of freedom n − p
 */
public record LeastSquares(double[] coefficients, double[][] unscaledCov, double rss, int dof) {

    /** Design matrix with an intercept column. */
    public static double[][] modelMatrix(List<Term> terms, double[][] x) {
        double[][] m = new double[x.length][terms.size() + 1];
        for (int r = 0; r < x.length; r++) {
            m[r][0] = 1;
            for (int t = 0; t < terms.size(); t++) {
                m[r][t + 1] = terms.get(t).value(x[r]);
            }
        }
        return m;
    }

    public static LeastSquares fit(List<Term> terms, double[][] x, double[] y) {
        double[][] m = modelMatrix(terms, x);
        RealMatrix xm = new Array2DRowRealMatrix(m, false);
        DecompositionSolver solver = new QRDecomposition(xm, 1e-10).getSolver();
        if (!solver.isNonSingular()) {
            throw new IllegalArgumentException("the runs cannot estimate all " + terms.size() + " model terms");
        }
        double[] beta = solver.solve(new ArrayRealVector(y, false)).toArray();
        double rss = 0;
        for (int r = 0; r < m.length; r++) {
            double f = 0;
            for (int c = 0; c < beta.length; c++) {
                f += m[r][c] * beta[c];
            }
            rss += (y[r] - f) * (y[r] - f);
        }
        RealMatrix xtx = xm.transpose().multiply(xm);
        double[][] cov = new QRDecomposition(xtx).getSolver().getInverse().getData();
        return new LeastSquares(beta, cov, rss, m.length - beta.length);
    }

    /** Effect of term t (0-based, without the intercept): 2β for main effects and interactions, β for squares. */
    public double effect(List<Term> terms, int t) {
        double b = coefficients[t + 1];
        return terms.get(t).square() ? b : 2 * b;
    }

    /** Standard error of that effect for residual standard deviation sigma. */
    public double effectStdError(List<Term> terms, int t, double sigma) {
        double se = sigma * Math.sqrt(unscaledCov[t + 1][t + 1]);
        return terms.get(t).square() ? se : 2 * se;
    }
}
