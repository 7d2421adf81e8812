package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class MieTest {

    @Test
    void bohrenHuffmanWorkedExample() {
        // source: Bohren & Huffman, Absorption and Scattering of Light by Small Particles (1983), app. A
        // worked example (m = 1.55, r = 0.525 µm, λ = 0.6328 µm), values as quoted in the model document 4.2.
        // x = 2π·0.525/0.6328 evaluates to 5.2128197, not the document's decimal 5.212822: at the
        // document's decimal the series gives 3.10542 / 2.92533, so the exact expression is used here.
        double x = 2 * Math.PI * 0.525 / 0.6328;
        MieResult r = Mie.compute(1.55, 0, x);
        assertEquals(3.10543, r.qExt(), 5e-6);
        assertEquals(3.10543, r.qSca(), 5e-6);
        assertEquals(2.92534, r.qBack(), 5e-6);
        assertEquals(0.63314, r.g(), 5e-6);
    }

    @Test
    void bohrenHuffmanAtRoundedSizeParameter() {
        // source: model document 4.2 (Bohren & Huffman 1983, app. A, evaluated at x = 5.213 exactly)
        MieResult r = Mie.compute(1.55, 0, 5.213);
        assertEquals(3.10500, r.qExt(), 5e-6);
        assertEquals(2.92421, r.qBack(), 5e-6);
        assertEquals(0.63310, r.g(), 5e-6);
    }

    @Test
    void realIndexDoesNotAbsorb() {
        // source: Bohren & Huffman (1983) ch. 4: for real m, Q_abs = 0, i.e. Re a_n = |a_n|², Re b_n = |b_n|²
        for (double x : new double[] {0.1, 1, 3, 12, 40}) {
            MieResult r = Mie.compute(1.33, 0, x);
            assertEquals(r.qExt(), r.qSca(), 1e-12 * r.qExt(), "x = " + x);
        }
    }

    @Test
    void termCountFollowsWiscombeBohrenHuffman() {
        // source: Bohren & Huffman (1983) app. A: N = x + 4x^{1/3} + 2
        assertEquals(14, Mie.terms(2 * Math.PI * 0.525 / 0.6328));
        assertEquals(Mie.terms(5.212822), Mie.compute(1.55, 0, 5.212822).terms());
    }

    @Test
    void smallSphereDipoleIsTheQuasiStaticSphere() {
        // source: Bohren & Huffman (1983) eq. 5.7: a_1 → −i(2x³/3)(m² − 1)/(m² + 2) for x → 0,
        // so 6π i a_1/k³ → 4πr³(ε − ε_h)/(ε + 2ε_h)
        double[] out = new double[2];
        double lambda = 500;
        double r = 0.05;
        double epsRe = -9.5;
        double epsIm = 0.35;
        double hRe = 2.25;
        Polarizability.mieDipole(r, lambda, epsRe, epsIm, hRe, 0, out);
        double[] qs = new double[2];
        Polarizability.quasiStatic(4 * Math.PI * r * r * r / 3, 1.0 / 3, epsRe, epsIm, hRe, 0, qs);
        double qsIm = qs[1];
        assertEquals(qs[0], out[0], 1e-5 * Math.hypot(qs[0], qs[1]));
        assertEquals(qs[1], out[1], 1e-5 * Math.hypot(qs[0], qs[1]));
        // the deviation is the O(x²) size correction: ten times smaller r, about a hundred times smaller
        double dev = Math.hypot(out[0] - qs[0], out[1] - qs[1]) / Math.hypot(qs[0], qs[1]);
        double rs = r / 10;
        Polarizability.mieDipole(rs, lambda, epsRe, epsIm, hRe, 0, out);
        Polarizability.quasiStatic(4 * Math.PI * rs * rs * rs / 3, 1.0 / 3, epsRe, epsIm, hRe, 0, qs);
        double devSmall = Math.hypot(out[0] - qs[0], out[1] - qs[1]) / Math.hypot(qs[0], qs[1]);
        assertEquals(100, dev / devSmall, 2);
        // and the full series' extinction equals k Im α (dipole dominates)
        double nh = 1.5;
        double k = 2 * Math.PI * nh / lambda;
        Complex m = new Complex(epsRe, epsIm).sqrt().div(nh);
        MieResult full = Mie.compute(m.re(), m.im(), k * r);
        assertEquals(k * qsIm, full.qExt() * Math.PI * r * r, 1e-5 * k * qsIm);
    }

    @Test
    void allocationFreeDipoleMatchesTheSeries() {
        // common practice: two evaluations of the same a_1 (downward-recurrence D_1 and the cot form) agree
        double[] out = new double[2];
        double[][] cases = {{0.05, 4.0, 0.3}, {1.5, 0.1, 0.05}, {0.2, 3.2, 1.4}, {0.3, 2.0, 0.01}, {1.2, 0.0, 2.5},
            {0.04, 9.0, 5.0}};
        for (double[] c : cases) {
            MieResult r = Mie.compute(c[0], c[1], c[2]);
            Mie.a1(c[0], c[1], c[2], out);
            Complex a1 = r.a1();
            assertEquals(a1.re(), out[0], 1e-11 * a1.abs(), "case " + c[0] + "," + c[1] + "," + c[2]);
            assertEquals(a1.im(), out[1], 1e-11 * a1.abs(), "case " + c[0] + "," + c[1] + "," + c[2]);
        }
    }

    @Test
    void largeMetallicSphereStaysFinite() {
        // common practice: the downward D_n recurrence is stable for strongly absorbing spheres;
        // extinction efficiency of a large absorbing sphere tends to 2 (extinction paradox, B&H ch. 4.6)
        MieResult r = Mie.compute(0.2, 6.0, 200);
        MieResult big = Mie.compute(0.2, 6.0, 3000);
        assertTrue(Double.isFinite(r.qExt()) && Double.isFinite(big.qExt()));
        assertTrue(Math.abs(big.qExt() - 2) < Math.abs(r.qExt() - 2));
        assertEquals(2.0, big.qExt(), 0.05);
    }
}
