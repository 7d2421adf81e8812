package org.fabspread.sampling;

import java.util.Arrays;

import org.fabspread.study.DistributionSpec;

/**
 * Turns a {@link DistributionSpec} into a {@link Distribution} with closed-form moments and an exact
 * inverse CDF. Every quantile goes through {@link StandardNormal} or an explicit formula, so far
 * tails keep full relative precision (Commons Math's lognormal has no closed-form inverse and
 * falls back to a root finder with an absolute tolerance of 1e−9; its normal inverse loses the
 * relative precision of p below about 1e−3 because it forms 2p − 1).
 *
 * <p>Truncated normals use the exact inverse CDF on the truncated range,
 * x = μ + σ Φ⁻¹(Φ(α) + p (Φ(β) − Φ(α))) with α = (a − μ)/σ, β = (b − μ)/σ, worked in the upper
 * tail (with 1 − Φ) when α &gt; 0 so that a range like [5σ, ∞) keeps its precision; the removed
 * mass Φ(α) + 1 − Φ(β) is computed from the two tails directly.
 */
public final class Distributions {

    private Distributions() {
    }

    public static Distribution of(DistributionSpec spec) {
        if (spec instanceof DistributionSpec.Fixed f) {
            return new Point(f.value());
        } else if (spec instanceof DistributionSpec.Normal n) {
            return new Normal(n.mean(), n.sigma());
        } else if (spec instanceof DistributionSpec.TruncatedNormal t) {
            return new TruncatedNormal(t.mean(), t.sigma(), t.lower(), t.upper());
        } else if (spec instanceof DistributionSpec.LogNormal l) {
            return new LogNormal(l.median(), l.cv());
        } else if (spec instanceof DistributionSpec.Uniform u) {
            return new Uniform(u.lower(), u.upper());
        } else if (spec instanceof DistributionSpec.Triangular t) {
            return new Triangular(t.lower(), t.mode(), t.upper());
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

    /** Normal(μ, σ). */
    record Normal(double mu, double sigma) implements Distribution {
        Normal {
            if (!(sigma > 0) || !Double.isFinite(mu) || !Double.isFinite(sigma)) {
                throw new IllegalArgumentException("normal needs a finite mean and sigma > 0");
            }
        }
        @Override public double inverseCdf(double p) { return mu + sigma * StandardNormal.quantile(p); }
        @Override public double cdf(double x) { return StandardNormal.cdf((x - mu) / sigma); }
        @Override public double density(double x) { return StandardNormal.density((x - mu) / sigma) / sigma; }
        @Override public double mean() { return mu; }
        @Override public double standardDeviation() { return sigma; }
        @Override public double nominal() { return mu; }
        @Override public double supportLower() { return Double.NEGATIVE_INFINITY; }
        @Override public double supportUpper() { return Double.POSITIVE_INFINITY; }
    }

    /**
     * Lognormal with median m and coefficient of variation c: ln X ~ N(ln m, s²) with
     * s² = ln(1 + c²), so mean = m e^{s²/2} and sd = mean · c exactly.
     */
    record LogNormal(double median, double cv) implements Distribution {
        LogNormal {
            if (!(median > 0) || !(cv > 0) || !Double.isFinite(median) || !Double.isFinite(cv)) {
                throw new IllegalArgumentException("lognormal needs median > 0 and cv > 0");
            }
        }
        double shape() { return Math.sqrt(Math.log1p(cv * cv)); }
        @Override public double inverseCdf(double p) { return median * Math.exp(shape() * StandardNormal.quantile(p)); }
        @Override public double cdf(double x) {
            return x <= 0 ? 0 : StandardNormal.cdf(Math.log(x / median) / shape());
        }
        @Override public double density(double x) {
            if (x <= 0) {
                return 0;
            }
            double s = shape();
            return StandardNormal.density(Math.log(x / median) / s) / (x * s);
        }
        @Override public double mean() { return median * Math.sqrt(1 + cv * cv); }
        @Override public double standardDeviation() { return mean() * cv; }
        @Override public double nominal() { return median; }
        @Override public double supportLower() { return 0; }
        @Override public double supportUpper() { return Double.POSITIVE_INFINITY; }
    }

    /** Uniform on [a, b]. */
    record Uniform(double a, double b) implements Distribution {
        Uniform {
            if (!(b > a) || !Double.isFinite(a) || !Double.isFinite(b)) {
                throw new IllegalArgumentException("uniform needs finite lower < upper");
            }
        }
        @Override public double inverseCdf(double p) { return a + p * (b - a); }
        @Override public double cdf(double x) { return x <= a ? 0 : (x >= b ? 1 : (x - a) / (b - a)); }
        @Override public double density(double x) { return x < a || x > b ? 0 : 1 / (b - a); }
        @Override public double mean() { return 0.5 * (a + b); }
        @Override public double standardDeviation() { return (b - a) / Math.sqrt(12); }
        @Override public double nominal() { return 0.5 * (a + b); }
        @Override public double supportLower() { return a; }
        @Override public double supportUpper() { return b; }
    }

    /** Triangular on [a, b] with mode c; closed-form inverse CDF. */
    record Triangular(double a, double c, double b) implements Distribution {
        Triangular {
            if (!(b > a) || c < a || c > b || !Double.isFinite(a) || !Double.isFinite(b)) {
                throw new IllegalArgumentException("triangular needs lower <= mode <= upper, lower < upper");
            }
        }
        @Override public double inverseCdf(double p) {
            double fc = (c - a) / (b - a);
            if (p < fc) {
                return a + Math.sqrt(p * (b - a) * (c - a));
            }
            // b − √((1−p)(b−a)(b−c)) rewritten without the cancellation near x = a when c = a
            return a + (b - a) * ((c - a) + p * (b - c)) / ((b - a) + Math.sqrt((1 - p) * (b - a) * (b - c)));
        }
        @Override public double cdf(double x) {
            if (x <= a) {
                return 0;
            }
            if (x >= b) {
                return 1;
            }
            if (x <= c) {
                return (x - a) * (x - a) / ((b - a) * (c - a));
            }
            // 1 − (b−x)²/((b−a)(b−c)) rewritten without the cancellation near x = a when c = a
            double u = x - a;
            return (u * (2 * (b - a) - u) - (b - a) * (c - a)) / ((b - a) * (b - c));
        }
        @Override public double density(double x) {
            if (x < a || x > b) {
                return 0;
            }
            return x < c ? 2 * (x - a) / ((b - a) * (c - a))
                    : (x > c ? 2 * (b - x) / ((b - a) * (b - c)) : 2 / (b - a));
        }
        @Override public double mean() { return (a + b + c) / 3; }
        @Override public double standardDeviation() {
            return Math.sqrt((a * a + b * b + c * c - a * b - a * c - b * c) / 18);
        }
        @Override public double nominal() { return c; }
        @Override public double supportLower() { return a; }
        @Override public double supportUpper() { return b; }
    }

    /** Normal(μ, σ) restricted to [a, b], sampled exactly by its inverse CDF. */
    static final class TruncatedNormal implements Distribution {
        private final double mu;
        private final double sigma;
        private final double lo;
        private final double hi;
        private final double alpha;
        private final double beta;
        private final boolean upperTail;
        private final double pa;
        private final double z;
        private final double removed;

        TruncatedNormal(double mu, double sigma, double lo, double hi) {
            if (!(sigma > 0) || !(hi > lo) || !Double.isFinite(mu) || !Double.isFinite(sigma)) {
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
                this.pa = StandardNormal.upperCdf(alpha);
                this.z = pa - StandardNormal.upperCdf(beta);
            } else {
                this.pa = StandardNormal.cdf(alpha);
                this.z = StandardNormal.cdf(beta) - pa;
            }
            if (!(z > 0)) {
                throw new IllegalArgumentException("truncation to [" + lo + ", " + hi + "] keeps no probability");
            }
            this.removed = StandardNormal.cdf(alpha) + StandardNormal.upperCdf(beta);
        }

        @Override public double inverseCdf(double p) {
            double zz = upperTail ? StandardNormal.upperQuantile(pa - p * z) : StandardNormal.quantile(pa + p * z);
            double x = mu + sigma * zz;
            // rounding of the last bit only: the quantile lies in [lo, hi] mathematically
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
            return upperTail ? (pa - StandardNormal.upperCdf(t)) / z : (StandardNormal.cdf(t) - pa) / z;
        }

        @Override public double density(double x) {
            if (x < lo || x > hi) {
                return 0;
            }
            return StandardNormal.density((x - mu) / sigma) / (sigma * z);
        }

        @Override public double mean() {
            return mu + sigma * (StandardNormal.density(alpha) - StandardNormal.density(beta)) / z;
        }

        @Override public double standardDeviation() {
            double a = Double.isInfinite(alpha) ? 0 : alpha * StandardNormal.density(alpha);
            double b = Double.isInfinite(beta) ? 0 : beta * StandardNormal.density(beta);
            double r = (StandardNormal.density(alpha) - StandardNormal.density(beta)) / z;
            return sigma * Math.sqrt(1 + (a - b) / z - r * r);
        }

        @Override public double nominal() { return Math.min(hi, Math.max(lo, mu)); }
        @Override public double supportLower() { return lo; }
        @Override public double supportUpper() { return hi; }
        @Override public double truncatedMass() { return removed; }
    }

    /**
     * Measured values. Raw: the inverse of the empirical CDF with linear interpolation between order
     * statistics (Hyndman &amp; Fan, Am. Stat. 50, 361 (1996), definition 7): a mixture of n − 1
     * uniforms on [x₍ᵢ₎, x₍ᵢ₊₁₎] with weight 1/(n − 1) each, whose moments are reported exactly.
     * Smoothed: Gaussian kernel density with Silverman's bandwidth h = 0.9 min(s, IQR/1.34) n^(−1/5)
     * (Silverman, Density Estimation (1986), eq. 3.31), mean = sample mean, variance = (1/n)Σ(x − x̄)² + h²,
     * inverted by safeguarded Newton iteration.
     */
    static final class Empirical implements Distribution {
        private final double[] sorted;
        private final boolean smooth;
        private final double h;
        private final double mean;
        private final double sd;
        private final double sampleMean;

        Empirical(double[] values, boolean smooth) {
            if (values.length < 2) {
                throw new IllegalArgumentException("measured values need at least 2 points");
            }
            this.sorted = values.clone();
            Arrays.sort(sorted);
            if (!Double.isFinite(sorted[0]) || !Double.isFinite(sorted[sorted.length - 1])) {
                throw new IllegalArgumentException("measured values must be finite");
            }
            if (!(sorted[sorted.length - 1] > sorted[0])) {
                throw new IllegalArgumentException("measured values are all equal");
            }
            this.smooth = smooth;
            int n = sorted.length;
            double m = 0;
            for (double v : sorted) {
                m += v;
            }
            m /= n;
            this.sampleMean = m;
            double s2 = 0;
            for (double v : sorted) {
                s2 += (v - m) * (v - m);
            }
            double s = Math.sqrt(s2 / (n - 1));
            double iqr = quantile7(0.75) - quantile7(0.25);
            double spread = iqr > 0 ? Math.min(s, iqr / 1.34) : s;
            this.h = 0.9 * spread * Math.pow(n, -0.2);
            if (smooth) {
                this.mean = m;
                this.sd = Math.sqrt(s2 / n + h * h);
            } else {
                // moments of the piecewise-uniform mixture sampled by quantile7
                double m1 = 0;
                double m2 = 0;
                for (int i = 0; i + 1 < n; i++) {
                    double a = sorted[i] - m;
                    double b = sorted[i + 1] - m;
                    m1 += 0.5 * (a + b);
                    m2 += (a * a + a * b + b * b) / 3;
                }
                m1 /= n - 1;
                m2 /= n - 1;
                this.mean = m + m1;
                this.sd = Math.sqrt(Math.max(0, m2 - m1 * m1));
            }
        }

        double bandwidth() {
            return h;
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
            double a = sorted[0] - 40 * h;
            double b = sorted[sorted.length - 1] + 40 * h;
            double x = Math.min(b, Math.max(a, quantile7(p)));
            for (int it = 0; it < 100; it++) {
                double f = cdf(x) - p;
                if (f < 0) {
                    a = x;
                } else {
                    b = x;
                }
                double d = density(x);
                double next = d > 0 ? x - f / d : Double.NaN;
                if (!(next > a && next < b)) {
                    next = 0.5 * (a + b);
                }
                if (Math.abs(next - x) <= 1e-14 * (Math.abs(x) + h) || b - a <= 1e-14 * (Math.abs(x) + h)) {
                    return next;
                }
                x = next;
            }
            return x;
        }

        @Override public double cdf(double x) {
            if (smooth) {
                double s = 0;
                for (double v : sorted) {
                    s += StandardNormal.cdf((x - v) / h);
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
                s += StandardNormal.density((x - v) / h);
            }
            return s / (sorted.length * h);
        }

        @Override public double mean() { return mean; }
        @Override public double standardDeviation() { return sd; }
        /** The sample mean, as {@link DistributionSpec.Empirical#nominal()}. */
        @Override public double nominal() { return sampleMean; }
        @Override public double supportLower() { return smooth ? Double.NEGATIVE_INFINITY : sorted[0]; }
        @Override public double supportUpper() { return smooth ? Double.POSITIVE_INFINITY : sorted[sorted.length - 1]; }
    }
}
