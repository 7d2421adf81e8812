package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;

import org.apache.commons.math3.complex.Complex;
import org.fabspread.optics.ObliqueStack.Polarization;
import org.junit.jupiter.api.Test;

class ObliqueStackTest {

    private static final double[] NONE = new double[0];

    /** Born & Wolf's Fresnel reflectances (ch. 1.5.2) with complex cos θ_t, by commons-math complex arithmetic. */
    private static double[] fresnelSp(double n1, Complex n2, double theta) {
        Complex c1 = new Complex(Math.cos(theta));
        Complex sinT = new Complex(n1 * Math.sin(theta)).divide(n2);
        Complex c2 = Complex.ONE.subtract(sinT.multiply(sinT)).sqrt();
        Complex a = new Complex(n1);
        Complex rs = a.multiply(c1).subtract(n2.multiply(c2)).divide(a.multiply(c1).add(n2.multiply(c2)));
        Complex rp = n2.multiply(c1).subtract(a.multiply(c2)).divide(n2.multiply(c1).add(a.multiply(c2)));
        return new double[] {rs.abs() * rs.abs(), rp.abs() * rp.abs()};
    }

    @Test
    void singleInterfaceIsFresnel() {
        ObliqueStack os = new ObliqueStack(0);
        double[][] media = {{1.5, 0}, {2.2, 0.4}, {0.13, 3.9}};
        for (double[] m : media) {
            for (double deg : new double[] {0, 15, 40, 70, 85}) {
                double th = Math.toRadians(deg);
                // source: Born & Wolf, Principles of Optics, ch. 1.5.2 (Fresnel formulas, s and p)
                double[] ref = fresnelSp(1.0, new Complex(m[0], m[1]), th);
                os.solve(600, 1.0, th, Polarization.S, 0, NONE, NONE, NONE, m[0], m[1]);
                assertEquals(ref[0], os.reflectance(), 1e-13, "s at " + deg);
                assertEquals(1.0, os.reflectance() + os.transmittance(), 1e-13);
                os.solve(600, 1.0, th, Polarization.P, 0, NONE, NONE, NONE, m[0], m[1]);
                assertEquals(ref[1], os.reflectance(), 1e-13, "p at " + deg);
                assertEquals(1.0, os.reflectance() + os.transmittance(), 1e-13);
            }
        }
    }

    @Test
    void brewsterAndTotalInternalReflection() {
        ObliqueStack os = new ObliqueStack(1);
        double n2 = 1.52;
        // source: Born & Wolf, Principles of Optics, ch. 1.5.3 (Brewster angle tan θ_B = n2/n1: r_p = 0)
        os.solve(550, 1.0, Math.atan(n2), Polarization.P, 0, NONE, NONE, NONE, n2, 0);
        assertEquals(0.0, os.reflectance(), 1e-28);
        os.solve(550, 1.0, Math.atan(n2), Polarization.S, 0, NONE, NONE, NONE, n2, 0);
        assertTrue(os.reflectance() > 0.1);
        // source: Born & Wolf, Principles of Optics, ch. 1.5.4 (total reflection beyond the critical angle)
        for (Polarization pol : Polarization.values()) {
            os.solve(550, 1.52, Math.toRadians(60), pol, 0, NONE, NONE, NONE, 1, 0);
            assertEquals(1.0, os.reflectance(), 1e-13);
            assertEquals(0.0, os.transmittance(), 1e-13);
            // frustrated total reflection: a thin air gap then glass again lets light tunnel through
            os.solve(550, 1.52, Math.toRadians(60), pol, 1, new double[] {1}, new double[] {0}, new double[] {100},
                    1.52, 0);
            assertTrue(os.transmittance() > 0.05 && os.transmittance() < 1, "tunnelling " + os.transmittance());
            assertEquals(1.0, os.reflectance() + os.transmittance(), 1e-13);
        }
    }

    @Test
    void normalIncidenceReproducesTheCoherentStack() {
        MaterialLibrary lib = MaterialLibrary.bundled();
        List<String> ids = lib.ids();
        SplittableRandom rnd = new SplittableRandom(7);
        CoherentStack cs = new CoherentStack(6);
        ObliqueStack os = new ObliqueStack(6);
        double[] nr = new double[6];
        double[] ni = new double[6];
        double[] d = new double[6];
        for (int trial = 0; trial < 2000; trial++) {
            int count = rnd.nextInt(1, 7);
            double lambda = 400 + 500 * rnd.nextDouble();
            for (int j = 0; j < count; j++) {
                NkTable t = lib.get(ids.get(rnd.nextInt(ids.size())));
                if (!t.covers(lambda)) {
                    t = lib.get("ag-mcpeak");
                }
                nr[j] = t.n(lambda);
                ni[j] = t.k(lambda);
                d[j] = 300 * rnd.nextDouble();
            }
            double n0 = trial % 2 == 0 ? 1 : 1.52;
            cs.solve(lambda, n0, count, nr, ni, d, 1, 0);
            for (Polarization pol : Polarization.values()) {
                os.solve(lambda, n0, 0, pol, count, nr, ni, d, 1, 0);
                // common practice: two formulations (closed-form field integral, Poynting flux differences)
                // of the same characteristic-matrix method must agree at normal incidence
                assertEquals(cs.reflectance(), os.reflectance(), 1e-12);
                assertEquals(cs.transmittance(), os.transmittance(), 1e-12);
                for (int j = 0; j < count; j++) {
                    assertEquals(cs.absorptance(j), os.absorptance(j), 1e-12);
                }
            }
        }
    }

    @Test
    void thickAbsorberAtAnAngleTakesEverythingNotReflected() {
        NkTable t = MaterialLibrary.bundled().get("ptb7-pc71bm-stelling");
        double lambda = 620;
        double n = t.n(lambda);
        double k = t.k(lambda);
        ObliqueStack os = new ObliqueStack(1);
        for (double deg : new double[] {20, 50, 75}) {
            double th = Math.toRadians(deg);
            double[] ref = fresnelSp(1, new Complex(n, k), th);
            for (Polarization pol : Polarization.values()) {
                os.solve(lambda, 1, th, pol, 1, new double[] {n}, new double[] {k}, new double[] {50000}, 1, 0);
                double r = ref[pol == Polarization.S ? 0 : 1];
                // source: Born & Wolf ch. 1.5.2 (Fresnel loss) and Beer–Lambert absorption of the rest
                assertEquals(r, os.reflectance(), 1e-12);
                assertEquals(1 - r, os.absorptance(0), 1e-12);
            }
        }
    }
}
