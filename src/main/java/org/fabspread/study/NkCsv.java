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
 * {@code wavelength_nm,n,k}, then rows with increasing wavelength. The bundled tables live in the jar
 * under {@link #BUNDLED_ROOT}, listed in its {@code index.txt}.
 */
public final class NkCsv {
    /** Classpath folder of the bundled tables and their index. */
    public static final String BUNDLED_ROOT = "/org/fabspread/shared/data/materials/";

    private static final String[] COLUMNS = {"wavelength_nm", "n", "k"};

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
     */
    public record Rows(Map<String, String> meta, double[] wavelength, double[] n, double[] k, int clamped) {
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
        String line;
        int lineNo = 0;
        boolean header = false;
        int clamped = 0;
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
            if (!header) {
                String h = s.replace(" ", "").toLowerCase();
                if (!h.equals("wavelength_nm,n,k")) {
                    throw new StudyException(fileName + ":" + lineNo + ": header must be 'wavelength_nm,n,k', got '" + Printable.excerpt(s) + "'");
                }
                header = true;
                continue;
            }
            String[] f = s.split(",");
            if (f.length != 3) {
                throw new StudyException(fileName + ":" + lineNo + ": expected 3 columns wavelength_nm,n,k, got " + f.length);
            }
            double[] row = new double[3];
            for (int i = 0; i < 3; i++) {
                try {
                    row[i] = Double.parseDouble(f[i].strip());
                } catch (NumberFormatException e) {
                    throw new StudyException(fileName + ":" + lineNo + ": " + COLUMNS[i] + ": not a number: '" + Printable.excerpt(f[i]) + "'");
                }
                if (!Double.isFinite(row[i])) {
                    throw new StudyException(fileName + ":" + lineNo + ": " + COLUMNS[i] + ": not a finite number");
                }
            }
            if (row[0] <= 0) {
                throw new StudyException(fileName + ":" + lineNo + ": wavelength_nm must be > 0");
            }
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
            if (!rows.isEmpty() && row[0] <= rows.get(rows.size() - 1)[0]) {
                throw new StudyException(fileName + ":" + lineNo + ": wavelength_nm must increase");
            }
            rows.add(row);
        }
        if (rows.size() < 2) {
            throw new StudyException(fileName + ": a material table needs at least two data rows");
        }
        double[] w = new double[rows.size()];
        double[] n = new double[rows.size()];
        double[] k = new double[rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            w[i] = rows.get(i)[0];
            n[i] = rows.get(i)[1];
            k[i] = rows.get(i)[2];
        }
        return new Rows(Collections.unmodifiableMap(meta), w, n, k, clamped);
    }
}
