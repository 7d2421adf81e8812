package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.fabspread.analysis.ScreeningResult;
import org.fabspread.analysis.SobolResult;
import org.fabspread.pipeline.StudyResults;

/** The sensitivity part of the findings: Sobol indices with intervals and their convergence, or screening. */
final class SensitivityBlocks {

    private final ChartFactory charts;

    SensitivityBlocks(ChartFactory charts) {
        this.charts = charts;
    }

    List<Block> blocks(StudyResults r, String out, String label) {
        SobolResult sobol = r.sobol();
        if (sobol != null && hasOutput(sobol, out)) {
            return sobol(sobol, out, label);
        }
        if (r.screening() != null && hasOutput(r.screening(), out)) {
            return screening(r.screening(), out, label);
        }
        return List.of(new Paragraph("The study asked for no sensitivity analysis, so no variance contributions are given."));
    }

    /** The Sobol indices of one output: chart, convergence, table and what they add up to. */
    private List<Block> sobol(SobolResult sobol, String out, String label) {
        List<Block> b = new ArrayList<>();
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
        b.addAll(convergence(sobol, out, label));
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
        return b;
    }

    /** The total indices at growing design sizes, the largest few drawn; empty when none were kept. */
    private List<Block> convergence(SobolResult sobol, String out, String label) {
        List<Block> b = new ArrayList<>();
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
            int shown = Math.min(StudyReport.CONVERGENCE_LINES, order.size());
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
        return b;
    }

    /** Given-data first-order indices of one output, for studies without a Sobol design. */
    private List<Block> screening(ScreeningResult screening, String out, String label) {
        List<Block> b = new ArrayList<>();
        ScreeningResult.OutputScreening os = screening.output(out);
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
                        + "ratio over " + screening.bins() + " bins, bias " + Numbers.num3(screening.binBias())
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
}
