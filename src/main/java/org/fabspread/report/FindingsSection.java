package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.List;
import org.fabspread.analysis.Capability;
import org.fabspread.analysis.YieldResult;
import org.fabspread.model.OutputDef;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.sampling.Interval;
import org.fabspread.sampling.RunSummary;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.Parameter;
import org.fabspread.study.Target;

/** The report's "Findings" section: the followed output's statistics, yields, histogram, scatter, sensitivity. */
final class FindingsSection {

    private final ChartFactory charts;

    FindingsSection(ChartFactory charts) {
        this.charts = charts;
    }

    Section section(StudyResults r) {
        List<Block> b = new ArrayList<>();
        String out = focusOutput(r);
        OutputDef od = outputDef(r, out);
        String label = label(out);
        String unit = od.unit();
        RunSummary.OutputStats st = stats(r.summary(), out);
        List<KeyValues.Pair> kv = new ArrayList<>();
        kv.add(KeyValues.pair(label + " mean ± sd", Numbers.num(st.mean()) + " ± " + Numbers.num3(st.sd()) + " "
                + Numbers.unit(unit)));
        double q05 = quantile(st, 0.05);
        double q50 = quantile(st, 0.50);
        double q95 = quantile(st, 0.95);
        kv.add(KeyValues.pair(label + " 5 % / 50 % / 95 % quantiles", Numbers.num(q05) + " / " + Numbers.num(q50)
                + " / " + Numbers.num(q95) + " " + Numbers.unit(unit)));
        double nominal = r.nominal(out);
        if (Double.isFinite(nominal)) {
            kv.add(KeyValues.pair(label + " of the nominal device", Numbers.withUnit(Numbers.num(nominal), unit)));
            kv.add(KeyValues.pair("Current the scatter costs (nominal − mean)",
                    Numbers.withUnit(Numbers.num3(nominal - st.mean()), unit)));
            kv.add(KeyValues.pair("Current the scatter costs the worst 5 % (nominal − 5 % quantile)",
                    Numbers.withUnit(Numbers.num3(nominal - q05), unit)));
        }
        YieldResult y = r.yield();
        if (y != null) {
            List<Target> targets = r.study().targets();
            for (int i = 0; i < y.perTarget().size(); i++) {
                String key = i < targets.size() ? target(targets.get(i)) : y.perTarget().get(i).spec();
                kv.add(KeyValues.pair("Yield, " + key, yieldText(y.perTarget().get(i), y.confidence())));
            }
            kv.add(KeyValues.pair("Yield, all targets", yieldText(y.all(), y.confidence())));
        }
        for (int i = 0; i < r.capabilities().size(); i++) {
            Capability c = r.capabilities().get(i);
            String key = i < r.study().targets().size() ? target(r.study().targets().get(i)) : c.spec();
            String text = "C_pk " + Numbers.num3(c.cpk()) + " (normal theory " + Numbers.pct(c.normalYield())
                    + " beside " + Numbers.pct(c.observedYield()) + " counted; skewness " + Numbers.num3(c.skewness())
                    + ")";
            if (c.caveat() != null && !c.caveat().isBlank()) {
                text += ". " + c.caveat();
            }
            kv.add(KeyValues.pair("Capability, " + key, text));
        }
        kv.add(KeyValues.pair("Failed samples", failures(r.summary())));
        b.add(new KeyValues(kv));
        b.add(new Paragraph(headline(r, out, st, nominal)));

        SampleTable t = r.table();
        Target target = targetOf(r.study(), out);
        if (t != null && target != null && y != null) {
            YieldResult.YieldLine line = y.perTarget().get(r.study().targets().indexOf(target));
            Interval iv = new Interval(line.wilsonLow(), line.wilsonHigh()).enclosing(line.yield());
            b.add(new Figure(charts.histogram("histogram-" + safe(out), "Spread of " + label,
                    Numbers.quantity(label, unit), t.output(out), target.value(), target.atLeast(), line.yield(), iv),
                    "Histogram of " + label + " over the " + line.n() + " samples that evaluated, with the target ("
                            + target(target) + ") as a dashed line; the title gives the yield with its Wilson "
                            + "interval."));
            b.add(yieldCurve(r, out, label, unit, target));
        }
        List<String> top = topInputs(r, out);
        if (t != null) {
            for (int k = 0; k < Math.min(StudyReport.SCATTER_INPUTS, top.size()); k++) {
                String id = top.get(k);
                Parameter p = r.study().parameters().get(id);
                String u = p == null ? "1" : p.unit();
                b.add(new Figure(charts.scatter("scatter-" + safe(out) + "-" + (k + 1), label + " against " + id,
                        Numbers.quantity(id, u), t.input(id), Numbers.quantity(label, unit), t.output(out)),
                        label + " of every sample against " + id + ", the input with the "
                                + (k == 0 ? "" : ordinal(k) + " ") + "largest variance contribution."));
            }
        }
        b.addAll(new AttributionBlocks(charts).around(r, out, label, new SensitivityBlocks(charts).blocks(r, out, label)));
        return new Section(StudyReport.FINDINGS, "Findings", b);
    }

    private String headline(StudyResults r, String out, RunSummary.OutputStats st, double nominal) {
        StringBuilder sb = new StringBuilder();
        String label = label(out);
        String unit = Numbers.unit(st.unit());
        sb.append("Across ").append(st.n()).append(" simulated devices, ").append(label).append(" averages ")
                .append(Numbers.num(st.mean())).append(' ').append(unit).append(" with a standard deviation of ")
                .append(Numbers.num3(st.sd())).append(' ').append(unit).append('.');
        if (Double.isFinite(nominal)) {
            double loss = nominal - st.mean();
            sb.append(" The nominal device gives ").append(Numbers.num(nominal)).append(' ').append(unit)
                    .append(loss >= 0 ? "; the process scatter costs " + Numbers.num3(loss) + " " + unit
                            + " on average."
                            : "; the average device does better than the nominal one by " + Numbers.num3(-loss)
                            + " " + unit + ", because the output is not linear in the inputs.");
        }
        if (r.yield() != null) {
            YieldResult.YieldLine all = r.yield().all();
            sb.append(" ").append(Numbers.pct(all.yield())).append(" of devices meet every target (")
                    .append(Numbers.level(r.yield().confidence())).append(" interval ")
                    .append(Numbers.pctRange(all.wilsonLow(), all.wilsonHigh())).append(").");
        }
        return sb.toString();
    }

    /** How the yield moves if the target moves, with its Wilson band. */
    private Figure yieldCurve(StudyResults r, String out, String label, String unit, Target target) {
        double confidence = r.summary().confidence();
        YieldCurve yc = YieldCurve.of(r.table().output(out), target.atLeast(), target.value(), confidence);
        return new Figure(charts.yieldCurve("yield-curve-" + safe(out), "Yield if the target on " + label + " moved",
                Numbers.quantity((target.atLeast() ? "target: " + label + " at least" : "target: " + label + " at most"),
                        unit), yc.threshold(), yc.yield(), yc.low(), yc.high(), target.value(),
                Numbers.level(confidence) + " Wilson band"),
                "Share of the " + yc.n() + " samples that would pass if the target on " + label + " were set at each "
                        + "value of the axis, with its pointwise " + Numbers.level(confidence) + " Wilson interval "
                        + "shaded; the dashed line is the study's target (" + target(target) + ").");
    }
}
