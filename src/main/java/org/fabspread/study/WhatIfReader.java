package org.fabspread.study;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Sequence;

/**
 * The {@code analysis.what_ifs} list: scenario changes to one input's spread (scale sigma, shift the
 * nominal, truncate), written as a sentence or as a section.
 */
final class WhatIfReader extends SectionReader {

    WhatIfReader(ReadContext ctx) {
        super(ctx);
    }

    private static final Pattern WI_HALVE = Pattern.compile("^halve\\s+(?:the\\s+)?sigma\\s+of\\s+(\\S+)$");
    private static final Pattern WI_SCALE = Pattern.compile("^scale\\s+(?:the\\s+)?sigma\\s+of\\s+(\\S+)\\s+by\\s+(\\S+)$");
    private static final Pattern WI_SHIFT = Pattern.compile("^shift\\s+(\\S+)\\s+by\\s+(.+)$");
    private static final Pattern WI_TRUNC = Pattern.compile("^truncate\\s+(\\S+)\\s+at\\s+(\\S+)\\s*(?:sigma|σ)$");

    List<AnalysisSettings.WhatIf> whatIfs(YamlNode n, String path, Map<String, Parameter> params) {
        Sequence s = list(n, path);
        List<AnalysisSettings.WhatIf> out = new ArrayList<>();
        for (int i = 0; i < s.items().size(); i++) {
            String p = path + "[" + i + "]";
            YamlNode item = s.items().get(i);
            SourceLocation where = loc(item, p);
            if (item instanceof Mapping wm) {
                mapping(wm, p, keys("input", "scale_sigma", "shift", "truncate_at"));
                YamlNode in = req(wm, p, "input");
                Parameter param = input(in, child(p, "input"), text(in, child(p, "input")), params);
                List<String> given = new ArrayList<>();
                for (String k : List.of("scale_sigma", "shift", "truncate_at")) {
                    if (opt(wm, k) != null) {
                        given.add(k);
                    }
                }
                if (given.size() != 1) {
                    throw err(wm, p, "give exactly one of scale_sigma, shift and truncate_at");
                }
                String k = given.get(0);
                YamlNode v = wm.get(k);
                out.add(whatIf(param, k, text(v, child(p, k)), v, child(p, k), where));
                continue;
            }
            String t = text(item, p).replaceAll("\\s+", " ");
            Matcher mm;
            if ((mm = WI_HALVE.matcher(t)).matches()) {
                Parameter param = input(item, p, mm.group(1), params);
                out.add(whatIf(param, "scale_sigma", "0.5", item, p, where));
            } else if ((mm = WI_SCALE.matcher(t)).matches()) {
                Parameter param = input(item, p, mm.group(1), params);
                out.add(whatIf(param, "scale_sigma", mm.group(2), item, p, where));
            } else if ((mm = WI_SHIFT.matcher(t)).matches()) {
                Parameter param = input(item, p, mm.group(1), params);
                out.add(whatIf(param, "shift", mm.group(2), item, p, where));
            } else if ((mm = WI_TRUNC.matcher(t)).matches()) {
                Parameter param = input(item, p, mm.group(1), params);
                out.add(whatIf(param, "truncate_at", mm.group(2), item, p, where));
            } else {
                throw err(item, p, "write a what-if as 'halve sigma of ID', 'scale sigma of ID by 0.7', "
                        + "'shift ID by +5 nm' or 'truncate ID at 2 sigma', got '" + t + "'");
            }
        }
        return out;
    }

    private AnalysisSettings.WhatIf whatIf(Parameter param, String kind, String amount, YamlNode n, String path,
                                           SourceLocation where) {
        String id = param.id();
        if (param.distribution() instanceof DistributionSpec.Empirical) {
            throw err(n, path, "what-if on '" + id + "' refused: it is given by measured values, which"
                    + " have no parametric spread to scale or shift; edit the measured data and re-run instead");
        }
        switch (kind) {
            case "scale_sigma": {
                double f = parseOr(amount.strip());
                if (!(f > 0) || Double.isInfinite(f)) {
                    throw err(n, path, "the sigma factor must be a number > 0, got '" + amount.strip() + "'");
                }
                physical(param, SpecChanges.scaled(param.distribution(), f), n, path,
                        "scaling the spread of " + id + " by " + Units.format(f));
                return new AnalysisSettings.WhatIf(id, AnalysisSettings.WhatIf.Kind.SCALE_SIGMA, f, where);
            }
            case "shift": {
                Quantity q = Describe.quantity(param.unit());
                double d = finite(amount, q, n, path, "shift of " + id, "the shift must be finite");
                physical(param, SpecChanges.shifted(param.distribution(), d), n, path,
                        "shifting " + id + " by " + amount.strip());
                return new AnalysisSettings.WhatIf(id, AnalysisSettings.WhatIf.Kind.SHIFT_NOMINAL, d, where);
            }
            default: {
                String a = amount.strip().replaceFirst("\\s*(sigma|σ)$", "");
                double k = parseOr(a);
                if (!(k > 0) || Double.isInfinite(k)) {
                    throw err(n, path, "truncate at a number of sigmas > 0, got '" + amount.strip() + "'");
                }
                return new AnalysisSettings.WhatIf(id, AnalysisSettings.WhatIf.Kind.TRUNCATE_SIGMAS, k, where);
            }
        }
    }

    /** The changed spread must keep the nominal, the bounds and the reachable values physical. */
    private void physical(Parameter param, DistributionSpec changed, YamlNode n, String path, String change) {
        Range r = param.range();
        String bad = r.violation(changed.nominal());
        if (bad == null) {
            bad = boundsViolation(changed, r);
        }
        if (bad != null) {
            throw err(n, path, change + " gives a nominal or bound that " + bad.replaceFirst("^must", "does not")
                    .replaceFirst("does not be", "is not") + ", got " + Describe.distribution(
                    new Parameter(param.id(), param.unit(), changed, param.where(), r, param.display())));
        }
        String outside = Reach.outside(param, changed, change + ": ");
        if (outside != null) {
            throw err(n, path, outside);
        }
    }

    private static String boundsViolation(DistributionSpec s, Range r) {
        double lo;
        double hi;
        if (s instanceof DistributionSpec.Uniform u) {
            lo = u.lower();
            hi = u.upper();
        } else if (s instanceof DistributionSpec.Triangular t) {
            lo = t.lower();
            hi = t.upper();
        } else if (s instanceof DistributionSpec.LogNormal l) {
            return l.median() > 0 ? null : "must be > 0";
        } else {
            return null;
        }
        String bad = r.violation(lo);
        return bad != null ? bad : r.violation(hi);
    }
}
