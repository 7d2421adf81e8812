package org.fabspread.sampling;

import org.apache.commons.math3.special.Erf;

/**
 * The standard normal distribution with full relative accuracy in both tails: Φ and its complement
 * through the complementary error function (Φ(z) = erfc(−z/√2)/2, never 1 − tiny), and Φ⁻¹ that
 * stays accurate down to p ≈ 1e−300.
 *
 * <p>Quantile: in the central region 0.02 ≤ p ≤ 0.98, Φ⁻¹(p) = √2 erf⁻¹(2p − 1) (Giles' erf⁻¹ in
 * Commons Math). In the tails, 2p − 1 loses p's relative precision, so the tail is solved directly:
 * a start from Abramowitz &amp; Stegun 26.2.23 (error below 4.5e−4) refined by Newton steps on
 * ln Φ(z) − ln p, which converge quadratically to full precision in two or three steps.
 */
public final class StandardNormal {

    /** The smallest probability handed to a quantile function: 2^-53 (and 1 − 2^-53 at the top). */
    public static final double P_MIN = 0x1.0p-53;
    /** The largest double below 1. */
    public static final double P_MAX = 1.0 - 0x1.0p-53;

    private static final double SQRT2 = Math.sqrt(2.0);
    private static final double INV_SQRT_2PI = 1.0 / Math.sqrt(2.0 * Math.PI);
    private static final double CENTRAL = 0.02;

    private StandardNormal() {
    }

    /** Clamps a probability into [2^-53, 1 − 2^-53] so no inverse CDF ever sees exactly 0 or 1. */
    public static double clamp(double p) {
        return p < P_MIN ? P_MIN : (p > P_MAX ? P_MAX : p);
    }

    /** Density φ(z). */
    public static double density(double z) {
        return Double.isInfinite(z) ? 0.0 : INV_SQRT_2PI * Math.exp(-0.5 * z * z);
    }

    /** Φ(z) = P(Z ≤ z), relatively accurate for z → −∞. */
    public static double cdf(double z) {
        if (z == Double.NEGATIVE_INFINITY) {
            return 0.0;
        }
        if (z == Double.POSITIVE_INFINITY) {
            return 1.0;
        }
        return 0.5 * Erf.erfc(-z / SQRT2);
    }

    /** 1 − Φ(z) = P(Z &gt; z), relatively accurate for z → +∞. */
    public static double upperCdf(double z) {
        return cdf(-z);
    }

    /** Φ⁻¹(p) for 0 &lt; p &lt; 1; ±∞ at 0 and 1. */
    public static double quantile(double p) {
        if (!(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException("probability out of [0, 1]: " + p);
        }
        if (p == 0) {
            return Double.NEGATIVE_INFINITY;
        }
        if (p == 1) {
            return Double.POSITIVE_INFINITY;
        }
        if (p >= CENTRAL && p <= 1 - CENTRAL) {
            return SQRT2 * Erf.erfInv(2.0 * p - 1.0);
        }
        return p < 0.5 ? lowerTail(p) : -lowerTail(1.0 - p);
    }

    /** Φ⁻¹(1 − q) computed from the upper-tail probability q without forming 1 − q. */
    public static double upperQuantile(double q) {
        return -quantile(q);
    }

    /** Solves Φ(z) = p for small p. */
    private static double lowerTail(double p) {
        double lnp = Math.log(p);
        double t = Math.sqrt(-2.0 * lnp);
        // source: Abramowitz & Stegun, Handbook of Mathematical Functions (1964), 26.2.23
        double z = -(t - (2.515517 + t * (0.802853 + t * 0.010328))
                / (1.0 + t * (1.432788 + t * (0.189269 + t * 0.001308))));
        for (int it = 0; it < 8; it++) {
            double c = cdf(z);
            double step = (Math.log(c) - lnp) * c / density(z);
            z -= step;
            if (Math.abs(step) <= 1e-15 * Math.abs(z)) {
                break;
            }
        }
        return z;
    }
}
