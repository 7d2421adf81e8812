package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * Whether measured runs can tell the calibrated inputs apart, judged before the fit from the
 * Jacobian J of the run predictions with respect to the inputs at their nominal values:
 * <ul>
 * <li>the condition index of J with its columns scaled to unit length (largest over smallest singular
 * value; Belsley, Kuh &amp; Welsch, Regression Diagnostics, Wiley 1980, ch. 3: above 30 the columns
 * are nearly dependent and the estimates are not separately determined);</li>
 * <li>the correlation of the estimates from (JᵀJ)⁻¹; above 0.95 in magnitude two inputs trade off
 * against each other (common practice in nonlinear regression, e.g. Bates &amp; Watts, Nonlinear
 * Regression Analysis and Its Applications, 1988, §7).</li>
 * </ul>
 * When either limit is passed, the input of the most correlated pair whose scaled sensitivity
 * (column norm times its σ) is smaller is held at nominal, and the check repeats on the rest; an
 * input with no effect on the runs is held at nominal first.
 */
final class Identifiability {

    /** Belsley's condition-index limit. */
    static final double MAX_CONDITION = 30;
    /** Largest magnitude of an estimate correlation accepted. */
    static final double MAX_CORRELATION = 0.95;

    /**
     * @param kept           indices (into the inputs offered) that can be fitted
     * @param dropped        indices held at nominal
     * @param condition      condition index of all the inputs offered (NaN for one input)
     * @param maxCorrelation largest |correlation| among all the inputs offered (NaN for one input)
     * @param sentence       one sentence saying what was reduced and why, empty when nothing was
     */
    record Check(List<Integer> kept, List<Integer> dropped, double condition, double maxCorrelation,
                 String sentence) {
    }

    private Identifiability() {
    }

    /**
     * @param jac   ∂ prediction of run r / ∂ input j at the start [run][input]
     * @param scale a typical change of each input (its σ), to rank sensitivities
     * @param ids   the inputs' ids
     */
    static Check check(double[][] jac, double[] scale, List<String> ids, String response) {
        List<Integer> kept = new ArrayList<>();
        List<Integer> dropped = new ArrayList<>();
        List<String> why = new ArrayList<>();
        for (int j = 0; j < ids.size(); j++) {
            if (norm(jac, j) > 0) {
                kept.add(j);
            } else {
                dropped.add(j);
                why.add("The runs do not change " + response + " with " + ids.get(j) + ", so it stays at its nominal value");
            }
        }
        double cond0 = Double.NaN;
        double corr0 = Double.NaN;
        boolean first = true;
        while (kept.size() > 1) {
            double cond = condition(jac, kept);
            double[][] corr = correlation(jac, kept);
            int a = 0;
            int b = 1;
            double worst = 0;
            for (int i = 0; i < kept.size(); i++) {
                for (int j = i + 1; j < kept.size(); j++) {
                    if (Math.abs(corr[i][j]) > worst) {
                        worst = Math.abs(corr[i][j]);
                        a = i;
                        b = j;
                    }
                }
            }
            if (first) {
                cond0 = cond;
                corr0 = worst;
                first = false;
            }
            if (cond <= MAX_CONDITION && worst <= MAX_CORRELATION) {
                break;
            }
            int ia = kept.get(a);
            int ib = kept.get(b);
            int drop = norm(jac, ia) * scale[ia] >= norm(jac, ib) * scale[ib] ? ib : ia;
            int keep = drop == ia ? ib : ia;
            why.add(String.format(Locale.ROOT, "The runs cannot tell %s from %s in %s alone (their estimates would "
                    + "be %.2f %% correlated, condition index %.3g; limits %.0f %% and %.0f), so only %s is fitted and "
                    + "%s stays at its nominal value", ids.get(keep), ids.get(drop), response, 100 * worst, cond,
                    100 * MAX_CORRELATION, MAX_CONDITION, ids.get(keep), ids.get(drop)));
            kept.remove(Integer.valueOf(drop));
            dropped.add(drop);
        }
        String sentence = why.isEmpty() ? "" : String.join(". ", why) + ".";
        return new Check(kept, dropped, cond0, corr0, sentence);
    }

    static double norm(double[][] jac, int j) {
        double s = 0;
        for (double[] row : jac) {
            s += row[j] * row[j];
        }
        return Math.sqrt(s);
    }

    /** Condition index of the columns in {@code cols}, each scaled to unit length. */
    static double condition(double[][] jac, List<Integer> cols) {
        double[][] m = new double[jac.length][cols.size()];
        for (int c = 0; c < cols.size(); c++) {
            double nrm = norm(jac, cols.get(c));
            for (int r = 0; r < jac.length; r++) {
                m[r][c] = jac[r][cols.get(c)] / nrm;
            }
        }
        double[] sv = new SingularValueDecomposition(new Array2DRowRealMatrix(m, false)).getSingularValues();
        return sv[sv.length - 1] > 0 ? sv[0] / sv[sv.length - 1] : Double.POSITIVE_INFINITY;
    }

    /** Correlation matrix of the estimates, from (JᵀJ)⁻¹ of the columns in {@code cols}. */
    static double[][] correlation(double[][] jac, List<Integer> cols) {
        int q = cols.size();
        double[][] m = new double[jac.length][q];
        for (int c = 0; c < q; c++) {
            for (int r = 0; r < jac.length; r++) {
                m[r][c] = jac[r][cols.get(c)];
            }
        }
        RealMatrix x = new Array2DRowRealMatrix(m, false);
        double[][] out = new double[q][q];
        QRDecomposition qr = new QRDecomposition(x.transpose().multiply(x), 0);
        if (!qr.getSolver().isNonSingular()) {
            for (int i = 0; i < q; i++) {
                for (int j = 0; j < q; j++) {
                    out[i][j] = 1;
                }
            }
            return out;
        }
        RealMatrix cov = qr.getSolver().getInverse();
        for (int i = 0; i < q; i++) {
            for (int j = 0; j < q; j++) {
                out[i][j] = cov.getEntry(i, j) / Math.sqrt(cov.getEntry(i, i) * cov.getEntry(j, j));
            }
        }
        return out;
    }
}
