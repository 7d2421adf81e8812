package org.fabspread.sampling;

/**
 * A univariate distribution of one input, in the input's canonical unit. Separate from the way it is
 * sampled: samplers produce points of the unit hypercube, and {@link #inverseCdf(double)} maps each
 * coordinate to a value (exactly, also for truncated distributions). Immutable.
 */
public interface Distribution {

    /** Quantile function, p in (0, 1). */
    double inverseCdf(double p);

    double cdf(double x);

    /** Probability density; {@code Double.NaN} when the distribution has none (raw empirical data). */
    double density(double x);

    double mean();

    double standardDeviation();

    /** The value used for the nominal evaluation. */
    double nominal();

    double supportLower();

    double supportUpper();

    /** Probability mass that truncation removed from the parent distribution (0 when untruncated). */
    default double truncatedMass() {
        return 0.0;
    }
}
