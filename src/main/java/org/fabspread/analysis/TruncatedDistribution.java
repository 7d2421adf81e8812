package org.fabspread.analysis;

import org.fabspread.sampling.Distribution;

/**
 * A distribution restricted to [lo, hi] and renormalised: density p(x)/(F(hi) − F(lo)) inside, sampled
 * exactly by F⁻¹(F(lo) + u (F(hi) − F(lo))). Mean and standard deviation by a midpoint rule over
 * 4096 quantiles. Used for "truncate at ± k σ" what-ifs of inputs that are not normal.
 */
final class TruncatedDistribution implements Distribution {
    private static final int QUANTILES = 4096;
    private final Distribution parent;
    private final double lo;
    private final double hi;
    private final double flo;
    private final double mass;
    private final double mean;
    private final double sd;

    TruncatedDistribution(Distribution parent, double lo, double hi) {
        this.parent = parent;
        this.lo = Math.max(lo, parent.supportLower());
        this.hi = Math.min(hi, parent.supportUpper());
        this.flo = parent.cdf(this.lo);
        this.mass = parent.cdf(this.hi) - flo;
        if (!(mass > 0)) {
            throw new IllegalArgumentException("truncation to [" + lo + ", " + hi + "] keeps no probability");
        }
        double s = 0;
        double s2 = 0;
        for (int t = 0; t < QUANTILES; t++) {
            double x = inverseCdf((t + 0.5) / QUANTILES);
            s += x;
            s2 += x * x;
        }
        this.mean = s / QUANTILES;
        this.sd = Math.sqrt(Math.max(0, s2 / QUANTILES - mean * mean));
    }

    @Override public double inverseCdf(double p) {
        return Math.min(hi, Math.max(lo, parent.inverseCdf(flo + p * mass)));
    }

    @Override public double cdf(double x) {
        if (x <= lo) {
            return 0;
        }
        if (x >= hi) {
            return 1;
        }
        return (parent.cdf(x) - flo) / mass;
    }

    @Override public double density(double x) {
        return x < lo || x > hi ? 0 : parent.density(x) / mass;
    }

    @Override public double mean() { return mean; }
    @Override public double standardDeviation() { return sd; }
    @Override public double nominal() { return Math.min(hi, Math.max(lo, parent.nominal())); }
    @Override public double supportLower() { return lo; }
    @Override public double supportUpper() { return hi; }
    @Override public double truncatedMass() { return 1 - mass * (1 - parent.truncatedMass()); }
}
