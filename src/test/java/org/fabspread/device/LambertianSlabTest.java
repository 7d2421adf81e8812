package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class LambertianSlabTest {

    /**
     * E_n(x) = int_1^inf e^{-xt} t^{-n} dt by Simpson's rule after t = e^v:
     * int_0^inf exp(-x e^v) e^{(1-n)v} dv, cut where x e^v > 60.
     */
    private static double numericalEn(int n, double x) {
        double vMax = Math.max(Math.log(60 / x), 1.0);
        int m = 200_000;
        double h = vMax / m;
        double s = 0;
        for (int i = 0; i <= m; i++) {
            double v = i * h;
            double f = Math.exp(-x * Math.exp(v) + (1 - n) * v);
            s += (i == 0 || i == m ? 1 : (i % 2 == 1 ? 4 : 2)) * f;
        }
        return s * h / 3;
    }

    @Test
    void exponentialIntegralMatchesItsDefinition() {
        // source: Abramowitz & Stegun, Handbook of Mathematical Functions (1964), 5.1.4 (definition of E_n)
        for (int n = 1; n <= 3; n++) {
            for (double x : new double[] {1e-4, 0.01, 0.3, 0.999, 1.0, 1.001, 2.5, 7, 20, 45}) {
                double exact = LambertianSlab.expIntegral(n, x);
                double num = numericalEn(n, x);
                assertEquals(num, exact, 1e-9 * num, "E_" + n + "(" + x + ")");
            }
        }
    }

    @Test
    void exponentialIntegralKnownValueAndRecurrence() {
        // from memory: E_1(1) = 0.219383934395520 (Abramowitz & Stegun table 5.1);
        // cross-checked against the defining integral
        assertEquals(0.219383934395520, LambertianSlab.expIntegral(1, 1.0), 1e-14);
        assertEquals(numericalEn(1, 1.0), 0.219383934395520, 1e-10);
        // source: Abramowitz & Stegun 5.1.14: n E_{n+1}(x) = e^{-x} - x E_n(x), which gives the model
        // document's 2E_3(x) = e^{-x}(1 - x) + x^2 E_1(x)
        for (double x : new double[] {1e-6, 0.05, 0.7, 1.3, 4, 12}) {
            double e1 = LambertianSlab.expIntegral(1, x);
            double e2 = LambertianSlab.expIntegral(2, x);
            double e3 = LambertianSlab.expIntegral(3, x);
            assertEquals(Math.exp(-x) - x * e1, e2, 1e-14);
            assertEquals(Math.exp(-x) * (1 - x) + x * x * e1, 2 * e3, 1e-13);
        }
        // E_n(0) = 1/(n - 1) (A&S 5.1.23)
        assertEquals(0.5, LambertianSlab.expIntegral(3, 0), 0);
        assertEquals(1.0, LambertianSlab.diffuseTransmission(0), 0);
    }

    @Test
    void diffuseLightSeesTwiceTheThickness() {
        // source: Yablonovitch & Cody, IEEE Trans. Electron Dev. 29, 300 (1982): the mean path of
        // isotropic light across a weakly absorbing slab is 2d, so T_1 = 1 - 2 kappa d + o(kappa d)
        double x = 1e-7;
        assertEquals(2.0, (1 - LambertianSlab.diffuseTransmission(x)) / x, 1e-4);
    }

    @Test
    void absorptionLimits() {
        // source: device-model.md section 4.5: A_diff -> 0 as kappa -> 0 and -> 1 as kappa d -> inf
        for (double rb : new double[] {0, 0.5, 0.95}) {
            double rf = LambertianSlab.escapeConeReflectance(1.9, 1.0);
            double t0 = LambertianSlab.diffuseTransmission(1e-12);
            assertEquals(0, LambertianSlab.absorbedFront(t0, rb, rf), 1e-9);
            assertEquals(0, LambertianSlab.absorbedBack(t0, rb, rf), 1e-9);
            double tInf = LambertianSlab.diffuseTransmission(60);
            assertEquals(1, LambertianSlab.absorbedFront(tInf, rb, rf), 1e-20);
            assertEquals(1, LambertianSlab.absorbedBack(tInf, rb, rf), 1e-20);
        }
    }

    @Test
    void bookkeepingCloses() {
        // source: device-model.md section 4.5 (absorbed + escaped + lost in the back electrode = 1)
        for (double kd : new double[] {0, 1e-3, 0.05, 0.4, 2, 10}) {
            double t1 = LambertianSlab.diffuseTransmission(kd);
            for (double rb : new double[] {0, 0.3, 0.9, 1}) {
                for (double rf : new double[] {0, 0.723, 0.99}) {
                    double front = LambertianSlab.absorbedFront(t1, rb, rf) + LambertianSlab.escapedFront(t1, rb, rf)
                            + LambertianSlab.lostBackFront(t1, rb, rf);
                    double back = LambertianSlab.absorbedBack(t1, rb, rf) + LambertianSlab.escapedBack(t1, rb, rf)
                            + LambertianSlab.lostBackBack(t1, rb, rf);
                    assertEquals(1, front, 1e-13);
                    assertEquals(1, back, 1e-13);
                }
            }
        }
    }

    @Test
    void escapeConeAndLightTrappingRaiseAbsorption() {
        // source: Yablonovitch 1982: R_f = 1 - (n_out/n)^2; n = 1.9 into air gives 0.7230
        assertEquals(1 - 1 / (1.9 * 1.9), LambertianSlab.escapeConeReflectance(1.9, 1.0), 1e-15);
        assertEquals(0.0, LambertianSlab.escapeConeReflectance(1.4, 1.5), 0);
        // common practice: more back reflection and more trapping absorb more in a weak absorber
        double t1 = LambertianSlab.diffuseTransmission(0.05);
        double single = LambertianSlab.absorbedFront(t1, 0, 0);
        double mirror = LambertianSlab.absorbedFront(t1, 0.9, 0);
        double trapped = LambertianSlab.absorbedFront(t1, 0.9, 0.723);
        assertEquals(1 - t1, single, 1e-15);
        assertTrue(single < mirror && mirror < trapped);
    }
}
