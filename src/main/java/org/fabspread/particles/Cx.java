package org.fabspread.particles;

/**
 * Allocation-free complex helpers on (re, im) pairs; results go to {@code out[0]} (real) and
 * {@code out[1]} (imaginary). {@code out} may be any array of length ≥ 2; inputs are read before it is
 * written, so it may alias nothing else of concern.
 */
final class Cx {
    private Cx() {
    }

    /** (a + ib)/(c + id) by Smith's algorithm. */
    static void div(double a, double b, double c, double d, double[] out) {
        if (Math.abs(c) >= Math.abs(d)) {
            double r = d / c;
            double den = c + d * r;
            out[0] = (a + b * r) / den;
            out[1] = (b - a * r) / den;
        } else {
            double r = c / d;
            double den = c * r + d;
            out[0] = (a * r + b) / den;
            out[1] = (b * r - a) / den;
        }
    }

    /** Principal square root. */
    static void sqrt(double a, double b, double[] out) {
        if (a == 0 && b == 0) {
            out[0] = 0;
            out[1] = b;
            return;
        }
        double m = Math.hypot(a, b);
        if (a >= 0) {
            double t = Math.sqrt(0.5 * (m + a));
            out[0] = t;
            out[1] = b / (2 * t);
        } else {
            double t = Math.sqrt(0.5 * (m - a));
            out[0] = Math.abs(b) / (2 * t);
            out[1] = Math.copySign(t, b);
        }
    }

    /**
     * cot(x + iy), stable for any y: written with e^{-2|y|} so that nothing overflows
     * (cot z → ∓i as Im z → ±∞).
     */
    static void cot(double x, double y, double[] out) {
        double e = Math.exp(-2 * Math.abs(y));
        double e2 = e * e;
        double den = 1 + e2 - 2 * Math.cos(2 * x) * e;
        out[0] = 2 * Math.sin(2 * x) * e / den;
        out[1] = -Math.copySign(1 - e2, y) / den;
    }
}
