package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;

import org.fabspread.sampling.Interval;
import org.fabspread.sampling.Intervals;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.Target;

/**
 * Yields and moments of weighted samples for {@link WhatIf}: the self-normalised estimator Σ w I / Σ w
 * with its standard error, and the paired interval of its change from the counted yield on the same
 * samples.
 */
final class WeightedEstimates {

    private WeightedEstimates() {
    }

    /** Yield lines before and after; {@code w == null} leaves "after" NaN. */
    static List<WhatIfResult.WeightedYield> summarise(SampleTable table, List<Target> targets, int[] col, double[] w,
                                                      WhatIf.Options options) {
        List<WhatIfResult.WeightedYield> out = new ArrayList<>();
        for (int t = 0; t <= targets.size(); t++) {
            boolean all = t == targets.size();
            int size = table.size();
            boolean[] pass = new boolean[size];
            for (int j = 0; j < size; j++) {
                if (!table.ok()[j]) {
                    continue;
                }
                boolean p = true;
                for (int g = 0; g < targets.size(); g++) {
                    if (all || g == t) {
                        p &= targets.get(g).isMet(table.outputs()[col[g]][j]);
                    }
                }
                pass[j] = p;
            }
            out.add(weightedYield(all ? "all targets" : targets.get(t).describe(), pass, table.ok(), w,
                    options.confidence()));
        }
        return out;
    }

    static WhatIfResult.WeightedYield weightedYield(String spec, boolean[] pass, boolean[] ok, double[] w,
                                                    double confidence) {
        int n = 0;
        int x = 0;
        double sw = 0;
        double swi = 0;
        double sw2 = 0;
        for (int j = 0; j < pass.length; j++) {
            if (!ok[j]) {
                continue;
            }
            n++;
            x += pass[j] ? 1 : 0;
            if (w != null) {
                sw += w[j];
                sw2 += w[j] * w[j];
                swi += pass[j] ? w[j] : 0;
            }
        }
        double before = x / (double) n;
        if (w == null || !(sw > 0)) {
            return new WhatIfResult.WeightedYield(spec, before, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    Interval.none());
        }
        double p = swi / sw;
        double v = 0;
        for (int j = 0; j < pass.length; j++) {
            if (ok[j]) {
                double d = (pass[j] ? 1 : 0) - p;
                v += w[j] * w[j] * d * d;
            }
        }
        double se = Math.sqrt(v) / sw;
        double lo;
        double hi;
        if (se > 0) {
            double z = Stats.zFor(confidence);
            lo = Math.max(0, p - z * se);
            hi = Math.min(1, p + z * se);
        } else {
            double ess = sw * sw / sw2;
            long ne = Math.max(1, Math.round(ess));
            Interval wi = Intervals.wilson(Math.round(p * ne), ne, confidence);
            lo = wi.low();
            hi = wi.high();
        }
        return new WhatIfResult.WeightedYield(spec, before, p, se, lo, hi,
                pairedChange(pass, ok, w, n, sw, p, before, confidence));
    }

    /**
     * Paired interval of the reweighted yield minus the counted one on the same samples. Both are
     * functions of the same n draws, D = Σ w_j I_j / Σ w_j − Σ I_j / n; by the delta method its influence
     * per sample is ψ_j = (w_j / w̄)(I_j − p̂_w) − (I_j − p̂_0), w̄ = Σ w / n, and Var D ≈ Σ ψ_j² / n²
     * (Owen, Monte Carlo theory, methods and examples (2013), sec. 9.2 for the self-normalised ratio;
     * common practice for paired differences). The interval is D ± z √Var D; it is [D, D] when every
     * sample agrees (all pass or all fail).
     */
    static Interval pairedChange(boolean[] pass, boolean[] ok, double[] w, int n, double sw, double p,
                                 double before, double confidence) {
        double wbar = sw / n;
        double s = 0;
        for (int j = 0; j < pass.length; j++) {
            if (ok[j]) {
                double i = pass[j] ? 1 : 0;
                double psi = w[j] / wbar * (i - p) - (i - before);
                s += psi * psi;
            }
        }
        double d = p - before;
        double half = Stats.zFor(confidence) * Math.sqrt(s) / n;
        return new Interval(d - half, d + half);
    }

    static List<WhatIfResult.WeightedMoments> moments(SampleTable table, double[] w) {
        List<WhatIfResult.WeightedMoments> out = new ArrayList<>();
        for (int m = 0; m < table.outputIds().size(); m++) {
            double[] y = table.outputs()[m];
            double[] b = weightedMoments(y, table.ok(), null);
            double[] a = w == null ? new double[] {Double.NaN, Double.NaN} : weightedMoments(y, table.ok(), w);
            out.add(new WhatIfResult.WeightedMoments(table.outputIds().get(m), b[0], b[1], a[0], a[1]));
        }
        return out;
    }

    private static double[] weightedMoments(double[] y, boolean[] ok, double[] w) {
        double sw = 0;
        double s = 0;
        for (int j = 0; j < y.length; j++) {
            if (ok[j]) {
                double wj = w == null ? 1 : w[j];
                sw += wj;
                s += wj * y[j];
            }
        }
        double mean = s / sw;
        double s2 = 0;
        for (int j = 0; j < y.length; j++) {
            if (ok[j]) {
                double wj = w == null ? 1 : w[j];
                s2 += wj * (y[j] - mean) * (y[j] - mean);
            }
        }
        return new double[] {mean, Math.sqrt(s2 / sw)};
    }
}
