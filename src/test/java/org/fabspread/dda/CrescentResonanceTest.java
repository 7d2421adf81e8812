package org.fabspread.dda;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fabspread.shapes.Crescent;
import org.junit.jupiter.api.Test;

/**
 * A metal crescent (a damped Drude metal, {@link Drude}) has one resonance per in-plane polarisation: field across the opening (y, tip to tip)
 * at the longer wavelength, field along the symmetry axis (x) at the shorter; both move to the red as the
 * crescent grows at fixed proportions (common practice for template-made crescents and split rings).
 * Coarse lattice (pitch 8 nm) to keep the test short. Recorded at a 50 nm wavelength step when written: x 690 → 740 nm,
 * y 990 → 1040 nm for a 1.3-fold larger crescent.
 */
class CrescentResonanceTest {

    private static final double HOST = 1.5;

    @Test
    void twoSeparatedInPlaneResonancesRedShiftAsTheCrescentGrows() {
        double[] small = peaks(1.0);
        double[] large = peaks(1.3);
        String rec = String.format(java.util.Locale.ROOT, "peaks x %.0f -> %.0f nm, y %.0f -> %.0f nm",
                small[0], large[0], small[1], large[1]);
        System.out.println("crescent resonances: " + rec);
        assertTrue(small[1] - small[0] > 40, "the two polarisations resonate apart: " + rec);
        assertTrue(large[0] > small[0] + 5, "x resonance red-shifts: " + rec);
        assertTrue(large[1] > small[1] + 20, "y resonance red-shifts: " + rec);
    }

    /** Wavelengths (nm) of the largest C_ext for field along x and along y. */
    private static double[] peaks(double scale) {
        Crescent c = new Crescent(80 * scale, 56 * scale, 24 * scale, 20 * scale);
        DdaSolver s = new DdaSolver(c.voxelise(8 * scale), DdaSettings.defaults().withShell(0).withTolerance(1e-4));
        double[] best = new double[2];
        double[] at = new double[2];
        for (double l = 440; l <= 1340; l += 50) {
            double[] e = Drude.eps(l);
            s.setMedium(l, e[0], e[1], HOST);
            for (int pol = 0; pol < 2; pol++) {
                double ext = s.solve(pol == 0 ? Incidence.X : Incidence.Y, pol).extinction();
                if (ext > best[pol]) {
                    best[pol] = ext;
                    at[pol] = l;
                }
            }
        }
        return at;
    }
}
