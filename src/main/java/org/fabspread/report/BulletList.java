package org.fabspread.report;

import java.util.List;
import java.util.Objects;

/** An unordered list of plain-text items. */
public record BulletList(List<String> items) implements Block {

    public BulletList {
        items = List.copyOf(Objects.requireNonNull(items, "items"));
        if (items.isEmpty()) {
            throw new IllegalArgumentException("a bullet list needs at least one item");
        }
    }
}
