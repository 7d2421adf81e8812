package org.fabspread.study;

/**
 * Bad input: a study file, a table or a command-line value that cannot be used. Its message is the
 * whole one-line error a user sees, e.g. {@code study.yaml:12:5: stack[2].thickness: must be >= 0 nm, got -3 nm}.
 * The command line turns it into exit code 2.
 */
public class StudyException extends RuntimeException {

    /** The message is shown with its control characters escaped ({@link Printable#escape}). */
    public StudyException(String message) {
        super(Printable.escape(message));
    }

    public StudyException(String message, Throwable cause) {
        super(Printable.escape(message), cause);
    }

    /** An error at a location: {@code file:line:col: key.path: message}. */
    public static StudyException at(SourceLocation where, String message) {
        return new StudyException(where.prefix() + ": " + message);
    }

    /**
     * The one-line error for a CSV file that could not be read: malformed CSV (with its line when the
     * parser knows it), an I/O failure, or a located error raised while reading (passed through).
     */
    public static StudyException readingCsv(String fileName, Exception e) {
        if (e instanceof StudyException se) {
            return se;
        }
        if (e instanceof com.fasterxml.jackson.core.JsonProcessingException j) {
            int line = j.getLocation() == null ? 0 : j.getLocation().getLineNr();
            return new StudyException(fileName + (line > 0 ? ":" + line : "") + ": malformed CSV: "
                    + Printable.excerpt(j.getOriginalMessage()));
        }
        if (e instanceof java.io.IOException) {
            return new StudyException(fileName + ": cannot read: " + Printable.excerpt(e.getMessage()));
        }
        Throwable c = e.getCause();
        return new StudyException(fileName + ": malformed CSV: " + Printable.excerpt(c != null ? c.getMessage() : e.getMessage()));
    }
}
