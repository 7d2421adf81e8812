package org.fabspread.device;

import java.lang.management.ManagementFactory;

import org.fabspread.model.Evaluator;
import org.fabspread.study.Study;

/**
 * Measures the device model's speed on one thread: evaluations per second and bytes allocated per
 * evaluation (from {@code com.sun.management.ThreadMXBean#getThreadAllocatedBytes}).
 *
 * <p>The rate is evaluations per second of the thread's CPU time
 * ({@code ThreadMXBean#getCurrentThreadCpuTime}), i.e. per busy core, so that other processes sharing
 * the machine do not distort it; the loop runs for {@code seconds} of wall time.
 *
 * <p>Every evaluation gets a different input vector, so no result can be reused: each uncertain input
 * cycles through 11 values within ±0.5 % of its nominal (an input whose nominal is 0 stays 0), with
 * different cycle phases per input. A warm-up of half the measured time (on top of it) lets the JIT compile first.
 *
 * <p>The model is the one {@link DeviceModel#of} builds: for spheres with fixed metal and host optics the
 * single-sphere quantities come from its {@link SphereTable} (J_sc within 1e-4 relative of the exact path,
 * about 2e-9 on the demo study); everything else is computed afresh for every input vector. On the demo
 * study (2 shared cores) this went from about 3,600 to about 10,900 evaluations per second.
 */
public final class DeviceBenchmark {

    private DeviceBenchmark() {
    }

    /** Evaluations per second on one thread, and heap bytes allocated per evaluation. */
    public record Result(double evaluationsPerSecond, double bytesPerEvaluation) {
    }

    /** Runs the benchmark for about {@code seconds} of measured time on the calling thread. */
    public static Result run(Study study, double seconds) {
        if (!(seconds > 0)) {
            throw new IllegalArgumentException("seconds must be > 0, got " + seconds);
        }
        DeviceModel model = DeviceModel.of(study);
        Evaluator e = model.newEvaluator();
        double[] nominal = model.nominalInputs();
        int k = nominal.length;
        // the input vectors, built before timing
        final int cycle = 11;
        double[][] inputs = new double[cycle][k];
        for (int c = 0; c < cycle; c++) {
            for (int i = 0; i < k; i++) {
                int step = (c + 3 * i) % cycle - cycle / 2;
                inputs[c][i] = nominal[i] * (1 + 0.001 * step);
            }
        }
        double[] out = new double[model.outputs().size()];
        long warmNanos = (long) (0.5 * seconds * 1e9);
        long t0 = System.nanoTime();
        int c = 0;
        while (System.nanoTime() - t0 < warmNanos) {
            e.evaluate(inputs[c], out);
            c = c + 1 == cycle ? 0 : c + 1;
        }
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long tid = Thread.currentThread().getId();
        long measureNanos = (long) (seconds * 1e9);
        long bytes0 = mx.getThreadAllocatedBytes(tid);
        long cpu0 = mx.getCurrentThreadCpuTime();
        long start = System.nanoTime();
        long n = 0;
        long now;
        do {
            for (int r = 0; r < 8; r++) {
                e.evaluate(inputs[c], out);
                c = c + 1 == cycle ? 0 : c + 1;
            }
            n += 8;
            now = System.nanoTime();
        } while (now - start < measureNanos);
        long cpu1 = mx.getCurrentThreadCpuTime();
        long bytes1 = mx.getThreadAllocatedBytes(tid);
        double secs = cpu1 > cpu0 ? (cpu1 - cpu0) * 1e-9 : (now - start) * 1e-9;
        return new Result(n / secs, (double) (bytes1 - bytes0) / n);
    }
}
