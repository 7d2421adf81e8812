package org.fabspread.sampling;

import java.util.Arrays;

import org.apache.commons.math3.distribution.LogNormalDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TriangularDistribution;
import org.apache.commons.math3.distribution.UniformRealDistribution;
import org.apache.commons.math3.special.Erf;
import org.fabspread.study.DistributionSpec;

/**
 * Turns a {@link DistributionSpec} into a {@link Distribution} backed by Commons Math's exact
 * distributions. Truncated normals use the exact inverse CDF on the truncated range
 * (x = μ + σ Φ⁻¹(Φ(a) + p (Φ(b) − Φ(a)))), worked on the tail nearer the mean for accuracy.
 */
public final class Distributions {

    private Distributions() {
    }

    public static Distribution of(DistributionSpec spec) {
        if (spec instanceof DistributionSpec.Fixed f) {
            return new Point(f.value());
        } else if (spec instanceof DistributionSpec.Normal n) {
            return new Wrapped(new NormalDistribution(null, n.mean(), n.sigma()), n.mean());
        } else if (spec instanceof DistributionSpec.TruncatedNormal t) {
            return new TruncatedNormal(t.mean(), t.sigma(), t.lower(), t.upper());
        } else if (spec instanceof DistributionSpec.LogNormal l) {
            double s = Math.sqrt(Math.log1p(l.cv() * l.cv()));
            return new Wrapped(new LogNormalDistribution(null, Math.log(l.median()), s), l.median());
        } else if (spec instanceof DistributionSpec.Uniform u) {
            return new Wrapped(new UniformRealDistribution(null, u.lower(), u.upper()), 0.5 * (u.lower() + u.upper()));
        } else if (spec instanceof DistributionSpec.Triangular t) {
            return new Wrapped(new TriangularDistribution(null, t.lower(), t.mode(), t.upper()), t.mode());
        } else if (spec instanceof DistributionSpec.Empirical e) {
            return new Empirical(e.values(), e.smooth());
        }
        throw new IllegalArgumentException("unknown distribution " + spec);
    }

    /** A fixed value. */
    record Point(double value) implements Distribution {
        @Override public double inverseCdf(double p) { return value; }
        @Override public double cdf(double x) { return x >= value ? 1 : 0; }
        @Override public double density(double x) { return Double.NaN; }
        @Override public double mean() { return value; }
        @Override public double standardDeviation() { return 0; }
        @Override public double nominal() { return value; }
        @Override public double supportLower() { return value; }
        @Override public double supportUpper() { return value; }
    }

    /** A Commons Math distribution. */
    static final class Wrapped implements Distribution {
        private final org.apache.commons.math3.distribution.RealDistribution d;
        private final double nominal;

        Wrapped(org.apache.commons.math3.distribution.RealDistribution d, double nominal) {
            this.d = d;
            this.nominal = nominal;
        }

        @Override public double inverseCdf(double p) { return d.inverseCumulativeProbability(p); }
        @Override public double cdf(double x) { return d.cumulativeProbability(x); }
        @Override public double density(double x) { return d.density(x); }
        @Override public double mean() { return d.getNumericalMean(); }
        @Override public double standardDeviation() { return Math.sqrt(d.getNumericalVariance()); }
        @Override public double nominal() { return nominal; }
        @Override public double supportLower() { return d.getSupportLowerBound(); }
        @Override public double supportUpper() { return d.getSupportUpperBound(); }
    }

    /** Normal(μ, σ) restricted to [a, b], sampled exactly by its inverse CDF. */
    static final class TruncatedNormal implements Distribution {
        private static final NormalDistribution STD = new NormalDistribution(null, 0, 1);
        private final double mu;
        private final double sigma;
        private final double lo;
        private final double hi;
        private final double alpha;
        private final double beta;
        private final boolean upperTail;
        private final double pa;
        private final double pb;
        private final double z;

        TruncatedNormal(double mu, double sigma, double lo, double hi) {
            if (!(sigma > 0) || !(hi > lo)) {
                throw new IllegalArgumentException("truncated normal needs sigma > 0 and lower < upper");
            }
            this.mu = mu;
            this.sigma = sigma;
            this.lo = lo;
            this.hi = hi;
            this.alpha = (lo - mu) / sigma;
            this.beta = (hi - mu) / sigma;
            // work in the tail where the CDF values are small, so no precision is lost to 1 - tiny
            this.upperTail = alpha > 0;
            if (upperTail) {
                this.pa = upper(alpha);
                this.pb = upper(beta);
                this.z = pa - pb;
            } else {
                this.pa = lower(alpha);
                this.pb = lower(beta);
                this.z = pb - pa;
            }
            if (!(z > 0)) {
                throw new IllegalArgumentException("truncation keeps no probability");
            }
        }

        private static double lower(double x) {
            return x == Double.NEGATIVE_INFINITY ? 0 : 0.5 * Erf.erfc(-x / Math.sqrt(2));
        }

        private static double upper(double x) {
            return x == Double.POSITIVE_INFINITY ? 0 : 0.5 * Erf.erfc(x / Math.sqrt(2));
        }

        @Override public double inverseCdf(double p) {
            double zz;
            if (upperTail) {
                double q = pa - p * z;
                zz = -STD.inverseCumulativeProbability(q);
            } else {
                zz = STD.inverseCumulativeProbability(pa + p * z);
            }
            double x = mu + sigma * zz;
            return Math.min(hi, Math.max(lo, x));
        }

