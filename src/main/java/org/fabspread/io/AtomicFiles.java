package org.fabspread.io;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;

/**
 * Every output file is written to a temporary file in the same folder and then renamed over its
 * final name, so a reader (or an interrupted run) never sees a half-written file.
 */
public final class AtomicFiles {

    private AtomicFiles() {
    }

    /** Writes bytes through a callback, atomically. */
    public static void write(Path target, IoConsumer<OutputStream> body) throws IOException {
        Path dir = target.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path tmp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".part");
        try {
            try (OutputStream out = Files.newOutputStream(tmp)) {
                body.accept(out);
            }
            readableByAll(tmp);
            move(tmp, target);
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    /** Writes text (UTF-8) through a callback, atomically. */
    public static void writeText(Path target, IoConsumer<Writer> body) throws IOException {
        write(target, out -> {
            Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8));
            body.accept(w);
            w.flush();
        });
    }

    public static void writeString(Path target, String text) throws IOException {
        writeText(target, w -> w.write(text));
    }

    /** Temporary files are created owner-only; results are ordinary files others may read. */
    private static void readableByAll(Path file) throws IOException {
        if (file.getFileSystem().supportedFileAttributeViews().contains("posix")) {
            Files.setPosixFilePermissions(file, PosixFilePermissions.fromString("rw-r--r--"));
        }
    }

    private static void move(Path tmp, Path target) throws IOException {
        try {
            Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    /** A consumer that may throw {@link IOException}. */
    @FunctionalInterface
    public interface IoConsumer<T> {
        void accept(T t) throws IOException;
    }
}
