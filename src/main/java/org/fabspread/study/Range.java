package org.fabspread.study;

import org.fabspread.study.Units.Quantity;

/**
 * The physical range of one study number in its canonical unit, written once where the study reader
 * defines the parameter and carried by the {@link Parameter}: the reader checks every written value
 * and every value a distribution can reach against it, and a later stage that meets a sampled value
 * asks the same range ({@link #violation}) instead of writing its own interval.
 *
 * @param quantity        the quantity (for the unit in messages)
 * @param lower           lowest allowed value (may be -infinity)
 * @param lowerStrict     true when {@code lower} itself is not allowed
 * @param upper           highest allowed value (may be +infinity)
 * @param upperStrict     true when {@code upper} itself is not allowed
 * @param infiniteAllowed true when +-infinity is a meaningful value (a shunt resistance)
 */
public record Range(Quantity quantity, double lower, boolean lowerStrict, double upper, boolean upperStrict,
                    boolean infiniteAllowed) {

    /** Every finite value of the quantity. */
    public static Range any(Quantity q) {
        return new Range(q, Double.NEGATIVE_INFINITY, false, Double.POSITIVE_INFINITY, false, false);
    }

    /** This range with a lower limit. */
    public Range above(double lo, boolean strict) {
        return new Range(quantity, lo, strict, upper, upperStrict, infiniteAllowed);
    }

    /** This range with an upper limit. */
    public Range below(double hi, boolean strict) {
        return new Range(quantity, lower, lowerStrict, hi, strict, infiniteAllowed);
    }

    /** This range, also allowing infinity. */
    public Range withInfinity() {
        return new Range(quantity, lower, lowerStrict, upper, upperStrict, true);
    }

    /** True when {@code v} is allowed. */
    public boolean contains(double v) {
        return violation(v) == null;
    }

    /** Null when {@code v} is allowed, else the reason in words ("must be > 0 nm"). */
    public String violation(double v) {
        if (Double.isNaN(v)) {
            return "must be a number";
        }
        if (Double.isInfinite(v) && !infiniteAllowed) {
            return "must be finite";
        }
        if (lowerStrict ? !(v > lower) : !(v >= lower)) {
            return "must be " + (lowerStrict ? "> " : ">= ") + quantity.show(lower);
        }
        if (upperStrict ? !(v < upper) : !(v <= upper)) {
            return "must be " + (upperStrict ? "< " : "<= ") + quantity.show(upper);
        }
        return null;
    }

    /** True when values of this range cannot be negative (thicknesses, sizes, fractions). */
    public boolean nonNegative() {
        return lower >= 0;
    }
}
