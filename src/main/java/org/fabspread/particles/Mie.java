package org.fabspread.particles;

import java.util.ArrayList;
import java.util.List;

/**
 * Mie theory for a homogeneous sphere after Bohren &amp; Huffman's algorithm (<i>Absorption and Scattering
 * of Light by Small Particles</i>, 1983, appendix A): logarithmic derivative D_n(mx) by downward
 * recurrence from n = max(N, |mx|) + 15, Riccati–Bessel functions ψ_n, χ_n of the real size parameter by
 * upward recurrence, N = x + 4x^{1/3} + 2 terms, and
 * a_n = [(D_n/m + n/x) ψ_n − ψ_{n−1}] / [(D_n/m + n/x) ξ_n − ξ_{n−1}],
 * b_n = [(m D_n + n/x) ψ_n − ψ_{n−1}] / [(m D_n + n/x) ξ_n − ξ_{n−1}], ξ_n = ψ_n − iχ_n.
 * The host is non-absorbing: m is the particle's index relative to the host, x = 2π n_host r / λ.
 */
public final class Mie {
    private Mie() {
    }

    /** Number of series terms N = x + 4x^{1/3} + 2 (Bohren &amp; Huffman app. A), at least 1. */
    public static int terms(double x) {
        return Math.max(1, (int) (x + 4 * Math.cbrt(x) + 2));
    }

    /**
     * Full Mie series.
     *
     * @param mRe real part of the relative refractive index m
     * @param mIm imaginary part of m (≥ 0 for absorption with e^{-iωt})
     * @param x   size parameter &gt; 0
     */
    public static MieResult compute(double mRe, double mIm, double x) {
        if (!(x > 0) || Double.isInfinite(x)) {
            throw new IllegalArgumentException("Mie size parameter must be finite and > 0, got " + x);
        }
        if (mRe == 0 && mIm == 0) {
            throw new IllegalArgumentException("Mie relative index must not be 0");
        }
        Complex m = new Complex(mRe, mIm);
        Complex y = m.times(x);
        int nstop = terms(x);
        int nmx = (int) Math.max(nstop, y.abs()) + 15;
        // D_n(mx) by downward recurrence: D_{n-1} = n/y − 1/(D_n + n/y)
        Complex[] d = new Complex[nmx + 1];
        d[nmx] = Complex.ZERO;
        for (int n = nmx; n >= 2; n--) {
            Complex ny = new Complex(n, 0).div(y);
            d[n - 1] = ny.minus(Complex.ONE.div(d[n].plus(ny)));
        }
        double psi0 = Math.cos(x);
        double psi1 = Math.sin(x);
        double chi0 = -Math.sin(x);
        double chi1 = Math.cos(x);
        Complex xi1 = new Complex(psi1, -chi1);
        List<Complex> as = new ArrayList<>(nstop);
        List<Complex> bs = new ArrayList<>(nstop);
        double qsca = 0;
        double qext = 0;
        double gsum = 0;
        double backRe = 0;
        double backIm = 0;
        Complex aPrev = null;
        Complex bPrev = null;
        for (int n = 1; n <= nstop; n++) {
            double psi = (2 * n - 1) * psi1 / x - psi0;
            double chi = (2 * n - 1) * chi1 / x - chi0;
            Complex xi = new Complex(psi, -chi);
            Complex ta = d[n].div(m).plus(n / x);
            Complex an = ta.times(psi).minus(new Complex(psi1, 0)).div(ta.times(xi).minus(xi1));
            Complex tb = m.times(d[n]).plus(n / x);
            Complex bn = tb.times(psi).minus(new Complex(psi1, 0)).div(tb.times(xi).minus(xi1));
            as.add(an);
            bs.add(bn);
            qsca += (2 * n + 1) * (an.abs2() + bn.abs2());
            qext += (2 * n + 1) * (an.re() + bn.re());
            double sign = (n % 2 == 0) ? 1 : -1;
            backRe += (2 * n + 1) * sign * (an.re() - bn.re());
            backIm += (2 * n + 1) * sign * (an.im() - bn.im());
            gsum += (2.0 * n + 1) / (n * (n + 1.0)) * (an.re() * bn.re() + an.im() * bn.im());
            if (aPrev != null) {
                // term p(p+2)/(p+1) Re(a_p a*_{p+1} + b_p b*_{p+1}) with p = n − 1
                gsum += (n - 1.0) * (n + 1.0) / n
                        * (aPrev.re() * an.re() + aPrev.im() * an.im() + bPrev.re() * bn.re() + bPrev.im() * bn.im());
            }
            aPrev = an;
            bPrev = bn;
            psi0 = psi1;
            psi1 = psi;
            chi0 = chi1;
            chi1 = chi;
            xi1 = new Complex(psi1, -chi1);
        }
        double x2 = x * x;
        qsca *= 2 / x2;
        qext *= 2 / x2;
        double qback = (backRe * backRe + backIm * backIm) / x2;
        double g = 4 / (x2 * qsca) * gsum;
        return new MieResult(x, qext, qsca, qback, g, as, bs);
    }

