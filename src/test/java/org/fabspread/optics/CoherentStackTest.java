package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;
import java.util.function.DoubleUnaryOperator;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;

class CoherentStackTest {

    /** |(N1 − N2)/(N1 + N2)|² with commons-math complex arithmetic, independent of the solver. */
    private static double fresnel(Complex n1, Complex n2) {
        Complex r = n1.subtract(n2).divide(n1.add(n2));
        return r.abs() * r.abs();
    }

    private static double simpson(DoubleUnaryOperator f, double a, double b, int intervals) {
        int n = intervals % 2 == 0 ? intervals : intervals + 1;
        double h = (b - a) / n;
        double s = f.applyAsDouble(a) + f.applyAsDouble(b);
        for (int i = 1; i < n; i++) {
            s += (i % 2 == 1 ? 4 : 2) * f.applyAsDouble(a + i * h);
        }
        return s * h / 3;
    }

    @Test
    void singleInterfaceIsFresnel() {
        CoherentStack cs = new CoherentStack(2);
        double[][] exits = {{1.5, 0}, {2.0, 0.3}, {0.13, 3.9}, {1.0, 0}, {3.5, 0.01}};
        double[] n0s = {1.0, 1.52, 2.1};
        for (double n0 : n0s) {
            for (double[] ex : exits) {
                cs.solve(550, n0, 0, new double[0], new double[0], new double[0], ex[0], ex[1]);
                // source: Born & Wolf, Principles of Optics, ch. 1.5 (normal-incidence Fresnel formulas)
                double expected = fresnel(new Complex(n0, 0), new Complex(ex[0], ex[1]));
                assertEquals(expected, cs.reflectance(), 1e-14);
                assertEquals(expected, IncoherentSubstrate.fresnelNormal(n0, 0, ex[0], ex[1]), 1e-15);
                assertEquals(1.0, cs.reflectance() + cs.transmittance(), 1e-14);
                // a zero-thickness absorbing layer changes nothing
                cs.solve(550, n0, 1, new double[] {0.2}, new double[] {4}, new double[] {0}, ex[0], ex[1]);
                assertEquals(expected, cs.reflectance(), 1e-14);
                assertEquals(0.0, cs.absorptance(0), 0.0);
            }
        }
        // both sides absorbing: the formula is symmetric in the media
        // source: Born & Wolf, Principles of Optics, ch. 1.5
        assertEquals(fresnel(new Complex(1.4, 0.2), new Complex(0.3, 4.1)),
                IncoherentSubstrate.fresnelNormal(0.3, 4.1, 1.4, 0.2), 1e-15);
    }

    @Test
    void quarterWaveLayerIsAntireflecting() {
        CoherentStack cs = new CoherentStack(1);
        double n1 = 1.0;
        double n2 = 2.25;
        double n = Math.sqrt(n1 * n2);
        double lambda = 600;
        double d = lambda / (4 * n);
        // source: Born & Wolf, Principles of Optics, ch. 1.6 (quarter-wave antireflection layer)
        cs.solve(lambda, n1, 1, new double[] {n}, new double[] {0}, new double[] {d}, n2, 0);
        assertEquals(0.0, cs.reflectance(), 1e-28);
        assertEquals(1.0, cs.transmittance(), 1e-14);
        // the same film is a half-wave absentee layer at λ/2: the bare-interface reflectance returns
        // source: Born & Wolf, Principles of Optics, ch. 1.6 (half-wave layers)
        cs.solve(lambda / 2, n1, 1, new double[] {n}, new double[] {0}, new double[] {d}, n2, 0);
        assertEquals(fresnel(new Complex(n1, 0), new Complex(n2, 0)), cs.reflectance(), 1e-14);
    }

