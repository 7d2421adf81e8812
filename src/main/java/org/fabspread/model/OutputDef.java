package org.fabspread.model;

/**
 * One model output: a stable id usable in targets (for example {@code jsc}), its unit as shown
 * to users (for example {@code mA/cm^2}) and a one-line description.
 */
public record OutputDef(String id, String unit, String description) {
}
