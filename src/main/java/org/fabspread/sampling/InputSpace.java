package org.fabspread.sampling;

import java.util.List;

/**
 * The joint distribution of a model's uncertain inputs, expressed as a map from the unit hypercube
 * of independent uniforms to input values. Samplers produce the uniforms; this applies the
 * dependence (Gaussian copula, when the study correlates inputs) and the marginal inverse CDFs.
 * Sensitivity indices computed on the uniforms are indices of the independent underlying variables.
 * Immutable and thread-safe.
 */
public interface InputSpace {

    /** Input ids, in model order. */
    List<String> ids();

    /** The marginal distribution of each input, in model order. */
    List<Distribution> marginals();

    default int dimension() {
        return ids().size();
    }

    /** True when a correlation block ties some inputs together. */
    boolean correlated();

    /**
     * Maps independent uniforms {@code u} (each in (0, 1)) to input values {@code x}. Must not
     * allocate; {@code u} is not modified.
     */
    void map(double[] u, double[] x);
}
