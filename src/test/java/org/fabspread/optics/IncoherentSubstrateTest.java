package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fabspread.study.Study;
import org.junit.jupiter.api.Test;

class IncoherentSubstrateTest {

    /** R, T, A_glass and the power reaching the stack, by following the bounces one by one. */
    static double[] bruteForce(double rAg, double tG, double rC, double tC) {
        double tAg = 1 - rAg;
        double r = rAg;
        double t = 0;
        double glass = 0;
        double entry = 0;
        double down = tAg; // power heading towards the stack just inside the front face
        for (int pass = 0; pass < 100000 && down > 1e-300; pass++) {
            glass += down * (1 - tG);
            double atStack = down * tG;
            entry += atStack;
            t += atStack * tC;
            double up = atStack * rC;       // reflected back into the glass
            glass += up * (1 - tG);
            double atFront = up * tG;
            r += atFront * tAg;             // escapes to the air
            down = atFront * rAg;           // reflected back towards the stack
        }
        return new double[] {r, t, glass, entry};
    }

    @Test
    void zeroStackReflectanceLetsThroughTagTg() {
        double rAg = IncoherentSubstrate.fresnelNormal(1, 0, 1.52, 1e-6);
        double tG = IncoherentSubstrate.singlePass(1e-6, 1e6, 500);
        // source: Pettersson, Roman & Inganäs, J. Appl. Phys. 86, 487 (1999); device-model doc section 3 check
        assertEquals((1 - rAg) * tG, IncoherentSubstrate.entryFactor(rAg, tG, 0), 1e-15);
        // source: Beer–Lambert single pass exp(-4πkd/λ) (device-model doc section 3)
        assertEquals(Math.exp(-4 * Math.PI * 1e-6 * 1e6 / 500), tG, 1e-15);
    }

    @Test
    void closedFormsEqualTheSummedSeries() {
        double[][] cases = {
            {0.04, 0.999, 0.3, 0.5}, {0.04, 0.9, 0.9, 0.05}, {0.2, 0.5, 0.99, 0.0}, {0.3, 1.0, 0.7, 0.3},
            {0.0, 0.8, 0.5, 0.5}, {0.04, 0.95, 0.0, 0.8},
        };
        for (double[] c : cases) {
            double rAg = c[0];
            double tG = c[1];
            double rC = c[2];
            double tC = c[3];
            double[] bf = bruteForce(rAg, tG, rC, tC);
            // source: Katsidis & Siapkas, Appl. Opt. 41, 3978 (2002) (incoherent multiple reflections as a geometric series)
            assertEquals((1 - rAg) * tG / (1 - rAg * rC * tG * tG), IncoherentSubstrate.entryFactor(rAg, tG, rC), 1e-15);
            assertEquals(bf[3], IncoherentSubstrate.entryFactor(rAg, tG, rC), 1e-13);
            assertEquals(bf[0], IncoherentSubstrate.totalReflectance(rAg, tG, rC), 1e-13);
            assertEquals(bf[1], IncoherentSubstrate.totalTransmittance(rAg, tG, rC, tC), 1e-13);
            assertEquals(bf[2], IncoherentSubstrate.glassAbsorptance(rAg, tG, rC), 1e-13);
        }
    }

    @Test
    void planarOpticsAgreesWithIndependentBounceSum() {
        Study study = TestStudies.sixLayer();
        PlanarOptics po = PlanarOptics.of(study);
        SpectralResult res = po.newResult();
        po.evaluateNominal(res);
        MaterialLibrary lib = MaterialLibrary.bundled();
        String[] m = {"ito-konig", "zno-stelling", "ptb7-pc71bm-stelling", "moo3-stelling", "ag-johnson-christy"};
        double[] d = {150, 30, 100, 10, 100};
        NkTable glass = lib.get("soda-lime-rubin");
        CoherentStack cs = new CoherentStack(5);
        double[] nr = new double[5];
        double[] ni = new double[5];
        for (int i = 0; i < res.wavelengthCount(); i++) {
            double lambda = res.wavelength(i);
            for (int j = 0; j < 5; j++) {
                nr[j] = lib.get(m[j]).n(lambda);
                ni[j] = lib.get(m[j]).k(lambda);
            }
            cs.solve(lambda, glass.n(lambda), 5, nr, ni, d, 1, 0);
            double rAg = IncoherentSubstrate.fresnelNormal(1, 0, glass.n(lambda), glass.k(lambda));
            double tG = Math.exp(-4 * Math.PI * glass.k(lambda) * 1e6 / lambda);
            double[] bf = bruteForce(rAg, tG, cs.reflectance(), cs.transmittance());
            // source: Pettersson, Roman & Inganäs (1999) substrate treatment against the summed bounce series
            assertEquals(bf[0], res.reflectance(i), 1e-12);
            assertEquals(bf[1], res.transmittance(i), 1e-12);
            assertEquals(bf[2], res.glassAbsorptance(i), 1e-12);
            for (int j = 0; j < 5; j++) {
                assertEquals(bf[3] * cs.absorptance(j), res.absorptance(j + 1, i), 1e-12);
            }
            assertTrue(res.glassAbsorptance(i) > 0);
        }
    }
}
