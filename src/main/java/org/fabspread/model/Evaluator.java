package org.fabspread.model;

/**
 * Evaluates a {@link Model} at one point. Not thread-safe: each thread takes its own from
 * {@link Model#newEvaluator()}. Implementations must not allocate per call in their hot loops.
 */
@FunctionalInterface
public interface Evaluator {

    /**
     * Evaluates the model.
     *
     * @param inputs  values of the uncertain inputs, in {@link Model#inputIds()} order, canonical units
     * @param outputs filled with the outputs, in {@link Model#outputs()} order
     * @throws ModelException when the point is outside the model's domain (a negative thickness,
     *                        a wavelength outside a table, a NaN); the runner counts and reports it
     */
    void evaluate(double[] inputs, double[] outputs);
}
