package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

/**
 * A compact plain-text summary for the terminal: yield lines, C_pk, the top variance contributions, the
 * tightening ranking and the what-ifs. Every part is optional (null or empty is left out).
 */
public final class TextSummary {

    private TextSummary() {
    }

    /**
     * @param focusOutput output whose contributions are listed; null = the first target's output, else
     *                    the first output of the sensitivity results
     * @param top         at most this many inputs per list
     */
    public static String render(YieldResult yield, List<Capability> capabilities, SobolResult sobol,
                                ScreeningResult screening, ToleranceRanking ranking, List<WhatIfResult> whatIfs,
                                String focusOutput, int top) {
        StringBuilder b = new StringBuilder();
        if (yield != null) {
            b.append(String.format(Locale.ROOT, "Yield (%s intervals, n = %d):%n", pct0(yield.confidence()),
                    yield.samples()));
            List<YieldResult.YieldLine> lines = new ArrayList<>(yield.perTarget());
            if (yield.perTarget().size() > 1) {
                lines.add(yield.all());
            }
            int width = lines.stream().mapToInt(l -> l.spec().length()).max().orElse(10);
            for (YieldResult.YieldLine l : lines) {
                b.append(String.format(Locale.ROOT, "  %-" + width + "s  %s  Wilson %s-%s  exact %s-%s%n", l.spec(),
                        pct(l.yield()), pct(l.wilsonLow()), pct(l.wilsonHigh()), pct(l.exactLow()), pct(l.exactHigh())));
            }
            if (!yield.note().isEmpty()) {
                b.append("  ").append(yield.note()).append('\n');
            }
        }
        if (capabilities != null) {
            for (Capability c : capabilities) {
                b.append(String.format(Locale.ROOT, "C_pk %s: %.3f (normal-theory yield %s, skewness %.2f)%n",
                        c.spec(), c.cpk(), pct(c.normalYield()), c.skewness()));
                if (!c.caveat().isEmpty()) {
                    b.append("  ").append(c.caveat()).append('\n');
                }
            }
        }
        String focus = focusOutput;
        if (focus == null && yield != null && !yield.perTarget().isEmpty()) {
            focus = yield.perTarget().get(0).spec().split(" ")[0];
        }
        if (sobol != null && !sobol.outputs().isEmpty()) {
            SobolResult.OutputIndices o = pick(sobol, focus);
            b.append(String.format(Locale.ROOT, "Variance contributions to %s (Sobol, N = %d, %d runs; first order"
                    + " / total, %s intervals):%n", o.output(), sobol.n(), sobol.modelRuns(), pct0(sobol.confidence())));
            List<SobolResult.IndexEstimate> list = new ArrayList<>(o.indices());
            list.sort(Comparator.comparingDouble(SobolResult.IndexEstimate::total).reversed());
            int width = width(list.stream().map(SobolResult.IndexEstimate::input).toList(), top);
            for (SobolResult.IndexEstimate e : list.subList(0, Math.min(top, list.size()))) {
                b.append(String.format(Locale.ROOT, "  %-" + width + "s  %6.3f [%s]  %6.3f [%s]%n", e.input(), e.first(),
                        range(e.firstLow(), e.firstHigh()), e.total(), range(e.totalLow(), e.totalHigh())));
            }
            if (!sobol.note().isEmpty()) {
                b.append("  ").append(sobol.note()).append('\n');
            }
        }
        if (screening != null && !screening.outputs().isEmpty()) {
            ScreeningResult.OutputScreening o = pickScreening(screening, focus);
            b.append(String.format(Locale.ROOT, "Screening of %s (n = %d; binned first order, bias %.4f subtracted;"
                    + " SRRC, rank R^2 = %.3f):%n", o.output(), screening.samples(), screening.binBias(), o.rankRSquared()));
            List<ScreeningResult.InputScreening> list = new ArrayList<>(o.inputs());
            list.sort(Comparator.comparingDouble(ScreeningResult.InputScreening::firstOrder).reversed());
            int width = width(list.stream().map(ScreeningResult.InputScreening::input).toList(), top);
            for (ScreeningResult.InputScreening e : list.subList(0, Math.min(top, list.size()))) {
                b.append(String.format(Locale.ROOT, "  %-" + width + "s  %6.3f  SRRC %+6.3f%n", e.input(), e.firstOrder(),
                        e.srrc()));
            }
        }
        if (ranking != null && !ranking.entries().isEmpty()) {
            b.append(String.format(Locale.ROOT, "Which tolerance to tighten (sigma halved, by yield gained; baseline %s):%n",
                    pct(ranking.baselineYield())));
            List<ToleranceRanking.Entry> list = ranking.entries();
            int width = width(list.stream().map(ToleranceRanking.Entry::input).toList(), top);
            int rank = 1;
            for (ToleranceRanking.Entry e : list.subList(0, Math.min(top, list.size()))) {
                if (Double.isNaN(e.yieldGain())) {
                    b.append(String.format(Locale.ROOT, "  %d. %-" + width + "s  %s%n", rank++, e.input(), e.note()));
                    continue;
                }
                b.append(String.format(Locale.ROOT, "  %d. %-" + width + "s  %+.1f points yield [%+.1f, %+.1f paired]"
                                + "  sd %s %.4g -> %.4g  (ESS %.0f %%)%s%n", rank++, e.input(), 100 * e.yieldGain(),
                        100 * e.gain().low(), 100 * e.gain().high(), ranking.sdOutput(), e.sdBefore(), e.sdAfter(),
                        100 * e.essFraction(), e.rerunNeeded() ? "  needs a new run" : ""));
            }
        }
        if (whatIfs != null && !whatIfs.isEmpty()) {
            b.append("What-ifs (reweighted samples, or new samples where reweighting cannot be trusted):\n");
            for (WhatIfResult w : whatIfs) {
                WhatIfResult.WeightedYield y = w.allTargets();
                if (w.reweighted()) {
                    b.append(String.format(Locale.ROOT, "  %s: yield %s -> %s [%s]  change %+.1f points [%+.1f, %+.1f"
                            + " paired]  ESS %.0f (%.0f %%)%n", w.description(), pct(y.before()), pct(y.after()),
                            range100(y.afterLow(), y.afterHigh()), 100 * y.gain(), 100 * y.change().low(),
                            100 * y.change().high(), w.ess(), 100 * w.essFraction()));
                } else if (!w.rerunNeeded() && Double.isFinite(y.after())) {
                    b.append(String.format(Locale.ROOT, "  %s: yield %s -> %s [%s]  re-run, %d new samples%n",
                            w.description(), pct(y.before()), pct(y.after()), range100(y.afterLow(), y.afterHigh()),
                            w.samples()));
                } else {
                    b.append("  ").append(w.description()).append(": not reweighted\n");
                }
                if (w.rerunNeeded()) {
                    b.append("    needs a new run: ").append(w.message()).append('\n');
                }
            }
        }
        return b.toString();
    }

