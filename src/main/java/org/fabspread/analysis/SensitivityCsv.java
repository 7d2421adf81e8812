package org.fabspread.analysis;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;

import org.fabspread.io.AtomicFiles;

/**
 * Writes {@code sensitivity.csv}: one row per output and input with the columns
 * {@code output,input,first_order,first_low,first_high,total,total_low,total_high,method}. Missing values
 * (no interval, no total index from screening) are empty fields. Written atomically.
 */
public final class SensitivityCsv {

    public static final String HEADER = "output,input,first_order,first_low,first_high,total,total_low,total_high,method";
    public static final String FILE_NAME = "sensitivity.csv";

    private SensitivityCsv() {
    }

    /** Writes the Sobol indices and/or the screening results (either may be null). */
    public static void write(Path file, SobolResult sobol, ScreeningResult screening) throws IOException {
        AtomicFiles.writeText(file, w -> {
            w.write(HEADER);
            w.write('\n');
            if (sobol != null) {
                String method = sobol.points() == SobolIndices.Points.RANDOM ? "sobol-saltelli-jansen-bootstrap"
                        : "sobol-saltelli-jansen-rqmc";
                for (SobolResult.OutputIndices o : sobol.outputs()) {
                    for (SobolResult.IndexEstimate e : o.indices()) {
                        row(w, o.output(), e.input(), method, e.first(), e.firstLow(), e.firstHigh(), e.total(),
                                e.totalLow(), e.totalHigh());
                    }
                }
            }
            if (screening != null) {
                for (ScreeningResult.OutputScreening o : screening.outputs()) {
                    for (ScreeningResult.InputScreening e : o.inputs()) {
                        row(w, o.output(), e.input(), "binned-correlation-ratio", e.firstOrder(), Double.NaN,
                                Double.NaN, Double.NaN, Double.NaN, Double.NaN);
                    }
                }
            }
        });
    }

    public static void write(Path file, SobolResult sobol) throws IOException {
        write(file, sobol, null);
    }

    public static void write(Path file, ScreeningResult screening) throws IOException {
        write(file, null, screening);
    }

    private static void row(Writer w, String output, String input, String method, double... v) throws IOException {
        w.write(field(output));
        w.write(',');
        w.write(field(input));
        for (double d : v) {
            w.write(',');
            if (Double.isFinite(d)) {
                w.write(Double.toString(d));
            }
        }
        w.write(',');
        w.write(method);
        w.write('\n');
    }

    static String field(String s) {
        if (s.indexOf(',') >= 0 || s.indexOf('"') >= 0 || s.indexOf('\n') >= 0) {
            return '"' + s.replace("\"", "\"\"") + '"';
        }
        return s;
    }
}
