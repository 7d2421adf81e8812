package org.fabspread.particles;

/**
 * A small immutable complex number for code off the hot paths (Mie series set-up, tests, per-wavelength
 * results). Hot loops in this package work on (re, im) pairs of doubles instead.
 *
 * @param re real part
 * @param im imaginary part
 */
public record Complex(double re, double im) {
    public static final Complex ZERO = new Complex(0, 0);
    public static final Complex ONE = new Complex(1, 0);
    public static final Complex I = new Complex(0, 1);

    public static Complex of(double re, double im) {
        return new Complex(re, im);
    }

    /** The complex number held in {@code out[0]}, {@code out[1]}. */
    public static Complex of(double[] out) {
        return new Complex(out[0], out[1]);
    }

    public Complex plus(Complex o) {
        return new Complex(re + o.re, im + o.im);
    }

    public Complex plus(double x) {
        return new Complex(re + x, im);
    }

    public Complex minus(Complex o) {
        return new Complex(re - o.re, im - o.im);
    }

    public Complex times(Complex o) {
        return new Complex(re * o.re - im * o.im, re * o.im + im * o.re);
    }

    public Complex times(double x) {
        return new Complex(re * x, im * x);
    }

    /** Quotient by Smith's algorithm (no overflow of the intermediate |o|²). */
    public Complex div(Complex o) {
        double[] out = new double[2];
        Cx.div(re, im, o.re, o.im, out);
        return new Complex(out[0], out[1]);
    }

    public Complex div(double x) {
        return new Complex(re / x, im / x);
    }

    public Complex conj() {
        return new Complex(re, -im);
    }

    public Complex negate() {
        return new Complex(-re, -im);
    }

    /** |z|². */
    public double abs2() {
        return re * re + im * im;
    }

    public double abs() {
        return Math.hypot(re, im);
    }

    /** Principal square root (branch cut on the negative real axis, Re ≥ 0). */
    public Complex sqrt() {
        double[] out = new double[2];
        Cx.sqrt(re, im, out);
        return new Complex(out[0], out[1]);
    }

    @Override
    public String toString() {
        return re + (im < 0 || (im == 0 && 1 / im < 0) ? " - " : " + ") + Math.abs(im) + "i";
    }
}
