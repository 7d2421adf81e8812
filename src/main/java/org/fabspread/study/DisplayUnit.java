package org.fabspread.study;

import java.util.Locale;

import org.fabspread.study.Units.Quantity;

/**
 * The unit a number is shown in: the unit the user wrote in the study (or, where they wrote none,
 * the unit of the trade: % for fractions, nm for films, mm for glass), with the factor from the
 * program's canonical unit. One formatter serves the terminal, the report, CSV headers and the run
 * sheet, so a coverage written as {@code 5.5 %} comes back as {@code 5.5 %} everywhere, never as
 * {@code 0.055 fraction}.
 *
 * <p>Numbers are written at {@link #SIGNIFICANT} significant digits (enough to tell any two study
 * values apart that a process engineer would, few enough to read); trailing zeros are dropped.
 *
 * @param symbol       the unit as shown, e.g. "%", "nm", "mm", "mA/cm^2"; empty for a plain number
 * @param perCanonical how many display units one canonical unit is (100 for %, 1e-6 for mm over nm)
 */
public record DisplayUnit(String symbol, double perCanonical) {

    /** Significant digits of {@link #format}. */
    public static final int SIGNIFICANT = 4;

    /** Glass and other films from this thickness up are shown in mm (a trade habit: "1.1 mm glass"). */
    private static final double MM_FROM_NM = 1e5;

    public DisplayUnit {
        if (!(perCanonical > 0) || Double.isInfinite(perCanonical)) {
            throw new IllegalArgumentException("display factor must be finite and > 0, got " + perCanonical);
        }
    }

    /**
     * The trade's unit for a value of {@code q}: % for fractions, mm for lengths of 0.1 mm and more,
     * otherwise the canonical unit.
     */
    public static DisplayUnit tradeUnit(Quantity q, double typicalCanonical) {
        if (q == Quantity.FRACTION) {
            return new DisplayUnit("%", 100);
        }
        if (q == Quantity.LENGTH && Math.abs(typicalCanonical) >= MM_FROM_NM) {
            return new DisplayUnit("mm", 1e-6);
        }
        return canonical(q);
    }

    /** The canonical unit itself ("1" is shown as no unit). */
    public static DisplayUnit canonical(Quantity q) {
        return new DisplayUnit(q == Quantity.DIMENSIONLESS ? "" : q.canonical(), 1);
    }

    /**
     * The unit written in {@code text} (e.g. "1.1 mm", "5.5 %") when {@code q} accepts it, else the
     * trade's unit for the value.
     */
    public static DisplayUnit asWritten(String text, Quantity q, double canonicalValue) {
        Units.Reading r = text == null ? null : Units.split(text);
        if (r != null && !r.unit().isEmpty()) {
            double f = q.factor(r.unit());
            if (!Double.isNaN(f)) {
                return new DisplayUnit(r.unit(), 1 / f);
            }
        }
        return tradeUnit(q, canonicalValue);
    }

    /** The canonical value in this unit. */
    public double convert(double canonicalValue) {
        return canonicalValue * perCanonical;
    }

    /** The canonical value as text in this unit: "5.5 %", "1.1 mm", "0.92". */
    public String format(double canonicalValue) {
        String n = number(canonicalValue);
        return symbol.isEmpty() ? n : n + " " + symbol;
    }

    /** The number alone, in this unit, at {@link #SIGNIFICANT} significant digits. */
    public String number(double canonicalValue) {
        return round(convert(canonicalValue));
    }

    /**
     * A column name for CSV files: {@code base} with the unit as a suffix ({@code coverage_pct},
     * {@code thickness_nm}, {@code jsc_mA_per_cm2}); a plain number keeps {@code base}.
     */
    public String column(String base) {
        if (symbol.isEmpty()) {
            return base;
        }
        String s = symbol.replace("%", "pct").replace("µ", "u").replace("^2", "2").replace("/", "_per_")
                .replace(' ', '_');
        return base + "_" + s;
    }

    private static String round(double v) {
        if (!Double.isFinite(v) || v == 0) {
            return Units.format(v);
        }
        double r = Double.parseDouble(String.format(Locale.ROOT, "%." + (SIGNIFICANT - 1) + "e", v));
        return Units.format(r);
    }
}
