package org.fabspread.optics;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import org.fabspread.study.MaterialRef;
import org.fabspread.study.StudyException;

/**
 * The optical-constant tables bundled in the jar (copied from the project's {@code shared/data/materials},
 * listed in its {@code index.txt}) and user tables in the same CSV format: {@code #} comment lines
 * (the bundled ones carry {@code # material:} and {@code # source:}), a header {@code wavelength_nm,n,k},
 * then rows.
 */
public final class MaterialLibrary {
    /** Classpath folder of the project's shared data inside the jar. */
    public static final String SHARED = "/org/fabspread/shared/";
    private static final MaterialLibrary BUNDLED = new MaterialLibrary();

    private final List<String> ids;
    private final Map<String, NkTable> cache = new ConcurrentHashMap<>();

    private MaterialLibrary() {
        List<String> list = new ArrayList<>();
        try (InputStream in = MaterialLibrary.class.getResourceAsStream(SHARED + "data/materials/index.txt")) {
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
        this.ids = Collections.unmodifiableList(list);
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
        return cache.computeIfAbsent(id, key -> {
            String res = SHARED + "data/materials/" + key + ".csv";
            try (InputStream in = MaterialLibrary.class.getResourceAsStream(res)) {
                if (in == null) {
                    throw new IllegalStateException("bundled material file missing: " + res);
                }
                return read(key, key + ".csv", new InputStreamReader(in, StandardCharsets.UTF_8));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        });
    }

    /** A study's material: bundled, or a user CSV. */
    public NkTable resolve(MaterialRef ref) {
        return ref.isBundled() ? get(ref.id()) : readCsv(ref.id(), ref.csvFile());
    }

    /** Reads a user CSV table; errors name the file and line. */
    public static NkTable readCsv(String id, Path file) {
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return read(id, file.toString(), r);
        } catch (NoSuchFileException e) {
            throw new StudyException(file + ": material table not found");
        } catch (IOException e) {
            throw new StudyException(file + ": cannot read material table: " + e.getMessage());
        }
    }

    static NkTable read(String id, String fileName, Reader reader) throws IOException {
        BufferedReader r = new BufferedReader(reader);
        Map<String, String> meta = new LinkedHashMap<>();
        List<double[]> rows = new ArrayList<>();
        String line;
        int lineNo = 0;
        boolean header = false;
        int clamped = 0;
        while ((line = r.readLine()) != null) {
            lineNo++;
            String s = line.strip();
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
                    throw new StudyException(fileName + ":" + lineNo + ": header must be 'wavelength_nm,n,k', got '" + s + "'");
                }
                header = true;
                continue;
            }
            String[] f = s.split(",");
            if (f.length != 3) {
                throw new StudyException(fileName + ":" + lineNo + ": expected 3 columns wavelength_nm,n,k, got " + f.length);
            }
            double[] row = new double[3];
            String[] names = {"wavelength_nm", "n", "k"};
            for (int i = 0; i < 3; i++) {
                try {
                    row[i] = Double.parseDouble(f[i].strip());
                } catch (NumberFormatException e) {
                    throw new StudyException(fileName + ":" + lineNo + ": " + names[i] + ": not a number: '" + f[i].strip() + "'");
                }
                if (!Double.isFinite(row[i])) {
                    throw new StudyException(fileName + ":" + lineNo + ": " + names[i] + ": not a finite number");
                }
            }
            if (row[0] <= 0) {
                throw new StudyException(fileName + ":" + lineNo + ": wavelength_nm must be > 0");
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
        return new NkTable(id, meta.getOrDefault("material", id), meta.getOrDefault("source", fileName), w, n, k,
                clamped);
    }
}
