package org.fabspread.study;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Scalar;
import org.fabspread.study.YamlNode.Sequence;

/**
 * The common ground of the section readers: typed access to YAML nodes, unit conversion, range
 * rules and the one-line error {@code file:line:col: key.path: what is wrong}. Each section of the
 * study file has its own subclass.
 */
abstract class SectionReader {

    final ReadContext ctx;
    final Path file;

    SectionReader(ReadContext ctx) {
        this.ctx = ctx;
        this.file = ctx.file();
    }

    // ------------------------------------------------------------------ helpers

    SourceLocation loc(YamlNode n, String path) {
        return new SourceLocation(file, n.line(), n.column(), path);
    }

    StudyException err(YamlNode n, String path, String message) {
        return StudyException.at(loc(n, path), message);
    }

    static String child(String path, String key) {
        return path.isEmpty() ? key : path + "." + key;
    }

    /** The node as a mapping whose keys are all in {@code allowed}. */
    Mapping mapping(YamlNode n, String path, Set<String> allowed) {
        if (!(n instanceof Mapping m)) {
            throw err(n, path, "expected a section of key: value pairs, got " + n.kindName());
        }
        for (YamlNode.Entry e : m.entries().values()) {
            String k = e.key().name();
            if (!allowed.contains(k)) {
                throw StudyException.at(new SourceLocation(file, e.key().line(), e.key().column(), child(path, k)),
                        "unknown key '" + k + "'" + Suggestions.didYouMean(k, allowed)
                                + (Suggestions.nearest(k, allowed) == null ? "; allowed keys: " + String.join(", ", allowed) : ""));
            }
        }
        return m;
    }

    static Set<String> keys(String... k) {
        return new LinkedHashSet<>(List.of(k));
    }

    YamlNode opt(Mapping m, String key) {
        YamlNode n = m.get(key);
        return n instanceof Scalar s && s.isNull() ? null : n;
    }

    YamlNode req(Mapping m, String path, String key) {
        YamlNode n = opt(m, key);
        if (n == null) {
            YamlNode at = m.get(key) == null ? m : m.get(key);
            throw err(at, child(path, key), m.get(key) == null ? "required key is missing" : "needs a value");
        }
        return n;
    }

    String text(YamlNode n, String path) {
        if (!(n instanceof Scalar s) || s.isNull()) {
            throw err(n, path, "expected a single value, got " + n.kindName());
        }
        return s.text().strip();
    }

    Sequence list(YamlNode n, String path) {
        if (!(n instanceof Sequence s)) {
            throw err(n, path, "expected a list, got " + n.kindName());
        }
        return s;
    }

    String word(YamlNode n, String path, List<String> allowed) {
        String t = text(n, path);
        if (!allowed.contains(t)) {
            throw err(n, path, "'" + t + "' is not one of " + String.join(", ", allowed)
                    + Suggestions.didYouMean(t, allowed));
        }
        return t;
    }

    boolean bool(YamlNode n, String path) {
        if (!(n instanceof Scalar s) || s.type() != Scalar.Type.BOOLEAN) {
            throw err(n, path, "expected true or false, got " + (n instanceof Scalar s2 ? "'" + s2.text() + "'" : n.kindName()));
        }
        return Boolean.parseBoolean(s.text().toLowerCase(Locale.ROOT));
    }

    long integer(YamlNode n, String path, long min) {
        String t = text(n, path);
        double v;
        try {
            v = Double.parseDouble(t);
        } catch (NumberFormatException e) {
            throw err(n, path, "expected a whole number, got '" + t + "'");
        }
        if (v != Math.rint(v) || Math.abs(v) > 9e15) {
            throw err(n, path, "expected a whole number, got '" + t + "'");
        }
        if (v < min) {
            throw err(n, path, "must be at least " + min + ", got " + t);
        }
        return (long) v;
    }

    /** A whole number in [min, max]; above max the message says why the limit exists ({@code why}). */
    long integer(YamlNode n, String path, long min, long max, String why) {
        long v = integer(n, path, min);
        if (v > max) {
            throw err(n, path, "at most " + max + " (" + why + "), got " + text(n, path));
        }
        return v;
    }

    /** A single value converted to canonical units of {@code q}; a unit error names the node. */
    double canonical(YamlNode n, String path, Quantity q) {
        String t = text(n, path);
        try {
            return Units.toCanonical(t, q);
        } catch (IllegalArgumentException e) {
            throw err(n, path, e.getMessage());
        }
    }

    /** A plain number of a quantity, converted to canonical units and checked against a rule. */
    double number(YamlNode n, String path, Rule rule) {
        double v = canonical(n, path, rule.q());
        String bad = rule.violation(v);
        if (bad != null) {
            throw err(n, path, bad + ", got " + show(rule, v));
        }
        return v;
    }

    /**
     * A finite value in canonical units of {@code q}; a unit error is prefixed with {@code context},
     * a non-finite value reported as {@code notFinite}.
     */
    double finite(String text, Quantity q, YamlNode n, String path, String context, String notFinite) {
        double v;
        try {
            v = Units.toCanonical(text, q);
        } catch (IllegalArgumentException e) {
            throw err(n, path, context + ": " + e.getMessage());
        }
        if (!Double.isFinite(v)) {
            throw err(n, path, notFinite);
        }
        return v;
    }

    static String show(Rule r, double v) {
        return r.q().show(v);
    }

