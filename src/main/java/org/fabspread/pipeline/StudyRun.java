package org.fabspread.pipeline;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

import org.fabspread.analysis.AttributionText;
import org.fabspread.analysis.InputGroup;
import org.fabspread.analysis.SensitivityCsv;
import org.fabspread.analysis.ShapleyEffects;
import org.fabspread.analysis.SobolIndices;
import org.fabspread.analysis.TailText;
import org.fabspread.analysis.TextSummary;
import org.fabspread.analysis.VarianceAttribution;
import org.fabspread.analysis.WhatIf;
import org.fabspread.device.DenseLayerCheck;
import org.fabspread.device.EnvelopeCounts;
import org.fabspread.device.DeviceModel;
import org.fabspread.model.ModelException;
import org.fabspread.optics.MaterialLibrary;
import org.fabspread.sampling.ChunkStore;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.FileDigest;
import org.fabspread.sampling.RunJob;
import org.fabspread.sampling.StudyDigest;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.Layer;
import org.fabspread.study.Study;
import org.fabspread.study.KeyPlaces;
import org.fabspread.study.StudyException;

/**
 * The main job, from a study file to the report: the Monte Carlo run, then the {@link Analyses} (yield and
 * capability, screening, the Sobol design, what-ifs, tolerance ranking and allocation, rare failures, the
 * suggested experiment plan), {@code summary.json}, {@code sensitivity.csv} and the report.
 *
 * <p>Everything the study or the options could get wrong is checked before anything is written. The job
 * works in the staging folder of an {@link OutputFolder} and publishes it whole at the end, so bad input,
 * a fault or an interruption never leaves a half-written result; an interrupted run continues with
 * {@link Options#resume()} from its last finished phase (Monte Carlo chunks, Sobol design, what-if re-runs,
 * importance sampling) to byte-identical files. The job fills one {@link StudyResults}; {@link SummaryJson}
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

    /** The folder of the per-chunk samples store in the results ({@code --samples-format parquet}). */
    public static final String SAMPLES_STORE = "samples.parquet";

    /** Files of the run's bookkeeping, removed before the results are published. */
    static final List<String> BOOKKEEPING = List.of(PhaseStore.STATE, PhaseStore.FOLDER, RunJob.CHECKPOINT,
            RunJob.PART);

    /**
     * @param samples   sample count (0: the study's)
     * @param seed      master seed (null: the study's)
     * @param threads   worker threads
     * @param resume    continue an interrupted run
     * @param command   the command line, for the provenance
     * @param engine    where the batches of model evaluations run
     * @param renderer  renders the results beside summary.json (the report), or null for none
     * @param force     replace results of another study or seed in the output folder
     * @param quiet     no progress and no result summary on the log; errors only
     * @param sobolBase the Sobol base size N, 0 = the study's
     * @param samplesStore makes the store each chunk's samples are also written to by its evaluator (under
     *                  {@code samples.parquet} of the results), or null for {@code samples.csv} alone
     */
    public record Options(long samples, Long seed, int threads, boolean resume, String command, Engine engine,
                          ResultsRenderer renderer, boolean force, boolean quiet, int sobolBase,
                          ChunkStore.Maker samplesStore) {

        /** Options on this machine's engine with {@code threads} threads and no renderer. */
        public static Options of(long samples, Long seed, int threads, boolean resume, String command) {
            return new Options(samples, seed, threads, resume, command, Engine.local(threads), null, false, false, 0,
                    null);
        }

        public Options withRenderer(ResultsRenderer r) {
            return new Options(samples, seed, threads, resume, command, engine, r, force, quiet, sobolBase,
                    samplesStore);
        }

        public Options withEngine(Engine e) {
            return new Options(samples, seed, threads, resume, command, e, renderer, force, quiet, sobolBase,
                    samplesStore);
        }

        public Options withForce(boolean f) {
            return new Options(samples, seed, threads, resume, command, engine, renderer, f, quiet, sobolBase,
                    samplesStore);
        }

        /** The Sobol base size N (and the Shapley design's orders), 0 = the study's {@code sobol_base}. */
        public Options withSobolBase(int n) {
            return new Options(samples, seed, threads, resume, command, engine, renderer, force, quiet, n,
                    samplesStore);
        }

        /** Each chunk's samples also written by its evaluator to the store {@code m} makes (null: none). */
        public Options withSamplesStore(ChunkStore.Maker m) {
            return new Options(samples, seed, threads, resume, command, engine, renderer, force, quiet, sobolBase, m);
        }

        public Options withQuiet(boolean q) {
            return new Options(samples, seed, threads, resume, command, engine, renderer, force, q, sobolBase,
                    samplesStore);
        }
    }

    /**
     * The outcome: results, and the renderer's main file (null when not rendered or interrupted).
     *
     * @param folder the results folder (or, interrupted, the staging folder holding the unfinished run)
     */
    public record Outcome(boolean completed, StudyResults results, Path report, Path folder) {
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
        this.log = options.quiet() ? new PrintWriter(java.io.Writer.nullWriter()) : log;
    }

    /** Runs the whole job. */
    public Outcome run() throws IOException {
        // validate everything that could be wrong before anything is written (the pass check makes too)
        RunValidation v = RunValidation.of(study, options, out);
        DeviceModel model = v.model();
        long samples = v.samples();
        long seed = v.seed();
        List<WhatIfPlan> whatIfPlans = v.whatIfs();
        SobolIndices.Options sobolOptions = v.sobol();
        ShapleyEffects.Options shapleyOptions = v.shapley();
        OutputFolder folder = OutputFolder.plan(out, options.resume(), options.force(), study.name(), seed);
        Path work = folder.work();
        String runId = StudyDigest.of(study, model) + " seed " + seed + " samples " + samples;
        PhaseStore resumed = folder.resuming() ? PhaseStore.resume(work, runId) : null;
        String mcDigest = resumed == null ? null : resumed.digest("monte_carlo").orElse(null);
        boolean fromCheckpoint = mcDigest == null && folder.resuming()
                && Files.isRegularFile(work.resolve(RunJob.CHECKPOINT));
        RunJob.Options runOptions = RunJob.Options.defaults().withSamples(samples).withSeed(seed)
                .withThreads(options.threads()).withResume(fromCheckpoint).withEngine(options.engine())
                .withTableLimit(ANALYSIS_SAMPLES).withProgress(options.quiet() ? null : RunJob.consoleProgress(samples));
        RunJob job = new RunJob(study, model, runOptions, work);
        if (options.samplesStore() != null) {
            List<String> columns = new ArrayList<>(job.inputSpace().ids());
            model.outputs().forEach(o -> columns.add(o.id()));
            job.storeChunks(options.samplesStore().at(work.resolve(SAMPLES_STORE).toAbsolutePath(), columns));
        }
        EnvelopeCounter envelope = new EnvelopeCounter(model, job.inputSpace().ids());
        job.observe(envelope);
        logPlan(samples, job.inputSpace(), sobolOptions, shapleyOptions);
        model.shapeTableOrigin().ifPresent(log::println);
        log.println(v.estimate().describe());

        try {
            folder.open(log, label(seed, folder.target()));
        } catch (IOException e) {
            Optional<String> full = DiskFullException.reason(e);
            if (full.isPresent()) {
                throw new DiskFullException(full.get(), work, folder.target(), folder.labelled(), e);
            }
            throw e;
        }
        Interruption interruption = Interruption.install(work);
        try {
            PhaseStore phases = resumed != null ? resumed : PhaseStore.fresh(work, runId);
            RunJob.Result run = mcDigest != null ? job.reload(mcDigest) : job.runWithInterruptHook();
            if (!run.completed()) {
                interruption.disarm();
                log.println("interrupted: the unfinished run is in " + work + "; run again with --resume to finish");
                log.flush();
                return new Outcome(false, null, null, work);
            }
            phases.record("monte_carlo", run.samplesSha256());
            interruption.phase("the analyses after the Monte Carlo run");
            Outcome o = finish(model, job.inputSpace(), run, envelope.counts(), seed, phases, sobolOptions, shapleyOptions, whatIfPlans,
                    folder);
            interruption.disarm();
            return o;
        } catch (StudyException e) {
            interruption.disarm();
            if (!folder.resuming()) {
                folder.discard();
            }
            throw KeyPlaces.locate(study.file(), e);
        } catch (ModelException | IllegalArgumentException e) {
            interruption.disarm();
            if (!folder.resuming()) {
                folder.discard();
            }
            throw e;
        } catch (IOException | RuntimeException | Error e) {
            interruption.disarm();
            Optional<String> full = DiskFullException.reason(e);
            if (full.isPresent()) {
                // the unfinished run stays in the labelled staging folder for --resume
                throw new DiskFullException(full.get(), work, folder.target(), true, e);
            }
            folder.discard();
            throw e;
        }
    }

    private Outcome finish(DeviceModel model, StudyInputSpace space, RunJob.Result run, EnvelopeCounts envelope, long seed, PhaseStore phases,
                           SobolIndices.Options sobolOptions, ShapleyEffects.Options shapleyOptions,
                           List<WhatIfPlan> whatIfPlans, OutputFolder folder)
            throws IOException {
        Path work = folder.work();
        List<String> notes = new ArrayList<>(model.warnings());
        DenseLayerCheck.note(model, run.table().inputs(), run.table().ok()).ifPresent(notes::add);
        if (space.repaired()) {
            notes.add("The correlation matrix was not positive definite and was repaired (eigenvalues clipped).");
        }
        if (run.tableStride() > 1) {
            notes.add("The screening, what-ifs and tolerance analyses use every " + run.tableStride() + "-th sample ("
                    + run.table().size() + " samples); the moments, yield counts and quantiles use all of them.");
        }
        long failed = run.summary().samplesRequested() - run.summary().samplesOk();
        if (failed > 0) {
            notes.add(failed + " of " + run.summary().samplesRequested() + " samples failed in the model and were"
                    + " left out of the statistics (" + run.summary().failures() + "; see samples.csv, column status).");
        }
        Analyses.Found f = new Analyses(study, model, space, options, seed, phases, notes)
                .run(run, sobolOptions, shapleyOptions, whatIfPlans, work);
        StudyResults results = new StudyResults(study, provenance(seed), model.outputs(), run.summary(), run.table(),
                f.yield(), f.capabilities(), f.screening(), f.sobol(), f.whatIfs(), f.ranking(), f.allocation(),
                f.plan(), model.nominalSpectra(), study.particleLayer().isPresent() && model.enhancementTable().isEmpty()
                        ? model.particleCrossSections() : null, notes,
                model.evaluate(model.nominalInputs()), f.tail(), f.tailFits(), f.planMissing(), f.attribution(),
                study.particleLayer().isPresent() && model.enhancementTable().isEmpty() ? envelope : null);
        SummaryJson.write(results, work);
        if (f.attribution() != null) {
            f.attribution().writeDesigns(work, model.outputs());
        }
        if (f.sobol() != null || f.screening() != null) {
            SensitivityCsv.write(work.resolve("sensitivity.csv"), f.sobol(), f.screening());
        }
        log.print(TextSummary.render(f.yield(), f.capabilities(), f.sobol(), f.screening(), f.ranking(), f.whatIfs(),
                "jsc", 5));
        log.print(AttributionText.render(f.attribution(), "jsc", 5));
        if (f.tail() != null) {
            log.print(TailText.render(f.tail(), 3));
            log.print(TailText.render(f.tailFits()));
        }
        for (String n : notes) {
            log.println("note: " + Terminal.printable(n));
        }
        Path reportPath = options.renderer() == null ? null : options.renderer().render(results, work);
        folder.commit(BOOKKEEPING);
        if (reportPath != null) {
            reportPath = folder.target().resolve(work.relativize(reportPath.toAbsolutePath().normalize()));
        }
        log.flush();
        return new Outcome(true, results, reportPath, folder.target());
    }

    private void logPlan(long samples, StudyInputSpace space, SobolIndices.Options sobolOptions,
                         ShapleyEffects.Options shapleyOptions) {
        int k = space.dimension();
        if (sobolOptions != null) {
            List<InputGroup> studyGroups = study.analysis().groups().stream()
                    .map(g -> new InputGroup(g.name(), g.inputs())).toList();
            int groups = VarianceAttribution.allGroups(space, studyGroups).size();
            log.printf(Locale.ROOT, "Monte Carlo: %d samples of %d inputs; Sobol design: N(k + 2 + groups) = %d(%d + 2"
                    + " + %d) = %d further model runs; Shapley design: N_v + m(k - 1)N_o N_i = %d further model runs%n",
                    samples, k, sobolOptions.n(), k, groups, SobolIndices.cost(sobolOptions.n(), k, groups),
                    k >= 2 ? ShapleyEffects.cost(shapleyOptions, k) : 0);
        } else {
            log.printf(Locale.ROOT, "Monte Carlo: %d samples of %d inputs%n", samples, k);
        }
        log.flush();
    }

    private String label(long seed, Path target) {
        return "This folder holds an unfinished fabspread run of study '" + Terminal.printable(study.name())
                + "' (seed " + seed + ").\nIt is not a result. Continue it with the same command and --resume;"
                + " a run without --resume replaces it.\nWhen the run finishes, this folder becomes "
                + target.getFileName() + ".\n";
    }

    /** One what-if of the study, with its change of distribution (built before running, to fail early). */
    public record WhatIfPlan(AnalysisSettings.WhatIf settings, WhatIf.Change change) {
    }

    private StudyResults.Provenance provenance(long seed) throws IOException {
        byte[] bytes = studyFile == null ? new byte[0] : Files.readAllBytes(studyFile);
        String sha = FileDigest.hex(FileDigest.sha256().digest(bytes));
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
