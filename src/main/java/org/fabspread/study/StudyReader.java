package org.fabspread.study;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.apache.commons.math3.distribution.NormalDistribution;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Scalar;
import org.fabspread.study.YamlNode.Sequence;

/**
 * Reads and validates a study file (format v1, YAML; see {@code shared/schema/study.schema.json}).
 * Every problem is reported as one {@link StudyException} line {@code file:line:col: key.path: what is
 * wrong}, pointing at the offending key or value. Reading stops at the first problem.
 */
public final class StudyReader {

    private static final Pattern LAYER_NAME = Pattern.compile("[a-z][a-z0-9_-]*");
    private static final Pattern PLUS_MINUS = Pattern.compile("±|\\+/-|\\+-");
    private static final Pattern AT = Pattern.compile("^(.*?)\\s+at\\s+(.+)$");
    private static final Pattern SIGMAS = Pattern.compile("^([0-9.eE+-]+)\\s*(?:sigma|σ|sd)$");
    private static final Pattern TARGET = Pattern.compile("^\\s*([A-Za-z_][A-Za-z0-9_]*)\\s*(>=|<=|≥|≤|>|<|=)\\s*(.*)$");
    private static final Set<String> DISTRIBUTIONS = new LinkedHashSet<>(List.of(
            "normal", "truncated_normal", "lognormal", "uniform", "triangular", "measured"));

    private final Path file;
    private final Path dir;
    private final MaterialCatalog catalog;
    /** Per layer / metal: material range and where it was named, for the grid check. */
    private final List<MaterialUse> materialUses = new ArrayList<>();

    private record MaterialUse(String material, String usedBy, double[] range) {
    }

    /**
     * Allowed range of a parameter in canonical units.
     */
    private record Rule(String id, Quantity q, double lower, boolean lowerStrict, double upper,
                        boolean upperStrict, boolean infiniteAllowed) {
        static Rule of(String id, Quantity q) {
            return new Rule(id, q, Double.NEGATIVE_INFINITY, false, Double.POSITIVE_INFINITY, false, false);
        }

        Rule above(double lo, boolean strict) {
            return new Rule(id, q, lo, strict, upper, upperStrict, infiniteAllowed);
        }

        Rule below(double hi, boolean strict) {
            return new Rule(id, q, lower, lowerStrict, hi, strict, infiniteAllowed);
        }

        Rule infinite() {
            return new Rule(id, q, lower, lowerStrict, upper, upperStrict, true);
        }

        /** Null when v is allowed, else the reason ("must be > 0 nm"). */
        String violation(double v) {
            if (Double.isNaN(v)) {
                return "must be a number";
            }
            if (Double.isInfinite(v) && !infiniteAllowed) {
                return "must be finite";
            }
            if (lowerStrict ? !(v > lower) : !(v >= lower)) {
                return "must be " + (lowerStrict ? "> " : ">= ") + q.show(lower);
            }
            if (upperStrict ? !(v < upper) : !(v <= upper)) {
                return "must be " + (upperStrict ? "< " : "<= ") + q.show(upper);
            }
            return null;
        }
    }

    private StudyReader(Path file, MaterialCatalog catalog) {
        this.file = file;
        Path parent = file.toAbsolutePath().getParent();
        this.dir = parent == null ? Path.of(".") : parent;
        this.catalog = catalog;
    }

    /** Reads a study with the bundled material tables. */
    public static Study read(Path file) {
        return read(file, MaterialCatalog.bundled());
    }

    /** Reads a study, checking materials against {@code catalog}. */
    public static Study read(Path file, MaterialCatalog catalog) {
        if (!Files.isRegularFile(file)) {
            throw new StudyException(file + ": study file not found");
        }
        return new StudyReader(file, catalog).top(YamlTree.parse(file));
    }

    // ------------------------------------------------------------------ helpers

    private SourceLocation loc(YamlNode n, String path) {
        return new SourceLocation(file, n.line(), n.column(), path);
    }

    private StudyException err(YamlNode n, String path, String message) {
        return StudyException.at(loc(n, path), message);
    }

    private static String child(String path, String key) {
        return path.isEmpty() ? key : path + "." + key;
    }

