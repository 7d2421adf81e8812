package org.fabspread.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.fabspread.analysis.YieldResult;
import org.fabspread.sampling.RunSummary;
import org.fabspread.study.Describe;
import org.fabspread.study.Parameter;
import org.fabspread.study.Target;

/** How the study report words its values: targets, output names, quantities, yields, failures. */
final class ReportText {

    private ReportText() {
    }

    /** The yield line as the report prints it. */
    static String yieldText(YieldResult.YieldLine l, double confidence) {
        return Numbers.pct(l.yield()) + " (" + l.passed() + " of " + l.n() + "; " + Numbers.level(confidence)
                + " Wilson " + Numbers.pctRange(l.wilsonLow(), l.wilsonHigh()) + ", Clopper–Pearson "
                + Numbers.pctRange(l.exactLow(), l.exactHigh()) + ")";
    }

    static String failures(RunSummary s) {
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

    static String ess(double ess, double fraction) {
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

    static String describe(Parameter p) {
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

    static String sampler(String s) {
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

    static boolean any(double[] a) {
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
    static String safe(String id) {
        String s = id.replaceAll("[^A-Za-z0-9_-]", "-");
        return s.isEmpty() || !Character.isLetterOrDigit(s.charAt(0)) ? "x" + s : s;
    }

    static String ordinal(int k) {
        return switch (k) {
            case 0 -> "";
            case 1 -> "second";
            case 2 -> "third";
            default -> (k + 1) + "th";
        };
    }
}
