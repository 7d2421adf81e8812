package org.fabspread.dda;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;

import org.fabspread.io.AtomicFiles;

/**
 * Shape tables on disk, one file {@code dda-KEY.bin} per {@link TableSpec#key()} in a cache folder. A file
 * that does not read back completely or whose key differs is ignored (the table is then recomputed).
 * Written through {@link AtomicFiles}, so a reader never sees half a file.
 */
public final class TableCache {
    private static final int MAGIC = 0x44444131;

    private TableCache() {
    }

    public static Path file(Path dir, TableSpec spec) {
        return dir.resolve("dda-" + spec.key() + ".bin");
    }

    public static Optional<ShapeTable> load(Path dir, TableSpec spec) {
        Path f = file(dir, spec);
        if (!Files.isRegularFile(f)) {
            return Optional.empty();
        }
        try (InputStream raw = Files.newInputStream(f);
             DataInputStream in = new DataInputStream(new BufferedInputStream(raw))) {
            if (in.readInt() != MAGIC || !in.readUTF().equals(spec.key())) {
                return Optional.empty();
            }
            double[][] nodes = spec.nodes();
            double[] wl = spec.wavelengths();
            int n = in.readInt();
            if (n != Quantity.COUNT * 2 * spec.nodeCount() * wl.length) {
                return Optional.empty();
            }
            double[] data = new double[n];
            for (int i = 0; i < n; i++) {
                data[i] = in.readDouble();
            }
            return Optional.of(new ShapeTable(nodes, wl, data));
        } catch (IOException e) {
            return Optional.empty();
        }
    }

    public static void store(Path dir, TableSpec spec, ShapeTable table) throws IOException {
        Files.createDirectories(dir);
        double[] data = table.data();
        AtomicFiles.write(file(dir, spec), os -> {
            DataOutputStream out = new DataOutputStream(new BufferedOutputStream(os));
            out.writeInt(MAGIC);
            out.writeUTF(spec.key());
            out.writeInt(data.length);
            for (double v : data) {
                out.writeDouble(v);
            }
            out.flush();
        });
    }

    /** The cached table, or a new one tabulated and stored. */
    public static ShapeTable loadOrTabulate(Path dir, TableSpec spec, int threads, ShapeTabulator.Progress progress)
            throws IOException {
        Optional<ShapeTable> t = load(dir, spec);
        if (t.isPresent()) {
            return t.get();
        }
        ShapeTable made = ShapeTabulator.tabulate(spec, threads, progress);
        store(dir, spec, made);
        return made;
    }
}
