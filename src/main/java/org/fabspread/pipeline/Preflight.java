package org.fabspread.pipeline;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.fabspread.analysis.ShapleyEffects;
import org.fabspread.analysis.SobolIndices;
import org.fabspread.analysis.TailYield;
import org.fabspread.device.DeviceModel;
import org.fabspread.plan.FactorLevels;
import org.fabspread.plan.PlanAdvisor;
import org.fabspread.plan.PlanJob;
import org.fabspread.plan.RankedInput;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.PlanSettings;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * The checks of a run that need the model and the run's sizes, made before anything is written, by both
 * {@code check} and {@code run} (through {@link RunValidation}): the experiment plan fits its run budget, the Sobol design fits the memory,
 * {@code samples.csv} fits the disk, and the whole run fits in a sane time; and the estimate of time and
 * disk a long run is told before it starts. The time comes from a few timed evaluations of the nominal
 * device on this machine, so it is a rough guide, not a promise.
 */
public final class Preflight {

    /** A run estimated to take longer than this is refused (it would not end in any useful time). */
    static final double MAX_SECONDS = 30 * 24 * 3600.0;
    /** Share of the Java heap the Sobol design's arrays may take. */
    static final double SOBOL_HEAP_SHARE = 0.6;
    /** Bytes of one number in samples.csv (Double.toString, at most 24 characters and a comma). */
    static final int CSV_NUMBER_BYTES = 24;

    /**
     * @param modelRuns      model evaluations the run will make (Monte Carlo, Sobol design, at most the re-runs)
     * @param secondsPerRun  measured time of one evaluation on one thread
     * @param seconds        the run's estimated wall time on {@code threads} threads
     * @param diskBytes      estimated size of samples.csv
     * @param threads        worker threads the estimate assumes
     */
    public record Estimate(long modelRuns, double secondsPerRun, double seconds, long diskBytes, int threads) {

        /** One line for the terminal. */
        public String describe() {
            return String.format(Locale.ROOT, "estimate: %d model runs, about %s on %d thread%s; samples.csv about %s",
                    modelRuns, duration(seconds), threads, threads == 1 ? "" : "s", size(diskBytes));
        }
    }

    private Preflight() {
    }

    /**
     * Checks the run and returns its estimate.
     *
     * @param out     the results folder (the file system it is on, or the nearest existing folder above it
     *                would be, is checked; not the current folder's), or null for no disk check
     * @param sobol   the Sobol design's options, or null when the study has none
     * @param shapley the Shapley design's options (used with the Sobol design)
     */
    public static Estimate check(Study study, DeviceModel model, StudyInputSpace space, long samples,
                                 SobolIndices.Options sobol, ShapleyEffects.Options shapley, Path out, int threads)
            throws IOException {
        int k = space.dimension();
        int m = model.outputs().size();
        if (k > 0) {
            planFits(study, space);
        }
        long runs = samples;
        if (sobol != null && k > 0) {
            long n = sobol.n();
            double bytes = 8.0 * n * (2.0 * k + (double) m * (k + 2) + 1);
            double heap = MachineLimits.heapBytes();
            if (n * 2L * k > Integer.MAX_VALUE - 8 || bytes > SOBOL_HEAP_SHARE * heap) {
                throw StudyException.at(at(study, "analysis.sobol_base"), String.format(Locale.ROOT,
                        "%d needs about %s of memory for the Sobol design's %d model runs, more than this Java heap"
                                + " allows (%s); use a smaller sobol_base or give Java more memory (-Xmx)",
                        n, size((long) bytes), SobolIndices.cost(sobol.n(), k), size((long) heap)));
            }
            runs += SobolIndices.cost(sobol.n(), k);
            if (k >= 2 && shapley != null) {
                runs += ShapleyEffects.cost(shapley, k);
            }
        }
        runs += (long) study.analysis().whatIfs().size() * WhatIfRerun.RERUN_SAMPLES;
        if (!study.targets().isEmpty()) {
            runs += TailYield.Options.defaults().runs();
        }
        runs += (long) PlanJob.NOISE_DRAWS * PlanJob.NOISE_POINTS;
        long disk = samples * ((long) CSV_NUMBER_BYTES * (k + m) + 32);
        if (out != null) {
            Path existing = out.toAbsolutePath().normalize();
            while (existing != null && !Files.exists(existing)) {
                existing = existing.getParent();
            }
            if (existing != null) {
                long free = MachineLimits.usableBytes(existing);
                if (disk > free) {
                    throw StudyException.at(at(study, "analysis.samples"), String.format(Locale.ROOT,
                            "%d samples would write about %s of samples.csv; the disk of %s has %s free", samples,
                            size(disk), existing, size(free)));
                }
            }
        }
        double perRun = secondsPerRun(model);
        double seconds = runs * perRun / Math.max(1, threads);
        if (seconds > MAX_SECONDS) {
            throw StudyException.at(at(study, "analysis.samples"), String.format(Locale.ROOT,
                    "%d model runs would take about %s on %d threads; use fewer samples", runs, duration(seconds),
                    threads));
        }
        return new Estimate(runs, perRun, seconds, disk, threads);
    }

