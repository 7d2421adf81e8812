package org.fabspread.plan;

import java.util.function.Function;

/**
 * Profile-likelihood limits of each fitted input inside its physical range (Bates &amp; Watts,
 * Nonlinear Regression Analysis and Its Applications, 1988, §6.1): the limits are where the profile
 * sum of squares S_j(t) — input j held at t, the others refitted within their ranges — rises by
 * {@code rise} = s² t²_{ν} above the minimum. Each side is bracketed by steps that double from the
 * standard error outwards, then found by bisection; a side whose bracket reaches the range's end
 * without the rise ends there and is flagged.
 */
final class ProfileInterval {

    /** Bisection steps per limit (the bracket shrinks by 2^-50). */
    static final int BISECTIONS = 50;
    /** Doubling steps allowed before a side counts as unbounded. */
    static final int MAX_STEPS = 60;

    record Bounds(double[] lower, double[] upper, boolean[] lowerAtLimit, boolean[] upperAtLimit) {
    }

    private ProfileInterval() {
    }

    static Bounds of(Function<double[], double[]> f, double[] y, double[] est, double rss, double rise, double[] se,
                     double[] scale, double[] lo, double[] hi) {
        int q = est.length;
        double[] lower = new double[q];
        double[] upper = new double[q];
        boolean[] lowAt = new boolean[q];
        boolean[] highAt = new boolean[q];
        for (int j = 0; j < q; j++) {
            int jj = j;
            Function<Double, Double> profile = t -> profileRss(f, y, est, jj, t, lo, hi);
            double step = Double.isFinite(se[j]) && se[j] > 0 ? se[j] : Math.abs(scale[j]) > 0 ? Math.abs(scale[j]) : 1;
            double threshold = rss + rise;
            double[] up = side(profile, est[j], step, hi[j], threshold);
            double[] dn = side(profile, est[j], -step, lo[j], threshold);
            upper[j] = up[0];
            highAt[j] = up[1] > 0;
            lower[j] = dn[0];
            lowAt[j] = dn[1] > 0;
        }
        return new Bounds(lower, upper, lowAt, highAt);
    }

    /** {limit, 1 if the limit is the range's end else 0}. */
    private static double[] side(Function<Double, Double> profile, double est, double step, double end,
                                 double threshold) {
        if (!(threshold > profile.apply(est)) || step == 0) {
            return new double[] {est, 0};
        }
        double inside = est;
        double d = step;
        for (int s = 0; s < MAX_STEPS; s++) {
            double t = step > 0 ? Math.min(inside + d, end) : Math.max(inside + d, end);
            if (profile.apply(t) > threshold) {
                double a = inside;
                double b = t;
                for (int i = 0; i < BISECTIONS && Math.abs(b - a) > 1e-12 * Math.max(1, Math.abs(est)); i++) {
                    double m = 0.5 * (a + b);
                    if (profile.apply(m) > threshold) {
                        b = m;
                    } else {
                        a = m;
                    }
                }
                return new double[] {0.5 * (a + b), 0};
            }
            if (t == end) {
                return new double[] {end, 1};
            }
            inside = t;
            d *= 2;
        }
        return new double[] {step > 0 ? Double.POSITIVE_INFINITY : Double.NEGATIVE_INFINITY, 1};
    }

    /** S_j(t): input j at t, the others refitted within their ranges. */
    static double profileRss(Function<double[], double[]> f, double[] y, double[] est, int j, double t, double[] lo,
                             double[] hi) {
        int q = est.length;
        if (q == 1) {
            return rss(f.apply(new double[] {t}), y);
        }
        double[] start = new double[q - 1];
        double[] l = new double[q - 1];
        double[] h = new double[q - 1];
        int[] map = new int[q - 1];
        for (int i = 0, c = 0; i < q; i++) {
            if (i != j) {
                map[c] = i;
                start[c] = est[i];
                l[c] = lo[i];
                h[c] = hi[i];
                c++;
            }
        }
        Function<double[], double[]> g = others -> {
            double[] theta = new double[q];
            theta[j] = t;
            for (int c = 0; c < map.length; c++) {
                theta[map[c]] = others[c];
            }
            return f.apply(theta);
        };
        return BoundedFit.fit(g, y, start, l, h).rss();
    }

    static double rss(double[] v, double[] y) {
        double s = 0;
        for (int r = 0; r < y.length; r++) {
            s += (y[r] - v[r]) * (y[r] - v[r]);
        }
        return s;
    }
}
