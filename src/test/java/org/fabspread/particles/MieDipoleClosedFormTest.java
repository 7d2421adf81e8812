package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;

import org.junit.jupiter.api.Test;

/**
 * The closed-form a_1 of {@link Mie#a1} against the full series of {@link Mie#compute} and against the same
 * Bohren &amp; Huffman expression evaluated from power series in 50-digit arithmetic (no sin, cos or exp, no
 * cancellation), over x from 1e-4 to 5 and relative indices of metals and dielectrics.
 */
class MieDipoleClosedFormTest {
    private static final MathContext MC = new MathContext(50);

    /** Relative indices: Ag and Au in n_h = 1.5–2 near and off resonance, a strongly absorbing metal, dielectrics. */
    private static final double[][] M = {
        {0.05, 1.5}, {0.1, 4.0}, {0.3, 2.5}, {0.04, 9.0}, {0.2, 6.0}, {0.27, 1.6}, {0.6, 1.2}, {0.9, 0.4},
        {1.5, 0.01}, {1.33, 0.0}, {2.5, 0.3}, {0.2, 0.7}, {0.08, 0.05}};
    private static final double[] X = {1e-4, 3e-4, 1e-3, 3e-3, 0.01, 0.03, 0.1, 0.2, 0.3, 0.5, 0.7, 0.9, 0.99,
        1.01, 1.2, 1.5, 2, 2.5, 3, 4, 5};

    @Test
    void matchesFiftyDigitEvaluationFromTheSmallToTheLargeLimit() {
        // source: Bohren & Huffman, Absorption and Scattering of Light by Small Particles (1983), eq. 4.56 with
        // ψ_1(ρ) = ρ j_1(ρ), χ_1 = −ρ y_1 (§4.4); j_1, y_1 as power series (Abramowitz & Stegun 10.1.2, 10.1.11)
        double[] out = new double[2];
        double worst = 0;
        for (double[] m : M) {
            for (double x : X) {
                double[] ref = reference(m[0], m[1], x);
                Mie.a1(m[0], m[1], x, out);
                double err = Math.hypot(out[0] - ref[0], out[1] - ref[1]) / Math.hypot(ref[0], ref[1]);
                worst = Math.max(worst, err);
                assertTrue(err < 1e-13, "m = " + m[0] + "+" + m[1] + "i, x = " + x + ": relative error " + err);
            }
        }
        assertTrue(worst > 0, "the comparison compares something");
    }

    @Test
    void matchesTheFullMieSeriesWhereTheSeriesIsAccurate() {
        // source: Bohren & Huffman (1983) app. A (Mie.compute: downward D_n recurrence, upward ψ_n, χ_n)
        // The full series' own a_1 comes from the logarithmic-derivative form, whose numerator
        // (D_1/m + 1/x) ψ_1 − ψ_0 cancels from O(x) down to a_1 ∝ x³: it loses about 2 log₁₀(1/x) digits
        // (measured over this grid: at most 4.2e-16/x², i.e. 4.2e-8 at x = 1e-4, 2.8e-10 at 1e-3, 1.9e-11 at
        // 3e-3; the closed form stays within 1e-13 of the 50-digit evaluation there, see above).
        // So the 1e-10 comparison with it holds from x = 3e-3 up; below, the difference is held to that law.
        double[] out = new double[2];
        for (double[] m : M) {
            for (double x : X) {
                Complex a = Mie.compute(m[0], m[1], x).a1();
                Mie.a1(m[0], m[1], x, out);
                double err = Math.hypot(out[0] - a.re(), out[1] - a.im()) / a.abs();
                double tol = x >= 3e-3 ? 1e-10 : 1e-15 / (x * x);
                assertTrue(err < tol, "m = " + m[0] + "+" + m[1] + "i, x = " + x + ": relative difference " + err);
            }
        }
    }

    @Test
    void quasiStaticLimit() {
        // source: Bohren & Huffman (1983) eq. 5.7: a_1 → −i(2x³/3)(m² − 1)/(m² + 2) as x → 0, with a relative
        // correction O(x²); the 50-digit evaluation confirms the limit a second way
        double[] out = new double[2];
        double[] m = {0.05, 1.5};
        for (double x : new double[] {1e-4, 1e-3}) {
            Mie.a1(m[0], m[1], x, out);
            Complex m2 = new Complex(m[0], m[1]).times(new Complex(m[0], m[1]));
            Complex lim = m2.minus(Complex.ONE).div(m2.plus(2)).times(new Complex(0, -2 * x * x * x / 3));
            double err = Math.hypot(out[0] - lim.re(), out[1] - lim.im()) / lim.abs();
            assertTrue(err < 10 * x * x, "x = " + x + ": " + err);
            double[] ref = reference(m[0], m[1], x);
            assertEquals(ref[1], out[1], 1e-13 * Math.abs(ref[1]));
        }
    }

    @Test
    void hugeImaginaryArgumentDoesNotOverflow() {
        // source: Bohren & Huffman (1983) app. A: the full series stays finite for any |Im mx|; sinh and cosh of
        // Im mx = 1500 would overflow a double unless scaled by e^{−|Im mx|}
        double[] out = new double[2];
        for (double[] c : new double[][] {{0.1, 300, 5}, {2, 1000, 1}, {0.01, 200, 4}}) {
            Mie.a1(c[0], c[1], c[2], out);
            Complex a = Mie.compute(c[0], c[1], c[2]).a1();
            assertTrue(Double.isFinite(out[0]) && Double.isFinite(out[1]));
            assertEquals(a.re(), out[0], 1e-10 * a.abs());
            assertEquals(a.im(), out[1], 1e-10 * a.abs());
        }
    }

