package org.fabspread.pipeline;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.atomic.AtomicLong;

import org.fabspread.analysis.Capability;
import org.fabspread.analysis.ProgressListener;
import org.fabspread.analysis.Screening;
import org.fabspread.analysis.ScreeningResult;
import org.fabspread.analysis.SensitivityCsv;
import org.fabspread.analysis.AttributionText;
import org.fabspread.analysis.InputGroup;
import org.fabspread.analysis.ShapleyEffects;
import org.fabspread.analysis.ShapleyResult;
import org.fabspread.analysis.SobolIndices;
import org.fabspread.analysis.SobolResult;
import org.fabspread.analysis.TailFit;
import org.fabspread.analysis.TailFitResult;
import org.fabspread.analysis.TailText;
import org.fabspread.analysis.TailYield;
import org.fabspread.analysis.TailYieldResult;
import org.fabspread.analysis.TextSummary;
import org.fabspread.analysis.ToleranceAdvisor;
import org.fabspread.analysis.ToleranceAllocation;
import org.fabspread.analysis.ToleranceRanking;
import org.fabspread.analysis.VarianceAttribution;
import org.fabspread.analysis.WhatIf;
import org.fabspread.analysis.WhatIfResult;
import org.fabspread.analysis.YieldEstimate;
import org.fabspread.analysis.YieldResult;
import org.fabspread.device.DenseLayerCheck;
import org.fabspread.device.DeviceModel;
import org.fabspread.model.ModelException;
import org.fabspread.optics.MaterialLibrary;
import org.fabspread.plan.PlanJob;
import org.fabspread.plan.PlanRefused;
import org.fabspread.plan.PlanReport;
import org.fabspread.plan.RankedInput;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.RunJob;
import org.fabspread.sampling.SampleTable;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Layer;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;

/**
 * The main job, from a study file to the report: the Monte Carlo run, yield and capability, the
 * given-data screening, the Sobol design (when the study asks for it), the what-ifs (reweighted, or
 * re-run when the effective sample size is too small), the tolerance ranking and allocation, the
 * suggested experiment plan, {@code summary.json}, {@code sensitivity.csv} and the report.
 *
 * <p>Everything the study or the options could get wrong is checked before the output folder is
 * created, so bad input leaves nothing behind. The job fills one {@link StudyResults}; {@link SummaryJson}
 * renders {@code summary.json} from it and the options' {@link ResultsRenderer} (the report, from the
 * command line) renders the rest. Every batch of model evaluations goes through the options'
 * {@link Engine}. No command-line library is involved: a library user drives the job directly.
 */
public final class StudyRun {

    /**
     * The analyses after the run (screening, what-ifs, tolerance) work on at most this many samples held in
     * memory (every s-th sample of a larger run, said in the notes); the summary's moments, yield counts and
     * quantiles always use every sample.
     */
    static final long ANALYSIS_SAMPLES = 250_000;

    /** Above this yield of all targets the rare-failure estimators run too. */
    static final double RARE_YIELD = 0.999;

    /**
     * @param samples   sample count (0: the study's)
     * @param seed      master seed (null: the study's)
     * @param threads   worker threads
     * @param resume    continue an interrupted run
     * @param command   the command line, for the provenance
     * @param engine    where the batches of model evaluations run
     * @param renderer  renders the results beside summary.json (the report), or null for none
     */
    public record Options(long samples, Long seed, int threads, boolean resume, String command, Engine engine,
                          ResultsRenderer renderer, int sobolBase) {

        /** Options on this machine's engine with {@code threads} threads and no renderer. */
        public static Options of(long samples, Long seed, int threads, boolean resume, String command) {
            return new Options(samples, seed, threads, resume, command, Engine.local(threads), null, 0);
        }

        public Options withRenderer(ResultsRenderer r) {
            return new Options(samples, seed, threads, resume, command, engine, r, sobolBase);
        }

        public Options withEngine(Engine e) {
            return new Options(samples, seed, threads, resume, command, e, renderer, sobolBase);
        }

        /** The Sobol base size N (and the Shapley design's orders), 0 = the study's {@code sobol_base}. */
        public Options withSobolBase(int n) {
            return new Options(samples, seed, threads, resume, command, engine, renderer, n);
        }
    }

