package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.junit.jupiter.api.Test;

/** The ensemble's full-series default for spheres: where the dipole parts from it, and the absorbing host. */
class FullMieEnsembleTest {
    private static final NkTable AG = MaterialLibrary.bundled().get("ag-johnson-christy");

    /** Worst |σ_ext,dipole − σ_ext,full|/σ_ext,full over 320–800 nm, bulk Ag (Johnson &amp; Christy) in n = 1.5. */
    private static double parting(double d) {
        double worst = 0;
        ParticleEnsemble full = new ParticleEnsemble(1).setShape(d, 0, 1, 1, 0);
        ParticleEnsemble dip = new ParticleEnsemble(1).setShape(d, 0, 1, 1, 0)
                .setMethod(Polarizability.Method.MIE_DIPOLE);
        for (double lam = 320; lam <= 800; lam += 4) {
            double n = AG.n(lam);
            double k = AG.k(lam);
            full.compute(lam, n * n - k * k, 2 * n * k, 2.25, 0, Double.POSITIVE_INFINITY, 0);
            dip.compute(lam, n * n - k * k, 2 * n * k, 2.25, 0, Double.POSITIVE_INFINITY, 0);
            double ef = full.metalAbsorption(0) + full.scattering(0);
            double ed = dip.metalAbsorption(0) + dip.scattering(0);
            worst = Math.max(worst, Math.abs(ed - ef) / ef);
        }
        return worst;
    }

    @Test
    void dipoleAndFullSeriesPartAboveAFewNanometres() {
        // source: Bohren & Huffman (1983) §5.2: the dipole is the leading term, the next orders (b_1, a_2)
        // are O(x²) smaller, so the gap grows as D². Recorded (bulk Ag in n = 1.5, worst over 320–800 nm, near
        // the quadrupole resonance at 380 nm): 0.60 % at 4 nm, 1.4 % at 6 nm, 3.9 % at 10 nm, 15 % at 20 nm,
        // 26 % at 30 nm; the dipole alone is within 1 % only below about 5 nm here
        assertTrue(parting(4) < 0.01);
        assertTrue(parting(6) > 0.01);
        double r10 = parting(10);
        double r20 = parting(20);
        assertEquals(0.039, r10, 0.004);
        assertEquals(0.153, r20, 0.01);
        // O(x²): doubling D multiplies the gap by about four while it is small
        assertEquals(4, parting(8) / parting(4), 0.5);
    }

    @Test
    void absorbingHostLossTendsToTheLossFreeOneAndIsNeverNegative() {
        // source: model document 4.2 (internal dissipation): a host whose Im ε vanishes recovers the real-host
        // loss σ_ext − σ_sca of the full series; the loss is ≥ 0 at every wavelength and host loss
        ParticleEnsemble e = new ParticleEnsemble(1).setShape(60, 0, 1, 1, 0).setMetal(9.01, 0.018, 1.39e6, 1);
        for (double lam = 340; lam <= 800; lam += 20) {
            double n = AG.n(lam);
            double k = AG.k(lam);
            double er = n * n - k * k;
            double ei = 2 * n * k;
            e.compute(lam, er, ei, 3.5, 0, Double.POSITIVE_INFINITY, 0);
            double real = e.metalAbsorption(0);
            e.compute(lam, er, ei, 3.5, 1e-9, Double.POSITIVE_INFINITY, 0);
            assertEquals(real, e.metalAbsorption(0), 1e-7 * real, "λ " + lam);
            for (double hIm : new double[] {0.05, 0.3, 1.0}) {
                e.compute(lam, er, ei, 3.5, hIm, Double.POSITIVE_INFINITY, 0);
                assertTrue(e.metalAbsorption(0) >= 0 && e.scattering(0) >= 0);
                double s = e.forwardShare(ParticleEnsemble.UNPOLARIZED);
                assertTrue(s > 0 && s < 1);
            }
        }
    }
}
