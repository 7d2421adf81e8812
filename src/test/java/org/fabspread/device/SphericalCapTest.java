package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class SphericalCapTest {

    /** ∫₀ʰ π(2rz − z²) dz, the cap as a stack of discs of radius² = r² − (r − z)², by Simpson's rule. */
    private static double discs(double r, double h) {
        int m = 1000;
        double dz = h / m;
        double s = 0;
        for (int i = 0; i <= m; i++) {
            double z = i * dz;
            double a = Math.PI * (2 * r * z - z * z);
            s += (i == 0 || i == m ? 1 : (i % 2 == 1 ? 4 : 2)) * a;
        }
        return s * dz / 3;
    }

    @Test
    void capVolumeIsTheSphericalSegment() {
        // source: Bronshtein & Semendyayev, Handbook of Mathematics, spherical segment V = πh²(3r − h)/3,
        // checked against the stack of discs (Simpson's rule is exact for this quadratic integrand)
        for (double r : new double[] {1, 7.5, 15}) {
            for (double x : new double[] {0, 0.1, 0.5, 1, 1.3, 2}) {
                double h = x * r;
                assertEquals(discs(r, h), SphericalCap.volume(r, h), 1e-12 * r * r * r);
            }
            double sphere = 4 * Math.PI * r * r * r / 3;
            // a hemisphere is half the sphere; the two sides of any plane make the whole sphere
            assertEquals(sphere / 2, SphericalCap.volume(r, r), 1e-12 * sphere);
            for (double x : new double[] {0, 0.25, 0.9, 1.6}) {
                assertEquals(sphere, SphericalCap.volume(r, x * r) + SphericalCap.volume(r, (2 - x) * r), 1e-12 * sphere);
                assertEquals(SphericalCap.volume(r, x * r) / sphere, SphericalCap.share(r, x * r), 1e-14);
            }
        }
        assertEquals(0, SphericalCap.share(4, 0), 0);
        assertEquals(1, SphericalCap.share(4, 8), 1e-15);
        assertThrows(IllegalArgumentException.class, () -> SphericalCap.volume(1, 2.5));
    }
}
