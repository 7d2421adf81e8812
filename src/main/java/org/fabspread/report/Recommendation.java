package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.List;
import org.fabspread.analysis.ToleranceAllocation;
import org.fabspread.analysis.ToleranceRanking;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.sampling.Distributions;
import org.fabspread.sampling.RunSummary;
import org.fabspread.study.Parameter;
import org.fabspread.study.Target;

/** The one recommendation of the report, in words, from the tolerance ranking and the allocation. */
final class Recommendation {

    private Recommendation() {
    }

    /** The recommendation paragraph, from the ranking and the allocation. */
    static String text(StudyResults r) {
        ToleranceRanking rk = r.ranking();
        StringBuilder sb = new StringBuilder();
        ToleranceRanking.Entry best = null;
        for (ToleranceRanking.Entry e : rk.entries()) {
            if (Double.isFinite(e.yieldGain()) && (best == null || e.yieldGain() > best.yieldGain())) {
                best = e;
            }
        }
        if (best == null) {
            sb.append("No input's tolerance could be assessed by reweighting; a new run with tightened σ is needed "
                    + "to say which one to tighten.");
            return sb.toString();
        }
        Parameter p = r.study().parameters().get(best.input());
        String sigma = "";
        if (p != null) {
            double sd = Distributions.of(p.distribution()).standardDeviation();
            sigma = " (from " + show(sd, p.unit()) + " to " + show(sd / 2, p.unit()) + ")";
        }
        String label = label(rk.sdOutput());
        String unit = Numbers.unit(outputDef(r, rk.sdOutput()).unit());
        if (best.yieldGain() <= 0) {
            sb.append("Halving any single input's σ does not raise the yield measurably (present yield ")
                    .append(Numbers.pct(rk.baselineYield())).append("): the spread is not what limits it, or ")
                    .append("several inputs must be tightened together.");
        } else {
            boolean clear = best.yieldLow() > rk.baselineYield();
            // a headline only for a gain whose interval clears today's yield
            sb.append(clear ? "Tighten " + best.input() + " first. Halving its standard deviation"
                    : "No single tightening is established by this run. The largest estimate: halving the standard "
                    + "deviation of " + best.input()).append(sigma)
                    .append(" raises the yield of all targets from ").append(Numbers.pct(rk.baselineYield()))
                    .append(" to ").append(Numbers.pct(best.yieldAfter())).append(" (interval ")
                    .append(Numbers.pctRange(best.yieldLow(), best.yieldHigh())).append(", ")
                    .append(Numbers.points(best.yieldGain())).append(") and narrows ").append(label).append(" from ")
                    .append(Numbers.num3(best.sdBefore())).append(" to ").append(Numbers.num3(best.sdAfter()))
                    .append(' ').append(unit).append(" standard deviation. ");
            if (PairedText.establishedGain(best.gain())) {
                sb.append("The paired interval of the gain on the same samples (").append(PairedText.range(best.gain()))
                        .append(") lies above zero, so the gain is not sampling noise. ");
            } else {
                sb.append("The paired interval of the gain on the same samples (").append(PairedText.range(best.gain()))
                        .append(") still includes zero, so this run does not establish the gain. ");
            }
        }
        if (best.rerunNeeded() || best.ess() < StudyReport.LOW_ESS) {
            sb.append("The estimate rests on ").append(Numbers.num3(best.ess()))
                    .append(" effective samples only: confirm it with a new Monte Carlo run at the tightened σ "
                            + "before acting on it. ");
        } else {
            sb.append("It rests on ").append(Numbers.num3(best.ess())).append(" effective samples. ");
        }
        Target first = r.study().targets().isEmpty() ? null : r.study().targets().get(0);
        if (first != null) {
            RunSummary.OutputStats st = stats(r.summary(), first.output());
            boolean centredOff = first.atLeast() ? st.mean() < first.value() : st.mean() > first.value();
            if (centredOff) {
                sb.append("The average device misses the target (mean ").append(label(first.output())).append(' ')
                        .append(Numbers.withUnit(Numbers.num(st.mean()), st.unit())).append(" against ")
                        .append(target(first)).append("), so the yield is limited by where the process is centred "
                                + "more than by its spread: narrowing an input that now pushes some devices past the "
                                + "target lowers the yield, and moving a nominal value is the larger lever. ");
            }
        }
        ToleranceAllocation al = r.allocation();
        if (al != null) {
            List<String> changed = new ArrayList<>();
            for (ToleranceAllocation.Choice c : al.choices()) {
                if (c.scale() < 1) {
                    changed.add(c.input() + " to " + Numbers.level(c.scale()) + " of its σ");
                }
            }
            if (changed.isEmpty()) {
                sb.append("The yield goal of ").append(Numbers.level(al.goal()))
                        .append(al.reached() ? " is met without tightening anything." : " could not be reached by tightening.");
            } else {
                sb.append(al.reached() ? "To reach the yield goal of " : "Aiming at the yield goal of ")
                        .append(Numbers.level(al.goal())).append(", the cheapest combination found tightens ")
                        .append(String.join(", ", changed)).append(" at a cost of ").append(Numbers.num3(al.totalCost()))
                        .append(", for a predicted yield of ").append(Numbers.pct(al.predictedYield())).append(" (")
                        .append(Numbers.pctRange(al.predictedLow(), al.predictedHigh())).append(")")
                        .append(al.reached() ? "." : ", short of the goal.");
                if (al.confirmationRunNeeded()) {
                    sb.append(" Few effective samples remain after that much reweighting: a confirmation run is needed.");
                }
            }
        }
        return sb.toString().strip();
    }
}
