package org.fabspread.study;

/**
 * A specification on one output, e.g. {@code jsc >= 15 mA/cm^2}: value in the output's unit.
 */
public record Target(String output, boolean atLeast, double value, String unit, SourceLocation where) {

    public boolean isMet(double x) {
        return atLeast ? x >= value : x <= value;
    }

    public String describe() {
        return output + (atLeast ? " >= " : " <= ") + value + " " + unit;
    }
}
