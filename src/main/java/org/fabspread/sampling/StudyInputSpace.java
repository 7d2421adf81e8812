package org.fabspread.sampling;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.NonPositiveDefiniteMatrixException;
import org.apache.commons.math3.linear.RealMatrix;
import org.fabspread.study.Correlation;
import org.fabspread.study.Parameter;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * The joint distribution of a study's uncertain inputs: exact marginals ({@link Distributions}) tied
 * by a Gaussian copula (NORTA: Cario &amp; Nelson, Northwestern IE tech. rep. (1997); Iman &amp; Conover,
 * Commun. Stat. B 11, 311 (1982) for rank-correlation targets).
 *
 * <p>A Spearman target ρ_S becomes the normal correlation r = 2 sin(π ρ_S / 6) (Pearson, 1907;
 * for bivariate normals ρ_S = (6/π) asin(r/2)), which the copula keeps exactly whatever the
 * marginals, since ranks survive monotone maps. The correlation matrix of the correlated inputs is
 * factored by Cholesky; when it is not positive definite it is repaired by clipping its eigenvalues
 * at {@value #EIGEN_FLOOR} and rescaling to a unit diagonal (Rousseeuw &amp; Molenberghs, Comput.
 * Stat. Data Anal. 15, 1 (1993)), and {@link #repaired()} says so.
 *
 * <p>{@link #map(double[], double[])} runs x_i = F_i⁻¹(u_i) for uncorrelated inputs, and for the
 * correlated block z = Φ⁻¹(u), y = L z, x_i = F_i⁻¹(Φ(y_i)). It allocates nothing: the normal
 * scratch of the block is one {@code double[]} per calling thread (a {@link ThreadLocal}), so one
 * instance serves all worker threads.
 */
public final class StudyInputSpace implements InputSpace {

    /** Eigenvalue floor of the positive-definiteness repair. */
    public static final double EIGEN_FLOOR = 1e-8;

    private final List<String> ids;
    private final List<Distribution> marginals;
    private final Distribution[] dist;
    private final int[] block;
    private final boolean[] inBlock;
    private final double[] lower;
    private final double[][] normalCorrelation;
    private final boolean repaired;
    private final ThreadLocal<double[]> scratch;

    private StudyInputSpace(List<String> ids, List<Distribution> marginals, int[] block, double[][] r, double[] lower,
                            boolean repaired) {
        this.ids = List.copyOf(ids);
        this.marginals = List.copyOf(marginals);
        this.dist = marginals.toArray(new Distribution[0]);
        this.block = block;
        this.inBlock = new boolean[dist.length];
        for (int i : block) {
            inBlock[i] = true;
        }
        this.normalCorrelation = r;
        this.lower = lower;
        this.repaired = repaired;
        int b = block.length;
        this.scratch = ThreadLocal.withInitial(() -> new double[2 * b]);
    }

    /** The study's uncertain inputs, in order, with their correlations. */
    public static StudyInputSpace of(Study study) {
        List<String> ids = new ArrayList<>();
        List<Distribution> marg = new ArrayList<>();
        for (Parameter p : study.uncertainInputs()) {
            ids.add(p.id());
            try {
                marg.add(Distributions.of(p.distribution()));
            } catch (IllegalArgumentException e) {
                throw StudyException.at(p.where(), e.getMessage());
            }
        }
        return of(ids, marg, study.correlations());
    }

    /** Inputs with explicit marginals and Spearman targets between them (ids as in {@code ids}). */
    public static StudyInputSpace of(List<String> ids, List<Distribution> marginals, List<Correlation> correlations) {
        if (ids.size() != marginals.size()) {
            throw new IllegalArgumentException("ids and marginals differ in length");
        }
        Map<String, Integer> index = new HashMap<>();
        for (int i = 0; i < ids.size(); i++) {
            if (index.put(ids.get(i), i) != null) {
                throw new IllegalArgumentException("duplicate input id " + ids.get(i));
            }
        }
        // the block: correlated inputs in model order
        boolean[] inBlock = new boolean[ids.size()];
        for (Correlation c : correlations) {
            for (String id : new String[] {c.first(), c.second()}) {
                Integer i = index.get(id);
                if (i == null) {
                    throw StudyException.at(c.where(), "'" + id + "' is not an uncertain input of the study");
                }
                inBlock[i] = true;
            }
            if (c.first().equals(c.second())) {
                throw StudyException.at(c.where(), "an input cannot be correlated with itself");
            }
            if (!(Math.abs(c.spearman()) <= 1)) {
                throw StudyException.at(c.where(), "Spearman correlation must lie in [-1, 1], got " + c.spearman());
            }
        }
        int[] block = new int[0];
        for (int i = 0; i < inBlock.length; i++) {
            if (inBlock[i]) {
                block = Arrays.copyOf(block, block.length + 1);
                block[block.length - 1] = i;
            }
        }
        int b = block.length;
        if (b == 0) {
            return new StudyInputSpace(ids, marginals, block, new double[0][0], new double[0], false);
        }
        int[] pos = new int[ids.size()];
        for (int j = 0; j < b; j++) {
            pos[block[j]] = j;
        }
        double[][] r = new double[b][b];
        boolean[][] set = new boolean[b][b];
        for (int j = 0; j < b; j++) {
            r[j][j] = 1;
        }
        for (Correlation c : correlations) {
            int p = pos[index.get(c.first())];
            int q = pos[index.get(c.second())];
            if (set[p][q]) {
                throw StudyException.at(c.where(), "correlation between " + c.first() + " and " + c.second()
                        + " given twice");
            }
            set[p][q] = true;
            set[q][p] = true;
            double rn = normalCorrelation(c.spearman());
            r[p][q] = rn;
            r[q][p] = rn;
        }
        boolean repaired = false;
        RealMatrix m = new Array2DRowRealMatrix(r);
        CholeskyDecomposition chol;
        try {
            chol = new CholeskyDecomposition(m);
        } catch (NonPositiveDefiniteMatrixException e) {
            r = nearestCorrelation(r);
            repaired = true;
            chol = new CholeskyDecomposition(new Array2DRowRealMatrix(r));
        }
        double[][] l = chol.getL().getData();
        double[] packed = new double[b * b];
        for (int i = 0; i < b; i++) {
            System.arraycopy(l[i], 0, packed, i * b, b);
        }
        return new StudyInputSpace(ids, marginals, block, r, packed, repaired);
    }

    /** r = 2 sin(π ρ_S / 6): the normal correlation whose Spearman correlation is ρ_S. */
    public static double normalCorrelation(double spearman) {
        return 2 * Math.sin(Math.PI * spearman / 6);
    }

    /** Eigenvalues clipped at {@link #EIGEN_FLOOR}, then rescaled to a unit diagonal. */
    static double[][] nearestCorrelation(double[][] r) {
        int b = r.length;
        EigenDecomposition ed = new EigenDecomposition(new Array2DRowRealMatrix(r));
        double[] lam = ed.getRealEigenvalues();
        double[][] v = ed.getV().getData();
        double[][] out = new double[b][b];
        for (int i = 0; i < b; i++) {
            for (int j = 0; j < b; j++) {
                double s = 0;
                for (int k = 0; k < b; k++) {
                    s += v[i][k] * Math.max(lam[k], EIGEN_FLOOR) * v[j][k];
                }
                out[i][j] = s;
            }
        }
        double[] d = new double[b];
        for (int i = 0; i < b; i++) {
            d[i] = Math.sqrt(out[i][i]);
        }
        for (int i = 0; i < b; i++) {
            for (int j = 0; j < b; j++) {
                out[i][j] = i == j ? 1 : out[i][j] / (d[i] * d[j]);
            }
        }
        for (int i = 0; i < b; i++) {
            for (int j = 0; j < i; j++) {
                double s = 0.5 * (out[i][j] + out[j][i]);
                out[i][j] = s;
                out[j][i] = s;
            }
        }
        return out;
    }

    @Override public List<String> ids() { return ids; }

    @Override public List<Distribution> marginals() { return marginals; }

    @Override public boolean correlated() { return block.length > 0; }

    /** True when the normal correlation matrix was not positive definite and had to be repaired. */
    public boolean repaired() { return repaired; }

    /** Ids of the correlated inputs, in model order (the rows of {@link #normalCorrelation()}). */
    public List<String> correlatedIds() {
        List<String> out = new ArrayList<>();
        for (int i : block) {
            out.add(ids.get(i));
        }
        return out;
    }

    /** The normal correlation matrix actually used (after any repair); a copy. */
    public double[][] normalCorrelation() {
        double[][] c = new double[normalCorrelation.length][];
        for (int i = 0; i < c.length; i++) {
            c[i] = normalCorrelation[i].clone();
        }
        return c;
    }

    /** Nominal value of every input, in model order. */
    public double[] nominal() {
        double[] x = new double[dist.length];
        for (int i = 0; i < x.length; i++) {
            x[i] = dist[i].nominal();
        }
        return x;
    }

    @Override
    public void map(double[] u, double[] x) {
        int k = dist.length;
        for (int i = 0; i < k; i++) {
            if (!inBlock[i]) {
                x[i] = dist[i].inverseCdf(StandardNormal.clamp(u[i]));
            }
        }
        int b = block.length;
        if (b == 0) {
            return;
        }
        double[] s = scratch.get();
        for (int j = 0; j < b; j++) {
            s[j] = StandardNormal.quantile(StandardNormal.clamp(u[block[j]]));
        }
        for (int i = 0; i < b; i++) {
            double y = 0;
            int row = i * b;
            for (int j = 0; j <= i; j++) {
                y += lower[row + j] * s[j];
            }
            s[b + i] = y;
        }
        for (int i = 0; i < b; i++) {
            x[block[i]] = dist[block[i]].inverseCdf(StandardNormal.clamp(StandardNormal.cdf(s[b + i])));
        }
    }
}
