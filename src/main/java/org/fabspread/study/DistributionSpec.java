package org.fabspread.study;

/**
 * How one number of a study is spread, in the parameter's canonical unit. A fixed value is the
 * degenerate case. The sampling layer turns a spec into a {@code org.fabspread.sampling.Distribution}.
 */
public sealed interface DistributionSpec {

    /** The value used for the nominal (single) evaluation. */
    double nominal();

    /** True when the value is not random. */
    default boolean isFixed() {
        return false;
    }

    /** A fixed number. */
    record Fixed(double value) implements DistributionSpec {
        @Override public double nominal() { return value; }
        @Override public boolean isFixed() { return true; }
    }

    /** Normal with mean and standard deviation (sigma &gt; 0). */
    record Normal(double mean, double sigma) implements DistributionSpec {
        @Override public double nominal() { return mean; }
    }

    /** Normal(mean, sigma) restricted exactly to [lower, upper] (either may be infinite). */
    record TruncatedNormal(double mean, double sigma, double lower, double upper) implements DistributionSpec {
        @Override public double nominal() { return mean; }
    }

    /** Lognormal given by its median and coefficient of variation (sd/mean), sigma_ln = sqrt(ln(1+cv^2)). */
    record LogNormal(double median, double cv) implements DistributionSpec {
        @Override public double nominal() { return median; }
    }

    /** Uniform on [lower, upper]. */
    record Uniform(double lower, double upper) implements DistributionSpec {
        @Override public double nominal() { return 0.5 * (lower + upper); }
    }

    /** Triangular on [lower, upper] with its mode. */
    record Triangular(double lower, double mode, double upper) implements DistributionSpec {
        @Override public double nominal() { return mode; }
    }

    /**
     * Measured values (from a CSV column): sampled by the inverse of their empirical CDF, or, when
     * {@code smooth}, of a Gaussian-kernel smoothed one. {@code source} says file and column.
     */
    record Empirical(double[] values, boolean smooth, String source) implements DistributionSpec {
        public Empirical {
            values = values.clone();
        }
        @Override public double[] values() { return values.clone(); }
        @Override public double nominal() {
            double s = 0;
            for (double v : values) {
                s += v;
            }
            return s / values.length;
        }
        @Override public boolean equals(Object o) {
            return o instanceof Empirical e && java.util.Arrays.equals(values, e.values)
                    && smooth == e.smooth && java.util.Objects.equals(source, e.source);
        }
        @Override public int hashCode() {
            return java.util.Arrays.hashCode(values) * 31 + Boolean.hashCode(smooth);
        }
        @Override public String toString() {
            return "Empirical[" + values.length + " values from " + source + (smooth ? ", smoothed]" : "]");
        }
    }
}
