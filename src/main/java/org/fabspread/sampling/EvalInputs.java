package org.fabspread.sampling;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.fabspread.study.Describe;
import org.fabspread.study.Parameter;
import org.fabspread.study.StudyException;
import org.fabspread.study.Suggestions;
import org.fabspread.study.TextFiles;
import org.fabspread.study.Units;

/**
 * The rows {@code eval} reads: a comma-separated table whose header names uncertain inputs of the study, each
 * optionally with its unit ({@code stack.etl.thickness [nm]}, the form of the run sheet the {@code plan} command
 * writes), and any number of ID columns ({@code wafer}, {@code lot}, or the run sheet's {@code run},
 * {@code notes} …) that travel to the output unchanged. A cell may carry its own unit ({@code 5 %},
 * {@code 102 nm}, {@code 0.1 µm}); a bare number is in its column's unit, or the input's canonical unit when
 * the header names none. Cells in double quotes follow RFC 4180 (a quoted cell may hold commas; {@code ""} is
 * a quote); ID cells are copied as written, quotes included.
 *
 * <p>A column that is not an input is an ID column unless it looks like a mistyped input: a dotted name (input
 * ids are dotted, ID column names are not), a fixed number of the study, an input's last part
 * ({@code thickness} for {@code stack.etl.thickness}), or within two edits of an input id. Those are refused.
 *
 * @param idHeaders  the ID columns' headers as written, in file order
 * @param idCells    per row, the ID cells as written
 * @param points     per row, the full input vector (space order, nominal where the file has no column)
 */
record EvalInputs(List<String> idHeaders, List<List<String>> idCells, List<double[]> points) {

    private static final Pattern WITH_UNIT = Pattern.compile("^(.*?)\\s*\\[([^\\]]*)]$");

    /** Reads and checks the whole file; errors name the file, line and column. */
    static EvalInputs read(Path file, StudyInputSpace space, Map<String, Parameter> parameters,
                           List<String> outputColumns) throws IOException {
        String name = file.getFileName().toString();
        if (!Files.isRegularFile(file)) {
            throw new StudyException(name + ": no such file");
        }
        List<String> lines = TextFiles.read(file).lines().toList();
        int headerLine = 0;
        while (headerLine < lines.size() && lines.get(headerLine).isBlank()) {
            headerLine++;
        }
        if (headerLine == lines.size()) {
            throw new StudyException(name + ": empty file, expected a header of input ids");
        }
        String header = lines.get(headerLine);
        if (header.startsWith("\uFEFF")) {
            header = header.substring(1);
        }
        String where = name + ":" + (headerLine + 1) + ": ";
        List<String> ids = space.ids();
        List<String> cols = split(header, where);
        int[] target = new int[cols.size()];
        String[] bareUnit = new String[cols.size()];
        Units.Quantity[] quantity = new Units.Quantity[cols.size()];
        List<String> idHeaders = new ArrayList<>();
        List<String> seen = new ArrayList<>();
        for (int c = 0; c < cols.size(); c++) {
            String raw = unquote(cols.get(c)).trim();
            Matcher m = WITH_UNIT.matcher(raw);
            String col = m.matches() ? m.group(1).trim() : raw;
            String unit = m.matches() ? m.group(2).trim() : null;
            if (seen.contains(col)) {
                throw new StudyException(where + "column '" + col + "' appears twice");
            }
            seen.add(col);
            int at = ids.indexOf(col);
            target[c] = at;
            if (at < 0) {
                refuseIfMistypedInput(where, c, col, ids, parameters);
                if (outputColumns.contains(raw)) {
                    throw new StudyException(where + "column " + (c + 1) + " '" + raw + "' has the name of a column"
                            + " eval writes; rename it");
                }
                idHeaders.add(cols.get(c));
                continue;
            }
            quantity[c] = Describe.quantity(parameters.get(col).unit());
            if (unit != null) {
                try {
                    Units.cell("1", quantity[c], unit);
                } catch (IllegalArgumentException e) {
                    throw new StudyException(where + raw + ": " + e.getMessage());
                }
                bareUnit[c] = unit;
            }
        }
        double[] nominal = space.nominal();
        List<List<String>> idCells = new ArrayList<>();
        List<double[]> points = new ArrayList<>();
        for (int l = headerLine + 1; l < lines.size(); l++) {
            String line = lines.get(l);
            if (line.isBlank()) {
                continue;
            }
            String at = name + ":" + (l + 1);
            List<String> cells = split(line, at + ": ");
            if (cells.size() != cols.size()) {
                throw new StudyException(at + ": expected " + cols.size() + " values, got " + cells.size());
            }
            double[] x = nominal.clone();
            List<String> passed = new ArrayList<>();
            int charCol = 1;
            for (int c = 0; c < cells.size(); c++) {
                String cell = unquote(cells.get(c)).trim();
                if (target[c] < 0) {
                    passed.add(cells.get(c));
                } else {
                    String id = ids.get(target[c]);
                    String here = at + ":" + charCol + ": " + id + ": ";
                    if (cell.isEmpty()) {
                        throw new StudyException(here + "missing value");
                    }
                    try {
                        x[target[c]] = Units.cell(cell, quantity[c], bareUnit[c]);
                    } catch (IllegalArgumentException e) {
                        throw new StudyException(here + (e.getMessage().contains("is not a number")
                                ? "not a number: '" + cell + "'" : e.getMessage()));
                    }
                    if (!Double.isFinite(x[target[c]])) {
                        throw new StudyException(here + "must be a finite number, got '" + cell + "'");
                    }
                }
                charCol += cells.get(c).length() + 1;
            }
            points.add(x);
            idCells.add(passed);
        }
        return new EvalInputs(List.copyOf(idHeaders), List.copyOf(idCells), List.copyOf(points));
    }

