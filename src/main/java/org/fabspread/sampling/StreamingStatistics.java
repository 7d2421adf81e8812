package org.fabspread.sampling;

import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import org.fabspread.model.OutputDef;
import org.fabspread.study.Target;

/**
 * Fixed-memory statistics over the rows of a run, fed in sample order: per output the count, mean,
 * second and third central moment sums (the one-pass update of Welford, Technometrics 4, 419 (1962),
 * extended to the third moment by Terriberry (2007) after Pébay, Sandia SAND2008-6212), min and
 * max; exact counts of rows meeting each target and all targets together; failures by reason.
 * Failed rows are counted and excluded from everything else.
 */
public final class StreamingStatistics implements RowSink {

    private final int m;
    private final long[] n;
    private final double[] mean;
    private final double[] m2;
    private final double[] m3;
    private final double[] min;
    private final double[] max;
    private final Target[] targets;
    private final int[] targetOutput;
    private final long[] met;
    private long allMet;
    private long good;
    private final Map<String, Long> failures = new TreeMap<>();

    public StreamingStatistics(List<OutputDef> outputs, List<Target> targets) {
        this.m = outputs.size();
        this.n = new long[m];
        this.mean = new double[m];
        this.m2 = new double[m];
        this.m3 = new double[m];
        this.min = new double[m];
        this.max = new double[m];
        java.util.Arrays.fill(min, Double.POSITIVE_INFINITY);
        java.util.Arrays.fill(max, Double.NEGATIVE_INFINITY);
        this.targets = targets.toArray(new Target[0]);
        this.targetOutput = new int[this.targets.length];
        for (int t = 0; t < this.targets.length; t++) {
            int at = -1;
            for (int o = 0; o < m; o++) {
                if (outputs.get(o).id().equals(this.targets[t].output())) {
                    at = o;
                }
            }
            if (at < 0) {
                throw new IllegalArgumentException("target on unknown output " + this.targets[t].output());
            }
            targetOutput[t] = at;
        }
        this.met = new long[this.targets.length];
    }

    @Override
    public void row(long sample, double[] x, int offX, double[] y, int offY, String status) {
        if (status != null) {
            failures.merge(status, 1L, Long::sum);
            return;
        }
        good++;
        for (int o = 0; o < m; o++) {
            double v = y[offY + o];
            long n1 = n[o];
            long nn = n1 + 1;
            n[o] = nn;
            double delta = v - mean[o];
            double dn = delta / nn;
            double term1 = delta * dn * n1;
            mean[o] += dn;
            m3[o] += term1 * dn * (nn - 2) - 3 * dn * m2[o];
            m2[o] += term1;
            if (v < min[o]) {
                min[o] = v;
            }
            if (v > max[o]) {
                max[o] = v;
            }
        }
        boolean all = true;
        for (int t = 0; t < targets.length; t++) {
            if (targets[t].isMet(y[offY + targetOutput[t]])) {
                met[t]++;
            } else {
                all = false;
            }
        }
        if (all) {
            allMet++;
        }
    }

    public long good() { return good; }

    public Map<String, Long> failures() { return new TreeMap<>(failures); }

    public long count(int o) { return n[o]; }

    public double mean(int o) { return n[o] > 0 ? mean[o] : Double.NaN; }

    /** Sample variance, divisor n − 1. */
    public double variance(int o) { return n[o] > 1 ? m2[o] / (n[o] - 1) : Double.NaN; }

    public double min(int o) { return n[o] > 0 ? min[o] : Double.NaN; }

    public double max(int o) { return n[o] > 0 ? max[o] : Double.NaN; }

    /**
     * Adjusted sample skewness G₁ = n/((n − 1)(n − 2)) Σ((x − x̄)/s)³ with s the sample standard
     * deviation (Joanes &amp; Gill, The Statistician 47, 183 (1998); as Commons Math's Skewness).
     */
    public double skewness(int o) {
        long k = n[o];
        if (k < 3 || !(m2[o] > 0)) {
            return Double.NaN;
        }
        double var = m2[o] / (k - 1);
        return (double) k / ((k - 1.0) * (k - 2.0)) * m3[o] / (var * Math.sqrt(var));
    }

    public long met(int target) { return met[target]; }

    public long allMet() { return allMet; }
}
