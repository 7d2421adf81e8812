package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.junit.jupiter.api.Test;

class PolarizabilityTest {
    private static final NkTable AG = MaterialLibrary.bundled().get("ag-johnson-christy");
    private static final NkTable AU = MaterialLibrary.bundled().get("au-johnson-christy");

    /** Extinction spectrum (nm²) of a sphere, bulk ε, on [from, to] in steps of 0.1 nm. */
    private enum Kind { MIE_FULL, MIE_DIPOLE, MLWA }

    private static double sigmaExt(Kind kind, NkTable t, double nh, double r, double lam) {
        double n = t.n(lam);
        double k = t.k(lam);
        double er = n * n - k * k;
        double ei = 2 * n * k;
        double kk = 2 * Math.PI * nh / lam;
        double[] o = new double[2];
        switch (kind) {
            case MIE_FULL:
                return Mie.compute(n / nh, k / nh, kk * r).qExt() * Math.PI * r * r;
            case MIE_DIPOLE:
                Polarizability.mieDipole(r, lam, er, ei, nh * nh, 0, o);
                return Polarizability.extinction(kk, o[0], o[1]);
            default:
                Polarizability.quasiStatic(4 * Math.PI * r * r * r / 3, 1.0 / 3, er, ei, nh * nh, 0, o);
                Polarizability.mlwa(o[0], o[1], kk, r, o);
                return Polarizability.extinction(kk, o[0], o[1]);
        }
    }

    /** {peak wavelength, peak height} on 300–900 nm, 0.1 nm steps. */
    private static double[] peak(Kind kind, NkTable t, double nh, double r) {
        double best = -1;
        double at = 0;
        for (int i = 0; i <= 6000; i++) {
            double lam = 300 + 0.1 * i;
            double s = sigmaExt(kind, t, nh, r, lam);
            if (s > best) {
                best = s;
                at = lam;
            }
        }
        return new double[] {at, best};
    }

    @Test
    void mlwaAgainstMieWithinTheDocumentTolerances() {
        // source: model document 4.2: MLWA vs Mie for spheres is off by ≤ 3.5 nm and ≤ 2 % at r = 10 nm and
        // 8–15 nm, 6–13 % at r = 20 nm (Ag and Au, n_h = 1.5–2); Mie: Bohren & Huffman (1983) app. A;
        // Johnson & Christy bulk tables, no size correction.
        // Measured (peak shift nm / height %):      r = 10          r = 20
        //   Ag n=1.5                               1.5 / 1.91      8.3 / 8.50
        //   Ag n=2.0                               3.6 / 2.22      15.8 / 6.16
        //   Au n=1.5                               0.7 / 2.12      3.4 / 10.07
        //   Au n=2.0                               1.8 / 3.20      8.5 / 12.70
        // The document's bounds hold except where marked EXCEEDS below; those are held to the measured value.
        check(AG, 1.5, 10, 3.5, 0.02);
        check(AG, 1.5, 20, 15, 0.13);
        check(AU, 1.5, 20, 15, 0.13);
        check(AU, 2.0, 20, 15, 0.13);
        // EXCEEDS the document: Ag in n = 2 at r = 10 shifts 3.6 nm (bound 3.5) and is 2.2 % high (bound 2 %)
        checkMeasured(AG, 2.0, 10, 3.6, 0.0222);
        // EXCEEDS the document: Ag in n = 2 at r = 20 shifts 15.8 nm (bound 15)
        checkMeasured(AG, 2.0, 20, 15.8, 0.0616);
        // EXCEEDS the document: Au at r = 10 is 2.1 % (n = 1.5) and 3.2 % (n = 2) high (bound 2 %)
        checkMeasured(AU, 1.5, 10, 0.7, 0.0212);
        checkMeasured(AU, 2.0, 10, 1.8, 0.0320);
        // r = 5: MLWA and Mie agree to well within the r = 10 bounds
        for (NkTable t : new NkTable[] {AG, AU}) {
            for (double nh : new double[] {1.5, 2.0}) {
                check(t, nh, 5, 1.0, 0.01);
            }
        }
    }

