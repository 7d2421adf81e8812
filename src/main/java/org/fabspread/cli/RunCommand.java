package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.fabspread.parquet.ParquetSamples;
import org.fabspread.pipeline.StudyRun;
import org.fabspread.spark.SparkEngine;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code run STUDY --out DIR}: the whole job on one study. */
@Command(name = "run", mixinStandardHelpOptions = true,
        description = {"Run a study: Monte Carlo over its uncertain inputs, yield against its targets, variance"
                + " contributions, what-ifs, which tolerance to tighten, a suggested experiment plan, and the report.",
                "Writes samples.csv, summary.json, sensitivity.csv, plan/, report.html, report.md and charts/ into DIR."})
public final class RunCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file (YAML).")
    Path studyFile;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--out", paramLabel = "DIR", description = "Folder for the results (default:"
            + " fabspread-out/<study name>). It must be new, empty, or hold results of the same study and seed.")
    Path out;

    @Option(names = "--force", description = "Replace results of another study or seed in DIR.")
    boolean force;

    @Option(names = {"-q", "--quiet"}, description = "Print nothing but errors.")
    boolean quiet;

    @Option(names = "--samples", paramLabel = "N", description = "Monte Carlo samples (default: the study's).")
    long samples;

    @Option(names = "--seed", paramLabel = "S", description = "Master seed (default: the study's).")
    Long seed;

    @Option(names = "--threads", paramLabel = "T", description = "Worker threads (default: all processors)."
            + " Results do not depend on it.")
    int threads = Runtime.getRuntime().availableProcessors();

    @Option(names = "--sobol-base", paramLabel = "N", description = "Base size N of the Sobol design (N(k + 2)"
            + " runs) and number of orders of the Shapley design (default: the study's analysis.sobol_base).")
    int sobolBase;

    @Option(names = "--resume", description = "Finish an interrupted run from its checkpoint in DIR.")
    boolean resume;

    @Option(names = "--no-report", description = "Skip the HTML/Markdown report and charts.")
    boolean noReport;

    @Option(names = "--engine", paramLabel = "E", description = "Where the model runs: local (default) or spark"
            + " (every batch of model runs as Apache Spark tasks). Results do not depend on it.")
    String engine = "local";

    @Option(names = "--master", paramLabel = "URL", description = "With --engine spark: the Spark master"
            + " (default local[2]; under spark-submit, the one it was given).")
    String master;

    @Option(names = "--samples-format", paramLabel = "F", description = "csv (default): samples.csv; parquet:"
            + " samples.csv and samples.parquet/chunk=NNNNN/part-0.parquet, one file per chunk, written by the"
            + " engine's workers (Spark executors under --engine spark).")
    String samplesFormat = "csv";

    @Override
    public Integer call() throws IOException {
        CountOptions.check(samples, sobolBase, threads);
        Study study = StudyReader.read(studyFile, dataFiles.forRun());
        if (out == null) {
            out = DefaultFolder.of(study);
        }
        PrintWriter w = spec.commandLine().getOut();
        StudyRun.Options options = StudyRun.Options.of(samples, seed, threads, resume, commandLine())
                .withSobolBase(sobolBase).withForce(force).withQuiet(quiet);
        if ("parquet".equals(samplesFormat)) {
            options = options.withSamplesStore(ParquetSamples.maker());
        } else if (!"csv".equals(samplesFormat)) {
            throw new StudyException("--samples-format: expected csv or parquet, got '" + samplesFormat + "'");
        }
        SparkEngine spark = null;
        if ("spark".equals(engine)) {
            String url = master != null ? master : System.getProperty("spark.master", "local[2]");
            spark = SparkEngine.of(url, studyFile, study, threads, spec.commandLine().getErr());
            options = options.withEngine(spark);
        } else if (!"local".equals(engine)) {
            throw new StudyException("--engine: expected local or spark, got '" + engine + "'");
        }
        StudyRun.Outcome o;
        try {
            o = new StudyRun(study, studyFile, out,
                    noReport ? options : options.withRenderer(ReportRenderer.INSTANCE), w).run();
        } finally {
            if (spark != null) {
                spark.close();
            }
        }
        if (!o.completed()) {
            return ExitCodes.FAILURE;
        }
        if (!quiet) {
            w.println("results in " + o.folder());
            if (o.report() != null) {
                w.println("report: " + o.report());
            }
        }
        w.flush();
        return ExitCodes.OK;
    }

    private String commandLine() {
        StringBuilder sb = new StringBuilder("fabspread run ").append(studyFile);
        if (out != null) {
            sb.append(" --out ").append(out);
        }
        if (samples > 0) {
            sb.append(" --samples ").append(samples);
        }
        if (seed != null) {
            sb.append(" --seed ").append(seed);
        }
        return sb.toString();
    }
}
