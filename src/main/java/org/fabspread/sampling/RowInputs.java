package org.fabspread.sampling;

import java.io.Serializable;

/**
 * The model inputs of one chunk of a {@link RowBatch}: {@code rows} rows of {@code width} values in the
 * model's input order, row-major ({@code x[r * width + i]}). Rows come in groups of {@code group}
 * consecutive rows in which a failed row (refused, or a non-finite output) ends its group: the rows after it
 * are not evaluated (the Sobol design's A, B, A_B^(i) of one design row). {@code notes} are per-chunk
 * values the batch keeps for its own consumer (the importance-sampling weights), never read by an engine.
 * A plain value object: it travels to another machine as it is.
 *
 * @param chunk the chunk index
 * @param rows  number of rows
 * @param width values per row (the model's input count)
 * @param group rows per group (≥ 1; 1: every row stands alone)
 * @param x     the input values, {@code rows × width}
 * @param notes the batch's own per-chunk values (empty when it keeps none)
 */
public record RowInputs(long chunk, int rows, int width, int group, double[] x, double[] notes)
        implements Serializable {

    public RowInputs {
        if (width < 1 || group < 1 || rows < 0 || x.length != (long) rows * width || rows % group != 0) {
            throw new IllegalArgumentException("rows " + rows + ", width " + width + ", group " + group
                    + " do not fit " + x.length + " values");
        }
    }

    /** Rows that stand alone and keep no notes. */
    public static RowInputs of(long chunk, int width, double[] x) {
        return new RowInputs(chunk, x.length / width, width, 1, x, new double[0]);
    }
}
