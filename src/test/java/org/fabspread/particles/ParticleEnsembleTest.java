package org.fabspread.particles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.junit.jupiter.api.Test;

class ParticleEnsembleTest {
    private static final NkTable AG = MaterialLibrary.bundled().get("ag-johnson-christy");
    private static final double H_RE = 3.2;
    private static final double H_IM = 0.6;

    private static double epsRe(double lam) {
        double n = AG.n(lam);
        double k = AG.k(lam);
        return n * n - k * k;
    }

    private static double epsIm(double lam) {
        return 2 * AG.n(lam) * AG.k(lam);
    }

    private static ParticleEnsemble ensemble(int nodes, double cv, double p, double q) {
        return new ParticleEnsemble(nodes).setShape(36, cv, p, q, 0.25).setMetal(9.01, 0.021, 1.39e6, 1);
    }

    @Test
    void twelveNodesMatchTwoHundred() {
        // source: model document 4.3: ~12 Gauss–Hermite nodes, checked against a 200-node reference (1e-4).
        // Measured (D₅₀ = 36 nm, CV = 0.3, Ag in ε_h = 3.2 + 0.6i, every 5 nm; worst of ⟨α⟩, ⟨σ_abs⟩, ⟨σ_sca⟩,
        // ⟨|α|²/r³⟩, quenched near field): the 1e-4 holds for spheres in the resonance band 350–450 nm
        // (2e-6) but NOT over 350–900 nm (9.2e-4 at 590 nm); for the spheroid p = 1.5, q = 0.6 it fails even
        // in the band (in-plane 1.1e-4, out-of-plane ⟨α_c⟩ 1.6e-3) and reaches 1.2e-2 in the red tail, where
        // the few large particles of the spread resonate and dominate. 24 nodes bring the grid worst case to
        // 1.9e-5 (sphere) … 5.1e-4 (spheroids).
        // With the full Mie series for spheres (issue 13) the metal loss and scattering of the large tail and the capped
        // near field (a min() per node, so a kinked integrand) converge slower: measured worst over 350–900 nm
        // 4.0e-2 with 12 nodes and 7.9e-3 with 24 against 200, so those get 5e-2 here.
        checkNodes(new double[] {1, 1}, 350, 450, 1e-4, 1e-3, 5e-2);
        checkNodes(new double[] {1.5, 0.6}, 350, 450, 2e-3, 1.5e-2, 3e-2);
    }

