package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.List;
import org.fabspread.plan.Factor;
import org.fabspread.plan.PlanReport;

/** The report's "Suggested experiments" section: the plan, its factors, aliases, predicted effects and power. */
final class ExperimentsSection {

    private final ChartFactory charts;

    ExperimentsSection(ChartFactory charts) {
        this.charts = charts;
    }

    Section section(PlanReport p) {
        List<Block> b = new ArrayList<>();
        b.add(new Paragraph(p.explanation()));
        List<KeyValues.Pair> kv = new ArrayList<>();
        kv.add(KeyValues.pair("Design", p.design()));
        if (p.resolution() != null && !p.resolution().isBlank()) {
            kv.add(KeyValues.pair("Resolution", p.resolution()));
        }
        if (p.generators() != null && !p.generators().isEmpty()) {
            kv.add(KeyValues.pair("Generators", String.join(", ", p.generators())));
        }
        kv.add(KeyValues.pair("Runs", p.runs() + " (" + p.replicates() + " replicate(s), " + p.centrePoints()
                + " centre point(s), " + p.blocks() + " block(s))"));
        kv.add(KeyValues.pair("Response", label(p.response()) + " (" + Numbers.unit(p.unit()) + ")"));
        kv.add(KeyValues.pair("Run-order seed", Long.toString(p.seed())));
        if (p.blockGenerators() != null && !p.blockGenerators().isEmpty()) {
            kv.add(KeyValues.pair("Confounded with blocks", String.join(", ", p.blockGenerators())));
        }
        b.add(new KeyValues(kv));
        List<List<String>> rows = new ArrayList<>();
        for (int i = 0; i < p.factors().size(); i++) {
            Factor f = p.factors().get(i);
            rows.add(List.of(String.valueOf(org.fabspread.plan.EffectNames.letter(i)), f.id(), show(f.low(), f.unit()),
                    show(f.high(), f.unit()), show(f.nominal(), f.unit()), show(f.sigma(), f.unit()), f.levelSource()));
        }
        b.add(Table.of("Factors and their levels in real units", List.of("letter", "input", "low", "high", "nominal",
                "σ", "levels from"), rows));
        if (p.leftOut() != null && !p.leftOut().isEmpty()) {
            b.add(new Paragraph("Left out of the plan (held at their usual process settings): "
                    + String.join(", ", p.leftOut()) + "."));
        }
        if (p.aliases() != null) {
            b.add(new Paragraph("What each effect is confounded with (aliases up to two-factor interactions):"));
            b.add(new Preformatted(p.aliases().text(p.factors().stream().map(Factor::id).toList())));
        }
        if (!p.predictions().isEmpty()) {
            String[] names = new String[p.predictions().size()];
            double[] v = new double[names.length];
            for (int i = 0; i < names.length; i++) {
                PlanReport.PredictedEffect e = p.predictions().get(i);
                names[i] = e.term() + ": " + e.name();
                v[i] = e.effect();
            }
            b.add(new Figure(charts.predictedEffects("plan-predicted-effects", "Effects the model predicts for the plan",
                            Numbers.quantity(label(p.response()), p.unit()), names, v),
                    "Effects (high-level mean minus low-level mean) the model predicts for each term of the plan, "
                            + "the other inputs at nominal; the runs should find effects of about these sizes."));
        }
        PlanReport.PowerReport pw = p.power();
        if (pw != null) {
            b.add(new KeyValues(List.of(
                    KeyValues.pair("Effect to detect", Numbers.withUnit(Numbers.plain(pw.effectOfInterest()), p.unit())
                            + ", " + pw.effectSource()),
                    KeyValues.pair("Run-to-run noise (from the model)", Numbers.withUnit(Numbers.num3(pw.sigmaNoise()),
                            p.unit()) + " (" + pw.noiseDraws() + " draws at " + pw.noisePoints() + " design points)"),
                    KeyValues.pair("Replicates", pw.replicates() + (pw.reached() ? "" : " (the wanted power is not "
                            + "reached within the run budget)")),
                    KeyValues.pair("Power", Numbers.pct(pw.power()) + " at α = " + Numbers.plain(pw.alpha()) + ", wanted "
                            + Numbers.pct(pw.wantedPower()) + " (normal approximation " + Numbers.pct(
                            pw.normalApproximation()) + "); " + Numbers.num3(pw.dof()) + " error degrees of freedom"))));
        }
        return new Section(StudyReport.EXPERIMENTS, "Suggested experiments", b);
    }
}
