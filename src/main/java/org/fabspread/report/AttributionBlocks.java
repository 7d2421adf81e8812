package org.fabspread.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

import org.fabspread.analysis.ConvergenceCheck;
import org.fabspread.analysis.ShapleyResult;
import org.fabspread.analysis.SobolResult;
import org.fabspread.analysis.VarianceAttribution;
import org.fabspread.pipeline.StudyResults;

/**
 * The variance attribution beyond the per-input Sobol indices: Shapley effects (placed first when inputs
 * are correlated, since they then are the ranking that does not depend on the inputs' order), the group
 * indices, and the estimates that are not converged with the design size to raise to.
 */
final class AttributionBlocks {

    private final ChartFactory charts;

    AttributionBlocks(ChartFactory charts) {
        this.charts = charts;
    }

    /** The Sobol blocks with the attribution around them. */
    List<Block> around(StudyResults r, String out, String label, List<Block> sobolBlocks) {
        VarianceAttribution va = r.attribution();
        if (va == null || !hasOutput(va.sobol(), out)) {
            return sobolBlocks;
        }
        List<Block> b = new ArrayList<>();
        List<Block> shapley = va.shapley() == null ? List.of() : shapley(va.shapley(), out, label, va.shapleyLeads());
        if (va.shapleyLeads()) {
            b.addAll(shapley);
            b.add(new Paragraph("The Sobol indices below are those of the independent variables behind the copula: "
                    + "for a correlated input they depend on the order of the inputs in the study file and are "
                    + "shown for reference; the group of a correlated set and the Shapley effects above do not."));
            b.addAll(sobolBlocks);
        } else {
            b.addAll(sobolBlocks);
            b.addAll(shapley);
        }
        b.addAll(groups(va.sobol(), out, label));
        b.addAll(convergence(va.unconverged(), out, label));
        return b;
    }

    private static boolean hasOutput(SobolResult s, String out) {
        return s.outputs().stream().anyMatch(o -> o.output().equals(out));
    }

    private List<Block> shapley(ShapleyResult sh, String out, String label, boolean leads) {
        ShapleyResult.OutputEffects oe = sh.outputs().stream().filter(o -> o.output().equals(out)).findFirst()
                .orElse(null);
        if (oe == null || !Double.isFinite(oe.variance())) {
            return List.of();
        }
        List<ShapleyResult.Effect> effects = new ArrayList<>(oe.effects());
        int n = effects.size();
        String[] names = new String[n];
        double[] v = new double[n];
        double[] lo = new double[n];
        double[] hi = new double[n];
        for (int i = 0; i < n; i++) {
            names[i] = effects.get(i).input();
            v[i] = 100 * effects.get(i).share();
            lo[i] = 100 * effects.get(i).interval().low();
            hi[i] = 100 * effects.get(i).interval().high();
        }
        List<Block> b = new ArrayList<>();
        b.add(new Figure(charts.intervalBars("shapley-" + ReportText.safe(out), "Shares of the variance of " + label
                        + " (Shapley effects)", Quantity.of("share of the variance", "%"),
                Quantity.of("input", "sorted by share"), names, v, lo, hi, "Shapley effect",
                Numbers.level(sh.confidence()) + " interval"),
                "Shapley effects of " + label + ": each input's share of the variance, what correlated inputs "
                        + "explain together split fairly between them; the shares add up to 100 % and do not depend "
                        + "on the order of the inputs" + (leads ? " (the ranking to follow: inputs are correlated)" : "")
                        + ". " + sh.method() + "; " + sh.modelRuns() + " model runs."));
        effects.sort(Comparator.comparingDouble(ShapleyResult.Effect::share).reversed());
        List<List<String>> rows = new ArrayList<>();
        for (ShapleyResult.Effect e : effects) {
            rows.add(List.of(e.input(), Numbers.pct(e.share()) + " (" + Numbers.pctRange(e.interval().low(),
                    e.interval().high()) + ")", e.interval().above(0) ? "contributes" : "not distinguished from zero"));
        }
        b.add(Table.of("Shapley effects of " + label + " with " + Numbers.level(sh.confidence()) + " intervals",
                List.of("input", "share of the variance", "reading"), rows));
        return b;
    }

    private static List<Block> groups(SobolResult s, String out, String label) {
        SobolResult.OutputIndices oi = s.output(out);
        if (oi.groups().isEmpty()) {
            return List.of();
        }
        List<List<String>> rows = new ArrayList<>();
        for (SobolResult.GroupEstimate g : oi.groups()) {
            rows.add(List.of(g.group(), Numbers.pct(g.first()) + " (" + Numbers.pctRange(g.firstInterval().low(),
                    g.firstInterval().high()) + ")", Numbers.pct(g.total()) + " (" + Numbers.pctRange(
                    g.totalInterval().low(), g.totalInterval().high()) + ")"));
        }
        return List.of(Table.of("Variance contributions of groups of inputs to " + label + " (Sobol, N = " + s.n()
                        + ")", List.of("group", "closed first order S_G", "total S_TG"), rows),
                new Paragraph("A group's closed first-order index is the share of the variance its inputs explain "
                        + "together, alone; its total index adds their interactions with the rest. A set of "
                        + "correlated inputs is always a group, so its indices do not depend on the order of the "
                        + "inputs."));
    }

    private static List<Block> convergence(List<ConvergenceCheck.Flag> flags, String out, String label) {
        List<String> items = new ArrayList<>();
        for (ConvergenceCheck.Flag f : flags) {
            if (!f.output().equals(out)) {
                continue;
            }
            boolean shapley = f.index().equals("Shapley");
            items.add(f.index() + " of " + f.input() + ": " + Numbers.pct(f.estimate()) + " ("
                    + Numbers.pctRange(f.interval().low(), f.interval().high()) + ") — not converged; raise "
                    + (shapley ? "the Shapley orders m" : "the Sobol base size N") + " from " + f.size() + " to about "
                    + f.suggested() + (shapley ? " (m = 4N: --sobol-base " + Math.max(8, f.suggested() / 4) + ")"
                            : " (analysis.sobol_base or --sobol-base)"));
        }
        if (items.isEmpty()) {
            return List.of(new Paragraph("Every variance share of " + label + " of at least "
                    + Numbers.pct(ConvergenceCheck.FLOOR) + " has an interval narrower than "
                    + Numbers.pct(ConvergenceCheck.WIDTH_FRACTION) + " of itself: the design is large enough."));
        }
        return List.of(new Paragraph("Estimates of " + label + " of at least " + Numbers.pct(ConvergenceCheck.FLOOR)
                + " whose interval is wider than " + Numbers.pct(ConvergenceCheck.WIDTH_FRACTION) + " of the estimate "
                + "(the size to reach follows from the interval shrinking as 1/√N):"), new BulletList(items));
    }
}