    private static void refuseIfMistypedInput(String where, int c, String col, List<String> ids,
                                              Map<String, Parameter> parameters) {
        String head = where + "column " + (c + 1) + " '" + col + "' ";
        String inputs = " (inputs: " + String.join(", ", ids) + ")";
        Parameter fixed = parameters.get(col);
        if (fixed != null) {
            throw new StudyException(head + "is a fixed number of the study, not an uncertain input; give it a"
                    + " spread in the study to vary it" + inputs);
        }
        List<String> near = new ArrayList<>();
        for (String id : ids) {
            int d = Suggestions.distance(col, id);
            if (id.endsWith("." + col) || d <= 2 && d < col.length()) {
                near.add(id);
            }
        }
        if (col.contains(".") || !near.isEmpty()) {
            throw new StudyException(head + "is not an uncertain input of the study"
                    + (near.isEmpty() ? "" : "; did you mean " + String.join(" or ", near.stream()
                    .map(s -> "'" + s + "'").toList()) + "?") + inputs
                    + "; ID columns such as 'wafer' pass through to the output");
        }
    }

    /** Splits one CSV line into raw cells (quotes kept) at commas outside double quotes. */
    static List<String> split(String line, String where) {
        List<String> out = new ArrayList<>();
        int start = 0;
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char ch = line.charAt(i);
            if (ch == '"') {
                quoted = !quoted;
            } else if (ch == ',' && !quoted) {
                out.add(line.substring(start, i));
                start = i + 1;
            }
        }
        if (quoted) {
            throw new StudyException(where + "a quoted cell is not closed");
        }
        out.add(line.substring(start));
        return out;
    }

    /** The text of a cell without its surrounding quotes ({@code ""} inside reads as one quote). */
    static String unquote(String raw) {
        String t = raw.trim();
        if (t.length() >= 2 && t.startsWith("\"") && t.endsWith("\"")) {
            return t.substring(1, t.length() - 1).replace("\"\"", "\"");
        }
        return raw;
    }
}
