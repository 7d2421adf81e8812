package org.fabspread.study;

import java.nio.file.Path;
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

    /** Reads the bundled index and tables through {@link NkCsv} for their first and last wavelength. */
    final class Bundled implements MaterialCatalog {
        static final Bundled INSTANCE = new Bundled();
        private final List<String> ids = NkCsv.bundledIds();
        private final Map<String, double[]> ranges = new ConcurrentHashMap<>();

        private Bundled() {
        }

        @Override public List<String> ids() {
            return ids;
        }

        @Override public double[] range(String id) {
            if (!has(id)) {
                throw new IllegalArgumentException("no bundled material " + id);
            }
            return ranges.computeIfAbsent(id, k -> span(NkCsv.readBundled(k))).clone();
        }

        @Override public double[] rangeOfFile(Path csv) {
            return span(NkCsv.read(csv));
        }

        private static double[] span(NkCsv.Rows rows) {
            double[] w = rows.wavelength();
            return new double[] {w[0], w[w.length - 1]};
        }
    }
}
