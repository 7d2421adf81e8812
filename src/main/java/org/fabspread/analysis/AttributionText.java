package org.fabspread.analysis;

import java.util.Comparator;
import java.util.List;
import java.util.Locale;

/** Plain-text lines for the console: Shapley effects, group indices and unconverged estimates of one output. */
public final class AttributionText {

    private AttributionText() {
    }

    /** Up to {@code top} Shapley effects, every group, and the output's unconverged estimates. */
    public static String render(VarianceAttribution va, String output, int top) {
        if (va == null) {
            return "";
        }
        StringBuilder sb = new StringBuilder();
        ShapleyResult sh = va.shapley();
        if (sh != null && sh.outputs().stream().anyMatch(o -> o.output().equals(output))) {
            ShapleyResult.OutputEffects oe = sh.output(output);
            if (Double.isFinite(oe.variance())) {
                sb.append(String.format(Locale.ROOT, "Shapley effects of %s (%d orders, %d runs; shares of the variance,"
                        + " %.0f %% intervals)%s:%n", output, sh.permutations(), sh.modelRuns(), 100 * sh.confidence(),
                        va.shapleyLeads() ? "; the ranking to follow, inputs are correlated" : ""));
                List<ShapleyResult.Effect> e = oe.effects().stream()
                        .sorted(Comparator.comparingDouble(ShapleyResult.Effect::share).reversed()).limit(top).toList();
                for (ShapleyResult.Effect x : e) {
                    sb.append(String.format(Locale.ROOT, "  %-26s %.3f [%.3f, %.3f]%n", x.input(), x.share(),
                            x.interval().low(), x.interval().high()));
                }
            }
        }
        for (SobolResult.OutputIndices oi : va.sobol().outputs()) {
            if (!oi.output().equals(output)) {
                continue;
            }
            for (SobolResult.GroupEstimate g : oi.groups()) {
                sb.append(String.format(Locale.ROOT, "Group %s: closed first order %.3f [%.3f, %.3f], total %.3f"
                        + " [%.3f, %.3f]%n", g.group(), g.first(), g.firstInterval().low(), g.firstInterval().high(),
                        g.total(), g.totalInterval().low(), g.totalInterval().high()));
            }
        }
        for (ConvergenceCheck.Flag f : va.unconverged()) {
            if (f.output().equals(output)) {
                sb.append(String.format(Locale.ROOT, "  not converged: %s of %s %.3f [%.3f, %.3f]; raise %s from %d to"
                        + " about %d%n", f.index(), f.input(), f.estimate(), f.interval().low(), f.interval().high(),
                        f.index().equals("Shapley") ? "the orders m" : "N", f.size(), f.suggested()));
            }
        }
        return sb.toString();
    }
}
