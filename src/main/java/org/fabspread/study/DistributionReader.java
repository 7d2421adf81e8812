package org.fabspread.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.apache.commons.math3.distribution.NormalDistribution;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Scalar;

/**
 * The spread of one study number: a fixed value, {@code x ± d at k sigma} / {@code at p %}, or a
 * distribution section (normal, truncated normal, lognormal, uniform, triangular, measured values).
 * Every value is converted to the parameter's canonical unit and checked against its {@link Rule}.
 */
final class DistributionReader extends SectionReader {

    static final Pattern PLUS_MINUS = Pattern.compile("±|\\+/-|\\+-");
    private static final Pattern AT = Pattern.compile("^(.*?)\\s+at\\s+(.+)$");
    private static final Pattern SIGMAS = Pattern.compile("^([0-9.eE+-]+)\\s*(?:sigma|σ|sd)$");
    private static final Set<String> DISTRIBUTIONS = new LinkedHashSet<>(List.of(
            "normal", "truncated_normal", "lognormal", "uniform", "triangular", "measured"));

    DistributionReader(ReadContext ctx) {
        super(ctx);
    }

    DistributionSpec scalarSpec(Scalar s, String path, Rule rule) {
        String t = text(s, path);
        Matcher pm = PLUS_MINUS.matcher(t);
        if (!pm.find()) {
            return new DistributionSpec.Fixed(number(s, path, rule));
        }
        String left = t.substring(0, pm.start()).strip();
        String right = t.substring(pm.end()).strip();
        Matcher at = AT.matcher(right);
        if (!at.matches()) {
            throw err(s, path, "'" + t + "' is ambiguous: say what the ± means, as '" + t
                    + " at 3 sigma' (three standard deviations) or '" + t + " at 95 %' (coverage probability)");
        }
        double mean;
        double half;
        try {
            mean = Units.toCanonical(left, rule.q());
            half = Units.toCanonical(at.group(1), rule.q());
        } catch (IllegalArgumentException e) {
            throw err(s, path, e.getMessage());
        }
        if (Double.isInfinite(mean) || Double.isInfinite(half)) {
            throw err(s, path, "nominal and ± must be finite");
        }
        String bad = rule.violation(mean);
        if (bad != null) {
            throw err(s, path, "nominal " + bad + ", got " + show(rule, mean));
        }
        if (!(half > 0)) {
            throw err(s, path, "the ± half-width must be > 0, got " + show(rule, half));
        }
        if (rule.range().nonNegative() && half > mean) {
            throw err(s, path, "the ± half-width (" + at.group(1).strip() + ") is larger than the nominal value ("
                    + left + "); check the units");
        }
        String level = at.group(2).strip();
        Matcher sm = SIGMAS.matcher(level);
        double sigma;
        if (sm.matches()) {
            double k = parseOr(sm.group(1));
            if (!(k > 0) || Double.isInfinite(k)) {
                throw err(s, path, "the number of sigmas after 'at' must be > 0, got '" + level + "'");
            }
            sigma = half / k;
        } else if (level.endsWith("%")) {
            double p = parseOr(level.substring(0, level.length() - 1).strip());
            if (!(p > 0 && p < 100)) {
                throw err(s, path, "the coverage probability after 'at' must lie between 0 % and 100 %, got '" + level + "'");
            }
            // two-sided coverage p: half-width = z_{(1+p)/2} sigma
            sigma = half / new NormalDistribution(null, 0, 1).inverseCumulativeProbability(0.5 + p / 200);
        } else {
            throw err(s, path, "after 'at' give a number of sigmas ('3 sigma') or a coverage probability ('95 %'), got '"
                    + level + "'");
        }
        return new DistributionSpec.Normal(mean, sigma);
    }

