package org.fabspread.study;

/**
 * How a study is read. The command line builds one from its options and passes it to
 * {@link StudyReader#read(java.nio.file.Path, ReadOptions)}; {@code check} and {@code run} use
 * {@link #forRun()}, so that {@code check} refuses exactly what {@code run} would.
 *
 * @param allowOutsideFiles    data files (n,k tables, measured values, enhancement tables) may lie
 *                             outside the study's folder (the {@code --allow-outside-files} option);
 *                             otherwise such a path is refused
 * @param requireUncertainInput the study is for a Monte Carlo run: at least one input must carry a
 *                             spread
 */
public record ReadOptions(boolean allowOutsideFiles, boolean requireUncertainInput) {

    /** For commands that look at one device (optics, particles, eval): no spread needed, files inside. */
    public static ReadOptions defaults() {
        return new ReadOptions(false, false);
    }

    /** For check and run: everything a run needs is checked. */
    public static ReadOptions forRun() {
        return new ReadOptions(false, true);
    }

    /** These options with outside files allowed or not. */
    public ReadOptions allowingOutsideFiles(boolean allow) {
        return new ReadOptions(allow, requireUncertainInput);
    }
}
