package org.fabspread.sampling;

import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.BinomialDistribution;

/**
 * Confidence intervals for proportions and quantiles: the program's one home of the binomial intervals
 * (Wilson's score interval and the Clopper–Pearson exact interval) and of the order-statistic interval.
 */
public final class Intervals {

    private Intervals() {
    }

    /** z such that P(|Z| ≤ z) = confidence. */
    public static double z(double confidence) {
        if (!(confidence > 0 && confidence < 1)) {
            throw new IllegalArgumentException("confidence must lie in (0, 1), got " + confidence);
        }
        return StandardNormal.upperQuantile(0.5 * (1 - confidence));
    }

    /**
     * Wilson score interval for x successes in n trials (Wilson, JASA 22, 209 (1927)):
     * [p̂ + z²/2n ± z √(p̂(1 − p̂)/n + z²/4n²)] / (1 + z²/n); [0, 1] for n = 0.
     */
    public static Interval wilson(long x, long n, double confidence) {
        checkCounts(x, n);
        if (n == 0) {
            return new Interval(0, 1);
        }
        double z = z(confidence);
        double p = (double) x / n;
        double z2 = z * z;
        double centre = p + z2 / (2.0 * n);
        double half = z * Math.sqrt(p * (1 - p) / n + z2 / (4.0 * n * n));
        double d = 1 + z2 / n;
        return new Interval(Math.max(0, (centre - half) / d), Math.min(1, (centre + half) / d));
    }

    /**
     * Clopper–Pearson exact interval (Biometrika 26, 404 (1934)): lower Beta⁻¹(α/2; x, n − x + 1), 0 when
     * x = 0; upper Beta⁻¹(1 − α/2; x + 1, n − x), 1 when x = n; [0, 1] for n = 0.
     */
    public static Interval clopperPearson(long x, long n, double confidence) {
        checkCounts(x, n);
        if (!(confidence > 0 && confidence < 1)) {
            throw new IllegalArgumentException("confidence must lie in (0, 1), got " + confidence);
        }
        if (n == 0) {
            return new Interval(0, 1);
        }
        double a = 1 - confidence;
        double lo = x == 0 ? 0 : new BetaDistribution(null, x, n - x + 1.0).inverseCumulativeProbability(a / 2);
        double hi = x == n ? 1 : new BetaDistribution(null, x + 1.0, n - x).inverseCumulativeProbability(1 - a / 2);
        return new Interval(lo, hi);
    }

    /**
     * Interval for the difference p₁ − p₀ of two independent proportions x₁/n₁ and x₀/n₀ by Newcombe's
     * hybrid score method (Newcombe, Stat. Med. 17, 873 (1998), method 10), from the two Wilson intervals
     * (l₁, u₁) and (l₀, u₀): [D − √((p₁ − l₁)² + (u₀ − p₀)²), D + √((u₁ − p₁)² + (p₀ − l₀)²)].
     */
    public static Interval newcombeDifference(long x1, long n1, long x0, long n0, double confidence) {
        if (n1 == 0 || n0 == 0) {
            return new Interval(-1, 1);
        }
        Interval a = wilson(x1, n1, confidence);
        Interval b = wilson(x0, n0, confidence);
        double p1 = (double) x1 / n1;
        double p0 = (double) x0 / n0;
        double d = p1 - p0;
        return new Interval(d - Math.hypot(p1 - a.low(), b.high() - p0), d + Math.hypot(a.high() - p1, p0 - b.low()));
    }

    private static void checkCounts(long x, long n) {
        if (n < 0 || x < 0 || x > n) {
            throw new IllegalArgumentException("need 0 <= x <= n, got x = " + x + ", n = " + n);
        }
    }

    /**
     * Distribution-free interval for the p-quantile from order statistics: with B ~ Bin(n, p),
     * r = the smallest k with P(B ≤ k) ≥ α/2 and s = 1 + the smallest k with P(B ≤ k) ≥ 1 − α/2, the
     * interval [X₍ᵣ₎, X₍ₛ₎] covers the quantile with probability P(r ≤ B ≤ s − 1) ≥ 1 − α for any
     * continuous distribution (Conover, Practical Nonparametric Statistics, 3rd ed. (1999), sec. 3.2;
     * David &amp; Nagaraja, Order Statistics (2003), sec. 7.1). Returns 1-based ranks {r, s}; r = 0
     * means no lower bound exists at this n, s = n + 1 no upper bound.
     */
    public static long[] quantileRanks(long n, double p, double confidence) {
        if (n < 1 || n > Integer.MAX_VALUE) {
            throw new IllegalArgumentException("sample size out of range: " + n);
        }
        double alpha = 1 - confidence;
        BinomialDistribution b = new BinomialDistribution(null, (int) n, p);
        long r = b.inverseCumulativeProbability(alpha / 2);
        long s = b.inverseCumulativeProbability(1 - alpha / 2) + 1L;
        if (b.cumulativeProbability((int) r - 1) > alpha / 2) {
            r = 0;
        }
        return new long[] {r, Math.min(s, n + 1)};
    }

    /** Quantile of sorted data by linear interpolation between order statistics (Hyndman &amp; Fan type 7). */
    public static double quantile7(double[] sorted, int n, double p) {
        double pos = p * (n - 1);
        int i = (int) Math.floor(pos);
        if (i >= n - 1) {
            return sorted[n - 1];
        }
        return sorted[i] + (pos - i) * (sorted[i + 1] - sorted[i]);
    }
}
