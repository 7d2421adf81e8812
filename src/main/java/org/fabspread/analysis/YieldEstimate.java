package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.apache.commons.math3.stat.descriptive.moment.Skewness;
import org.fabspread.sampling.Interval;
import org.fabspread.sampling.Intervals;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;

/**
 * Yield against targets with binomial intervals, and process capability.
 *
 * <p>The intervals assume independent samples (plain Monte Carlo; a Latin hypercube makes them roughly
 * conservative). Weighted samples use {@link WhatIf}'s self-normalised estimator instead.
 */
public final class YieldEstimate {

    /** |skewness| above which the normal-theory yield gets a caveat (Bulmer's "moderately skewed"). */
    public static final double NOTABLE_SKEWNESS = 0.5;

    private YieldEstimate() {
    }

    /** One yield line from counts. */
    public static YieldResult.YieldLine line(String spec, long passed, long n, double confidence) {
        Interval w = Intervals.wilson(passed, n, confidence);
        Interval cp = Intervals.clopperPearson(passed, n, confidence);
        return new YieldResult.YieldLine(spec, passed, n, passed / (double) n, w.low(), w.high(), cp.low(), cp.high());
    }

    /**
     * Yield of each target and of all together over the samples that evaluated.
     *
     * @throws StudyException when a target names an output the samples do not have
     */
    public static YieldResult of(SampleTable table, List<Target> targets, double confidence) {
        if (targets.isEmpty()) {
            throw new IllegalArgumentException("no targets to compute a yield against");
        }
        int[] col = columns(table, targets);
        boolean[] ok = table.ok();
        int n = 0;
        long[] pass = new long[targets.size()];
        long passAll = 0;
        for (int j = 0; j < ok.length; j++) {
            if (!ok[j]) {
                continue;
            }
            n++;
            boolean all = true;
            for (int t = 0; t < targets.size(); t++) {
                boolean met = targets.get(t).isMet(table.outputs()[col[t]][j]);
                if (met) {
                    pass[t]++;
                }
                all &= met;
            }
            if (all) {
                passAll++;
            }
        }
        int failed = ok.length - n;
        if (n == 0) {
            throw new IllegalStateException("no sample evaluated: no yield can be estimated");
        }
        List<YieldResult.YieldLine> lines = new ArrayList<>();
        for (int t = 0; t < targets.size(); t++) {
            lines.add(line(targets.get(t).describe(), pass[t], n, confidence));
        }
        YieldResult.YieldLine all = line("all targets", passAll, n, confidence);
        String note = "";
        if (failed > 0) {
            note = String.format(Locale.ROOT, "%d of %d samples failed to evaluate and are left out; counted as"
                    + " failures the yield would be %.4f.", failed, ok.length, passAll / (double) ok.length);
        }
        return new YieldResult(n, failed, confidence, lines, all, note);
    }

    static int[] columns(SampleTable table, List<Target> targets) {
        int[] col = new int[targets.size()];
        for (int t = 0; t < targets.size(); t++) {
            Target g = targets.get(t);
            col[t] = table.outputIds().indexOf(g.output());
            if (col[t] < 0) {
                throw StudyException.at(g.where(), "unknown output '" + g.output() + "'; the model gives "
                        + String.join(", ", table.outputIds()));
            }
        }
        return col;
    }

    /** C_pk of the target's output over the samples that evaluated. */
    public static Capability capability(SampleTable table, Target target) {
        int c = columns(table, List.of(target))[0];
        double[] y = table.outputs()[c];
        int n = 0;
        for (boolean b : table.ok()) {
            n += b ? 1 : 0;
        }
        double[] v = new double[n];
        n = 0;
        for (int j = 0; j < y.length; j++) {
            if (table.ok()[j]) {
                v[n++] = y[j];
            }
        }
        return capability(v, target);
    }

    /**
     * C_pk against a one-sided spec: (μ − LSL)/(3σ) for a lower limit, (USL − μ)/(3σ) for an upper one;
     * under normality the yield is Φ(3 C_pk). The skewness is shown because that equivalence needs normality.
     */
    public static Capability capability(double[] values, Target target) {
        int n = values.length;
        if (n < 3) {
            throw new IllegalArgumentException("C_pk needs at least 3 values, got " + n);
        }
        double mean = Stats.mean(values);
        double sd = Math.sqrt(Stats.variance(values));
        double cpk = target.atLeast() ? (mean - target.value()) / (3 * sd) : (target.value() - mean) / (3 * sd);
        double normalYield = Stats.normalCdf(3 * cpk);
        long pass = 0;
        for (double x : values) {
            if (target.isMet(x)) {
                pass++;
            }
        }
        double skew = sd > 0 ? new Skewness().evaluate(values) : Double.NaN;
        String caveat = "";
        if (Math.abs(skew) > NOTABLE_SKEWNESS) {
            boolean towardLimit = target.atLeast() ? skew < 0 : skew > 0;
            caveat = String.format(Locale.ROOT, "%s is skewed (skewness %.2f), its tail %s the limit is %s than"
                            + " a normal one: Phi(3 C_pk) = %.4f likely %s the yield; trust the counted yield %.4f.",
                    target.output(), skew, towardLimit ? "toward" : "away from", "longer",
                    normalYield, towardLimit ? "overstates" : "understates", pass / (double) n);
        }
        return new Capability(target.output(), target.describe(), n, mean, sd, cpk, normalYield,
                pass / (double) n, skew, caveat);
    }
}
