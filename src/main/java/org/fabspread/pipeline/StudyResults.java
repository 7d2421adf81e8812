package org.fabspread.pipeline;

import java.util.List;
import java.util.Map;

import org.fabspread.analysis.Capability;
import org.fabspread.analysis.ScreeningResult;
import org.fabspread.analysis.SobolResult;
import org.fabspread.analysis.TailFitResult;
import org.fabspread.analysis.TailYieldResult;
import org.fabspread.analysis.ToleranceAllocation;
import org.fabspread.analysis.ToleranceRanking;
import org.fabspread.analysis.VarianceAttribution;
import org.fabspread.analysis.WhatIfResult;
import org.fabspread.analysis.YieldResult;
import org.fabspread.device.DeviceModel;
import org.fabspread.device.EnvelopeCounts;
import org.fabspread.device.Spectra;
import org.fabspread.model.OutputDef;
import org.fabspread.plan.PlanReport;
import org.fabspread.sampling.RunSummary;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.Study;

/**
 * Everything one study run found: the one results object the pipeline fills and every output renders
 * ({@link SummaryJson} writes {@code summary.json} from it, the report package builds the report from it).
 * Optional parts are null when the study did not ask for them (no Sobol design, no yield goal, no particle
 * layer, no plan, no rare-failure estimate). A new analysis adds its result here as a new component.
 *
 * @param study          the study as read
 * @param provenance     where the numbers came from
 * @param outputs        the model's outputs (ids, units, descriptions)
 * @param summary        the Monte Carlo summary (moments, quantiles, yields) — also in summary.json
 * @param table          the samples held in memory (possibly every s-th sample of a very large run)
 * @param yield          yields with Wilson and Clopper–Pearson intervals
 * @param capabilities   C_pk per target
 * @param screening      given-data sensitivity from the Monte Carlo sample
 * @param sobol          Sobol indices (Saltelli design), or null
 * @param whatIfs        what-ifs by reweighting (or re-run), may be empty
 * @param ranking        yield gained by tightening each input, or null
 * @param allocation     cost-weighted tolerance allocation, or null
 * @param plan           the suggested experiment plan, or null
 * @param nominalSpectra the nominal device's spectra and generation profile
 * @param crossSections  the nominal particle ensemble's cross-sections, or null
 * @param notes          run notes worth a reader's attention (re-runs, repaired correlations, failures)
 * @param nominalOutputs the model's outputs at the nominal point, in {@code outputs} order, or null when
 *                       not recorded (the report then cannot say what the scatter costs)
 * @param tail           the failure rate by importance sampling when the yield is above 99.9 %, or null
 * @param tailFits       the failure rate by a fitted tail per target, or null (with {@code tail})
 * @param planMissing    why there is no plan and what to change, when {@code plan} is null; else null
 * @param attribution    the Sobol design's groups and designs, the Shapley effects and the unconverged
 *                       estimates, or null (no Sobol design)
 * @param envelope       the samples outside the validity envelope by reason, or null without built-in particle optics
 */
