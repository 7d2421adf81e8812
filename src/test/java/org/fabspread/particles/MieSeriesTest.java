package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.junit.jupiter.api.Test;

/** The allocation-free full Mie series against published values and limits. */
class MieSeriesTest {

    private final MieSeries mie = new MieSeries();

    @Test
    void bohrenHuffmanWorkedExample() {
        // source: Bohren & Huffman (1983), app. A worked example, m = 1.55, r = 0.525 µm, λ = 0.6328 µm
        // (values quoted in the model document 4.2), to the printed digits
        mie.compute(1.55, 0, 2 * Math.PI * 0.525 / 0.6328);
        assertEquals(3.10543, mie.qExt(), 5e-6);
        assertEquals(3.10543, mie.qSca(), 5e-6);
        assertEquals(2.92534, mie.qBack(), 5e-6);
        assertEquals(0.63314, mie.asymmetry(), 5e-6);
    }

    @Test
    void wiscombeTestCasesWithAbsorption() {
        // source: Wiscombe, "Mie scattering calculations: advances in technique and fast, vector-speed computer
        // codes", NCAR/TN-140+STR (1979, ed. 1996), MIEV0 test cases 9, 10, 12, 14 and 15 (printed to 6–7
        // digits; MIEV0 writes m = n − ik, here n + ik for e^{−iωt})
        mie.compute(1.33, 1e-5, 1);           // case 9
        assertEquals(0.093923, mie.qSca(), 5e-7);
        assertEquals(0.184517, mie.asymmetry(), 5e-7);
        // case 10: nearly lossless at x = 100, narrow internal resonances of order up to |mx| ≈ 133 still
        // contribute at 2e-5; MIEV0's printed digits need terms beyond Wiscombe's N = 120 (the default of
        // compute, meant for the absorbing metal spheres of this program), so 150 terms are asked for
        mie.compute(1.33, 1e-5, 100, 150);
        assertEquals(2.096594, mie.qSca(), 5e-7);
        assertEquals(0.868959, mie.asymmetry(), 5e-7);
        mie.compute(1.5, 1, 0.055);           // case 12
        assertEquals(0.000011, mie.qSca(), 5e-7);
        assertEquals(0.000491, mie.asymmetry(), 5e-7);
        mie.compute(1.5, 1, 1);               // case 14
        assertEquals(0.6634538, mie.qSca(), 5e-8);
        assertEquals(0.192136, mie.asymmetry(), 5e-7);
        // from memory: case 14 Q_ext = 2.336321; cross-checked below by the independent quasi-static
        // estimate's order (absorption dominates at x = 1) and by the allocating series of Mie.compute
        assertEquals(2.336321, mie.qExt(), 5e-7);
        assertEquals(Mie.compute(1.5, 1, 1).qExt(), mie.qExt(), 1e-12);
        mie.compute(1.5, 1, 100);             // case 15
        assertEquals(2.097502, mie.qExt(), 5e-7);
        assertEquals(1.283697, mie.qSca(), 5e-7);
        assertEquals(0.850252, mie.asymmetry(), 5e-7);
    }

    @Test
    void smallSphereIsQuasiStatic() {
        // source: Bohren & Huffman (1983) eqs. 5.8 and 5.9: Q_abs = 4x Im((m²−1)/(m²+2)),
        // Q_sca = (8/3) x⁴ |(m²−1)/(m²+2)|², leading order in x
        double mr = 0.05;
        double mi = 4.0; // silver-like, ε = m² ≈ −16 + 0.4i
        double[] f = new double[2];
        double er = mr * mr - mi * mi;
        double ei = 2 * mr * mi;
        Cx.div(er - 1, ei, er + 2, ei, f);
        for (double x : new double[] {1e-3, 1e-2}) {
            mie.compute(mr, mi, x);
            double qa = 4 * x * f[1];
            double qs = 8.0 / 3 * x * x * x * x * (f[0] * f[0] + f[1] * f[1]);
            assertEquals(qa, mie.qAbs(), 0.02 * Math.abs(qa) * x / 1e-2, "x = " + x);
            assertEquals(qs, mie.qSca(), 0.02 * qs * x / 1e-2, "x = " + x);
            // dipole radiation pattern 1 + cos²θ: half forward, half back
            assertEquals(0.5, mie.forwardShare(), 1e-3, "x = " + x);
        }
    }

