package org.fabspread.pipeline;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicLong;

import org.fabspread.analysis.Capability;
import org.fabspread.analysis.InputGroup;
import org.fabspread.analysis.ProgressListener;
import org.fabspread.analysis.Screening;
import org.fabspread.analysis.ScreeningResult;
import org.fabspread.analysis.ShapleyEffects;
import org.fabspread.analysis.ShapleyResult;
import org.fabspread.analysis.SobolIndices;
import org.fabspread.analysis.SobolResult;
import org.fabspread.analysis.TailFit;
import org.fabspread.analysis.TailFitResult;
import org.fabspread.analysis.TailYield;
import org.fabspread.analysis.TailYieldResult;
import org.fabspread.analysis.ToleranceAdvisor;
import org.fabspread.analysis.ToleranceAllocation;
import org.fabspread.analysis.ToleranceRanking;
import org.fabspread.analysis.VarianceAttribution;
import org.fabspread.analysis.WhatIf;
import org.fabspread.analysis.WhatIfResult;
import org.fabspread.analysis.YieldEstimate;
import org.fabspread.analysis.YieldResult;
import org.fabspread.device.DeviceModel;
import org.fabspread.model.ModelException;
import org.fabspread.plan.PlanJob;
import org.fabspread.plan.PlanRefused;
import org.fabspread.plan.PlanReport;
import org.fabspread.plan.RankedInput;
import org.fabspread.sampling.RunJob;
import org.fabspread.sampling.SampleTable;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.Study;
import org.fabspread.study.Target;

/**
 * The phases after the Monte Carlo run, in order: yields and C_pk, the given-data screening, the Sobol
 * design, the what-ifs (re-run when reweighting cannot be trusted), the tolerance ranking and allocation,
 * the rare-failure estimates, the experiment plan. The phases that run the model (Sobol design, what-if
 * re-runs, importance sampling) keep their result in the run's {@link PhaseStore} when they finish, so a
 * resumed run takes them from there; the rest is recomputed from the samples (same bits).
 */
final class Analyses {

    /** Above this yield of all targets the rare-failure estimators run too. */
    static final double RARE_YIELD = 0.999;

    /** The results of the phases, in the order they ran. */
    record Found(YieldResult yield, List<Capability> capabilities, ScreeningResult screening, SobolResult sobol,
                 List<WhatIfResult> whatIfs, ToleranceRanking ranking, ToleranceAllocation allocation,
                 TailYieldResult tail, List<TailFitResult> tailFits, PlanReport plan, String planMissing,
                 VarianceAttribution attribution) {
    }

    private final Study study;
    private final DeviceModel model;
    private final StudyInputSpace space;
    private final StudyRun.Options options;
    private final long seed;
    private final PhaseStore phases;
    private final List<String> notes;

    Analyses(Study study, DeviceModel model, StudyInputSpace space, StudyRun.Options options, long seed,
             PhaseStore phases, List<String> notes) {
        this.study = study;
        this.model = model;
        this.space = space;
        this.options = options;
        this.seed = seed;
        this.phases = phases;
        this.notes = notes;
    }

    Found run(RunJob.Result run, SobolIndices.Options sobolOptions, ShapleyEffects.Options shapleyOptions,
              List<StudyRun.WhatIfPlan> whatIfPlans, Path work) throws IOException {
        SampleTable table = run.table();
        int k = space.dimension();
        AnalysisSettings a = study.analysis();
        double conf = a.confidence();
        YieldResult yield = study.targets().isEmpty() ? null : YieldEstimate.of(table, study.targets(), conf);
        List<Capability> capabilities = new ArrayList<>();
        for (Target t : study.targets()) {
            capabilities.add(YieldEstimate.capability(table, t));
        }
        ScreeningResult screening = table.size() >= 20 && k > 0 ? Screening.of(table) : null;
        SobolResult sobol = null;
        VarianceAttribution attribution = null;
        if (sobolOptions != null && k > 0) {
            attribution = phases.load("sobol", VarianceAttribution.class).orElse(null);
            if (attribution == null) {
                List<InputGroup> studyGroups = study.analysis().groups().stream()
                        .map(g -> new InputGroup(g.name(), g.inputs())).toList();
                attribution = VarianceAttribution.run(options.engine(), model, space, sobolOptions, shapleyOptions,
                        studyGroups, progress("Sobol design"), progress("Shapley design"));
                phases.save("sobol", attribution, VarianceAttribution.class);
            }
            sobol = attribution.sobol();
        }
        WhatIf.Options wOptions = WhatIfRerun.options(space, conf);
        List<WhatIfResult> whatIfs = study.targets().isEmpty() ? List.of() : whatIfs(whatIfPlans, table, wOptions);
        ToleranceRanking ranking = null;
        ToleranceAllocation allocation = null;
        if (!study.targets().isEmpty() && k > 0) {
            ranking = ToleranceAdvisor.rank(table, space, study, wOptions);
            double goal = a.yieldGoal();
            if (goal > 0 && goal < 1) {
                allocation = ToleranceAdvisor.allocate(table, space, study, wOptions);
            }
        }
        // rare failures: above 99.9 % yield plain Monte Carlo sees too few failing cells to be trusted
        TailYieldResult tail = null;
        List<TailFitResult> tailFits = null;
        if (yield != null && k > 0 && yield.all().yield() > RARE_YIELD) {
            tail = phases.load("importance_sampling", TailYieldResult.class).orElse(null);
            if (tail == null) {
                tail = TailYield.estimate(options.engine(), model, space, study.targets(), TailYield.Options
                        .defaults().withSeed(seed).withConfidence(conf).withThreads(options.threads()));
                phases.save("importance_sampling", tail, TailYieldResult.class);
            }
            tailFits = TailFit.of(table, study.targets(), TailFit.Options.defaults().withSeed(seed)
                    .withConfidence(conf));
            notes.add(String.format(Locale.ROOT, "The yield is above %.1f %%: the failure rate was also estimated by"
                    + " importance sampling (%d further model runs) and by a fitted tail; see rare_failures in"
                    + " summary.json.", 100 * RARE_YIELD, tail.runs() + tail.searchRuns()));
        }
        PlanReport plan = null;
        String planMissing = k > 0 ? null : "the study has no uncertain inputs to vary";
        if (k > 0) {
            try {
                plan = PlanJob.run(options.engine(), study, model, space, ranking(sobol, attribution, screening),
                        work.resolve("plan"));
            } catch (PlanRefused e) {
                planMissing = e.getMessage() + "; " + e.remedy();
                notes.add("No experiment plan: " + planMissing + ".");
            } catch (ModelException e) {
                notes.add("No experiment plan: the device model refuses one of the plan's runs (" + e.getMessage()
                        + "); move plan.limits or plan.levels inside the range the model accepts.");
            }
        }
        return new Found(yield, capabilities, screening, sobol, whatIfs, ranking, allocation, tail, tailFits, plan,
                planMissing, attribution);
    }

