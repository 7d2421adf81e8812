package org.fabspread.plan;

import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * One factor of a plan in real units: its input id, unit, nominal value, the spread σ of its
 * marginal, the low/high levels (coded −1 and +1) and the precision an operator can set it to.
 * Coded level c is run at centre + c·halfRange, rounded to the precision ({@link #setting}), so axial
 * points of a central composite design lie beyond low/high.
 *
 * <p>Fractions (canonical unit {@code fraction}) are shown to the operator in percent, the unit the
 * study writes them in; {@link #sheetUnit()}, {@link #toSheet} and {@link #fromSheet} convert.
 *
 * @param levelSource how the levels were set, e.g. {@code nominal -/+ 2 sigma} or {@code limits}
 * @param precision   the step settings are rounded to, canonical unit (0: no rounding)
 */
public record Factor(String id, String unit, double nominal, double sigma, double low, double high,
                     String levelSource, double precision) {

    /** The canonical unit of fractions, shown as percent. */
    public static final String FRACTION = "fraction";

    public Factor {
        if (!(high > low)) {
            throw new IllegalArgumentException("factor " + id + ": high level must exceed low level");
        }
        if (!(precision >= 0)) {
            throw new IllegalArgumentException("factor " + id + ": precision must be >= 0");
        }
    }

    /** A factor whose settings are not rounded. */
    public Factor(String id, String unit, double nominal, double sigma, double low, double high, String levelSource) {
        this(id, unit, nominal, sigma, low, high, levelSource, 0);
    }

    public double centre() {
        return 0.5 * (low + high);
    }

    public double halfRange() {
        return 0.5 * (high - low);
    }

    /** Real value of a coded level, unrounded. */
    public double real(double coded) {
        return centre() + coded * halfRange();
    }

    /** The value the operator sets for a coded level: {@link #real} rounded to the precision. */
    public double setting(double coded) {
        return round(real(coded), precision);
    }

    /** Coded level of a real value. */
    public double coded(double real) {
        return (real - centre()) / halfRange();
    }

    /** The unit of the run sheet: percent for fractions, otherwise the canonical unit. */
    public String sheetUnit() {
        return FRACTION.equals(unit) ? "%" : unit;
    }

    /** A canonical value in the run sheet's unit. */
    public double toSheet(double v) {
        return FRACTION.equals(unit) ? new BigDecimal(Double.toString(v)).movePointRight(2).doubleValue() : v;
    }

    /** A run-sheet value in the canonical unit. */
    public double fromSheet(double v) {
        return FRACTION.equals(unit) ? new BigDecimal(Double.toString(v)).movePointLeft(2).doubleValue() : v;
    }

    /** The run-sheet column header, e.g. {@code stack.etl.thickness [nm]} or {@code particles.coverage [%]}. */
    public String header() {
        return id + " [" + sheetUnit() + "]";
    }

    /**
     * v rounded half-up to a multiple of step, computed in decimal so that 86.8 stays 86.8 (and not
     * 86.80000000000001); step 0 returns v.
     */
    public static double round(double v, double step) {
        if (!(step > 0) || !Double.isFinite(v)) {
            return v;
        }
        BigDecimal s = new BigDecimal(Double.toString(step));
        BigDecimal q = new BigDecimal(v).divide(s, 0, RoundingMode.HALF_UP);
        return q.multiply(s).doubleValue();
    }

    /** v rounded down (towards −∞) to a multiple of step. */
    public static double floor(double v, double step) {
        if (!(step > 0) || !Double.isFinite(v)) {
            return v;
        }
        BigDecimal s = new BigDecimal(Double.toString(step));
        BigDecimal q = new BigDecimal(v).divide(s, 0, RoundingMode.FLOOR);
        return q.multiply(s).doubleValue();
    }
}
