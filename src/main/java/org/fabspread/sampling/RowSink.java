package org.fabspread.sampling;

/**
 * Receives the samples of a run one row at a time, strictly in sample order (so anything it
 * accumulates is independent of the thread count). {@code x} and {@code y} are views that are reused:
 * copy what you keep.
 */
public interface RowSink {

    /**
     * @param sample  sample index
     * @param x       inputs, input-space order, from {@code x[offX]}
     * @param y       outputs, model order, from {@code y[offY]} (NaN when failed)
     * @param status  null when the evaluation succeeded, else its reason
     */
    void row(long sample, double[] x, int offX, double[] y, int offY, String status);

    /** Feeds every row of a chunk. */
    default void chunk(Chunk c) {
        for (int r = 0; r < c.count(); r++) {
            row(c.first() + r, c.x(), r * c.inputs(), c.y(), r * c.outputs(), c.status()[r]);
        }
    }
}
