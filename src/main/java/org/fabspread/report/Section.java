package org.fabspread.report;

import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * A titled section of a report. Its id becomes the anchor of the table of contents, so it must be a
 * short identifier ({@code [A-Za-z][A-Za-z0-9_-]*}) unique within the document.
 */
public record Section(String id, String title, List<Block> blocks) {

    static final Pattern ID = Pattern.compile("[A-Za-z][A-Za-z0-9_-]{0,63}");

    public Section {
        Objects.requireNonNull(id, "id");
        Objects.requireNonNull(title, "title");
        if (!ID.matcher(id).matches()) {
            throw new IllegalArgumentException("section id '" + id
                    + "' must start with a letter and hold only letters, digits, '_' and '-' (at most 64)");
        }
        blocks = List.copyOf(Objects.requireNonNull(blocks, "blocks"));
    }

    public Section(String id, String title, Block... blocks) {
        this(id, title, List.of(blocks));
    }
}
