package org.fabspread.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.fabspread.analysis.Capability;
import org.fabspread.analysis.ScreeningResult;
import org.fabspread.analysis.SobolResult;
import org.fabspread.analysis.ToleranceAllocation;
import org.fabspread.analysis.ToleranceRanking;
import org.fabspread.analysis.WhatIfResult;
import org.fabspread.analysis.YieldResult;
import org.fabspread.device.DeviceModel;
import org.fabspread.device.Spectra;
import org.fabspread.model.OutputDef;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.plan.Factor;
import org.fabspread.plan.PlanReport;
import org.fabspread.sampling.Distributions;
import org.fabspread.sampling.Interval;
import org.fabspread.sampling.RunSummary;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.Describe;
import org.fabspread.study.Layer;
import org.fabspread.study.Parameter;
import org.fabspread.study.ParticleLayer;
import org.fabspread.study.Study;
import org.fabspread.study.Target;

/**
 * The design-review report of one study run: what was studied, what the Monte Carlo found, what to
 * tighten, which experiments to run, the optics of the nominal device, the model's limits with the
 * cautions, and where the numbers came from. Every sentence that carries a number is generated from
 * the results; nothing is hard-coded. Numbers are formatted by {@link Numbers}.
 */
public final class StudyReport {

    /** Section ids, in reading order. */
    public static final String STUDIED = "studied";
    public static final String FINDINGS = "findings";
    public static final String TIGHTEN = "tighten";
    public static final String EXPERIMENTS = "experiments";
    public static final String OPTICS = "optics";
    public static final String LIMITS = "limits";
    public static final String PROVENANCE = "provenance";

    /** Inputs drawn against the output in scatter plots. */
    public static final int SCATTER_INPUTS = 3;
    /** Inputs drawn in the convergence chart (as many as the chart has distinct line styles). */
    public static final int CONVERGENCE_LINES = 5;
    /** Below this effective sample size a reweighted estimate is called for confirmation. */
    public static final double LOW_ESS = 200;

    /** Elementary charge, C (exact since the 2019 SI). */
    private static final double Q = 1.602176634e-19;

    private final ChartFactory charts;

    public StudyReport() {
        this(new ChartFactory());
    }

    public StudyReport(ChartFactory charts) {
        this.charts = charts;
    }

    /** Builds the report with the default chart size. */
    public static ReportDocument build(StudyResults r) {
        return new StudyReport().document(r);
    }

    /** Builds the report. */
    public ReportDocument document(StudyResults r) {
        Study s = r.study();
        List<Section> sections = new ArrayList<>();
        sections.add(studied(r));
        sections.add(findings(r));
        Section tighten = tighten(r);
        if (tighten != null) {
            sections.add(tighten);
        }
        if (r.plan() != null) {
            sections.add(experiments(r.plan()));
        }
        if (r.nominalSpectra() != null) {
            sections.add(optics(r));
        }
        List<String> notes = new ArrayList<>(r.notes());
        if (r.yield() != null) {
            notes.add(r.yield().note());
        }
        if (r.sobol() != null) {
            notes.add(r.sobol().note());
        }
        if (r.allocation() != null) {
            notes.add(r.allocation().note());
        }
        if (r.summary().correlationRepaired()) {
            notes.add("The study's correlation targets were inconsistent; the normal correlation matrix was "
                    + "repaired to the nearest valid one before sampling.");
        }
        sections.add(ModelLimits.section(LIMITS, s, notes));
        sections.add(provenance(r));
        String subtitle = "Design review: spread, yield and tolerances from " + r.summary().samplesOk()
                + " Monte Carlo samples of the device model";
        return new ReportDocument(s.name(), subtitle, sections);
    }

    // ------------------------------------------------------------------------------------------------
    // What was studied

