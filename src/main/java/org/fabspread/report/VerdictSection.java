package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

import org.fabspread.pipeline.StudyResults;
import org.fabspread.analysis.SobolResult;
import org.fabspread.analysis.ToleranceRanking;
import org.fabspread.analysis.YieldResult;
import org.fabspread.plan.Factor;
import org.fabspread.plan.PlanReport;
import org.fabspread.sampling.Distributions;
import org.fabspread.sampling.RunSummary;
import org.fabspread.study.Parameter;
import org.fabspread.study.Target;

/**
 * The report's opening screen, the answer before the evidence: the followed output's mean and spread,
 * the yield against each target with its interval, what the particle layer buys or costs against the
 * planar stack, the inputs that drive the spread, the one recommendation with what it buys, the
 * proposed plan in one line, how sure the numbers are and what fell outside the model's validity.
 * An effect is named as a finding only when its interval excludes zero.
 */
final class VerdictSection {

    /** Contributors named on the opening screen at most. */
    static final int TOP = 3;

    private VerdictSection() {
    }

    static Section build(StudyResults r) {
        String out = focusOutput(r);
        RunSummary.OutputStats st = stats(r.summary(), out);
        List<KeyValues.Pair> kv = new ArrayList<>();
        kv.add(KeyValues.pair(label(out), spread(r, out, st)));
        YieldResult y = r.yield();
        if (y != null) {
            List<Target> targets = r.study().targets();
            for (int i = 0; i < y.perTarget().size(); i++) {
                String key = i < targets.size() ? target(targets.get(i)) : y.perTarget().get(i).spec();
                kv.add(KeyValues.pair("Yield, " + key, yieldShort(y.perTarget().get(i), y.confidence())));
            }
            if (y.perTarget().size() > 1) {
                kv.add(KeyValues.pair("Yield, all targets", yieldShort(y.all(), y.confidence())));
            }
        }
        String planar = planar(r);
        if (planar != null) {
            kv.add(KeyValues.pair("What the particles buy", planar));
        }
        kv.add(KeyValues.pair("What drives the spread", contributors(r, out)));
        if (r.ranking() != null) {
            kv.add(KeyValues.pair("Recommendation", recommendation(r)));
        }
        if (r.plan() != null) {
            kv.add(KeyValues.pair("Proposed experiments", plan(r.plan())));
        }
        kv.add(KeyValues.pair("How sure", sureness(r)));
        kv.add(KeyValues.pair("Outside the model's validity", outside(r)));
        List<Block> b = new ArrayList<>();
        b.add(new Paragraph(lead(r, out, st)));
        b.add(new KeyValues(kv));
        return new Section(StudyReport.VERDICT, "The answer", b);
    }

    /** The answer in one sentence: the yield of all targets (or the mean) and the one clear lever. */
    static String lead(StudyResults r, String out, RunSummary.OutputStats st) {
        StringBuilder sb = new StringBuilder();
        if (r.yield() != null) {
            YieldResult.YieldLine all = r.yield().all();
            sb.append(Numbers.pct(all.yield())).append(" of devices meet ")
                    .append(r.study().targets().size() == 1 ? target(r.study().targets().get(0)) : "every target")
                    .append('.');
        } else {
            sb.append(label(out)).append(" averages ").append(Numbers.withUnit(Numbers.num(st.mean()), st.unit()))
                    .append('.');
        }
        ToleranceRanking.Entry best = clearBest(r.ranking());
        if (best != null) {
            sb.append(" Halving the σ of ").append(best.input()).append(" would raise that to ")
                    .append(Numbers.pct(best.yieldAfter())).append('.');
        } else if (r.ranking() != null) {
            sb.append(" No single tightening buys a gain this run can tell from noise.");
        }
        return sb.toString();
    }

    /** The input whose halved σ gains the most yield, when the gain's interval clears today's yield; else null. */
    static ToleranceRanking.Entry clearBest(ToleranceRanking rk) {
        if (rk == null) {
            return null;
        }
        ToleranceRanking.Entry best = null;
        for (ToleranceRanking.Entry e : rk.entries()) {
            if (Double.isFinite(e.yieldGain()) && (best == null || e.yieldGain() > best.yieldGain())) {
                best = e;
            }
        }
        return best != null && best.yieldLow() > rk.baselineYield() ? best : null;
    }

    /** Mean, spread and the nominal device, e.g. {@code 13.6 mA/cm² mean, sd 0.31; 5–95 %: 13.1 to 14.1}. */
    static String spread(StudyResults r, String out, RunSummary.OutputStats st) {
        String u = Numbers.unit(st.unit());
        StringBuilder sb = new StringBuilder();
        sb.append(Numbers.num(st.mean())).append(' ').append(u).append(" mean, standard deviation ")
                .append(Numbers.num3(st.sd())).append(' ').append(u);
        double q05 = quantile(st, 0.05);
        double q95 = quantile(st, 0.95);
        if (Double.isFinite(q05) && Double.isFinite(q95)) {
            sb.append("; 90 % of devices between ").append(Numbers.num(q05)).append(" and ").append(Numbers.num(q95))
                    .append(' ').append(u);
        }
        double nominal = r.nominal(out);
        if (Double.isFinite(nominal)) {
            sb.append("; the nominal device gives ").append(Numbers.num(nominal)).append(' ').append(u);
        }
        return sb.toString();
    }

    private static String yieldShort(YieldResult.YieldLine l, double confidence) {
        return Numbers.pct(l.yield()) + " of devices (" + Numbers.level(confidence) + " interval "
                + Numbers.pctRange(l.wilsonLow(), l.wilsonHigh()) + ")";
    }

