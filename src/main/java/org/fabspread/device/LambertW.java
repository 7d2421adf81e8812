package org.fabspread.device;

/**
 * The principal branch W₀ of the Lambert W function (w e^w = x, x ≥ 0), by Halley's iteration
 * (Corless, Gonnet, Hare, Jeffrey &amp; Knuth, Adv. Comput. Math. 5, 329 (1996), §4). The diode model
 * needs W of arguments like e^{700+}, so the log-argument form {@link #ofExp(double)} = W(e^L) works
 * entirely in logs and never forms e^L.
 */
final class LambertW {

    private LambertW() {
    }

    /** W₀(x) for x ≥ 0. */
    public static double w0(double x) {
        if (!(x >= 0)) {
            throw new IllegalArgumentException("W0 is taken here only for x >= 0, got " + x);
        }
        if (x == 0) {
            return 0;
        }
        if (Double.isInfinite(x)) {
            return x;
        }
        return ofExp(Math.log(x));
    }

    /**
     * W₀(e^L) for any real L, without forming e^L. For L ≤ 1 Halley's iteration on w e^w − e^L;
     * for L &gt; 1 on the log form f(w) = w + ln w − L (f' = 1 + 1/w, f'' = −1/w²), started from
     * L − ln L + ln L / L (Corless et al. 1996, eq. 4.19).
     */
    public static double ofExp(double logX) {
        if (Double.isNaN(logX)) {
            return Double.NaN;
        }
        if (logX == Double.POSITIVE_INFINITY) {
            return Double.POSITIVE_INFINITY;
        }
        if (logX < -745) {
            return 0;
        }
        if (logX <= 1) {
            double x = Math.exp(logX);
            // start: series near 0, else log-based
            double w = x < 0.5 ? x * (1 - x) : 0.5 * Math.log1p(x) + 0.2;
            for (int i = 0; i < 50; i++) {
                double ew = Math.exp(w);
                double f = w * ew - x;
                double wp1 = w + 1;
                double denom = ew * wp1 - (w + 2) * f / (2 * wp1);
                double dw = f / denom;
                w -= dw;
                if (Math.abs(dw) <= 4e-16 * Math.max(Math.abs(w), 1e-300)) {
                    break;
                }
            }
            return w;
        }
        double ll = Math.log(logX);
        double w = logX - ll + ll / logX;
        for (int i = 0; i < 50; i++) {
            double f = w + Math.log(w) - logX;
            double fp = 1 + 1 / w;
            double fpp = -1 / (w * w);
            double dw = 2 * f * fp / (2 * fp * fp - f * fpp);
            w -= dw;
            if (Math.abs(dw) <= 4e-16 * w) {
                break;
            }
        }
        return w;
    }
}
