package org.fabspread.dda;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Locale;

import org.fabspread.particles.Mie;
import org.fabspread.shapes.Sphere;
import org.junit.jupiter.api.Test;

/** The discrete-dipole sphere against the full Mie series, coarse lattices only. */
class SphereConvergenceTest {

    private static double qext(double diameter, double pitch, double epsRe, double epsIm, double lambda, double host,
                               DdaSolution[] out) {
        DdaSolver s = new DdaSolver(new Sphere(diameter).voxelise(pitch),
                DdaSettings.defaults().withShell(0).withTolerance(1e-6));
        s.setMedium(lambda, epsRe, epsIm, host);
        DdaSolution sol = s.solve(Incidence.X);
        if (out != null) {
            out[0] = sol;
        }
        return sol.extinction() / (Math.PI * diameter * diameter / 4);
    }

    private static double mie(double diameter, double epsRe, double epsIm, double lambda, double host) {
        double m = Math.hypot(epsRe, epsIm);
        double nr = Math.sqrt((m + epsRe) / 2);
        double ni = epsIm / (2 * nr);
        return Mie.compute(nr / host, ni / host, Math.PI * host * diameter / lambda).qExt();
    }

    /**
     * source: Mie theory (particles.Mie, Bohren &amp; Huffman app. A) for a glass sphere, m = 1.5, x = 0.63; the
     * DDA error falls as the lattice is refined (Draine &amp; Flatau, JOSA A 11, 1491 (1994): errors of a few per
     * cent at |m|kd &lt; 1 with ~10 dipoles across).
     */
    @Test
    void dielectricSphereConvergesToMie() {
        double ref = mie(100, 2.25, 0, 500, 1);
        double e1 = Math.abs(qext(100, 20, 2.25, 0, 500, 1, null) / ref - 1);
        double e2 = Math.abs(qext(100, 10, 2.25, 0, 500, 1, null) / ref - 1);
        String rec = String.format(Locale.ROOT, "|error| 5 across %.4f, 10 across %.4f, order %.2f", e1, e2,
                Math.log(e1 / e2) / Math.log(2));
        System.out.println("glass sphere: " + rec);
        assertTrue(e2 < e1, rec);
        assertTrue(e2 < 0.03, rec);
    }

    /**
     * source: Mie theory for a 20 nm Drude-metal sphere at its plasmon peak (ε ≈ −2 + 0.6i at 335 nm); the
     * error falls from 7 to 14 dipoles across. Metal spheres converge slowly and not monotonically (the staircase
     * surface's edge and corner modes; Yurkin, Maltsev &amp; Hoekstra, JOSA A 23, 2578 (2006) on shape errors):
     * recorded 0.153, 0.304, 0.333, 0.233 at 4, 7, 10, 14 across when written.
     */
    @Test
    void metalSphereErrorFallsWithRefinement() {
        double lambda = 335;
        double[] eps = Drude.eps(lambda);
        double ref = mie(20, eps[0], eps[1], lambda, 1.0);
        double[] pitch = {5, 20.0 / 7, 2, 20.0 / 14};
        double[] err = new double[pitch.length];
        for (int i = 0; i < pitch.length; i++) {
            err[i] = Math.abs(qext(20, pitch[i], eps[0], eps[1], lambda, 1.0, null) / ref - 1);
        }
        String rec = String.format(Locale.ROOT, "|error| at 4, 7, 10, 14 across: %.3f %.3f %.3f %.3f; order 7 -> 14 "
                + "across %.2f", err[0], err[1], err[2], err[3], Math.log(err[1] / err[3]) / Math.log(2));
        System.out.println("metal sphere at its plasmon peak: " + rec);
        assertTrue(err[3] < err[1], rec);
    }

    /**
     * source: optical theorem / energy balance of the dipole array, C_ext = C_abs + C_sca (Draine, ApJ 333, 848
     * (1988), eqs. 8–10), to the solver tolerance (1e-6 here) and the angular rule; and a published small-particle
     * value: Rayleigh's Q_sca = (8/3)x⁴|(m²−1)/(m²+2)|² (Bohren &amp; Huffman 1983, eq. 5.8) for a 10 nm glass sphere.
     */
    @Test
    void energyBalanceAndRayleighLimit() {
        double[] eps = Drude.eps(450);
        DdaSolution[] s = new DdaSolution[1];
        qext(20, 4, eps[0], eps[1], 450, 1.33, s);
        double bal = (s[0].absorption() + s[0].scattering()) / s[0].extinction() - 1;
        assertEquals(0, bal, 1e-5, "abs + sca = ext");
        assertEquals(0.5, s[0].forwardFraction(), 0.05, "a small sphere scatters about equally forward and back");
        qext(10, 2, 2.25, 0, 600, 1, s);
        double x = Math.PI * 10 / 600;
        double f = (2.25 - 1) / (2.25 + 2);
        double rayleigh = 8.0 / 3 * Math.pow(x, 4) * f * f;
        assertEquals(rayleigh, s[0].scattering() / (Math.PI * 25), 0.03 * rayleigh);
        assertEquals(0, s[0].absorption() / s[0].extinction(), 1e-6, "a lossless sphere absorbs nothing");
    }
}