    private static void check(NkTable t, double nh, double r, double maxShift, double maxHeight) {
        double[] mie = peak(Kind.MIE_FULL, t, nh, r);
        double[] mlwa = peak(Kind.MLWA, t, nh, r);
        String what = t.id() + " n=" + nh + " r=" + r + ": Mie " + mie[0] + " nm, MLWA " + mlwa[0] + " nm, heights "
                + mie[1] + " / " + mlwa[1];
        assertTrue(Math.abs(mlwa[0] - mie[0]) <= maxShift + 1e-9, what);
        assertTrue(Math.abs(mlwa[1] / mie[1] - 1) <= maxHeight, what);
        // MLWA peaks red of Mie and higher (common practice: it overestimates dynamic depolarisation)
        assertTrue(mlwa[0] >= mie[0], what);
    }

    private static void checkMeasured(NkTable t, double nh, double r, double shift, double height) {
        double[] mie = peak(Kind.MIE_FULL, t, nh, r);
        double[] mlwa = peak(Kind.MLWA, t, nh, r);
        String what = t.id() + " n=" + nh + " r=" + r;
        assertEquals(shift, mlwa[0] - mie[0], 0.15, what);
        assertEquals(height, mlwa[1] / mie[1] - 1, 0.001, what);
    }

    @Test
    void mieDipoleAgainstFullMie() {
        // source: model document 4.2 claims the Mie dipole is within 0.1 % of full Mie extinction up to
        // r = 30 nm; Mie: Bohren & Huffman (1983) app. A. Measured on J&C bulk tables, 350–800 nm:
        // * at the dipole-resonance peak it holds for Ag up to r = 20 nm (0.04–0.05 %), not at r = 30 nm
        //   (0.11 % in n = 1.5, 0.15 % in n = 2); for Au only up to r = 5 nm (0.19 % / 0.10 % at r = 10);
        // * over the whole 350–800 nm grid it fails already at r ≈ 1 nm: the quadrupole resonance of Ag
        //   (near 380 nm in n = 1.5, 430 nm in n = 2) and the Au wings (350 nm, 800 nm), where the dipole
        //   extinction is small, carry a_2 and b_1 terms growing as r².
        assertTrue(dipoleDeviationAtPeak(AG, 1.5, 20) < 1e-3);
        assertTrue(dipoleDeviationAtPeak(AG, 2.0, 20) < 1e-3);
        assertTrue(dipoleDeviationAtPeak(AU, 1.5, 5) < 1e-3);
        assertTrue(dipoleDeviationAtPeak(AU, 2.0, 5) < 1e-3);
        assertTrue(dipoleDeviationAtPeak(AG, 1.5, 30) > 1e-3);
        assertTrue(dipoleDeviationAtPeak(AU, 1.5, 10) > 1e-3);
        assertTrue(maxDipoleDeviation(AG, 1.5, 0.5) < 1e-3);
        assertTrue(maxDipoleDeviation(AU, 1.5, 2) < 1e-3);
        assertTrue(maxDipoleDeviation(AG, 1.5, 30) > 0.5, "quadrupole resonance of a 30 nm Ag sphere");
        assertTrue(maxDipoleDeviation(AG, 2.0, 1) > 1e-3);
        // the deviation is the O(x²) higher-multipole share: quadrupling r multiplies it by about 16
        double d1 = maxDipoleDeviation(AU, 1.5, 1);
        double d4 = maxDipoleDeviation(AU, 1.5, 4);
        assertEquals(16, d4 / d1, 1);
    }

    private static double dipoleDeviationAtPeak(NkTable t, double nh, double r) {
        double[] pk = peak(Kind.MIE_FULL, t, nh, r);
        return Math.abs(sigmaExt(Kind.MIE_DIPOLE, t, nh, r, pk[0]) / pk[1] - 1);
    }

    private static double maxDipoleDeviation(NkTable t, double nh, double r) {
        double max = 0;
        for (double lam = 350; lam <= 800; lam += 1) {
            double full = sigmaExt(Kind.MIE_FULL, t, nh, r, lam);
            max = Math.max(max, Math.abs(sigmaExt(Kind.MIE_DIPOLE, t, nh, r, lam) / full - 1));
        }
        return max;
    }

    @Test
    void largerSphereRedShifts() {
        // common practice: a larger particle red-shifts the plasmon resonance (MLWA and Mie)
        for (Kind kind : new Kind[] {Kind.MIE_FULL, Kind.MLWA, Kind.MIE_DIPOLE}) {
            double prev = 0;
            for (double r : new double[] {5, 15, 25, 35}) {
                double at = peak(kind, AG, 1.5, r)[0];
                assertTrue(at > prev, kind + " r=" + r);
                prev = at;
            }
        }
    }

