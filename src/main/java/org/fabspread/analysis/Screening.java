package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.fabspread.sampling.SampleTable;

/**
 * Cheap sensitivity from samples already run (no extra model runs), for many inputs:
 * <ul>
 *   <li>standardised rank regression coefficients: inputs and output replaced by their ranks (ties
 *   averaged), least squares with an intercept, each slope multiplied by sd(rank x_i)/sd(rank y)
 *   (Iman &amp; Conover; Saltelli et al., The Primer (2008), ch. 1); with the R² of that regression;</li>
 *   <li>first-order indices by binning: the correlation ratio η² = Σ_b n_b (ȳ_b − ȳ)² / Σ (y − ȳ)² over
 *   M equal-count bins of each input. Under no effect E[η²] = (M − 1)/(n − 1) (one-way analysis of
 *   variance); that bias is subtracted and reported.</li>
 * </ul>
 * Samples whose evaluation failed are left out.
 */
public final class Screening {

    private Screening() {
    }

    /** Default bins: about √n / 2, between 2 and 50. */
    public static int defaultBins(int n) {
        return (int) Math.max(2, Math.min(50, Math.round(Math.sqrt(n) / 2)));
    }

    public static ScreeningResult of(SampleTable table) {
        int n = 0;
        for (boolean b : table.ok()) {
            n += b ? 1 : 0;
        }
        return of(table, defaultBins(n));
    }

    public static ScreeningResult of(SampleTable table, int bins) {
        int[] rows = okRows(table.ok());
        int n = rows.length;
        int k = table.inputIds().size();
        if (n < Math.max(k + 2, 2 * bins)) {
            throw new IllegalArgumentException("screening needs more samples than inputs + 2 and at least 2 per bin: "
                    + n + " samples, " + k + " inputs, " + bins + " bins");
        }
        if (bins < 2) {
            throw new IllegalArgumentException("need at least 2 bins, got " + bins);
        }
        double bias = (bins - 1.0) / (n - 1.0);
        double[][] x = new double[k][];
        double[][] rx = new double[k][];
        int[][] order = new int[k][];
        double[] sdRank = new double[k];
        for (int i = 0; i < k; i++) {
            x[i] = pick(table.inputs()[i], rows);
            rx[i] = Stats.ranks(x[i]);
            sdRank[i] = Math.sqrt(Stats.variance(rx[i]));
            order[i] = argsort(x[i]);
        }
        double[][] design = new double[n][k];
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < k; i++) {
                design[j][i] = rx[i][j];
            }
        }
        List<ScreeningResult.OutputScreening> outs = new ArrayList<>();
        for (int m = 0; m < table.outputIds().size(); m++) {
            double[] y = pick(table.outputs()[m], rows);
            double vy = Stats.variance(y);
            double[] srrc = new double[k];
            double r2 = Double.NaN;
            if (vy > 0) {
                double[] ry = Stats.ranks(y);
                double sdy = Math.sqrt(Stats.variance(ry));
                OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
                ols.newSampleData(ry, design);
                double[] beta = ols.estimateRegressionParameters();
                for (int i = 0; i < k; i++) {
                    srrc[i] = beta[i + 1] * sdRank[i] / sdy;
                }
                r2 = ols.calculateRSquared();
            } else {
                Arrays.fill(srrc, Double.NaN);
            }
            List<ScreeningResult.InputScreening> list = new ArrayList<>();
            for (int i = 0; i < k; i++) {
                double eta = vy > 0 ? correlationRatio(y, order[i], bins) : Double.NaN;
                list.add(new ScreeningResult.InputScreening(table.inputIds().get(i), srrc[i], eta - bias, eta));
            }
            outs.add(new ScreeningResult.OutputScreening(table.outputIds().get(m), r2, list));
        }
        String method = "standardised rank regression coefficients (least squares on ranks, with intercept);"
                + " first-order indices by binning: correlation ratio over " + bins + " equal-count bins, bias (M-1)/(n-1) = "
                + String.format(java.util.Locale.ROOT, "%.4g", bias) + " subtracted";
        return new ScreeningResult(n, bins, bias, method, outs);
    }

    /** η² of y over M equal-count bins of the inputs' order. */
    static double correlationRatio(double[] y, int[] order, int bins) {
        int n = y.length;
        double mean = Stats.mean(y);
        double ssTot = 0;
        for (double v : y) {
            ssTot += (v - mean) * (v - mean);
        }
        double ssBetween = 0;
        for (int b = 0; b < bins; b++) {
            int from = (int) ((long) b * n / bins);
            int to = (int) ((long) (b + 1) * n / bins);
            double s = 0;
            for (int t = from; t < to; t++) {
                s += y[order[t]];
            }
            int nb = to - from;
            double d = s / nb - mean;
            ssBetween += nb * d * d;
        }
        return ssBetween / ssTot;
    }

    private static int[] okRows(boolean[] ok) {
        int c = 0;
        for (boolean b : ok) {
            c += b ? 1 : 0;
        }
        int[] rows = new int[c];
        c = 0;
        for (int j = 0; j < ok.length; j++) {
            if (ok[j]) {
                rows[c++] = j;
            }
        }
        return rows;
    }

    private static double[] pick(double[] v, int[] rows) {
        double[] out = new double[rows.length];
        for (int t = 0; t < rows.length; t++) {
            out[t] = v[rows[t]];
        }
        return out;
    }

    private static int[] argsort(double[] v) {
        Integer[] idx = new Integer[v.length];
        for (int i = 0; i < v.length; i++) {
            idx[i] = i;
        }
        Arrays.sort(idx, (a, b) -> Double.compare(v[a], v[b]));
        int[] out = new int[v.length];
        for (int i = 0; i < v.length; i++) {
            out[i] = idx[i];
        }
        return out;
    }
}
