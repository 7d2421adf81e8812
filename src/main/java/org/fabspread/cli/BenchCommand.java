package org.fabspread.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.fabspread.device.DeviceBenchmark;
import org.fabspread.optics.PlanarBenchmark;
import org.fabspread.sampling.RunnerBenchmark;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code bench [STUDY]}: speed and memory figures. */
@Command(name = "bench", mixinStandardHelpOptions = true,
        description = {"Measure speed and memory on this machine: full-spectrum evaluations per second of the planar"
                + " stack and of the whole device model on one thread (rate per second of the thread's CPU time),"
                + " bytes allocated per evaluation, and, with --runner, the Monte Carlo runner's overhead, its"
                + " two-thread speed-up and a large run's heap use.",
                "Without STUDY the bundled demo study is used."})
public final class BenchCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "0..1", paramLabel = "STUDY", description = "A study file (default: the demo).")
    Path studyFile;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--seconds", paramLabel = "S", description = "Measuring time per figure (default: ${DEFAULT-VALUE}).")
    double seconds = 5;

    @Option(names = "--runner", description = "Also measure the runner (takes a few minutes).")
    boolean runner;

    @Option(names = "--large", paramLabel = "N", description = "Samples of the runner's large run (default:"
            + " ${DEFAULT-VALUE}); run the jar with -Xmx512m to check the heap target.")
    long large = 10_000_000L;

    @Option(names = "--dda", description = "Measure only the discrete-dipole solver and its shape tables.")
    boolean dda;

    @Override
    public Integer call() throws IOException {
        if (dda) {
            org.fabspread.dda.DdaBenchmark.run(spec.commandLine().getOut(), seconds);
            return ExitCodes.OK;
        }
        Path file = studyFile;
        if (file == null) {
            file = Files.createTempFile("fabspread-demo", ".yaml");
            file.toFile().deleteOnExit();
            try (InputStream in = BenchCommand.class.getResourceAsStream(DemoCommand.DEMO)) {
                Files.write(file, in.readAllBytes());
            }
        }
        Study study = StudyReader.read(file, dataFiles.forTools());
        PrintWriter w = spec.commandLine().getOut();
        w.println("study: " + study.name());
        PlanarBenchmark.Result p = PlanarBenchmark.run(study, seconds);
        w.printf(Locale.ROOT, "planar optics (%d layers, %d wavelengths): %.0f evaluations/s on one thread,"
                + " %.1f bytes/evaluation%n", p.layers(), p.wavelengths(), p.evaluationsPerSecond(),
                p.bytesPerEvaluation());
        w.flush();
        DeviceBenchmark.Result d = DeviceBenchmark.run(study, seconds);
        w.printf(Locale.ROOT, "device model (particles and collection, inputs sampled): %.0f evaluations/s on one"
                + " thread, %.1f bytes/evaluation%n", d.evaluationsPerSecond(), d.bytesPerEvaluation());
        w.flush();
        if (runner) {
            RunnerBenchmark.Figures f = RunnerBenchmark.measure(20_000, large);
            w.printf(Locale.ROOT, "runner: overhead %.1f %% over bare evaluation (%.0f us/evaluation model),"
                    + " two threads %.2fx one thread%n", 100 * f.overhead(), f.microsPerEval(), f.speedupTwo());
            w.printf(Locale.ROOT, "runner: %d samples on %d threads in %.1f s, peak heap %.0f MB of %.0f MB%n",
                    f.largeSamples(), f.largeThreads(), f.largeSeconds(), f.peakHeapMb(), f.maxHeapMb());
        }
        w.flush();
        return ExitCodes.OK;
    }
}
