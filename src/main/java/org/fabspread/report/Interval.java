package org.fabspread.report;

/**
 * An estimate with the bounds of its confidence interval, for example a yield of 0.873 with a 95 %
 * interval 0.851–0.892. The bounds enclose the estimate.
 */
public record Interval(double estimate, double low, double high) {

    public Interval {
        if (!Double.isFinite(estimate) || !Double.isFinite(low) || !Double.isFinite(high)) {
            throw new IllegalArgumentException("interval values must be finite: " + estimate + " (" + low + ", " + high + ")");
        }
        if (low > estimate || estimate > high) {
            throw new IllegalArgumentException("interval bounds must enclose the estimate: " + estimate
                    + " not within (" + low + ", " + high + ")");
        }
    }
}
