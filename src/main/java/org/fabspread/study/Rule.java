package org.fabspread.study;

import org.fabspread.study.Units.Quantity;

/**
 * Allowed range of a study number in canonical units: the one place a parameter's physical range
 * is written (the model below trusts it).
 */
record Rule(String id, Quantity q, double lower, boolean lowerStrict, double upper,
                    boolean upperStrict, boolean infiniteAllowed) {
    static Rule of(String id, Quantity q) {
        return new Rule(id, q, Double.NEGATIVE_INFINITY, false, Double.POSITIVE_INFINITY, false, false);
    }

    Rule above(double lo, boolean strict) {
        return new Rule(id, q, lo, strict, upper, upperStrict, infiniteAllowed);
    }

    Rule below(double hi, boolean strict) {
        return new Rule(id, q, lower, lowerStrict, hi, strict, infiniteAllowed);
    }

    Rule infinite() {
        return new Rule(id, q, lower, lowerStrict, upper, upperStrict, true);
    }

    /** Null when v is allowed, else the reason ("must be > 0 nm"). */
    String violation(double v) {
        if (Double.isNaN(v)) {
            return "must be a number";
        }
        if (Double.isInfinite(v) && !infiniteAllowed) {
            return "must be finite";
        }
        if (lowerStrict ? !(v > lower) : !(v >= lower)) {
            return "must be " + (lowerStrict ? "> " : ">= ") + q.show(lower);
        }
        if (upperStrict ? !(v < upper) : !(v <= upper)) {
            return "must be " + (upperStrict ? "< " : "<= ") + q.show(upper);
        }
        return null;
    }
}
