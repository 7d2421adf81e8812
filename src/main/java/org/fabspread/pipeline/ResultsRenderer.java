package org.fabspread.pipeline;

import java.io.IOException;
import java.nio.file.Path;

/**
 * A rendering of a run's results into its output folder beside {@code summary.json} (the report, for
 * one). The pipeline calls it last, once every result is in.
 */
@FunctionalInterface
public interface ResultsRenderer {

    /** Writes the rendering into {@code folder}; returns its main file (for the user), or null. */
    Path render(StudyResults results, Path folder) throws IOException;
}
