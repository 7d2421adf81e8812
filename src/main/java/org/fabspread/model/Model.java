package org.fabspread.model;

import java.util.List;

/**
 * A deterministic function from a vector of uncertain inputs to a vector of outputs.
 *
 * <p>This is the only thing the sampling, analysis and plan layers know about the physics: they
 * see input ids, output definitions and an {@link Evaluator}. The device model implements it; so do
 * the closed-form test functions (Ishigami, Sobol g, linear) used to hold the statistics to
 * published values.
 *
 * <p>Implementations are immutable and thread-safe; per-thread scratch space lives in the
 * evaluators they hand out.
 */
public interface Model {

    /** Stable ids of the inputs, in the order {@link Evaluator#evaluate} reads them. */
    List<String> inputIds();

    /** The outputs, in the order {@link Evaluator#evaluate} writes them. */
    List<OutputDef> outputs();

    /** A new evaluator with its own scratch buffers; one per thread. */
    Evaluator newEvaluator();

    /** Index of an output by id, or -1. */
    default int outputIndex(String id) {
        List<OutputDef> outs = outputs();
        for (int i = 0; i < outs.size(); i++) {
            if (outs.get(i).id().equals(id)) {
                return i;
            }
        }
        return -1;
    }

    /** Index of an input by id, or -1. */
    default int inputIndex(String id) {
        return inputIds().indexOf(id);
    }
}
