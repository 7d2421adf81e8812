package org.fabspread.study;

import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;

/**
 * The place of a key path in a study file, for errors raised after reading by code that knows the key
 * ({@code plan.max_runs}, {@code analysis.samples}) but not the file: {@link #locate} puts such an error at
 * the key's value, or, when the key was not written (a default), at the nearest section written above it,
 * or at the file alone. The file is parsed again for this; it is only done on the way to an error.
 */
public final class KeyPlaces {

    /** Line and column of one written key and of its value. */
    private record Place(int keyLine, int keyColumn, int valueLine, int valueColumn) {
    }

    private KeyPlaces() {
    }

    /**
     * The error {@code e} at its key's place in {@code studyFile}; unchanged when it already names a
     * place, when there is no file, or when the file can no longer be read.
     */
    public static StudyException locate(Path studyFile, StudyException e) {
        if (studyFile == null || e.unplacedKey().isEmpty()) {
            return e;
        }
        return e.placedAt(find(studyFile, e.unplacedKey().get()));
    }

    /** Where {@code keyPath} is written in {@code studyFile} (see the class comment for a key not written). */
    public static SourceLocation find(Path studyFile, String keyPath) {
        Map<String, Place> places = new HashMap<>();
        try {
            walk(YamlTree.parse(studyFile), "", places);
        } catch (StudyException unreadable) {
            return new SourceLocation(studyFile, 0, 0, keyPath);
        }
        Place exact = places.get(keyPath);
        if (exact != null) {
            return new SourceLocation(studyFile, exact.valueLine(), exact.valueColumn(), keyPath);
        }
        for (String p = parent(keyPath); p != null; p = parent(p)) {
            Place above = places.get(p);
            if (above != null) {
                return new SourceLocation(studyFile, above.keyLine(), above.keyColumn(), keyPath);
            }
        }
        return new SourceLocation(studyFile, 0, 0, keyPath);
    }

    private static void walk(YamlNode node, String path, Map<String, Place> places) {
        if (node instanceof YamlNode.Mapping m) {
            for (YamlNode.Entry e : m.entries().values()) {
                String p = path.isEmpty() ? e.key().name() : path + "." + e.key().name();
                YamlNode v = e.value();
                boolean empty = v instanceof YamlNode.Scalar s && s.isNull();
                places.put(p, new Place(e.key().line(), e.key().column(), empty ? e.key().line() : v.line(),
                        empty ? e.key().column() : v.column()));
                walk(v, p, places);
            }
        } else if (node instanceof YamlNode.Sequence s) {
            for (int i = 0; i < s.items().size(); i++) {
                YamlNode v = s.items().get(i);
                String p = path + "[" + i + "]";
                places.put(p, new Place(v.line(), v.column(), v.line(), v.column()));
                walk(v, p, places);
            }
        }
    }

    /** {@code plan.limits.x} → {@code plan.limits}, {@code stack[2]} → {@code stack}, {@code plan} → null. */
    private static String parent(String keyPath) {
        int cut = Math.max(keyPath.lastIndexOf('.'), keyPath.lastIndexOf('['));
        return cut <= 0 ? null : keyPath.substring(0, cut);
    }
}