    private static void checkNodes(double[] shape, double bandFrom, double bandTo, double bandTol, double gridTol,
                                   double lossTol) {
        ParticleEnsemble e12 = ensemble(12, 0.3, shape[0], shape[1]);
        ParticleEnsemble ref = ensemble(200, 0.3, shape[0], shape[1]);
        assertEquals(ref.meanVolume(), e12.meanVolume(), 1e-10 * ref.meanVolume());
        assertEquals(ref.numberPerArea(), e12.numberPerArea(), 1e-10 * ref.numberPerArea());
        for (double lam = 350; lam <= 900; lam += 5) {
            // z₀ = 2 nm is below every node's r_eq: each node uses z₀ = r_eq (particles touching the
            // neighbouring absorber), a smooth function of D
            e12.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, 2, 3);
            ref.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, 2, 3);
            double tol = lam >= bandFrom && lam <= bandTo ? bandTol : gridTol;
            for (int ax = 0; ax < 3; ax++) {
                double s = Math.hypot(ref.alphaRe(ax), ref.alphaIm(ax));
                assertEquals(ref.alphaRe(ax), e12.alphaRe(ax), tol * s, "λ " + lam + " axis " + ax);
                assertEquals(ref.alphaIm(ax), e12.alphaIm(ax), tol * s, "λ " + lam + " axis " + ax);
            }
            for (int pol = 0; pol < 3; pol++) {
                rel(ref.metalAbsorption(pol), e12.metalAbsorption(pol), lam, Math.max(tol, lossTol));
                rel(ref.scattering(pol), e12.scattering(pol), lam, Math.max(tol, lossTol));
                rel(ref.alpha2OverR3(pol), e12.alpha2OverR3(pol), lam, tol);
                rel(ref.alpha2OverZ03(pol), e12.alpha2OverZ03(pol), lam, tol);
                rel(ref.nearFieldQuenched(pol), e12.nearFieldQuenched(pol), lam, Math.max(tol, lossTol));
            }
        }
    }

    @Test
    void neighbourDistanceInsideTheSizeSpreadConvergesSlower() {
        // common practice: quadrature of a kinked integrand. When z₀ falls inside the size distribution
        // (z₀ = 20 nm, r_eq from 4 to 80 nm), z₀,i = max(z₀, r_eq,i) has a kink in D and 12 nodes reach only
        // about 2 % on ⟨|α|²/z₀³⟩ (measured 1.2–2.1 % at 380–700 nm) and 0.2 % on the host near field
        ParticleEnsemble e12 = ensemble(12, 0.3, 1, 1);
        ParticleEnsemble ref = ensemble(200, 0.3, 1, 1);
        for (double lam : new double[] {380, 470, 700}) {
            e12.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, 20, 3);
            ref.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, 20, 3);
            int u = ParticleEnsemble.UNPOLARIZED;
            assertEquals(ref.alpha2OverZ03(u), e12.alpha2OverZ03(u), 0.03 * ref.alpha2OverZ03(u));
            // the capped near field and the full-series metal loss: 5e-2 (see twelveNodesMatchTwoHundred)
            assertEquals(ref.nearFieldHost(u), e12.nearFieldHost(u), 0.05 * ref.nearFieldHost(u));
            assertEquals(ref.nearFieldQuenched(u), e12.nearFieldQuenched(u), 0.05 * ref.nearFieldQuenched(u));
            rel(ref.metalAbsorption(u), e12.metalAbsorption(u), lam, 0.05);
            // the smooth quantities keep 1e-4
            rel(ref.alpha2OverR3(u), e12.alpha2OverR3(u), lam);
        }
    }

    private static void rel(double ref, double got, double lam) {
        rel(ref, got, lam, 1e-4);
    }

    private static void rel(double ref, double got, double lam, double tol) {
        assertEquals(ref, got, tol * Math.abs(ref), "λ " + lam);
    }

    @Test
    void lognormalMoments() {
        // source: model document 4.3: ⟨D²⟩ = D₅₀² e^{2σ_ln²}, +19 % at CV = 0.3; lognormal moments
        // E[D^k] = D₅₀^k e^{k²σ²/2} (Johnson, Kotz & Balakrishnan, Continuous Univariate Distributions, ch. 14)
        ParticleEnsemble e = ensemble(12, 0.3, 1, 1);
        double s2 = Math.log(1 + 0.09);
        assertEquals(36 * 36 * Math.exp(2 * s2), e.meanDiameterSquared(), 1e-10 * 36 * 36);
        assertEquals(0.19, e.meanDiameterSquared() / (36 * 36) - 1, 0.005);
        assertEquals(Math.PI / 6 * Math.pow(36, 3) * Math.exp(4.5 * s2), e.meanVolume(), 1e-9 * e.meanVolume());
        // median of the nodes' distribution is D₅₀ and the CV comes back: Var/mean² = e^{σ²} − 1 = CV²
        double m1 = 0;
        double m2 = 0;
        for (int i = 0; i < e.activeNodes(); i++) {
            m1 += e.nodeWeight(i) * e.nodeDiameter(i);
            m2 += e.nodeWeight(i) * e.nodeDiameter(i) * e.nodeDiameter(i);
        }
        assertEquals(0.09, m2 / (m1 * m1) - 1, 1e-10);
    }

    @Test
    void geometryFollowsTheShapeConvention() {
        // source: study.ParticleLayer: a = (D/2)(p/q)^{1/3}, b = a/p, c = q a; model document 4.3:
        // n_A = θ/(π⟨ab⟩), h = 2c at D₅₀, n_V = n_A/h, f = n_A⟨V⟩/h
        double p = 1.4;
        double q = 0.5;
        ParticleEnsemble e = new ParticleEnsemble().setShape(40, 0.2, p, q, 0.3);
        double a50 = 20 * Math.cbrt(p / q);
        assertEquals(2 * q * a50, e.thickness(), 1e-12);
        double meanAb = 0;
        double meanV = 0;
        for (int i = 0; i < e.activeNodes(); i++) {
            double a = e.nodeSemiAxis(i, 0);
            double b = e.nodeSemiAxis(i, 1);
            double c = e.nodeSemiAxis(i, 2);
            double d = e.nodeDiameter(i);
            assertEquals(d * d * d / 8, a * b * c, 1e-12 * a * b * c);
            assertEquals(p, a / b, 1e-12);
            assertEquals(q, c / a, 1e-12);
            meanAb += e.nodeWeight(i) * a * b;
            meanV += e.nodeWeight(i) * 4 * Math.PI * a * b * c / 3;
            assertEquals(MetalPermittivity.meanFreePath(a, b, c), e.nodeMeanFreePath(i), 1e-12 * d);
        }
        assertEquals(0.3 / (Math.PI * meanAb), e.numberPerArea(), 1e-15);
        assertEquals(e.numberPerArea() / e.thickness(), e.numberPerVolume(), 1e-18);
        assertEquals(e.numberPerArea() * meanV / e.thickness(), e.volumeFraction(), 1e-12);
        ParticleEnsemble.Geometry g = ParticleEnsemble.geometry(40, 0.2, p, q, 0.3);
        assertEquals(e.thickness(), g.thickness(), 0);
        assertEquals(e.volumeFraction(), g.volumeFraction(), 0);
        assertEquals(1, g.depolA() + g.depolB() + g.depolC(), 1e-14);
        // monodisperse spheres: f = θ · (4/3)r³π / (πr² · 2r) = 2θ/3
        assertEquals(2 * 0.3 / 3, ParticleEnsemble.geometry(40, 0, 1, 1, 0.3).volumeFraction(), 1e-15);
    }

    @Test
    void zeroSpreadIsTheSingleParticle() {
        // common practice: CV → 0 collapses the ensemble on the median particle
        double lam = 450;
        double[] t = new double[2];
        double[] q = new double[2];
        ParticleEnsemble e = ensemble(12, 0, 1.3, 0.8);
        e.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, Double.POSITIVE_INFINITY, 0);
        ParticleEnsemble tiny = ensemble(12, 1e-7, 1.3, 0.8);
        tiny.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, Double.POSITIVE_INFINITY, 0);
        double a = 18 * Math.cbrt(1.3 / 0.8);
        double[] axes = {a, a / 1.3, 0.8 * a};
        double v = 4 * Math.PI * axes[0] * axes[1] * axes[2] / 3;
        MetalPermittivity.sizeCorrected(lam, epsRe(lam), epsIm(lam), MetalPermittivity.meanFreePath(axes[0], axes[1],
                axes[2]), 9.01, 0.021, 1.39e6, 1, t);
        double[] l = Depolarization.factors(axes[0], axes[1], axes[2]);
        double k = Polarizability.wavenumber(lam, H_RE, H_IM);
        for (int ax = 0; ax < 3; ax++) {
            Polarizability.quasiStatic(v, l[ax], t[0], t[1], H_RE, H_IM, q);
            Polarizability.mlwa(q[0], q[1], k, axes[ax], q);
            double s = Math.hypot(q[0], q[1]);
            assertEquals(q[0], e.alphaRe(ax), 1e-12 * s);
            assertEquals(q[1], e.alphaIm(ax), 1e-12 * s);
            assertEquals(q[0], tiny.alphaRe(ax), 1e-6 * s);
            assertEquals(q[1], tiny.alphaIm(ax), 1e-6 * s);
        }
        assertEquals(1, e.activeNodes());
    }

    @Test
    void averagesArePerParticleNotRatios() {
        // source: model document 4.3: ⟨|α|²/r_eq³⟩ is the average of the per-particle quantity
        double lam = 430;
        ParticleEnsemble e = ensemble(12, 0.4, 1, 1);
        e.compute(lam, epsRe(lam), epsIm(lam), H_RE, 0, 25, 0);
        double[] t = new double[2];
        double direct = 0;
        double num = 0;
        double den = 0;
        for (int i = 0; i < e.activeNodes(); i++) {
            double r = e.nodeDiameter(i) / 2;
            MetalPermittivity.sizeCorrected(lam, epsRe(lam), epsIm(lam), 4 * r / 3, 9.01, 0.021, 1.39e6, 1, t);
            Polarizability.mieDipole(r, lam, t[0], t[1], H_RE, 0, t);
            double a2 = t[0] * t[0] + t[1] * t[1];
            direct += e.nodeWeight(i) * a2 / (r * r * r);
            num += e.nodeWeight(i) * a2;
            den += e.nodeWeight(i) * r * r * r;
        }
        assertEquals(direct, e.alpha2OverR3(ParticleEnsemble.UNPOLARIZED), 1e-12 * direct);
        assertTrue(Math.abs(num / den / direct - 1) > 0.05, "a ratio of averages would differ");
        assertEquals(Polarizability.Method.MIE, e.effectiveMethod());
    }

    @Test
    void inPlaneAspectSplitsTheResonance() {
        // common practice: an in-plane aspect ratio a ≠ b gives two resonances, one per in-plane polarisation
        // (model document 4.2), the long axis red of the short one
        ParticleEnsemble e = new ParticleEnsemble().setShape(30, 0.1, 1.8, 1, 0.2).setMetal(9.01, 0.021, 1.39e6, 1);
        double[] pkA = {0, 0};
        double[] pkB = {0, 0};
        int n = 0;
        double[] spec = new double[501];
        for (int i = 0; i <= 500; i++) {
            double lam = 350 + i;
            e.compute(lam, epsRe(lam), epsIm(lam), 2.25, 0, Double.POSITIVE_INFINITY, 0);
            double sa = e.metalAbsorption(ParticleEnsemble.AXIS_A);
            double sb = e.metalAbsorption(ParticleEnsemble.AXIS_B);
            if (sa > pkA[1]) {
                pkA[0] = lam;
                pkA[1] = sa;
            }
            if (sb > pkB[1]) {
                pkB[0] = lam;
                pkB[1] = sb;
            }
            spec[i] = e.metalAbsorption(ParticleEnsemble.UNPOLARIZED);
        }
        assertTrue(pkA[0] > pkB[0] + 50, "long-axis resonance " + pkA[0] + " vs short " + pkB[0]);
        for (int i = 1; i < 500; i++) {
            if (spec[i] > spec[i - 1] && spec[i] > spec[i + 1]) {
                n++;
            }
        }
        assertEquals(2, n, "two maxima in the unpolarised spectrum");
        // sphere: one
        e.setShape(30, 0.1, 1, 1, 0.2);
        n = 0;
        for (int i = 0; i <= 500; i++) {
            double lam = 350 + i;
            e.compute(lam, epsRe(lam), epsIm(lam), 2.25, 0, Double.POSITIVE_INFINITY, 0);
            spec[i] = e.metalAbsorption(ParticleEnsemble.UNPOLARIZED);
        }
        for (int i = 1; i < 500; i++) {
            if (spec[i] > spec[i - 1] && spec[i] > spec[i + 1]) {
                n++;
            }
        }
        assertEquals(1, n);
    }

    @Test
    void largerParticlesRedShiftTheEnsemble() {
        // common practice: a larger particle red-shifts the resonance
        double prev = 0;
        for (double d : new double[] {10, 30, 50, 70}) {
            ParticleEnsemble e = new ParticleEnsemble().setShape(d, 0.2, 1, 1, 0.2);
            double best = 0;
            double at = 0;
            for (double lam = 350; lam <= 700; lam += 0.5) {
                e.compute(lam, epsRe(lam), epsIm(lam), 2.25, 0, Double.POSITIVE_INFINITY, 0);
                double s = e.metalAbsorption(ParticleEnsemble.UNPOLARIZED) + e.scattering(ParticleEnsemble.UNPOLARIZED);
                if (s > best) {
                    best = s;
                    at = lam;
                }
            }
            assertTrue(at > prev, "D = " + d);
            prev = at;
        }
    }

    @Test
    void moreCoverageMoreMetalAbsorptionPerArea() {
        // common practice: metal absorption per area, n_A⟨σ_abs⟩, rises with coverage
        double lam = 450;
        double prev = 0;
        for (double theta : new double[] {0.05, 0.1, 0.2, 0.4}) {
            ParticleEnsemble e = new ParticleEnsemble().setShape(30, 0.3, 1, 1, theta);
            e.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, Double.POSITIVE_INFINITY, 0);
            double perArea = e.numberPerArea() * e.metalAbsorption(ParticleEnsemble.UNPOLARIZED);
            assertTrue(perArea > prev);
            prev = perArea;
        }
    }

    @Test
    void computeAllocatesNothing() {
        // common practice: the per-wavelength path must not allocate (121 wavelengths × samples)
        ParticleEnsemble e = ensemble(12, 0.3, 1.3, 0.7);
        ParticleEnsemble s = ensemble(12, 0.3, 1, 1);
        double[] out = new double[2];
        double[] rates = new double[LossSplit.PARTS];
        for (int i = 0; i < 20000; i++) {
            run(e, s, out, rates, 300 + (i % 121) * 5);
        }
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long id = Thread.currentThread().getId();
        // a JIT recompilation inside a window can materialise objects that compiled code keeps in registers
        // (escape analysis), so the steady state is the least of a few windows; speed is the benchmark's job
        long least = Long.MAX_VALUE;
        for (int window = 0; window < 5 && least > 0; window++) {
            long before = mx.getThreadAllocatedBytes(id);
            for (int i = 0; i < 1210; i++) {
                run(e, s, out, rates, 300 + (i % 121) * 5);
            }
            least = Math.min(least, mx.getThreadAllocatedBytes(id) - before);
        }
        assertEquals(0, least, "bytes allocated by 1210 ensemble evaluations");
    }

    private static void run(ParticleEnsemble e, ParticleEnsemble s, double[] out, double[] rates, double lam) {
        e.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, 20, 2);
        e.maxwellGarnett(ParticleEnsemble.AXIS_A, out);
        LossSplit.rates(e, ParticleEnsemble.UNPOLARIZED, 1.0, rates);
        LossSplit.split(0.1, rates, rates);
        s.compute(lam, epsRe(lam), epsIm(lam), H_RE, H_IM, 20, 2);
        s.maxwellGarnett(ParticleEnsemble.AXIS_A, out);
    }

    @Test
    void rejectsBadShapes() {
        // common practice: a shape outside the convention is a programming error here (the study validates input)
        ParticleEnsemble e = new ParticleEnsemble();
        assertThrows(IllegalArgumentException.class, () -> e.setShape(30, 0.2, 0.8, 1, 0.2));
        assertThrows(IllegalArgumentException.class, () -> e.setShape(-1, 0.2, 1, 1, 0.2));
        assertThrows(IllegalArgumentException.class, () -> e.setShape(30, 0.2, 1, 1, 1.2));
        assertThrows(IllegalStateException.class, () -> e.compute(500, -9, 0.3, 2.25, 0, 20, 0));
        e.setShape(30, 0.2, 1.2, 1, 0.2).setMethod(Polarizability.Method.MIE_DIPOLE);
        assertThrows(IllegalArgumentException.class, () -> e.compute(500, -9, 0.3, 2.25, 0, 20, 0));
    }
}