    DistributionSpec distribution(Mapping m, String path, Rule rule) {
        if (m.entries().size() != 1) {
            if (m.entries().isEmpty()) {
                throw err(m, path, "empty distribution; use one of " + String.join(", ", DISTRIBUTIONS));
            }
            List<String> given = new ArrayList<>(m.entries().keySet());
            YamlNode.Key second = m.entries().get(given.get(1)).key();
            throw StudyException.at(new SourceLocation(file, second.line(), second.column(), child(path, given.get(1))),
                    "give exactly one distribution, found " + given.get(0) + " and " + given.get(1));
        }
        YamlNode.Entry e = m.entries().values().iterator().next();
        String kind = e.key().name();
        if (!DISTRIBUTIONS.contains(kind)) {
            throw StudyException.at(new SourceLocation(file, e.key().line(), e.key().column(), child(path, kind)),
                    "unknown distribution '" + kind + "'" + Suggestions.didYouMean(kind, DISTRIBUTIONS)
                            + (Suggestions.nearest(kind, DISTRIBUTIONS) == null ? "; use one of " + String.join(", ", DISTRIBUTIONS) : ""));
        }
        String p = child(path, kind);
        YamlNode body = e.value();
        Quantity q = rule.q();
        return switch (kind) {
            case "normal" -> normal(body, p, rule);
            case "truncated_normal" -> truncatedNormal(body, p, rule);
            case "lognormal" -> lognormal(body, p, rule);
            case "uniform" -> uniform(body, p, rule);
            case "triangular" -> triangular(body, p, rule);
            default -> measured(body, p, rule);
        };
    }

    private DistributionSpec normal(YamlNode body, String p, Rule rule) {
        Quantity q = rule.q();
        Mapping b = mapping(body, p, keys("mean", "sigma"));
        double mean = bounded(req(b, p, "mean"), child(p, "mean"), rule, "mean");
        YamlNode sn = req(b, p, "sigma");
        double sigma = positive(sn, child(p, "sigma"), q, "sigma");
        if (rule.range().nonNegative() && sigma > mean) {
            throw err(sn, child(p, "sigma"), "sigma (" + text(sn, child(p, "sigma")) + ") is larger than the mean ("
                    + text(b.get("mean"), child(p, "mean")) + "); check the units");
        }
        return new DistributionSpec.Normal(mean, sigma);
    }

    private DistributionSpec truncatedNormal(YamlNode body, String p, Rule rule) {
        Quantity q = rule.q();
        Mapping b = mapping(body, p, keys("mean", "sigma", "lower", "upper"));
        double mean = bounded(req(b, p, "mean"), child(p, "mean"), rule, "mean");
        double sigma = positive(req(b, p, "sigma"), child(p, "sigma"), q, "sigma");
        YamlNode lo = opt(b, "lower");
        YamlNode hi = opt(b, "upper");
        if (lo == null && hi == null) {
            throw err(b, p, "give lower, upper or both (a truncated normal without bounds is a normal)");
        }
        // a truncation bound is not a value the distribution takes: it may sit on a strict limit (upper: 100 %)
        Range r = rule.range();
        Rule bounds = new Rule(rule.id(), q, new Range(q, r.lower(), false, r.upper(), false, false));
        double lower = lo == null ? Double.NEGATIVE_INFINITY : bounded(lo, child(p, "lower"), bounds, "lower");
        double upper = hi == null ? Double.POSITIVE_INFINITY : bounded(hi, child(p, "upper"), bounds, "upper");
        if (!(upper > lower)) {
            throw err(hi, child(p, "upper"), "upper (" + q.show(upper) + ") must be above lower (" + q.show(lower) + ")");
        }
        if (mean < lower || mean > upper) {
            throw err(b.get("mean"), child(p, "mean"), "mean " + q.show(mean) + " lies outside the truncation "
                    + q.show(lower) + " to " + q.show(upper));
        }
        return new DistributionSpec.TruncatedNormal(mean, sigma, lower, upper);
    }

    private DistributionSpec lognormal(YamlNode body, String p, Rule rule) {
        Quantity q = rule.q();
        Mapping b = mapping(body, p, keys("median", "cv"));
        YamlNode mn = req(b, p, "median");
        double median = bounded(mn, child(p, "median"), rule, "median");
        if (!(median > 0)) {
            throw err(mn, child(p, "median"), "a lognormal median must be > 0, got " + q.show(median));
        }
        YamlNode cvn = req(b, p, "cv");
        double cv = number(cvn, child(p, "cv"), Rule.of("cv", Quantity.FRACTION));
        if (!(cv > 0)) {
            throw err(cvn, child(p, "cv"), "cv must be > 0, got " + Quantity.FRACTION.show(cv));
        }
        return new DistributionSpec.LogNormal(median, cv);
    }

