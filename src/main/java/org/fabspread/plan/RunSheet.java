package org.fabspread.plan;

import java.io.IOException;
import java.io.Reader;
import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.databind.MappingIterator;
import com.fasterxml.jackson.databind.SequenceWriter;
import com.fasterxml.jackson.dataformat.csv.CsvMapper;
import com.fasterxml.jackson.dataformat.csv.CsvParser;
import com.fasterxml.jackson.dataformat.csv.CsvSchema;

import org.fabspread.io.AtomicFiles;
import org.fabspread.study.StudyException;

/**
 * The run sheet an operator follows: one line per run in run order, with the standard order, the
 * block, every factor in real units (header {@code id [unit]}), an empty {@code measured_<response>}
 * column to fill in, and a notes column (centre point, axial point, replicate). Settings are rounded
 * to each factor's precision ({@link Factor#setting}) and fractions are written in percent. Read back
 * with the measured column filled for the analysis.
 */
public final class RunSheet {

    public static final String RUN = "run";
    public static final String STD = "std_order";
    public static final String BLOCK = "block";
    public static final String NOTES = "notes";
    public static final String MEASURED_PREFIX = "measured_";

    private RunSheet() {
    }

    /** The header of the measured column, e.g. {@code measured_jsc [mA/cm^2]}. */
    public static String measuredHeader(String response, String unit) {
        return MEASURED_PREFIX + response + (unit == null || unit.isEmpty() ? "" : " [" + unit + "]");
    }

    /** Writes the run sheet (atomically). */
    public static void write(Plan plan, String response, String unit, Path file) throws IOException {
        List<String> header = new ArrayList<>(List.of(RUN, STD, BLOCK));
        for (Factor f : plan.factors()) {
            header.add(f.header());
        }
        header.add(measuredHeader(response, unit));
        header.add(NOTES);
        CsvMapper mapper = new CsvMapper();
        mapper.disable(com.fasterxml.jackson.core.JsonGenerator.Feature.AUTO_CLOSE_TARGET);
        mapper.enable(com.fasterxml.jackson.dataformat.csv.CsvGenerator.Feature.STRICT_CHECK_FOR_QUOTING);
        AtomicFiles.writeText(file, w -> {
            try (SequenceWriter sw = mapper.writer().with(CsvSchema.emptySchema()).writeValues(w)) {
                sw.write(header);
                for (Run r : plan.runs()) {
                    List<String> row = new ArrayList<>();
                    row.add(Integer.toString(r.runOrder()));
                    row.add(Integer.toString(r.standardOrder()));
                    row.add(Integer.toString(r.block()));
                    for (int i = 0; i < plan.factors().size(); i++) {
                        row.add(format(plan.factors().get(i).toSheet(plan.real(r, i))));
                    }
                    row.add("");
                    row.add(notes(plan, r));
                    sw.write(row);
                }
            }
        });
    }

    private static String notes(Plan plan, Run r) {
        List<String> n = new ArrayList<>();
        if (r.type() == Run.PointType.CENTRE) {
            n.add("centre point");
        } else if (r.type() == Run.PointType.AXIAL) {
            boolean beyond = false;
            for (int i = 0; i < plan.factors().size(); i++) {
                beyond |= Math.abs(r.level(i)) > 1 + 1e-9;
            }
            n.add(beyond ? "axial point (beyond the low/high levels)" : "axial point (face-centred, at a low or high level)");
        }
        if (plan.replicates() > 1 && r.type() != Run.PointType.CENTRE) {
            n.add("replicate " + r.replicate());
        }
        return String.join("; ", n);
    }

    /** Six significant digits, plain notation. */
    public static String format(double v) {
        if (v == 0) {
            return "0";
        }
        return new BigDecimal(v).round(new MathContext(6)).stripTrailingZeros().toPlainString();
    }

    /**
     * A run sheet read back.
     *
     * @param factorIds   factor ids from the headers
     * @param units       their units
     * @param response    the response id of the measured column
     * @param real        factor settings per run [run][factor]
     * @param measured    the measured response per run
     * @param runOrder    run numbers
     * @param standardOrder standard-order numbers
     * @param block       blocks
     */
    public record Measured(List<String> factorIds, List<String> units, String response, double[][] real,
                           double[] measured, int[] runOrder, int[] standardOrder, int[] block) {
    }

