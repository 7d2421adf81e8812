package org.fabspread.sampling;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** SHA-256 (FIPS 180-4) of files and file prefixes, for the integrity of checkpoints and partial results. */
public final class FileDigest {

    private FileDigest() {
    }

    /** A fresh SHA-256 digest (every Java platform has one: Java SE MessageDigest requirements). */
    public static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("the Java platform lacks SHA-256", e);
        }
    }

    /** The digest updated with the first {@code bytes} bytes of {@code file} (fewer if the file is shorter). */
    public static MessageDigest prefix(Path file, long bytes) throws IOException {
        MessageDigest md = sha256();
        byte[] buf = new byte[1 << 16];
        long left = bytes;
        try (InputStream in = Files.newInputStream(file)) {
            while (left > 0) {
                int n = in.read(buf, 0, (int) Math.min(buf.length, left));
                if (n < 0) {
                    break;
                }
                md.update(buf, 0, n);
                left -= n;
            }
        }
        return md;
    }

    /** Hex SHA-256 of a whole file. */
    public static String of(Path file) throws IOException {
        return hex(prefix(file, Long.MAX_VALUE));
    }

    /** Hex of the digest so far, leaving {@code md} usable for more bytes. */
    public static String peek(MessageDigest md) {
        try {
            return hex((MessageDigest) md.clone());
        } catch (CloneNotSupportedException e) {
            throw new IllegalStateException("SHA-256 digest cannot be cloned", e);
        }
    }

    private static String hex(MessageDigest md) {
        return hex(md.digest());
    }

    /** Lower-case hex of a digest's bytes. */
    public static String hex(byte[] digest) {
        return HexFormat.of().formatHex(digest);
    }
}