    private List<WhatIfResult> whatIfs(List<StudyRun.WhatIfPlan> plans, SampleTable table, WhatIf.Options wOptions)
            throws IOException {
        List<WhatIfResult> out = new ArrayList<>();
        for (int i = 0; i < plans.size(); i++) {
            StudyRun.WhatIfPlan w = plans.get(i);
            WhatIfResult r = WhatIf.evaluate(table, space, study.targets(), List.of(w.change()), wOptions);
            if (r.rerunNeeded() || !r.reweighted()) {
                String phase = "what_if_" + (i + 1);
                WhatIfResult kept = phases.load(phase, WhatIfResult.class).orElse(null);
                if (kept == null) {
                    kept = WhatIfRerun.run(options.engine(), study, model, space, w.change(), r, seed, table);
                    phases.save(phase, kept, WhatIfResult.class);
                }
                r = kept;
                notes.add("What-if '" + w.change().description() + "' was re-run with new samples ("
                        + r.message() + ").");
            }
            out.add(r);
        }
        return out;
    }

    /**
     * Inputs ranked for the experiment plan: the Shapley effects when inputs are correlated (they do not
     * depend on the inputs' order), else the Sobol total indices, else the screening indices.
     */
    private List<RankedInput> ranking(SobolResult sobol, VarianceAttribution attribution, ScreeningResult screening) {
        String response = study.plan().response() == null ? "jsc" : study.plan().response();
        List<RankedInput> r = new ArrayList<>();
        if (attribution != null && attribution.shapleyLeads()) {
            for (ShapleyResult.OutputEffects oe : attribution.shapley().outputs()) {
                if (oe.output().equals(response)) {
                    for (ShapleyResult.Effect e : oe.effects()) {
                        r.add(new RankedInput(e.input(), Math.max(0, e.share())));
                    }
                }
            }
        } else if (sobol != null) {
            for (SobolResult.OutputIndices oi : sobol.outputs()) {
                if (oi.output().equals(response)) {
                    for (SobolResult.IndexEstimate e : oi.indices()) {
                        r.add(new RankedInput(e.input(), Math.max(0, e.total())));
                    }
                }
            }
        } else if (screening != null) {
            ScreeningResult.OutputScreening os = screening.output(response);
            if (os != null) {
                for (ScreeningResult.InputScreening is : os.inputs()) {
                    r.add(new RankedInput(is.input(), Math.max(Math.max(0, is.firstOrder()), is.srrc() * is.srrc())));
                }
            }
        }
        r.sort((x, y) -> Double.compare(y.totalIndex(), x.totalIndex()));
        return r;
    }

    private ProgressListener progress(String what) {
        if (options.quiet() || System.console() == null || System.getenv("CI") != null) {
            return ProgressListener.NONE;
        }
        AtomicLong last = new AtomicLong();
        return (done, total) -> {
            long now = System.nanoTime();
            long prev = last.get();
            if ((now - prev > 200_000_000L || done == total) && last.compareAndSet(prev, now)) {
                System.err.printf(Locale.ROOT, "\r%s: %d/%d model runs (%.0f %%)%s", what, done, total,
                        100.0 * done / total, done == total ? "\n" : "");
                System.err.flush();
            }
        };
    }
}
