package org.fabspread.study;

import java.util.Locale;

import org.apache.commons.math3.special.Erf;

import org.fabspread.study.Units.Quantity;

/**
 * Which values a distribution can reach against its parameter's physical {@link Range}. A normal or
 * lognormal has unbounded support; what matters for a Monte Carlo run is how much probability lies
 * outside the range, since a sample there is a device that cannot exist. More than
 * {@link #MAX_OUTSIDE} (one sample in a million) is refused with the bound to truncate at; below it,
 * the rare sample outside is handled by the study's {@code on_failure} policy. Bounded distributions
 * (uniform, triangular, truncated normal bounds, measured values) are checked value by value where
 * they are read.
 *
 * <p>Tail probabilities: standard normal Φ(z) = erfc(−z/√2)/2 (Abramowitz and Stegun 7.1.2,
 * 26.2.29), exact in the far tails where 1 − Φ would cancel; a lognormal median m, cv c has
 * ln X ~ N(ln m, ln(1 + c²)).
 */
final class Reach {

    /** Largest probability outside the physical range a distribution may put (one in a million). */
    static final double MAX_OUTSIDE = 1e-6;

    private Reach() {
    }

    /**
     * Null when {@code spec} stays inside {@code p}'s range (to within {@link #MAX_OUTSIDE}), else
     * the reason in one sentence, naming the bound and how to truncate.
     *
     * @param what how the spread is named in the message ("" for the parameter's own spread, or
     *             e.g. "after 'shift by -50 nm', ")
     */
    static String outside(Parameter p, DistributionSpec spec, String what) {
        Range r = p.range();
        double[] tails = tails(spec, r);
        if (tails == null) {
            return null;
        }
        boolean low = tails[0] > MAX_OUTSIDE;
        boolean high = tails[1] > MAX_OUTSIDE;
        if (!low && !high) {
            return null;
        }
        Quantity q = r.quantity();
        double bound = low ? r.lower() : r.upper();
        String side = low ? "below" : "above";
        String desc = Describe.distribution(new Parameter(p.id(), p.unit(), spec, p.where(), r, p.display()));
        String fix = !what.isEmpty() ? "choose a smaller change"
                : spec instanceof DistributionSpec.TruncatedNormal
                ? "move its " + (low ? "lower" : "upper") + " bound to " + q.show(bound) + " or narrow the spread"
                : "truncate it (truncated_normal with " + (low ? "lower: " : "upper: ") + q.show(bound)
                + ") or narrow the spread";
        return what + desc + " reaches " + side + " " + q.show(bound) + " with probability "
                + percent(low ? tails[0] : tails[1]) + "; " + fix;
    }

    /** {P(X below the range), P(X above the range)}, or null for a bounded or fixed distribution. */
    static double[] tails(DistributionSpec spec, Range r) {
        if (spec instanceof DistributionSpec.Normal n) {
            double lo = Double.isInfinite(r.lower()) ? 0 : phi((r.lower() - n.mean()) / n.sigma());
            double hi = Double.isInfinite(r.upper()) ? 0 : phi((n.mean() - r.upper()) / n.sigma());
            return new double[] {lo, hi};
        }
        if (spec instanceof DistributionSpec.TruncatedNormal t) {
            double a = (t.lower() - t.mean()) / t.sigma();
            double b = (t.upper() - t.mean()) / t.sigma();
            double z = phi(b) - phi(a);
            double lo = r.lower() > t.lower()
                    ? (phi((Math.min(r.lower(), t.upper()) - t.mean()) / t.sigma()) - phi(a)) / z : 0;
            double hi = r.upper() < t.upper()
                    ? (phi(b) - phi((Math.max(r.upper(), t.lower()) - t.mean()) / t.sigma())) / z : 0;
            return new double[] {Math.max(0, lo), Math.max(0, hi)};
        }
        if (spec instanceof DistributionSpec.LogNormal l) {
            double sl = Math.sqrt(Math.log1p(l.cv() * l.cv()));
            double lo = r.lower() > 0 ? phi(Math.log(r.lower() / l.median()) / sl) : 0;
            double hi = Double.isInfinite(r.upper()) ? 0 : phi(Math.log(l.median() / r.upper()) / sl);
            return new double[] {lo, hi};
        }
        return null;
    }

    /** Standard normal CDF through erfc (accurate in the lower tail). */
    static double phi(double z) {
        if (z == Double.NEGATIVE_INFINITY) {
            return 0;
        }
        if (z == Double.POSITIVE_INFINITY) {
            return 1;
        }
        return 0.5 * Erf.erfc(-z / Math.sqrt(2));
    }

    private static String percent(double p) {
        double pct = 100 * p;
        return (pct >= 0.01 ? String.format(Locale.ROOT, "%.2g", pct) : String.format(Locale.ROOT, "%.1e", pct))
                + " %";
    }
}
