package org.fabspread.study;

import java.util.List;
import java.util.Map;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;

/**
 * The {@code analysis} section: samples, seed, sampler, sensitivity method and its settings,
 * failure policy, confidence, yield goal, planar reference and the what-ifs.
 */
final class AnalysisReader extends SectionReader {

    AnalysisReader(ReadContext ctx) {
        super(ctx);
    }

    AnalysisSettings analysis(YamlNode n, String path, Map<String, Parameter> params, List<Target> targets) {
        boolean planarNeeded = targets.stream().anyMatch(t -> OutputCatalog.needsPlanarReference(t.output()));
        if (n == null) {
            return new AnalysisSettings(1000, 1, AnalysisSettings.Sampler.LATIN_HYPERCUBE,
                    AnalysisSettings.Sensitivity.SCREENING, 256, 200, AnalysisSettings.FailurePolicy.REJECT,
                    List.of(), Double.NaN, 0.95, planarNeeded);
        }
        Mapping m = mapping(n, path, keys("samples", "seed", "sampler", "sensitivity", "sobol_base", "bootstrap",
                "on_failure", "confidence", "yield_goal", "planar_reference", "what_ifs", "groups"));
        YamlNode sn = opt(m, "samples");
        long samples = 1000;
        if (sn != null) {
            samples = integer(sn, child(path, "samples"), Long.MIN_VALUE);
            if (samples < 2) {
                throw err(sn, child(path, "samples"), "at least 2 samples are needed, got " + samples);
            }
            if (samples > Limits.MAX_SAMPLES) {
                throw err(sn, child(path, "samples"), "at most " + Limits.MAX_SAMPLES
                        + " samples (each is kept in memory and written to samples.csv), got " + text(sn, child(path, "samples")));
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
        int base = bn == null ? 256 : (int) integer(bn, child(path, "sobol_base"), 2, Limits.MAX_SOBOL_BASE,
                "the Sobol design evaluates sobol_base x (inputs + 2) devices");
        long inputs = params.values().stream().filter(Parameter::isUncertain).count();
        long evaluations = (long) base * (inputs + 2);
        if (sensitivity == AnalysisSettings.Sensitivity.SOBOL && evaluations > Limits.MAX_SOBOL_EVALUATIONS) {
            throw err(bn == null ? sen : bn, child(path, bn == null ? "sensitivity" : "sobol_base"), "the Sobol design would evaluate "
                    + base + " x (" + inputs + " inputs + 2) = " + evaluations + " devices; at most "
                    + Limits.MAX_SOBOL_EVALUATIONS + ": use sobol_base " + Integer.highestOneBit(
                    (int) Math.max(2, Limits.MAX_SOBOL_EVALUATIONS / (inputs + 2))) + " or less");
        }
        if (sampler == AnalysisSettings.Sampler.SOBOL && Integer.bitCount(base) != 1) {
            throw err(bn == null ? sam : bn, child(path, "sobol_base"), "with sampler: sobol, sobol_base must be a power of two, got "
                    + base + " (nearest: " + Integer.highestOneBit(base) + " or " + 2 * Integer.highestOneBit(base) + ")");
        }
        YamlNode bootN = opt(m, "bootstrap");
        int bootstrap = bootN == null ? 200 : (int) integer(bootN, child(path, "bootstrap"), 0, Limits.MAX_BOOTSTRAP,
                "each resample recomputes every index");
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
        List<AnalysisSettings.WhatIf> whatIfs = wn == null ? List.of() : new WhatIfReader(ctx).whatIfs(wn, child(path, "what_ifs"), params);
        YamlNode gn = opt(m, "groups");
        List<AnalysisSettings.Group> groups = gn == null ? List.of()
                : new GroupsReader(ctx).groups(gn, child(path, "groups"), params);
        return new AnalysisSettings(samples, seed, sampler, sensitivity, base, bootstrap, fail, whatIfs, yieldGoal,
                confidence, planar, groups);
    }
}
