package org.fabspread.study;

/**
 * Bad input: a study file, a table or a command-line value that cannot be used. Its message is the
 * whole one-line error a user sees, e.g. {@code study.yaml:12:5: stack[2].thickness: must be >= 0 nm, got -3 nm}.
 * The command line turns it into exit code 2.
 */
public class StudyException extends RuntimeException {

    /** The key path of an error raised without a place in the file (null: the message is complete). */
    private final String unplacedKey;
    /** The message after the key path, for an error without a place. */
    private final String detail;

    /** The message is shown with its control characters escaped ({@link Printable#escape}). */
    public StudyException(String message) {
        this(message, (Throwable) null);
    }

    public StudyException(String message, Throwable cause) {
        super(Printable.escape(message), cause);
        this.unplacedKey = null;
        this.detail = null;
    }

    private StudyException(SourceLocation where, String message, Throwable cause) {
        super(Printable.escape(where.prefix() + ": " + message), cause);
        boolean unplaced = where.file() == null && where.line() <= 0;
        this.unplacedKey = unplaced ? where.keyPath() : null;
        this.detail = unplaced ? message : null;
    }

    /**
     * An error at a location: {@code file:line:col: key.path: message}. Code that knows the key but not
     * the file passes {@link SourceLocation#unknown}; {@link KeyPlaces#locate} then puts the error at
     * the key's place in the study file.
     */
    public static StudyException at(SourceLocation where, String message) {
        return new StudyException(where, message, null);
    }

    /** The key path of an error raised with {@link SourceLocation#unknown}, if it was. */
    public java.util.Optional<String> unplacedKey() {
        return java.util.Optional.ofNullable(unplacedKey);
    }

    /** What is wrong, without the place (the whole message when the error names its place itself). */
    public String detail() {
        return detail == null ? getMessage() : detail;
    }

    /** The same error at {@code where} (for an error raised with {@link SourceLocation#unknown}). */
    public StudyException placedAt(SourceLocation where) {
        return new StudyException(where, detail(), getCause());
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
