package org.fabspread.study;

import org.fabspread.study.Units.Quantity;

/**
 * A study number's id, quantity and allowed {@link Range} in canonical units, as the section
 * readers write them: the one place a parameter's physical range is defined.
 */
record Rule(String id, Quantity q, Range range) {

    static Rule of(String id, Quantity q) {
        return new Rule(id, q, Range.any(q));
    }

    Rule above(double lo, boolean strict) {
        return new Rule(id, q, range.above(lo, strict));
    }

    Rule below(double hi, boolean strict) {
        return new Rule(id, q, range.below(hi, strict));
    }

    Rule infinite() {
        return new Rule(id, q, range.withInfinity());
    }

    /** Null when v is allowed, else the reason ("must be > 0 nm"). */
    String violation(double v) {
        return range.violation(v);
    }
}
