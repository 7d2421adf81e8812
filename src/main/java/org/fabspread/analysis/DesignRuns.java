package org.fabspread.analysis;

import java.util.concurrent.atomic.AtomicLong;

import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.sampling.Engine;

/**
 * Evaluates the rows of a design whose input values are already drawn, in fixed chunks on worker
 * threads (one evaluator each), storing outputs by row: the same bits on any thread count. A failed or
 * non-finite evaluation leaves NaN in every output of its row.
 */
final class DesignRuns {

    private static final int CHUNK_ROWS = 64;

    private DesignRuns() {
    }

    /**
     * @param x      row-major input values, {@code rows × k}
     * @param total  the number reported to {@code progress} as the whole
     * @return outputs[output][row]
     */
    static double[][] evaluate(Engine engine, Model model, double[] x, int k, long total, ProgressListener progress) {
        int rows = x.length / k;
        int nOut = model.outputs().size();
        double[][] y = new double[nOut][rows];
        AtomicLong done = new AtomicLong();
        int chunks = (rows + CHUNK_ROWS - 1) / CHUNK_ROWS;
        Parallel.run(engine, chunks, () -> new Object[] {model.newEvaluator(), new double[k], new double[nOut]},
                (state, c) -> {
                    Evaluator e = (Evaluator) state[0];
                    double[] xi = (double[]) state[1];
                    double[] out = (double[]) state[2];
                    int from = c * CHUNK_ROWS;
                    int to = Math.min(rows, from + CHUNK_ROWS);
                    for (int r = from; r < to; r++) {
                        System.arraycopy(x, r * k, xi, 0, k);
                        boolean good = true;
                        try {
                            e.evaluate(xi, out);
                        } catch (ModelException ex) {
                            good = false;
                        }
                        for (int q = 0; q < nOut && good; q++) {
                            good = Double.isFinite(out[q]);
                        }
                        for (int q = 0; q < nOut; q++) {
                            y[q][r] = good ? out[q] : Double.NaN;
                        }
                    }
                    progress.progress(done.addAndGet(to - from), total);
                });
        return y;
    }
}
