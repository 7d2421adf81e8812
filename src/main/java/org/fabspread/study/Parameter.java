package org.fabspread.study;

/**
 * One number of a study, with a stable id (e.g. {@code stack.etl.thickness}), its canonical unit
 * (the unit every layer below the study parser uses: nm, fraction, V, cm^2/V, mA/cm^2, ohm cm^2, K,
 * or "1" for dimensionless), its spread, and where it was written.
 */
public record Parameter(String id, String unit, DistributionSpec distribution, SourceLocation where) {

    public static Parameter fixed(String id, String unit, double value) {
        return new Parameter(id, unit, new DistributionSpec.Fixed(value), SourceLocation.unknown(id));
    }

    public double nominal() {
        return distribution.nominal();
    }

    public boolean isUncertain() {
        return !distribution.isFixed();
    }
}
