package org.fabspread.study;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.fabspread.study.YamlNode.Mapping;

/**
 * Reads and validates a study file (format v1, YAML; see {@code shared/schema/study.schema.json}).
 * Every problem is reported as one {@link StudyException} line {@code file:line:col: key.path: what is
 * wrong}, pointing at the offending key or value. Reading stops at the first problem.
 *
 * <p>Each section of the file has its own reader ({@link GridReader}, {@link StackReader},
 * {@link ParticlesReader}, {@link CollectionReader}, {@link DiodeReader}, {@link TargetsReader},
 * {@link AnalysisReader} with {@link WhatIfReader}, {@link PlanReader}, {@link CostsReader},
 * {@link CorrelationsReader}); they share {@link SectionReader}'s typed access and
 * {@link DistributionReader} for every number that may carry a spread.
 */
public final class StudyReader extends SectionReader {

    private StudyReader(Path file, MaterialCatalog catalog, ReadOptions options) {
        super(new ReadContext(file, catalog, options));
    }

    /** Reads a study with the bundled material tables and {@link ReadOptions#defaults()}. */
    public static Study read(Path file) {
        return read(file, MaterialCatalog.bundled(), ReadOptions.defaults());
    }

    /** Reads a study with the bundled material tables. */
    public static Study read(Path file, ReadOptions options) {
        return read(file, MaterialCatalog.bundled(), options);
    }

    /** Reads a study, checking materials against {@code catalog}, with {@link ReadOptions#defaults()}. */
    public static Study read(Path file, MaterialCatalog catalog) {
        return read(file, catalog, ReadOptions.defaults());
    }

    /**
     * Reads and validates a study: the one validation pass of the study file. With
     * {@link ReadOptions#forRun()} it refuses everything a run would refuse for reasons of the file
     * itself (ranges, reachable values, sizes, data files, a study with nothing uncertain).
     *
     * @throws StudyException one line {@code file:line:col: key.path: what is wrong}
     */
    public static Study read(Path file, MaterialCatalog catalog, ReadOptions options) {
        if (!Files.isRegularFile(file)) {
            throw new StudyException(file + ": study file not found");
        }
        return new StudyReader(file, catalog, options).top(YamlTree.parse(file));
    }

    // ------------------------------------------------------------------ the document

    Study top(YamlNode root) {
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
        GridReader gridReader = new GridReader(ctx);
        YamlNode gn = opt(m, "wavelengths");
        WavelengthGrid grid = gn == null ? new WavelengthGrid(320, 800, 4) : gridReader.grid(gn, "wavelengths");
        List<Layer> stack = new StackReader(ctx).stack(req(m, "", "stack"), "stack");
        YamlNode pn = opt(m, "particles");
        ParticleLayer particles = pn == null ? null : new ParticlesReader(ctx).particles(pn, "particles", stack);
        ChargeCollection collection = new CollectionReader(ctx).collection(req(m, "", "collection"), "collection", stack);
        YamlNode don = opt(m, "diode");
        Diode diode = don == null ? null : new DiodeReader(ctx).diode(don, "diode");
        if (gn != null) {
            gridReader.checkGrid(gn, grid);
        } else {
            gridReader.checkGrid(m, grid);
        }
        YamlNode tn = opt(m, "targets");
        List<Target> targets = tn == null ? List.of() : new TargetsReader(ctx).targets(tn, "targets", diode != null);

        // the inputs are known now: the sections that refer to them come last
        Study draft = new Study(file, name, description, grid, stack, particles, collection, diode, targets,
                null, null, Map.of(), List.of());
        Map<String, Parameter> params = draft.parameters();
        YamlNode an = opt(m, "analysis");
        AnalysisSettings analysis = new AnalysisReader(ctx).analysis(an, "analysis", params, targets);
        YamlNode pln = opt(m, "plan");
        PlanSettings plan = new PlanReader(ctx).plan(pln, "plan", params, diode != null);
        YamlNode cn = opt(m, "costs");
        Map<String, Double> costs = cn == null ? Map.of() : new CostsReader(ctx).costs(cn, "costs", params);
        YamlNode con = opt(m, "correlations");
        List<Correlation> correlations = con == null ? List.of() : new CorrelationsReader(ctx).correlations(con, "correlations", params);
        if (ctx.options().requireUncertainInput() && draft.uncertainInputs().isEmpty()) {
            YamlNode at = an != null ? m.get("analysis") : m.get("stack");
            throw err(at, an != null ? "analysis" : "stack", "no input has a spread, so there is nothing to sample:"
                    + " give at least one number a distribution, e.g. 'thickness: 100 nm ± 5 nm at 2 sigma'");
        }
        return new Study(file, name, description, grid, stack, particles, collection, diode, targets, analysis, plan,
                costs, correlations);
    }
}