    /**
     * Refuses a plan that cannot fit its {@code max_runs} for some sensitivity ranking the run may find.
     * The factors the advisor picks from a ranking (and the fewest it may drop to) are most with an even
     * ranking, and a design of fewer factors fits any budget a design of more factors fits, so a plan that
     * fits with the even ranking fits with every ranking, and one that does not would be refused at the end
     * of the run whenever the ranking leaves two factors or more.
     */
    private static void planFits(Study study, StudyInputSpace space) {
        PlanSettings s = study.plan() == null ? PlanJob.defaults() : study.plan();
        boolean chosenByRanking = s.factors() == null || s.factors().isEmpty();
        List<RankedInput> even = new ArrayList<>();
        for (int i = 0; i < space.dimension(); i++) {
            even.add(new RankedInput(space.ids().get(i), 1.0));
        }
        try {
            PlanAdvisor.advise(even, s);
            // the run sheet's levels of every input the plan may take
            FactorLevels.of(study, space, chosenByRanking ? space.ids() : s.factors());
        } catch (StudyException e) {
            if (!chosenByRanking || e.unplacedKey().isEmpty()) {
                throw e;
            }
            throw StudyException.at(SourceLocation.unknown(e.unplacedKey().get()), e.detail() + " (the plan's"
                    + " factors come from the sensitivity ranking, known only after the Monte Carlo run, and may be"
                    + " any of the inputs; raise max_runs or list the factors)");
        }
    }

    /** Seconds of one evaluation of the nominal device on one thread (the median of a few). */
    private static double secondsPerRun(DeviceModel model) {
        double fake = MachineLimits.secondsPerRun();
        if (fake >= 0) {
            return fake;
        }
        double[] x = model.nominalInputs();
        var ev = model.newEvaluator();
        double[] y = new double[model.outputs().size()];
        double[] t = new double[5];
        for (int r = -1; r < t.length; r++) {
            long t0 = System.nanoTime();
            try {
                ev.evaluate(x, y);
            } catch (RuntimeException e) {
                return 0;
            }
            if (r >= 0) {
                t[r] = (System.nanoTime() - t0) * 1e-9;
            }
        }
        java.util.Arrays.sort(t);
        return t[t.length / 2];
    }

    /** The key of an error; the caller ({@link RunValidation}) puts it at its place in the study file. */
    private static SourceLocation at(Study study, String key) {
        return SourceLocation.unknown(key);
    }

    static String size(long bytes) {
        String[] units = {"B", "kB", "MB", "GB", "TB", "PB"};
        double v = bytes;
        int u = 0;
        while (v >= 1000 && u < units.length - 1) {
            v /= 1000;
            u++;
        }
        return String.format(Locale.ROOT, u == 0 ? "%.0f %s" : "%.3g %s", v, units[u]);
    }

    static String duration(double s) {
        if (s < 90) {
            return String.format(Locale.ROOT, "%.0f s", Math.max(1, s));
        }
        if (s < 5400) {
            return String.format(Locale.ROOT, "%.0f min", s / 60);
        }
        if (s < 48 * 3600) {
            return String.format(Locale.ROOT, "%.1f h", s / 3600);
        }
        return String.format(Locale.ROOT, "%.0f days", s / 86400);
    }
}
