package org.fabspread.cli;

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
import org.fabspread.analysis.WhatIf;
import org.fabspread.analysis.WhatIfResult;
import org.fabspread.analysis.YieldEstimate;
import org.fabspread.analysis.YieldResult;
import org.fabspread.device.DeviceModel;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.optics.MaterialLibrary;
import org.fabspread.particles.EffectiveMedium;
import org.fabspread.plan.PlanJob;
import org.fabspread.plan.PlanReport;
import org.fabspread.plan.RankedInput;
import org.fabspread.report.ReportWriter;
import org.fabspread.report.StudyReport;
import org.fabspread.report.StudyResults;
import org.fabspread.sampling.Chunk;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.Intervals;
import org.fabspread.sampling.PointSets;
import org.fabspread.sampling.RunJob;
import org.fabspread.sampling.Runner;
import org.fabspread.sampling.SampleTable;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Layer;
import org.fabspread.study.ParticleLayer;
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
 * created, so bad input leaves nothing behind.
 */
public final class StudyRun {

    /** What-ifs re-run with at most this many samples when reweighting cannot be trusted. */
    static final int RERUN_SAMPLES = 2000;

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
     * @param report    write the report (HTML, Markdown, charts)
     * @param command   the command line, for the provenance
     */
    public record Options(long samples, Long seed, int threads, boolean resume, boolean report, String command) {
    }

