package org.fabspread.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

import org.fabspread.pipeline.StudyResults;
import org.fabspread.sampling.RunSummary;
import org.fabspread.study.Target;

/**
 * The design-review report of one study run: what was studied, what the Monte Carlo found, what to
 * tighten, which experiments to run, the optics of the nominal device, the model's limits with the
 * cautions, and where the numbers came from. Every sentence that carries a number is generated from
 * the results; nothing is hard-coded. Numbers are formatted by {@link Numbers}.
 *
 * <p>Each section is built by its own class; {@link #SECTIONS} lists them in reading order.
 */
public final class StudyReport {

    /** Section ids, in reading order. */
    public static final String VERDICT = "verdict";
    public static final String STUDIED = "studied";
    public static final String FINDINGS = "findings";
    public static final String OUTPUTS = "outputs";
    public static final String TIGHTEN = "tighten";
    public static final String EXPERIMENTS = "experiments";
    public static final String OPTICS = "optics";
    public static final String LIMITS = "limits";
    public static final String PROVENANCE = "provenance";

    /** Inputs drawn against the output in scatter plots. */
    public static final int SCATTER_INPUTS = 3;
    /** Inputs drawn in the convergence chart (as many as the chart has distinct line styles). */
    public static final int CONVERGENCE_LINES = 5;
    /** Below this effective sample size a reweighted estimate is called for confirmation. */
    public static final double LOW_ESS = 200;

    /** The sections in reading order; a builder that returns null leaves its section out. */
    static final List<SectionBuilder> SECTIONS = List.of(
            (r, c) -> VerdictSection.build(r),
            (r, c) -> StudiedSection.build(r),
            (r, c) -> new FindingsSection(c).section(r),
            (r, c) -> new OutputsSection(c).section(r),
            (r, c) -> new TightenSection(c).section(r),
            (r, c) -> r.plan() == null ? PlanMissingSection.build(r) : new ExperimentsSection(c).section(r.plan()),
            (r, c) -> r.nominalSpectra() == null ? null : new OpticsSection(c).section(r),
            (r, c) -> new ShapeSection(c).section(r),
            (r, c) -> LimitsSection.build(r),
            (r, c) -> ProvenanceSection.build(r));

    private final ChartFactory charts;

    public StudyReport() {
        this(new ChartFactory());
    }

    public StudyReport(ChartFactory charts) {
        this.charts = Objects.requireNonNull(charts, "charts");
    }

    /** Builds the report with the default chart size. */
    public static ReportDocument build(StudyResults r) {
        return new StudyReport().document(r);
    }

    /** Builds the report. */
    public ReportDocument document(StudyResults r) {
        List<Section> sections = new ArrayList<>();
        for (SectionBuilder b : SECTIONS) {
            Section s = b.build(r, charts);
            if (s != null) {
                sections.add(s);
            }
        }
        String subtitle = "Design review: spread, yield and tolerances from " + r.summary().samplesOk()
                + " Monte Carlo samples of the device model";
        return new ReportDocument(r.study().name(), subtitle, sections);
    }

    /** The recommendation paragraph, from the ranking and the allocation ({@link Recommendation}). */
    static String recommendation(StudyResults r) {
        return Recommendation.text(r);
    }

    /** The summary statistics of output {@code id}; refused when the run has no such output. */
    static RunSummary.OutputStats stats(RunSummary s, String id) {
        return ResultLookup.stats(s, id);
    }

    /** The recorded quantile at probability p, NaN when it was not recorded. */
    static double quantile(RunSummary.OutputStats st, double p) {
        return ResultLookup.quantile(st, p);
    }

    /** A target in words, e.g. {@code J_sc ≥ 14 mA/cm²}. */
    static String target(Target t) {
        return ReportText.target(t);
    }

    /** The printed name of an output: J_sc for jsc, V_oc for voc, FF and efficiency; else the id. */
    static String label(String output) {
        return ReportText.label(output);
    }

    /** A value in a canonical unit as a reader wants it: fractions as %, thick layers in mm. */
    static String show(double v, String unit) {
        return ReportText.show(v, unit);
    }
}
