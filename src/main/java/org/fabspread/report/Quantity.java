package org.fabspread.report;

import java.util.Objects;

/**
 * What an axis shows: a label and its unit, drawn as {@code label (unit)}. Every axis of every chart
 * carries a unit; a dimensionless quantity uses {@link #dimensionless(String)} and reads
 * {@code label (–)}.
 */
public record Quantity(String label, String unit) {

    /** The unit shown for a dimensionless quantity. */
    public static final String NO_UNIT = "–";

    public Quantity {
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(unit, "unit");
        if (label.isBlank()) {
            throw new IllegalArgumentException("an axis quantity needs a label");
        }
        if (unit.isBlank()) {
            throw new IllegalArgumentException("the quantity '" + label
                    + "' needs a unit; use Quantity.dimensionless for a pure number");
        }
    }

    public static Quantity of(String label, String unit) {
        return new Quantity(label, unit);
    }

    public static Quantity dimensionless(String label) {
        return new Quantity(label, NO_UNIT);
    }

    /** The axis title: {@code label (unit)}. */
    public String axisTitle() {
        return label + " (" + unit + ")";
    }
}
