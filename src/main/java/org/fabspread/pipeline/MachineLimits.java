package org.fabspread.pipeline;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * What {@link Preflight} asks of the machine: the free space of a folder's file system, the Java heap, the
 * time of one model run. Each answer can be replaced by a hidden system property so that the refusals that
 * depend on the machine are tested deterministically (for tests only; not a user option, not in the help):
 * <ul>
 *   <li>{@value #FREE_DISK}: {@code FOLDER=BYTES[,FOLDER=BYTES…]}; a path at or under FOLDER (the longest
 *       match wins) has BYTES usable, any other path the file system's real usable space;</li>
 *   <li>{@value #HEAP}: the Java heap in bytes instead of {@link Runtime#maxMemory()};</li>
 *   <li>{@value #SECONDS_PER_RUN}: the seconds of one model run instead of the timed nominal runs.</li>
 * </ul>
 */
final class MachineLimits {

    static final String FREE_DISK = "fabspread.test.free-disk-bytes";
    static final String HEAP = "fabspread.test.heap-bytes";
    static final String SECONDS_PER_RUN = "fabspread.test.seconds-per-run";

    private MachineLimits() {
    }

    /** Usable bytes on the file system of {@code existing} (a path that exists). */
    static long usableBytes(Path existing) throws IOException {
        String fake = System.getProperty(FREE_DISK);
        if (fake != null && !fake.isBlank()) {
            Path p = existing.toAbsolutePath().normalize();
            Path best = null;
            long bytes = 0;
            for (String entry : fake.split(",")) {
                int eq = entry.lastIndexOf('=');
                Path folder = Path.of(entry.substring(0, eq)).toAbsolutePath().normalize();
                if (p.startsWith(folder) && (best == null || folder.getNameCount() > best.getNameCount())) {
                    best = folder;
                    bytes = Long.parseLong(entry.substring(eq + 1).strip());
                }
            }
            if (best != null) {
                return bytes;
            }
        }
        return Files.getFileStore(existing).getUsableSpace();
    }

    /** The most memory the Java heap may take. */
    static long heapBytes() {
        String fake = System.getProperty(HEAP);
        return fake == null || fake.isBlank() ? Runtime.getRuntime().maxMemory() : Long.parseLong(fake.strip());
    }

    /** The faked seconds of one model run, or a negative number when the runs are to be timed. */
    static double secondsPerRun() {
        String fake = System.getProperty(SECONDS_PER_RUN);
        return fake == null || fake.isBlank() ? -1 : Double.parseDouble(fake.strip());
    }
}
