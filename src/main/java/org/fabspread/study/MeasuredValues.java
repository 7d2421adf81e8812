package org.fabspread.study;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import com.fasterxml.jackson.databind.MappingIterator;
import com.fasterxml.jackson.dataformat.csv.CsvMapper;
import com.fasterxml.jackson.dataformat.csv.CsvParser;

/**
 * One column of measured values from a CSV file with a header row (read with jackson-dataformat-csv).
 * Empty cells are skipped (logs of unequal length); anything else that is not a number is an error
 * naming the file, line and column.
 */
final class MeasuredValues {
    private static final CsvMapper MAPPER = new CsvMapper();

    /** The values and the 1-based file line of each. */
    record Column(double[] values, int[] lines) {
    }

    private MeasuredValues() {
    }

    static Column read(Path csv, String column) {
        String name = csv.getFileName().toString();
        List<Double> values = new ArrayList<>();
        List<Integer> lines = new ArrayList<>();
        try (MappingIterator<String[]> it = MAPPER.readerFor(String[].class)
                .with(CsvParser.Feature.WRAP_AS_ARRAY)
                .with(CsvParser.Feature.SKIP_EMPTY_LINES)
                .readValues(TextFiles.read(csv))) {
            if (!it.hasNextValue()) {
                throw new StudyException(name + ": the file is empty; expected a header row naming the columns");
            }
            String[] header = it.nextValue();
            int idx = -1;
            for (int i = 0; i < header.length; i++) {
                if (header[i].strip().equals(column)) {
                    idx = i;
                }
            }
            if (idx < 0) {
                List<String> cols = Arrays.stream(header).map(String::strip).toList();
                String shown = String.join(", ", cols.subList(0, Math.min(cols.size(), 12)));
                throw new StudyException(name + ": no column '" + column + "'" + Suggestions.didYouMean(column, cols)
                        + "; columns: " + (shown.length() > 3 * Printable.EXCERPT
                        ? Printable.escape(shown.substring(0, 3 * Printable.EXCERPT)) + "…" : Printable.escape(shown)));
            }
            while (it.hasNextValue()) {
                int line = it.getCurrentLocation().getLineNr();
                String[] row = it.nextValue();
                if (row.length == 1 && row[0].isBlank()) {
                    continue;
                }
                String cell = idx < row.length ? row[idx].strip() : "";
                if (cell.isEmpty()) {
                    continue;
                }
                double v;
                try {
                    v = Double.parseDouble(cell);
                } catch (NumberFormatException e) {
                    throw new StudyException(name + ":" + line + ": column '" + column + "': not a number: '" + Printable.excerpt(cell) + "'");
                }
                if (!Double.isFinite(v)) {
                    throw new StudyException(name + ":" + line + ": column '" + column + "': not a finite number");
                }
                values.add(v);
                lines.add(line);
            }
        } catch (IOException | RuntimeException e) {
            throw StudyException.readingCsv(name, e);
        }
        if (values.size() < 2) {
            throw new StudyException(name + ": column '" + column + "' holds " + values.size()
                    + " value(s); a measured distribution needs at least 2");
        }
        double[] v = new double[values.size()];
        int[] l = new int[values.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = values.get(i);
            l[i] = lines.get(i);
        }
        return new Column(v, l);
    }
}
