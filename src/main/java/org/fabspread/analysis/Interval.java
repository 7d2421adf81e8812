package org.fabspread.analysis;

/** A two-sided interval {@code [low, high]} at a stated confidence level. */
public record Interval(double low, double high) {

    public boolean contains(double x) {
        return x >= low && x <= high;
    }

    public double width() {
        return high - low;
    }
}
