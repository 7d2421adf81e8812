package org.fabspread.study;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The optical-constant table format, read in one place for the study reader's checks
 * ({@link MaterialCatalog}) and the optics package's tables ({@code optics.MaterialLibrary}):
 * {@code #} comment lines (the bundled ones carry {@code # material:} and {@code # source:}), a header
 * ({@code wavelength_nm,n,k}, or any layout {@link NkColumns} detects: nm, µm or eV; n, k or ε1, ε2;
 * comma, tab or semicolon), then rows with increasing wavelength (or photon energy in either order). The bundled tables live in the jar
 * under {@link #BUNDLED_ROOT}, listed in its {@code index.txt}.
 */
public final class NkCsv {
    /** Classpath folder of the bundled tables and their index. */
    public static final String BUNDLED_ROOT = "/org/fabspread/shared/data/materials/";

    private NkCsv() {
    }

    /**
     * The rows of a table.
     *
     * @param meta       {@code # key: value} comment lines, first occurrence of each key, in file order
     * @param wavelength nm, increasing
     * @param n          refractive index
     * @param k          extinction coefficient, ≥ 0
     * @param clamped    rows whose negative k (digitisation noise) was read as 0
     * @param layout     what the header said, in one line ("comma-separated, wavelength in nm, n and k")
     */
    public record Rows(Map<String, String> meta, double[] wavelength, double[] n, double[] k, int clamped,
                       String layout) {
    }

    /** The ids of the bundled tables in index order (lines of {@code index.txt} that are not blank or comments). */
    public static List<String> bundledIds() {
        List<String> list = new ArrayList<>();
        try (InputStream in = NkCsv.class.getResourceAsStream(BUNDLED_ROOT + "index.txt")) {
            if (in == null) {
                throw new IllegalStateException("the material index is missing from the jar");
            }
            try (BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
                String line;
                while ((line = r.readLine()) != null) {
                    line = line.strip();
                    if (!line.isEmpty() && !line.startsWith("#")) {
                        list.add(line);
                    }
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return Collections.unmodifiableList(list);
    }

    /** Reads the bundled table {@code id} (the caller checks that the index lists it). */
    public static Rows readBundled(String id) {
        String res = BUNDLED_ROOT + id + ".csv";
        try (InputStream in = NkCsv.class.getResourceAsStream(res)) {
            if (in == null) {
                throw new IllegalStateException("bundled material file missing: " + res);
            }
            return read(id + ".csv", new InputStreamReader(in, StandardCharsets.UTF_8));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * Reads a user's table file (UTF-8 with or without byte-order mark, see {@link TextFiles}); errors
     * name the file by its name and line.
     */
    public static Rows read(Path file) {
        String name = file.getFileName().toString();
        try {
            return read(name, TextFiles.reader(file));
        } catch (IOException e) {
            throw new StudyException(name + ": cannot read material table: " + Printable.excerpt(e.getMessage()));
        }
    }

    /**
     * Reads a table; a malformed one throws a {@link StudyException} naming {@code fileName} and the line.
     * Negative k is read as 0 and counted.
     */
    public static Rows read(String fileName, Reader reader) throws IOException {
        BufferedReader r = new BufferedReader(reader);
        Map<String, String> meta = new LinkedHashMap<>();
        List<double[]> rows = new ArrayList<>();
        List<Integer> lines = new ArrayList<>();
        String line;
        int lineNo = 0;
        NkColumns layout = null;
        while ((line = r.readLine()) != null) {
            lineNo++;
            String s = (lineNo == 1 && line.startsWith("\uFEFF") ? line.substring(1) : line).strip();
            if (s.isEmpty()) {
                continue;
            }
            if (s.startsWith("#")) {
                int c = s.indexOf(':');
                if (c > 0) {
                    meta.putIfAbsent(s.substring(1, c).strip(), s.substring(c + 1).strip());
                }
                continue;
            }
            if (layout == null) {
                layout = NkColumns.detect(s);
                if (layout == null) {
                    throw new StudyException(fileName + ":" + lineNo + ": header must name a wavelength (nm, µm) or"
                            + " photon-energy (eV) column and n, k or ε1, ε2 columns, as 'wavelength_nm,n,k', got '"
                            + Printable.excerpt(s) + "'");
                }
                continue;
            }
            rows.add(row(fileName, lineNo, s, layout));
            lines.add(lineNo);
        }
        if (rows.size() < 2) {
            throw new StudyException(fileName + ": a material table needs at least two data rows");
        }
        if (layout.axis() == NkColumns.Axis.ELECTRONVOLT && rows.get(1)[0] < rows.get(0)[0]) {
            // energies in increasing order are wavelengths in decreasing order: read them backwards
            java.util.Collections.reverse(rows);
            java.util.Collections.reverse(lines);
        }
        return rows(fileName, meta, rows, lines, layout);
    }

    /** One data row as {wavelength nm, n, k}. */
    private static double[] row(String fileName, int lineNo, String s, NkColumns layout) {
        String[] names = layout.labels();
        String[] f = layout.cells(s);
        if (f.length != 3) {
            throw new StudyException(fileName + ":" + lineNo + ": expected 3 columns " + String.join(",", names)
                    + ", got " + f.length);
        }
        double[] v = new double[3];
        for (int i = 0; i < 3; i++) {
            try {
                v[i] = Double.parseDouble(f[i].strip());
            } catch (NumberFormatException e) {
                throw new StudyException(fileName + ":" + lineNo + ": " + names[i] + ": not a number: '"
                        + Printable.excerpt(f[i]) + "'");
            }
            if (!Double.isFinite(v[i])) {
                throw new StudyException(fileName + ":" + lineNo + ": " + names[i] + ": not a finite number");
            }
        }
        if (v[0] <= 0) {
            throw new StudyException(fileName + ":" + lineNo + ": " + names[0] + " must be > 0");
        }
        double[] nk = layout.toNk(v[1], v[2]);
        return new double[] {layout.toNanometres(v[0]), nk[0], nk[1]};
    }

    private static Rows rows(String fileName, Map<String, String> meta, List<double[]> rows, List<Integer> lines,
                             NkColumns layout) {
        double[] w = new double[rows.size()];
        double[] n = new double[rows.size()];
        double[] k = new double[rows.size()];
        int clamped = 0;
        for (int i = 0; i < rows.size(); i++) {
            double[] row = rows.get(i);
            int lineNo = lines.get(i);
            if (!(row[1] > 0)) {
                throw new StudyException(fileName + ":" + lineNo + ": n must be > 0 (a refractive index of a passive"
                        + " film), got " + Units.format(row[1]));
            }
            if (row[2] < 0) {
                // digitised tables carry small negative k (digitisation noise); a passive film cannot
                // have gain, so such k is read as 0 and counted (shown by the materials command)
                row[2] = 0;
                clamped++;
            }
            if (i > 0 && row[0] <= w[i - 1]) {
                throw new StudyException(fileName + ":" + lineNo + ": " + layout.labels()[0]
                        + (layout.axis() == NkColumns.Axis.ELECTRONVOLT ? " must change in one direction" : " must increase"));
            }
            w[i] = row[0];
            n[i] = row[1];
            k[i] = row[2];
        }
        return new Rows(Collections.unmodifiableMap(meta), w, n, k, clamped, layout.describe());
    }
}
