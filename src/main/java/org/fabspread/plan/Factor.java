package org.fabspread.plan;

/**
 * One factor of a plan in real units: its input id, unit, nominal value, the spread σ of its
 * marginal, and the low/high levels (coded −1 and +1). Coded level c is run at
 * centre + c·halfRange, so axial points of a central composite design lie beyond low/high.
 *
 * @param levelSource how the levels were set, e.g. {@code nominal -/+ 2 sigma} or {@code limits}
 */
public record Factor(String id, String unit, double nominal, double sigma, double low, double high,
                     String levelSource) {

    public Factor {
        if (!(high > low)) {
            throw new IllegalArgumentException("factor " + id + ": high level must exceed low level");
        }
    }

    public double centre() {
        return 0.5 * (low + high);
    }

    public double halfRange() {
        return 0.5 * (high - low);
    }

    /** Real value of a coded level. */
    public double real(double coded) {
        return centre() + coded * halfRange();
    }

    /** Coded level of a real value. */
    public double coded(double real) {
        return (real - centre()) / halfRange();
    }

    /** The run-sheet column header, e.g. {@code stack.etl.thickness [nm]}. */
    public String header() {
        return id + " [" + unit + "]";
    }
}