    @Test
    void energyClosesOverRandomStacks() {
        MaterialLibrary lib = MaterialLibrary.bundled();
        List<String> ids = lib.ids();
        List<String> glasses = List.of("soda-lime-rubin", "fused-silica-malitson");
        SplittableRandom rnd = new SplittableRandom(20240601);
        CoherentStack cs = new CoherentStack(8);
        double[] nr = new double[8];
        double[] ni = new double[8];
        double[] d = new double[8];
        double worst = 0;
        double worstGlass = 0;
        for (int trial = 0; trial < 20000; trial++) { // 10^4 with and 10^4 without the substrate
            int count = rnd.nextInt(1, 8);
            boolean substrate = trial % 2 == 1;
            boolean metalExit = trial % 5 == 0;
            NkTable[] tables = new NkTable[count];
            double lo = 0;
            double hi = Double.MAX_VALUE;
            for (int j = 0; j < count; j++) {
                tables[j] = lib.get(ids.get(rnd.nextInt(ids.size())));
                lo = Math.max(lo, tables[j].minWavelength());
                hi = Math.min(hi, tables[j].maxWavelength());
            }
            NkTable glass = lib.get(glasses.get(rnd.nextInt(glasses.size())));
            NkTable exitTable = lib.get("ag-mcpeak");
            if (substrate) {
                lo = Math.max(lo, glass.minWavelength());
                hi = Math.min(hi, glass.maxWavelength());
            }
            if (metalExit) {
                lo = Math.max(lo, exitTable.minWavelength());
                hi = Math.min(hi, exitTable.maxWavelength());
            }
            if (!(hi > lo)) {
                trial--;
                continue;
            }
            double lambda = lo + (hi - lo) * rnd.nextDouble();
            for (int j = 0; j < count; j++) {
                nr[j] = tables[j].n(lambda);
                ni[j] = tables[j].k(lambda);
                d[j] = rnd.nextInt(20) == 0 ? 0.0 : 500 * rnd.nextDouble();
            }
            double exRe = metalExit ? exitTable.n(lambda) : 1;
            double exIm = metalExit ? exitTable.k(lambda) : 0;
            double n0 = substrate ? glass.n(lambda) : 1;
            cs.solve(lambda, n0, count, nr, ni, d, exRe, exIm);
            double sum = cs.reflectance() + cs.transmittance();
            double sumA = 0;
            for (int j = 0; j < count; j++) {
                double a = cs.absorptance(j);
                assertTrue(a >= 0, () -> "negative absorptance " + a);
                sumA += a;
            }
            assertTrue(cs.reflectance() >= 0 && cs.transmittance() >= 0);
            // source: energy conservation (Poynting's theorem), device-model doc section 2 check
            worst = Math.max(worst, Math.abs(sum + sumA - 1));
            if (substrate) {
                double rAg = IncoherentSubstrate.fresnelNormal(1, 0, glass.n(lambda), glass.k(lambda));
                double tG = IncoherentSubstrate.singlePass(glass.k(lambda), 1e5 + 3e6 * rnd.nextDouble(), lambda);
                double rc = cs.reflectance();
                double f = IncoherentSubstrate.entryFactor(rAg, tG, rc);
                double total = IncoherentSubstrate.totalReflectance(rAg, tG, rc)
                        + IncoherentSubstrate.totalTransmittance(rAg, tG, rc, cs.transmittance())
                        + IncoherentSubstrate.glassAbsorptance(rAg, tG, rc) + f * sumA;
                // source: Pettersson, Roman & Inganäs, J. Appl. Phys. 86, 487 (1999); device-model doc section 3 check
                worstGlass = Math.max(worstGlass, Math.abs(total - 1));
            }
        }
        assertTrue(worst < 1e-10, "worst closure error " + worst);
        assertTrue(worstGlass < 1e-10, "worst closure error with substrate " + worstGlass);
    }

    /** A fixed organic-cell-like stack at 540 nm seen from glass. */
    private static CoherentStack cellAt(double lambda) {
        MaterialLibrary lib = MaterialLibrary.bundled();
        String[] m = {"ito-konig", "zno-stelling", "ptb7-pc71bm-stelling", "moo3-stelling", "ag-johnson-christy"};
        double[] d = {150, 30, 100, 10, 100};
        double[] nr = new double[m.length];
        double[] ni = new double[m.length];
        for (int j = 0; j < m.length; j++) {
            nr[j] = lib.get(m[j]).n(lambda);
            ni[j] = lib.get(m[j]).k(lambda);
        }
        CoherentStack cs = new CoherentStack(m.length);
        cs.solve(lambda, lib.get("soda-lime-rubin").n(lambda), m.length, nr, ni, d, 1, 0);
        return cs;
    }

