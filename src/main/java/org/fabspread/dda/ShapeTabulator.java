package org.fabspread.dda;

import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.ArrayList;
import java.util.List;

import org.fabspread.shapes.Shape;
import org.fabspread.shapes.Voxels;

/**
 * Runs the discrete-dipole solver over a {@link TableSpec}: one task per parameter node (its own lattice
 * and solver), each sweeping the wavelengths in increasing order with both in-plane polarisations, every
 * solve warm-started from the same polarisation at the previous wavelength. Tasks are independent and
 * write only their own slots, so the table is bit-identical for any number of threads.
 */
public final class ShapeTabulator {

    /** Progress while tabulating: solves done of the total, called from worker threads (serialised). */
    public interface Progress {
        void solved(int done, int total);
    }

    private ShapeTabulator() {
    }

    public static ShapeTable tabulate(TableSpec spec, int threads, Progress progress) {
        int nodes = spec.nodeCount();
        double[] wl = spec.wavelengths();
        int nw = wl.length;
        double[] data = new double[Quantity.COUNT * 2 * nodes * nw];
        int total = 2 * nodes * nw;
        AtomicInteger done = new AtomicInteger();
        Object lock = new Object();
        ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, Math.min(threads, nodes)), r -> {
            Thread t = new Thread(r, "dda-table");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> futures = new ArrayList<>();
            for (int node = 0; node < nodes; node++) {
                int nd = node;
                futures.add(pool.submit(() -> {
                    runNode(spec, nd, data, nodes, () -> {
                        int d = done.addAndGet(2);
                        if (progress != null) {
                            synchronized (lock) {
                                progress.solved(d, total);
                            }
                        }
                    });
                    return null;
                }));
            }
            for (Future<?> f : futures) {
                try {
                    f.get();
                } catch (java.util.concurrent.ExecutionException e) {
                    Throwable c = e.getCause();
                    if (c instanceof RuntimeException re) {
                        throw re;
                    }
                    throw new IllegalStateException(c);
                }
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("tabulation interrupted", e);
        } finally {
            pool.shutdownNow();
        }
        return new ShapeTable(spec.nodes(), wl, data);
    }

    private static void runNode(TableSpec spec, int node, double[] data, int nodes, Runnable tick) {
        double[] v = spec.nodeValues(node);
        Shape shape = spec.family().shape(v);
        Voxels vox = shape.voxelise(spec.settings().pitchNm());
        DdaSolver solver = new DdaSolver(vox, spec.settings());
        double[] wl = spec.wavelengths();
        double[] er = spec.epsRe();
        double[] ei = spec.epsIm();
        double[] nh = spec.hostIndex();
        int nw = wl.length;
        for (int w = 0; w < nw; w++) {
            solver.setMedium(wl[w], er[w], ei[w], nh[w]);
            for (int pol = 0; pol < 2; pol++) {
                Incidence inc = pol == ShapeTable.POL_X ? Incidence.X : Incidence.Y;
                DdaSolution s = solver.solve(inc, pol);
                store(data, Quantity.EXTINCTION, pol, node, w, nodes, nw, s.extinction());
                store(data, Quantity.ABSORPTION, pol, node, w, nodes, nw, s.absorption());
                store(data, Quantity.SCATTERING, pol, node, w, nodes, nw, s.scattering());
                store(data, Quantity.FORWARD, pol, node, w, nodes, nw, s.forward());
                store(data, Quantity.NEAR_FIELD, pol, node, w, nodes, nw, s.nearField());
                store(data, Quantity.ALPHA_RE, pol, node, w, nodes, nw, s.dipoleRe()[pol]);
                store(data, Quantity.ALPHA_IM, pol, node, w, nodes, nw, s.dipoleIm()[pol]);
            }
            tick.run();
        }
    }

    private static void store(double[] data, Quantity q, int pol, int node, int w, int nodes, int nw, double v) {
        data[ShapeTable.slot(q, pol, node, w, nodes, nw)] = v;
    }
}
