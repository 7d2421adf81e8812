package org.fabspread.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * A table of plain-text cells with a caption, a header row and one alignment per column. Every row
 * has as many cells as the header.
 */
public record Table(String caption, List<String> header, List<List<String>> rows, List<Align> alignment)
        implements Block {

    /** Horizontal alignment of a column. */
    public enum Align { LEFT, CENTER, RIGHT }

    /** A number as the report prints it: optional sign, digits, decimals, exponent, percent sign, ±, range dash. */
    private static final Pattern NUMERIC =
            Pattern.compile("[−+-]?(\\d+([.,]\\d*)?|[.,]\\d+)([eE][−+-]?\\d+)?\\s*(%|±.*|[–-][−+-]?[\\d.]+\\s*%?)?");

    public Table {
        Objects.requireNonNull(caption, "caption");
        header = List.copyOf(Objects.requireNonNull(header, "header"));
        alignment = List.copyOf(Objects.requireNonNull(alignment, "alignment"));
        if (header.isEmpty()) {
            throw new IllegalArgumentException("table '" + caption + "': the header needs at least one column");
        }
        if (alignment.size() != header.size()) {
            throw new IllegalArgumentException("table '" + caption + "': " + alignment.size()
                    + " alignments for " + header.size() + " columns");
        }
        List<List<String>> copy = new ArrayList<>(rows.size());
        for (int r = 0; r < rows.size(); r++) {
            List<String> row = List.copyOf(rows.get(r));
            if (row.size() != header.size()) {
                throw new IllegalArgumentException("table '" + caption + "': row " + (r + 1) + " has "
                        + row.size() + " cells, the header has " + header.size());
            }
            copy.add(row);
        }
        rows = List.copyOf(copy);
    }

    /**
     * A table whose columns are right-aligned where every non-empty cell reads as a number (so digits
     * line up) and left-aligned otherwise.
     */
    public static Table of(String caption, List<String> header, List<List<String>> rows) {
        List<Align> align = new ArrayList<>(header.size());
        for (int c = 0; c < header.size(); c++) {
            boolean numeric = false;
            boolean text = false;
            for (List<String> row : rows) {
                if (c >= row.size()) {
                    continue;
                }
                String cell = row.get(c).strip();
                if (cell.isEmpty()) {
                    continue;
                }
                if (NUMERIC.matcher(cell).matches()) {
                    numeric = true;
                } else {
                    text = true;
                }
            }
            align.add(numeric && !text ? Align.RIGHT : Align.LEFT);
        }
        return new Table(caption, header, rows, align);
    }
}
