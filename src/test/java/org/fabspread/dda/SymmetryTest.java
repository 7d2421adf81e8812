package org.fabspread.dda;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fabspread.particles.Depolarization;
import org.fabspread.shapes.Crescent;
import org.fabspread.shapes.Spheroid;
import org.fabspread.shapes.Voxels;
import org.junit.jupiter.api.Test;

class SymmetryTest {

    private static DdaSolver crescent(double lambda) {
        Voxels v = new Crescent(60, 40, 18, 16).voxelise(6);
        DdaSolver s = new DdaSolver(v, DdaSettings.defaults().withShell(0).withTolerance(1e-8));
        double[] e = Drude.eps(lambda);
        s.setMedium(lambda, e[0], e[1], 1.5);
        return s;
    }

    /**
     * source: symmetry (common practice; Draine &amp; Flatau 1994): y = 0 is a mirror plane of the crescent, so a
     * field along x (in the plane) induces no net y dipole, and a field along y none along x: the in-plane
     * polarisability tensor is diagonal in the crescent's frame.
     */
    @Test
    void mirrorPlaneGivesADiagonalTensor() {
        DdaSolver s = crescent(700);
        DdaSolution x = s.solve(Incidence.X);
        DdaSolution y = s.solve(Incidence.Y);
        double ax = Math.hypot(x.dipoleRe()[0], x.dipoleIm()[0]);
        double ay = Math.hypot(y.dipoleRe()[1], y.dipoleIm()[1]);
        assertTrue(ax > 0 && ay > 0);
        assertEquals(0, Math.hypot(x.dipoleRe()[1], x.dipoleIm()[1]) / ax, 1e-7, "alpha_yx");
        assertEquals(0, Math.hypot(y.dipoleRe()[0], y.dipoleIm()[0]) / ay, 1e-7, "alpha_xy");
    }

    /**
     * source: reciprocity of scattering amplitudes (Saxon, Phys. Rev. 100, 1771 (1955); in the DDA the interaction
     * matrix is symmetric, Draine &amp; Flatau 1994): the amplitude for (â, ê) → (n̂, f̂) equals that for
     * (−n̂, f̂) → (−â, ê), i.e. Σ E₂(r_j)·P₁,j = Σ E₁(r_j)·P₂,j with E₂ the wave along −n̂. The two waves are
     * chosen with equal lattice-dispersion S so both see the same polarisabilities.
     */
    @Test
    void reciprocity() {
        DdaSolver s = crescent(650);
        double t = 0.6;
        Incidence one = new Incidence(new double[] {Math.sin(t), 0, Math.cos(t)},
                new double[] {Math.cos(t), 0, -Math.sin(t)});
        Incidence two = new Incidence(new double[] {0, -Math.sin(t), -Math.cos(t)},
                new double[] {0, Math.cos(t), -Math.sin(t)});
        double[] p1 = amplitude(s, one, two);
        double[] p2 = amplitude(s, two, one);
        double scale = Math.hypot(p1[0], p1[1]);
        assertTrue(scale > 0);
        assertEquals(p1[0], p2[0], 1e-6 * scale);
        assertEquals(p1[1], p2[1], 1e-6 * scale);
    }

    /** Σ_j E_probe(r_j)·P_j for the dipoles excited by {@code by} (unconjugated). */
    private static double[] amplitude(DdaSolver s, Incidence by, Incidence probe) {
        s.solve(by);
        return s.project(probe);
    }

    /**
     * source: quasi-static ellipsoid α = V(ε − 1)/(1 + L(ε − 1)) (Bohren &amp; Huffman 1983, eq. 5.32) with L of a
     * prolate spheroid of aspect 2 from particles.Depolarization (Osborn 1945); the DDA tends to it as the
     * particle shrinks and the lattice is refined (dielectric ε = 4 to stay clear of surface modes).
     */
    @Test
    void smallSpheroidTendsToTheQuasiStaticEllipsoid() {
        double[] l = Depolarization.prolate(2);
        double eps = 4;
        Spheroid sp = new Spheroid(12, 6);
        double[] err = new double[2];
        double[] pitch = {1.5, 0.75};
        for (int i = 0; i < 2; i++) {
            DdaSolver s = new DdaSolver(sp.voxelise(pitch[i]), DdaSettings.defaults().withShell(0).withTolerance(1e-7));
            s.setMedium(2000, eps, 0, 1);
            double ax = s.solve(Incidence.X).dipoleRe()[0];
            double ay = s.solve(Incidence.Y).dipoleRe()[1];
            double qx = sp.volume() * (eps - 1) / (1 + l[0] * (eps - 1));
            double qy = sp.volume() * (eps - 1) / (1 + l[1] * (eps - 1));
            err[i] = Math.max(Math.abs(ax / qx - 1), Math.abs(ay / qy - 1));
        }
        String rec = "relative error 8 and 16 dipoles along: " + err[0] + ", " + err[1];
        System.out.println("spheroid: " + rec);
        assertTrue(err[1] < err[0], rec);
        assertTrue(err[1] < 0.03, rec);
    }
}