    private Section studied(StudyResults r) {
        Study s = r.study();
        List<Block> b = new ArrayList<>();
        b.add(new KeyValues(List.of(KeyValues.pair("Study", s.name()),
                KeyValues.pair("Study file", s.file() == null ? "(built in code)" : s.file().getFileName().toString()))));
        if (s.description() != null && !s.description().isBlank()) {
            b.add(new Paragraph(s.description().strip()));
        }
        List<List<String>> rows = new ArrayList<>();
        for (Layer l : s.stack()) {
            Parameter t = l.thickness();
            String spread = t.isUncertain() ? Describe.distribution(t) : "fixed";
            String role = l.role().name().toLowerCase(Locale.ROOT).replace('_', '-');
            if (l.incoherent()) {
                role += " (incoherent)";
            }
            rows.add(List.of(l.name(), l.material().id(), show(t.nominal(), t.unit()), spread, role));
        }
        b.add(Table.of("The stack, in the order light meets it", List.of("layer", "material", "thickness",
                "spread", "role"), rows));
        ParticleLayer p = s.particles();
        if (p != null) {
            List<KeyValues.Pair> kv = new ArrayList<>();
            kv.add(KeyValues.pair("Metal", p.metal().id()));
            kv.add(KeyValues.pair("Host layer", p.host() + ", placed at its "
                    + (p.placement() == ParticleLayer.Placement.OFFSET ? "offset " + show(p.offset().nominal(),
                    p.offset().unit()) : p.placement().name().toLowerCase(Locale.ROOT) + " face")));
            kv.add(KeyValues.pair("Diameter (median)", describe(p.diameter())));
            kv.add(KeyValues.pair("Size spread within a device (CV)", describe(p.sizeCv())));
            kv.add(KeyValues.pair("Aspect ratios (in plane, out of plane)", describe(p.inPlaneAspect()) + "; "
                    + describe(p.outOfPlaneAspect())));
            kv.add(KeyValues.pair("Coverage", describe(p.coverage())));
            kv.add(KeyValues.pair("Forward share of scattered light", describe(p.forwardFraction())));
            kv.add(KeyValues.pair("Orientation", p.aligned() ? "aligned in plane" : "random in plane"));
            kv.add(KeyValues.pair("Mixing rule", p.mixingRule() == ParticleLayer.MixingRule.BRUGGEMAN
                    ? "Bruggeman" : "Maxwell Garnett"));
            if (p.enhancementTable() != null) {
                kv.add(KeyValues.pair("Enhancement table", p.enhancementTable().getFileName().toString()));
            }
            b.add(new Paragraph("The metal nanoparticle layer:"));
            b.add(new KeyValues(kv));
        } else {
            b.add(new Paragraph("The study has no particle layer."));
        }
        List<Parameter> inputs = s.uncertainInputs();
        if (inputs.isEmpty()) {
            b.add(new Paragraph("Every number of the study is fixed: there are no uncertain inputs."));
        } else {
            List<List<String>> in = new ArrayList<>();
            for (Parameter q : inputs) {
                double sd = Distributions.of(q.distribution()).standardDeviation();
                in.add(List.of(q.id(), Describe.distribution(q), show(q.nominal(), q.unit()), show(sd, q.unit()),
                        Numbers.unit(q.unit())));
            }
            b.add(Table.of("The uncertain inputs (" + inputs.size() + ")", List.of("input", "distribution",
                    "nominal", "standard deviation", "unit"), in));
        }
        if (!s.correlations().isEmpty()) {
            List<List<String>> c = new ArrayList<>();
            s.correlations().forEach(x -> c.add(List.of(x.first(), x.second(), Numbers.num3(x.spearman()))));
            b.add(Table.of("Correlated inputs (Spearman rank correlation)", List.of("input", "with", "Spearman ρ"), c));
        }
        if (s.targets().isEmpty()) {
            b.add(new Paragraph("The study sets no targets, so no yield is computed."));
        } else {
            List<String> t = new ArrayList<>();
            for (Target g : s.targets()) {
                t.add(target(g));
            }
            b.add(new Paragraph("Targets (a device passes when it meets all of them):"));
            b.add(new BulletList(t));
        }
        RunSummary sum = r.summary();
        List<KeyValues.Pair> run = new ArrayList<>();
        run.add(KeyValues.pair("Samples", sum.samplesOk() + " evaluated of " + sum.samplesRequested() + " drawn"));
        run.add(KeyValues.pair("Sampler", sampler(sum.sampler())));
        run.add(KeyValues.pair("Seed", Long.toString(sum.seed())));
        run.add(KeyValues.pair("Confidence of intervals", Numbers.level(sum.confidence())));
        if (r.sobol() != null) {
            run.add(KeyValues.pair("Sobol design", "base N = " + r.sobol().n() + ", " + r.sobol().modelRuns()
                    + " model runs"));
        }
        b.add(new KeyValues(run));
        return new Section(STUDIED, "What was studied", b);
    }

    // ------------------------------------------------------------------------------------------------
    // Findings

