package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.Interval;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.AnalysisSettings.WhatIf.Kind;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Parameter;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;

/**
 * Which tolerance to tighten, and by how much, from the samples already run (by {@link WhatIf}
 * reweighting).
 *
 * <p>Ranking: each uncertain input's σ halved alone; yield gained and the spread of one output reduced,
 * with the effective sample size of each reweighting.
 *
 * <p>Allocation: each input may be scaled to one of {@link #SCALES}, at cost c_i log2(1/scale) where
 * c_i is the study's cost of halving its σ (1 when not given). Starting from no change, the greedy path
 * repeatedly takes the one-level tightening with the largest gain in (jointly reweighted) yield per unit
 * of cost, until the goal is met or nothing gains; each point is verified by the joint reweighting of all
 * changes so far. A discrete knapsack-like problem solved greedily: cheap and usually near the cheapest,
 * not guaranteed optimal. When the final effective sample size collapses the result asks for a
 * confirmation run ({@link WhatIf#modifiedSpace}).
 */
public final class ToleranceAdvisor {

    /** The σ scale factors an allocation may choose from. */
    public static final double[] SCALES = {1, 0.75, 0.5, 0.35, 0.25};

    private ToleranceAdvisor() {
    }

    /** The distribution specs of a study's uncertain inputs, by id. */
    public static Map<String, DistributionSpec> specs(Study study) {
        Map<String, DistributionSpec> m = new LinkedHashMap<>();
        for (Parameter p : study.uncertainInputs()) {
            m.put(p.id(), p.distribution());
        }
        return m;
    }

    /**
     * Ranks the inputs by the yield gained when their σ is halved.
     *
     * @param sdOutput output whose sd reduction is reported; null = the first target's output
     */
    public static ToleranceRanking rank(SampleTable table, InputSpace space, List<Target> targets,
                                        Map<String, DistributionSpec> specs, String sdOutput, WhatIf.Options options) {
        String sdOut = sdOutput != null ? sdOutput : targets.get(0).output();
        if (!table.outputIds().contains(sdOut)) {
            throw new IllegalArgumentException("no output " + sdOut);
        }
        YieldResult base = YieldEstimate.of(table, targets, options.confidence());
        double baseline = base.all().yield();
        List<ToleranceRanking.Entry> entries = new ArrayList<>();
        for (String id : space.ids()) {
            DistributionSpec spec = spec(specs, id);
            WhatIf.Change c;
            try {
                c = WhatIf.change(id, spec, Kind.SCALE_SIGMA, 0.5, null);
            } catch (StudyException e) {
                entries.add(new ToleranceRanking.Entry(id, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                        Interval.none(), Double.NaN, Double.NaN, Double.NaN, Double.NaN, true, e.getMessage()));
                continue;
            }
            WhatIfResult r = WhatIf.evaluate(table, space, targets, List.of(c), options);
            WhatIfResult.WeightedYield y = r.allTargets();
            WhatIfResult.WeightedMoments m = r.output(sdOut);
            entries.add(new ToleranceRanking.Entry(id, y.after(), y.afterLow(), y.afterHigh(), y.after() - baseline,
                    y.change(), m.sdBefore(), m.sdAfter(), r.ess(), r.essFraction(), r.rerunNeeded(), r.message()));
        }
        entries.sort(Comparator.comparingDouble((ToleranceRanking.Entry e) -> Double.isNaN(e.yieldGain())
                        ? Double.NEGATIVE_INFINITY : e.yieldGain()).reversed()
                .thenComparing(Comparator.comparingDouble((ToleranceRanking.Entry e) -> Double.isNaN(e.sdReduction())
                        ? Double.NEGATIVE_INFINITY : e.sdReduction()).reversed()));
        return new ToleranceRanking(sdOut, baseline, entries);
    }

    private static DistributionSpec spec(Map<String, DistributionSpec> specs, String id) {
        DistributionSpec s = specs.get(id);
        if (s == null) {
            throw new IllegalArgumentException("no distribution given for input " + id);
        }
        return s;
    }

    /** The ranking for a study: its targets, its inputs' specs, J_sc spread of the first target's output. */
    public static ToleranceRanking rank(SampleTable table, InputSpace space, Study study, WhatIf.Options options) {
        return rank(table, space, study.targets(), specs(study), null, options);
    }