    /** The outcome: results, and the renderer's main file (null when not rendered or interrupted). */
    public record Outcome(boolean completed, StudyResults results, Path report) {
    }

    private final Study study;
    private final Path studyFile;
    private final Path out;
    private final Options options;
    private final PrintWriter log;

    public StudyRun(Study study, Path studyFile, Path out, Options options, PrintWriter log) {
        this.study = study;
        this.studyFile = studyFile;
        this.out = out;
        this.options = options;
        this.log = log;
    }

    /** Runs the whole job. */
    public Outcome run() throws IOException {
        DeviceModel model = DeviceModel.of(study);
        AnalysisSettings a = study.analysis();
        long samples = options.samples() > 0 ? options.samples() : a.samples();
        long seed = options.seed() != null ? options.seed() : a.seed();
        // validate everything that could be wrong before anything is written
        List<WhatIfPlan> whatIfPlans = whatIfPlans();
        SobolIndices.Options sobolOptions = a.sensitivity() == AnalysisSettings.Sensitivity.SOBOL
                ? SobolIndices.Options.from(a, options.sobolBase(), options.threads()).withSeed(seed) : null;
        ShapleyEffects.Options shapleyOptions = ShapleyEffects.Options.from(a, options.sobolBase(), seed,
                options.threads());
        RunJob.Options runOptions = RunJob.Options.defaults().withSamples(samples).withSeed(seed)
                .withThreads(options.threads()).withResume(options.resume()).withEngine(options.engine()).withTableLimit(ANALYSIS_SAMPLES)
                .withProgress(RunJob.consoleProgress(samples));
        RunJob job = new RunJob(study, model, runOptions, out);
        StudyInputSpace space = job.inputSpace();
        int k = space.dimension();
        List<InputGroup> studyGroups = a.groups().stream().map(g -> new InputGroup(g.name(), g.inputs())).toList();
        if (sobolOptions != null) {
            int groups = VarianceAttribution.allGroups(space, studyGroups).size();
            log.printf(Locale.ROOT, "Monte Carlo: %d samples of %d inputs; Sobol design: N(k + 2 + groups) = %d(%d + 2"
                    + " + %d) = %d further model runs; Shapley design: N_v + m(k - 1)N_o N_i = %d further model runs%n",
                    samples, k, sobolOptions.n(), k, groups, SobolIndices.cost(sobolOptions.n(), k, groups),
                    k >= 2 ? ShapleyEffects.cost(shapleyOptions, k) : 0);
        } else {
            log.printf(Locale.ROOT, "Monte Carlo: %d samples of %d inputs%n", samples, k);
        }
        log.flush();

        RunJob.Result run = job.runWithInterruptHook();
        if (!run.completed()) {
            log.println("interrupted: a checkpoint is in " + out + "; run again with --resume to finish");
            log.flush();
            return new Outcome(false, null, null);
        }
        List<String> notes = new ArrayList<>(model.warnings());
        DenseLayerCheck.note(model, run.table().inputs(), run.table().ok()).ifPresent(notes::add);
        if (space.repaired()) {
            notes.add("The correlation matrix was not positive definite and was repaired (eigenvalues clipped).");
        }
        if (run.tableStride() > 1) {
            notes.add("The screening, what-ifs and tolerance analyses use every " + run.tableStride() + "-th sample ("
                    + run.table().size() + " samples); the moments, yield counts and quantiles use all of them.");
        }
        SampleTable table = run.table();
        long failed = run.summary().samplesRequested() - run.summary().samplesOk();
        if (failed > 0) {
            notes.add(failed + " of " + run.summary().samplesRequested() + " samples failed in the model and were"
                    + " left out of the statistics (" + run.summary().failures() + "; see samples.csv, column status).");
        }
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
            attribution = VarianceAttribution.run(options.engine(), model, space, sobolOptions, shapleyOptions,
                    studyGroups, progress("Sobol design"), progress("Shapley design"));
            sobol = attribution.sobol();
        }