    @Test
    void realIndexConservesEnergyAndLossAbsorbs() {
        // source: Bohren & Huffman (1983) ch. 4: for real m the n = 1 term neither absorbs nor emits,
        // Re a_1 = |a_1|²; for Im m > 0 it absorbs, Re a_1 > |a_1|²
        double[] out = new double[2];
        for (double x : X) {
            Mie.a1(1.33, 0, x, out);
            double a2 = out[0] * out[0] + out[1] * out[1];
            assertEquals(a2, out[0], 1e-12 * Math.sqrt(a2), "x = " + x);
            Mie.a1(0.3, 2.5, x, out);
            assertTrue(out[0] > out[0] * out[0] + out[1] * out[1], "x = " + x);
        }
    }

    // ----- 50-digit reference -----

    private record BC(BigDecimal re, BigDecimal im) {
        static BC of(double re, double im) {
            return new BC(new BigDecimal(re), new BigDecimal(im));
        }

        BC plus(BC o) {
            return new BC(re.add(o.re, MC), im.add(o.im, MC));
        }

        BC minus(BC o) {
            return new BC(re.subtract(o.re, MC), im.subtract(o.im, MC));
        }

        BC times(BC o) {
            return new BC(re.multiply(o.re, MC).subtract(im.multiply(o.im, MC), MC),
                    re.multiply(o.im, MC).add(im.multiply(o.re, MC), MC));
        }

        BC scale(BigDecimal s) {
            return new BC(re.multiply(s, MC), im.multiply(s, MC));
        }

        BC div(BC o) {
            BigDecimal d = o.re.multiply(o.re, MC).add(o.im.multiply(o.im, MC), MC);
            BigDecimal r = re.multiply(o.re, MC).add(im.multiply(o.im, MC), MC).divide(d, MC);
            BigDecimal i = im.multiply(o.re, MC).subtract(re.multiply(o.im, MC), MC).divide(d, MC);
            return new BC(r, i);
        }
    }

    /** {ψ_1(z), ψ_1'(z)} from Σ (−1)^k (2k+2) z^{2k+2}/(2k+3)! and its derivative. */
    private static BC[] psi(BC z) {
        BC w = z.times(z);
        BC zp = w; // z^{2k+2}
        BigDecimal fact = BigDecimal.valueOf(6);
        BC p = BC.of(0, 0);
        BC d = BC.of(0, 0);
        for (int k = 0; k < 400; k++) {
            BigDecimal c = BigDecimal.valueOf(2L * k + 2).divide(fact, MC);
            if (k % 2 == 1) {
                c = c.negate();
            }
            BC term = zp.scale(c);
            p = p.plus(term);
            d = d.plus(term.scale(BigDecimal.valueOf(2L * k + 2)).div(z));
            if (k > 10 && term.re.abs().add(term.im.abs()).compareTo(new BigDecimal("1e-45")) < 0) {
                break;
            }
            zp = zp.times(w);
            fact = fact.multiply(BigDecimal.valueOf((2L * k + 4) * (2L * k + 5)), MC);
        }
        return new BC[] {p, d};
    }

    /** sin and cos of a real x by their Taylor series. */
    private static BigDecimal[] sinCos(BigDecimal x) {
        BigDecimal s = BigDecimal.ZERO;
        BigDecimal c = BigDecimal.ZERO;
        BigDecimal term = BigDecimal.ONE; // x^n / n!
        for (int n = 0; n < 400; n++) {
            int r = n % 4;
            if (r == 0) {
                c = c.add(term, MC);
            } else if (r == 1) {
                s = s.add(term, MC);
            } else if (r == 2) {
                c = c.subtract(term, MC);
            } else {
                s = s.subtract(term, MC);
            }
            term = term.multiply(x, MC).divide(BigDecimal.valueOf(n + 1), MC);
            if (n > 10 && term.abs().compareTo(new BigDecimal("1e-48")) < 0) {
                break;
            }
        }
        return new BigDecimal[] {s, c};
    }

    private static double[] reference(double mRe, double mIm, double xd) {
        BigDecimal x = new BigDecimal(xd);
        BC m = BC.of(mRe, mIm);
        BC[] inner = psi(m.times(new BC(x, BigDecimal.ZERO)));
        BC[] outer = psi(new BC(x, BigDecimal.ZERO));
        BigDecimal[] sc = sinCos(x);
        BigDecimal chi = sc[1].divide(x, MC).add(sc[0], MC);
        BigDecimal dchi = sc[1].subtract(chi.divide(x, MC), MC);
        // ξ_1 = ψ_1 − iχ_1
        BC xi = new BC(outer[0].re(), chi.negate());
        BC dxi = new BC(outer[1].re(), dchi.negate());
        BC mp = m.times(inner[0]);
        BC num = mp.times(outer[1]).minus(outer[0].times(inner[1]));
        BC den = mp.times(dxi).minus(xi.times(inner[1]));
        BC a = num.div(den);
        return new double[] {a.re().doubleValue(), a.im().doubleValue()};
    }
}
