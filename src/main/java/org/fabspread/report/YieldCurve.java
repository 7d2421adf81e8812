package org.fabspread.report;

import java.util.Arrays;
import org.fabspread.sampling.Interval;
import org.fabspread.sampling.Intervals;

/**
 * The yield as a function of the target value: at each threshold t, the share of the finite samples
 * that meet it ({@code x ≥ t} for a lower bound, {@code x ≤ t} for an upper one), with the Wilson
 * score interval of that share (Wilson, J. Am. Stat. Assoc. 22, 209 (1927)), pointwise.
 *
 * @param threshold the thresholds, increasing
 * @param yield     share meeting each threshold
 * @param low       lower Wilson bound at each threshold
 * @param high      upper Wilson bound at each threshold
 * @param n         finite samples counted
 */
public record YieldCurve(double[] threshold, double[] yield, double[] low, double[] high, int n) {

    /** Thresholds drawn between the 1 % and 99 % quantiles of the samples. */
    public static final int POINTS = 121;

    /**
     * The curve over {@link #POINTS} thresholds spanning the samples' 1 % to 99 % quantiles, widened to
     * include {@code target}.
     */
    public static YieldCurve of(double[] values, boolean atLeast, double target, double confidence) {
        double[] v = Arrays.stream(values).filter(Double::isFinite).sorted().toArray();
        if (v.length < 2) {
            throw new IllegalArgumentException("a yield curve needs two finite samples, has " + v.length);
        }
        double lo = Math.min(DistributionCharts.quantileSorted(v, 0.01), target);
        double hi = Math.max(DistributionCharts.quantileSorted(v, 0.99), target);
        if (!(hi > lo)) {
            hi = lo + Math.max(Math.abs(lo) * 1e-3, 1e-9);
        }
        double[] t = new double[POINTS];
        for (int i = 0; i < POINTS; i++) {
            t[i] = lo + (hi - lo) * i / (POINTS - 1);
        }
        return at(v, atLeast, t, confidence);
    }

    /** The curve at the given increasing thresholds over sorted finite samples. */
    static YieldCurve at(double[] sorted, boolean atLeast, double[] thresholds, double confidence) {
        int n = sorted.length;
        int m = thresholds.length;
        double[] y = new double[m];
        double[] l = new double[m];
        double[] h = new double[m];
        for (int i = 0; i < m; i++) {
            long met = atLeast ? n - lowerBound(sorted, thresholds[i]) : upperBound(sorted, thresholds[i]);
            Interval w = Intervals.wilson(met, n, confidence);
            y[i] = (double) met / n;
            l[i] = w.low();
            h[i] = w.high();
        }
        return new YieldCurve(thresholds.clone(), y, l, h, n);
    }

    /** The first index whose value is ≥ t. */
    private static int lowerBound(double[] a, double t) {
        int lo = 0;
        int hi = a.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] < t) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** The number of values ≤ t. */
    private static int upperBound(double[] a, double t) {
        int lo = 0;
        int hi = a.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] <= t) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
