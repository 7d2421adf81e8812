package org.fabspread.study;

/**
 * One number of a study, with a stable id (e.g. {@code stack.etl.thickness}), its canonical unit
 * (the unit every layer below the study parser uses: nm, fraction, V, cm^2/V, mA/cm^2, ohm cm^2, K,
 * or "1" for dimensionless), its spread, where it was written, its physical {@link Range} (the one
 * range check of this input) and the {@link DisplayUnit} it is shown in (the unit the user wrote).
 */
public record Parameter(String id, String unit, DistributionSpec distribution, SourceLocation where, Range range,
                        DisplayUnit display) {

    /** A parameter without a stated range, shown in the trade's unit for its quantity. */
    public Parameter(String id, String unit, DistributionSpec distribution, SourceLocation where) {
        this(id, unit, distribution, where, Range.any(Describe.quantity(unit)),
                DisplayUnit.tradeUnit(Describe.quantity(unit), distribution.nominal()));
    }

    public static Parameter fixed(String id, String unit, double value) {
        return new Parameter(id, unit, new DistributionSpec.Fixed(value), SourceLocation.unknown(id));
    }

    public double nominal() {
        return distribution.nominal();
    }

    public boolean isUncertain() {
        return !distribution.isFixed();
    }

    /** A value of this parameter in its display unit, e.g. "5.5 %". */
    public String show(double canonicalValue) {
        return display.format(canonicalValue);
    }
}
