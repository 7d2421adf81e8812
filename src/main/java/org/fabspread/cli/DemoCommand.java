package org.fabspread.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.fabspread.io.AtomicFiles;
import org.fabspread.pipeline.ResultsRenderer;
import org.fabspread.pipeline.StudyRun;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code demo}: the whole job on the bundled demo study. */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Run the whole job on the bundled demo study (an invented pilot line: inverted PTB7:PC71BM"
                + " cells with silver nanospheres in the ZnO) and print where the report is.",
                "The study file is copied to DIR/study.yaml so you can read it, edit it and run it again with"
                        + " 'fabspread run'."})
public final class DemoCommand implements Callable<Integer> {

    /** The bundled demo studies, inside the jar. */
    static final String DEMO = "/org/fabspread/demo-studies/pilot-line-inverted.yaml";

    @Spec
    CommandSpec spec;

    @Option(names = "--out", paramLabel = "DIR", description = "Folder for the results (default: ${DEFAULT-VALUE}).")
    Path out = Path.of("fabspread-out", "demo");

    @Option(names = "--samples", paramLabel = "N", description = "Monte Carlo samples (default: the study's).")
    long samples;

    @Option(names = "--sobol-base", paramLabel = "N", description = "Base size N of the Sobol design (N(k + 2)"
            + " runs) and number of orders of the Shapley design (default: the study's analysis.sobol_base).")
    int sobolBase;

    @Option(names = "--threads", paramLabel = "T", description = "Worker threads (default: all processors).")
    int threads = Runtime.getRuntime().availableProcessors();

    @Option(names = {"-q", "--quiet"}, description = "Print nothing but errors.")
    boolean quiet;

    @Override
    public Integer call() throws IOException {
        CountOptions.check(samples, sobolBase, threads);
        byte[] text;
        try (InputStream in = DemoCommand.class.getResourceAsStream(DEMO)) {
            if (in == null) {
                throw new IllegalStateException("the demo study is missing from the jar");
            }
            text = in.readAllBytes();
        }
        Path studyFile = Files.createTempFile("fabspread-demo-", ".yaml");
        try {
            Files.write(studyFile, text);
            Study study = StudyReader.read(studyFile);
            PrintWriter w = spec.commandLine().getOut();
            if (!quiet) {
                w.println("demo study: " + study.name());
                w.println("(all process data in it is invented for the demonstration)");
            }
            ResultsRenderer withStudy = (r, dir) -> {
                AtomicFiles.write(dir.resolve("study.yaml"), o -> o.write(text));
                return ReportRenderer.INSTANCE.render(r, dir);
            };
            StudyRun.Outcome o = new StudyRun(study, studyFile, out,
                    StudyRun.Options.of(samples, null, threads, false, "fabspread demo").withForce(true)
                            .withSobolBase(sobolBase).withQuiet(quiet)
                            .withRenderer(withStudy), w).run();
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
        } finally {
            Files.deleteIfExists(studyFile);
        }
    }
}
