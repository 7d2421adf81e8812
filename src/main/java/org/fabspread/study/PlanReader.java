package org.fabspread.study;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Scalar;
import org.fabspread.study.YamlNode.Sequence;

/**
 * The optional {@code plan} section: the factors, size limits, levels and kind of the proposed
 * experiment plan, and the response and power settings that size it.
 */
final class PlanReader extends SectionReader {

    PlanReader(ReadContext ctx) {
        super(ctx);
    }

    PlanSettings plan(YamlNode n, String path, Map<String, Parameter> params, boolean hasDiode) {
        if (n == null) {
            return new PlanSettings(List.of(), 0, 2, List.of(), PlanSettings.Kind.AUTO, 0, 0, 1, 0, Double.NaN,
                    "jsc", 0.05, 0.8, 1);
        }
        Mapping m = mapping(n, path, keys("factors", "max_runs", "levels", "limits", "kind", "resolution",
                "centre_points", "blocks", "replicates", "effect_of_interest", "response", "alpha", "power", "seed",
                "precision"));
        List<String> factors = factors(m, path, params);
        YamlNode mr = opt(m, "max_runs");
        int maxRuns = mr == null ? 0 : (int) integer(mr, child(path, "max_runs"), 0, Limits.MAX_PLAN_RUNS, "a plan is run by hand on the line");
        YamlNode lv = opt(m, "levels");
        double levels = 2;
        if (lv != null) {
            String t = text(lv, child(path, "levels")).replaceFirst("\\s*(sigma|σ)$", "");
            levels = parseOr(t);
            if (!(levels > 0) || Double.isInfinite(levels)) {
                throw err(lv, child(path, "levels"), "levels are a number of sigmas > 0, such as '2 sigma', got '"
                        + text(lv, child(path, "levels")) + "'");
            }
        }
        List<PlanSettings.FactorLimits> limits = limits(m, path, params);
        YamlNode kn = opt(m, "kind");
        PlanSettings.Kind kind = kn == null ? PlanSettings.Kind.AUTO : PlanSettings.Kind.valueOf(enumName(word(kn,
                child(path, "kind"), List.of("auto", "full-factorial", "fractional", "plackett-burman",
                        "central-composite", "box-behnken"))));
        YamlNode rn = opt(m, "resolution");
        int resolution = 0;
        if (rn != null) {
            resolution = (int) integer(rn, child(path, "resolution"), 0, 1000, "resolution is 3, 4 or 5");
            if (resolution != 0 && (resolution < 3 || resolution > 5)) {
                throw err(rn, child(path, "resolution"), "resolution must be 3, 4 or 5 (0: let the planner choose), got "
                        + resolution);
            }
        }
        YamlNode cp = opt(m, "centre_points");
        int centre = cp == null ? 0 : (int) integer(cp, child(path, "centre_points"), 0, Limits.MAX_PLAN_RUNS, "a plan is run by hand on the line");
        YamlNode bl = opt(m, "blocks");
        int blocks = bl == null ? 1 : (int) integer(bl, child(path, "blocks"), 1, Limits.MAX_PLAN_RUNS, "a plan is run by hand on the line");
        YamlNode rep = opt(m, "replicates");
        int replicates = rep == null ? 0 : (int) integer(rep, child(path, "replicates"), 0, Limits.MAX_PLAN_RUNS, "a plan is run by hand on the line");
        YamlNode resp = opt(m, "response");
        String response = resp == null ? "jsc" : text(resp, child(path, "response"));
        Quantity rq = resp == null ? Quantity.CURRENT_DENSITY : outputQuantity(response, resp, child(path, "response"), hasDiode);
        YamlNode eoi = opt(m, "effect_of_interest");
        double effect = eoi == null ? Double.NaN : number(eoi, child(path, "effect_of_interest"),
                Rule.of("effect_of_interest", rq).above(0, true));
        YamlNode an = opt(m, "alpha");
        double alpha = an == null ? 0.05 : number(an, child(path, "alpha"),
                Rule.of("alpha", Quantity.FRACTION).above(0, true).below(0.5, false));
        YamlNode pn = opt(m, "power");
        double power = pn == null ? 0.8 : number(pn, child(path, "power"),
                Rule.of("power", Quantity.FRACTION).above(0, true).below(1, true));
        YamlNode sn = opt(m, "seed");
        long seed = sn == null ? 1 : integer(sn, child(path, "seed"), 0);
        return new PlanSettings(factors, maxRuns, levels, limits, kind, resolution, centre, blocks, replicates, effect,
                response, alpha, power, seed, precision(m, path, params));
    }

    /** {@code precision: {input: step}}: the step each input's run-sheet settings are rounded to, in its unit. */
    private Map<String, Double> precision(Mapping m, String path, Map<String, Parameter> params) {
        Map<String, Double> out = new java.util.LinkedHashMap<>();
        YamlNode pn = opt(m, "precision");
        if (pn == null) {
            return out;
        }
        String pp = child(path, "precision");
        if (!(pn instanceof Mapping pm)) {
            throw err(pn, pp, "expected a section of input: step pairs, such as 'stack.etl.thickness: 0.5 nm', got "
                    + pn.kindName());
        }
        for (YamlNode.Entry e : pm.entries().values()) {
            String id = e.key().name();
            String p = child(pp, id);
            Parameter param = input(e.value() instanceof Scalar sc && sc.isNull() ? pm : e.value(), p, id, params);
            out.put(id, number(e.value(), p, Rule.of(id, Describe.quantity(param.unit())).above(0, true)));
        }
        return out;
    }

    private List<String> factors(Mapping m, String path, Map<String, Parameter> params) {
        List<String> factors = new ArrayList<>();
        YamlNode fn = opt(m, "factors");
        if (fn != null) {
            Sequence s = list(fn, child(path, "factors"));
            for (int i = 0; i < s.items().size(); i++) {
                String p = child(path, "factors") + "[" + i + "]";
                YamlNode f = s.items().get(i);
                String id = text(f, p);
                input(f, p, id, params);
                if (factors.contains(id)) {
                    throw err(f, p, "factor '" + id + "' is listed twice");
                }
                factors.add(id);
            }
        }
        return factors;
    }

    private List<PlanSettings.FactorLimits> limits(Mapping m, String path, Map<String, Parameter> params) {
        List<PlanSettings.FactorLimits> limits = new ArrayList<>();
        YamlNode ln = opt(m, "limits");
        if (ln != null) {
            String lp = child(path, "limits");
            if (!(ln instanceof Mapping lm)) {
                throw err(ln, lp, "expected a section of input: [low, high] pairs, got " + ln.kindName());
            }
            for (YamlNode.Entry e : lm.entries().values()) {
                String id = e.key().name();
                String p = child(lp, id);
                Parameter param = input(e.value() instanceof Scalar sc && sc.isNull() ? lm : e.value(), p, id, params);
                Sequence pair = list(e.value(), p);
                if (pair.items().size() != 2) {
                    throw err(pair, p, "give [low, high], got " + pair.items().size() + " values");
                }
                Rule r = Rule.of(id, Describe.quantity(param.unit()));
                double lo = number(pair.items().get(0), p + "[0]", r);
                double hi = number(pair.items().get(1), p + "[1]", r);
                if (!(hi > lo)) {
                    throw err(pair.items().get(1), p + "[1]", "high (" + r.q().show(hi) + ") must be above low ("
                            + r.q().show(lo) + ")");
                }
                limits.add(new PlanSettings.FactorLimits(id, lo, hi));
            }
        }
        return limits;
    }
}
