package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class HechtCollectionTest {

    /** Composite Simpson rule of η over [x0, x1] (optical depth), divided by the width. */
    private static double simpsonMean(HechtCollection h, double x0, double x1) {
        int n = 20_000;
        double step = (x1 - x0) / n;
        double s = h.eta(x0) + h.eta(x1);
        for (int i = 1; i < n; i++) {
            s += (i % 2 == 1 ? 4 : 2) * h.eta(x0 + i * step);
        }
        return s * step / 3 / (x1 - x0);
    }

    @Test
    void driftLengthConvertsUnits() {
        // E = V_bi/d = 0.8 V / 1e-5 cm = 8e4 V/cm; l = mu tau E = 1e-8 cm^2/V * 8e4 V/cm = 8e-4 cm = 8000 nm
        // source: Hecht, Z. Phys. 77, 235 (1932) (drift length = mu tau E)
        assertEquals(8000.0, HechtCollection.driftLengthNm(1e-8, 0.8, 100), 1e-9);
        HechtCollection h = HechtCollection.of(1e-8, 2e-9, 0.8, 100, true);
        assertEquals(8000.0, h.electronDriftNm(), 1e-9);
        assertEquals(1600.0, h.holeDriftNm(), 1e-9);
    }

    @Test
    void builtInVoltageMustBePositive() {
        // source: device-model.md section 5 (Hecht at short circuit needs E > 0)
        assertThrows(IllegalArgumentException.class, () -> HechtCollection.of(1e-8, 1e-8, 0, 100, true));
        assertThrows(IllegalArgumentException.class, () -> HechtCollection.of(1e-8, 1e-8, -0.3, 100, false));
        assertThrows(IllegalArgumentException.class, () -> HechtCollection.of(-1e-8, 1e-8, 0.8, 100, false));
    }

    @Test
    void etaTendsToOneForLongDriftLengths() {
        // source: Hecht 1932: with both drift lengths >> d every carrier is collected
        for (boolean front : new boolean[] {true, false}) {
            HechtCollection h = HechtCollection.of(10.0, 10.0, 0.8, 100, front);
            for (double x = 0; x <= 100; x += 12.5) {
                assertEquals(1.0, h.eta(x), 1e-6);
            }
            assertEquals(1.0, h.uniformAverage(), 1e-6);
        }
    }

    @Test
    void etaMatchesTheHechtFormulaAtKnownPoints() {
        // source: Hecht 1932: eta(x) = (le/d)(1 - e^{-x/le}) + (lh/d)(1 - e^{-(d-x)/lh}), x from the electron contact
        double le = 50;
        double lh = 20;
        double d = 100;
        HechtCollection front = new HechtCollection(le, lh, d, true);
        HechtCollection back = new HechtCollection(le, lh, d, false);
        for (double x = 0; x <= d; x += 10) {
            double expected = le / d * (1 - Math.exp(-x / le)) + lh / d * (1 - Math.exp(-(d - x) / lh));
            assertEquals(expected, front.eta(x), 1e-14);
            // conventional cell: electrons at the back, so the electron-contact depth is d - x_opt
            assertEquals(expected, back.eta(d - x), 1e-14);
        }
        // at the electron contact only holes have to travel: eta(0) = (lh/d)(1 - e^{-d/lh})
        assertEquals(lh / d * (1 - Math.exp(-d / lh)), front.eta(0), 1e-15);
    }

    @Test
    void exponentialFormEqualsDirectFormBothOrientations() {
        // source: Hecht 1932, rearranged into exponentials of the optical depth (device-model.md section 5)
        double[] c = new double[HechtCollection.TERMS];
        double[] s = new double[HechtCollection.TERMS];
        for (boolean front : new boolean[] {true, false}) {
            for (double[] mt : new double[][] {{1e-8, 1e-8}, {1e-10, 3e-9}, {5e-12, 2e-11}, {1e-6, 1e-12}}) {
                HechtCollection h = HechtCollection.of(mt[0], mt[1], 0.8, 100, front);
                h.exponentials(c, s);
                for (double x = 0; x <= 100; x += 5) {
                    double sum = 0;
                    for (int m = 0; m < c.length; m++) {
                        sum += c[m] * Math.exp(s[m] * x);
                    }
                    assertEquals(h.eta(x), sum, 1e-9, "front=" + front + " x=" + x);
                }
            }
        }
    }

    @Test
    void weightedIntegralOfAProfileViaExponentials() {
        // a(x) = A e^{-k x} + B e^{k x} (a forward and a backward wave, no interference):
        // sum_m c_m * int a e^{s_m x} dx in closed form equals the numerical integral of a(x) eta(x)
        // source: device-model.md section 5 (closed-form weighted integrals of the profile)
        double d = 120;
        double kap = 0.02;
        double bigA = 0.01;
        double bigB = 0.002;
        HechtCollection h = new HechtCollection(90, 35, d, false);
        double[] c = h.coefficients();
        double[] s = h.rates();
        double closed = 0;
        for (int m = 0; m < c.length; m++) {
            closed += c[m] * (bigA * expIntegral0(s[m] - kap, d) + bigB * expIntegral0(s[m] + kap, d));
        }
        int n = 20_000;
        double step = d / n;
        double num = 0;
        for (int i = 0; i <= n; i++) {
            double x = i * step;
            double w = (i == 0 || i == n) ? 1 : (i % 2 == 1 ? 4 : 2);
            num += w * (bigA * Math.exp(-kap * x) + bigB * Math.exp(kap * x)) * h.eta(x);
        }
        num *= step / 3;
        assertEquals(num, closed, 1e-12 * Math.abs(num) + 1e-14);
    }

    @Test
    void weightedIntegralOfATransferMatrixProfile() {
        // source: device-model.md section 5 with CoherentStack.absorbedWeighted (closed form of the
        // field profile) against Simpson's rule on absorptionRate(x) * eta(x), both orientations
        org.fabspread.optics.CoherentStack stack = new org.fabspread.optics.CoherentStack(4);
        double[] n = {1.9, 2.0, 1.8, 0.13};
        double[] k = {0.01, 0.005, 0.35, 3.9};
        double[] d = {150, 30, 100, 100};
        stack.solve(550, 1.52, 4, n, k, d, 1.0, 0.0);
        for (boolean front : new boolean[] {true, false}) {
            HechtCollection h = HechtCollection.of(5e-11, 2e-10, 0.8, 100, front);
            double[] c = h.coefficients();
            double[] s = h.rates();
            double closed = 0;
            for (int m = 0; m < c.length; m++) {
                closed += c[m] * stack.absorbedWeighted(2, s[m]);
            }
            int steps = 4000;
            double step = 100.0 / steps;
            double num = 0;
            for (int i = 0; i <= steps; i++) {
                double x = i * step;
                double w = (i == 0 || i == steps) ? 1 : (i % 2 == 1 ? 4 : 2);
                num += w * stack.absorptionRate(2, x) * h.eta(x);
            }
            num *= step / 3;
            assertEquals(num, closed, 1e-9 * num, "front=" + front);
            assertTrue(closed < stack.absorptance(2));
        }
    }

    private static double expIntegral0(double r, double d) {
        return Math.abs(r) < 1e-12 ? d : Math.expm1(r * d) / r;
    }

    @Test
    void uniformAverageEqualsNumericalMean() {
        // source: device-model.md section 5: <eta> = sum_l (l/d)[1 - (l/d)(1 - e^{-d/l})], cross-checked
        // against Simpson's rule over eta(x)
        for (double[] ls : new double[][] {{50, 20}, {1, 1000}, {8000, 8000}, {3, 3}, {1e5, 0.5}}) {
            HechtCollection h = new HechtCollection(ls[0], ls[1], 100, true);
            double closed = h.uniformAverage();
            assertEquals(simpsonMean(h, 0, 100), closed, 1e-9);
            double manual = 0;
            for (double l : new double[] {h.electronDriftNm(), h.holeDriftNm()}) {
                manual += l / 100 * (1 - l / 100 * (1 - Math.exp(-100 / l)));
            }
            assertEquals(manual, closed, 1e-9);
            assertEquals(closed, h.averageOver(0, 100), 1e-12);
        }
    }

    @Test
    void averageOverASubSlabEqualsNumericalMean() {
        // source: Hecht 1932 integrated over a slab; Simpson's rule cross-check
        for (boolean front : new boolean[] {true, false}) {
            HechtCollection h = new HechtCollection(40, 70, 100, front);
            assertEquals(simpsonMean(h, 10, 35), h.averageOver(10, 35), 1e-11);
            assertEquals(simpsonMean(h, 80, 100), h.averageOver(80, 100), 1e-11);
            assertEquals(h.eta(42), h.averageOver(42, 42), 1e-15);
        }
    }

    @Test
    void collectionFallsWithShorterDriftLengths() {
        // common practice: lower mobility-lifetime products collect less
        double prev = 1.1;
        for (double mt : new double[] {1e-6, 1e-8, 1e-9, 1e-10, 1e-11}) {
            double avg = HechtCollection.of(mt, mt, 0.8, 100, true).uniformAverage();
            assertTrue(avg < prev && avg > 0);
            prev = avg;
        }
    }
}
