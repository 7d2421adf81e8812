package org.fabspread.report;

import java.util.ArrayList;
import java.util.List;

import org.fabspread.pipeline.StudyResults;
import org.fabspread.plan.Calibration;
import org.fabspread.plan.EffectAnalysis;
import org.fabspread.plan.EffectNames;
import org.fabspread.plan.Factor;
import org.fabspread.plan.Lenth;
import org.fabspread.plan.MeasuredReport;
import org.fabspread.study.Study;

/**
 * The report of the measured-results step: the effects the runs found beside the ones the model
 * predicted, their significance (ANOVA on pure error, or Lenth's pseudo standard error for an
 * unreplicated plan), the half-normal plot, the model inputs calibrated against the runs, and the
 * model's limits with the cautions.
 */
public final class MeasuredDocument {

    public static final String MEASURED = "measured";
    public static final String EFFECTS = "effects";
    public static final String CALIBRATION = "calibration";
    public static final String LIMITS = "limits";
    public static final String PROVENANCE = "provenance";

    /** Effects named on the half-normal plot. */
    public static final int LABEL_TOP = 5;

    private MeasuredDocument() {
    }

    /** Builds the document with the default chart size; {@code provenance} may be null. */
    public static ReportDocument build(Study study, MeasuredReport m, StudyResults.Provenance provenance) {
        return build(study, m, provenance, new ChartFactory());
    }

    /** Builds the document. */
    public static ReportDocument build(Study study, MeasuredReport m, StudyResults.Provenance provenance,
                                       ChartFactory charts) {
        String label = StudyReport.label(m.response());
        String unit = m.unit();
        List<Section> sections = new ArrayList<>();
        sections.add(measured(study, m, label, unit));
        sections.add(effects(m, label, unit, charts));
        sections.add(calibration(study, m, unit));

        List<String> notes = new ArrayList<>();
        notes.add("Predicted effects are the same analysis applied to the model's noise-free predictions at the "
                + "run settings, every other input at nominal.");
        sections.add(ModelLimits.section(LIMITS, study, notes));
        if (provenance != null) {
            sections.add(new Section(PROVENANCE, "Provenance", new KeyValues(List.of(
                    KeyValues.pair("fabspread version", provenance.version()),
                    KeyValues.pair("Build commit", provenance.commit()),
                    KeyValues.pair("Build date", provenance.buildDate()),
                    KeyValues.pair("Run finished", provenance.runDate()),
                    KeyValues.pair("Study file SHA-256", provenance.studySha256()),
                    KeyValues.pair("Command", provenance.command())))));
        }
        return new ReportDocument(study.name(), "Measured results of " + m.runSheet(), sections);
    }

    private static Section measured(Study study, MeasuredReport m, String label, String unit) {
        EffectAnalysis.Result a = m.analysis();
        List<Block> b = new ArrayList<>();
        b.add(new KeyValues(List.of(
                KeyValues.pair("Study", study.name()),
                KeyValues.pair("Run sheet", m.runSheet()),
                KeyValues.pair("Response", label + " (" + Numbers.unit(unit) + ")"),
                KeyValues.pair("Runs", a.runs() + " (" + a.factorialRuns() + " factorial or axial, " + a.centreRuns()
                        + " centre)"),
                KeyValues.pair("Analysis", a.method()))));
        List<List<String>> rows = new ArrayList<>();
        for (int i = 0; i < m.factors().size(); i++) {
            Factor f = m.factors().get(i);
            rows.add(List.of(String.valueOf(EffectNames.letter(i)), f.id(), StudyReport.show(f.low(), f.unit()),
                    StudyReport.show(f.high(), f.unit()), f.levelSource()));
        }
        b.add(Table.of("Factors (coded −1 at low, +1 at high)", List.of("letter", "input", "low", "high", "levels from"),
                rows));
        return new Section(MEASURED, "What was measured", b);
    }

    private static Section effects(MeasuredReport m, String label, String unit, ChartFactory charts) {
        EffectAnalysis.Result a = m.analysis();
        List<Block> b = new ArrayList<>();
        b.add(new Paragraph(effectsSummary(a, label, unit)));
        List<List<String>> er = new ArrayList<>();
        for (EffectAnalysis.Estimate e : a.effects()) {
            er.add(List.of(e.label(), e.name(), Numbers.num3(e.estimate()), Numbers.num3(e.predicted()),
                    Numbers.num3(e.stdError()), Numbers.num3(e.statistic()), Double.isFinite(e.pValue())
                            ? Numbers.sig(e.pValue(), 2) : "n/a", e.active() ? "yes" : "no",
                    e.aliases().isEmpty() ? "–" : String.join(" ", e.aliases())));
        }
        b.add(Table.of("Effects on " + label + " (" + Numbers.unit(unit) + "): measured beside predicted",
                List.of("effect", "name", "measured", "predicted", "std. error", "statistic", "p", "active", "aliases"),
                er));
        if (!a.anova().isEmpty()) {
            List<List<String>> ar = new ArrayList<>();
            for (EffectAnalysis.AnovaRow row : a.anova()) {
                ar.add(List.of(row.source(), Numbers.num3(row.sumOfSquares()), Numbers.sig(row.dof(), 3),
                        Numbers.num3(row.meanSquare()), Numbers.num3(row.f()),
                        Double.isFinite(row.pValue()) ? Numbers.sig(row.pValue(), 2) : "n/a"));
            }
            b.add(Table.of("Analysis of variance", List.of("source", "sum of squares", "df", "mean square", "F", "p"), ar));
        }
        Lenth lenth = a.lenth();
        boolean lenthForReference = false;
        if (lenth != null) {
            b.add(new KeyValues(List.of(
                    KeyValues.pair("Contrasts m", Integer.toString(lenth.m())),
                    KeyValues.pair("Pseudo standard error (PSE)", Numbers.withUnit(Numbers.num3(lenth.pse()), unit)),
                    KeyValues.pair("Margin of error ME (individual 95 %)", Numbers.withUnit(Numbers.num3(lenth.me()), unit)),
                    KeyValues.pair("Simultaneous margin SME (all effects, 95 %)",
                            Numbers.withUnit(Numbers.num3(lenth.sme()), unit)),
                    KeyValues.pair("Degrees of freedom d = m/3", Numbers.num3(lenth.dof())))));
        } else if (a.halfNormal().size() >= 2) {
            double[] v = new double[a.halfNormal().size()];
            for (int i = 0; i < v.length; i++) {
                v[i] = a.halfNormal().get(i).absEffect();
            }
            lenth = Lenth.of(v);
            lenthForReference = true;
        }
        if (!a.halfNormal().isEmpty() && lenth != null && lenth.me() > 0) {
            String[] names = new String[a.halfNormal().size()];
            double[] v = new double[names.length];
            for (int i = 0; i < names.length; i++) {
                names[i] = a.halfNormal().get(i).label();
                v[i] = a.halfNormal().get(i).absEffect();
            }
            b.add(new Figure(charts.halfNormal("half-normal", "Which effects stand out from the noise",
                            Numbers.quantity(label, unit), names, v, lenth.me(), lenth.sme(), LABEL_TOP),
                    "Half-normal plot of the measured effects: inactive effects fall on a line through the origin, "
                            + "active ones lie above it. The horizontal lines are Lenth's margin of error ME and "
                            + "simultaneous margin SME" + (lenthForReference ? " (computed from these effects for "
                            + "reference; the tests in the table use the error estimate of the " + a.method() + ")"
                            : "") + "."));
        }
        return new Section(EFFECTS, "Effects measured beside predicted", b);
    }

