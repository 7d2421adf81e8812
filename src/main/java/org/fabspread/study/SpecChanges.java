package org.fabspread.study;

/**
 * The what-if changes to a spread, as distributions: scaling the spread and shifting the nominal.
 * One definition for the study reader (which checks that the changed spread stays physical) and the
 * what-if analysis (which reweights the samples to it).
 */
public final class SpecChanges {

    private SpecChanges() {
    }

    /**
     * The spread scaled by {@code s} about its nominal: σ of a normal, the log-space σ of a
     * lognormal, the half-widths of a uniform or triangular.
     *
     * @throws IllegalArgumentException for a fixed value or measured values
     */
    public static DistributionSpec scaled(DistributionSpec spec, double s) {
        if (spec instanceof DistributionSpec.Normal n) {
            return new DistributionSpec.Normal(n.mean(), n.sigma() * s);
        } else if (spec instanceof DistributionSpec.TruncatedNormal t) {
            return new DistributionSpec.TruncatedNormal(t.mean(), t.sigma() * s, t.lower(), t.upper());
        } else if (spec instanceof DistributionSpec.LogNormal l) {
            double sl = Math.sqrt(Math.log1p(l.cv() * l.cv())) * s;
            return new DistributionSpec.LogNormal(l.median(), Math.sqrt(Math.expm1(sl * sl)));
        } else if (spec instanceof DistributionSpec.Uniform u) {
            double c = u.nominal();
            double h = 0.5 * (u.upper() - u.lower()) * s;
            return new DistributionSpec.Uniform(c - h, c + h);
        } else if (spec instanceof DistributionSpec.Triangular t) {
            return new DistributionSpec.Triangular(t.mode() - s * (t.mode() - t.lower()), t.mode(),
                    t.mode() + s * (t.upper() - t.mode()));
        }
        throw new IllegalArgumentException("cannot scale " + spec);
    }

    /**
     * The nominal moved by {@code d}: μ of a normal (truncation bounds kept: they are limits of the
     * process), the lognormal median (cv kept), a uniform or triangular as a whole.
     *
     * @throws IllegalArgumentException for a fixed value or measured values
     */
    public static DistributionSpec shifted(DistributionSpec spec, double d) {
        if (spec instanceof DistributionSpec.Normal n) {
            return new DistributionSpec.Normal(n.mean() + d, n.sigma());
        } else if (spec instanceof DistributionSpec.TruncatedNormal t) {
            return new DistributionSpec.TruncatedNormal(t.mean() + d, t.sigma(), t.lower(), t.upper());
        } else if (spec instanceof DistributionSpec.LogNormal l) {
            return new DistributionSpec.LogNormal(l.median() + d, l.cv());
        } else if (spec instanceof DistributionSpec.Uniform u) {
            return new DistributionSpec.Uniform(u.lower() + d, u.upper() + d);
        } else if (spec instanceof DistributionSpec.Triangular t) {
            return new DistributionSpec.Triangular(t.lower() + d, t.mode() + d, t.upper() + d);
        }
        throw new IllegalArgumentException("cannot shift " + spec);
    }
}
