package org.fabspread.particles;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Locale;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;

/**
 * Plain timing harness for the particle ensemble (not a test: it asserts nothing and only prints).
 * Run after {@code mvn test-compile} with target/classes, target/test-classes and the dependencies on the
 * class path: {@code java org.fabspread.particles.EnsembleBenchmark [seconds per case]}.
 *
 * <p>Set-up as the device model uses it: 12 Gauss–Hermite nodes, D₅₀ = 36 nm, CV = 0.3, silver
 * (ag-johnson-christy, size-corrected), 121 wavelengths 300–900 nm; one "sample" is one setShape plus
 * 121 compute calls. Times are the thread's CPU time (the build machine is shared), so they leave out
 * waiting for a core but not the cache and frequency effects of neighbours.
 */
public final class EnsembleBenchmark {
    private static final int WAVELENGTHS = 121;
    private static final ThreadMXBean MX = ManagementFactory.getThreadMXBean();
    private static volatile double sink;

    private EnsembleBenchmark() {
    }

    public static void main(String[] args) {
        double seconds = args.length > 0 ? Double.parseDouble(args[0]) : 2;
        NkTable ag = MaterialLibrary.bundled().get("ag-johnson-christy");
        double[] lam = new double[WAVELENGTHS];
        double[] er = new double[WAVELENGTHS];
        double[] ei = new double[WAVELENGTHS];
        for (int i = 0; i < WAVELENGTHS; i++) {
            lam[i] = 300 + 5 * i;
            double n = ag.n(lam[i]);
            double k = ag.k(lam[i]);
            er[i] = n * n - k * k;
            ei[i] = 2 * n * k;
        }
        System.out.println("case                                   ns/call   us/sample");
        for (int round = 0; round < 2; round++) {
            // round 0 is warm-up for the JIT; round 1 is reported
            boolean print = round == 1;
            ensemble("sphere, n_h = 2, no neighbour", 1, 1, 4, 0, Double.POSITIVE_INFINITY, 0, lam, er, ei, seconds, print);
            ensemble("spheroid 1.5/0.6, n_h = 2", 1.5, 0.6, 4, 0, Double.POSITIVE_INFINITY, 0, lam, er, ei, seconds, print);
            ensemble("sphere, eps_h = 3.2+0.6i, z0 20, dq 2", 1, 1, 3.2, 0.6, 20, 2, lam, er, ei, seconds, print);
            ensemble("spheroid, eps_h = 3.2+0.6i, z0 20, dq 2", 1.5, 0.6, 3.2, 0.6, 20, 2, lam, er, ei, seconds, print);
            pieces(lam, er, ei, seconds, print);
        }
    }

    private static void ensemble(String name, double p, double q, double hRe, double hIm, double z0, double dq,
                                 double[] lam, double[] er, double[] ei, double seconds, boolean print) {
        ParticleEnsemble e = new ParticleEnsemble().setMetal(9.01, 0.021, 1.39e6, 1);
        double acc = 0;
        long samples = 0;
        long t0 = MX.getCurrentThreadCpuTime();
        long end = t0 + (long) (seconds * 1e9);
        long now;
        do {
            for (int rep = 0; rep < 20; rep++) {
                // a slightly different sample each time, as in a Monte Carlo run
                e.setShape(36 + 0.001 * (samples % 100), 0.3, p, q, 0.25);
                for (int i = 0; i < WAVELENGTHS; i++) {
                    e.compute(lam[i], er[i], ei[i], hRe, hIm, z0, dq);
                    acc += e.alphaIm(0) + e.metalAbsorption(ParticleEnsemble.UNPOLARIZED);
                }
                samples++;
            }
            now = MX.getCurrentThreadCpuTime();
        } while (now < end);
        sink += acc;
        double perSample = (now - t0) / (double) samples;
        if (print) {
            System.out.printf(Locale.ROOT, "%-38s %8.0f %10.2f%n", name, perSample / WAVELENGTHS, perSample / 1e3);
        }
    }

    private static void pieces(double[] lam, double[] er, double[] ei, double seconds, boolean print) {
        double[] out = new double[2];
        int n = WAVELENGTHS;
        for (int kind = 0; kind < 4; kind++) {
            double acc = 0;
            long calls = 0;
            long t0 = MX.getCurrentThreadCpuTime();
            long end = t0 + (long) (seconds * 1e9 / 4);
            long now;
            do {
                for (int i = 0; i < n; i++) {
                    double r = 10 + (i % 12) * 2;
                    switch (kind) {
                        case 0 -> {
                            Mie.a1(0.05 + 0.001 * i, 1.5, 0.02 * r, out);
                            acc += out[0];
                        }
                        case 1 -> {
                            Polarizability.mieDipole(r, lam[i], er[i], ei[i], 4, 0, out);
                            acc += out[0];
                        }
                        case 2 -> acc += Polarizability.mieDipoleMetalAbsorption(r, lam[i], er[i], ei[i], 3.2, 0.6, out);
                        default -> {
                            MetalPermittivity.sizeCorrected(lam[i], er[i], ei[i], 4 * r / 3, 9.01, 0.021, 1.39e6, 1, out);
                            acc += out[1];
                        }
                    }
                }
                calls += n;
                now = MX.getCurrentThreadCpuTime();
            } while (now < end);
            sink += acc;
            if (print) {
                String[] names = {"Mie.a1", "Polarizability.mieDipole", "mieDipoleMetalAbsorption (abs. host)",
                    "MetalPermittivity.sizeCorrected"};
                System.out.printf(Locale.ROOT, "  piece %-32s %8.1f ns/call%n", names[kind], (now - t0) / (double) calls);
            }
        }
    }
}