    private static Section calibration(Study study, MeasuredReport m, String unit) {
        List<Block> b = new ArrayList<>();
        Calibration.Result c = m.calibration();
        if (c != null) {
            if (!c.identifiability().isEmpty()) {
                b.add(new Paragraph(c.identifiability()));
            }
            List<List<String>> cr = new ArrayList<>();
            List<String> differ = new ArrayList<>();
            for (int j = 0; j < c.ids().size(); j++) {
                String id = c.ids().get(j);
                String u = study.parameters().containsKey(id) ? study.parameters().get(id).unit() : "1";
                cr.add(List.of(id, StudyReport.show(c.start()[j], u), StudyReport.show(c.estimates()[j], u),
                        StudyReport.show(c.lower()[j], u) + (c.lowerAtLimit()[j] ? " (physical limit)" : "") + " to "
                                + StudyReport.show(c.upper()[j], u) + (c.upperAtLimit()[j] ? " (physical limit)" : ""),
                        StudyReport.show(c.stdErrors()[j], u), c.excludesNominal(j) ? "no" : "yes"));
                if (c.excludesNominal(j)) {
                    differ.add(id);
                }
            }
            if (!cr.isEmpty()) {
                b.add(Table.of("Model inputs fitted to the runs (" + Numbers.level(c.confidence())
                                + " profile-likelihood intervals, inside each input's physical range)",
                        List.of("input", "study's nominal", "fitted", "interval", "std. error", "nominal inside"), cr));
                b.add(new KeyValues(List.of(
                        KeyValues.pair("Residual standard deviation", Numbers.withUnit(Numbers.num3(c.residualSd()), unit)),
                        KeyValues.pair("Degrees of freedom", Integer.toString(c.dof())),
                        KeyValues.pair("Model evaluations", Integer.toString(c.evaluations())))));
            }
            b.add(new Paragraph(differ.isEmpty()
                    ? "Every fitted interval holds the study's nominal value: these runs give no reason to change "
                    + "what the study assumes for " + (c.ids().isEmpty() ? "the calibrated inputs" : String.join(", ",
                    c.ids())) + "."
                    : "The interval of " + String.join(", ", differ) + " leaves out the study's nominal value: the line "
                    + "may differ from what the study assumed; update the study only after checking that the model's "
                    + "limits (below), or an input held at nominal, do not explain the difference."));
        } else {
            b.add(new Paragraph("No model input was calibrated."));
        }
        if (!m.notes().isEmpty()) {
            b.add(new BulletList(m.notes()));
        }
        return new Section(CALIBRATION, "Calibration of the model", b);
    }

    private static String effectsSummary(EffectAnalysis.Result a, String label, String unit) {
        List<String> active = new ArrayList<>();
        int agree = 0;
        int compared = 0;
        for (EffectAnalysis.Estimate e : a.effects()) {
            if (e.active()) {
                active.add(e.label() + " (" + Numbers.withUnit(Numbers.num3(e.estimate()), unit) + ")");
            }
            if (Double.isFinite(e.predicted()) && e.active()) {
                compared++;
                if (Math.signum(e.predicted()) == Math.signum(e.estimate())) {
                    agree++;
                }
            }
        }
        StringBuilder sb = new StringBuilder();
        if (active.isEmpty()) {
            sb.append("No effect on ").append(label).append(" stands out from the noise of these runs.");
        } else {
            sb.append("Effects on ").append(label).append(" that stand out from the noise: ")
                    .append(String.join(", ", active)).append('.');
            if (compared > 0) {
                sb.append(" The model predicted the direction of ").append(agree).append(" of these ")
                        .append(compared).append('.');
            }
        }
        if (Double.isFinite(a.sigma())) {
            sb.append(" Run-to-run standard deviation: ").append(Numbers.withUnit(Numbers.num3(a.sigma()), unit))
                    .append('.');
        }
        return sb.toString();
    }
}
