package org.fabspread.sampling;

/**
 * A two-sided confidence interval {@code [low, high]} at a level stated by whoever made it. The one
 * interval type of the program: yields, quantiles, sensitivity indices, what-if differences and report
 * figures all carry their bounds in it. Bounds may be NaN where no interval exists (too few samples).
 */
public record Interval(double low, double high) {

    /** The interval that says nothing: both bounds NaN. */
    public static Interval none() {
        return new Interval(Double.NaN, Double.NaN);
    }

    /** Whether both bounds are finite numbers (named so that JSON writers do not take it for a property). */
    public boolean bounded() {
        return Double.isFinite(low) && Double.isFinite(high);
    }

    public boolean contains(double x) {
        return x >= low && x <= high;
    }

    public double width() {
        return high - low;
    }

    /** Whether the whole interval lies above {@code x} (its lower bound exceeds it). */
    public boolean above(double x) {
        return low > x;
    }

    /** Whether the whole interval lies below {@code x} (its upper bound is less). */
    public boolean below(double x) {
        return high < x;
    }

    /** The smallest interval holding this one and {@code x} (an estimate the bounds must enclose). */
    public Interval enclosing(double x) {
        return new Interval(Math.min(low, x), Math.max(high, x));
    }
}