        @Override public double cdf(double x) {
            if (x <= lo) {
                return 0;
            }
            if (x >= hi) {
                return 1;
            }
            double t = (x - mu) / sigma;
            return upperTail ? (pa - upper(t)) / z : (lower(t) - pa) / z;
        }

        @Override public double density(double x) {
            if (x < lo || x > hi) {
                return 0;
            }
            double t = (x - mu) / sigma;
            return Math.exp(-0.5 * t * t) / (Math.sqrt(2 * Math.PI) * sigma * z);
        }

        private double phi(double t) {
            return Double.isInfinite(t) ? 0 : Math.exp(-0.5 * t * t) / Math.sqrt(2 * Math.PI);
        }

        @Override public double mean() {
            return mu + sigma * (phi(alpha) - phi(beta)) / z;
        }

        @Override public double standardDeviation() {
            double a = Double.isInfinite(alpha) ? 0 : alpha * phi(alpha);
            double b = Double.isInfinite(beta) ? 0 : beta * phi(beta);
            double r = (phi(alpha) - phi(beta)) / z;
            return sigma * Math.sqrt(1 + (a - b) / z - r * r);
        }

        @Override public double nominal() { return Math.min(hi, Math.max(lo, mu)); }
        @Override public double supportLower() { return lo; }
        @Override public double supportUpper() { return hi; }
        @Override public double truncatedMass() { return 1 - z; }
    }

    /**
     * Measured values. Raw: inverse of the empirical CDF with linear interpolation between order
     * statistics (Hyndman &amp; Fan definition 7). Smoothed: Gaussian kernel with Silverman's bandwidth
     * 0.9 min(s, IQR/1.34) n^(-1/5), inverted by bisection.
     */
    static final class Empirical implements Distribution {
        private final double[] sorted;
        private final boolean smooth;
        private final double h;
        private final double mean;
        private final double sd;

        Empirical(double[] values, boolean smooth) {
            if (values.length < 2) {
                throw new IllegalArgumentException("measured values need at least 2 points");
            }
            this.sorted = values.clone();
            Arrays.sort(sorted);
            this.smooth = smooth;
            double m = 0;
            for (double v : sorted) {
                m += v;
            }
            m /= sorted.length;
            double s2 = 0;
            for (double v : sorted) {
                s2 += (v - m) * (v - m);
            }
            this.mean = m;
            double s = Math.sqrt(s2 / (sorted.length - 1));
            double iqr = quantile7(0.75) - quantile7(0.25);
            double spread = iqr > 0 ? Math.min(s, iqr / 1.34) : s;
            this.h = 0.9 * spread * Math.pow(sorted.length, -0.2);
            this.sd = smooth ? Math.sqrt(s2 / sorted.length + h * h) : Math.sqrt(s2 / sorted.length);
        }

        private double quantile7(double p) {
            double pos = p * (sorted.length - 1);
            int i = (int) Math.floor(pos);
            if (i >= sorted.length - 1) {
                return sorted[sorted.length - 1];
            }
            double f = pos - i;
            return sorted[i] + f * (sorted[i + 1] - sorted[i]);
        }

        @Override public double inverseCdf(double p) {
            if (!smooth) {
                return quantile7(p);
            }
            double a = sorted[0] - 10 * h;
            double b = sorted[sorted.length - 1] + 10 * h;
            for (int it = 0; it < 200 && b - a > 1e-12 * Math.max(1, Math.abs(a)); it++) {
                double c = 0.5 * (a + b);
                if (cdf(c) < p) {
                    a = c;
                } else {
                    b = c;
                }
            }
            return 0.5 * (a + b);
        }

        @Override public double cdf(double x) {
            if (smooth) {
                double s = 0;
                for (double v : sorted) {
                    s += 0.5 * Erf.erfc(-(x - v) / (h * Math.sqrt(2)));
                }
                return s / sorted.length;
            }
            if (x < sorted[0]) {
                return 0;
            }
            if (x >= sorted[sorted.length - 1]) {
                return 1;
            }
            int i = Arrays.binarySearch(sorted, x);
            if (i < 0) {
                i = -i - 2;
            }
            while (i + 1 < sorted.length && sorted[i + 1] <= x) {
                i++;
            }
            double f = sorted[i + 1] > sorted[i] ? (x - sorted[i]) / (sorted[i + 1] - sorted[i]) : 0;
            return (i + f) / (sorted.length - 1);
        }

        @Override public double density(double x) {
            if (!smooth) {
                return Double.NaN;
            }
            double s = 0;
            for (double v : sorted) {
                double t = (x - v) / h;
                s += Math.exp(-0.5 * t * t);
            }
            return s / (sorted.length * h * Math.sqrt(2 * Math.PI));
        }

        @Override public double mean() { return mean; }
        @Override public double standardDeviation() { return sd; }
        @Override public double nominal() { return mean; }
        @Override public double supportLower() { return smooth ? Double.NEGATIVE_INFINITY : sorted[0]; }
        @Override public double supportUpper() { return smooth ? Double.POSITIVE_INFINITY : sorted[sorted.length - 1]; }
    }
}
