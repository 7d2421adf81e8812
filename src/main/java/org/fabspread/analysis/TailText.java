package org.fabspread.analysis;

import java.util.List;
import java.util.Locale;

/** Short plain-text renderings of the rare-failure results for the terminal. */
public final class TailText {

    private TailText() {
    }

    /** Importance-sampling result: the union line, the per-target lines, the design points and the caveats. */
    public static String render(TailYieldResult r, int topInputs) {
        StringBuilder b = new StringBuilder();
        TailYieldResult.FailureLine all = r.all();
        b.append(String.format(Locale.ROOT, "Rare failures by importance sampling (%d draws + %d search runs, seed %d,"
                + " %s intervals):%n", r.runs(), r.searchRuns(), r.seed(), pct0(r.confidence())));
        b.append(String.format(Locale.ROOT, "  yield %s  [%s, %s]%n", yieldPct(r.yield()), yieldPct(r.yieldLow()),
                yieldPct(r.yieldHigh())));
        List<TailYieldResult.FailureLine> lines = r.perTarget().size() > 1
                ? concat(r.perTarget(), all) : List.of(all);
        int width = lines.stream().mapToInt(l -> l.spec().length()).max().orElse(10);
        for (TailYieldResult.FailureLine l : lines) {
            b.append(String.format(Locale.ROOT, "  P(fail) %-" + width + "s  %s  [%s, %s]  rel. error %s  %d failing"
                            + " draws (effective %.0f)%n", l.spec(), sci(l.probability()), sci(l.low()), sci(l.high()),
                    Double.isNaN(l.relativeError()) ? "-" : String.format(Locale.ROOT, "%.0f %%", 100 * l.relativeError()),
                    l.failingDraws(), l.essFailing()));
        }
        b.append(String.format(Locale.ROOT, "  Kish effective sample size %.0f of %d draws (%.0f %%, low by design for a"
                + " rare event)%n", r.ess(), r.runs(), 100 * r.essFraction()));
        if (!Double.isNaN(r.plainRunsForSameError())) {
            b.append(String.format(Locale.ROOT, "  plain Monte Carlo would need %.3g runs for the same error, and would"
                    + " expect %.2g failures in %d%n", r.plainRunsForSameError(), all.probability() * r.totalRuns(),
                    r.totalRuns()));
        }
        for (TailYieldResult.DesignPoint d : r.designPoints()) {
            b.append(String.format(Locale.ROOT, "  design point %s: beta %.3f (first-order P %s)%s; toward failure:",
                    d.spec(), d.beta(), sci(d.formProbability()), d.converged() ? "" : ", not converged"));
            List<TailYieldResult.Coordinate> cs = d.coordinates().stream()
                    .sorted((p, q) -> Double.compare(Math.abs(q.cosine()), Math.abs(p.cosine()))).toList();
            for (TailYieldResult.Coordinate c : cs.subList(0, Math.min(topInputs, cs.size()))) {
                b.append(String.format(Locale.ROOT, " %s %.4g (z %+.2f)", c.input(), c.value(), c.z()));
            }
            b.append('\n');
        }
        if (!r.note().isEmpty()) {
            b.append("  ").append(r.note()).append('\n');
        }
        return b.toString();
    }

    /** Fitted-tail results, one block per target. */
    public static String render(List<TailFitResult> fits) {
        StringBuilder b = new StringBuilder();
        for (TailFitResult f : fits) {
            b.append(String.format(Locale.ROOT, "Fitted tail of %s (n = %d, failures %s the limit, %s intervals):%n",
                    f.spec(), f.samples(), f.failureSide(), pct0(f.confidence())));
            TailFitResult.Counted c = f.counted();
            b.append(String.format(Locale.ROOT, "  counted      P(fail) %s  [%s, %s]  (%d failures)%n",
                    sci(c.probability()), sci(c.low()), sci(c.high()), c.failures()));
            TailFitResult.NormalTail nt = f.normal();
            b.append(String.format(Locale.ROOT, "  normal       P(fail) %s  [%s, %s]  (limit %.2f sd from the mean)%n",
                    sci(nt.probability()), sci(nt.low()), sci(nt.high()), nt.distance()));
            TailFitResult.ParetoTail pt = f.pareto();
            if (pt.applicable()) {
                b.append(String.format(Locale.ROOT, "  gen. Pareto  P(fail) %s  [%s, %s]  (xi %.3f [%.3f, %.3f], %d"
                                + " beyond %.5g)%n", sci(pt.probability()), sci(pt.low()), sci(pt.high()), pt.shape(),
                        pt.shapeLow(), pt.shapeHigh(), pt.exceedances(), pt.threshold()));
            } else {
                b.append("  gen. Pareto  not used: ").append(pt.note()).append('\n');
            }
            b.append(String.format(Locale.ROOT, "  yield %s  [%s, %s]  from the %s estimate%n", yieldPct(f.yield()),
                    yieldPct(f.yieldLow()), yieldPct(f.yieldHigh()), f.preferred()));
            b.append("  ").append(f.caveat()).append('\n');
        }
        return b.toString();
    }

    private static <T> List<T> concat(List<T> a, T b) {
        java.util.ArrayList<T> l = new java.util.ArrayList<>(a);
        l.add(b);
        return l;
    }

    static String sci(double p) {
        if (Double.isNaN(p)) {
            return "-";
        }
        return p == 0 ? "0" : String.format(Locale.ROOT, "%.3g", p);
    }

    /** A yield with enough decimals to show the nines: 99.99872 %. */
    static String yieldPct(double y) {
        if (Double.isNaN(y)) {
            return "-";
        }
        double miss = 1 - y;
        int decimals = miss > 0 ? Math.max(1, Math.min(8, (int) Math.ceil(-Math.log10(miss * 100)) + 2)) : 1;
        return String.format(Locale.ROOT, "%." + decimals + "f %%", 100 * y);
    }

    private static String pct0(double p) {
        return String.format(Locale.ROOT, "%.0f %%", 100 * p);
    }
}