    /**
     * The allocation for a study: its targets, its yield goal ({@code analysis.yieldGoal()}) and its costs
     * ({@code costs()}, missing = 1).
     */
    public static ToleranceAllocation allocate(SampleTable table, InputSpace space, Study study,
                                               WhatIf.Options options) {
        return allocate(table, space, study.targets(), specs(study), study.costs(), study.analysis().yieldGoal(),
                options);
    }

    /**
     * Greedy cost-weighted allocation of σ scales to reach {@code goal} (yield of all targets).
     *
     * @param costs cost of halving each input's σ, by id; missing = 1
     */
    public static ToleranceAllocation allocate(SampleTable table, InputSpace space, List<Target> targets,
                                               Map<String, DistributionSpec> specs, Map<String, Double> costs,
                                               double goal, WhatIf.Options options) {
        if (!(goal > 0 && goal < 1)) {
            throw new IllegalArgumentException("yield goal must lie in (0, 1), got " + goal);
        }
        List<String> ids = space.ids();
        int k = ids.size();
        int levels = SCALES.length;
        double[] unitCost = new double[k];
        WhatIf.Change[][] changes = new WhatIf.Change[k][levels];
        StringBuilder note = new StringBuilder();
        for (int i = 0; i < k; i++) {
            String id = ids.get(i);
            Double c = costs.get(id);
            unitCost[i] = c == null ? 1 : c;
            if (!(unitCost[i] >= 0)) {
                throw new IllegalArgumentException("cost of " + id + " must be >= 0, got " + c);
            }
            for (int l = 1; l < levels; l++) {
                try {
                    changes[i][l] = WhatIf.change(id, spec(specs, id), Kind.SCALE_SIGMA, SCALES[l], null);
                } catch (StudyException e) {
                    changes[i][l] = null;
                }
            }
            if (changes[i][1] == null) {
                note.append(id).append(" cannot be scaled (measured values or fixed) and is left as it is. ");
            }
        }
        int[] col = YieldEstimate.columns(table, targets);
        int size = table.size();
        boolean[] pass = new boolean[size];
        for (int j = 0; j < size; j++) {
            boolean p = table.ok()[j];
            for (int g = 0; g < targets.size() && p; g++) {
                p = targets.get(g).isMet(table.outputs()[col[g]][j]);
            }
            pass[j] = p;
        }
        boolean correlated = space.correlated();
        double[][][] logw = correlated ? null : new double[k][levels][];
        int[] level = new int[k];
        double[] cur = new double[size];
        double[] trial = new double[size];
        double[] w = new double[size];
        List<ToleranceAllocation.TradeOffPoint> curve = new ArrayList<>();
        Eval e = evalWeights(table, space, pass, changes, level, cur, w, options, correlated);
        curve.add(new ToleranceAllocation.TradeOffPoint(0, "", 1, 0, e.yield.after(), e.yield.afterLow(),
                e.yield.afterHigh(), e.ess, false));
        double totalCost = 0;
        int step = 0;
        while (e.yield.afterLow() < goal) {
            int bestI = -1;
            double bestRatio = 0;
            Eval bestEval = null;
            for (int i = 0; i < k; i++) {
                int l = level[i] + 1;
                if (l >= levels || changes[i][l] == null || !changes[i][l].reweightable()) {
                    continue;
                }
                double dc = unitCost[i] * (log2inv(SCALES[l]) - log2inv(SCALES[level[i]]));
                level[i] = l;
                Eval t;
                if (correlated) {
                    t = evalWeights(table, space, pass, changes, level, trial, w, options, true);
                } else {
                    double[] a = lw(logw, changes, table, i, l);
                    double[] b = level[i] - 1 == 0 ? null : lw(logw, changes, table, i, l - 1);
                    for (int j = 0; j < size; j++) {
                        trial[j] = cur[j] + a[j] - (b == null ? 0 : b[j]);
                    }
                    t = fromLog(trial, w, pass, table.ok(), options);
                }
                level[i] = l - 1;
                double gain = t.yield.after() - e.yield.after();
                double ratio = dc > 0 ? gain / dc : (gain > 0 ? Double.POSITIVE_INFINITY : 0);
                if (gain > 0 && ratio > bestRatio) {
                    bestRatio = ratio;
                    bestI = i;
                    bestEval = t;
                }
            }
            if (bestI < 0) {
                note.append(String.format(Locale.ROOT, "No further tightening raises the predicted yield; the goal"
                        + " %.4f is not reached with the scales %s. ", goal, java.util.Arrays.toString(SCALES)));
                break;
            }
            int l = level[bestI] + 1;
            totalCost += unitCost[bestI] * (log2inv(SCALES[l]) - log2inv(SCALES[level[bestI]]));
            if (!correlated) {
                double[] a = lw(logw, changes, table, bestI, l);
                double[] b = level[bestI] == 0 ? null : lw(logw, changes, table, bestI, level[bestI]);
                for (int j = 0; j < size; j++) {
                    cur[j] += a[j] - (b == null ? 0 : b[j]);
                }
            }
            level[bestI] = l;
            e = bestEval;
            step++;
            curve.add(new ToleranceAllocation.TradeOffPoint(step, ids.get(bestI), SCALES[l], totalCost,
                    e.yield.after(), e.yield.afterLow(), e.yield.afterHigh(), e.ess, e.rerun));
        }
        // verify the final choice through the public what-if path (all changes reweighted jointly)
        List<WhatIf.Change> chosen = new ArrayList<>();
        List<ToleranceAllocation.Choice> choices = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            double s = SCALES[level[i]];
            choices.add(new ToleranceAllocation.Choice(ids.get(i), s, unitCost[i], unitCost[i] * log2inv(s)));
            if (level[i] > 0) {
                chosen.add(changes[i][level[i]]);
            }
        }
        double yield;
        Interval change;
        double low;
        double high;
        double ess;
        double fraction;
        boolean confirm;
        if (chosen.isEmpty()) {
            yield = e.yield.after();
            change = e.yield.change();
            low = e.yield.afterLow();
            high = e.yield.afterHigh();
            ess = e.ess;
            fraction = e.ess / e.n;
            confirm = false;
        } else {
            WhatIfResult v = WhatIf.evaluate(table, space, targets, chosen, options);
            yield = v.allTargets().after();
            change = v.allTargets().change();
            low = v.allTargets().afterLow();
            high = v.allTargets().afterHigh();
            ess = v.ess();
            fraction = v.essFraction();
            confirm = v.rerunNeeded();
            if (confirm) {
                note.append("The effective sample size of the final reweighting is ")
                        .append(String.format(Locale.ROOT, "%.0f (%.1f %%)", ess, 100 * fraction))
                        .append(": confirm the allocation with a new run. ");
            }
        }
        if (yield >= goal && low < goal) {
            note.append(String.format(Locale.ROOT, "The predicted yield %.4f meets the goal but its lower bound %.4f"
                    + " does not: the goal is not shown to be reached. ", yield, low));
        }
        return new ToleranceAllocation(goal, low >= goal, yield, low, high, change, totalCost, ess, fraction, confirm,
                choices, curve, note.toString().trim());
    }

    private static double log2inv(double s) {
        return Math.log(1 / s) / Math.log(2);
    }

    private static double[] lw(double[][][] cache, WhatIf.Change[][] changes, SampleTable table, int i, int l) {
        if (cache[i][l] == null) {
            cache[i][l] = WhatIf.logWeights(table, changes[i][l]);
        }
        return cache[i][l];
    }

    private record Eval(WhatIfResult.WeightedYield yield, double ess, int n, boolean rerun) {
    }

    private static Eval evalWeights(SampleTable table, InputSpace space, boolean[] pass, WhatIf.Change[][] changes,
                                    int[] level, double[] logOut, double[] w, WhatIf.Options options,
                                    boolean correlated) {
        List<WhatIf.Change> list = new ArrayList<>();
        for (int i = 0; i < level.length; i++) {
            if (level[i] > 0) {
                list.add(changes[i][level[i]]);
            }
        }
        double[] weights = WhatIf.weights(table, space, list, options);
        for (int j = 0; j < weights.length; j++) {
            logOut[j] = Math.log(weights[j]);
        }
        return fromLog(logOut, w, pass, table.ok(), options);
    }

    private static Eval fromLog(double[] logw, double[] w, boolean[] pass, boolean[] ok, WhatIf.Options options) {
        double sw = 0;
        double sw2 = 0;
        int n = 0;
        for (int j = 0; j < logw.length; j++) {
            w[j] = ok[j] ? Math.exp(logw[j]) : 0;
            sw += w[j];
            sw2 += w[j] * w[j];
            n += ok[j] ? 1 : 0;
        }
        WhatIfResult.WeightedYield y = WeightedEstimates.weightedYield("all targets", pass, ok, w, options.confidence());
        double ess = sw > 0 ? sw * sw / sw2 : 0;
        boolean rerun = ess < options.minEss() || ess < options.minEssFraction() * n;
        return new Eval(y, ess, n, rerun);
    }
}