    private static SobolResult.OutputIndices pick(SobolResult s, String focus) {
        for (SobolResult.OutputIndices o : s.outputs()) {
            if (o.output().equals(focus)) {
                return o;
            }
        }
        return s.outputs().get(0);
    }

    private static ScreeningResult.OutputScreening pickScreening(ScreeningResult s, String focus) {
        for (ScreeningResult.OutputScreening o : s.outputs()) {
            if (o.output().equals(focus)) {
                return o;
            }
        }
        return s.outputs().get(0);
    }

    private static int width(List<String> ids, int top) {
        return Math.max(1, ids.subList(0, Math.min(top, ids.size())).stream().mapToInt(String::length).max().orElse(1));
    }

    private static String pct(double p) {
        return Double.isNaN(p) ? "-" : String.format(Locale.ROOT, "%.1f %%", 100 * p);
    }

    private static String pct0(double p) {
        return String.format(Locale.ROOT, "%.0f %%", 100 * p);
    }

    private static String range(double lo, double hi) {
        return Double.isNaN(lo) ? "no interval" : String.format(Locale.ROOT, "%.3f, %.3f", lo, hi);
    }

    private static String range100(double lo, double hi) {
        return Double.isNaN(lo) ? "-" : String.format(Locale.ROOT, "%.1f, %.1f %%", 100 * lo, 100 * hi);
    }
}
