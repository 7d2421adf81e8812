package org.fabspread.spark;

import java.io.Serializable;

/**
 * Called in the Spark task before each chunk is evaluated, with the task's attempt number (0 for the
 * first attempt). The engine's own probe does nothing; a test passes one that fails chosen first attempts,
 * to show that Spark's retry of a deterministic chunk gives the same bits.
 */
@FunctionalInterface
public interface TaskProbe extends Serializable {

    /** The probe that does nothing. */
    TaskProbe NONE = (chunk, attempt) -> { };

    void before(long chunk, int attempt);
}
