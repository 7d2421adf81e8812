package org.fabspread.study;

/**
 * Bad input: a study file, a table or a command-line value that cannot be used. Its message is the
 * whole one-line error a user sees, e.g. {@code study.yaml:12:5: stack[2].thickness: must be >= 0 nm, got -3 nm}.
 * The command line turns it into exit code 2.
 */
public class StudyException extends RuntimeException {

    public StudyException(String message) {
        super(message);
    }

    public StudyException(String message, Throwable cause) {
        super(message, cause);
    }

    /** An error at a location: {@code file:line:col: key.path: message}. */
    public static StudyException at(SourceLocation where, String message) {
        return new StudyException(where.prefix() + ": " + message);
    }
}