    /**
     * The particles against the planar stack, or null when the study has no particle layer; when the
     * planar reference was not computed, says how to ask for it.
     */
    static String planar(StudyResults r) {
        if (r.study().particles() == null) {
            return null;
        }
        if (r.table() == null || !r.table().outputIds().contains("jsc_planar") || !r.table().outputIds().contains("jsc")) {
            return "not computed: set analysis.planar_reference: true to solve the same stack without particles";
        }
        PlanarComparison c = PlanarComparison.of(r.table().output("jsc"), r.table().output("jsc_planar"),
                r.summary().confidence());
        String u = Numbers.unit("mA/cm^2");
        String verb = c.mean() >= 0 ? "add " : "cost ";
        StringBuilder sb = new StringBuilder();
        sb.append("the particles ").append(verb).append(Numbers.num3(Math.abs(c.mean()))).append(' ').append(u)
                .append(" of J_sc against the same stack without them (").append(Numbers.level(r.summary().confidence()))
                .append(" interval of the mean ").append(signed(c.low())).append(" to ").append(signed(c.high()))
                .append("; 90 % of devices between ").append(signed(c.q05())).append(" and ").append(signed(c.q95()))
                .append(' ').append(u).append(')');
        RunSummary.OutputStats enh = statsOrNull(r.summary(), "enhancement");
        if (enh != null) {
            sb.append(", a factor of ").append(Numbers.num(enh.mean()));
        }
        if (!c.clear()) {
            sb.append("; this run cannot tell the difference from zero");
        }
        return sb.toString();
    }

    private static String signed(double v) {
        return (v > 0 ? "+" : "") + Numbers.num3(v);
    }

    /** The inputs whose total Sobol index has an interval above zero, largest first. */
    static String contributors(StudyResults r, String out) {
        SobolResult sobol = r.sobol();
        if (sobol == null || sobol.outputs().stream().noneMatch(o -> o.output().equals(out))) {
            List<String> top = topInputs(r, out);
            return top.isEmpty() ? "no sensitivity analysis was asked for"
                    : "by the screening (no intervals): " + String.join(", ", top.subList(0, Math.min(TOP, top.size())));
        }
        List<SobolResult.IndexEstimate> est = new ArrayList<>(sobol.output(out).indices());
        est.sort(Comparator.comparingDouble(SobolResult.IndexEstimate::total).reversed());
        List<String> named = new ArrayList<>();
        for (SobolResult.IndexEstimate e : est) {
            if (named.size() < TOP && Double.isFinite(e.totalLow()) && e.totalLow() > 0) {
                named.add(e.input() + " " + Numbers.pct(e.total()) + " (" + Numbers.pctRange(e.totalLow(), e.totalHigh())
                        + ")");
            }
        }
        if (named.isEmpty()) {
            return "no input's share of the variance can be told from zero at this design size";
        }
        return String.join("; ", named) + " of the variance of " + label(out) + " (total Sobol index with "
                + Numbers.level(sobol.confidence()) + " interval)";
    }

    /** The one recommendation with what it buys, named only when its interval clears today's yield. */
    static String recommendation(StudyResults r) {
        ToleranceRanking rk = r.ranking();
        ToleranceRanking.Entry best = clearBest(rk);
        if (best == null) {
            return "none with a clear gain: no single input's σ, halved, raises the yield by more than this run's "
                    + "noise (see What to tighten)";
        }
        Parameter p = r.study().parameters().get(best.input());
        String sigma = "";
        if (p != null) {
            double sd = Distributions.of(p.distribution()).standardDeviation();
            sigma = " from " + show(sd, p.unit()) + " to " + show(sd / 2, p.unit());
        }
        return "halve the σ of " + best.input() + sigma + ": yield " + Numbers.pct(rk.baselineYield()) + " → "
                + Numbers.pct(best.yieldAfter()) + " (" + Numbers.points(best.yieldGain()) + ", interval "
                + Numbers.pctRange(best.yieldLow(), best.yieldHigh()) + ")"
                + (best.rerunNeeded() || best.ess() < StudyReport.LOW_ESS ? "; confirm with a new run first" : "");
    }

    /** The plan in one line: design, runs, factors. */
    static String plan(PlanReport p) {
        List<String> ids = p.factors().stream().map(Factor::id).toList();
        return p.design() + ", " + p.runs() + " runs on " + String.join(", ", ids) + " (response "
                + label(p.response()) + "; run sheet plan.csv)";
    }

    /** Sample sizes and what the intervals cover. */
    static String sureness(StudyResults r) {
        RunSummary s = r.summary();
        StringBuilder sb = new StringBuilder();
        sb.append(s.samplesOk()).append(" Monte Carlo devices; ").append(Numbers.level(s.confidence()))
                .append(" intervals");
        if (r.sobol() != null) {
            sb.append("; Sobol design of ").append(r.sobol().modelRuns()).append(" model runs");
        }
        sb.append(". The intervals cover sampling error only, not the model's own error.");
        return sb.toString();
    }

    /** Failed samples, the probability the model's limits removed, and the run's validity notes. */
    static String outside(StudyResults r) {
        RunSummary s = r.summary();
        long failed = s.samplesRequested() - s.samplesOk();
        StringBuilder sb = new StringBuilder();
        sb.append(failed == 0 ? "no sample failed in the model" : failed + " of " + s.samplesRequested()
                + " samples failed in the model (" + failures(s) + ")");
        if (s.truncatedByModel() != null && s.truncatedByModel() > 0) {
            sb.append("; probability removed by the model's limits ").append(Numbers.pct(s.truncatedByModel()));
        }
        List<String> notes = r.notes().stream().filter(n -> n.contains("unreliable") || n.contains("outside")).toList();
        for (String n : notes) {
            sb.append("; ").append(n);
        }
        return sb.append(". The model's limits are listed under Limits of this model and cautions.").toString();
    }
}