    @Test
    void depthProfileIntegratesToAbsorptance() {
        for (double lambda : new double[] {350, 450, 540, 640, 760}) {
            CoherentStack cs = cellAt(lambda);
            for (int j = 0; j < cs.count(); j++) {
                final int layer = j;
                double d = cs.thickness(j);
                double a = cs.absorptance(j);
                double quad = simpson(x -> cs.absorptionRate(layer, x), 0, d, 4000);
                // common practice: the closed form and a fine Simpson quadrature of the same profile agree
                assertEquals(1.0, cs.absorbedWeighted(j, 0) / a, 1e-12);
                assertEquals(1.0, quad / a, 1e-6);
                for (double s : new double[] {-0.2, -0.03, -0.001, 0.004, 0.02}) {
                    double q = simpson(x -> cs.absorptionRate(layer, x) * Math.exp(s * x), 0, d, 4000);
                    assertEquals(1.0, cs.absorbedWeighted(j, s) / q, 1e-6, "layer " + j + " s " + s);
                    double qb = simpson(x -> cs.absorptionRate(layer, x) * Math.exp(s * (d - x)), 0, d, 4000);
                    assertEquals(1.0, cs.absorbedWeightedFromBack(j, s) / qb, 1e-6, "layer " + j + " s " + s);
                }
                // the degenerate exponents s = ±α (an exponential of the field cancels)
                double alpha = cs.absorptionCoefficient(j);
                for (double s : new double[] {alpha, -alpha}) {
                    double q = simpson(x -> cs.absorptionRate(layer, x) * Math.exp(s * x), 0, d, 4000);
                    assertEquals(1.0, cs.absorbedWeighted(j, s) / q, 1e-6);
                    // continuity across the degenerate point
                    assertEquals(cs.absorbedWeighted(j, s), cs.absorbedWeighted(j, s * (1 + 1e-9)),
                            1e-7 * Math.abs(cs.absorbedWeighted(j, s)));
                }
            }
        }
    }

    @Test
    void fieldProfileMatchesClosedFormIntensity() {
        CoherentStack cs = cellAt(540);
        // a(x) = (4π n k/λ)|E|²/n0 (device-model doc section 2): check the prefactor against fieldIntensity
        MaterialLibrary lib = MaterialLibrary.bundled();
        double n = lib.get("ptb7-pc71bm-stelling").n(540);
        double k = lib.get("ptb7-pc71bm-stelling").k(540);
        double n0 = lib.get("soda-lime-rubin").n(540);
        // source: Pettersson, Roman & Inganäs, J. Appl. Phys. 86, 487 (1999), eq. for the time-averaged absorbed power
        assertEquals(4 * Math.PI * n * k / 540 * cs.fieldIntensity(2, 37.0) / n0, cs.absorptionRate(2, 37.0), 1e-15);
        // the field is continuous across an interface (tangential E)
        // source: Born & Wolf, Principles of Optics, ch. 1.1 (boundary conditions)
        assertEquals(cs.fieldIntensity(1, 30), cs.fieldIntensity(2, 0), 1e-12);
        assertEquals(cs.fieldIntensity(2, 100), cs.fieldIntensity(3, 0), 1e-12);
        assertThrows(IllegalArgumentException.class, () -> cs.fieldIntensity(2, 101));
    }

    @Test
    void weaklyAbsorbingLimit() {
        CoherentStack cs = new CoherentStack(1);
        for (double k : new double[] {1e-14, 1e-9, 1e-5}) {
            cs.solve(500, 1, 1, new double[] {1.8}, new double[] {k}, new double[] {220}, 1.5, 0);
            double quad = simpson(x -> cs.absorptionRate(0, x), 0, 220, 4000);
            // common practice: closed form against quadrature, as k → 0
            assertEquals(1.0, cs.absorptance(0) / quad, 1e-9);
            assertEquals(1.0, cs.reflectance() + cs.transmittance() + cs.absorptance(0), 1e-13);
            double s = 0.01;
            double qs = simpson(x -> cs.absorptionRate(0, x) * Math.exp(s * x), 0, 220, 4000);
            assertEquals(1.0, cs.absorbedWeighted(0, s) / qs, 1e-9);
        }
        cs.solve(500, 1, 1, new double[] {1.8}, new double[] {0}, new double[] {220}, 1.5, 0);
        assertEquals(0.0, cs.absorptance(0), 0.0);
        assertEquals(1.0, cs.reflectance() + cs.transmittance(), 1e-14);
    }

