package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.fabspread.sampling.Distribution;
import org.fabspread.sampling.StandardNormal;
import org.fabspread.sampling.StudyInputSpace;

/**
 * The study's joint input distribution seen as a Gaussian copula over all inputs: normal scores
 * z ~ N(0, R) with R the copula's normal correlation (identity for inputs no correlation ties), and
 * x_i = F_i⁻¹(Φ(z_i)). This is the distribution {@link StudyInputSpace} samples.
 *
 * <p>Its conditional distributions are exact: given the normal scores z_K of a set K, the scores of the
 * rest J are normal with mean R_JK R_KK⁻¹ z_K and covariance R_JJ − R_JK R_KK⁻¹ R_KJ (the Schur
 * complement; Anderson, An Introduction to Multivariate Statistical Analysis, 3rd ed. (2003), thm.
 * 2.5.1), and since each x_i is a monotone map of z_i, conditioning on x_K is conditioning on z_K. This
 * is what the Shapley effects' conditional sampling needs (Song, Nelson &amp; Staum, SIAM/ASA J. Uncertain.
 * Quantif. 4, 1060 (2016), sec. 4).
 *
 * @param ids         input ids, in model order
 * @param marginals   each input's marginal distribution
 * @param correlation the k × k normal correlation R
 */
public record GaussianCopula(List<String> ids, List<Distribution> marginals, double[][] correlation) {

    public GaussianCopula {
        ids = List.copyOf(ids);
        marginals = List.copyOf(marginals);
        int k = ids.size();
        if (marginals.size() != k || correlation.length != k) {
            throw new IllegalArgumentException("ids, marginals and correlation differ in size");
        }
        double[][] c = new double[k][];
        for (int i = 0; i < k; i++) {
            if (correlation[i].length != k) {
                throw new IllegalArgumentException("correlation matrix is not square");
            }
            c[i] = correlation[i].clone();
        }
        correlation = c;
    }

    /** The copula of a study's input space (its correlation block placed in the full k × k matrix). */
    public static GaussianCopula of(StudyInputSpace space) {
        int k = space.dimension();
        double[][] r = new double[k][k];
        for (int i = 0; i < k; i++) {
            r[i][i] = 1;
        }
        List<String> block = space.correlatedIds();
        double[][] rb = space.normalCorrelation();
        for (int a = 0; a < block.size(); a++) {
            for (int b = 0; b < block.size(); b++) {
                r[space.ids().indexOf(block.get(a))][space.ids().indexOf(block.get(b))] = rb[a][b];
            }
        }
        return new GaussianCopula(space.ids(), space.marginals(), r);
    }

    public int dimension() {
        return ids.size();
    }

    /** Whether some pair of inputs is correlated. */
    public boolean correlated() {
        for (int i = 0; i < correlation.length; i++) {
            for (int j = 0; j < i; j++) {
                if (correlation[i][j] != 0) {
                    return true;
                }
            }
        }
        return false;
    }

    /** The inputs tied together by nonzero correlations: connected components of two or more, in model order. */
    public List<List<String>> correlatedGroups() {
        int k = dimension();
        int[] comp = new int[k];
        java.util.Arrays.fill(comp, -1);
        List<List<String>> out = new ArrayList<>();
        for (int s = 0; s < k; s++) {
            if (comp[s] >= 0) {
                continue;
            }
            List<Integer> members = new ArrayList<>();
            java.util.ArrayDeque<Integer> queue = new java.util.ArrayDeque<>();
            queue.add(s);
            comp[s] = s;
            while (!queue.isEmpty()) {
                int i = queue.poll();
                members.add(i);
                for (int j = 0; j < k; j++) {
                    if (comp[j] < 0 && correlation[i][j] != 0) {
                        comp[j] = s;
                        queue.add(j);
                    }
                }
            }
            if (members.size() > 1) {
                members.sort(null);
                List<String> g = new ArrayList<>();
                for (int i : members) {
                    g.add(ids.get(i));
                }
                out.add(g);
            }
        }
        return out;
    }

    /** x_i = F_i⁻¹(Φ(z_i)) for every input. */
    public void toInputs(double[] z, double[] x) {
        for (int i = 0; i < z.length; i++) {
            x[i] = marginals.get(i).inverseCdf(StandardNormal.clamp(StandardNormal.cdf(z[i])));
        }
    }

    /**
     * The conditional law of the scores of {@code vary} given the others (the scores of inputs not in
     * {@code vary} held fixed): z_J = M z_K + L ε with ε standard normal.
     *
     * @param vary which inputs are drawn anew (true) and which are held (false)
     */
    public Conditional conditional(boolean[] vary) {
        int k = dimension();
        int nj = 0;
        for (boolean v : vary) {
            nj += v ? 1 : 0;
        }
        int[] j = new int[nj];
        int[] kk = new int[k - nj];
        int a = 0;
        int b = 0;
        for (int i = 0; i < k; i++) {
            if (vary[i]) {
                j[a++] = i;
            } else {
                kk[b++] = i;
            }
        }
        double[][] rjj = sub(j, j);
        double[][] m = new double[nj][kk.length];
        double[][] cov = rjj;
        if (kk.length > 0 && nj > 0) {
            RealMatrix rkk = new Array2DRowRealMatrix(sub(kk, kk));
            RealMatrix rjk = new Array2DRowRealMatrix(sub(j, kk));
            RealMatrix mm = rjk.multiply(new LUDecomposition(rkk).getSolver().getInverse());
            m = mm.getData();
            cov = new Array2DRowRealMatrix(rjj).subtract(mm.multiply(rjk.transpose())).getData();
        }
        double[][] l = nj == 0 ? new double[0][0] : cholesky(cov);
        return new Conditional(j, kk, m, l);
    }

    private double[][] sub(int[] rows, int[] cols) {
        double[][] s = new double[rows.length][cols.length];
        for (int a = 0; a < rows.length; a++) {
            for (int b = 0; b < cols.length; b++) {
                s[a][b] = correlation[rows[a]][cols[b]];
            }
        }
        return s;
    }

    /** Lower Cholesky factor; a positive semi-definite matrix (a variance lost to rounding) gets a tiny ridge. */
    private static double[][] cholesky(double[][] c) {
        int n = c.length;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                double s = 0.5 * (c[i][j] + c[j][i]);
                c[i][j] = s;
                c[j][i] = s;
            }
            c[i][i] = Math.max(c[i][i], 1e-14);
        }
        return new CholeskyDecomposition(new Array2DRowRealMatrix(c), 1e-10, 1e-16).getL().getData();
    }

    /**
     * z_J = M z_K + L ε.
     *
     * @param vary indices J drawn anew
     * @param held indices K held fixed
     * @param m    the regression matrix R_JK R_KK⁻¹ (|J| × |K|)
     * @param l    the lower Cholesky factor of the conditional covariance (|J| × |J|)
     */
    public record Conditional(int[] vary, int[] held, double[][] m, double[][] l) {

        /** Overwrites the scores of {@link #vary()} in {@code z} with a draw given the held ones; ε is |J| normals. */
        public void draw(double[] z, double[] eps) {
            for (int a = 0; a < vary.length; a++) {
                double s = 0;
                double[] ma = m[a];
                for (int b = 0; b < held.length; b++) {
                    s += ma[b] * z[held[b]];
                }
                double[] la = l[a];
                for (int b = 0; b <= a; b++) {
                    s += la[b] * eps[b];
                }
                z[vary[a]] = s;
            }
        }
    }
}