    private Section findings(StudyResults r) {
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
        }
        List<String> top = topInputs(r, out);
        if (t != null) {
            for (int k = 0; k < Math.min(SCATTER_INPUTS, top.size()); k++) {
                String id = top.get(k);
                Parameter p = r.study().parameters().get(id);
                String u = p == null ? "1" : p.unit();
                b.add(new Figure(charts.scatter("scatter-" + safe(out) + "-" + (k + 1), label + " against " + id,
                        Numbers.quantity(id, u), t.input(id), Numbers.quantity(label, unit), t.output(out)),
                        label + " of every sample against " + id + ", the input with the "
                                + (k == 0 ? "" : ordinal(k) + " ") + "largest variance contribution."));
            }
        }
        b.addAll(sensitivity(r, out, label));
        return new Section(FINDINGS, "Findings", b);
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

    private List<Block> sensitivity(StudyResults r, String out, String label) {
        List<Block> b = new ArrayList<>();
        SobolResult sobol = r.sobol();
        if (sobol != null && hasOutput(sobol, out)) {
            SobolResult.OutputIndices oi = sobol.output(out);
            List<SobolResult.IndexEstimate> est = new ArrayList<>(oi.indices());
            int n = est.size();
            String[] names = new String[n];
            double[][] a = new double[6][n];
            for (int i = 0; i < n; i++) {
                SobolResult.IndexEstimate e = est.get(i);
                names[i] = e.input();
                a[0][i] = e.first();
                a[1][i] = e.firstLow();
                a[2][i] = e.firstHigh();
                a[3][i] = e.total();
                a[4][i] = e.totalLow();
                a[5][i] = e.totalHigh();
            }
            b.add(new Figure(charts.varianceContributions("sobol-" + safe(out), "What drives the variance of "
                    + label, names, a[0], a[1], a[2], a[3], a[4], a[5]),
                    "Sobol indices of " + label + ": first-order S_i (the input alone) and total S_Ti (with its "
                            + "interactions), with " + Numbers.level(sobol.confidence()) + " intervals; "
                            + sobol.method() + "."));
            List<SobolResult.ConvergenceStep> steps = new ArrayList<>();
            for (SobolResult.ConvergenceStep c : sobol.convergence()) {
                if (c.output().equals(out) && (steps.isEmpty() || c.n() > steps.get(steps.size() - 1).n())) {
                    steps.add(c);
                }
            }
            if (!steps.isEmpty()) {
                double[] last = steps.get(steps.size() - 1).total();
                List<Integer> order = new ArrayList<>();
                for (int i = 0; i < sobol.inputs().size(); i++) {
                    order.add(i);
                }
                order.sort(Comparator.comparingDouble((Integer i) -> Double.isFinite(last[i]) ? -last[i] : 0));
                int shown = Math.min(CONVERGENCE_LINES, order.size());
                double[] sizes = new double[steps.size()];
                double[][] idx = new double[shown][steps.size()];
                String[] lines = new String[shown];
                for (int j = 0; j < shown; j++) {
                    lines[j] = sobol.inputs().get(order.get(j));
                }
                for (int k = 0; k < steps.size(); k++) {
                    sizes[k] = steps.get(k).n();
                    for (int j = 0; j < shown; j++) {
                        idx[j][k] = steps.get(k).total()[order.get(j)];
                    }
                }
                String rest = shown < order.size() ? " The " + shown + " inputs with the largest final index are "
                        + "drawn; the others end below " + Numbers.pct(last[order.get(shown - 1)]) + "." : "";
                b.add(new Figure(charts.convergence("sobol-convergence-" + safe(out), "Do the total indices of "
                                + label + " settle?", Quantity.dimensionless("total index S_Ti"), sizes, lines, idx),
                        "Total Sobol indices of " + label + " from the first N/8, N/4, N/2 and all N rows of the "
                                + "same design: lines that still move at the right want a larger design." + rest));
            }
            est.sort(Comparator.comparingDouble(SobolResult.IndexEstimate::total).reversed());
            List<List<String>> rows = new ArrayList<>();
            boolean negative = false;
            for (SobolResult.IndexEstimate e : est) {
                negative |= e.first() < 0 || e.total() < 0;
                rows.add(List.of(e.input(), Numbers.pct(e.first()) + " (" + Numbers.pctRange(e.firstLow(),
                                e.firstHigh()) + ")", Numbers.pct(e.total()) + " (" + Numbers.pctRange(e.totalLow(),
                                e.totalHigh()) + ")", reading(e, label)));
            }
            b.add(Table.of("Variance contributions to " + label + " with " + Numbers.level(sobol.confidence())
                            + " intervals", List.of("input", "first-order S_i", "total S_Ti", "reading"), rows));
            StringBuilder sb = new StringBuilder();
            sb.append("The first-order indices add up to ").append(Numbers.pct(oi.sumFirst())).append(". ");
            if (oi.sumFirst() <= 1) {
                sb.append("The remaining ").append(Numbers.pct(1 - oi.sumFirst()))
                        .append(" of the variance comes from inputs acting together (interactions) or is sampling noise.");
            } else {
                sb.append("That exceeds 100 % through sampling noise alone: interactions are too small to see at "
                        + "this design size (N = ").append(sobol.n()).append(").");
            }
            if (negative) {
                sb.append(" Some estimates are negative. A variance share cannot be negative: these are sampling "
                        + "noise around a small true value and are shown as computed, not clipped.");
            }
            b.add(new Paragraph(sb.toString()));
        } else if (r.screening() != null && hasOutput(r.screening(), out)) {
            ScreeningResult.OutputScreening os = r.screening().output(out);
            int n = os.inputs().size();
            String[] names = new String[n];
            double[] first = new double[n];
            for (int i = 0; i < n; i++) {
                names[i] = os.inputs().get(i).input();
                first[i] = os.inputs().get(i).firstOrder();
            }
            b.add(new Figure(charts.firstOrderIndices("screening-" + safe(out), "What drives the variance of "
                            + label + " (screening)", names, first),
                    "First-order indices of " + label + " estimated from the Monte Carlo sample itself (correlation "
                            + "ratio over " + r.screening().bins() + " bins, bias " + Numbers.num3(r.screening().binBias())
                            + " removed). The study ran no Sobol design, so there are no intervals and no total "
                            + "indices: interactions are not seen."));
            List<ScreeningResult.InputScreening> sorted = new ArrayList<>(os.inputs());
            sorted.sort(Comparator.comparingDouble(ScreeningResult.InputScreening::firstOrder).reversed());
            List<List<String>> rows = new ArrayList<>();
            for (ScreeningResult.InputScreening e : sorted) {
                String reading = e.firstOrder() <= 0
                        ? "no detectable contribution (estimate " + Numbers.pct(e.firstOrder()) + ", noise around zero)"
                        : e.input() + " explains about " + Numbers.pct(e.firstOrder()) + " of the variance of " + label
                        + (e.srrc() >= 0 ? "; " + label + " rises with it" : "; " + label + " falls as it rises");
                rows.add(List.of(e.input(), Numbers.pct(e.firstOrder()), Numbers.num3(e.srrc()), reading));
            }
            b.add(Table.of("Screening of " + label + " (no intervals; rank regression R² "
                    + Numbers.num3(os.rankRSquared()) + ")", List.of("input", "first-order S_i", "SRRC", "reading"), rows));
        } else {
            b.add(new Paragraph("The study asked for no sensitivity analysis, so no variance contributions are given."));
        }
        return b;
    }

