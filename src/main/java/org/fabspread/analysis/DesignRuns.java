package org.fabspread.analysis;

import org.fabspread.model.Model;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.ModelRows;
import org.fabspread.sampling.RowBatch;
import org.fabspread.sampling.RowInputs;

/**
 * Evaluates the rows of a design whose input values are already drawn, as a {@link RowBatch} of fixed
 * chunks on the caller's engine, storing outputs by row in chunk order: the same bits on any thread count
 * and engine. A failed or non-finite evaluation leaves NaN in every output of its row.
 */
final class DesignRuns {

    private static final int CHUNK_ROWS = 64;

    private DesignRuns() {
    }

    /**
     * @param name   what the design is, for the engine's log
     * @param x      row-major input values, {@code rows × k}
     * @param total  the number reported to {@code progress} as the whole
     * @return outputs[output][row]
     */
    static double[][] evaluate(Engine engine, String name, Model model, double[] x, int k, long total,
                               ProgressListener progress) {
        int rows = x.length / k;
        int nOut = model.outputs().size();
        double[][] y = new double[nOut][rows];
        long[] done = {0};
        ModelRows.run(engine, new Rows(name, model, x, k), (in, out) -> {
            int from = (int) in.chunk() * CHUNK_ROWS;
            for (int t = 0; t < in.rows(); t++) {
                boolean good = out.finite(t);
                for (int q = 0; q < nOut; q++) {
                    y[q][from + t] = good ? out.value(t, q) : Double.NaN;
                }
            }
            done[0] += in.rows();
            progress.progress(done[0], total);
        });
        return y;
    }

    /** The drawn rows in chunks of {@link #CHUNK_ROWS}. */
    private record Rows(String name, Model model, double[] x, int k) implements RowBatch {

        @Override
        public long chunkCount() {
            return (x.length / k + CHUNK_ROWS - 1) / CHUNK_ROWS;
        }

        @Override
        public RowInputs inputs(long chunk) {
            int from = (int) chunk * CHUNK_ROWS;
            int to = Math.min(x.length / k, from + CHUNK_ROWS);
            return RowInputs.of(chunk, k, java.util.Arrays.copyOfRange(x, from * k, to * k));
        }
    }
}
