package org.fabspread.analysis;

import java.util.Arrays;

/**
 * Generalised Pareto distribution of excesses over a threshold, F(y) = 1 − (1 + ξ y/σ)^(−1/ξ) for y ≥ 0
 * (F(y) = 1 − exp(−y/σ) at ξ = 0; bounded above by −σ/ξ when ξ &lt; 0). By the Pickands–Balkema–de Haan
 * theorem (Pickands, Ann. Stat. 3, 119 (1975); Balkema &amp; de Haan, Ann. Prob. 2, 792 (1974)) it is the
 * limit law of excesses over a high threshold.
 *
 * @param shape ξ
 * @param scale σ &gt; 0
 */
public record GeneralizedPareto(double shape, double scale) {

    /** |ξ| below which the exponential limit is used, to avoid cancellation. */
    private static final double NEAR_ZERO = 1e-9;

    public GeneralizedPareto {
        if (!(scale > 0) || !Double.isFinite(shape)) {
            throw new IllegalArgumentException("generalised Pareto needs scale > 0 and a finite shape, got scale "
                    + scale + ", shape " + shape);
        }
    }

    /** P(Y &gt; y). */
    public double survival(double y) {
        if (y <= 0) {
            return 1;
        }
        double t = shape * y / scale;
        if (Math.abs(shape) < NEAR_ZERO) {
            return Math.exp(-y / scale);
        }
        if (1 + t <= 0) {
            return 0;
        }
        return Math.exp(-Math.log1p(t) / shape);
    }

    /** y with P(Y ≤ y) = p, p in [0, 1). */
    public double inverseCdf(double p) {
        double l = Math.log1p(-p);
        if (Math.abs(shape) < NEAR_ZERO) {
            return -scale * l;
        }
        return scale * Math.expm1(-shape * l) / shape;
    }

    /** The upper end of the support: −σ/ξ for ξ &lt; 0, +∞ otherwise. */
    public double upperEnd() {
        return shape < 0 ? -scale / shape : Double.POSITIVE_INFINITY;
    }

    /**
     * Probability-weighted-moment fit (Hosking &amp; Wallis, Technometrics 29, 339 (1987)). With
     * a_s = E[Y (1 − F(Y))^s], the GPD has a_0 = σ/(1 − ξ) and a_1 = σ/(2 (2 − ξ)), hence
     * k = −ξ = a_0/(a_0 − 2a_1) − 2 and σ = 2 a_0 a_1/(a_0 − 2a_1). The unbiased estimators are
     * a_0 = mean and a_1 = (1/n) Σ (n − i)/(n − 1) y_(i) over the ascending order statistics.
     * Defined for ξ &lt; 1; recommended by the authors for ξ &lt; 1/2.
     *
     * @param excesses values above the threshold minus the threshold, all ≥ 0; not modified
     * @throws IllegalArgumentException with fewer than 3 excesses, a negative one, or no spread
     */
    public static GeneralizedPareto fitPwm(double[] excesses) {
        int n = excesses.length;
        if (n < 3) {
            throw new IllegalArgumentException("a generalised Pareto fit needs at least 3 excesses, got " + n);
        }
        double[] y = excesses.clone();
        Arrays.sort(y);
        if (y[0] < 0) {
            throw new IllegalArgumentException("excesses must be >= 0, got " + y[0]);
        }
        double a0 = 0;
        double a1 = 0;
        for (int i = 0; i < n; i++) {
            a0 += y[i];
            a1 += y[i] * (n - 1 - i);
        }
        a0 /= n;
        a1 /= (double) n * (n - 1);
        double den = a0 - 2 * a1;
        if (!(a0 > 0) || !(den > 0)) {
            throw new IllegalArgumentException("excesses have no spread to fit a generalised Pareto to");
        }
        double k = a0 / den - 2;
        double sigma = 2 * a0 * a1 / den;
        return new GeneralizedPareto(-k, sigma);
    }
}
