package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.junit.jupiter.api.Test;

class MetalPermittivityTest {
    private static final double EP_AG = 9.01;
    private static final double G0_AG = 0.021;
    private static final double VF_AG = 1.39e6;

    @Test
    void infiniteMeanFreePathReturnsBulkExactly() {
        // source: model document 4.1, check "ℓ → ∞ returns the bulk table exactly"
        NkTable ag = MaterialLibrary.bundled().get("ag-johnson-christy");
        double[] out = new double[2];
        for (double lam = 300; lam <= 900; lam += 7.3) {
            double n = ag.n(lam);
            double k = ag.k(lam);
            double re = n * n - k * k;
            double im = 2 * n * k;
            MetalPermittivity.sizeCorrected(lam, re, im, Double.POSITIVE_INFINITY, EP_AG, G0_AG, VF_AG, 1, out);
            assertEquals(re, out[0], 0);
            assertEquals(im, out[1], 0);
        }
    }

    @Test
    void surfaceDampingAtTenNanometres() {
        // source: model document 4.1: ħ v_F/ℓ is 0.069 eV at r = 10 nm, with ℓ = 4V/S = 4r/3 and
        // v_F(Ag) = 1.39e6 m/s (Kittel, Introduction to Solid State Physics)
        double l = MetalPermittivity.meanFreePath(10, 10, 10);
        assertEquals(40.0 / 3, l, 0);
        assertEquals(0.069, MetalPermittivity.surfaceDampingEv(l, VF_AG, 1), 0.0005);
    }

    @Test
    void correctionIsTheDrudeDifference() {
        // source: Kreibig & Vollmer (1995): Δε = ε_D(γ₀ + Δγ) − ε_D(γ₀), ε_D = −ω_p²/(ω(ω + iγ));
        // evaluated here by two complex divisions and compared with the cancellation-free form
        double lam = 420;
        double e = MetalPermittivity.photonEnergyEv(lam);
        double l = 8;
        double dg = MetalPermittivity.surfaceDampingEv(l, VF_AG, 1.2);
        Complex d0 = new Complex(-EP_AG * EP_AG, 0).div(new Complex(e * e, e * G0_AG));
        Complex d1 = new Complex(-EP_AG * EP_AG, 0).div(new Complex(e * e, e * (G0_AG + dg)));
        Complex diff = d1.minus(d0);
        double[] out = new double[2];
        MetalPermittivity.sizeCorrected(lam, -5, 0.3, l, EP_AG, G0_AG, VF_AG, 1.2, out);
        assertEquals(diff.re(), out[0] + 5, 1e-12);
        assertEquals(diff.im(), out[1] - 0.3, 1e-12);
        assertTrue(out[1] > 0.3, "more damping must add loss");
        // photon energy: hc = 1239.84198 eV nm (CODATA)
        assertEquals(1239.84198, MetalPermittivity.photonEnergyEv(1), 1e-5);
    }

    @Test
    void correctionGrowsAsTheParticleShrinks() {
        // common practice: surface scattering broadens small-particle resonances (Im ε rises as 1/ℓ)
        double[] out = new double[2];
        double prev = 0;
        for (double r : new double[] {40, 20, 10, 5, 2}) {
            MetalPermittivity.sizeCorrected(500, -10, 0.4, 4 * r / 3, EP_AG, G0_AG, VF_AG, 1, out);
            assertTrue(out[1] - 0.4 > prev);
            prev = out[1] - 0.4;
        }
    }

