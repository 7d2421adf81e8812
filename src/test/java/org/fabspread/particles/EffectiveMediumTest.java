package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class EffectiveMediumTest {
    private static final Complex METAL = new Complex(-9.8, 0.45);
    private static final Complex HOST = new Complex(2.6, 0.0);
    private static final Complex ABSORBER = new Complex(3.4, 0.9);

    /** Textbook Maxwell Garnett for spheres: ε_h(ε + 2ε_h + 2f(ε − ε_h))/(ε + 2ε_h − f(ε − ε_h)). */
    private static Complex textbook(Complex e, Complex h, double f) {
        Complex d = e.minus(h);
        Complex base = e.plus(h.times(2));
        return h.times(base.plus(d.times(2 * f))).div(base.minus(d.times(f)));
    }

    @Test
    void spheresReduceToTheTextbookFormula() {
        // source: Maxwell Garnett, Phil. Trans. R. Soc. A 203, 385 (1904); Bohren & Huffman (1983) ch. 8.5
        double[] alpha = new double[2];
        double[] out = new double[2];
        for (Complex h : new Complex[] {HOST, ABSORBER}) {
            for (double f : new double[] {0.01, 0.1, 0.3, 0.6}) {
                double r = 7;
                double v = 4 * Math.PI * r * r * r / 3;
                double nv = f / v;
                Polarizability.quasiStatic(v, 1.0 / 3, METAL.re(), METAL.im(), h.re(), h.im(), alpha);
                EffectiveMedium.maxwellGarnett(h.re(), h.im(), 1.0 / 3, nv * alpha[0], nv * alpha[1], out);
                Complex mg = textbook(METAL, h, f);
                assertEquals(mg.re(), out[0], 1e-12 * mg.abs());
                assertEquals(mg.im(), out[1], 1e-12 * mg.abs());
                EffectiveMedium.maxwellGarnettClassic(METAL.re(), METAL.im(), h.re(), h.im(), f, 1.0 / 3, out);
                assertEquals(mg.re(), out[0], 1e-12 * mg.abs());
                assertEquals(mg.im(), out[1], 1e-12 * mg.abs());
            }
        }
    }

    @Test
    void alignedEllipsoidsMatchSihvola() {
        // source: Sihvola, Electromagnetic Mixing Formulas and Applications (1999), aligned ellipsoids:
        // ε_eff = ε_h + f ε_h (ε − ε_h)/(ε_h + (1 − f) L (ε − ε_h)); the ensemble form with the quasi-static α
        double[] alpha = new double[2];
        double[] a = new double[2];
        double[] b = new double[2];
        double[] l = Depolarization.factors(9, 6, 3);
        double v = 4 * Math.PI * 9 * 6 * 3 / 3.0;
        for (int i = 0; i < 3; i++) {
            double f = 0.17;
            Polarizability.quasiStatic(v, l[i], METAL.re(), METAL.im(), ABSORBER.re(), ABSORBER.im(), alpha);
            EffectiveMedium.maxwellGarnett(ABSORBER.re(), ABSORBER.im(), l[i], f / v * alpha[0], f / v * alpha[1], a);
            EffectiveMedium.maxwellGarnettClassic(METAL.re(), METAL.im(), ABSORBER.re(), ABSORBER.im(), f, l[i], b);
            assertEquals(b[0], a[0], 1e-12 * Math.hypot(b[0], b[1]));
            assertEquals(b[1], a[1], 1e-12 * Math.hypot(b[0], b[1]));
        }
    }

    @Test
    void diluteLimit() {
        // source: Bohren & Huffman (1983) ch. 8.5: to first order in f,
        // ε_MG = ε_h + 3fε_h(ε − ε_h)/(ε + 2ε_h); the remainder is O(f²)
        double[] out = new double[2];
        Complex first = HOST.times(3).times(METAL.minus(HOST)).div(METAL.plus(HOST.times(2)));
        double prevRatio = 0;
        for (double f : new double[] {1e-3, 1e-4}) {
            EffectiveMedium.maxwellGarnettClassic(METAL.re(), METAL.im(), HOST.re(), HOST.im(), f, 1.0 / 3, out);
            Complex rest = Complex.of(out).minus(HOST).minus(first.times(f));
            double ratio = rest.abs() / (f * f);
            if (prevRatio > 0) {
                assertEquals(prevRatio, ratio, 0.01 * prevRatio);
            }
            prevRatio = ratio;
            // relative size of the remainder: 3ε_h f²β² against 3ε_h fβ, i.e. f|β| ≈ 2.7f here
            assertTrue(rest.abs() < 5 * f * first.abs() * f);
        }
    }

    @Test
    void nothingToMixGivesTheHostExactly() {
        // source: model document 4.4, checks "θ → 0 gives exactly the planar stack; ε = ε_h gives exactly the
        // planar stack" (the effective layer must then be the host itself, bit for bit)
        double[] out = new double[2];
        for (double[] shape : new double[][] {{1, 1}, {1.6, 0.5}}) {
            ParticleEnsemble e = new ParticleEnsemble().setShape(30, 0.3, shape[0], shape[1], 0.0)
                    .setMetal(9.01, 0.021, 1.39e6, 1);
            e.compute(520, METAL.re(), METAL.im(), ABSORBER.re(), ABSORBER.im(), Double.POSITIVE_INFINITY, 0);
            for (int ax = 0; ax < 3; ax++) {
                e.maxwellGarnett(ax, out);
                assertEquals(ABSORBER.re(), out[0], 0);
                assertEquals(ABSORBER.im(), out[1], 0);
                e.bruggeman(ax, out);
                assertEquals(ABSORBER.re(), out[0], 0);
                assertEquals(ABSORBER.im(), out[1], 0);
            }
            // ε = ε_h, no size correction (it would make ε differ from ε_h)
            e.setShape(30, 0.3, shape[0], shape[1], 0.4).setMetal(0, 0, 0, 0);
            e.compute(520, ABSORBER.re(), ABSORBER.im(), ABSORBER.re(), ABSORBER.im(), Double.POSITIVE_INFINITY, 0);
            for (int ax = 0; ax < 3; ax++) {
                e.maxwellGarnett(ax, out);
                assertEquals(ABSORBER.re(), out[0], 0);
                assertEquals(ABSORBER.im(), out[1], 0);
            }
        }
    }

    @Test
    void bruggemanRootIsPhysicalAndSolvesTheEquation() {
        // source: Bruggeman, Ann. Phys. 416, 636 (1935); Sihvola (1999), symmetric rule for aligned ellipsoids
        double[] out = new double[2];
        for (double l : new double[] {0.1, 1.0 / 3, 0.7}) {
            for (double f = 0.05; f < 1; f += 0.1) {
                EffectiveMedium.bruggeman(METAL.re(), METAL.im(), HOST.re(), HOST.im(), f, l, out);
                Complex e = Complex.of(out);
                assertTrue(e.im() >= 0, "Im ε_e >= 0 at f = " + f);
                Complex t1 = METAL.minus(e).times(f).div(e.plus(METAL.minus(e).times(l)));
                Complex t2 = HOST.minus(e).times(1 - f).div(e.plus(HOST.minus(e).times(l)));
                assertTrue(t1.plus(t2).abs() < 1e-12 * (t1.abs() + t2.abs() + 1e-300), "residual at f = " + f);
                // symmetric: exchanging the roles of the two phases gives the same medium
                double[] sw = new double[2];
                EffectiveMedium.bruggeman(HOST.re(), HOST.im(), METAL.re(), METAL.im(), 1 - f, l, sw);
                assertEquals(out[0], sw[0], 1e-10 * e.abs());
                assertEquals(out[1], sw[1], 1e-10 * e.abs());
            }
        }
        EffectiveMedium.bruggeman(METAL.re(), METAL.im(), HOST.re(), HOST.im(), 0, 1.0 / 3, out);
        assertEquals(HOST.re(), out[0], 0);
        EffectiveMedium.bruggeman(METAL.re(), METAL.im(), HOST.re(), HOST.im(), 1, 1.0 / 3, out);
        assertEquals(METAL.re(), out[0], 0);
    }

    @Test
    void bruggemanLimits() {
        // source: Wiener bounds (Sihvola 1999, ch. 6): L = 0 gives the parallel (arithmetic) mean,
        // L = 1 the series (harmonic) mean; dilute Bruggeman agrees with Maxwell Garnett to first order in f
        double[] out = new double[2];
        double f = 0.3;
        EffectiveMedium.bruggeman(METAL.re(), METAL.im(), HOST.re(), HOST.im(), f, 0, out);
        Complex par = METAL.times(f).plus(HOST.times(1 - f));
        assertEquals(par.re(), out[0], 1e-12);
        assertEquals(par.im(), out[1], 1e-12);
        EffectiveMedium.bruggeman(METAL.re(), METAL.im(), HOST.re(), HOST.im(), f, 1, out);
        Complex ser = Complex.ONE.div(Complex.ONE.div(METAL).times(f).plus(Complex.ONE.div(HOST).times(1 - f)));
        assertEquals(ser.re(), out[0], 1e-12);
        assertEquals(ser.im(), out[1], 1e-12);
        double small = 1e-4;
        double[] mg = new double[2];
        EffectiveMedium.bruggeman(METAL.re(), METAL.im(), HOST.re(), HOST.im(), small, 1.0 / 3, out);
        EffectiveMedium.maxwellGarnettClassic(METAL.re(), METAL.im(), HOST.re(), HOST.im(), small, 1.0 / 3, mg);
        double shift = Complex.of(mg).minus(HOST).abs();
        assertTrue(Complex.of(out).minus(Complex.of(mg)).abs() < 0.01 * shift);
    }

    @Test
    void inclusionPermittivityReproducesMaxwellGarnett() {
        // common practice: the equivalent inclusion of an ensemble, mixed by Maxwell Garnett at the same f,
        // gives back the ensemble's ε_eff
        double[] inc = new double[2];
        double[] a = new double[2];
        double[] b = new double[2];
        double f = 0.12;
        double l = 0.27;
        double nvAr = 0.31;
        double nvAi = 0.42;
        EffectiveMedium.inclusionPermittivity(HOST.re(), HOST.im(), l, nvAr, nvAi, f, inc);
        EffectiveMedium.maxwellGarnettClassic(inc[0], inc[1], HOST.re(), HOST.im(), f, l, a);
        EffectiveMedium.maxwellGarnett(HOST.re(), HOST.im(), l, nvAr, nvAi, b);
        assertEquals(b[0], a[0], 1e-12);
        assertEquals(b[1], a[1], 1e-12);
    }

    @Test
    void denseWarning() {
        // source: model document 4.4: warn when f > 0.3
        assertTrue(EffectiveMedium.isDense(0.31));
        assertFalse(EffectiveMedium.isDense(0.3));
        assertTrue(ParticleEnsemble.geometry(40, 0.1, 1, 1, 0.6).dense());
        assertFalse(ParticleEnsemble.geometry(40, 0.1, 1, 1, 0.2).dense());
    }
}
