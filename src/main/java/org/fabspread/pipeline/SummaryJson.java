package org.fabspread.pipeline;

import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.fabspread.device.EnvelopeCounts;
import org.fabspread.device.EnvelopeReason;
import org.fabspread.device.ShapeTableSummary;
import org.fabspread.device.ValidityEnvelope;
import org.fabspread.model.OutputDef;

/**
 * {@code summary.json}, rendered from the one {@link StudyResults}: the Monte Carlo summary's fields, then
 * one section per analysis the run made, the notes and the provenance (without the clock, the output path
 * or the study text, so the same study and seed give the same bytes).
 */
public final class SummaryJson {

    /** The file name in the output folder. */
    public static final String FILE = "summary.json";

    private SummaryJson() {
    }

    /** The sections after the run summary's fields, in file order. */
    public static Map<String, Object> sections(StudyResults r) {
        Map<String, Object> sections = new LinkedHashMap<>();
        if (r.nominalOutputs() != null) {
            sections.put("nominal", nominal(r.outputs(), r.nominalOutputs()));
        }
        if (r.yield() != null) {
            sections.put("yield", r.yield());
            sections.put("capability", r.capabilities());
        }
        if (r.tail() != null) {
            Map<String, Object> rare = new LinkedHashMap<>();
            rare.put("importance_sampling", r.tail());
            rare.put("fitted_tail", r.tailFits());
            sections.put("rare_failures", rare);
        }
        if (r.screening() != null) {
            sections.put("screening", r.screening());
        }
        if (r.sobol() != null) {
            sections.put("sobol", r.sobol());
        }
        if (r.attribution() != null && r.attribution().shapley() != null) {
            sections.put("shapley", r.attribution().shapley());
        }
        if (r.attribution() != null) {
            sections.put("sensitivity_not_converged", r.attribution().unconverged());
        }
        sections.put("what_ifs", r.whatIfs());
        if (r.ranking() != null) {
            sections.put("tolerance_ranking", r.ranking());
        }
        if (r.allocation() != null) {
            sections.put("tolerance_allocation", r.allocation());
        }
        if (r.plan() != null) {
            sections.put("plan", r.plan());
        }
        if (r.envelope() != null) {
            sections.put("validity_envelope", envelope(r.envelope()));
        }
        if (r.crossSections() != null && r.crossSections().shape() != null) {
            sections.put("particle_shape", particleShape(r.crossSections().shape()));
        }
        sections.put("notes", r.notes());
        sections.put("provenance", provenance(r.provenance()));
        return sections;
    }

    /** Writes {@code summary.json} into {@code folder} atomically. */
    public static Path write(StudyResults r, Path folder) throws IOException {
        Path file = folder.resolve(FILE);
        r.summary().write(file, sections(r));
        return file;
    }

    private static Map<String, Object> nominal(List<OutputDef> outputs, double[] y) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (int i = 0; i < y.length; i++) {
            m.put(outputs.get(i).id(), y[i]);
        }
        return m;
    }

    /** The validity envelope's counts by reason and its limits. */
    static Map<String, Object> envelope(EnvelopeCounts c) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("samples", c.samples());
        m.put("outside", c.outside());
        Map<String, Object> by = new LinkedHashMap<>();
        for (EnvelopeReason reason : EnvelopeReason.values()) {
            by.put(reason.key(), c.count(reason));
        }
        m.put("outside_by_reason", by);
        Map<String, Object> lim = new LinkedHashMap<>();
        lim.put("max_size_parameter", ValidityEnvelope.MAX_SIZE_PARAMETER);
        lim.put("max_volume_fraction", ValidityEnvelope.MAX_VOLUME_FRACTION);
        lim.put("max_monolayer_coverage", ValidityEnvelope.MAX_MONOLAYER_COVERAGE);
        m.put("limits", lim);
        return m;
    }

    /**
     * A named shape's discrete-dipole table: the nominal particle's resonance per in-plane polarisation, the
     * tabulated ranges and the leave-one-out interpolation error (null where it could not be estimated).
     */
    static Map<String, Object> particleShape(ShapeTableSummary t) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("kind", t.kind());
        Map<String, Object> res = new LinkedHashMap<>();
        res.put("x_nm", t.resonanceX());
        res.put("y_nm", t.resonanceY());
        res.put("x_at_grid_edge", t.resonanceAtEdgeX());
        res.put("y_at_grid_edge", t.resonanceAtEdgeY());
        m.put("resonance", res);
        List<Map<String, Object>> tab = new java.util.ArrayList<>();
        for (int d = 0; d < t.parameters().size(); d++) {
            Map<String, Object> p = new LinkedHashMap<>();
            p.put("input", t.parameters().get(d));
            p.put("low_nm", t.low()[d]);
            p.put("high_nm", t.high()[d]);
            p.put("nodes", t.nodes()[d]);
            p.put("interpolation_error", finiteOrNull(t.parameterError()[d]));
            tab.add(p);
        }
        m.put("tabulated", tab);
        m.put("tabulated_wavelengths", t.tabulatedWavelengths());
        m.put("wavelength_interpolation_error", finiteOrNull(t.wavelengthError()));
        m.put("worst_interpolation_error", finiteOrNull(t.worstError()));
        return m;
    }

    private static Double finiteOrNull(double v) {
        return Double.isFinite(v) ? v : null;
    }

    private static Map<String, Object> provenance(StudyResults.Provenance p) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("version", p.version());
        m.put("commit", p.commit());
        m.put("build_date", p.buildDate());
        m.put("seed", p.seed());
        m.put("study_sha256", p.studySha256());
        m.put("materials", p.materialSources());
        return m;
    }
}
