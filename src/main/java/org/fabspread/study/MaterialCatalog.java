package org.fabspread.study;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * What the study reader needs to know about optical-constant tables: which bundled ids exist and
 * which wavelength range each table (bundled or user CSV) covers. The reader checks ids and grids
 * against it without depending on the optics package (which depends on this one); the default
 * implementation reads the bundled index and tables the optics package ships in the jar, and
 * a test holds it equal to {@code optics.MaterialLibrary}.
 */
public interface MaterialCatalog {

    /** Bundled ids in index order. */
    List<String> ids();

    default boolean has(String id) {
        return ids().contains(id);
    }

    /** {min, max} tabulated wavelength (nm) of a bundled table. */
    double[] range(String id);

    /**
     * {min, max} wavelength (nm) of a user table {@code wavelength_nm,n,k}.
     *
     * @throws StudyException naming the file and line of a malformed table
     */
    double[] rangeOfFile(Path csv);

    /** The catalog of the tables bundled in the jar. */
    static MaterialCatalog bundled() {
        return Bundled.INSTANCE;
    }

    /** Reads the bundled index and scans tables for their first and last wavelength. */
    final class Bundled implements MaterialCatalog {
        static final Bundled INSTANCE = new Bundled();
        private static final String ROOT = "/org/fabspread/shared/data/materials/";
        private final List<String> ids;
        private final Map<String, double[]> ranges = new ConcurrentHashMap<>();

        private Bundled() {
            List<String> list = new ArrayList<>();
            try (InputStream in = MaterialCatalog.class.getResourceAsStream(ROOT + "index.txt")) {
                if (in == null) {
                    throw new IllegalStateException("the material index is missing from the jar");
                }
                BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
                String line;
                while ((line = r.readLine()) != null) {
                    line = line.strip();
                    if (!line.isEmpty() && !line.startsWith("#")) {
                        list.add(line);
                    }
                }
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            ids = Collections.unmodifiableList(list);
        }

        @Override public List<String> ids() {
            return ids;
        }

        @Override public double[] range(String id) {
            if (!has(id)) {
                throw new IllegalArgumentException("no bundled material " + id);
            }
            return ranges.computeIfAbsent(id, k -> {
                try (InputStream in = MaterialCatalog.class.getResourceAsStream(ROOT + k + ".csv")) {
                    if (in == null) {
                        throw new IllegalStateException("bundled material file missing: " + k);
                    }
                    return scan(k + ".csv", new InputStreamReader(in, StandardCharsets.UTF_8));
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            }).clone();
        }

        @Override public double[] rangeOfFile(Path csv) {
            try (Reader r = Files.newBufferedReader(csv, StandardCharsets.UTF_8)) {
                return scan(csv.getFileName().toString(), r);
            } catch (IOException e) {
                throw new StudyException(csv.getFileName() + ": cannot read material table: " + e.getMessage());
            }
        }

        /** First and last wavelength of a {@code wavelength_nm,n,k} table, checking its shape. */
        static double[] scan(String name, Reader reader) throws IOException {
            BufferedReader r = new BufferedReader(reader);
            String line;
            int no = 0;
            boolean header = false;
            double first = Double.NaN;
            double last = Double.NaN;
            int rows = 0;
            while ((line = r.readLine()) != null) {
                no++;
                String s = line.strip();
                if (s.isEmpty() || s.startsWith("#")) {
                    continue;
                }
                if (!header) {
                    if (!s.replace(" ", "").equalsIgnoreCase("wavelength_nm,n,k")) {
                        throw new StudyException(name + ":" + no + ": header must be 'wavelength_nm,n,k', got '" + s + "'");
                    }
                    header = true;
                    continue;
                }
                String[] f = s.split(",");
                if (f.length != 3) {
                    throw new StudyException(name + ":" + no + ": expected 3 columns wavelength_nm,n,k, got " + f.length);
                }
                double w;
                try {
                    w = Double.parseDouble(f[0].strip());
                    Double.parseDouble(f[1].strip());
                    Double.parseDouble(f[2].strip());
                } catch (NumberFormatException e) {
                    throw new StudyException(name + ":" + no + ": not a number in '" + s + "'");
                }
                if (!(w > 0) || (rows > 0 && !(w > last))) {
                    throw new StudyException(name + ":" + no + ": wavelength_nm must be positive and increase");
                }
                if (rows == 0) {
                    first = w;
                }
                last = w;
                rows++;
            }
            if (rows < 2) {
                throw new StudyException(name + ": a material table needs at least two data rows");
            }
            return new double[] {first, last};
        }
    }
}
