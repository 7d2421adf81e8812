package org.fabspread.sampling;

import java.io.IOException;

import org.fabspread.model.Model;

/**
 * A batch of model runs whose inputs are drawn by the caller: the Sobol and Shapley designs, what-if re-runs,
 * importance sampling, the plan's noise estimate. Chunk c's input rows are a pure function of the batch and c
 * ({@link #inputs(long)}, computed in the caller's JVM); evaluating them needs nothing but the model, so
 * an engine can evaluate them anywhere the model can be rebuilt and return plain arrays of outputs
 * ({@link RowOutputs}). The caller's sink receives each chunk's inputs and outputs in chunk order
 * ({@link ModelRows#run}), so every sum it takes is taken in row order on any engine.
 */
public interface RowBatch {

    /** What the batch is, for logs and job descriptions ("Sobol design"). */
    String name();

    /** The model the rows are evaluated with. */
    Model model();

    /** Number of chunks. */
    long chunkCount();

    /** Chunk c's input rows; depends on the batch and c only, safe to call from any thread. */
    RowInputs inputs(long chunk);

    /** Receives each chunk's inputs and outputs in chunk order, on the calling thread. */
    @FunctionalInterface
    interface Sink {
        void accept(RowInputs inputs, RowOutputs outputs) throws IOException;
    }
}
