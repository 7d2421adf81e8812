package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.junit.jupiter.api.Test;

class DipoleTableTest {
    private static final int NW = 121;

    /** Ag (Johnson & Christy) with its size correction, in a host given by an n,k table or a constant index. */
    private static DipoleTable table(String hostId, double hostN, double minD, double maxD, double step) {
        NkTable ag = MaterialLibrary.bundled().get("ag-johnson-christy");
        NkTable h = hostId == null ? null : MaterialLibrary.bundled().get(hostId);
        double[] lam = new double[NW];
        double[] er = new double[NW];
        double[] ei = new double[NW];
        double[] hr = new double[NW];
        double[] hi = new double[NW];
        for (int i = 0; i < NW; i++) {
            lam[i] = 320 + 4 * i;
            double n = ag.n(lam[i]);
            double k = ag.k(lam[i]);
            er[i] = n * n - k * k;
            ei[i] = 2 * n * k;
            double hn = h == null ? hostN : h.n(lam[i]);
            double hk = h == null ? 0 : h.k(lam[i]);
            hr[i] = hn * hn - hk * hk;
            hi[i] = 2 * hn * hk;
        }
        // source: Kreibig & Vollmer, Optical Properties of Metal Clusters (1995), Ag free-electron parameters
        return DipoleTable.of(lam, er, ei, hr, hi, 9.01, 0.018, 1.39e6, 1, minD, maxD, step);
    }

    /** Largest interpolation error relative to the wavelength's largest exact |α| (and σ_abs) over the range. */
    private static double[] maxError(DipoleTable t, int samples, long seed) {
        ParticleEnsemble one = new ParticleEnsemble(1).setMetal(9.01, 0.018, 1.39e6, 1);
        SplittableRandom rnd = new SplittableRandom(seed);
        double lo = Math.log(t.minDiameter());
        double hi = Math.log(t.maxDiameter());
        double[] scaleA = new double[NW];
        double[] scaleM = new double[NW];
        double[] scaleS = new double[NW];
        for (int g = 0; g <= 200; g++) {
            double d = Math.exp(lo + (hi - lo) * g / 200);
            one.setShape(d, 0, 1, 1, 0);
            for (int i = 0; i < NW; i++) {
                one.compute(t.wavelength(i), t.metalRe(i), t.metalIm(i), t.hostRe(i), t.hostIm(i),
                        Double.POSITIVE_INFINITY, 0);
                scaleA[i] = Math.max(scaleA[i], Math.hypot(one.alphaRe(0), one.alphaIm(0)));
                scaleM[i] = Math.max(scaleM[i], one.metalAbsorption(0));
                scaleS[i] = Math.max(scaleS[i], one.scattering(0));
            }
        }
        double[] out = new double[DipoleTable.QUANTITIES];
        double ea = 0;
        double em = 0;
        double eaLocal = 0;
        double es = 0;
        for (int s = 0; s < samples; s++) {
            double d = Math.exp(lo + (hi - lo) * rnd.nextDouble());
            one.setShape(d, 0, 1, 1, 0);
            for (int i = 0; i < NW; i++) {
                one.compute(t.wavelength(i), t.metalRe(i), t.metalIm(i), t.hostRe(i), t.hostIm(i),
                        Double.POSITIVE_INFINITY, 0);
                t.at(i, d, out);
                double da = Math.hypot(out[0] - one.alphaRe(0), out[1] - one.alphaIm(0));
                ea = Math.max(ea, da / scaleA[i]);
                eaLocal = Math.max(eaLocal, da / Math.hypot(one.alphaRe(0), one.alphaIm(0)));
                em = Math.max(em, Math.abs(out[2] - one.metalAbsorption(0)) / scaleM[i]);
                es = Math.max(es, Math.abs(out[3] - one.scattering(0)) / scaleS[i]);
                es = Math.max(es, Math.abs(out[4] - one.forwardScattering(0)) / scaleS[i]);
            }
        }
        return new double[] {ea, em, eaLocal, es};
    }

    @Test
    void interpolationErrorIsBelowTheStatedBoundAndFallsAsTheFourthPowerOfTheStep() {
        // source: Abramowitz & Stegun, Handbook of Mathematical Functions (1964), 25.2.13: four-point
        // Lagrange interpolation errs by O(h^4); halving the step divides the error by about 16
        for (String host : new String[] {null, "zno-stelling"}) {
            double[] coarse = maxError(table(host, 2.3, 3, 150, 2 * DipoleTable.DEFAULT_STEP), 150, 1);
            double[] fine = maxError(table(host, 2.3, 3, 150, DipoleTable.DEFAULT_STEP), 150, 1);
            assertTrue(fine[0] < 1e-6 && fine[1] < 1e-6 && fine[3] < 1e-6, "alpha " + fine[0] + ", metal " + fine[1]
                    + ", scattering " + fine[3] + " in " + host);
            double ratio = coarse[0] / fine[0];
            assertTrue(ratio > 8 && ratio < 32, "error ratio on halving the step " + ratio);
        }
        double[] air = maxError(table(null, 1.0, 3, 150, DipoleTable.DEFAULT_STEP), 150, 2);
        assertTrue(air[0] < 1e-6 && air[1] < 1e-6, "in air: " + air[0] + ", " + air[1]);
    }

