package org.fabspread.model;

/** A model evaluation that failed for a reason tied to its inputs (counted, never hidden). */
public class ModelException extends RuntimeException {
    private final String reason;

    public ModelException(String reason, String message) {
        super(message);
        this.reason = reason;
    }

    /** A short machine-friendly reason key, e.g. {@code negative-thickness}, {@code nan}, {@code out-of-range}. */
    public String reason() {
        return reason;
    }
}
