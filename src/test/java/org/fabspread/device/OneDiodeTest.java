package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class OneDiodeTest {

    @Test
    void lambertWSolvesItsDefiningEquation() {
        // source: Corless et al., Adv. Comput. Math. 5, 329 (1996): W(x) e^{W(x)} = x; W(e) = 1; W(0) = 0
        assertEquals(1.0, LambertW.w0(Math.E), 1e-15);
        assertEquals(0.0, LambertW.w0(0), 0);
        // from memory: the omega constant W(1) = 0.5671432904097838; cross-checked by w e^w = 1
        double omega = LambertW.w0(1);
        assertEquals(0.5671432904097838, omega, 1e-15);
        assertEquals(1.0, omega * Math.exp(omega), 1e-15);
        for (double x : new double[] {1e-300, 1e-12, 0.01, 0.3, 2, 10, 1e3, 1e12, 1e300}) {
            double w = LambertW.w0(x);
            assertEquals(Math.log(x), w + Math.log(w), 1e-13 * Math.max(1, Math.abs(Math.log(x))), "x=" + x);
        }
        // log-argument form far beyond double range: w + ln w = L
        for (double logX : new double[] {-700, -5, 0.5, 1, 1.0000001, 2, 800, 1e4, 1e8}) {
            double w = LambertW.ofExp(logX);
            assertEquals(logX, w + Math.log(w), 1e-14 * Math.max(1, Math.abs(logX)), "L=" + logX);
        }
    }

    @Test
    void idealDiodeOpenCircuitVoltage() {
        // source: Green, Solar Cells (1982), ch. 5: V_oc = n kT/q ln(J_L/J_0 + 1) for R_s = 0, R_sh = inf
        OneDiode d = new OneDiode(20, 1e-9, 1.5, 0, Double.POSITIVE_INFINITY, 300);
        double a = 1.5 * OneDiode.K_OVER_Q * 300;
        assertEquals(a * Math.log(20 / 1e-9 + 1), d.openCircuitVoltage(), 1e-13);
        assertEquals(20.0, d.shortCircuitCurrent(), 1e-13);
        // kT/q at 300 K is 25.852 mV (common practice); cross-checked from k and q above
        assertEquals(0.025852, OneDiode.K_OVER_Q * 300, 1e-6);
    }

    @Test
    void fillFactorMatchesGreensExpression() {
        // source: Green, Solar Cells (1982): FF = (v - ln(v + 0.72))/(v + 1), v = V_oc/(n kT/q),
        // within 2e-4 at v = 10 and 1e-4 for v >= 15 (model document section 5)
        double jl = 18;
        for (double v : new double[] {10, 15, 20, 30, 40}) {
            double j0 = jl / Math.expm1(v);
            OneDiode d = new OneDiode(jl, j0, 1.3, 0, Double.POSITIVE_INFINITY, 298.15);
            OneDiode.Performance p = d.performance();
            assertEquals(v, p.openCircuitVoltage() / d.thermalVoltage(), 1e-10);
            double green = (v - Math.log(v + 0.72)) / (v + 1);
            assertEquals(green, p.fillFactor(), v < 15 ? 2e-4 : 1e-4, "v=" + v);
            assertEquals(p.maxPower() / 100, p.efficiency(), 1e-15);
            assertEquals(p.maxPower(), p.openCircuitVoltage() * p.shortCircuitCurrent() * p.fillFactor(), 1e-12);
        }
    }

    @Test
    void lambertWSolutionSatisfiesTheImplicitEquation() {
        // source: Jain & Kapoor, Sol. Energy Mater. Sol. Cells 81, 269 (2004): the explicit J(V), V(J) solve
        // J = J_L - J_0 (e^{(V + J R_s)/(n V_T)} - 1) - (V + J R_s)/R_sh exactly
        double jl = 17;
        double j0 = 1e-7;
        double n = 1.6;
        double t = 300;
        for (double rs : new double[] {0, 0.5, 3, 15}) {
            for (double rsh : new double[] {200, 1500, Double.POSITIVE_INFINITY}) {
                OneDiode d = new OneDiode(jl, j0, n, rs, rsh, t);
                double a = d.thermalVoltage();
                for (double v = -0.1; v <= 0.9; v += 0.05) {
                    double j = d.current(v);
                    double vd = v + j * rs * 1e-3;
                    double rhs = jl - j0 * Math.expm1(vd / a) - (Double.isInfinite(rsh) ? 0 : vd / (rsh * 1e-3));
                    assertEquals(rhs, j, 1e-9 * Math.max(1, Math.abs(j)), "rs=" + rs + " rsh=" + rsh + " v=" + v);
                    if (j < jl) {
                        // V(J) near J_L without a shunt is ill-conditioned in V, so compare currents
                        assertEquals(j, d.current(d.voltage(j)), 1e-10 * Math.max(1, Math.abs(j)));
                    }
                }
                assertEquals(0, d.current(d.openCircuitVoltage()), 1e-9);
            }
        }
    }

    @Test
    void seriesAndShuntResistanceLowerJscAndFillFactor() {
        // source: Green, Solar Cells (1982), ch. 5: J_sc read off the curve is below J_L when R_s > 0 with
        // a finite shunt, or the shunt is finite; FF falls as R_s rises
        double jl = 15;
        OneDiode ideal = new OneDiode(jl, 1e-8, 1.5, 0, Double.POSITIVE_INFINITY, 300);
        assertEquals(jl, ideal.performance().shortCircuitCurrent(), 1e-12);
        assertTrue(new OneDiode(jl, 1e-8, 1.5, 0, 500, 300).shortCircuitCurrent() == jl); // R_s = 0: V = 0 across the shunt
        assertTrue(new OneDiode(jl, 1e-8, 1.5, 5, 500, 300).shortCircuitCurrent() < jl);
        double prev = ideal.performance().fillFactor();
        for (double rs : new double[] {0.5, 2, 5, 10, 20}) {
            double ff = new OneDiode(jl, 1e-8, 1.5, rs, 1000, 300).performance().fillFactor();
            assertTrue(ff < prev, "rs=" + rs);
            prev = ff;
        }
        double prevSh = 1;
        for (double rsh : new double[] {1e5, 3000, 800, 300}) {
            double ff = new OneDiode(jl, 1e-8, 1.5, 1, rsh, 300).performance().fillFactor();
            assertTrue(ff < prevSh, "rsh=" + rsh);
            prevSh = ff;
        }
    }

    @Test
    void maximumPowerPointIsAMaximum() {
        // common practice: dP/dV = 0 at the maximum power point; checked against a fine voltage scan
        OneDiode d = new OneDiode(16, 1e-8, 1.7, 4, 600, 310);
        OneDiode.Performance p = d.performance();
        double best = 0;
        for (double v = 0; v <= p.openCircuitVoltage(); v += 1e-4) {
            best = Math.max(best, v * d.current(v));
        }
        assertTrue(p.maxPower() >= best - 1e-12);
        assertTrue(p.maxPower() - best < 1e-6);
        assertEquals(p.maxPowerCurrent(), d.current(p.maxPowerVoltage()), 1e-12);
    }

    @Test
    void smallSeriesResistanceApproachesTheClosedCase() {
        // source: Jain & Kapoor 2004 (the W form tends to the R_s = 0 closed form as R_s -> 0)
        OneDiode zero = new OneDiode(20, 1e-9, 1.4, 0, 800, 300);
        // R_s = 1e-9 ohm cm^2 shifts the diode voltage by J R_s ~ 2e-11 V: a current change below 1e-9
        OneDiode tiny = new OneDiode(20, 1e-9, 1.4, 1e-9, 800, 300);
        for (double v = 0; v < 0.8; v += 0.1) {
            assertEquals(zero.current(v), tiny.current(v), 1e-8);
        }
    }

    @Test
    void badParametersAreRejected() {
        // common practice: J_0, n, T and R_sh must be positive
        assertThrows(IllegalArgumentException.class, () -> new OneDiode(10, 0, 1.5, 0, 100, 300));
        assertThrows(IllegalArgumentException.class, () -> new OneDiode(10, 1e-9, 1.5, -1, 100, 300));
        assertThrows(IllegalArgumentException.class, () -> new OneDiode(10, 1e-9, 1.5, 0, 0, 300));
        assertThrows(IllegalArgumentException.class, () -> new OneDiode(10, 1e-9, 1.5, 0, 100, 0));
        OneDiode.Performance dark = new OneDiode(0, 1e-9, 1.5, 1, 100, 300).performance();
        assertEquals(0, dark.maxPower(), 0);
        assertEquals(0, dark.openCircuitVoltage(), 1e-12);
    }
}
