package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.List;
import org.fabspread.analysis.ToleranceAllocation;
import org.fabspread.analysis.ToleranceRanking;
import org.fabspread.analysis.WhatIfResult;
import org.fabspread.pipeline.StudyResults;

/** The report's "What to tighten" section: the tolerance ranking, the what-ifs, the cost-weighted allocation. */
final class TightenSection {

    private final ChartFactory charts;

    TightenSection(ChartFactory charts) {
        this.charts = charts;
    }

    Section section(StudyResults r) {
        ToleranceRanking rk = r.ranking();
        ToleranceAllocation al = r.allocation();
        if (rk == null && al == null && r.whatIfs().isEmpty()) {
            return null;
        }
        List<Block> b = new ArrayList<>();
        String sdLabel = rk == null ? "J_sc" : label(rk.sdOutput());
        String sdUnit = rk == null ? "" : Numbers.unit(outputDef(r, rk.sdOutput()).unit());
        if (rk != null) {
            ranking(r, rk, sdLabel, sdUnit, b);
        }
        if (!r.whatIfs().isEmpty()) {
            List<List<String>> rows = new ArrayList<>();
            for (WhatIfResult w : r.whatIfs()) {
                WhatIfResult.WeightedYield y = w.allTargets();
                String after = Double.isFinite(y.after()) ? Numbers.pct(y.after()) + " (" + Numbers.pctRange(
                        y.afterLow(), y.afterHigh()) + ")" : "n/a";
                boolean rerun = !w.reweighted() && !w.rerunNeeded() && Double.isFinite(y.after());
                rows.add(List.of(w.description(), Numbers.pct(y.before()), after, Double.isFinite(y.after())
                        ? Numbers.points(y.gain()) + " (" + PairedText.range(y.change()) + ")" : "n/a",
                        rerun ? "new run of " + w.samples() + " samples (reweighting was not usable)"
                                : Double.isFinite(w.ess()) ? ess(w.ess(), w.essFraction()) : "n/a",
                        w.rerunNeeded() ? "yes" + (w.message().isBlank() ? "" : ": " + w.message()) : "no"));
            }
            b.add(Table.of("The study's what-ifs: yield of all targets before and after", List.of("what-if",
                    "yield before", "yield after", "change (" + PairedText.KIND + ")", "effective samples or new run",
                    "re-run needed"), rows));
        }
        if (al != null) {
            List<List<String>> rows = new ArrayList<>();
            for (ToleranceAllocation.Choice c : al.choices()) {
                rows.add(List.of(c.input(), c.scale() == 1 ? "unchanged" : "× " + Numbers.plain(c.scale()),
                        Numbers.plain(c.costOfHalving()), Numbers.num3(c.cost())));
            }
            b.add(Table.of("Cheapest tolerances found for a yield goal of " + Numbers.level(al.goal()),
                    List.of("input", "σ scale", "cost of halving", "cost"), rows));
            b.add(new KeyValues(List.of(
                    KeyValues.pair("Yield goal", Numbers.level(al.goal()) + (al.reached()
                            ? ", reached (the interval's lower bound meets it)"
                            : ", not shown to be reached (the interval's lower bound falls short)")),
                    KeyValues.pair("Change from today", rk == null ? "n/a" : Numbers.points(al.predictedYield()
                            - rk.baselineYield()) + " (" + PairedText.range(al.change()) + ")"),
                    KeyValues.pair("Predicted yield", Numbers.pct(al.predictedYield()) + " (" + Numbers.pctRange(
                            al.predictedLow(), al.predictedHigh()) + ")"),
                    KeyValues.pair("Total cost", Numbers.num3(al.totalCost())),
                    KeyValues.pair("Effective samples", ess(al.ess(), al.essFraction())),
                    KeyValues.pair("Confirmation run", al.confirmationRunNeeded() ? "needed" : "not needed"))));
            double[] cost = new double[al.curve().size()];
            double[] yl = new double[cost.length];
            double[] ylo = new double[cost.length];
            double[] yhi = new double[cost.length];
            for (int i = 0; i < cost.length; i++) {
                cost[i] = al.curve().get(i).cumulativeCost();
                yl[i] = al.curve().get(i).predictedYield();
                ylo[i] = al.curve().get(i).predictedLow();
                yhi[i] = al.curve().get(i).predictedHigh();
            }
            if (cost.length > 0) {
                b.add(new Figure(charts.allocationTradeoff("allocation-tradeoff", "What each step of tightening buys",
                                Quantity.of("cost of the tightened tolerances", "study cost units"), cost, yl, ylo, yhi,
                                al.goal()),
                        "Predicted yield of all targets along the greedy path of cheapest tightenings, against the "
                                + "summed cost (the study's cost of halving each σ, times the halvings), each point "
                                + "with its interval; the dashed line is the goal, counted as reached only where the "
                                + "interval's lower end meets it."));
            }
        }
        return new Section(StudyReport.TIGHTEN, "What to tighten", b);
    }