    /**
     * Reads a filled run sheet. Errors name the file, the line and the column:
     * {@code plan.csv:7: measured_jsc [mA/cm^2]: missing value}.
     */
    public static Measured read(Path file) {
        String fname = file.getFileName().toString();
        List<List<String>> rows = new ArrayList<>();
        CsvMapper mapper = new CsvMapper();
        mapper.enable(CsvParser.Feature.WRAP_AS_ARRAY);
        try (Reader r = org.fabspread.study.TextFiles.reader(file);
             MappingIterator<List<String>> it = mapper.readerForListOf(String.class).readValues(r)) {
            while (it.hasNext()) {
                rows.add(it.next());
            }
        } catch (NoSuchFileException e) {
            throw new StudyException(fname + ": no such file");
        } catch (IOException | RuntimeException e) {
            throw new StudyException(fname + ": cannot read the run sheet: " + e.getMessage().lines().findFirst().orElse(""));
        }
        if (rows.isEmpty()) {
            throw new StudyException(fname + ":1: empty file, expected a header line");
        }
        List<String> header = rows.get(0).stream().map(String::trim).toList();
        int cRun = header.indexOf(RUN);
        int cStd = header.indexOf(STD);
        int cBlock = header.indexOf(BLOCK);
        int cMeas = -1;
        for (int i = 0; i < header.size(); i++) {
            if (header.get(i).startsWith(MEASURED_PREFIX)) {
                cMeas = i;
            }
        }
        for (String need : List.of(RUN, STD, BLOCK)) {
            if (!header.contains(need)) {
                throw new StudyException(fname + ":1: " + need + ": missing column");
            }
        }
        if (cMeas < 0) {
            throw new StudyException(fname + ":1: " + MEASURED_PREFIX + "<response>: missing column");
        }
        String mh = header.get(cMeas);
        String response = mh.substring(MEASURED_PREFIX.length()).replaceAll("\\s*\\[.*]\\s*$", "").trim();
        List<Integer> fCols = new ArrayList<>();
        List<String> ids = new ArrayList<>();
        List<String> units = new ArrayList<>();
        for (int i = 0; i < header.size(); i++) {
            String h = header.get(i);
            if (i == cRun || i == cStd || i == cBlock || i == cMeas || h.equals(NOTES) || h.isEmpty()) {
                continue;
            }
            int lb = h.lastIndexOf('[');
            if (lb < 0 || !h.endsWith("]")) {
                throw new StudyException(fname + ":1: " + h + ": a factor column needs its unit, e.g. 'id [nm]'");
            }
            ids.add(h.substring(0, lb).trim());
            units.add(h.substring(lb + 1, h.length() - 1).trim());
            fCols.add(i);
        }
        if (ids.isEmpty()) {
            throw new StudyException(fname + ":1: no factor columns");
        }
        int n = rows.size() - 1;
        double[][] real = new double[n][ids.size()];
        double[] y = new double[n];
        int[] run = new int[n];
        int[] std = new int[n];
        int[] block = new int[n];
        int kept = 0;
        for (int r = 1; r < rows.size(); r++) {
            List<String> row = rows.get(r);
            int line = r + 1;
            if (row.stream().allMatch(s -> s == null || s.isBlank())) {
                continue;
            }
            run[kept] = (int) number(row, cRun, header, fname, line);
            std[kept] = (int) number(row, cStd, header, fname, line);
            block[kept] = (int) number(row, cBlock, header, fname, line);
            for (int f = 0; f < fCols.size(); f++) {
                real[kept][f] = number(row, fCols.get(f), header, fname, line);
            }
            y[kept] = number(row, cMeas, header, fname, line);
            kept++;
        }
        if (kept == 0) {
            throw new StudyException(fname + ":2: no runs");
        }
        return new Measured(List.copyOf(ids), List.copyOf(units), response,
                java.util.Arrays.copyOf(real, kept), java.util.Arrays.copyOf(y, kept),
                java.util.Arrays.copyOf(run, kept), java.util.Arrays.copyOf(std, kept),
                java.util.Arrays.copyOf(block, kept));
    }

    private static double number(List<String> row, int col, List<String> header, String fname, int line) {
        String s = col < row.size() ? row.get(col) : null;
        if (s == null || s.isBlank()) {
            throw new StudyException(fname + ":" + line + ": " + header.get(col) + ": missing value");
        }
        try {
            double v = Double.parseDouble(s.trim());
            if (!Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return v;
        } catch (NumberFormatException e) {
            throw new StudyException(fname + ":" + line + ": " + header.get(col) + ": not a number: '" + s.trim() + "'");
        }
    }
}