    /** A plain-language reading of one Sobol index with its interval. */
    static String reading(SobolResult.IndexEstimate e, String label) {
        StringBuilder sb = new StringBuilder(e.input());
        boolean firstClear = Double.isFinite(e.firstLow()) && e.firstLow() > 0;
        if (Double.isFinite(e.totalHigh()) && e.totalHigh() < 0.01) {
            sb.append(" is negligible: at most ").append(Numbers.pct(e.totalHigh())).append(" of the variance of ")
                    .append(label).append(", interactions included");
        } else if (firstClear) {
            sb.append(" explains about ").append(Numbers.pct(e.first())).append(" (")
                    .append(Numbers.pctRange(e.firstLow(), e.firstHigh())).append(") of the variance of ")
                    .append(label).append(" on its own");
            if (e.total() - e.first() > 0.05 && e.totalLow() > e.firstHigh()) {
                sb.append(", and ").append(Numbers.pct(e.total())).append(" with its interactions");
            }
        } else if (Double.isFinite(e.totalLow()) && e.totalLow() > 0) {
            sb.append(" accounts for about ").append(Numbers.pct(e.total())).append(" (")
                    .append(Numbers.pctRange(e.totalLow(), e.totalHigh())).append(") of the variance of ").append(label)
                    .append(" with its interactions; how much of that it causes alone (").append(Numbers.pct(e.first()))
                    .append(", ").append(Numbers.pctRange(e.firstLow(), e.firstHigh()))
                    .append(") this run cannot pin down");
        } else {
            sb.append(" has no contribution to the variance of ").append(label)
                    .append(" that this run can tell from zero");
        }
        if (e.first() < 0 || e.total() < 0) {
            sb.append("; its negative estimate is sampling noise around a small value");
        }
        return sb.append('.').toString();
    }

