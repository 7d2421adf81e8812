package org.fabspread.sampling;

/** A run stopped because a sample failed under the STOP failure policy, or the model broke. */
public class RunFailedException extends RuntimeException {

    public RunFailedException(String message) {
        super(message);
    }

    public RunFailedException(String message, Throwable cause) {
        super(message, cause);
    }
}
