package org.fabspread.pipeline;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.fabspread.analysis.ShapleyEffects;
import org.fabspread.analysis.SobolIndices;
import org.fabspread.analysis.ToleranceAdvisor;
import org.fabspread.analysis.WhatIf;
import org.fabspread.device.DeviceModel;
import org.fabspread.sampling.RunJob;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.KeyPlaces;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * The one validation pass of a run after the study file is read, shared by {@code check} and {@code run}
 * so that {@code check} refuses everything {@code run} would refuse before writing: the device model at the
 * nominal point, every what-if's change of distribution, the sensitivity designs' settings, the Monte
 * Carlo job's settings (targets against the model's outputs, the sampler) and the {@link Preflight} checks
 * (plan budget, Sobol design against the heap, disk, time). It writes nothing. A refusal is one
 * {@link StudyException} line at the key's place in the study file ({@link KeyPlaces#locate}).
 *
 * @param model    the device model
 * @param space    the input space of the uncertain inputs
 * @param samples  the Monte Carlo sample count (the options' or the study's)
 * @param seed     the master seed (the options' or the study's)
 * @param whatIfs  the study's what-ifs with their changes of distribution
 * @param sobol    the Sobol design's options, or null when the study asks for no Sobol design
 * @param shapley  the Shapley design's options
 * @param estimate the run's estimate of model runs, time and disk
 */
public record RunValidation(DeviceModel model, StudyInputSpace space, long samples, long seed,
                            List<StudyRun.WhatIfPlan> whatIfs, SobolIndices.Options sobol,
                            ShapleyEffects.Options shapley, Preflight.Estimate estimate) {

    /**
     * Validates a run of {@code study} with {@code options} whose results go to {@code out} (whose disk is
     * checked; null: no disk check).
     *
     * @throws StudyException one line {@code file:line:col: key.path: what is wrong}
     */
    public static RunValidation of(Study study, StudyRun.Options options, Path out) throws IOException {
        try {
            DeviceModel model = DeviceModel.of(study);
            AnalysisSettings a = study.analysis();
            long samples = options.samples() > 0 ? options.samples() : a.samples();
            long seed = options.seed() != null ? options.seed() : a.seed();
            List<StudyRun.WhatIfPlan> whatIfs = whatIfPlans(study);
            SobolIndices.Options sobol = a.sensitivity() == AnalysisSettings.Sensitivity.SOBOL
                    ? SobolIndices.Options.from(a, options.sobolBase(), options.threads()).withSeed(seed) : null;
            ShapleyEffects.Options shapley = ShapleyEffects.Options.from(a, options.sobolBase(), seed,
                    options.threads());
            // the Monte Carlo job's own checks; this instance writes nothing and is not run
            RunJob job = new RunJob(study, model, RunJob.Options.defaults().withSamples(samples).withSeed(seed)
                    .withThreads(options.threads()), null);
            Preflight.Estimate estimate = Preflight.check(study, model, job.inputSpace(), samples, sobol, shapley,
                    out, options.threads());
            return new RunValidation(model, job.inputSpace(), samples, seed, whatIfs, sobol, shapley, estimate);
        } catch (StudyException e) {
            throw KeyPlaces.locate(study.file(), e);
        }
    }

    private static List<StudyRun.WhatIfPlan> whatIfPlans(Study study) {
        Map<String, DistributionSpec> specs = ToleranceAdvisor.specs(study);
        List<StudyRun.WhatIfPlan> plans = new ArrayList<>();
        for (AnalysisSettings.WhatIf w : study.analysis().whatIfs()) {
            DistributionSpec spec = specs.get(w.input());
            if (spec == null) {
                throw StudyException.at(w.where(), "'" + w.input() + "' is not an uncertain input");
            }
            plans.add(new StudyRun.WhatIfPlan(w, WhatIf.change(spec, w)));
        }
        return plans;
    }
}