    static double parseOr(String t) {
        try {
            return Double.parseDouble(t);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

    static String enumName(String word) {
        return word.toUpperCase(Locale.ROOT).replace('-', '_');
    }

    /**
     * A data file named relative to the study's folder that must exist, be a regular file and lie in
     * that folder or below it (after resolving links), unless the options allow outside files.
     */
    Path existing(YamlNode n, String path) {
        String name = text(n, path);
        Path p;
        try {
            p = ctx.dir().resolve(name).normalize();
        } catch (java.nio.file.InvalidPathException e) {
            throw err(n, path, "'" + name + "' is not a file name");
        }
        if (!Files.isRegularFile(p)) {
            throw err(n, path, "file not found: " + name + " (names are relative to the study file's folder)");
        }
        if (!ctx.options().allowOutsideFiles() && !inside(p)) {
            throw err(n, path, "'" + name + "' lies outside the study's folder; a study reads its data files from"
                    + " its own folder and below (run with --allow-outside-files to allow others)");
        }
        return p;
    }

    private boolean inside(Path p) {
        try {
            return p.toRealPath().startsWith(ctx.dir().toRealPath());
        } catch (java.io.IOException e) {
            return false;
        }
    }

    // ------------------------------------------------------------------ parameters

    /**
     * A number of the study: fixed, "x ± d at ...", or a distribution section; refused when the
     * distribution can reach values outside the parameter's physical range (see {@link Reach}).
     */
    Parameter param(YamlNode n, String path, Rule rule) {
        DistributionSpec spec;
        if (n instanceof Mapping m) {
            spec = new DistributionReader(ctx).distribution(m, path, rule);
        } else if (n instanceof Sequence) {
            throw err(n, path, "expected a number or a distribution, got a list");
        } else {
            spec = new DistributionReader(ctx).scalarSpec((Scalar) n, path, rule);
        }
        Parameter p = new Parameter(rule.id(), rule.q().canonical(), spec, loc(n, path), rule.range(),
                DisplayUnit.asWritten(writtenUnit(n), rule.q(), spec.nominal()));
        String outside = Reach.outside(p, spec, "");
        if (outside != null) {
            throw err(n, path, outside);
        }
        return p;
    }

    /** The first value with a unit written under a parameter's node ("1.1 mm", "6 %"), or null. */
    private static String writtenUnit(YamlNode n) {
        if (n instanceof Scalar s) {
            String t = s.text().strip();
            java.util.regex.Matcher pm = DistributionReader.PLUS_MINUS.matcher(t);
            String first = pm.find() ? t.substring(0, pm.start()) : t;
            Units.Reading r = Units.split(first);
            return r != null && !r.unit().isEmpty() ? first : null;
        }
        if (n instanceof Mapping m) {
            YamlNode unit = m.get("unit");
            if (unit instanceof Scalar u && !u.isNull()) {
                return "1 " + u.text().strip();
            }
            for (YamlNode.Entry e : m.entries().values()) {
                String w = writtenUnit(e.value());
                if (w != null) {
                    return w;
                }
            }
        }
        return null;
    }

    /** The parameter under a required key. */
    Parameter param(Mapping m, String path, String key, Rule rule) {
        return param(req(m, path, key), child(path, key), rule);
    }

    /** The parameter or, when the key is absent, its fixed default. */
    Parameter param(Mapping m, String path, String key, Rule rule, double dflt) {
        YamlNode n = opt(m, key);
        if (n != null) {
            return param(n, child(path, key), rule);
        }
        return new Parameter(rule.id(), rule.q().canonical(), new DistributionSpec.Fixed(dflt),
                SourceLocation.unknown(rule.id()), rule.range(), DisplayUnit.tradeUnit(rule.q(), dflt));
    }

    Quantity outputQuantity(String output, YamlNode n, String path, boolean hasDiode) {
        Quantity q = OutputCatalog.quantity(output);
        if (q == null) {
            List<String> all = new ArrayList<>(OutputCatalog.ids());
            all.addAll(OutputCatalog.lossIds());
            String hint = Suggestions.didYouMean(output, all);
            throw err(n, path, "unknown output '" + output + "'" + (!hint.isEmpty() ? hint
                    : "; outputs: " + String.join(", ", OutputCatalog.ids()) + ", loss_<cause>"
                    + (output.startsWith("loss_") ? " (causes: " + String.join(", ", OutputCatalog.lossIds()).replace("loss_", "") + ")" : "")));
        }
        if (OutputCatalog.needsDiode(output) && !hasDiode) {
            throw err(n, path, "output '" + output + "' needs the diode section");
        }
        return q;
    }

    // ------------------------------------------------------------------ sections that name inputs

    Parameter input(YamlNode n, String path, String id, Map<String, Parameter> params) {
        Parameter p = params.get(id);
        if (p == null) {
            List<String> uncertain = uncertainIds(params);
            String hint = Suggestions.didYouMean(id, uncertain);
            throw err(n, path, "unknown input '" + id + "'" + (!hint.isEmpty() ? hint
                    : uncertain.isEmpty() ? "; the study has no uncertain inputs" : "; uncertain inputs: " + String.join(", ", uncertain)));
        }
        if (!p.isUncertain()) {
            List<String> uncertain = uncertainIds(params);
            throw err(n, path, "'" + id + "' is a fixed number, not an uncertain input"
                    + (uncertain.isEmpty() ? "; the study has no uncertain inputs" : "; uncertain inputs: " + String.join(", ", uncertain)));
        }
        return p;
    }

    static List<String> uncertainIds(Map<String, Parameter> params) {
        List<String> out = new ArrayList<>();
        for (Parameter p : params.values()) {
            if (p.isUncertain()) {
                out.add(p.id());
            }
        }
        return out;
    }
}
