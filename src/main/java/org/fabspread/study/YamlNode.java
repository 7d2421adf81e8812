package org.fabspread.study;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A node of a parsed YAML document that remembers where it was written (1-based line and column),
 * so every error can point at the offending value or key.
 */
sealed interface YamlNode {

    int line();

    int column();

    /** Plain words for error messages: "a number or text", "a list", "a section (key: value pairs)". */
    String kindName();

    /** A scalar: its source text and what the YAML parser took it for. */
    record Scalar(String text, Type type, int line, int column) implements YamlNode {
        enum Type { STRING, NUMBER, BOOLEAN, NULL }

        @Override public String kindName() {
            return type == Type.NULL ? "an empty value" : "a single value";
        }

        boolean isNull() {
            return type == Type.NULL;
        }
    }

    /** A key of a mapping with the position of the key itself. */
    record Key(String name, int line, int column) {
    }

    /** A mapping in document order. */
    record Mapping(Map<String, Entry> entries, int line, int column) implements YamlNode {
        public Mapping {
            entries = Collections.unmodifiableMap(new LinkedHashMap<>(entries));
        }

        @Override public String kindName() {
            return "a section of key: value pairs";
        }

        YamlNode get(String key) {
            Entry e = entries.get(key);
            return e == null ? null : e.value();
        }
    }

    /** One key: value pair. */
    record Entry(Key key, YamlNode value) {
    }

    /** A sequence. */
    record Sequence(List<YamlNode> items, int line, int column) implements YamlNode {
        public Sequence {
            items = List.copyOf(items);
        }

        @Override public String kindName() {
            return "a list";
        }
    }
}
