package org.fabspread.report;

import java.util.Objects;

/** A chart with its caption (plain text). */
public record Figure(Chart chart, String caption) implements Block {

    public Figure {
        Objects.requireNonNull(chart, "chart");
        Objects.requireNonNull(caption, "caption");
    }
}
