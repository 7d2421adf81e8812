package org.fabspread.device;

import org.fabspread.model.ModelException;

/**
 * A sample outside the model's domain, tied to the slot of the parameter at fault
 * ({@link ParameterVector#NONE} when no single parameter is), so that the check at the nominal point can
 * name the parameter and its place in the study file.
 */
final class InputException extends ModelException {
    private static final long serialVersionUID = 1L;

    /** slot of the parameter at fault in the {@link ParameterVector}, or {@link ParameterVector#NONE}. */
    final int slot;

    InputException(String reason, int slot, String message) {
        super(reason, message);
        this.slot = slot;
    }
}