    /** The outcome: results, and where the report went (null when not written or interrupted). */
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
                ? SobolIndices.Options.from(a, options.threads()).withSeed(seed) : null;
        RunJob.Options runOptions = RunJob.Options.defaults().withSamples(samples).withSeed(seed)
                .withThreads(options.threads()).withResume(options.resume()).withTableLimit(ANALYSIS_SAMPLES)
                .withProgress(RunJob.consoleProgress(samples));
        RunJob job = new RunJob(study, model, runOptions, out);
        StudyInputSpace space = job.inputSpace();
        int k = space.dimension();
        if (sobolOptions != null) {
            log.printf(Locale.ROOT, "Monte Carlo: %d samples of %d inputs; Sobol design: N(k + 2) = %d(%d + 2) = %d"
                    + " further model runs%n", samples, k, sobolOptions.n(), k, SobolIndices.cost(sobolOptions.n(), k));
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
        denseSamples(model, run.table(), notes);
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
        if (sobolOptions != null && k > 0) {
            sobol = SobolIndices.compute(model, space, sobolOptions, progress("Sobol design"));
        }

        WhatIf.Options wOptions = whatIfOptions(space, conf);
        List<WhatIfResult> whatIfs = new ArrayList<>();
        if (!study.targets().isEmpty()) {
            for (WhatIfPlan w : whatIfPlans) {
                WhatIfResult r = WhatIf.evaluate(table, space, study.targets(), List.of(w.change()), wOptions);
                if (r.rerunNeeded() || !r.reweighted()) {
                    r = rerun(model, space, w, r, seed, table);
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
            tail = TailYield.estimate(model, space, study.targets(), TailYield.Options.defaults().withSeed(seed)
                    .withConfidence(conf).withThreads(options.threads()));
            tailFits = TailFit.of(table, study.targets(), TailFit.Options.defaults().withSeed(seed)
                    .withConfidence(conf));
            notes.add(String.format(Locale.ROOT, "The yield is above %.1f %%: the failure rate was also estimated by"
                    + " importance sampling (%d further model runs) and by a fitted tail; see rare_failures in"
                    + " summary.json.", 100 * RARE_YIELD, tail.runs() + tail.searchRuns()));
        }

        PlanReport plan = null;
        if (k > 0) {
            try {
                plan = PlanJob.run(study, model, space, ranking(sobol, screening), out.resolve("plan"));
            } catch (ModelException e) {
                notes.add("No experiment plan: the device model refuses one of the plan's runs (" + e.getMessage()
                        + "); move plan.limits or plan.levels inside the range the model accepts.");
            }
        }

        StudyResults results = new StudyResults(study, provenance(seed), model.outputs(), run.summary(), table, yield,
                capabilities, screening, sobol, whatIfs, ranking, allocation, plan, model.nominalSpectra(),
                study.particleLayer().isPresent() && model.enhancementTable().isEmpty()
                        ? model.particleCrossSections() : null, notes,
                model.evaluate(model.nominalInputs()));

        Map<String, Object> sections = new LinkedHashMap<>();
        sections.put("nominal", nominalSection(model, results.nominalOutputs()));
        if (yield != null) {
            sections.put("yield", yield);
            sections.put("capability", capabilities);
        }
        if (tail != null) {
            Map<String, Object> rare = new LinkedHashMap<>();
            rare.put("importance_sampling", tail);
            rare.put("fitted_tail", tailFits);
            sections.put("rare_failures", rare);
        }
        if (screening != null) {
            sections.put("screening", screening);
        }
        if (sobol != null) {
            sections.put("sobol", sobol);
        }
        sections.put("what_ifs", whatIfs);
        if (ranking != null) {
            sections.put("tolerance_ranking", ranking);
        }
        if (allocation != null) {
            sections.put("tolerance_allocation", allocation);
        }
        if (plan != null) {
            sections.put("plan", plan);
        }
        sections.put("notes", notes);
        sections.put("provenance", provenanceSection(results.provenance()));
        run.summary().write(out.resolve(RunJob.SUMMARY), sections);
        if (sobol != null || screening != null) {
            SensitivityCsv.write(out.resolve("sensitivity.csv"), sobol, screening);
        }

        log.print(TextSummary.render(yield, capabilities, sobol, screening, ranking, whatIfs, "jsc", 5));
        if (tail != null) {
            log.print(TailText.render(tail, 3));
            log.print(TailText.render(tailFits));
        }
        for (String n : notes) {
            log.println("note: " + n);
        }
        Path reportPath = null;
        if (options.report()) {
            reportPath = ReportWriter.write(StudyReport.build(results), out);
        }
        log.flush();
        return new Outcome(true, results, reportPath);
    }

    /** Counts the samples whose particle layer is dense enough to strain Maxwell Garnett. */
    private void denseSamples(DeviceModel model, SampleTable table, List<String> notes) {
        if (study.particleLayer().isEmpty() || model.enhancementTable().isPresent()
                || study.particles().mixingRule() != ParticleLayer.MixingRule.MAXWELL_GARNETT) {
            return;
        }
        int k = table.inputIds().size();
        double[] x = new double[k];
        long dense = 0;
        for (int j = 0; j < table.size(); j++) {
            for (int i = 0; i < k; i++) {
                x[i] = table.inputs()[i][j];
            }
            dense += EffectiveMedium.isDense(model.particleVolumeFraction(x)) ? 1 : 0;
        }
        if (dense > 0) {
            notes.add(String.format(Locale.ROOT, "%d of %d samples have a particle volume fraction above %.1f, where"
                    + " Maxwell Garnett is unreliable; consider mixing: bruggeman.", dense, table.size(),
                    EffectiveMedium.DENSE_LIMIT));
        }
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

    /** The copula's normal-score correlation over all inputs, for reweighting correlated inputs. */
    static WhatIf.Options whatIfOptions(StudyInputSpace space, double confidence) {
        WhatIf.Options o = WhatIf.Options.defaults().withConfidence(confidence);
        if (!space.correlated()) {
            return o;
        }
        int k = space.dimension();
        double[][] full = new double[k][k];
        for (int i = 0; i < k; i++) {
            full[i][i] = 1;
        }
        List<String> ids = space.ids();
        List<String> block = space.correlatedIds();
        double[][] r = space.normalCorrelation();
        for (int i = 0; i < block.size(); i++) {
            for (int j = 0; j < block.size(); j++) {
                full[ids.indexOf(block.get(i))][ids.indexOf(block.get(j))] = r[i][j];
            }
        }
        return o.withCorrelation(full);
    }

    /**
     * A what-if whose reweighting cannot be trusted (too few effective samples, or a widened normal):
     * new samples from the changed distribution, counted against the targets.
     */
    private WhatIfResult rerun(Model model, InputSpace space, WhatIfPlan w, WhatIfResult reweighted, long seed,
                               SampleTable before) throws IOException {
        InputSpace changed = WhatIf.modifiedSpace(space, List.of(w.change()));
        int n = (int) Math.min(RERUN_SAMPLES, Math.max(200, before.size()));
        long rerunSeed = seed ^ 0x5DEECE66DL ^ (long) w.change().input().hashCode();
        AnalysisSettings.Sampler sampler = study.analysis().sampler();
        Runner runner = new Runner(model, changed, PointSets.of(sampler, changed.dimension(), n, rerunSeed),
                rerunSeed, new Runner.Config(options.threads(), Runner.DEFAULT_CHUNK, study.analysis().onFailure()));
        List<Target> targets = study.targets();
        int[] outIndex = new int[targets.size()];
        for (int t = 0; t < targets.size(); t++) {
            outIndex[t] = model.outputIndex(targets.get(t).output());
        }
        long[] met = new long[targets.size() + 1];
        long[] ok = new long[1];
        int m = model.outputs().size();
        runner.run(0, (Chunk c) -> {
            for (int row = 0; row < c.count(); row++) {
                if (!c.ok(row)) {
                    continue;
                }
                ok[0]++;
                boolean all = true;
                for (int t = 0; t < targets.size(); t++) {
                    boolean pass = targets.get(t).isMet(c.y()[row * m + outIndex[t]]);
                    met[t] += pass ? 1 : 0;
                    all &= pass;
                }
                met[targets.size()] += all ? 1 : 0;
            }
        }, null);
        List<WhatIfResult.WeightedYield> yields = new ArrayList<>();
        for (int t = 0; t <= targets.size(); t++) {
            WhatIfResult.WeightedYield old = reweighted.yields().get(Math.min(t, reweighted.yields().size() - 1));
            double p = ok[0] == 0 ? Double.NaN : (double) met[t] / ok[0];
            var ci = Intervals.wilson(met[t], ok[0], study.analysis().confidence());
            double se = ok[0] == 0 ? Double.NaN : Math.sqrt(p * (1 - p) / ok[0]);
            long nBefore = 0;
            for (boolean good : before.ok()) {
                nBefore += good ? 1 : 0;
            }
            yields.add(new WhatIfResult.WeightedYield(old.spec(), old.before(), p, se, ci.low(), ci.high(),
                    Intervals.newcombeDifference(met[t], ok[0], Math.round(old.before() * nBefore), nBefore,
                            study.analysis().confidence())));
        }
        String message = String.format(Locale.ROOT, "re-run with %d new samples; reweighting was not usable: %s",
                ok[0], reweighted.message().isEmpty() ? "see the effective sample size" : reweighted.message());
        return new WhatIfResult(reweighted.description(), reweighted.inputs(), false, false, message, (int) ok[0],
                ok[0], 1.0, 1.0, yields, reweighted.outputs());
    }

    /** Inputs ranked for the experiment plan: Sobol total indices, or the screening indices. */
    private List<RankedInput> ranking(SobolResult sobol, ScreeningResult screening) {
        String response = study.plan().response() == null ? "jsc" : study.plan().response();
        List<RankedInput> r = new ArrayList<>();
        if (sobol != null) {
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

    private Map<String, Object> nominalSection(DeviceModel model, double[] y) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (int i = 0; i < y.length; i++) {
            m.put(model.outputs().get(i).id(), y[i]);
        }
        return m;
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

    private static Map<String, Object> provenanceSection(StudyResults.Provenance p) {
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
