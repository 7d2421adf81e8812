package org.fabspread.report;

import java.util.Arrays;
import org.apache.commons.math3.distribution.TDistribution;

/**
 * What the particle layer buys or costs against the same stack without it, from paired samples
 * (each device's J_sc with and without the particles, same inputs): the mean difference with its
 * Student-t confidence interval, mean d ± t(1 − α/2, n − 1) s/√n (Student, Biometrika 6, 1 (1908);
 * the paired-difference interval of any statistics text), and the 5 % and 95 % quantiles of the
 * difference over the devices (type 7, Hyndman &amp; Fan, Am. Stat. 50, 361 (1996)).
 *
 * @param n    pairs with both values finite
 * @param mean mean difference (with − without)
 * @param low  lower bound of the mean's interval
 * @param high upper bound of the mean's interval
 * @param q05  5 % quantile of the difference over the devices
 * @param q95  95 % quantile of the difference over the devices
 */
public record PlanarComparison(int n, double mean, double low, double high, double q05, double q95) {

    /**
     * The comparison of {@code with} against {@code without}, pair by pair; NaN pairs are left out.
     * Refused with fewer than two finite pairs or arrays of different lengths.
     */
    public static PlanarComparison of(double[] with, double[] without, double confidence) {
        if (with.length != without.length) {
            throw new IllegalArgumentException(with.length + " values with the particles, " + without.length
                    + " without");
        }
        if (!(confidence > 0 && confidence < 1)) {
            throw new IllegalArgumentException("confidence must lie in (0, 1), got " + confidence);
        }
        double[] d = new double[with.length];
        int n = 0;
        for (int i = 0; i < with.length; i++) {
            double x = with[i] - without[i];
            if (Double.isFinite(x)) {
                d[n++] = x;
            }
        }
        if (n < 2) {
            throw new IllegalArgumentException("a paired comparison needs two finite pairs, has " + n);
        }
        d = Arrays.copyOf(d, n);
        double sum = 0;
        for (double x : d) {
            sum += x;
        }
        double mean = sum / n;
        double ss = 0;
        for (double x : d) {
            ss += (x - mean) * (x - mean);
        }
        double se = Math.sqrt(ss / (n - 1) / n);
        double t = new TDistribution(null, n - 1).inverseCumulativeProbability(0.5 + confidence / 2);
        Arrays.sort(d);
        return new PlanarComparison(n, mean, mean - t * se, mean + t * se, DistributionCharts.quantileSorted(d, 0.05),
                DistributionCharts.quantileSorted(d, 0.95));
    }

    /** Whether the interval of the mean difference excludes zero. */
    public boolean clear() {
        return low > 0 || high < 0;
    }
}