public record StudyResults(Study study, Provenance provenance, List<OutputDef> outputs, RunSummary summary,
                           SampleTable table, YieldResult yield, List<Capability> capabilities,
                           ScreeningResult screening, SobolResult sobol, List<WhatIfResult> whatIfs,
                           ToleranceRanking ranking, ToleranceAllocation allocation, PlanReport plan,
                           Spectra nominalSpectra, DeviceModel.CrossSections crossSections, List<String> notes,
                           double[] nominalOutputs, TailYieldResult tail, List<TailFitResult> tailFits,
                           String planMissing, VarianceAttribution attribution, EnvelopeCounts envelope) {

    public StudyResults {
        outputs = List.copyOf(outputs);
        capabilities = List.copyOf(capabilities);
        whatIfs = List.copyOf(whatIfs);
        notes = List.copyOf(notes);
        tailFits = tailFits == null ? null : List.copyOf(tailFits);
        if (nominalOutputs != null) {
            if (nominalOutputs.length != outputs.size()) {
                throw new IllegalArgumentException(nominalOutputs.length + " nominal outputs for "
                        + outputs.size() + " outputs");
            }
            nominalOutputs = nominalOutputs.clone();
        }
    }

    /** As the canonical constructor with nothing said about a missing plan. */
    public StudyResults(Study study, Provenance provenance, List<OutputDef> outputs, RunSummary summary,
                        SampleTable table, YieldResult yield, List<Capability> capabilities,
                        ScreeningResult screening, SobolResult sobol, List<WhatIfResult> whatIfs,
                        ToleranceRanking ranking, ToleranceAllocation allocation, PlanReport plan,
                        Spectra nominalSpectra, DeviceModel.CrossSections crossSections, List<String> notes,
                        double[] nominalOutputs, TailYieldResult tail, List<TailFitResult> tailFits) {
        this(study, provenance, outputs, summary, table, yield, capabilities, screening, sobol, whatIfs, ranking,
                allocation, plan, nominalSpectra, crossSections, notes, nominalOutputs, tail, tailFits, null, null, null);
    }

    /** As the canonical constructor without the rare-failure estimates (null). */
    public StudyResults(Study study, Provenance provenance, List<OutputDef> outputs, RunSummary summary,
                        SampleTable table, YieldResult yield, List<Capability> capabilities,
                        ScreeningResult screening, SobolResult sobol, List<WhatIfResult> whatIfs,
                        ToleranceRanking ranking, ToleranceAllocation allocation, PlanReport plan,
                        Spectra nominalSpectra, DeviceModel.CrossSections crossSections, List<String> notes,
                        double[] nominalOutputs) {
        this(study, provenance, outputs, summary, table, yield, capabilities, screening, sobol, whatIfs, ranking,
                allocation, plan, nominalSpectra, crossSections, notes, nominalOutputs, null, null, null, null, null);
    }

    /** As the canonical constructor without the nominal outputs and rare-failure estimates (null). */
    public StudyResults(Study study, Provenance provenance, List<OutputDef> outputs, RunSummary summary,
                        SampleTable table, YieldResult yield, List<Capability> capabilities,
                        ScreeningResult screening, SobolResult sobol, List<WhatIfResult> whatIfs,
                        ToleranceRanking ranking, ToleranceAllocation allocation, PlanReport plan,
                        Spectra nominalSpectra, DeviceModel.CrossSections crossSections, List<String> notes) {
        this(study, provenance, outputs, summary, table, yield, capabilities, screening, sobol, whatIfs, ranking,
                allocation, plan, nominalSpectra, crossSections, notes, null, null, null, null, null, null);
    }

    @Override
    public double[] nominalOutputs() {
        return nominalOutputs == null ? null : nominalOutputs.clone();
    }

    /** The nominal value of output {@code id}, or NaN when the nominal outputs were not recorded. */
    public double nominal(String id) {
        if (nominalOutputs == null) {
            return Double.NaN;
        }
        for (int i = 0; i < outputs.size(); i++) {
            if (outputs.get(i).id().equals(id)) {
                return nominalOutputs[i];
            }
        }
        throw new IllegalArgumentException("no output " + id);
    }

    /**
     * Where the numbers came from.
     *
     * @param version        fabspread version
     * @param commit         the build's commit
     * @param buildDate      the build's date
     * @param runDate        when the run finished (ISO-8601, UTC)
     * @param seed           the master seed
     * @param studySha256    SHA-256 of the study file's bytes
     * @param studyText      the study file as written (echoed in the report)
     * @param materialSources material id → its published source
     * @param command        the command line that produced the run
     */
    public record Provenance(String version, String commit, String buildDate, String runDate, long seed,
                             String studySha256, String studyText, Map<String, String> materialSources,
                             String command) {
    }
}
