package org.fabspread.study;

/** Short human-readable descriptions of distributions, in a parameter's unit (for tables and reports). */
public final class Describe {

    private Describe() {
    }

    /** The quantity whose canonical unit is {@code unit} ("nm", "fraction", "1", ...). */
    public static Units.Quantity quantity(String unit) {
        for (Units.Quantity q : Units.Quantity.values()) {
            if (q.canonical().equals(unit)) {
                return q;
            }
        }
        throw new IllegalArgumentException("not a canonical unit: " + unit);
    }

    /** E.g. "normal(mean 30 nm, sigma 1 nm)", "fixed 1.1e+06 nm", "measured(25 values from wafers.csv:etl_nm)". */
    public static String distribution(Parameter p) {
        Units.Quantity q = quantity(p.unit());
        DistributionSpec d = p.distribution();
        if (d instanceof DistributionSpec.Fixed f) {
            return "fixed " + q.show(f.value());
        } else if (d instanceof DistributionSpec.Normal n) {
            return "normal(mean " + q.show(n.mean()) + ", sigma " + spread(q, n.sigma()) + ")";
        } else if (d instanceof DistributionSpec.TruncatedNormal t) {
            return "truncated normal(mean " + q.show(t.mean()) + ", sigma " + spread(q, t.sigma()) + ", "
                    + q.show(t.lower()) + " to " + q.show(t.upper()) + ")";
        } else if (d instanceof DistributionSpec.LogNormal l) {
            return "lognormal(median " + q.show(l.median()) + ", cv " + Units.Quantity.FRACTION.show(l.cv()) + ")";
        } else if (d instanceof DistributionSpec.Uniform u) {
            return "uniform(" + q.show(u.lower()) + " to " + q.show(u.upper()) + ")";
        } else if (d instanceof DistributionSpec.Triangular t) {
            return "triangular(" + q.show(t.lower()) + ", mode " + q.show(t.mode()) + ", " + q.show(t.upper()) + ")";
        } else if (d instanceof DistributionSpec.Empirical e) {
            return "measured(" + e.values().length + " values from " + e.source() + (e.smooth() ? ", smoothed)" : ")");
        }
        throw new IllegalArgumentException("unknown distribution " + d);
    }

    private static String spread(Units.Quantity q, double sigma) {
        return q.show(sigma);
    }
}