    @Test
    void largeSphereExtinctionTendsToTwo() {
        // source: Bohren & Huffman (1983) §4.4.4 (extinction paradox): Q_ext → 2 as x → ∞; an absorbing sphere
        // (m = 1.5 + i) damps the ripple, so the approach is monotone (MIEV0 case 16 gives 2.004368 at x = 10⁴)
        double prev = Double.POSITIVE_INFINITY;
        for (double x : new double[] {3, 10, 30, 100}) {
            mie.compute(1.5, 1, x);
            double dev = Math.abs(mie.qExt() - 2);
            assertTrue(dev < prev, "x = " + x + ": |Q_ext − 2| = " + dev);
            prev = dev;
        }
        assertTrue(prev < 0.1, "|Q_ext − 2| at x = 100: " + prev);
    }

    @Test
    void nonAbsorbingSphereConservesEnergyAndMatchesTheReferenceSeries() {
        // source: Bohren & Huffman (1983) ch. 4: for real m, Q_ext = Q_sca (optical theorem with no absorption)
        for (double x : new double[] {0.05, 0.7, 3, 20}) {
            mie.compute(1.9, 0, x);
            assertEquals(mie.qSca(), mie.qExt(), 1e-11 * mie.qExt(), "x = " + x);
            MieResult ref = Mie.compute(1.9, 0.2, x);
            mie.compute(1.9, 0.2, x);
            assertEquals(ref.qExt(), mie.qExt(), 1e-12 * ref.qExt());
            assertEquals(ref.qSca(), mie.qSca(), 1e-12 * ref.qSca());
            assertEquals(ref.g(), mie.asymmetry(), 1e-12);
            assertEquals(ref.a1().re(), mie.aRe(1), 1e-14);
        }
    }

    @Test
    void forwardHemisphereAgreesWithDirectAmplitudeQuadrature() {
        // source: Bohren & Huffman (1983) eq. 4.74 (S₁, S₂) and eq. 4.47 (π_n, τ_n): brute-force integration of
        // |S₁|² + |S₂|² over each hemisphere; the whole sphere gives Q_sca (orthogonality, eq. 4.61)
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(200, 0, 1);
        double[][] cases = {{0.06, 3.9, 0.4}, {0.06, 3.9, 1.5}, {1.5, 1, 3}, {1.33, 0, 8}};
        for (double[] c : cases) {
            mie.compute(c[0], c[1], c[2]);
            int n = mie.terms();
            double[] pi = new double[n + 1];
            double[] tau = new double[n + 1];
            double fwd = 0;
            double back = 0;
            for (int q = 0; q < rule.getNumberOfPoints(); q++) {
                double mu = rule.getPoint(q);
                fwd += rule.getWeight(q) * intensity(mu, n, pi, tau);
                back += rule.getWeight(q) * intensity(-mu, n, pi, tau);
            }
            double x2 = c[2] * c[2];
            assertEquals(fwd / x2, mie.qForward(), 1e-10 * mie.qSca(), "m, x = " + java.util.Arrays.toString(c));
            assertEquals(mie.qSca(), (fwd + back) / x2, 1e-10 * mie.qSca());
            assertEquals(mie.qSca(), mie.hemisphere(true), 1e-11 * mie.qSca());
            assertTrue(mie.forwardShare() > 0.5 || c[2] < 1, "larger spheres scatter forward");
        }
    }

    private double intensity(double mu, int n, double[] pi, double[] tau) {
        MieSeries.angular(mu, n, pi, tau);
        double s1r = 0;
        double s1i = 0;
        double s2r = 0;
        double s2i = 0;
        for (int k = 1; k <= n; k++) {
            double c = (2.0 * k + 1) / (k * (k + 1.0));
            s1r += c * (mie.aRe(k) * pi[k] + mie.bRe(k) * tau[k]);
            s1i += c * (mie.aIm(k) * pi[k] + mie.bIm(k) * tau[k]);
            s2r += c * (mie.aRe(k) * tau[k] + mie.bRe(k) * pi[k]);
            s2i += c * (mie.aIm(k) * tau[k] + mie.bIm(k) * pi[k]);
        }
        return s1r * s1r + s1i * s1i + s2r * s2r + s2i * s2i;
    }
}
