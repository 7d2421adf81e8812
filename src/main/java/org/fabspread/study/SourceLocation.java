package org.fabspread.study;

import java.nio.file.Path;

/** Where a value came from in a study file: file, 1-based line and column, and its key path. */
public record SourceLocation(Path file, int line, int column, String keyPath) {

    public static SourceLocation unknown(String keyPath) {
        return new SourceLocation(null, 0, 0, keyPath);
    }

    /** {@code study.yaml:12:5: stack[2].thickness} */
    public String prefix() {
        String f = file == null ? "<study>" : file.getFileName().toString();
        return line > 0 ? f + ":" + line + ":" + column + ": " + keyPath : f + ": " + keyPath;
    }
}