    /** The recommendation, the ranking chart, yield per unit cost and the table of halvings. */
    private void ranking(StudyResults r, ToleranceRanking rk, String sdLabel, String sdUnit, List<Block> b) {
        b.add(new Paragraph(Recommendation.text(r)));
        List<String> names = new ArrayList<>();
        List<Double> gains = new ArrayList<>();
        List<Double> gainLow = new ArrayList<>();
        List<Double> gainHigh = new ArrayList<>();
        List<List<String>> rows = new ArrayList<>();
        for (ToleranceRanking.Entry e : rk.entries()) {
            if (Double.isFinite(e.yieldGain())) {
                names.add(e.input());
                gains.add(100 * e.yieldGain());
                gainLow.add(100 * e.gain().low());
                gainHigh.add(100 * e.gain().high());
            }
            rows.add(List.of(e.input(),
                    Double.isFinite(e.yieldAfter()) ? Numbers.pct(e.yieldAfter()) + " (" + Numbers.pctRange(
                            e.yieldLow(), e.yieldHigh()) + ")" : "n/a",
                    Double.isFinite(e.yieldGain()) ? Numbers.points(e.yieldGain()) + " (" + PairedText.range(e.gain())
                            + ")" : "n/a",
                    Numbers.num3(e.sdBefore()) + " → " + Numbers.num3(e.sdAfter()) + " " + sdUnit,
                    ess(e.ess(), e.essFraction()),
                    e.rerunNeeded() ? "yes" + (e.note().isBlank() ? "" : ": " + e.note()) : "no"));
        }
        if (!names.isEmpty()) {
            b.add(new Figure(charts.intervalBars("tolerance-ranking", "Yield gained by halving one σ",
                            Quantity.of("yield gained", "percentage points"), Quantity.of("input", "sorted by gain"),
                            names.toArray(new String[0]), PairedText.array(gains), PairedText.array(gainLow),
                            PairedText.array(gainHigh), "yield gained", Numbers.level(r.study().analysis().confidence())
                                    + " paired interval"),
                    "Yield of all targets gained when one input's standard deviation is halved and the others "
                            + "are left as they are (from " + Numbers.pct(rk.baselineYield()) + " as run), "
                            + "estimated by reweighting the existing samples; each bar carries the paired "
                            + "interval of the gain on the same samples. A bar whose interval crosses zero is "
                            + "not shown to be a gain or a loss."));
        }
        Figure perCost = costWeighted(r, rk);
        if (perCost != null) {
            b.add(perCost);
        }
        b.add(Table.of("Halving each input's σ, one at a time", List.of("input", "yield after",
                "gain (paired interval)",
                "sd of " + sdLabel, "effective samples", "re-run needed"), rows));
    }

    /** Yield gained per unit cost of halving, for the inputs the study prices; null when none is priced. */
    private Figure costWeighted(StudyResults r, ToleranceRanking rk) {
        List<String> names = new ArrayList<>();
        List<Double> perCost = new ArrayList<>();
        for (ToleranceRanking.Entry e : rk.entries()) {
            Double cost = r.study().costs().get(e.input());
            if (cost != null && cost > 0 && Double.isFinite(e.yieldGain())) {
                names.add(e.input());
                perCost.add(e.yieldGain() / cost);
            }
        }
        if (names.isEmpty()) {
            return null;
        }
        return new Figure(charts.costWeightedGain("tolerance-gain-per-cost", "Yield gained per unit cost of tightening",
                names.toArray(new String[0]), perCost.stream().mapToDouble(Double::doubleValue).toArray()),
                "Yield of all targets gained by halving one input's σ, divided by the study's cost of that halving: "
                        + "the best value for money on top. Inputs without a cost in the study are left out; the "
                        + "gains' intervals are in the table below.");
    }
}