    @Test
    void thickAbsorberTendsToBeerLambert() {
        NkTable t = MaterialLibrary.bundled().get("ptb7-pc71bm-stelling");
        double lambda = 620;
        double n = t.n(lambda);
        double k = t.k(lambda);
        double alpha = 4 * Math.PI * k / lambda;
        double d = 40 / alpha; // e^{-40} single pass
        CoherentStack cs = new CoherentStack(1);
        cs.solve(lambda, 1, 1, new double[] {n}, new double[] {k}, new double[] {d}, 1, 0);
        double r = fresnel(new Complex(1, 0), new Complex(n, k));
        // source: Beer–Lambert law with Fresnel loss at the entrance (Born & Wolf ch. 1.5; Pettersson et al. 1999)
        assertEquals(r, cs.reflectance(), 1e-12);
        assertEquals(1 - r, cs.absorptance(0), 1e-12);
        assertEquals(alpha * (1 - r), cs.absorptionRate(0, 0), 1e-12 * alpha);
        for (double x : new double[] {1 / alpha, 5 / alpha, 12 / alpha}) {
            // the profile decays as e^{-4πkx/λ}
            assertEquals(Math.exp(-alpha * x), cs.absorptionRate(0, x) / cs.absorptionRate(0, 0), 1e-12);
        }
    }

    @Test
    void bulkSilverIsFresnel() {
        for (String id : new String[] {"ag-johnson-christy", "ag-mcpeak"}) {
            NkTable ag = MaterialLibrary.bundled().get(id);
            CoherentStack cs = new CoherentStack(1);
            for (double lambda : new double[] {320, 400, 550, 700, 1000}) {
                double n = ag.n(lambda);
                double k = ag.k(lambda);
                // source: Born & Wolf, Principles of Optics, ch. 1.5 (Fresnel) with the table's n, k
                double expected = fresnel(new Complex(1, 0), new Complex(n, k));
                cs.solve(lambda, 1, 0, new double[0], new double[0], new double[0], n, k);
                assertEquals(expected, cs.reflectance(), 1e-14);
                // a very thick film: 3 µm, field attenuated by e^{-60} or more
                cs.solve(lambda, 1, 1, new double[] {n}, new double[] {k}, new double[] {3000}, 1, 0);
                assertEquals(expected, cs.reflectance(), 1e-12);
                assertEquals(1 - expected, cs.absorptance(0), 1e-12);
            }
        }
    }

    @Test
    void opaqueStacksStayFinite() {
        // twelve 1 µm silver films at 1000 nm: the amplitude grows by e^{535} across the backward sweep,
        // beyond double range without the solver's rescaling
        NkTable ag = MaterialLibrary.bundled().get("ag-johnson-christy");
        double lambda = 1000;
        int count = 12;
        double[] nr = new double[count];
        double[] ni = new double[count];
        double[] d = new double[count];
        java.util.Arrays.fill(nr, ag.n(lambda));
        java.util.Arrays.fill(ni, ag.k(lambda));
        java.util.Arrays.fill(d, 1000);
        CoherentStack cs = new CoherentStack(count);
        cs.solve(lambda, 1, count, nr, ni, d, 1.5, 0);
        // source: Born & Wolf, Principles of Optics, ch. 1.5: an opaque metal reflects as its bulk
        double expected = fresnel(new Complex(1, 0), new Complex(ag.n(lambda), ag.k(lambda)));
        assertEquals(expected, cs.reflectance(), 1e-12);
        assertEquals(1 - expected, cs.absorptance(0), 1e-12);
        assertEquals(0.0, cs.transmittance(), 1e-300);
        for (int j = 1; j < count; j++) {
            assertEquals(0.0, cs.absorptance(j), 1e-30);
            assertTrue(Double.isFinite(cs.fieldIntensity(j, 500)));
        }
        assertThrows(IllegalArgumentException.class,
                () -> cs.solve(lambda, 1, 1, nr, ni, new double[] {1e5}, 1, 0));
    }

    @Test
    void rejectsBadArguments() {
        CoherentStack cs = new CoherentStack(2);
        assertThrows(IllegalArgumentException.class,
                () -> cs.solve(500, 1, 3, new double[3], new double[3], new double[3], 1, 0));
        assertThrows(IllegalStateException.class, cs::reflectance);
    }
}