    /** The node as a mapping whose keys are all in {@code allowed}. */
    private Mapping mapping(YamlNode n, String path, Set<String> allowed) {
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

    private static Set<String> keys(String... k) {
        return new LinkedHashSet<>(List.of(k));
    }

    private YamlNode opt(Mapping m, String key) {
        YamlNode n = m.get(key);
        return n instanceof Scalar s && s.isNull() ? null : n;
    }

    private YamlNode req(Mapping m, String path, String key) {
        YamlNode n = opt(m, key);
        if (n == null) {
            YamlNode at = m.get(key) == null ? m : m.get(key);
            throw err(at, child(path, key), m.get(key) == null ? "required key is missing" : "needs a value");
        }
        return n;
    }

    private String text(YamlNode n, String path) {
        if (!(n instanceof Scalar s) || s.isNull()) {
            throw err(n, path, "expected a single value, got " + n.kindName());
        }
        return s.text().strip();
    }

    private Sequence list(YamlNode n, String path) {
        if (!(n instanceof Sequence s)) {
            throw err(n, path, "expected a list, got " + n.kindName());
        }
        return s;
    }

    private String word(YamlNode n, String path, List<String> allowed) {
        String t = text(n, path);
        if (!allowed.contains(t)) {
            throw err(n, path, "'" + t + "' is not one of " + String.join(", ", allowed)
                    + Suggestions.didYouMean(t, allowed));
        }
        return t;
    }

    private boolean bool(YamlNode n, String path) {
        if (!(n instanceof Scalar s) || s.type() != Scalar.Type.BOOLEAN) {
            throw err(n, path, "expected true or false, got " + (n instanceof Scalar s2 ? "'" + s2.text() + "'" : n.kindName()));
        }
        return Boolean.parseBoolean(s.text().toLowerCase(Locale.ROOT));
    }

    private long integer(YamlNode n, String path, long min) {
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

    /** A single value converted to canonical units of {@code q}; a unit error names the node. */
    private double canonical(YamlNode n, String path, Quantity q) {
        String t = text(n, path);
        try {
            return Units.toCanonical(t, q);
        } catch (IllegalArgumentException e) {
            throw err(n, path, e.getMessage());
        }
    }

    /** A plain number of a quantity, converted to canonical units and checked against a rule. */
    private double number(YamlNode n, String path, Rule rule) {
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
    private double finite(String text, Quantity q, YamlNode n, String path, String context, String notFinite) {
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

    private static String show(Rule r, double v) {
        return r.q().show(v);
    }

    // ------------------------------------------------------------------ parameters

    /** A number of the study: fixed, "x ± d at ...", or a distribution section. */
    private Parameter param(YamlNode n, String path, Rule rule) {
        DistributionSpec spec;
        if (n instanceof Mapping m) {
            spec = distribution(m, path, rule);
        } else if (n instanceof Sequence) {
            throw err(n, path, "expected a number or a distribution, got a list");
        } else {
            spec = scalarSpec((Scalar) n, path, rule);
        }
        return new Parameter(rule.id(), rule.q().canonical(), spec, loc(n, path));
    }

    /** The parameter under a required key. */
    private Parameter param(Mapping m, String path, String key, Rule rule) {
        return param(req(m, path, key), child(path, key), rule);
    }

    /** The parameter or, when the key is absent, its fixed default. */
    private Parameter param(Mapping m, String path, String key, Rule rule, double dflt) {
        YamlNode n = opt(m, key);
        return n == null ? Parameter.fixed(rule.id(), rule.q().canonical(), dflt) : param(n, child(path, key), rule);
    }

    private DistributionSpec scalarSpec(Scalar s, String path, Rule rule) {
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

    private static double parseOr(String t) {
        try {
            return Double.parseDouble(t);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

    private DistributionSpec distribution(Mapping m, String path, Rule rule) {
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
        switch (kind) {
            case "normal": {
                Mapping b = mapping(body, p, keys("mean", "sigma"));
                double mean = bounded(req(b, p, "mean"), child(p, "mean"), rule, "mean");
                double sigma = positive(req(b, p, "sigma"), child(p, "sigma"), q, "sigma");
                return new DistributionSpec.Normal(mean, sigma);
            }
            case "truncated_normal": {
                Mapping b = mapping(body, p, keys("mean", "sigma", "lower", "upper"));
                double mean = bounded(req(b, p, "mean"), child(p, "mean"), rule, "mean");
                double sigma = positive(req(b, p, "sigma"), child(p, "sigma"), q, "sigma");
                YamlNode lo = opt(b, "lower");
                YamlNode hi = opt(b, "upper");
                if (lo == null && hi == null) {
                    throw err(b, p, "give lower, upper or both (a truncated normal without bounds is a normal)");
                }
                double lower = lo == null ? Double.NEGATIVE_INFINITY : bounded(lo, child(p, "lower"), rule, "lower");
                double upper = hi == null ? Double.POSITIVE_INFINITY : bounded(hi, child(p, "upper"), rule, "upper");
                if (!(upper > lower)) {
                    throw err(hi, child(p, "upper"), "upper (" + q.show(upper) + ") must be above lower (" + q.show(lower) + ")");
                }
                if (mean < lower || mean > upper) {
                    throw err(b.get("mean"), child(p, "mean"), "mean " + q.show(mean) + " lies outside the truncation "
                            + q.show(lower) + " to " + q.show(upper));
                }
                return new DistributionSpec.TruncatedNormal(mean, sigma, lower, upper);
            }
            case "lognormal": {
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
            case "uniform": {
                Mapping b = mapping(body, p, keys("lower", "upper"));
                double lower = bounded(req(b, p, "lower"), child(p, "lower"), rule, "lower");
                YamlNode hi = req(b, p, "upper");
                double upper = bounded(hi, child(p, "upper"), rule, "upper");
                if (!(upper > lower)) {
                    throw err(hi, child(p, "upper"), "upper (" + q.show(upper) + ") must be above lower (" + q.show(lower) + ")");
                }
                return new DistributionSpec.Uniform(lower, upper);
            }
            case "triangular": {
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
            default:
                return measured(body, p, rule);
        }
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

    // ------------------------------------------------------------------ the document

    private Study top(YamlNode root) {
        if (!(root instanceof Mapping)) {
            throw err(root, "(top level)", "a study is a section of key: value pairs (name, stack, ...), got " + root.kindName());
        }
        Mapping m = mapping(root, "", keys("name", "description", "wavelengths", "stack", "particles", "collection",
                "diode", "targets", "analysis", "plan", "costs", "correlations"));
        String name = text(req(m, "", "name"), "name");
        if (name.isEmpty()) {
            throw err(m.get("name"), "name", "must not be empty");
        }
        YamlNode dn = opt(m, "description");
        String description = dn == null ? "" : text(dn, "description");
        YamlNode gn = opt(m, "wavelengths");
        WavelengthGrid grid = gn == null ? new WavelengthGrid(320, 800, 4) : grid(gn, "wavelengths");
        List<Layer> stack = stack(req(m, "", "stack"), "stack");
        YamlNode pn = opt(m, "particles");
        ParticleLayer particles = pn == null ? null : particles(pn, "particles", stack);
        ChargeCollection collection = collection(req(m, "", "collection"), "collection", stack);
        YamlNode don = opt(m, "diode");
        Diode diode = don == null ? null : diode(don, "diode");
        if (gn != null) {
            checkGrid(gn, grid);
        } else {
            checkGrid(m, grid);
        }
        YamlNode tn = opt(m, "targets");
        List<Target> targets = tn == null ? List.of() : targets(tn, "targets", diode != null);

        // the inputs are known now: the sections that refer to them come last
        Study draft = new Study(file, name, description, grid, stack, particles, collection, diode, targets,
                null, null, Map.of(), List.of());
        Map<String, Parameter> params = draft.parameters();
        YamlNode an = opt(m, "analysis");
        AnalysisSettings analysis = analysis(an, "analysis", params, targets);
        YamlNode pln = opt(m, "plan");
        PlanSettings plan = plan(pln, "plan", params, diode != null);
        YamlNode cn = opt(m, "costs");
        Map<String, Double> costs = cn == null ? Map.of() : costs(cn, "costs", params);
        YamlNode con = opt(m, "correlations");
        List<Correlation> correlations = con == null ? List.of() : correlations(con, "correlations", params);
        return new Study(file, name, description, grid, stack, particles, collection, diode, targets, analysis, plan,
                costs, correlations);
    }

    private WavelengthGrid grid(YamlNode n, String path) {
        Mapping m = mapping(n, path, keys("from", "to", "step"));
        Rule len = Rule.of("wavelength", Quantity.LENGTH).above(0, true);
        double from = number(req(m, path, "from"), child(path, "from"), len);
        YamlNode toN = req(m, path, "to");
        double to = number(toN, child(path, "to"), len);
        YamlNode stepN = req(m, path, "step");
        String st = text(stepN, child(path, "step"));
        double step;
        try {
            step = Units.toCanonical(st, Quantity.LENGTH);
        } catch (IllegalArgumentException e) {
            throw err(stepN, child(path, "step"), e.getMessage());
        }
        if (!(step > 0) || Double.isInfinite(step)) {
            throw err(stepN, child(path, "step"), "step must be > 0 nm, got " + Quantity.LENGTH.show(step));
        }
        if (!(to > from)) {
            throw err(toN, child(path, "to"), "the grid runs backwards or is empty: to (" + Quantity.LENGTH.show(to)
                    + ") must be above from (" + Quantity.LENGTH.show(from) + ")");
        }
        double steps = (to - from) / step;
        if (Math.abs(steps - Math.rint(steps)) > 1e-9 * Math.max(1, steps)) {
            throw err(stepN, child(path, "step"), "the range " + Units.format(from) + " to " + Units.format(to)
                    + " nm is not a whole number of " + Units.format(step) + " nm steps");
        }
        return new WavelengthGrid(from, to, step);
    }

    private void checkGrid(YamlNode gridNode, WavelengthGrid g) {
        for (MaterialUse u : materialUses) {
            double[] r = u.range();
            boolean low = g.startNm() < r[0];
            boolean high = g.stopNm() > r[1];
            if (low || high) {
                YamlNode at = gridNode;
                String path = "wavelengths";
                if (gridNode instanceof Mapping gm && gm.get(low ? "from" : "to") != null) {
                    at = gm.get(low ? "from" : "to");
                    path = "wavelengths." + (low ? "from" : "to");
                }
                throw err(at, path, "the grid " + Units.format(g.startNm()) + " to " + Units.format(g.stopNm())
                        + " nm leaves the table of material '" + u.material() + "' (" + u.usedBy() + "), tabulated "
                        + Units.format(r[0]) + " to " + Units.format(r[1]) + " nm");
            }
        }
    }

    private List<Layer> stack(YamlNode n, String path) {
        Sequence s = list(n, path);
        if (s.items().isEmpty()) {
            throw err(s, path, "the stack has no layers");
        }
        List<Layer> layers = new ArrayList<>();
        Map<String, Integer> names = new LinkedHashMap<>();
        for (int i = 0; i < s.items().size(); i++) {
            String p = path + "[" + i + "]";
            Mapping m = mapping(s.items().get(i), p, keys("name", "material", "thickness", "role", "incoherent",
                    "n_shift", "k_scale"));
            YamlNode nn = req(m, p, "name");
            String name = text(nn, child(p, "name"));
            if (!LAYER_NAME.matcher(name).matches()) {
                throw err(nn, child(p, "name"), "layer name '" + name
                        + "' must start with a lower-case letter and use only a-z, 0-9, _ and -");
            }
            if (names.containsKey(name)) {
                throw err(nn, child(p, "name"), "duplicate layer name '" + name + "' (also stack[" + names.get(name) + "])");
            }
            names.put(name, i);
            String idBase = "stack." + name + ".";
            YamlNode matN = req(m, p, "material");
            MaterialRef mat = material(matN, child(p, "material"), "layer '" + name + "'");
            Parameter thickness = param(m, p, "thickness",
                    Rule.of(idBase + "thickness", Quantity.LENGTH).above(0, true));
            YamlNode rn = opt(m, "role");
            LayerRole role = rn == null ? LayerRole.OTHER : LayerRole.valueOf(word(rn, child(p, "role"),
                    List.of("substrate", "electrode", "electron-transport", "hole-transport", "absorber", "other"))
                    .toUpperCase(Locale.ROOT).replace('-', '_'));
            YamlNode inc = opt(m, "incoherent");
            boolean incoherent = inc != null && bool(inc, child(p, "incoherent"));
            if (incoherent && i > 0) {
                boolean earlier = layers.stream().anyMatch(Layer::incoherent);
                throw err(inc, child(p, "incoherent"), earlier
                        ? "only one layer may be incoherent (the first, usually the glass)"
                        : "only the first layer may be incoherent (light meets the thick substrate first)");
            }
            Parameter nShift = param(m, p, "n_shift", Rule.of(idBase + "n_shift", Quantity.DIMENSIONLESS), 0);
            Parameter kScale = param(m, p, "k_scale", Rule.of(idBase + "k_scale", Quantity.DIMENSIONLESS).above(0, false), 1);
            layers.add(new Layer(name, mat, thickness, incoherent, role, nShift, kScale));
        }
        if (layers.stream().noneMatch(Layer::isAbsorber)) {
            throw err(s, path, "no layer has role: absorber; mark the photoactive layer");
        }
        if (layers.size() == 1 && layers.get(0).incoherent()) {
            throw err(s, path, "the stack needs thin layers after the incoherent substrate");
        }
        return layers;
    }

    private MaterialRef material(YamlNode n, String path, String usedBy) {
        if (n instanceof Mapping) {
            Mapping m = mapping(n, path, keys("file"));
            YamlNode fn = req(m, path, "file");
            String fp = child(path, "file");
            Path csv = existing(fn, fp);
            String id = csv.getFileName().toString().replaceFirst("\\.[^.]*$", "");
            double[] range;
            try {
                range = catalog.rangeOfFile(csv);
            } catch (StudyException e) {
                throw err(fn, fp, e.getMessage());
            }
            materialUses.add(new MaterialUse(id, usedBy, range));
            return new MaterialRef(id, csv);
        }
        String id = text(n, path);
        if (!catalog.has(id)) {
            List<String> close = Suggestions.close(id, catalog.ids(), 4);
            throw err(n, path, "unknown material '" + id + "'; " + (close.isEmpty()
                    ? "bundled materials: " + String.join(", ", catalog.ids())
                    : "close matches: " + String.join(", ", close)) + " (or give {file: table.csv})");
        }
        materialUses.add(new MaterialUse(id, usedBy, catalog.range(id)));
        return MaterialRef.bundled(id);
    }

    /** A file named relative to the study's folder that must exist. */
    private Path existing(YamlNode n, String path) {
        String name = text(n, path);
        Path p = dir.resolve(name).normalize();
        if (!Files.isRegularFile(p)) {
            throw err(n, path, "file not found: " + name + " (names are relative to the study file's folder)");
        }
        return p;
    }

    private ParticleLayer particles(YamlNode n, String path, List<Layer> stack) {
        Mapping m = mapping(n, path, keys("metal", "host", "placement", "diameter", "semi_axes", "size_spread",
                "in_plane_aspect", "out_of_plane_aspect", "coverage", "forward_fraction", "orientation", "mixing",
                "metal_parameters", "enhancement_table"));
        YamlNode metalN = req(m, path, "metal");
        MaterialRef metal = material(metalN, child(path, "metal"), "particles");
        YamlNode hn = req(m, path, "host");
        String host = text(hn, child(path, "host"));
        Layer hostLayer = null;
        List<String> names = new ArrayList<>();
        for (Layer l : stack) {
            names.add(l.name());
            if (l.name().equals(host)) {
                hostLayer = l;
            }
        }
        if (hostLayer == null) {
            throw err(hn, child(path, "host"), "no layer named '" + host + "' in the stack"
                    + Suggestions.didYouMean(host, names) + " (layers: " + String.join(", ", names) + ")");
        }
        if (hostLayer.incoherent()) {
            throw err(hn, child(path, "host"), "particles cannot sit in the incoherent layer '" + host
                    + "'; put them in a thin (coherent) layer");
        }
        YamlNode pl = req(m, path, "placement");
        String plp = child(path, "placement");
        ParticleLayer.Placement placement;
        Parameter offset;
        String pt = pl instanceof Scalar ps ? ps.text().strip() : null;
        if ("front".equals(pt) || "back".equals(pt)) {
            placement = "front".equals(pt) ? ParticleLayer.Placement.FRONT : ParticleLayer.Placement.BACK;
            offset = Parameter.fixed("particles.offset", "nm", 0);
        } else {
            if (pt != null && Units.split(pt) == null && !PLUS_MINUS.matcher(pt).find()) {
                throw err(pl, plp, "placement must be front, back or a distance from the host's front face such as '5 nm', got '"
                        + pt + "'" + Suggestions.didYouMean(pt, List.of("front", "back")));
            }
            placement = ParticleLayer.Placement.OFFSET;
            offset = param(pl, plp, Rule.of("particles.offset", Quantity.LENGTH).above(0, false));
        }

        Parameter diameter;
        Parameter inPlane;
        Parameter outOfPlane;
        YamlNode axes = opt(m, "semi_axes");
        if (axes != null) {
            for (String k : List.of("diameter", "in_plane_aspect", "out_of_plane_aspect")) {
                if (opt(m, k) != null) {
                    YamlNode.Key key = m.entries().get(k).key();
                    throw StudyException.at(new SourceLocation(file, key.line(), key.column(), child(path, k)),
                            "give either semi_axes or diameter and aspect ratios, not both");
                }
            }
            String ap = child(path, "semi_axes");
            Sequence s = list(axes, ap);
            if (s.items().size() != 3) {
                throw err(s, ap, "give three semi-axes [a, b, c] (a, b in the film plane, c normal to it), got "
                        + s.items().size());
            }
            double[] v = new double[3];
            for (int i = 0; i < 3; i++) {
                v[i] = number(s.items().get(i), ap + "[" + i + "]", Rule.of("semi-axis", Quantity.LENGTH).above(0, true));
            }
            if (v[0] < v[1]) {
                throw err(s, ap, "list the in-plane semi-axes longest first: a (" + Units.format(v[0])
                        + " nm) must be >= b (" + Units.format(v[1]) + " nm)");
            }
            // volume-equivalent diameter D = 2 (abc)^(1/3); p = a/b; q = c/a (see ParticleLayer)
            SourceLocation where = loc(s, ap);
            diameter = new Parameter("particles.diameter", "nm",
                    new DistributionSpec.Fixed(2 * Math.cbrt(v[0] * v[1] * v[2])), where);
            inPlane = new Parameter("particles.in_plane_aspect", "1", new DistributionSpec.Fixed(v[0] / v[1]), where);
            outOfPlane = new Parameter("particles.out_of_plane_aspect", "1", new DistributionSpec.Fixed(v[2] / v[0]), where);
        } else {
            diameter = param(m, path, "diameter",
                    Rule.of("particles.diameter", Quantity.LENGTH).above(0, true));
            inPlane = param(m, path, "in_plane_aspect",
                    Rule.of("particles.in_plane_aspect", Quantity.DIMENSIONLESS).above(1, false), 1);
            outOfPlane = param(m, path, "out_of_plane_aspect",
                    Rule.of("particles.out_of_plane_aspect", Quantity.DIMENSIONLESS).above(0, true), 1);
        }
        Parameter sizeCv = param(m, path, "size_spread",
                Rule.of("particles.size_cv", Quantity.FRACTION).above(0, false).below(1, true), 0);
        Parameter coverage = param(m, path, "coverage",
                Rule.of("particles.coverage", Quantity.FRACTION).above(0, false).below(1, true));
        Parameter forward = param(m, path, "forward_fraction",
                Rule.of("particles.forward_fraction", Quantity.FRACTION).above(0, false).below(1, false), 0.5);
        YamlNode on = opt(m, "orientation");
        boolean aligned = on == null || word(on, child(path, "orientation"), List.of("aligned", "random")).equals("aligned");
        YamlNode mx = opt(m, "mixing");
        ParticleLayer.MixingRule mixing = mx == null || word(mx, child(path, "mixing"),
                List.of("maxwell-garnett", "bruggeman")).equals("maxwell-garnett")
                ? ParticleLayer.MixingRule.MAXWELL_GARNETT : ParticleLayer.MixingRule.BRUGGEMAN;
        MetalParameters mp = metalParameters(m, path, metal, metalN);
        YamlNode et = opt(m, "enhancement_table");
        Path table = et == null ? null : existing(et, child(path, "enhancement_table"));

        // the particle layer's thickness is the median particle's height 2c = D p^(1/3) q^(2/3) (see ParticleLayer)
        double height = diameter.nominal() * Math.cbrt(inPlane.nominal()) * Math.pow(outOfPlane.nominal(), 2.0 / 3);
        double hostT = hostLayer.thickness().nominal();
        double needed = height + (placement == ParticleLayer.Placement.OFFSET ? offset.nominal() : 0);
        if (needed > hostT) {
            YamlNode at = axes != null ? axes : m.get("diameter");
            String ap = axes != null ? child(path, "semi_axes") : child(path, "diameter");
            throw err(at, ap, "the particle layer (" + Units.format(height) + " nm high"
                    + (placement == ParticleLayer.Placement.OFFSET ? ", starting " + Units.format(offset.nominal()) + " nm in" : "")
                    + ") does not fit in its host layer '" + host + "' (" + Units.format(hostT) + " nm)");
        }
        return new ParticleLayer(metal, host, placement, offset, diameter, sizeCv, inPlane, outOfPlane, coverage,
                forward, aligned, mixing, mp, table);
    }

    /**
     * Free-electron parameters; defaults for silver and gold: plasma energy 9.01 / 9.03 eV, bulk
     * damping 0.018 / 0.027 eV (Ordal et al., Appl. Opt. 24, 4493 (1985)), Fermi velocity
     * 1.39e6 / 1.40e6 m/s (Kittel, Introduction to Solid State Physics), A_s = 1.
     */
    private MetalParameters metalParameters(Mapping particles, String path, MaterialRef metal, YamlNode metalN) {
        String p = child(path, "metal_parameters");
        YamlNode n = opt(particles, "metal_parameters");
        Mapping m = n == null ? null : mapping(n, p, keys("plasma_energy", "bulk_damping", "fermi_velocity",
                "surface_scattering"));
        double[] d = null;
        String id = metal.id().toLowerCase(Locale.ROOT);
        if (metal.isBundled() && id.startsWith("ag-")) {
            d = new double[] {9.01, 0.018, 1.39e6};
        } else if (metal.isBundled() && id.startsWith("au-")) {
            d = new double[] {9.03, 0.027, 1.40e6};
        }
        String[] keys = {"plasma_energy", "bulk_damping", "fermi_velocity"};
        Quantity[] qs = {Quantity.ENERGY, Quantity.ENERGY, Quantity.SPEED};
        Parameter[] out = new Parameter[3];
        for (int i = 0; i < 3; i++) {
            Rule r = Rule.of("particles." + keys[i], qs[i]).above(0, true);
            YamlNode v = m == null ? null : opt(m, keys[i]);
            if (v != null) {
                out[i] = param(v, child(p, keys[i]), r);
            } else if (d != null) {
                out[i] = Parameter.fixed(r.id(), qs[i].canonical(), d[i]);
            } else {
                throw err(m == null ? metalN : m, m == null ? child(path, "metal") : child(p, keys[i]),
                        "no default free-electron parameters for metal '" + metal.id()
                                + "' (known for silver and gold); give metal_parameters with plasma_energy, bulk_damping and fermi_velocity");
            }
        }
        Parameter as = m == null ? Parameter.fixed("particles.surface_scattering", "1", 1)
                : param(m, p, "surface_scattering", Rule.of("particles.surface_scattering", Quantity.DIMENSIONLESS)
                .above(0, false), 1);
        return new MetalParameters(out[0], out[1], out[2], as);
    }

    private ChargeCollection collection(YamlNode n, String path, List<Layer> stack) {
        Mapping m = mapping(n, path, keys("dissociation", "electron_mu_tau", "hole_mu_tau", "built_in_voltage",
                "quenching_distance", "electrons_collected_at"));
        Parameter diss = param(m, path, "dissociation",
                Rule.of("collection.dissociation", Quantity.FRACTION).above(0, true).below(1, false), 1);
        Parameter emt = param(m, path, "electron_mu_tau",
                Rule.of("collection.electron_mu_tau", Quantity.MU_TAU).above(0, true));
        Parameter hmt = param(m, path, "hole_mu_tau",
                Rule.of("collection.hole_mu_tau", Quantity.MU_TAU).above(0, true));
        Parameter vbi = param(m, path, "built_in_voltage",
                Rule.of("collection.built_in_voltage", Quantity.VOLTAGE).above(0, true));
        Parameter quench = param(m, path, "quenching_distance",
                Rule.of("collection.quenching_distance", Quantity.LENGTH).above(0, false), 0);
        YamlNode en = opt(m, "electrons_collected_at");
        boolean front;
        if (en != null) {
            front = word(en, child(path, "electrons_collected_at"), List.of("front", "back")).equals("front");
        } else {
            Boolean inferred = electronsAtFront(stack);
            if (inferred == null) {
                throw err(m, child(path, "electrons_collected_at"),
                        "cannot tell the cell's orientation from the stack roles; give electrons_collected_at: front or back");
            }
            front = inferred;
        }
        return new ChargeCollection(diss, emt, hmt, vbi, quench, front);
    }

    /**
     * Orientation from the roles: an electron-transport layer before the first absorber, or a
     * hole-transport layer after it, means the electrons leave at the front (inverted cell).
     */
    private static Boolean electronsAtFront(List<Layer> stack) {
        int absorber = -1;
        for (int i = 0; i < stack.size(); i++) {
            if (stack.get(i).isAbsorber()) {
                absorber = i;
                break;
            }
        }
        Boolean etlFront = null;
        for (int i = 0; i < stack.size(); i++) {
            LayerRole r = stack.get(i).role();
            if (r == LayerRole.ELECTRON_TRANSPORT) {
                etlFront = i < absorber;
                break;
            }
            if (r == LayerRole.HOLE_TRANSPORT) {
                etlFront = i > absorber;
                break;
            }
        }
        return etlFront;
    }

    private Diode diode(YamlNode n, String path) {
        Mapping m = mapping(n, path, keys("saturation_current", "ideality", "series_resistance", "shunt_resistance",
                "temperature"));
        Parameter j0 = param(m, path, "saturation_current",
                Rule.of("diode.saturation_current", Quantity.CURRENT_DENSITY).above(0, true));
        Parameter nid = param(m, path, "ideality",
                Rule.of("diode.ideality", Quantity.DIMENSIONLESS).above(0, true));
        Parameter rs = param(m, path, "series_resistance",
                Rule.of("diode.series_resistance", Quantity.AREA_RESISTANCE).above(0, false), 0);
        Parameter rsh = param(m, path, "shunt_resistance",
                Rule.of("diode.shunt_resistance", Quantity.AREA_RESISTANCE).above(0, true).infinite(),
                Double.POSITIVE_INFINITY);
        Parameter temp = param(m, path, "temperature",
                Rule.of("diode.temperature", Quantity.TEMPERATURE).above(0, true), 300);
        return new Diode(j0, nid, rs, rsh, temp);
    }

    private List<Target> targets(YamlNode n, String path, boolean hasDiode) {
        Sequence s = list(n, path);
        List<Target> out = new ArrayList<>();
        for (int i = 0; i < s.items().size(); i++) {
            String p = path + "[" + i + "]";
            YamlNode item = s.items().get(i);
            String output;
            boolean atLeast;
            String value;
            YamlNode valueNode;
            YamlNode outputNode;
            if (item instanceof Mapping tm) {
                mapping(tm, p, keys("output", "at_least", "at_most"));
                outputNode = req(tm, p, "output");
                output = text(outputNode, child(p, "output"));
                YamlNode lo = opt(tm, "at_least");
                YamlNode hi = opt(tm, "at_most");
                if ((lo == null) == (hi == null)) {
                    throw err(tm, p, "give exactly one of at_least and at_most");
                }
                atLeast = lo != null;
                valueNode = atLeast ? lo : hi;
                value = text(valueNode, child(p, atLeast ? "at_least" : "at_most"));
            } else {
                String t = text(item, p);
                Matcher tmatch = TARGET.matcher(t);
                if (!tmatch.matches()) {
                    throw err(item, p, "write a target as 'OUTPUT >= VALUE UNIT' or 'OUTPUT <= VALUE UNIT', e.g. 'jsc >= 15 mA/cm^2'");
                }
                String op = tmatch.group(2);
                if (!op.equals(">=") && !op.equals("<=") && !op.equals("≥") && !op.equals("≤")) {
                    throw err(item, p, "use >= or <= in a target, got '" + op + "'");
                }
                output = tmatch.group(1);
                atLeast = op.equals(">=") || op.equals("≥");
                value = tmatch.group(3);
                valueNode = item;
                outputNode = item;
            }
            Quantity q = outputQuantity(output, outputNode, p, hasDiode);
            double v = finite(value, q, valueNode, p, "target on " + output, "target value must be finite");
            out.add(new Target(output, atLeast, v, q.canonical(), loc(item, p)));
        }
        return out;
    }

    private Quantity outputQuantity(String output, YamlNode n, String path, boolean hasDiode) {
        Quantity q = OutputCatalog.quantity(output);
        if (q == null) {
            String hint = Suggestions.didYouMean(output, OutputCatalog.ids());
            throw err(n, path, "unknown output '" + output + "'" + (!hint.isEmpty() ? hint
                    : "; outputs: " + String.join(", ", OutputCatalog.ids()) + ", loss_<cause>"));
        }
        if (OutputCatalog.needsDiode(output) && !hasDiode) {
            throw err(n, path, "output '" + output + "' needs the diode section");
        }
        return q;
    }

    // ------------------------------------------------------------------ sections that name inputs

    private Parameter input(YamlNode n, String path, String id, Map<String, Parameter> params) {
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

    private static List<String> uncertainIds(Map<String, Parameter> params) {
        List<String> out = new ArrayList<>();
        for (Parameter p : params.values()) {
            if (p.isUncertain()) {
                out.add(p.id());
            }
        }
        return out;
    }

    private AnalysisSettings analysis(YamlNode n, String path, Map<String, Parameter> params, List<Target> targets) {
        boolean planarNeeded = targets.stream().anyMatch(t -> OutputCatalog.needsPlanarReference(t.output()));
        if (n == null) {
            return new AnalysisSettings(1000, 1, AnalysisSettings.Sampler.LATIN_HYPERCUBE,
                    AnalysisSettings.Sensitivity.SCREENING, 256, 200, AnalysisSettings.FailurePolicy.REJECT,
                    List.of(), Double.NaN, 0.95, planarNeeded);
        }
        Mapping m = mapping(n, path, keys("samples", "seed", "sampler", "sensitivity", "sobol_base", "bootstrap",
                "on_failure", "confidence", "yield_goal", "planar_reference", "what_ifs"));
        YamlNode sn = opt(m, "samples");
        long samples = 1000;
        if (sn != null) {
            samples = integer(sn, child(path, "samples"), Long.MIN_VALUE);
            if (samples < 2) {
                throw err(sn, child(path, "samples"), "at least 2 samples are needed, got " + samples);
            }
        }
        YamlNode seedN = opt(m, "seed");
        long seed = seedN == null ? 1 : integer(seedN, child(path, "seed"), 0);
        YamlNode sam = opt(m, "sampler");
        AnalysisSettings.Sampler sampler = sam == null ? AnalysisSettings.Sampler.LATIN_HYPERCUBE
                : AnalysisSettings.Sampler.valueOf(enumName(word(sam, child(path, "sampler"),
                List.of("random", "latin-hypercube", "sobol"))));
        YamlNode sen = opt(m, "sensitivity");
        AnalysisSettings.Sensitivity sensitivity = sen == null ? AnalysisSettings.Sensitivity.SCREENING
                : AnalysisSettings.Sensitivity.valueOf(enumName(word(sen, child(path, "sensitivity"),
                List.of("none", "screening", "sobol"))));
        YamlNode bn = opt(m, "sobol_base");
        int base = bn == null ? 256 : (int) integer(bn, child(path, "sobol_base"), 2);
        if (sampler == AnalysisSettings.Sampler.SOBOL && Integer.bitCount(base) != 1) {
            throw err(bn == null ? sam : bn, child(path, "sobol_base"), "with sampler: sobol, sobol_base must be a power of two, got "
                    + base + " (nearest: " + Integer.highestOneBit(base) + " or " + 2 * Integer.highestOneBit(base) + ")");
        }
        YamlNode bootN = opt(m, "bootstrap");
        int bootstrap = bootN == null ? 200 : (int) integer(bootN, child(path, "bootstrap"), 0);
        YamlNode fn = opt(m, "on_failure");
        AnalysisSettings.FailurePolicy fail = fn == null ? AnalysisSettings.FailurePolicy.REJECT
                : AnalysisSettings.FailurePolicy.valueOf(enumName(word(fn, child(path, "on_failure"),
                List.of("reject", "truncate", "stop"))));
        YamlNode cn = opt(m, "confidence");
        double confidence = cn == null ? 0.95 : number(cn, child(path, "confidence"),
                Rule.of("confidence", Quantity.FRACTION).above(0, true).below(1, true));
        YamlNode yn = opt(m, "yield_goal");
        double yieldGoal = yn == null ? Double.NaN : number(yn, child(path, "yield_goal"),
                Rule.of("yield_goal", Quantity.FRACTION).above(0, true).below(1, true));
        YamlNode prn = opt(m, "planar_reference");
        boolean planar = planarNeeded;
        if (prn != null) {
            planar = bool(prn, child(path, "planar_reference"));
            if (!planar && planarNeeded) {
                throw err(prn, child(path, "planar_reference"),
                        "a target names jsc_planar or enhancement, which needs planar_reference: true");
            }
        }
        YamlNode wn = opt(m, "what_ifs");
        List<AnalysisSettings.WhatIf> whatIfs = wn == null ? List.of() : whatIfs(wn, child(path, "what_ifs"), params);
        return new AnalysisSettings(samples, seed, sampler, sensitivity, base, bootstrap, fail, whatIfs, yieldGoal,
                confidence, planar);
    }

    private static String enumName(String word) {
        return word.toUpperCase(Locale.ROOT).replace('-', '_');
    }

    private static final Pattern WI_HALVE = Pattern.compile("^halve\\s+(?:the\\s+)?sigma\\s+of\\s+(\\S+)$");
    private static final Pattern WI_SCALE = Pattern.compile("^scale\\s+(?:the\\s+)?sigma\\s+of\\s+(\\S+)\\s+by\\s+(\\S+)$");
    private static final Pattern WI_SHIFT = Pattern.compile("^shift\\s+(\\S+)\\s+by\\s+(.+)$");
    private static final Pattern WI_TRUNC = Pattern.compile("^truncate\\s+(\\S+)\\s+at\\s+(\\S+)\\s*(?:sigma|σ)$");

    private List<AnalysisSettings.WhatIf> whatIfs(YamlNode n, String path, Map<String, Parameter> params) {
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
        switch (kind) {
            case "scale_sigma": {
                double f = parseOr(amount.strip());
                if (!(f > 0) || Double.isInfinite(f)) {
                    throw err(n, path, "the sigma factor must be a number > 0, got '" + amount.strip() + "'");
                }
                return new AnalysisSettings.WhatIf(id, AnalysisSettings.WhatIf.Kind.SCALE_SIGMA, f, where);
            }
            case "shift": {
                Quantity q = Describe.quantity(param.unit());
                double d = finite(amount, q, n, path, "shift of " + id, "the shift must be finite");
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

    private PlanSettings plan(YamlNode n, String path, Map<String, Parameter> params, boolean hasDiode) {
        if (n == null) {
            return new PlanSettings(List.of(), 0, 2, List.of(), PlanSettings.Kind.AUTO, 0, 0, 1, 0, Double.NaN,
                    "jsc", 0.05, 0.8, 1);
        }
        Mapping m = mapping(n, path, keys("factors", "max_runs", "levels", "limits", "kind", "resolution",
                "centre_points", "blocks", "replicates", "effect_of_interest", "response", "alpha", "power", "seed"));
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
        YamlNode mr = opt(m, "max_runs");
        int maxRuns = mr == null ? 0 : (int) integer(mr, child(path, "max_runs"), 0);
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
        YamlNode kn = opt(m, "kind");
        PlanSettings.Kind kind = kn == null ? PlanSettings.Kind.AUTO : PlanSettings.Kind.valueOf(enumName(word(kn,
                child(path, "kind"), List.of("auto", "full-factorial", "fractional", "plackett-burman",
                        "central-composite", "box-behnken"))));
        YamlNode rn = opt(m, "resolution");
        int resolution = 0;
        if (rn != null) {
            resolution = (int) integer(rn, child(path, "resolution"), 0);
            if (resolution != 0 && (resolution < 3 || resolution > 5)) {
                throw err(rn, child(path, "resolution"), "resolution must be 3, 4 or 5 (0: let the planner choose), got "
                        + resolution);
            }
        }
        YamlNode cp = opt(m, "centre_points");
        int centre = cp == null ? 0 : (int) integer(cp, child(path, "centre_points"), 0);
        YamlNode bl = opt(m, "blocks");
        int blocks = bl == null ? 1 : (int) integer(bl, child(path, "blocks"), 1);
        YamlNode rep = opt(m, "replicates");
        int replicates = rep == null ? 0 : (int) integer(rep, child(path, "replicates"), 0);
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
                response, alpha, power, seed);
    }

    private Map<String, Double> costs(YamlNode n, String path, Map<String, Parameter> params) {
        if (!(n instanceof Mapping m)) {
            throw err(n, path, "expected a section of input: cost pairs, got " + n.kindName());
        }
        Map<String, Double> out = new LinkedHashMap<>();
        for (YamlNode.Entry e : m.entries().values()) {
            String id = e.key().name();
            String p = child(path, id);
            input(new YamlNode.Scalar(id, Scalar.Type.STRING, e.key().line(), e.key().column()), p, id, params);
            double c = number(e.value(), p, Rule.of(id, Quantity.DIMENSIONLESS).above(0, true));
            out.put(id, c);
        }
        return out;
    }

    private List<Correlation> correlations(YamlNode n, String path, Map<String, Parameter> params) {
        Sequence s = list(n, path);
        List<Correlation> out = new ArrayList<>();
        Set<String> pairs = new HashSet<>();
        for (int i = 0; i < s.items().size(); i++) {
            String p = path + "[" + i + "]";
            Mapping m = mapping(s.items().get(i), p, keys("between", "spearman"));
            String bp = child(p, "between");
            Sequence b = list(req(m, p, "between"), bp);
            if (b.items().size() != 2) {
                throw err(b, bp, "a correlation is between exactly two inputs, got " + b.items().size());
            }
            String a = text(b.items().get(0), bp + "[0]");
            String c = text(b.items().get(1), bp + "[1]");
            input(b.items().get(0), bp + "[0]", a, params);
            input(b.items().get(1), bp + "[1]", c, params);
            if (a.equals(c)) {
                throw err(b.items().get(1), bp + "[1]", "an input cannot be correlated with itself");
            }
            String key = a.compareTo(c) < 0 ? a + "|" + c : c + "|" + a;
            if (!pairs.add(key)) {
                throw err(b, bp, "the pair " + a + ", " + c + " is correlated twice");
            }
            YamlNode rn = req(m, p, "spearman");
            double r = number(rn, child(p, "spearman"), Rule.of("spearman", Quantity.DIMENSIONLESS));
            if (!(r >= -1 && r <= 1)) {
                throw err(rn, child(p, "spearman"), "a rank correlation must lie in [-1, 1], got " + Units.format(r));
            }
            out.add(new Correlation(a, c, r, loc(m, p)));
        }
        return out;
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