    @Test
    void internalDissipationEqualsExtinctionMinusScatteringForMlwa() {
        // source: optical theorem with α' = α/(1 − α D), Im D = k³/(6π): k Im α' − k⁴|α'|²/(6π) =
        // −k|α'|² Im(1/α), which equals the internal-dissipation formula of model document 4.2 in a real host
        double[] q = new double[2];
        double[] o = new double[2];
        double v = 4 * Math.PI * 12 * 8 * 5 / 3.0;
        for (double lam = 350; lam <= 800; lam += 25) {
            double n = AG.n(lam);
            double k = AG.k(lam);
            double er = n * n - k * k;
            double ei = 2 * n * k;
            double h = 3.1;
            double kk = Polarizability.wavenumber(lam, h, 0);
            for (double[] axis : new double[][] {{0.2, 12}, {0.35, 8}, {0.45, 5}}) {
                Polarizability.quasiStatic(v, axis[0], er, ei, h, 0, q);
                Polarizability.mlwa(q[0], q[1], kk, axis[1], o);
                double abs = Polarizability.extinction(kk, o[0], o[1]) - Polarizability.scattering(kk, o[0], o[1]);
                double internal = Polarizability.metalAbsorption(lam, v, axis[0], er, ei, h, 0, q[0], q[1], o[0], o[1]);
                assertEquals(abs, internal, 1e-10 * abs, "λ = " + lam);
                // quasi-static: σ_abs = k Im α
                double qsAbs = Polarizability.metalAbsorption(lam, v, axis[0], er, ei, h, 0, q[0], q[1], q[0], q[1]);
                assertEquals(kk * q[1], qsAbs, 1e-10 * qsAbs);
            }
        }
    }

    @Test
    void mieDipoleAbsorptionIsExactInRealHostAndContinuous() {
        // source: Bohren & Huffman (1983) eq. 4.61–4.62, n = 1 electric term: σ_abs = (6π/k²)(Re a_1 − |a_1|²)
        double[] o = new double[2];
        double r = 20;
        double lam = 430;
        double n = AG.n(lam);
        double k = AG.k(lam);
        double er = n * n - k * k;
        double ei = 2 * n * k;
        double h = 2.25;
        double kk = Polarizability.wavenumber(lam, h, 0);
        Mie.a1(n / 1.5, k / 1.5, kk * r, o);
        double exact = 6 * Math.PI / (kk * kk) * (o[0] - (o[0] * o[0] + o[1] * o[1]));
        assertEquals(exact, Polarizability.mieDipoleMetalAbsorption(r, lam, er, ei, h, 0, o), 1e-10 * exact);
        // continuous as the host loss vanishes (common practice)
        double tiny = Polarizability.mieDipoleMetalAbsorption(r, lam, er, ei, h, 1e-9, o);
        assertEquals(exact, tiny, 1e-6 * exact);
        // an absorbing host lowers the field driving the sphere less than it adds loss: still positive
        assertTrue(Polarizability.mieDipoleMetalAbsorption(r, lam, er, ei, h, 0.5, o) > 0);
    }

    @Test
    void mlwaAndMieDipoleReduceToQuasiStaticForTinySpheres() {
        // source: Meier & Wokaun, Opt. Lett. 8, 581 (1983): the corrections vanish as k a → 0
        double[] q = new double[2];
        double[] m = new double[2];
        double[] d = new double[2];
        double r = 0.01;
        double v = 4 * Math.PI * r * r * r / 3;
        Polarizability.quasiStatic(v, 1.0 / 3, -8, 0.5, 2.5, 0, q);
        Polarizability.mlwa(q[0], q[1], Polarizability.wavenumber(450, 2.5, 0), r, m);
        Polarizability.mieDipole(r, 450, -8, 0.5, 2.5, 0, d);
        double s = Math.hypot(q[0], q[1]);
        assertEquals(q[0], m[0], 1e-6 * s);
        assertEquals(q[1], m[1], 1e-6 * s);
        assertEquals(q[0], d[0], 1e-6 * s);
        assertEquals(q[1], d[1], 1e-6 * s);
        // Fröhlich condition: the quasi-static sphere resonates at ε = −2ε_h (B&H ch. 5.1)
        Polarizability.quasiStatic(v, 1.0 / 3, -5.0, 0.01, 2.5, 0, q);
        double atRes = Math.hypot(q[0], q[1]);
        Polarizability.quasiStatic(v, 1.0 / 3, -4.5, 0.01, 2.5, 0, q);
        assertTrue(atRes > 10 * Math.hypot(q[0], q[1]));
    }
}
