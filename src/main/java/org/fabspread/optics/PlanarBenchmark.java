package org.fabspread.optics;

import java.lang.management.ManagementFactory;

import org.fabspread.study.Study;

/**
 * Measures the speed of full-spectrum {@link PlanarOptics} evaluations on the calling thread, and the
 * heap bytes each allocates (via {@code com.sun.management.ThreadMXBean#getThreadAllocatedBytes}
 * where the JVM offers it). Thicknesses are varied a little from evaluation to evaluation so that
 * every evaluation is a fresh solve.
 *
 * <p>The rate is counted per second of the thread's own CPU time when the JVM can measure it, so that
 * other processes on a shared machine do not distort it; otherwise per second of wall-clock time.
 */
public final class PlanarBenchmark {

    /**
     * @param evaluationsPerSecond full-spectrum evaluations per second of one thread's CPU time
     * @param bytesPerEvaluation   heap bytes allocated per evaluation (NaN when the JVM cannot tell)
     * @param layers               layers of the stack (the substrate included)
     * @param wavelengths          points of the wavelength grid
     */
    public record Result(double evaluationsPerSecond, double bytesPerEvaluation, int layers, int wavelengths) {
    }

    private PlanarBenchmark() {
    }

    /**
     * Runs a warm-up of a quarter of the time (at most 2 s) and then measures for {@code seconds}.
     */
    public static Result run(Study study, double seconds) {
        if (!(seconds > 0)) {
            throw new IllegalArgumentException("seconds must be > 0, got " + seconds);
        }
        PlanarOptics po = PlanarOptics.of(study);
        SpectralResult res = po.newResult();
        double[] nominal = po.nominalThicknesses();
        double[] d = nominal.clone();
        double[] shift = po.nominalShifts();
        double[] scale = po.nominalScales();
        int layers = nominal.length;

        double sink = 0;
        long warmEnd = System.nanoTime() + (long) (Math.min(2.0, 0.25 * seconds) * 1e9);
        long counter = 0;
        while (System.nanoTime() < warmEnd) {
            for (int r = 0; r < 50; r++) {
                vary(nominal, d, counter++);
                sink += po.evaluate(d, shift, scale, res);
            }
        }

        com.sun.management.ThreadMXBean bean = allocationBean();
        long tid = Thread.currentThread().getId();
        java.lang.management.ThreadMXBean cpuBean = ManagementFactory.getThreadMXBean();
        boolean cpu = cpuBean.isCurrentThreadCpuTimeSupported();
        if (cpu && !cpuBean.isThreadCpuTimeEnabled()) {
            cpuBean.setThreadCpuTimeEnabled(true);
        }
        long bytes0 = bean == null ? 0 : bean.getThreadAllocatedBytes(tid);
        long cpu0 = cpu ? cpuBean.getCurrentThreadCpuTime() : 0;
        long evals = 0;
        long t0 = System.nanoTime();
        long end = t0 + (long) (seconds * 1e9);
        long now;
        do {
            for (int r = 0; r < 50; r++) {
                vary(nominal, d, counter++);
                sink += po.evaluate(d, shift, scale, res);
            }
            evals += 50;
            now = System.nanoTime();
        } while (now < end);
        long cpu1 = cpu ? cpuBean.getCurrentThreadCpuTime() : 0;
        long bytes1 = bean == null ? 0 : bean.getThreadAllocatedBytes(tid);
        long elapsed = cpu && cpu1 > cpu0 ? cpu1 - cpu0 : now - t0;
        double perSecond = evals / (elapsed * 1e-9);
        double perEval = bean == null ? Double.NaN : (double) (bytes1 - bytes0) / evals;
        if (Double.isNaN(sink)) {
            throw new IllegalStateException("an evaluation produced NaN");
        }
        return new Result(perSecond, perEval, layers, po.layerOptics().wavelengthCount());
    }

    /** ±1 % deterministic thickness variations around the nominal (the substrate stays). */
    private static void vary(double[] nominal, double[] d, long counter) {
        for (int j = 1; j < d.length; j++) {
            double u = ((counter * 7919 + j * 104729) % 1000) / 1000.0;
            d[j] = nominal[j] * (0.99 + 0.02 * u);
        }
    }

    private static com.sun.management.ThreadMXBean allocationBean() {
        java.lang.management.ThreadMXBean b = ManagementFactory.getThreadMXBean();
        if (b instanceof com.sun.management.ThreadMXBean sun && sun.isThreadAllocatedMemorySupported()) {
            if (!sun.isThreadAllocatedMemoryEnabled()) {
                sun.setThreadAllocatedMemoryEnabled(true);
            }
            return sun;
        }
        return null;
    }
}
