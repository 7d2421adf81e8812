package org.fabspread.analysis;

import org.apache.commons.rng.UniformRandomProvider;
import org.fabspread.sampling.Interval;

/**
 * The intervals of {@link SobolIndices}: for random points a percentile bootstrap that resamples the
 * rows j of f(A), f(B) and every f(A_B) together (Efron &amp; Tibshirani, An Introduction to the
 * Bootstrap (1993), ch. 13); for quasi-random points the mean of R independent randomisations with a
 * Student t interval (Owen, Monte Carlo theory, methods and examples (2013), ch. 17).
 */
final class SobolIntervals {

    private static final long BOOTSTRAP_SALT = 0x6a09e667f3bcc909L;

    private SobolIntervals() {
    }

    static void bootstrap(SobolIndices.Runs runs, int[] all, SobolIndices.Options o, double[][] first, double[][] total,
                                  double[][] lowF, double[][] highF, double[][] lowT, double[][] highT) {
        int nOut = first.length;
        int k = first[0].length;
        int b = o.bootstrap();
        if (b == 0) {
            fillNaN(lowF, highF, lowT, highT);
            return;
        }
        double[][][] bootF = new double[nOut][k][b];
        double[][][] bootT = new double[nOut][k][b];
        int count = all.length;
        Parallel.run(b, o.threads(), () -> new double[][] {new double[k], new double[k], new double[count]},
                (scratch, rep) -> {
                    UniformRandomProvider rng = RandomStreams.of(o.seed(), BOOTSTRAP_SALT, rep);
                    int[] rows = new int[count];
                    for (int t = 0; t < count; t++) {
                        rows[t] = all[rng.nextInt(count)];
                    }
                    for (int m = 0; m < nOut; m++) {
                        SobolIndices.estimate(runs.fA()[m], runs.fB()[m], runs.fAB()[m], rows, count, scratch[0], scratch[1]);
                        for (int i = 0; i < k; i++) {
                            bootF[m][i][rep] = scratch[0][i];
                            bootT[m][i][rep] = scratch[1][i];
                        }
                    }
                });
        for (int m = 0; m < nOut; m++) {
            for (int i = 0; i < k; i++) {
                Interval f = Stats.percentile(bootF[m][i], o.confidence());
                Interval t = Stats.percentile(bootT[m][i], o.confidence());
                lowF[m][i] = f.low();
                highF[m][i] = f.high();
                lowT[m][i] = t.low();
                highT[m][i] = t.high();
            }
        }
    }

    static void replicates(SobolIndices.Runs runs, SobolIndices.Options o, double[][] first, double[][] total, double[][] lowF,
                                   double[][] highF, double[][] lowT, double[][] highT) {
        int nOut = first.length;
        int k = first[0].length;
        int r = o.replicates();
        int m = o.n() / r;
        double[][][] repF = new double[nOut][k][r];
        double[][][] repT = new double[nOut][k][r];
        double[] f = new double[k];
        double[] t = new double[k];
        for (int rep = 0; rep < r; rep++) {
            int[] rows = SobolIndices.okRows(runs.ok(), rep * m, rep * m + m);
            for (int q = 0; q < nOut; q++) {
                if (rows.length < 2) {
                    java.util.Arrays.fill(f, Double.NaN);
                    java.util.Arrays.fill(t, Double.NaN);
                } else {
                    SobolIndices.estimate(runs.fA()[q], runs.fB()[q], runs.fAB()[q], rows, rows.length, f, t);
                }
                for (int i = 0; i < k; i++) {
                    repF[q][i][rep] = f[i];
                    repT[q][i][rep] = t[i];
                }
            }
        }
        for (int q = 0; q < nOut; q++) {
            for (int i = 0; i < k; i++) {
                Stats.MeanInterval a = Stats.tInterval(repF[q][i], o.confidence());
                Stats.MeanInterval b = Stats.tInterval(repT[q][i], o.confidence());
                first[q][i] = a.mean();
                lowF[q][i] = a.interval().low();
                highF[q][i] = a.interval().high();
                total[q][i] = b.mean();
                lowT[q][i] = b.interval().low();
                highT[q][i] = b.interval().high();
            }
        }
    }

    private static void fillNaN(double[][]... arrays) {
        for (double[][] a : arrays) {
            for (double[] row : a) {
                java.util.Arrays.fill(row, Double.NaN);
            }
        }
    }
}
