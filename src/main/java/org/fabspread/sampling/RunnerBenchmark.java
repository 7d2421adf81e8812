package org.fabspread.sampling;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.ChargeCollection;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Layer;
import org.fabspread.study.LayerRole;
import org.fabspread.study.MaterialRef;
import org.fabspread.study.Parameter;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;
import org.fabspread.study.WavelengthGrid;

/**
 * Measures the runner: its overhead over bare model evaluation on one thread (a model burning a
 * fixed amount of arithmetic, about 100 µs per call), the speed-up on two threads, and a large run
 * of a cheap model (heap use and time). Figures only; nothing is asserted.
 */
public final class RunnerBenchmark {

    /**
     * @param microsPerEval   measured cost of one evaluation of the burning model, bare
     * @param overhead        (runner time on 1 thread) / (bare time) − 1, for the burning model
     * @param speedupTwo      runner time on 1 thread / runner time on 2 threads
     * @param largeSamples    samples of the cheap-model run
     * @param largeSeconds    its wall time
     * @param largeThreads    its thread count
     * @param peakHeapMb      peak heap use over the whole benchmark (sum of heap pools' peaks)
     * @param maxHeapMb       the heap limit
     */
    public record Figures(double microsPerEval, double overhead, double speedupTwo, long largeSamples,
                          double largeSeconds, int largeThreads, double peakHeapMb, double maxHeapMb) {
    }

    /** k inputs x0.. uniform on [0, 1], y = Σ x_i plus a burn of {@code iterations} steps. */
    record Burn(int k, int iterations) implements Model {
        @Override public List<String> inputIds() {
            List<String> ids = new ArrayList<>();
            for (int i = 0; i < k; i++) {
                ids.add("x" + i);
            }
            return ids;
        }

        @Override public List<OutputDef> outputs() {
            return List.of(new OutputDef("y", "1", "sum"), new OutputDef("w", "1", "burn result"));
        }

        @Override public Evaluator newEvaluator() {
            return (x, out) -> {
                double s = 0;
                for (int i = 0; i < k; i++) {
                    s += x[i];
                }
                double w = s;
                for (int i = 0; i < iterations; i++) {
                    w = w * 0.999999 + Math.sqrt(w + i);
                }
                out[0] = s;
                out[1] = w;
            };
        }
    }

    /** Keeps the bare loop's results observable so the JIT cannot drop the evaluations. */
    static volatile double blackhole;

    static Study study(int k, long samples) {
        List<Layer> stack = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            Parameter p = new Parameter("x" + i, "1", new DistributionSpec.Uniform(0, 1), SourceLocation.unknown("x" + i));
            stack.add(new Layer("l" + i, MaterialRef.bundled("bench"), p, false, LayerRole.OTHER, null, null));
        }
        ChargeCollection cc = new ChargeCollection(Parameter.fixed("collection.dissociation", "1", 1),
                Parameter.fixed("collection.electron_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.hole_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.built_in_voltage", "V", 0.8),
                Parameter.fixed("collection.quenching_distance", "nm", 0), false);
        AnalysisSettings a = new AnalysisSettings(samples, 1, AnalysisSettings.Sampler.RANDOM,
                AnalysisSettings.Sensitivity.NONE, 64, 0, AnalysisSettings.FailurePolicy.REJECT, List.of(), Double.NaN,
                0.95, false);
        return new Study(null, "benchmark", "runner benchmark", new WavelengthGrid(400, 800, 10), stack, null, cc, null,
                List.of(), a, null, Map.of(), List.of());
    }

    private static double bareSeconds(Model model, long n) {
        Evaluator ev = model.newEvaluator();
        int k = model.inputIds().size();
        double[] x = new double[k];
        double[] y = new double[model.outputs().size()];
        double sink = 0;
        long t0 = System.nanoTime();
        for (long j = 0; j < n; j++) {
            for (int i = 0; i < k; i++) {
                x[i] = ((j * 31 + i * 17) % 1000) / 1000.0;
            }
            ev.evaluate(x, y);
            sink += y[1];
        }
        double s = (System.nanoTime() - t0) * 1e-9;
        blackhole = sink;
        return s;
    }

    private static double runSeconds(Model model, Study study, int threads, Path dir) throws IOException {
        RunJob.Options o = RunJob.Options.defaults().withThreads(threads);
        long t0 = System.nanoTime();
        new RunJob(study, model, o, dir).run();
        double s = (System.nanoTime() - t0) * 1e-9;
        deleteTree(dir);
        return s;
    }

    /**
     * Runs the three measurements in a temporary folder (the first two as the best of three interleaved
     * repetitions).
     *
     * @param burnSamples   samples of the ~100 µs model (e.g. 20 000: 2 s per pass)
     * @param largeSamples  samples of the cheap run (10^7 for the headline figure)
     */
    public static Figures measure(long burnSamples, long largeSamples) throws IOException {
        int k = 8;
        Path tmp = Files.createTempDirectory("fabspread-bench");
        try {
            // calibrate the burn to about 100 µs
            int iters = 1000;
            double per = bareSeconds(new Burn(k, iters), 2000) / 2000;
            iters = (int) Math.max(1000, iters * 100e-6 / per);
            Burn burn = new Burn(k, iters);
            Study s = study(k, burnSamples);
            bareSeconds(burn, burnSamples / 4);
            runSeconds(burn, s, 1, tmp.resolve("warm"));
            // interleaved repetitions, best of three each: the machine is shared
            double bare = Double.POSITIVE_INFINITY;
            double one = Double.POSITIVE_INFINITY;
            double two = Double.POSITIVE_INFINITY;
            for (int rep = 0; rep < 3; rep++) {
                bare = Math.min(bare, bareSeconds(burn, burnSamples));
                one = Math.min(one, runSeconds(burn, s, 1, tmp.resolve("one")));
                two = Math.min(two, runSeconds(burn, s, 2, tmp.resolve("two")));
            }
            Burn cheap = new Burn(k, 0);
            int threads = Runtime.getRuntime().availableProcessors();
            double large = runSeconds(cheap, study(k, largeSamples), threads, tmp.resolve("large"));
            double peak = 0;
            for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
                if (p.getType() == MemoryType.HEAP) {
                    peak += p.getPeakUsage().getUsed();
                }
            }
            return new Figures(bare / burnSamples * 1e6, one / bare - 1, one / two, largeSamples, large, threads,
                    peak / 1048576.0, Runtime.getRuntime().maxMemory() / 1048576.0);
        } finally {
            deleteTree(tmp);
        }
    }

    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }

    /** {@code java -Xmx512m ... RunnerBenchmark [burnSamples] [largeSamples]}. */
    public static void main(String[] args) throws IOException {
        long burn = args.length > 0 ? Long.parseLong(args[0]) : 20_000;
        long large = args.length > 1 ? Long.parseLong(args[1]) : 10_000_000;
        Figures f = measure(burn, large);
        System.out.printf("bare evaluation          %.1f us per sample%n", f.microsPerEval());
        System.out.printf("runner overhead, 1 thread %.2f %%%n", 100 * f.overhead());
        System.out.printf("speed-up on 2 threads     %.2f x%n", f.speedupTwo());
        System.out.printf("cheap model, %d samples on %d threads: %.1f s (%.0f samples/s)%n", f.largeSamples(),
                f.largeThreads(), f.largeSeconds(), f.largeSamples() / f.largeSeconds());
        System.out.printf("peak heap %.0f MB of %.0f MB%n", f.peakHeapMb(), f.maxHeapMb());
    }
}
