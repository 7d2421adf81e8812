package org.fabspread.particles;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * The full Mie series of a homogeneous sphere, allocation-free: every multipole order a_n, b_n up to
 * Wiscombe's number of terms, and from them the extinction, scattering and absorption efficiencies, the
 * backscattering efficiency, the asymmetry parameter g = ⟨cos θ⟩ and the share of the scattered power
 * that goes into the forward hemisphere (θ &lt; 90°).
 *
 * <p>Method (Bohren &amp; Huffman, <i>Absorption and Scattering of Light by Small Particles</i>, 1983,
 * ch. 4 and app. A; Wiscombe, Appl. Opt. 19, 1505 (1980)): the logarithmic derivative D_n(mx) by
 * downward recurrence D_{n−1} = n/(mx) − 1/(D_n + n/(mx)) from n = max(N, |mx|) + 15 with D = 0 (stable
 * for any m, Bohren &amp; Huffman app. A), the Riccati–Bessel functions ψ_n, χ_n of the real size parameter
 * by upward recurrence (stable for n ≤ N), N = x + 4x^{1/3} + 2 terms (Wiscombe 1980), and
 * a_n = [(D_n/m + n/x) ψ_n − ψ_{n−1}] / [(D_n/m + n/x) ξ_n − ξ_{n−1}],
 * b_n = [(m D_n + n/x) ψ_n − ψ_{n−1}] / [(m D_n + n/x) ξ_n − ξ_{n−1}], ξ_n = ψ_n − iχ_n (e^{−iωt}).
 * Q_ext = (2/x²) Σ(2n+1) Re(a_n + b_n), Q_sca = (2/x²) Σ(2n+1)(|a_n|² + |b_n|²),
 * g Q_sca = (4/x²) Σ [n(n+2)/(n+1) Re(a_n a*_{n+1} + b_n b*_{n+1}) + (2n+1)/(n(n+1)) Re(a_n b*_n)]
 * (Bohren &amp; Huffman eq. 4.62 and app. A).
 *
 * <p>Forward hemisphere: Q_fwd = (1/x²) ∫₀¹ (|S₁|² + |S₂|²) dμ with S₁ = Σ c_n(a_n π_n + b_n τ_n),
 * S₂ = Σ c_n(a_n τ_n + b_n π_n), c_n = (2n+1)/(n(n+1)) (Bohren &amp; Huffman eq. 4.74), which is
 * Σ_{n,m} c_n c_m [Re(a_n a*_m + b_n b*_m) P_nm + Re(a_n b*_m + b_n a*_m) T_nm] with the half-range integrals
 * P_nm = ∫₀¹ (π_nπ_m + τ_nτ_m) dμ and T_nm = ∫₀¹ (π_nτ_m + τ_nπ_m) dμ. These depend on no particle; they are
 * computed once by {@value #HEMISPHERE_POINTS}-point Gauss–Legendre quadrature (exact for the polynomial
 * integrands up to n, m = {@value #MAX_TERMS}). By the parity of π_n and τ_n (π_n(−μ) = (−1)^{n−1}π_n(μ),
 * τ_n(−μ) = (−1)^n τ_n(μ)), P_nm = δ_nm n²(n+1)²/(2n+1) when n + m is even and T_nm = 0 when n + m is odd,
 * so each pair costs one of the two terms. Over the whole sphere the same sum gives Q_sca (the
 * orthogonality of Bohren &amp; Huffman eq. 4.61), which a test holds.
 *
 * <p>An absorbing host is met as elsewhere in this package ({@link Polarizability}): complex m = √(ε/ε_h)
 * with the real size parameter x = 2π Re n_h r/λ; the scattering efficiencies are then those of that
 * approximation and Q_ext − Q_sca is not the metal's absorption (see {@link ParticleEnsemble}).
 *
 * <p>Spheres up to {@value #MAX_TERMS} terms (x ≲ 140, far beyond a thin-film particle) are computed;
 * larger ones are refused. Not thread-safe: one instance per thread.
 */
public final class MieSeries {
    /** Largest number of terms (x up to about 140). */
    public static final int MAX_TERMS = 160;
    /** Gauss–Legendre points on [0, 1] for the half-range integrals (exact to degree 2·points − 1). */
    static final int HEMISPHERE_POINTS = 168;
    /** Extra orders above max(N, |mx|) where the downward recurrence of D_n starts (Bohren &amp; Huffman). */
    private static final int DOWNWARD_EXTRA = 15;
    /** P_nm at [(n − 1)·MAX_TERMS + m − 1] (n + m odd, or n = m). */
    private static final double[] HALF_P = new double[MAX_TERMS * MAX_TERMS];
    /** T_nm at [(n − 1)·MAX_TERMS + m − 1] (n + m even). */
    private static final double[] HALF_T = new double[MAX_TERMS * MAX_TERMS];

    static {
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(HEMISPHERE_POINTS, 0, 1);
        double[] pi = new double[MAX_TERMS + 1];
        double[] tau = new double[MAX_TERMS + 1];
        for (int q = 0; q < rule.getNumberOfPoints(); q++) {
            double mu = rule.getPoint(q);
            double w = rule.getWeight(q);
            angular(mu, MAX_TERMS, pi, tau);
            for (int n = 1; n <= MAX_TERMS; n++) {
                for (int m = 1; m <= MAX_TERMS; m++) {
                    int o = (n - 1) * MAX_TERMS + m - 1;
                    HALF_P[o] += w * (pi[n] * pi[m] + tau[n] * tau[m]);
                    HALF_T[o] += w * (pi[n] * tau[m] + tau[n] * pi[m]);
                }
            }
        }
    }

    /**
     * The angular functions π_n(μ), τ_n(μ), n = 1 … nMax, by the upward recurrences of Bohren &amp; Huffman
     * eq. 4.47: π_n = ((2n−1)/(n−1)) μ π_{n−1} − (n/(n−1)) π_{n−2}, τ_n = n μ π_n − (n+1) π_{n−1}.
     */
    static void angular(double mu, int nMax, double[] pi, double[] tau) {
        double p0 = 0;
        double p1 = 1;
        pi[1] = 1;
        tau[1] = mu;
        for (int n = 2; n <= nMax; n++) {
            double p = (2.0 * n - 1) / (n - 1) * mu * p1 - (double) n / (n - 1) * p0;
            pi[n] = p;
            tau[n] = n * mu * p - (n + 1) * p1;
            p0 = p1;
            p1 = p;
        }
    }

    private final double[] dRe = new double[MAX_TERMS + 1];
    private final double[] dIm = new double[MAX_TERMS + 1];
    private final double[] aRe = new double[MAX_TERMS + 1];
    private final double[] aIm = new double[MAX_TERMS + 1];
    private final double[] bRe = new double[MAX_TERMS + 1];
    private final double[] bIm = new double[MAX_TERMS + 1];
    private int terms;
    private double x;
    private double qExt;
    private double qSca;
    private double qBack;
    private double gSum;
    private boolean forwardDone;
    private double qForward;

    /** Wiscombe's number of terms N = x + 4x^{1/3} + 2 (Bohren &amp; Huffman app. A), at least 1. */
    public static int terms(double x) {
        return Math.max(1, (int) (x + 4 * Math.cbrt(x) + 2));
    }

    /**
     * Computes a_n, b_n and the efficiencies. Allocation-free.
     *
     * @param mRe real part of the relative index m
     * @param mIm imaginary part of m (≥ 0 for absorption, e^{−iωt})
     * @param sizeParameter x &gt; 0
     * @return this
     */
    public MieSeries compute(double mRe, double mIm, double sizeParameter) {
        return compute(mRe, mIm, sizeParameter, terms(sizeParameter));
    }

    /** As {@link #compute(double, double, double)} with a chosen number of terms (convergence checks). */
    MieSeries compute(double mRe, double mIm, double sizeParameter, int nstop) {
        double xx = sizeParameter;
        if (!(xx > 0) || Double.isInfinite(xx)) {
            throw new IllegalArgumentException("Mie size parameter must be finite and > 0, got " + xx);
        }
        if (mRe == 0 && mIm == 0) {
            throw new IllegalArgumentException("Mie relative index must not be 0");
        }
        if (nstop < 1 || nstop > MAX_TERMS) {
            throw new IllegalArgumentException("sphere too large for the series (x = " + xx + ", at most "
                    + MAX_TERMS + " terms)");
        }
        x = xx;
        terms = nstop;
        forwardDone = false;
        // 1/(m x) and 1/m
        double yr = mRe * xx;
        double yi = mIm * xx;
        double y2 = yr * yr + yi * yi;
        double iyr = yr / y2;
        double iyi = -yi / y2;
        double m2 = mRe * mRe + mIm * mIm;
        double imr = mRe / m2;
        double imi = -mIm / m2;
        int nmx = (int) Math.max(nstop, Math.sqrt(y2)) + DOWNWARD_EXTRA;
        // D_n(mx) by downward recurrence; only n ≤ nstop is stored
        double cr = 0;
        double ci = 0;
        for (int n = nmx; n >= 2; n--) {
            double nr = n * iyr;
            double ni = n * iyi;
            double sr = cr + nr;
            double si = ci + ni;
            double s2 = sr * sr + si * si;
            cr = nr - sr / s2;
            ci = ni + si / s2;
            if (n - 1 <= nstop) {
                dRe[n - 1] = cr;
                dIm[n - 1] = ci;
            }
        }
        double psi0 = Math.cos(xx);
        double psi1 = Math.sin(xx);
        double chi0 = -Math.sin(xx);
        double chi1 = Math.cos(xx);
        double ext = 0;
        double sca = 0;
        double backRe = 0;
        double backIm = 0;
        double g = 0;
        double ix = 1 / xx;
        for (int n = 1; n <= nstop; n++) {
            double psi = (2 * n - 1) * psi1 * ix - psi0;
            double chi = (2 * n - 1) * chi1 * ix - chi0;
            double nx = n * ix;
            // a_n with t = D_n/m + n/x
            double tr = dRe[n] * imr - dIm[n] * imi + nx;
            double ti = dRe[n] * imi + dIm[n] * imr;
            coefficient(tr, ti, psi, chi, psi1, chi1, aRe, aIm, n);
            // b_n with t = m D_n + n/x
            tr = mRe * dRe[n] - mIm * dIm[n] + nx;
            ti = mRe * dIm[n] + mIm * dRe[n];
            coefficient(tr, ti, psi, chi, psi1, chi1, bRe, bIm, n);
            double ar = aRe[n];
            double ai = aIm[n];
            double br = bRe[n];
            double bi = bIm[n];
            sca += (2 * n + 1) * (ar * ar + ai * ai + br * br + bi * bi);
            ext += (2 * n + 1) * (ar + br);
            double sign = (n % 2 == 0) ? 1 : -1;
            backRe += (2 * n + 1) * sign * (ar - br);
            backIm += (2 * n + 1) * sign * (ai - bi);
            g += (2.0 * n + 1) / (n * (n + 1.0)) * (ar * br + ai * bi);
            if (n > 1) {
                // p(p+2)/(p+1) Re(a_p a*_{p+1} + b_p b*_{p+1}), p = n − 1
                g += (n - 1.0) * (n + 1.0) / n * (aRe[n - 1] * ar + aIm[n - 1] * ai + bRe[n - 1] * br + bIm[n - 1] * bi);
            }
            psi0 = psi1;
            psi1 = psi;
            chi0 = chi1;
            chi1 = chi;
        }
        double x2 = xx * xx;
        qExt = 2 * ext / x2;
        qSca = 2 * sca / x2;
        qBack = (backRe * backRe + backIm * backIm) / x2;
        gSum = 4 * g / x2;
        return this;
    }

    /** c_n = (t ψ_n − ψ_{n−1}) / (t ξ_n − ξ_{n−1}), ξ = ψ − iχ, into re[n], im[n]. */
    private static void coefficient(double tr, double ti, double psi, double chi, double psiPrev, double chiPrev,
                                    double[] re, double[] im, int n) {
        double nr = tr * psi - psiPrev;
        double ni = ti * psi;
        // t ξ_n − ξ_{n−1} with ξ_n = ψ_n − iχ_n
        double dr = tr * psi + ti * chi - psiPrev;
        double di = ti * psi - tr * chi + chiPrev;
        double d2 = dr * dr + di * di;
        re[n] = (nr * dr + ni * di) / d2;
        im[n] = (ni * dr - nr * di) / d2;
    }

    /** Size parameter of the last compute. */
    public double sizeParameter() {
        return x;
    }

    /** Number of terms of the last compute. */
    public int terms() {
        return terms;
    }

    /** Q_ext. */
    public double qExt() {
        return qExt;
    }

    /** Q_sca. */
    public double qSca() {
        return qSca;
    }

    /** Q_ext − Q_sca (the sphere's absorption in a non-absorbing host). */
    public double qAbs() {
        return qExt - qSca;
    }

    /** Q_back in Bohren &amp; Huffman's convention |Σ(2n+1)(−1)ⁿ(a_n − b_n)|²/x². */
    public double qBack() {
        return qBack;
    }

    /** Asymmetry parameter g = ⟨cos θ⟩ (0 when nothing is scattered). */
    public double asymmetry() {
        return qSca > 0 ? gSum / qSca : 0;
    }

    /** g·Q_sca. */
    public double asymmetryTimesQSca() {
        return gSum;
    }

    /** Re a_n, n ≥ 1. */
    public double aRe(int n) {
        return aRe[n];
    }

    /** Im a_n. */
    public double aIm(int n) {
        return aIm[n];
    }

    /** Re b_n. */
    public double bRe(int n) {
        return bRe[n];
    }

    /** Im b_n. */
    public double bIm(int n) {
        return bIm[n];
    }

    /** Q_fwd: scattering efficiency into the forward hemisphere 0 ≤ θ &lt; 90° (computed on first call). */
    public double qForward() {
        if (!forwardDone) {
            qForward = hemisphere(false);
            forwardDone = true;
        }
        return qForward;
    }

    /** Share of the scattered power in the forward hemisphere, Q_fwd/Q_sca (1/2 when nothing is scattered). */
    public double forwardShare() {
        return qSca > 0 ? qForward() / qSca : 0.5;
    }

    /**
     * Σ_{n,m} c_n c_m [Re(a_n a*_m + b_n b*_m) P_nm + Re(a_n b*_m + b_n a*_m) T_nm] / x² over the forward
     * hemisphere; with {@code fullSphere} the whole-sphere integrals instead (a check: equals Q_sca).
     */
    double hemisphere(boolean fullSphere) {
        double s = 0;
        for (int n = 1; n <= terms; n++) {
            double cn = (2.0 * n + 1) / (n * (n + 1.0));
            double anr = aRe[n];
            double ani = aIm[n];
            double bnr = bRe[n];
            double bni = bIm[n];
            int row = (n - 1) * MAX_TERMS;
            double inner = 0;
            for (int m = 1; m <= terms; m++) {
                double c = (2.0 * m + 1) / (m * (m + 1.0));
                if (((n + m) & 1) == 1 || n == m) {
                    double p = fullSphere ? (n == m ? 2.0 * n * n * (n + 1) * (n + 1) / (2 * n + 1) : 0)
                            : HALF_P[row + m - 1];
                    inner += c * p * (anr * aRe[m] + ani * aIm[m] + bnr * bRe[m] + bni * bIm[m]);
                }
                if (((n + m) & 1) == 0 && !fullSphere) {
                    inner += c * HALF_T[row + m - 1] * (anr * bRe[m] + ani * bIm[m] + bnr * aRe[m] + bni * aIm[m]);
                }
            }
            s += cn * inner;
        }
        return s / (x * x);
    }
}
