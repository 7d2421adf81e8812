package org.fabspread.dda;

import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.fabspread.particles.Mie;
import org.fabspread.shapes.Sphere;

/**
 * Speed figures of the discrete-dipole solver ({@code fabspread bench --dda}): solves per second for a 40 nm
 * silver sphere at the default resolution (with its Q_ext error against Mie at the plasmon peak), the time to
 * tabulate a crescent with two uncertain shape parameters over 350–850 nm on two threads, and the Monte Carlo
 * rate of reading that table. Rates are per second of thread CPU time where one thread works (the shared
 * build machines distort wall-clock figures); the tabulation is timed by the wall clock.
 */
public final class DdaBenchmark {
    private static final double HOST = 1.5;

    private DdaBenchmark() {
    }

    public static void main(String[] args) {
        PrintWriter w = new PrintWriter(System.out, true);
        run(w, args.length > 0 ? Double.parseDouble(args[0]) : 5);
    }

    public static void run(PrintWriter w, double seconds) {
        NkTable ag = MaterialLibrary.bundled().get("ag-johnson-christy");
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        sphere(w, ag, mx);
        ShapeTable table = crescent(w, ag);
        monteCarlo(w, table, mx, seconds);
    }

    private static double[] eps(NkTable t, double l) {
        double n = t.n(l);
        double k = t.k(l);
        return new double[] {n * n - k * k, 2 * n * k};
    }

    private static void sphere(PrintWriter w, NkTable ag, ThreadMXBean mx) {
        double peak = 0;
        double best = 0;
        for (double l = 380; l <= 480; l += 1) {
            double q = Mie.compute(ag.n(l) / HOST, ag.k(l) / HOST, Math.PI * HOST * 40 / l).qExt();
            if (q > best) {
                best = q;
                peak = l;
            }
        }
        DdaSettings s = DdaSettings.defaults();
        DdaSolver solver = new DdaSolver(new Sphere(40).voxelise(s.pitchNm()), s);
        int solves = 0;
        long t0 = mx.getCurrentThreadCpuTime();
        double qPeak = 0;
        int iterPeak = 0;
        for (double l : new double[] {peak, 600}) {
            double[] e = eps(ag, l);
            solver.setMedium(l, e[0], e[1], HOST);
            DdaSolution sol = solver.solve(Incidence.X);
            solves++;
            if (l == peak) {
                qPeak = sol.extinction() / (Math.PI * 400);
                iterPeak = sol.iterations();
            }
        }
        double cpu = (mx.getCurrentThreadCpuTime() - t0) / 1e9;
        w.printf(Locale.ROOT, "DDA 40 nm Ag sphere in n = %.1f, pitch %.1f nm (%d dipoles, %d FFT points, %d shell cells):"
                        + " %.3f solves/s on one thread (plasmon peak and 600 nm)%n", HOST, s.pitchNm(),
                solver.dipoles(), solver.fftPoints(), solver.shellCells(), solves / cpu);
        w.printf(Locale.ROOT, "DDA vs Mie at the Mie peak %.0f nm: Q_ext %.3f vs %.3f (%+.1f %%), %d operator applications%n",
                peak, qPeak, best, 100 * (qPeak / best - 1), iterPeak);
        w.flush();
    }

    private static ShapeTable crescent(PrintWriter w, NkTable ag) {
        ParametricFamily fam = new ParametricFamily("crescent",
                Map.of("outer_diameter", 80.0, "thickness", 20.0), List.of("bite_diameter", "bite_offset"));
        int nw = 26;
        double[] wl = new double[nw];
        double[] er = new double[nw];
        double[] ei = new double[nw];
        double[] nh = new double[nw];
        for (int i = 0; i < nw; i++) {
            wl[i] = 350 + 20 * i;
            double[] e = eps(ag, wl[i]);
            er[i] = e[0];
            ei[i] = e[1];
            nh[i] = HOST;
        }
        DdaSettings s = DdaSettings.defaults().withPitch(5).withTolerance(1e-4);
        TableSpec spec = new TableSpec(fam, new double[][] {Nodes.chebyshev(50, 62, 3), Nodes.chebyshev(18, 30, 3)},
                wl, er, ei, nh, s);
        long t0 = System.nanoTime();
        ShapeTable t = ShapeTabulator.tabulate(spec, 2, null);
        double secs = (System.nanoTime() - t0) / 1e9;
        InterpolationError e = InterpolationError.estimate(t);
        w.printf(Locale.ROOT, "DDA table: crescent, 3 x 3 nodes of bite diameter and offset, %d wavelengths 350-850 nm,"
                        + " pitch %.0f nm, tolerance %.0e: %d solves in %.1f s on 2 threads; leave-one-out error"
                        + " %.1f %% (bite diameter), %.1f %% (bite offset), %.1f %% (wavelength)%n", nw, s.pitchNm(),
                s.tolerance(), 2 * spec.nodeCount() * nw, secs, 100 * e.parameter()[0], 100 * e.parameter()[1],
                100 * e.wavelength());
        w.flush();
        return t;
    }

    private static void monteCarlo(PrintWriter w, ShapeTable table, ThreadMXBean mx, double seconds) {
        double[] grid = new double[101];
        for (int i = 0; i < grid.length; i++) {
            grid[i] = 350 + 5 * i;
        }
        ShapeTable t = table.resample(grid);
        double[] scratch = new double[t.scratchSize()];
        double[] v = new double[2];
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(1);
        double sink = 0;
        long evals = 0;
        long t0 = mx.getCurrentThreadCpuTime();
        long a0 = allocated(mx);
        long limit = (long) (seconds * 1e9);
        while (mx.getCurrentThreadCpuTime() - t0 < limit) {
            for (int rep = 0; rep < 100; rep++) {
                v[0] = 50 + 12 * rnd.nextDouble();
                v[1] = 18 + 12 * rnd.nextDouble();
                t.weights(v, scratch);
                for (int k = 0; k < grid.length; k++) {
                    for (int pol = 0; pol < 2; pol++) {
                        sink += t.value(Quantity.ABSORPTION, pol, k, scratch)
                                + t.value(Quantity.SCATTERING, pol, k, scratch)
                                + t.value(Quantity.FORWARD, pol, k, scratch)
                                + t.value(Quantity.ALPHA_RE, pol, k, scratch)
                                + t.value(Quantity.ALPHA_IM, pol, k, scratch);
                    }
                }
                evals++;
            }
        }
        double cpu = (mx.getCurrentThreadCpuTime() - t0) / 1e9;
        long bytes = allocated(mx) - a0;
        w.printf(Locale.ROOT, "DDA table in the Monte Carlo: %.0f evaluations/s on one thread (%d wavelengths,"
                        + " 2 polarisations, 5 quantities, 9 nodes), %.1f bytes/evaluation (check %.3g)%n",
                evals / cpu, grid.length, (double) bytes / evals, sink);
        w.flush();
    }

    private static long allocated(ThreadMXBean mx) {
        if (mx instanceof com.sun.management.ThreadMXBean sun) {
            return sun.getCurrentThreadAllocatedBytes();
        }
        return 0;
    }
}
