package org.fabspread.analysis;

import java.util.Arrays;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.fabspread.sampling.Interval;
import org.fabspread.sampling.StandardNormal;

/** Small numerical helpers shared by the analyses. */
final class Stats {

    private static final NormalDistribution STD_NORMAL = new NormalDistribution(null, 0, 1);

    private Stats() {
    }

    /**
     * Standard normal quantile with full relative precision in both tails (Commons Math's form through
     * erf⁻¹(2p − 1) reaches −∞ near p = 1e-16, which turned far-tail samples' copula weights into NaN).
     */
    static double normalQuantile(double p) {
        return StandardNormal.quantile(p);
    }

    static double normalCdf(double x) {
        return STD_NORMAL.cumulativeProbability(x);
    }

    /** Two-sided standard normal multiplier for a confidence level, e.g. 1.96 for 0.95. */
    static double zFor(double confidence) {
        return normalQuantile(0.5 + 0.5 * confidence);
    }

    /** Two-sided Student t multiplier with {@code df} degrees of freedom. */
    static double tFor(double confidence, double df) {
        return new TDistribution(null, df).inverseCumulativeProbability(0.5 + 0.5 * confidence);
    }

    /** Quantile of an already sorted array, linear interpolation between order statistics (Hyndman and Fan, type 7). */
    static double quantileSorted(double[] sorted, double p) {
        int n = sorted.length;
        if (n == 0) {
            return Double.NaN;
        }
        double pos = p * (n - 1);
        int i = (int) Math.floor(pos);
        if (i >= n - 1) {
            return sorted[n - 1];
        }
        if (i < 0) {
            return sorted[0];
        }
        double f = pos - i;
        return sorted[i] + f * (sorted[i + 1] - sorted[i]);
    }

    /** Percentile interval of a sample of estimates (sorted in place); NaN values are dropped. */
    static Interval percentile(double[] values, double confidence) {
        double[] v = Arrays.stream(values).filter(Double::isFinite).toArray();
        if (v.length < 2) {
            return Interval.none();
        }
        Arrays.sort(v);
        double a = 0.5 * (1 - confidence);
        return new Interval(quantileSorted(v, a), quantileSorted(v, 1 - a));
    }

    /** A mean with its interval. */
    record MeanInterval(double mean, Interval interval) {
    }

    /** Mean and a t interval over independent replicate estimates. */
    static MeanInterval tInterval(double[] values, double confidence) {
        int r = values.length;
        double m = 0;
        for (double v : values) {
            m += v;
        }
        m /= r;
        if (r < 2) {
            return new MeanInterval(m, Interval.none());
        }
        double s2 = 0;
        for (double v : values) {
            s2 += (v - m) * (v - m);
        }
        double se = Math.sqrt(s2 / (r - 1) / r);
        double t = tFor(confidence, r - 1);
        return new MeanInterval(m, new Interval(m - t * se, m + t * se));
    }

    /** Ranks 1..n with ties given their average rank. */
    static double[] ranks(double[] x) {
        int n = x.length;
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(x[a], x[b]));
        double[] r = new double[n];
        int i = 0;
        while (i < n) {
            int j = i;
            while (j + 1 < n && x[order[j + 1]] == x[order[i]]) {
                j++;
            }
            double avg = 0.5 * (i + j) + 1;
            for (int t = i; t <= j; t++) {
                r[order[t]] = avg;
            }
            i = j + 1;
        }
        return r;
    }

    static double mean(double[] x) {
        double s = 0;
        for (double v : x) {
            s += v;
        }
        return s / x.length;
    }

    /** Sample variance with divisor n - 1. */
    static double variance(double[] x) {
        double m = mean(x);
        double s = 0;
        for (double v : x) {
            s += (v - m) * (v - m);
        }
        return s / (x.length - 1);
    }
}