    @Test
    void gridPointsHoldTheExactValues() {
        // common practice: an interpolating table reproduces its nodes
        DipoleTable t = table("zno-stelling", 0, 10, 40, DipoleTable.DEFAULT_STEP);
        ParticleEnsemble one = new ParticleEnsemble(1).setMetal(9.01, 0.018, 1.39e6, 1);
        double[] out = new double[DipoleTable.QUANTITIES];
        // a grid point: exp(ln 10 + 20 steps)
        double d = Math.exp(Math.log(10) + 20 * t.step());
        one.setShape(d, 0, 1, 1, 0);
        for (int i = 0; i < NW; i += 10) {
            one.compute(t.wavelength(i), t.metalRe(i), t.metalIm(i), t.hostRe(i), t.hostIm(i), Double.POSITIVE_INFINITY, 0);
            t.at(i, d, out);
            assertEquals(one.alphaRe(0), out[0], 1e-12 * Math.abs(one.alphaRe(0)) + 1e-15);
            assertEquals(one.alphaIm(0), out[1], 1e-12 * Math.abs(one.alphaIm(0)));
            assertEquals(one.metalAbsorption(0), out[2], 1e-12 * one.metalAbsorption(0));
            assertEquals(one.scattering(0), out[3], 1e-12 * one.scattering(0));
            assertEquals(one.forwardScattering(0), out[4], 1e-12 * one.scattering(0));
        }
        assertTrue(t.covers(10) && t.covers(40));
        assertFalse(t.covers(9.9) || t.covers(41));
        assertThrows(IllegalArgumentException.class, () -> t.at(0, 5, out));
        assertThrows(IllegalArgumentException.class, () -> DipoleTable.of(new double[1], new double[1], new double[1],
                new double[1], new double[1], 9, 0.02, 1.4e6, 1, 20, 10));
    }

    @Test
    void ensembleReadsTheTableOnlyWhereItApplies() {
        // common practice: an accelerated path is held to the exact one and used only where it is exact in kind
        DipoleTable t = table("zno-stelling", 0, 4, 120, DipoleTable.DEFAULT_STEP);
        ParticleEnsemble fast = new ParticleEnsemble().setMetal(9.01, 0.018, 1.39e6, 1);
        ParticleEnsemble exact = new ParticleEnsemble().setMetal(9.01, 0.018, 1.39e6, 1);
        fast.setShape(20, 0.2, 1, 1, 0.06);
        exact.setShape(20, 0.2, 1, 1, 0.06);
        assertTrue(fast.attach(t));
        for (int i = 0; i < NW; i++) {
            fast.compute(i, 10, 0);
            exact.compute(t.wavelength(i), t.metalRe(i), t.metalIm(i), t.hostRe(i), t.hostIm(i), 10, 0);
            double a = Math.hypot(exact.alphaRe(0), exact.alphaIm(0));
            for (int pol = 0; pol < 3; pol++) {
                assertEquals(exact.alphaRe(pol), fast.alphaRe(pol), 1e-6 * a);
                assertEquals(exact.alphaIm(pol), fast.alphaIm(pol), 1e-6 * a);
                assertEquals(exact.metalAbsorption(pol), fast.metalAbsorption(pol), 1e-6 * exact.metalAbsorption(pol));
                assertEquals(exact.scattering(pol), fast.scattering(pol), 3e-6 * exact.scattering(pol));
                assertEquals(exact.nearFieldHost(pol), fast.nearFieldHost(pol), 3e-6 * exact.nearFieldHost(pol));
                assertEquals(exact.nearFieldNeighbour(pol), fast.nearFieldNeighbour(pol),
                        3e-6 * exact.nearFieldNeighbour(pol));
            }
            assertEquals(exact.wavelength(), fast.wavelength(), 0.0);
            assertEquals(exact.hostIm(), fast.hostIm(), 0.0);
        }
        // not a sphere, another metal, a node outside the range: nothing attached
        fast.setShape(20, 0.2, 1.5, 1, 0.06);
        assertFalse(fast.attach(t));
        assertThrows(IllegalStateException.class, () -> fast.compute(0, 10, 0));
        fast.setShape(20, 0.2, 1, 1, 0.06).setMetal(9.01, 0.02, 1.39e6, 1);
        assertFalse(fast.attach(t));
        fast.setMetal(9.01, 0.018, 1.39e6, 1).setShape(20, 0.5, 1, 1, 0.06);
        assertFalse(fast.attach(t), "CV 0.5 puts the outer nodes beyond 4 .. 120 nm");
        fast.setShape(20, 0.2, 1, 1, 0.06);
        assertTrue(fast.attach(t));
        fast.setShape(21, 0.2, 1, 1, 0.06);
        assertFalse(fast.tabulated(), "a new shape ends the attachment");
    }
}
