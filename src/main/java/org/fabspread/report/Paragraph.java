package org.fabspread.report;

import java.util.Objects;

/** A paragraph of plain text. */
public record Paragraph(String text) implements Block {

    public Paragraph {
        Objects.requireNonNull(text, "text");
    }
}