    /** Below this |argument| ψ_1 and ψ_1' are summed from their power series instead of sin and cos. */
    static final double SERIES_BELOW = 1.0;
    /** Below this |Im z| sinh and cosh are summed from their power series instead of exp. */
    private static final double HYPERBOLIC_SERIES_BELOW = 0.25;
    /** Coefficients of ψ_1(z)/z² = Σ_k (−1)^k (2k+2)/(2k+3)! z^{2k}, k = 0 … 9. */
    private static final double[] PSI_SERIES = new double[10];
    /** Coefficients of ψ_1'(z)/z = Σ_k (−1)^k (2k+2)²/(2k+3)! z^{2k}, k = 0 … 9. */
    private static final double[] DPSI_SERIES = new double[10];

    /** Taylor coefficients (−1)^k/(2k+1)! and (−1)^k/(2k)!, k = 0 … 9, of sin and cos for |t| ≤ 1. */
    private static final double[] SIN_SERIES = new double[10];
    private static final double[] COS_SERIES = new double[10];

    static {
        double f = 1;
        for (int n = 0; n < 20; n++) {
            f = n == 0 ? 1 : f * n;
            double sign = (n / 2) % 2 == 0 ? 1 : -1;
            if (n % 2 == 0) {
                COS_SERIES[n / 2] = sign / f;
            } else {
                SIN_SERIES[n / 2] = sign / f;
            }
        }
        double fact = 6; // (2k+3)! at k = 0
        for (int k = 0; k < PSI_SERIES.length; k++) {
            double sign = k % 2 == 0 ? 1 : -1;
            PSI_SERIES[k] = sign * (2 * k + 2) / fact;
            DPSI_SERIES[k] = sign * (2.0 * k + 2) * (2 * k + 2) / fact;
            fact *= (2 * k + 4) * (2 * k + 5);
        }
    }

    /**
     * The electric dipole coefficient a_1 alone, allocation-free (the hot path of the particle ensemble),
     * from the closed forms of the first-order Riccati–Bessel functions (Bohren &amp; Huffman 1983, eq. 4.56
     * with μ₁ = μ, and §4.4): a_1 = [m ψ_1(mx) ψ_1'(x) − ψ_1(x) ψ_1'(mx)] / [m ψ_1(mx) ξ_1'(x) − ξ_1(x) ψ_1'(mx)],
     * ψ_1(z) = sin z/z − cos z, ψ_1'(z) = sin z − ψ_1(z)/z, χ_1(x) = cos x/x + sin x, χ_1'(x) = cos x − χ_1(x)/x,
     * ξ_1 = ψ_1 − iχ_1 (B&amp;H's sign convention, e^{−iωt}).
     *
     * <p>No recurrence. sin and cos of the complex z = mx come from sin, cos of Re z and e^{−2|Im z|}, all
     * scaled by e^{−|Im z|} (the scale cancels between numerator and denominator, so no Im z overflows).
     * For |z| &lt; {@value #SERIES_BELOW} (and x below it) ψ_1 and ψ_1' are summed from their power series
     * z²/3 − z⁴/30 + z⁶/840 − … and 2z/3 − 2z³/15 + … (ten terms, truncation below 1e-17 relative),
     * since sin z/z − cos z loses about log₁₀(1/|z|²) digits to cancellation; this product form, unlike the
     * logarithmic-derivative form of {@link #compute}, keeps full relative precision of a_1 ∝ x³ as x → 0.
     * The argument may be complex in the sense of an absorbing host: m = √(ε/ε_h) complex and x real
     * (see {@link Polarizability}).
     *
     * @param out receives Re a_1, Im a_1
     */
    public static void a1(double mRe, double mIm, double x, double[] out) {
        a1(mRe, mIm, mRe * mRe - mIm * mIm, 2 * mRe * mIm, true, x, out);
    }

    /**
     * a_1 from m² = ε/ε_h instead of m (the ensemble's hot path): below |mx| = {@value #SERIES_BELOW} the
     * series branch needs only m² (the common factor m of numerator and denominator cancels), so the complex
     * square root is taken only above it.
     */
    static void a1OfSquare(double qRe, double qIm, double x, double[] out) {
        a1(0, 0, qRe, qIm, false, x, out);
    }