    @Test
    void ellipsoidSurfaceAndMeanFreePath() {
        // source: prolate spheroid area S = 2πb²(1 + a/(b e) arcsin e), e² = 1 − b²/a²; oblate
        // S = 2πa²(1 + (1 − e²)/e artanh e), e² = 1 − c²/a² (from memory; cross-checked against direct
        // quadrature of the surface element below)
        double a = 3;
        double b = 1.2;
        double e = Math.sqrt(1 - b * b / (a * a));
        double prolate = 2 * Math.PI * b * b * (1 + a / (b * e) * Math.asin(e));
        assertEquals(prolate, MetalPermittivity.surfaceArea(a, b, b), 1e-12 * prolate);
        double c = 0.7;
        double eo = Math.sqrt(1 - c * c / (a * a));
        double oblate = 2 * Math.PI * a * a * (1 + (1 - eo * eo) / eo * 0.5 * Math.log((1 + eo) / (1 - eo)));
        assertEquals(oblate, MetalPermittivity.surfaceArea(a, a, c), 1e-12 * oblate);
        assertEquals(prolate, surfaceByQuadrature(a, b, b), 1e-9 * prolate);
        assertEquals(oblate, surfaceByQuadrature(a, a, c), 1e-9 * oblate);
        double general = MetalPermittivity.surfaceArea(3, 2, 1);
        assertEquals(surfaceByQuadrature(3, 2, 1), general, 1e-9 * general);
        // ℓ = 4V/S, sphere exactly 4r/3
        assertEquals(4 * 7.5 / 3, MetalPermittivity.meanFreePath(7.5, 7.5, 7.5), 0);
        assertEquals(4 * (4 * Math.PI * 6 / 3) / general, MetalPermittivity.meanFreePath(3, 2, 1), 1e-13);
        assertEquals(4.0 / 3, MetalPermittivity.meanFreePath(1, 1, 1 + 1e-12), 1e-11);
        assertEquals(4 * Math.PI * 25, MetalPermittivity.surfaceArea(5, 5, 5), 1e-12);
    }

    /** S = ∫₀^π ∫₀^{2π} |r_θ × r_φ| dφ dθ for r = (a sinθ cosφ, b sinθ sinφ, c cosθ). */
    private static double surfaceByQuadrature(double a, double b, double c) {
        GaussIntegrator gl = new GaussIntegratorFactory().legendre(32, 0, 1);
        int panels = 16;
        double sum = 0;
        for (int i = 0; i < panels; i++) {
            for (int j = 0; j < panels; j++) {
                for (int p = 0; p < gl.getNumberOfPoints(); p++) {
                    for (int q = 0; q < gl.getNumberOfPoints(); q++) {
                        double th = Math.PI * (i + gl.getPoint(p)) / panels;
                        double ph = 2 * Math.PI * (j + gl.getPoint(q)) / panels;
                        double st = Math.sin(th);
                        double ct = Math.cos(th);
                        double sp = Math.sin(ph);
                        double cp = Math.cos(ph);
                        double nx = b * c * st * st * cp;
                        double ny = a * c * st * st * sp;
                        double nz = a * b * st * ct;
                        sum += gl.getWeight(p) * gl.getWeight(q) * Math.sqrt(nx * nx + ny * ny + nz * nz);
                    }
                }
            }
        }
        return sum * (Math.PI / panels) * (2 * Math.PI / panels);
    }

    @Test
    void plasmaEnergyFit() {
        // common practice: a synthetic Drude table is recovered exactly
        double ep = 8.7;
        double g0 = 0.03;
        double epsInf = 4.2;
        int rows = 40;
        double[] wl = new double[rows];
        double[] n = new double[rows];
        double[] k = new double[rows];
        for (int i = 0; i < rows; i++) {
            wl[i] = 500 + 30 * i;
            double e = MetalPermittivity.photonEnergyEv(wl[i]);
            Complex eps = new Complex(epsInf, 0).minus(new Complex(ep * ep, 0).div(new Complex(e * e, e * g0)));
            Complex nk = eps.sqrt();
            n[i] = nk.re();
            k[i] = nk.im();
        }
        NkTable drude = new NkTable("drude", "synthetic", "test", wl, n, k);
        assertEquals(ep, MetalPermittivity.fitPlasmaEnergy(drude, 500, 2000, g0), 1e-9);
        // source: model document 4.1 (Ordal et al., Appl. Opt. 24, 4493 (1985)): ħω_p 9.01 eV (Ag), 9.03 eV
        // (Au); a fit to the Johnson & Christy tables lands within 3 %
        NkTable ag = MaterialLibrary.bundled().get("ag-johnson-christy");
        NkTable au = MaterialLibrary.bundled().get("au-johnson-christy");
        assertEquals(9.01, MetalPermittivity.fitPlasmaEnergy(ag, 600, 1900, 0.021), 0.03 * 9.01);
        assertEquals(9.03, MetalPermittivity.fitPlasmaEnergy(au, 700, 1900, 0.071), 0.03 * 9.03);
    }
}
