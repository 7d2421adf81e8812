package org.fabspread.analysis;

/**
 * Receives progress of a long computation. May be called from any worker thread, concurrently;
 * implementations must be thread-safe and cheap.
 */
@FunctionalInterface
public interface ProgressListener {

    /** A listener that ignores every report. */
    ProgressListener NONE = (done, total) -> { };

    /**
     * @param done  units of work finished so far (model runs, for the Sobol design)
     * @param total units of work in all
     */
    void progress(long done, long total);
}