    private DistributionSpec uniform(YamlNode body, String p, Rule rule) {
        Quantity q = rule.q();
        Mapping b = mapping(body, p, keys("lower", "upper"));
        double lower = bounded(req(b, p, "lower"), child(p, "lower"), rule, "lower");
        YamlNode hi = req(b, p, "upper");
        double upper = bounded(hi, child(p, "upper"), rule, "upper");
        if (!(upper > lower)) {
            throw err(hi, child(p, "upper"), "upper (" + q.show(upper) + ") must be above lower (" + q.show(lower) + ")");
        }
        return new DistributionSpec.Uniform(lower, upper);
    }

    private DistributionSpec triangular(YamlNode body, String p, Rule rule) {
        Quantity q = rule.q();
        Mapping b = mapping(body, p, keys("lower", "mode", "upper"));
        double lower = bounded(req(b, p, "lower"), child(p, "lower"), rule, "lower");
        YamlNode mo = req(b, p, "mode");
        double mode = bounded(mo, child(p, "mode"), rule, "mode");
        YamlNode hi = req(b, p, "upper");
        double upper = bounded(hi, child(p, "upper"), rule, "upper");
        if (!(upper > lower)) {
            throw err(hi, child(p, "upper"), "upper (" + q.show(upper) + ") must be above lower (" + q.show(lower) + ")");
        }
        if (mode < lower || mode > upper) {
            throw err(mo, child(p, "mode"), "mode " + q.show(mode) + " must lie between lower and upper ("
                    + q.show(lower) + " to " + q.show(upper) + ")");
        }
        return new DistributionSpec.Triangular(lower, mode, upper);
    }

    /** A value of the parameter's quantity inside a distribution, checked against the parameter's range. */
    private double bounded(YamlNode n, String path, Rule rule, String what) {
        double v = canonical(n, path, rule.q());
        if (Double.isInfinite(v)) {
            throw err(n, path, what + " must be finite");
        }
        String bad = rule.violation(v);
        if (bad != null) {
            throw err(n, path, what + " " + bad + ", got " + show(rule, v));
        }
        return v;
    }

    private double positive(YamlNode n, String path, Quantity q, String what) {
        double v = canonical(n, path, q);
        if (!(v > 0) || Double.isInfinite(v)) {
            throw err(n, path, what + " must be > 0, got " + q.show(v));
        }
        return v;
    }

    /** Measured values from a CSV column, converted from the column's unit and checked against the rule. */
    private DistributionSpec measured(YamlNode body, String p, Rule rule) {
        Mapping b = mapping(body, p, keys("file", "column", "unit", "smooth"));
        YamlNode fn = req(b, p, "file");
        Path csv = existing(fn, child(p, "file"));
        YamlNode cn = req(b, p, "column");
        String column = text(cn, child(p, "column"));
        YamlNode un = opt(b, "unit");
        Quantity q = rule.q();
        String unit = un == null ? (q.acceptsBareNumber() ? "" : q.canonical()) : text(un, child(p, "unit"));
        double factor;
        try {
            factor = Units.toCanonical("1 " + unit, q);
        } catch (IllegalArgumentException e) {
            throw err(un, child(p, "unit"), "'" + unit + "' is not a unit of " + q.noun() + "; use " + q.unitList());
        }
        YamlNode sm = opt(b, "smooth");
        boolean smooth = sm != null && bool(sm, child(p, "smooth"));
        MeasuredValues.Column col;
        try {
            col = MeasuredValues.read(csv, column);
        } catch (StudyException e) {
            throw err(cn, child(p, "column"), e.getMessage());
        }
        double[] v = col.values();
        for (int i = 0; i < v.length; i++) {
            v[i] *= factor;
            String bad = rule.violation(v[i]);
            if (bad != null) {
                throw err(fn, child(p, "file"), csv.getFileName() + ":" + col.lines()[i] + ": column '" + column
                        + "': measured value " + bad + ", got " + q.show(v[i]));
            }
        }
        return new DistributionSpec.Empirical(v, smooth, csv.getFileName() + ":" + column);
    }
}