    // ------------------------------------------------------------------------------------------------
    // What to tighten

    private Section tighten(StudyResults r) {
        ToleranceRanking rk = r.ranking();
        ToleranceAllocation al = r.allocation();
        if (rk == null && al == null && r.whatIfs().isEmpty()) {
            return null;
        }
        List<Block> b = new ArrayList<>();
        String sdLabel = rk == null ? "J_sc" : label(rk.sdOutput());
        String sdUnit = rk == null ? "" : Numbers.unit(outputDef(r, rk.sdOutput()).unit());
        if (rk != null) {
            b.add(new Paragraph(recommendation(r)));
            List<String> names = new ArrayList<>();
            List<Double> gains = new ArrayList<>();
            List<List<String>> rows = new ArrayList<>();
            for (ToleranceRanking.Entry e : rk.entries()) {
                if (Double.isFinite(e.yieldGain())) {
                    names.add(e.input());
                    gains.add(e.yieldGain());
                }
                rows.add(List.of(e.input(),
                        Double.isFinite(e.yieldAfter()) ? Numbers.pct(e.yieldAfter()) + " (" + Numbers.pctRange(
                                e.yieldLow(), e.yieldHigh()) + ")" : "n/a",
                        Double.isFinite(e.yieldGain()) ? Numbers.points(e.yieldGain()) : "n/a",
                        Numbers.num3(e.sdBefore()) + " → " + Numbers.num3(e.sdAfter()) + " " + sdUnit,
                        ess(e.ess(), e.essFraction()),
                        e.rerunNeeded() ? "yes" + (e.note().isBlank() ? "" : ": " + e.note()) : "no"));
            }
            if (!names.isEmpty()) {
                b.add(new Figure(charts.toleranceRanking("tolerance-ranking", "Yield gained by halving one σ",
                                names.toArray(new String[0]), gains.stream().mapToDouble(Double::doubleValue).toArray()),
                        "Yield of all targets gained when one input's standard deviation is halved and the others "
                                + "are left as they are (from " + Numbers.pct(rk.baselineYield()) + " as run), "
                                + "estimated by reweighting the existing samples."));
            }
            b.add(Table.of("Halving each input's σ, one at a time", List.of("input", "yield after", "gain",
                    "sd of " + sdLabel, "effective samples", "re-run needed"), rows));
        }
        if (!r.whatIfs().isEmpty()) {
            List<List<String>> rows = new ArrayList<>();
            for (WhatIfResult w : r.whatIfs()) {
                WhatIfResult.WeightedYield y = w.allTargets();
                String after = Double.isFinite(y.after()) ? Numbers.pct(y.after()) + " (" + Numbers.pctRange(
                        y.afterLow(), y.afterHigh()) + ")" : "n/a";
                boolean rerun = !w.reweighted() && !w.rerunNeeded() && Double.isFinite(y.after());
                rows.add(List.of(w.description(), Numbers.pct(y.before()), after,
                        rerun ? "new run of " + w.samples() + " samples (reweighting was not usable)"
                                : Double.isFinite(w.ess()) ? ess(w.ess(), w.essFraction()) : "n/a",
                        w.rerunNeeded() ? "yes" + (w.message().isBlank() ? "" : ": " + w.message()) : "no"));
            }
            b.add(Table.of("The study's what-ifs: yield of all targets before and after", List.of("what-if",
                    "yield before", "yield after", "effective samples or new run", "re-run needed"), rows));
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
                    KeyValues.pair("Yield goal", Numbers.level(al.goal()) + (al.reached() ? ", reached" : ", not reached")),
                    KeyValues.pair("Predicted yield", Numbers.pct(al.predictedYield()) + " (" + Numbers.pctRange(
                            al.predictedLow(), al.predictedHigh()) + ")"),
                    KeyValues.pair("Total cost", Numbers.num3(al.totalCost())),
                    KeyValues.pair("Effective samples", ess(al.ess(), al.essFraction())),
                    KeyValues.pair("Confirmation run", al.confirmationRunNeeded() ? "needed" : "not needed"))));
            double[] cost = new double[al.curve().size()];
            double[] yl = new double[cost.length];
            for (int i = 0; i < cost.length; i++) {
                cost[i] = al.curve().get(i).cumulativeCost();
                yl[i] = al.curve().get(i).predictedYield();
            }
            if (cost.length > 0) {
                b.add(new Figure(charts.allocationTradeoff("allocation-tradeoff", "What each step of tightening buys",
                                Quantity.of("cost of the tightened tolerances", "study cost units"), cost, yl, al.goal()),
                        "Predicted yield of all targets along the greedy path of cheapest tightenings, against the "
                                + "summed cost (the study's cost of halving each σ, times the halvings); the dashed "
                                + "line is the goal."));
            }
        }
        return new Section(TIGHTEN, "What to tighten", b);
    }

    /** The recommendation paragraph, from the ranking and the allocation. */
    static String recommendation(StudyResults r) {
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
            sb.append("Tighten ").append(best.input()).append(" first. Halving its standard deviation").append(sigma)
                    .append(" raises the yield of all targets from ").append(Numbers.pct(rk.baselineYield()))
                    .append(" to ").append(Numbers.pct(best.yieldAfter())).append(" (interval ")
                    .append(Numbers.pctRange(best.yieldLow(), best.yieldHigh())).append(", ")
                    .append(Numbers.points(best.yieldGain())).append(") and narrows ").append(label).append(" from ")
                    .append(Numbers.num3(best.sdBefore())).append(" to ").append(Numbers.num3(best.sdAfter()))
                    .append(' ').append(unit).append(" standard deviation. ");
            if (best.yieldLow() > rk.baselineYield()) {
                sb.append("The whole interval lies above today's yield, so the gain is not sampling noise. ");
            } else {
                sb.append("The interval still includes today's yield, so this run does not establish the gain. ");
            }
        }
        if (best.rerunNeeded() || best.ess() < LOW_ESS) {
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

    // ------------------------------------------------------------------------------------------------
    // Suggested experiments

    private Section experiments(PlanReport p) {
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
        return new Section(EXPERIMENTS, "Suggested experiments", b);
    }

    // ------------------------------------------------------------------------------------------------
    // Optics of the nominal device

    private Section optics(StudyResults r) {
        Spectra s = r.nominalSpectra();
        List<Block> b = new ArrayList<>();
        int nw = s.size();
        Map<String, double[]> bands = new LinkedHashMap<>();
        if (any(s.substrateAbsorptance())) {
            String glass = r.study().stack().isEmpty() ? "substrate" : r.study().stack().get(0).name();
            bands.put(glass + " (substrate)", s.substrateAbsorptance());
        }
        for (Map.Entry<String, double[]> e : s.layerAbsorptance().entrySet()) {
            bands.put(e.getKey(), e.getValue());
        }
        if (r.study().particles() != null) {
            bands.put("particles: metal", s.particleMetal());
            double[] host = new double[nw];
            for (int i = 0; i < nw; i++) {
                host[i] = s.particleHost()[i] + s.particleQuenched()[i] + s.particleNearField()[i];
            }
            bands.put("particles: host and near field", host);
            bands.put("scattered light absorbed", s.diffuseAbsorbed());
        }
        String[] layers = bands.keySet().toArray(new String[0]);
        double[][] a = bands.values().toArray(new double[0][]);
        b.add(new Figure(charts.absorptionSpectra("absorption-spectra", "Where the light goes in the nominal device",
                        s.wavelengthNm(), layers, a, s.absorberEqe(), s.reflectance()),
                "Absorptance of each layer of the nominal device stacked in the order light meets them, with the "
                        + "absorber's external quantum efficiency and the reflectance (drawn down from 1); the gap "
                        + "between the top of the stack and the reflectance line is light transmitted or scattered "
                        + "out."));
        if (s.depthNm() != null && s.depthNm().length > 0 && any(s.generation())) {
            b.add(new Figure(charts.generationProfile("generation-profile", "Where the absorber generates carriers",
                            s.depthNm(), new String[] {"nominal device"}, new double[][] {s.generation()}, "cm⁻³ s⁻¹"),
                    "Photon-weighted absorption rate of the coherent field against depth in " + s.absorberName()
                            + " (diffuse light and the neighbour near field are not included)."));
        }
        DeviceModel.CrossSections cs = r.crossSections();
        if (cs != null) {
            b.add(new Figure(charts.crossSections("particle-cross-sections", "One nominal particle's cross-sections",
                            cs.wavelengthNm(), cs.extinction(), cs.scattering(), cs.absorption(), "nm²"),
                    "Ensemble-average cross-sections per particle at the nominal point (unpolarised light); "
                            + Numbers.num3(cs.numberPerArea() * 1e6) + " particles per µm²."));
        }
        List<List<String>> rows = new ArrayList<>();
        double incident = 0;
        for (int i = 0; i < nw; i++) {
            incident += s.photonFlux()[i];
        }
        // photons m^-2 s^-1 times q gives A/m^2; 1 A/m^2 = 0.1 mA/cm^2
        rows.add(List.of("incident photons on the grid", "every photon of the spectrum between "
                        + Numbers.num(s.wavelengthNm()[0]) + " and " + Numbers.num(s.wavelengthNm()[nw - 1]) + " nm",
                Numbers.num(0.1 * Q * incident), "–"));
        for (OutputDef od : r.outputs()) {
            if (!od.unit().equals("mA/cm^2")) {
                continue;
            }
            RunSummary.OutputStats st = statsOrNull(r.summary(), od.id());
            double nom = r.nominal(od.id());
            rows.add(List.of(od.id(), od.description(), Numbers.num(nom),
                    st == null ? "n/a" : Numbers.num(st.mean()) + " ± " + Numbers.num3(st.sd())));
        }
        b.add(Table.of("Photon budget as current density (mA/cm²)", List.of("output", "what it counts",
                "nominal device", "mean ± sd over the samples"), rows));
        return new Section(OPTICS, "Optics of the nominal device", b);
    }

    // ------------------------------------------------------------------------------------------------
    // Provenance

    private Section provenance(StudyResults r) {
        StudyResults.Provenance p = r.provenance();
        List<Block> b = new ArrayList<>();
        if (p == null) {
            b.add(new Paragraph("No provenance was recorded for this run."));
            return new Section(PROVENANCE, "Provenance", b);
        }
        b.add(new KeyValues(List.of(
                KeyValues.pair("fabspread version", p.version()),
                KeyValues.pair("Build commit", p.commit()),
                KeyValues.pair("Build date", p.buildDate()),
                KeyValues.pair("Run finished", p.runDate()),
                KeyValues.pair("Seed", Long.toString(p.seed())),
                KeyValues.pair("Study file SHA-256", p.studySha256()),
                KeyValues.pair("Command", p.command()))));
        if (p.materialSources() != null && !p.materialSources().isEmpty()) {
            List<List<String>> rows = new ArrayList<>();
            p.materialSources().forEach((k, v) -> rows.add(List.of(k, v)));
            b.add(Table.of("Optical constants and their published sources", List.of("material", "source"), rows));
        }
        if (p.studyText() != null && !p.studyText().isEmpty()) {
            b.add(new Paragraph("The study file as run:"));
            b.add(new Preformatted(p.studyText()));
        }
        return new Section(PROVENANCE, "Provenance", b);
    }

    // ------------------------------------------------------------------------------------------------
    // Helpers

    /** The output the report follows: the first target's, else {@code jsc}, else the first output. */
    static String focusOutput(StudyResults r) {
        if (!r.study().targets().isEmpty()) {
            return r.study().targets().get(0).output();
        }
        for (OutputDef o : r.outputs()) {
            if (o.id().equals("jsc")) {
                return o.id();
            }
        }
        return r.outputs().get(0).id();
    }

    /** Inputs in order of variance contribution (Sobol total, else screening first-order, else none). */
    static List<String> topInputs(StudyResults r, String out) {
        List<String> ids = new ArrayList<>();
        if (r.sobol() != null && hasOutput(r.sobol(), out)) {
            List<SobolResult.IndexEstimate> e = new ArrayList<>(r.sobol().output(out).indices());
            e.sort(Comparator.comparingDouble(SobolResult.IndexEstimate::total).reversed());
            e.forEach(x -> ids.add(x.input()));
        } else if (r.screening() != null && hasOutput(r.screening(), out)) {
            List<ScreeningResult.InputScreening> e = new ArrayList<>(r.screening().output(out).inputs());
            e.sort(Comparator.comparingDouble((ScreeningResult.InputScreening x) -> x.firstOrder()).reversed());
            e.forEach(x -> ids.add(x.input()));
        }
        if (r.table() != null) {
            ids.removeIf(id -> !r.table().inputIds().contains(id));
        }
        return ids;
    }

    private static boolean hasOutput(SobolResult s, String out) {
        return s.outputs().stream().anyMatch(o -> o.output().equals(out));
    }

    private static boolean hasOutput(ScreeningResult s, String out) {
        return s.outputs().stream().anyMatch(o -> o.output().equals(out));
    }

    private static OutputDef outputDef(StudyResults r, String id) {
        for (OutputDef o : r.outputs()) {
            if (o.id().equals(id)) {
                return o;
            }
        }
        throw new IllegalArgumentException("the results have no output " + id);
    }

    static RunSummary.OutputStats stats(RunSummary s, String id) {
        RunSummary.OutputStats st = statsOrNull(s, id);
        if (st == null) {
            throw new IllegalArgumentException("the run summary has no output " + id);
        }
        return st;
    }

    private static RunSummary.OutputStats statsOrNull(RunSummary s, String id) {
        for (RunSummary.OutputStats o : s.outputs()) {
            if (o.id().equals(id)) {
                return o;
            }
        }
        return null;
    }

    static double quantile(RunSummary.OutputStats st, double p) {
        for (RunSummary.QuantileStats q : st.quantiles()) {
            if (Math.abs(q.p() - p) < 1e-9) {
                return q.value();
            }
        }
        return Double.NaN;
    }

    private static Target targetOf(Study s, String out) {
        for (Target t : s.targets()) {
            if (t.output().equals(out)) {
                return t;
            }
        }
        return null;
    }

    /** The yield line as the report prints it. */
    static String yieldText(YieldResult.YieldLine l, double confidence) {
        return Numbers.pct(l.yield()) + " (" + l.passed() + " of " + l.n() + "; " + Numbers.level(confidence)
                + " Wilson " + Numbers.pctRange(l.wilsonLow(), l.wilsonHigh()) + ", Clopper–Pearson "
                + Numbers.pctRange(l.exactLow(), l.exactHigh()) + ")";
    }

    private static String failures(RunSummary s) {
        long failed = s.samplesRequested() - s.samplesOk();
        if (s.failures() == null || s.failures().isEmpty()) {
            return failed == 0 ? "none" : failed + " (reasons not recorded)";
        }
        long total = 0;
        List<String> parts = new ArrayList<>();
        for (Map.Entry<String, Long> e : s.failures().entrySet()) {
            total += e.getValue();
            parts.add(e.getKey() + " " + e.getValue());
        }
        String policy = s.failurePolicy() == null ? "" : "; policy " + s.failurePolicy().toLowerCase(Locale.ROOT);
        String removed = s.truncatedByModel() == null ? ""
                : "; probability removed by the model's limits " + Numbers.pct(s.truncatedByModel());
        return total + " (" + String.join(", ", parts) + policy + removed + ")";
    }

    private static String ess(double ess, double fraction) {
        if (!Double.isFinite(ess)) {
            return "n/a";
        }
        return Numbers.sig(ess, 3) + " (" + Numbers.pct(fraction) + ")";
    }

    /** A target in words, e.g. {@code J_sc ≥ 14 mA/cm²}. */
    static String target(Target t) {
        return label(t.output()) + (t.atLeast() ? " ≥ " : " ≤ ") + Numbers.withUnit(Numbers.num(t.value()), t.unit());
    }

    /** The printed name of an output: J_sc for jsc, V_oc for voc, FF and efficiency; else the id. */
    static String label(String output) {
        return switch (output) {
            case "jsc" -> "J_sc";
            case "voc" -> "V_oc";
            case "ff" -> "FF";
            case "jsc_planar" -> "J_sc without particles";
            default -> output;
        };
    }

    private static String describe(Parameter p) {
        return p == null ? "–" : p.isUncertain() ? Describe.distribution(p) : show(p.nominal(), p.unit());
    }

    /** A value in a canonical unit as a reader wants it: fractions as %, thick layers in mm. */
    static String show(double v, String unit) {
        if ("fraction".equals(unit)) {
            return Numbers.pct(v);
        }
        if ("nm".equals(unit) && Math.abs(v) >= 1e5) {
            return Numbers.plain(v / 1e6) + " mm";
        }
        return Numbers.withUnit(Numbers.plain(v), unit);
    }

    private static String sampler(String s) {
        if (s == null) {
            return "unknown";
        }
        return switch (s.toUpperCase(Locale.ROOT).replace('-', '_')) {
            case "RANDOM" -> "plain Monte Carlo";
            case "LATIN_HYPERCUBE" -> "Latin hypercube";
            case "SOBOL" -> "randomised Sobol points";
            default -> s;
        };
    }

    private static boolean any(double[] a) {
        if (a == null) {
            return false;
        }
        for (double v : a) {
            if (v != 0 && Double.isFinite(v)) {
                return true;
            }
        }
        return false;
    }

    /** A chart-name fragment from an output id. */
    private static String safe(String id) {
        String s = id.replaceAll("[^A-Za-z0-9_-]", "-");
        return s.isEmpty() || !Character.isLetterOrDigit(s.charAt(0)) ? "x" + s : s;
    }

    private static String ordinal(int k) {
        return switch (k) {
            case 0 -> "";
            case 1 -> "second";
            case 2 -> "third";
            default -> (k + 1) + "th";
        };
    }
}
