package org.fabspread.sampling;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.Arrays;

import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;

/**
 * Evaluates the rows of a {@link RowBatch}: as an engine's {@link ChunkPlan} (chunk c: its inputs, then its
 * outputs, with the worker's own evaluator) and, for an engine that evaluates elsewhere, the evaluation of
 * given inputs alone ({@link #evaluate(Evaluator, RowInputs, int)}). A model exception marks its row
 * refused; any other exception is a bug and ends the batch.
 */
public final class ModelRows {

    private ModelRows() {
    }

    /** One chunk's inputs and the outputs they gave. */
    public record Done(RowInputs inputs, RowOutputs outputs) {
    }

    /** The batch's chunks as a plan; {@link #batch()} tells an engine which batch it is. */
    public static final class Plan implements ChunkPlan<Evaluator, Done> {
        private final RowBatch batch;

        Plan(RowBatch batch) {
            this.batch = batch;
        }

        public RowBatch batch() {
            return batch;
        }

        @Override
        public long chunkCount() {
            return batch.chunkCount();
        }

        @Override
        public Evaluator newWorker() {
            return batch.model().newEvaluator();
        }

        @Override
        public Done evaluate(Evaluator worker, long chunk) {
            RowInputs in = batch.inputs(chunk);
            return new Done(in, ModelRows.evaluate(worker, in, batch.model().outputs().size()));
        }
    }

    /** The plan of {@code batch}. */
    public static Plan plan(RowBatch batch) {
        return new Plan(batch);
    }

    /**
     * Runs every chunk of {@code batch} on {@code engine} and hands each chunk's inputs and outputs to
     * {@code sink} in chunk order; a failure of the engine's I/O is rethrown unchecked.
     */
    public static void run(Engine engine, RowBatch batch, RowBatch.Sink sink) {
        try {
            engine.runAll(plan(batch), (c, d) -> sink.accept(d.inputs(), d.outputs()));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The outputs of {@code in}'s rows with {@code evaluator}, in row order; {@code outputs} per row. */
    public static RowOutputs evaluate(Evaluator evaluator, RowInputs in, int outputs) {
        int rows = in.rows();
        int w = in.width();
        double[] xi = new double[w];
        double[] out = new double[outputs];
        double[] y = new double[rows * outputs];
        byte[] outcome = new byte[rows];
        String[] refusal = new String[rows];
        boolean groupFailed = false;
        for (int r = 0; r < rows; r++) {
            if (r % in.group() == 0) {
                groupFailed = false;
            }
            int at = r * outputs;
            if (groupFailed) {
                outcome[r] = RowOutputs.SKIPPED;
                Arrays.fill(y, at, at + outputs, Double.NaN);
                continue;
            }
            System.arraycopy(in.x(), r * w, xi, 0, w);
            try {
                evaluator.evaluate(xi, out);
                outcome[r] = RowOutputs.RAN;
                System.arraycopy(out, 0, y, at, outputs);
                for (int m = 0; m < outputs && !groupFailed; m++) {
                    groupFailed = !Double.isFinite(out[m]);
                }
            } catch (ModelException e) {
                outcome[r] = RowOutputs.REFUSED;
                refusal[r] = SamplesCsv.reasonKey(e.reason());
                Arrays.fill(y, at, at + outputs, Double.NaN);
                groupFailed = true;
            }
        }
        return new RowOutputs(in.chunk(), rows, outputs, y, outcome, refusal);
    }

    /** As {@link #evaluate(Evaluator, RowInputs, int)} with a fresh evaluator of {@code model}. */
    public static RowOutputs evaluate(Model model, RowInputs in) {
        return evaluate(model.newEvaluator(), in, model.outputs().size());
    }
}
