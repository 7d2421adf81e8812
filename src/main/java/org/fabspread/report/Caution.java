package org.fabspread.report;

import java.util.Objects;

/** A warning the reader must not miss, rendered as a highlighted box. Plain text. */
public record Caution(String text) implements Block {

    public Caution {
        Objects.requireNonNull(text, "text");
    }
}
