package org.fabspread.sampling;

import java.io.IOException;
import java.io.Serializable;
import java.nio.file.Path;
import java.util.List;

/**
 * Where a chunk's samples are written by whoever evaluated it (a worker thread of this machine, or a
 * cluster's executor), right after the evaluation and before the chunk is handed over: one file or folder
 * per chunk, named by its index, written whole and then renamed into place, so a retried chunk (same bits)
 * replaces its file with the same bytes. Serializable: it travels to the executors with the run.
 */
@FunctionalInterface
public interface ChunkStore extends Serializable {

    /** Writes chunk {@code chunk}'s rows (inputs, outputs, status). Called from several threads at once. */
    void write(Chunk chunk) throws IOException;

    /** Makes the store of a run whose samples go under {@code folder}. */
    @FunctionalInterface
    interface Maker {
        /**
         * @param folder  the store's folder (absolute; the caller's results folder while it is being written)
         * @param columns the column names: the inputs, then the outputs, in the chunk's order
         */
        ChunkStore at(Path folder, List<String> columns);
    }
}
