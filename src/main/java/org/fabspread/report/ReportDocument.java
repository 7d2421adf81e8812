package org.fabspread.report;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * A whole report: title, subtitle (plain text, may be empty) and sections in reading order. Section ids
 * are unique, and so are the names of the charts of all its figures, compared without case because
 * they become file names ({@code charts/<name>.png}) on case-insensitive file systems too.
 */
public record ReportDocument(String title, String subtitle, List<Section> sections) {

    public ReportDocument {
        Objects.requireNonNull(title, "title");
        Objects.requireNonNull(subtitle, "subtitle");
        sections = List.copyOf(Objects.requireNonNull(sections, "sections"));
        Set<String> ids = new HashSet<>();
        Map<String, String> charts = new HashMap<>();
        for (Section s : sections) {
            if (!ids.add(s.id())) {
                throw new IllegalArgumentException("two sections have the id '" + s.id() + "'");
            }
            for (Block b : s.blocks()) {
                if (b instanceof Figure f) {
                    String name = f.chart().name();
                    String before = charts.put(name.toLowerCase(Locale.ROOT), name);
                    if (before != null) {
                        throw new IllegalArgumentException("two figures use the chart name '" + name
                                + (before.equals(name) ? "'" : "' (and '" + before + "', the same file name ignoring case)"));
                    }
                }
            }
        }
    }

    /** The figures of all sections, in reading order. */
    public List<Figure> figures() {
        List<Figure> out = new ArrayList<>();
        for (Section s : sections) {
            for (Block b : s.blocks()) {
                if (b instanceof Figure f) {
                    out.add(f);
                }
            }
        }
        return out;
    }
}
