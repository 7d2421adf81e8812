package org.fabspread.spark;

import java.io.IOException;
import java.io.Serializable;
import java.io.UncheckedIOException;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.RecordComponent;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HexFormat;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

import org.fabspread.study.ReadOptions;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;

/**
 * A study as it travels to another machine: the bytes of the study file and of every data file the
 * parsed study names (n,k tables, enhancement tables, measured columns), keyed by their paths relative
 * to the folder that holds them all. {@link #materialise(Path)} writes them back under a fresh folder with
 * the same relative layout and reads the study from there, so the executor parses exactly what the driver
 * parsed.
 *
 * @param studyFile the study file's path relative to the common folder ('/'-separated)
 * @param files     relative path → file bytes, the study file included
 * @param digest    SHA-256 over the paths and bytes, the executor's cache key
 */
public record StudySource(String studyFile, Map<String, byte[]> files, String digest) implements Serializable {

    /** Snapshots the study at {@code file} (already read and validated as {@code study}). */
    public static StudySource of(Path file, Study study) {
        List<Path> named = new ArrayList<>();
        Path main = file.toAbsolutePath().normalize();
        named.add(main);
        collectPaths(study, named, new IdentityHashMap<>());
        Path root = main.getParent();
        for (Path p : named) {
            while (!p.startsWith(root)) {
                root = root.getParent();
            }
        }
        Map<String, byte[]> files = new TreeMap<>();
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            for (Path p : named) {
                String rel = root.relativize(p).toString().replace('\\', '/');
                if (!files.containsKey(rel)) {
                    files.put(rel, Files.readAllBytes(p));
                }
            }
            for (Map.Entry<String, byte[]> e : files.entrySet()) {
                md.update(e.getKey().getBytes(java.nio.charset.StandardCharsets.UTF_8));
                md.update((byte) 0);
                md.update(e.getValue());
            }
            String rel = root.relativize(main).toString().replace('\\', '/');
            return new StudySource(rel, files, HexFormat.of().formatHex(md.digest()));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Writes the files under {@code folder} and reads the study from there. */
    public Study materialise(Path folder) throws IOException {
        for (Map.Entry<String, byte[]> e : files.entrySet()) {
            Path p = folder.resolve(e.getKey()).normalize();
            if (!p.startsWith(folder)) {
                throw new IOException("study source path escapes its folder: " + e.getKey());
            }
            Files.createDirectories(p.getParent());
            Files.write(p, e.getValue());
        }
        // the driver has already checked where the data files may lie; here they all sit under the folder
        return StudyReader.read(folder.resolve(studyFile), ReadOptions.forRun().allowingOutsideFiles(true));
    }

    /** Every regular file named by a {@link Path} anywhere in the study's records, lists, maps and optionals. */
    private static void collectPaths(Object o, List<Path> out, IdentityHashMap<Object, Boolean> seen) {
        if (o == null || seen.put(o, Boolean.TRUE) != null) {
            return;
        }
        if (o instanceof Path p) {
            Path a = p.toAbsolutePath().normalize();
            if (Files.isRegularFile(a)) {
                out.add(a);
            }
        } else if (o instanceof Collection<?> c) {
            c.forEach(e -> collectPaths(e, out, seen));
        } else if (o instanceof Map<?, ?> m) {
            m.forEach((k, v) -> {
                collectPaths(k, out, seen);
                collectPaths(v, out, seen);
            });
        } else if (o instanceof Optional<?> opt) {
            opt.ifPresent(v -> collectPaths(v, out, seen));
        } else if (o instanceof Object[] arr) {
            for (Object e : arr) {
                collectPaths(e, out, seen);
            }
        } else if (o.getClass().isRecord()) {
            for (RecordComponent rc : o.getClass().getRecordComponents()) {
                try {
                    rc.getAccessor().setAccessible(true);
                    collectPaths(rc.getAccessor().invoke(o), out, seen);
                } catch (IllegalAccessException | InvocationTargetException e) {
                    throw new IllegalStateException("cannot read " + rc, e);
                }
            }
        }
    }
}