    private static void a1(double mRe0, double mIm0, double qRe, double qIm, boolean haveM, double x, double[] out) {
        // real argument x
        double s = sin(x);
        double c = cos(x);
        double ix = 1 / x;
        double psi;
        double dpsi;
        if (x < SERIES_BELOW) {
            double w = x * x;
            double p = PSI_SERIES[9];
            double q = DPSI_SERIES[9];
            for (int k = 8; k >= 0; k--) {
                p = p * w + PSI_SERIES[k];
                q = q * w + DPSI_SERIES[k];
            }
            psi = p * w;
            dpsi = q * x;
        } else {
            psi = s * ix - c;
            dpsi = s - psi * ix;
        }
        double chi = c * ix + s;
        double dchi = c - chi * ix;
        // complex argument z = m x. Closed form: A = m ψ_1(z), B = ψ_1'(z), both times the same positive scale;
        // series: A = ψ_1(z) = z² P(z²), B = ψ_1'(z)/m = x Q(z²) (numerator and denominator divided by m)
        double x2 = x * x;
        double wr = qRe * x2;
        double wi = qIm * x2;
        double amr;
        double ami;
        double dr;
        double di;
        if (wr * wr + wi * wi < SERIES_BELOW * SERIES_BELOW * SERIES_BELOW * SERIES_BELOW) {
            double ar = PSI_SERIES[9];
            double ai = 0;
            double br = DPSI_SERIES[9];
            double bi = 0;
            for (int k = 8; k >= 0; k--) {
                double t = ar * wr - ai * wi + PSI_SERIES[k];
                ai = ar * wi + ai * wr;
                ar = t;
                t = br * wr - bi * wi + DPSI_SERIES[k];
                bi = br * wi + bi * wr;
                br = t;
            }
            amr = ar * wr - ai * wi;
            ami = ar * wi + ai * wr;
            dr = br * x;
            di = bi * x;
        } else {
            double mRe = mRe0;
            double mIm = mIm0;
            if (!haveM) {
                sqrt(qRe, qIm, out);
                mRe = out[0];
                mIm = out[1];
            }
            double zr = mRe * x;
            double zi = mIm * x;
            double z2 = zr * zr + zi * zi;
            double sa = sin(zr);
            double ca = cos(zr);
            double ch;
            double sh;
            double b = Math.abs(zi);
            if (b < HYPERBOLIC_SERIES_BELOW) {
                // unscaled cosh, sinh of |Im z| (1 − e^{−2b} would lose digits for small b)
                double b2 = b * b;
                ch = 1 + b2 / 2 * (1 + b2 / 12 * (1 + b2 / 30 * (1 + b2 / 56 * (1 + b2 / 90 * (1 + b2 / 132)))));
                sh = b * (1 + b2 / 6 * (1 + b2 / 20 * (1 + b2 / 42 * (1 + b2 / 72 * (1 + b2 / 110)))));
            } else {
                // e^{−b} cosh b and e^{−b} sinh b
                double e = Math.exp(-2 * b);
                ch = 0.5 * (1 + e);
                sh = 0.5 * (1 - e);
            }
            sh = Math.copySign(sh, zi);
            // sin z = sin a cosh b + i cos a sinh b; cos z = cos a cosh b − i sin a sinh b
            double sr = sa * ch;
            double si = ca * sh;
            double cr = ca * ch;
            double ci = -sa * sh;
            double iz2 = 1 / z2;
            double izr = zr * iz2;
            double izi = -zi * iz2;
            // P = sin z / z − cos z
            double pr = sr * izr - si * izi - cr;
            double pi = sr * izi + si * izr - ci;
            // D = sin z − P / z
            dr = sr - (pr * izr - pi * izi);
            di = si - (pr * izi + pi * izr);
            amr = mRe * pr - mIm * pi;
            ami = mRe * pi + mIm * pr;
        }
        double mpr = amr;
        double mpi = ami;
        // numerator N = A ψ_1'(x) − ψ_1(x) B; denominator N − i (A χ_1'(x) − χ_1(x) B)
        double nr = mpr * dpsi - psi * dr;
        double ni = mpi * dpsi - psi * di;
        double tr = mpr * dchi - chi * dr;
        double ti = mpi * dchi - chi * di;
        Cx.div(nr, ni, nr + ti, ni - tr, out);
    }

    /** sin t: Taylor polynomial for |t| ≤ 1 (truncation below 1e-19, about one rounding), else {@link Math#sin}. */
    private static double sin(double t) {
        if (!(Math.abs(t) <= 1)) {
            return Math.sin(t);
        }
        double w = t * t;
        double p = SIN_SERIES[9];
        for (int k = 8; k >= 0; k--) {
            p = p * w + SIN_SERIES[k];
        }
        return p * t;
    }

    /** cos t: Taylor polynomial for |t| ≤ 1 (truncation below 1e-19), else {@link Math#cos}. */
    private static double cos(double t) {
        if (!(Math.abs(t) <= 1)) {
            return Math.cos(t);
        }
        double w = t * t;
        double p = COS_SERIES[9];
        for (int k = 8; k >= 0; k--) {
            p = p * w + COS_SERIES[k];
        }
        return p;
    }

    /** Principal square root (as {@link Cx#sqrt}) with the modulus from its square: no hypot on the hot path. */
    static void sqrt(double a, double b, double[] out) {
        if (a == 0 && b == 0) {
            out[0] = 0;
            out[1] = b;
            return;
        }
        double mod = Math.sqrt(a * a + b * b);
        if (a >= 0) {
            double t = Math.sqrt(0.5 * (mod + a));
            out[0] = t;
            out[1] = b / (2 * t);
        } else {
            double t = Math.sqrt(0.5 * (mod - a));
            out[0] = Math.abs(b) / (2 * t);
            out[1] = Math.copySign(t, b);
        }
    }
}
