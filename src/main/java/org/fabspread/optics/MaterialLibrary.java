package org.fabspread.optics;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import org.fabspread.study.MaterialRef;
import org.fabspread.study.NkCsv;
import org.fabspread.study.StudyException;

/**
 * The optical-constant tables bundled in the jar (copied from the project's {@code shared/data/materials},
 * listed in its {@code index.txt}) and user tables in the same CSV format: {@code #} comment lines
 * (the bundled ones carry {@code # material:} and {@code # source:}), a header {@code wavelength_nm,n,k},
 * then rows. The format is read by {@link NkCsv}, which the study reader's checks share.
 */
public final class MaterialLibrary {
    /** Classpath folder of the project's shared data inside the jar. */
    public static final String SHARED = "/org/fabspread/shared/";
    private static final MaterialLibrary BUNDLED = new MaterialLibrary();

    private final List<String> ids;
    private final Map<String, NkTable> cache = new ConcurrentHashMap<>();

    private MaterialLibrary() {
        this.ids = NkCsv.bundledIds();
    }

    public static MaterialLibrary bundled() {
        return BUNDLED;
    }

    /** Bundled ids, in index order. */
    public List<String> ids() {
        return ids;
    }

    public boolean has(String id) {
        return ids.contains(id);
    }

    /** A bundled table by id. */
    public NkTable get(String id) {
        if (!has(id)) {
            throw new StudyException("unknown material '" + id + "'; bundled materials: " + String.join(", ", ids));
        }
        return cache.computeIfAbsent(id, key -> table(key, key + ".csv", NkCsv.readBundled(key)));
    }

    /** A study's material: bundled, or a user CSV. */
    public NkTable resolve(MaterialRef ref) {
        return ref.isBundled() ? get(ref.id()) : readCsv(ref.id(), ref.csvFile());
    }

    /** Reads a user CSV table; errors name the file and line. */
    public static NkTable readCsv(String id, Path file) {
        return table(id, file.toString(), NkCsv.read(file));
    }

    private static NkTable table(String id, String fileName, NkCsv.Rows rows) {
        return new NkTable(id, rows.meta().getOrDefault("material", id), rows.meta().getOrDefault("source", fileName),
                rows.wavelength(), rows.n(), rows.k(), rows.clamped());
    }
}
