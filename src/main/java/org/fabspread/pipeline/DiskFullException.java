package org.fabspread.pipeline;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;

/**
 * A run stopped because a write failed for lack of room: the disk is full (ENOSPC, "No space left on
 * device"), the user's disk quota is used up (EDQUOT, "Disk quota exceeded") or a file reached the file size
 * limit (EFBIG, "File too large"; {@code ulimit -f}). The input is not at fault and the unfinished run is
 * kept in its staging folder for {@code --resume}; the message is the whole one-line error and names both
 * folders. The error texts are the C library's {@code strerror} strings, which the JDK passes on as the
 * message of the {@link IOException} it throws (common practice: glibc's wording on Linux).
 */
public final class DiskFullException extends IOException {

    private static final long serialVersionUID = 1L;

    /** The system's words for a write that failed for lack of room. */
    private static final List<String> NO_ROOM = List.of("No space left on device", "Disk quota exceeded",
            "File too large");

    /**
     * @param reason  the system's words ("No space left on device", …)
     * @param staging the staging folder the run was writing
     * @param target  the results folder, left as it was
     * @param kept    the staging folder still holds the unfinished run (else nothing of this run is left)
     * @param cause   the failed write
     */
    DiskFullException(String reason, Path staging, Path target, boolean kept, Throwable cause) {
        super("the disk is full (" + reason + ") while writing " + staging + "; the results folder " + target
                + " was left as it was; free some space and run again" + (kept ? " with --resume" : ""), cause);
    }

    /** The system's words when {@code t} or one of its causes (or suppressed failures) is a write without room. */
    static Optional<String> reason(Throwable t) {
        for (Throwable c = t; c != null; c = c.getCause()) {
            String m = c.getMessage();
            if (m != null) {
                for (String r : NO_ROOM) {
                    if (m.contains(r)) {
                        return Optional.of(r);
                    }
                }
            }
            for (Throwable s : c.getSuppressed()) {
                Optional<String> r = reason(s);
                if (r.isPresent()) {
                    return r;
                }
            }
        }
        return Optional.empty();
    }
}
