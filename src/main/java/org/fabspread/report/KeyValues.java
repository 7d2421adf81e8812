package org.fabspread.report;

import java.util.List;
import java.util.Objects;

/** A two-column list of named values (settings, summary figures). */
public record KeyValues(List<Pair> pairs) implements Block {

    public KeyValues {
        pairs = List.copyOf(Objects.requireNonNull(pairs, "pairs"));
        if (pairs.isEmpty()) {
            throw new IllegalArgumentException("a key-value list needs at least one pair");
        }
    }

    /** One named value; both are plain text. */
    public record Pair(String key, String value) {
        public Pair {
            Objects.requireNonNull(key, "key");
            Objects.requireNonNull(value, "value");
        }
    }

    /** Shorthand for one pair. */
    public static Pair pair(String key, String value) {
        return new Pair(key, value);
    }
}
