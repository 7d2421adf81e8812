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

    /**
     * The electric dipole coefficient a_1 alone, allocation-free (the hot path of the particle ensemble):
     * the n = 1 term of the algorithm above with D_1(z) = 1/(1/z − cot z) − 1/z, cot written so that it
     * never overflows and 1/z − cot z by its Taylor series for |z| &lt; 0.1. The argument may be
     * complex in the sense of an absorbing host: m = √(ε/ε_h) complex and x real (see {@link Polarizability}).
     *
     * @param out receives Re a_1, Im a_1
     */
    public static void a1(double mRe, double mIm, double x, double[] out) {
        double zr = mRe * x;
        double zi = mIm * x;
        double ur;
        double ui;
        if (zr * zr + zi * zi < 0.01) {
            // 1/z − cot z = z/3 + z³/45 + 2z⁵/945 + z⁷/4725 + 2z⁹/93555 (error < 1e-17 relative for |z| < 0.1)
            double z2r = zr * zr - zi * zi;
            double z2i = 2 * zr * zi;
            double sr = 2.0 / 93555;
            double si = 0;
            double[] coef = {1.0 / 4725, 2.0 / 945, 1.0 / 45, 1.0 / 3};
            for (double c : coef) {
                double tr = sr * z2r - si * z2i + c;
                double ti = sr * z2i + si * z2r;
                sr = tr;
                si = ti;
            }
            ur = sr * zr - si * zi;
            ui = sr * zi + si * zr;
        } else {
            Cx.div(1, 0, zr, zi, out);
            double izr = out[0];
            double izi = out[1];
            Cx.cot(zr, zi, out);
            ur = izr - out[0];
            ui = izi - out[1];
        }
        // D_1 = 1/u − 1/z
        Cx.div(1, 0, ur, ui, out);
        double dr = out[0];
        double di = out[1];
        Cx.div(1, 0, zr, zi, out);
        dr -= out[0];
        di -= out[1];
        // t = D_1/m + 1/x
        Cx.div(dr, di, mRe, mIm, out);
        double tr = out[0] + 1 / x;
        double ti = out[1];
        double s = Math.sin(x);
        double c = Math.cos(x);
        double psi0 = s;
        double psi1 = s / x - c;
        double chi0 = c;
        double chi1 = c / x + s;
        // numerator t ψ_1 − ψ_0; denominator t ξ_1 − ξ_0, ξ = ψ − iχ
        double nr = tr * psi1 - psi0;
        double ni = ti * psi1;
        double xr = psi1;
        double xim = -chi1;
        double er = tr * xr - ti * xim - psi0;
        double ei = tr * xim + ti * xr + chi0;
        Cx.div(nr, ni, er, ei, out);
    }
}
