package org.fabspread.report;

import java.util.Objects;

/** Text shown verbatim in a monospaced font, for example the echo of the study file. */
public record Preformatted(String text) implements Block {

    public Preformatted {
        Objects.requireNonNull(text, "text");
    }
}