        WhatIf.Options wOptions = WhatIfRerun.options(space, conf);
        List<WhatIfResult> whatIfs = new ArrayList<>();
        if (!study.targets().isEmpty()) {
            for (WhatIfPlan w : whatIfPlans) {
                WhatIfResult r = WhatIf.evaluate(table, space, study.targets(), List.of(w.change()), wOptions);
                if (r.rerunNeeded() || !r.reweighted()) {
                    r = WhatIfRerun.run(options.engine(), study, model, space, w.change(), r, seed, table,
                            options.threads());
                    notes.add("What-if '" + w.change().description() + "' was re-run with new samples ("
                            + r.message() + ").");
                }
                whatIfs.add(r);
            }
        }
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
            tail = TailYield.estimate(options.engine(), model, space, study.targets(),
                    TailYield.Options.defaults().withSeed(seed).withConfidence(conf).withThreads(options.threads()));
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
                plan = PlanJob.run(study, model, space, ranking(sobol, attribution, screening), out.resolve("plan"));
            } catch (PlanRefused e) {
                planMissing = e.getMessage() + "; " + e.remedy();
                notes.add("No experiment plan: " + planMissing + ".");
            } catch (ModelException e) {
                notes.add("No experiment plan: the device model refuses one of the plan's runs (" + e.getMessage()
                        + "); move plan.limits or plan.levels inside the range the model accepts.");
            }
        }

        StudyResults results = new StudyResults(study, provenance(seed), model.outputs(), run.summary(), table, yield,
                capabilities, screening, sobol, whatIfs, ranking, allocation, plan, model.nominalSpectra(),
                study.particleLayer().isPresent() && model.enhancementTable().isEmpty()
                        ? model.particleCrossSections() : null, notes,
                model.evaluate(model.nominalInputs()), tail, tailFits, planMissing, attribution);
        SummaryJson.write(results, out);
        if (attribution != null) {
            attribution.writeDesigns(out, model.outputs());
        }
        if (sobol != null || screening != null) {
            SensitivityCsv.write(out.resolve("sensitivity.csv"), sobol, screening);
        }

        log.print(TextSummary.render(yield, capabilities, sobol, screening, ranking, whatIfs, "jsc", 5));
        log.print(AttributionText.render(attribution, "jsc", 5));
        if (tail != null) {
            log.print(TailText.render(tail, 3));
            log.print(TailText.render(tailFits));
        }
        for (String n : notes) {
            log.println("note: " + n);
        }
        Path reportPath = null;
        if (options.renderer() != null) {
            reportPath = options.renderer().render(results, out);
        }
        log.flush();
        return new Outcome(true, results, reportPath);
    }

    /** One what-if of the study, with its change of distribution (built before running, to fail early). */
    record WhatIfPlan(AnalysisSettings.WhatIf settings, WhatIf.Change change) {
    }

    private List<WhatIfPlan> whatIfPlans() {
        Map<String, DistributionSpec> specs = ToleranceAdvisor.specs(study);
        List<WhatIfPlan> plans = new ArrayList<>();
        for (AnalysisSettings.WhatIf w : study.analysis().whatIfs()) {
            DistributionSpec spec = specs.get(w.input());
            if (spec == null) {
                throw StudyException.at(w.where(), "'" + w.input() + "' is not an uncertain input");
            }
            plans.add(new WhatIfPlan(w, WhatIf.change(spec, w)));
        }
        return plans;
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
        if (System.console() == null || System.getenv("CI") != null) {
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

    private StudyResults.Provenance provenance(long seed) throws IOException {
        byte[] bytes = studyFile == null ? new byte[0] : Files.readAllBytes(studyFile);
        String sha;
        try {
            sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
        Map<String, String> materials = new LinkedHashMap<>();
        MaterialLibrary lib = MaterialLibrary.bundled();
        for (Layer l : study.stack()) {
            materials.putIfAbsent(l.material().id(), lib.resolve(l.material()).source());
        }
        study.particleLayer().ifPresent(p -> materials.putIfAbsent(p.metal().id(), lib.resolve(p.metal()).source()));
        return new StudyResults.Provenance(BuildInfo.version(), BuildInfo.commit(), BuildInfo.date(),
                Instant.now().truncatedTo(ChronoUnit.SECONDS).toString(), seed, sha,
                new String(bytes, StandardCharsets.UTF_8), materials, options.command());
    }
}
