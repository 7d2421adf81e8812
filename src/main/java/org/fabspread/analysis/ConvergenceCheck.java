package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;

import org.fabspread.sampling.Interval;

/**
 * Which sensitivity estimates are not converged: an index of at least {@link #FLOOR} whose interval is
 * wider than {@link #WIDTH_FRACTION} of the index itself. The size that would bring it within that
 * width follows from the interval's 1/√N shrinkage (central limit theorem; Saltelli et al., Comput.
 * Phys. Commun. 181, 259 (2010), sec. 4): N' = N (w / (f · S))², rounded up to a power of two (valid
 * for random and quasi-random points alike). Smaller indices are not judged: their relative width is
 * always large and says nothing about the ranking.
 */
public final class ConvergenceCheck {

    /** The widest interval, as a fraction of its index, that counts as converged. */
    public static final double WIDTH_FRACTION = 0.5;
    /** Indices below this share of the variance are not judged. */
    public static final double FLOOR = 0.05;

    /**
     * One unconverged estimate.
     *
     * @param index     "first order", "total", "group first order", "group total" or "Shapley"
     * @param size      the design size it came from (Sobol base N, or Shapley orders m)
     * @param suggested the size that would bring the interval within {@link #WIDTH_FRACTION} of the index
     */
    public record Flag(String output, String input, String index, double estimate, Interval interval, int size,
                       int suggested) {
    }

    private ConvergenceCheck() {
    }

    /** The Sobol indices (inputs and groups) of every output that are not converged. */
    public static List<Flag> of(SobolResult r) {
        List<Flag> out = new ArrayList<>();
        for (SobolResult.OutputIndices o : r.outputs()) {
            for (SobolResult.IndexEstimate e : o.indices()) {
                add(out, o.output(), e.input(), "first order", e.first(), e.firstInterval(), r.n());
                add(out, o.output(), e.input(), "total", e.total(), e.totalInterval(), r.n());
            }
            for (SobolResult.GroupEstimate g : o.groups()) {
                add(out, o.output(), g.group(), "group first order", g.first(), g.firstInterval(), r.n());
                add(out, o.output(), g.group(), "group total", g.total(), g.totalInterval(), r.n());
            }
        }
        return out;
    }

    /** The Shapley effects of every output that are not converged (size: the number of orders). */
    public static List<Flag> of(ShapleyResult r) {
        List<Flag> out = new ArrayList<>();
        for (ShapleyResult.OutputEffects o : r.outputs()) {
            for (ShapleyResult.Effect e : o.effects()) {
                add(out, o.output(), e.input(), "Shapley", e.share(), e.interval(), r.permutations());
            }
        }
        return out;
    }

    /** N (w / (f S))² rounded up to a power of two, at least 2N. */
    public static int suggestedSize(int n, double estimate, Interval interval) {
        double ratio = interval.width() / (WIDTH_FRACTION * Math.abs(estimate));
        double need = n * ratio * ratio;
        long p = Long.highestOneBit((long) Math.ceil(Math.min(need, 1 << 30)));
        if (p < need) {
            p <<= 1;
        }
        return (int) Math.max(p, 2L * n);
    }

    private static void add(List<Flag> out, String output, String input, String index, double s, Interval iv,
                            int n) {
        if (!(s >= FLOOR) || !iv.bounded() || iv.width() <= WIDTH_FRACTION * s) {
            return;
        }
        out.add(new Flag(output, input, index, s, iv, n, suggestedSize(n, s, iv)));
    }
}
