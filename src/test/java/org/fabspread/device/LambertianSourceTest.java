package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Diffuse light born inside the slab ({@link LambertianSlab#absorbedInside} and its two companions). */
class LambertianSourceTest {

    private static final double[] OPTICAL_DEPTHS = {0, 1e-6, 0.01, 0.2, 1, 3, 25};
    private static final double[] DEPTHS = {0, 1e-3, 0.25, 0.5, 0.9, 1};
    private static final double[] FORWARD = {0, 0.3, 0.5, 1};
    private static final double[] R_BACK = {0, 0.4, 0.93, 1};
    private static final double[] R_FRONT = {0, 0.723, 0.99};

    private static double t(double kappaS) {
        return LambertianSlab.diffuseTransmission(kappaS);
    }

    @Test
    void energyClosesForAnyDepth() {
        // source: conservation of energy (every ray is absorbed, leaves through the front or dies at the back);
        // device-model.md section 4.5 asks every wavelength to close
        for (double kd : OPTICAL_DEPTHS) {
            for (double zr : DEPTHS) {
                double t1 = t(kd);
                double tf = t(kd * zr);
                double tb = t(kd * (1 - zr));
                for (double f : FORWARD) {
                    for (double rb : R_BACK) {
                        for (double rf : R_FRONT) {
                            double a = LambertianSlab.absorbedInside(t1, tf, tb, f, rb, rf);
                            double e = LambertianSlab.escapedInside(t1, tf, tb, f, rb, rf);
                            double l = LambertianSlab.lostBackInside(t1, tf, tb, f, rb, rf);
                            assertEquals(1, a + e + l, 1e-12, "kd " + kd + " z/d " + zr + " f " + f);
                            assertTrue(a >= 0 && e >= 0 && l >= 0);
                        }
                    }
                }
            }
        }
    }

    @Test
    void facesReproduceFaceInjection() {
        // source: device-model.md section 4.5 (and the class comment of LambertianSlab): at z = 0 the
        // backward share meets the front at once, 1 - R_f escapes and R_f returns as front-injected light,
        // and the forward share is front-injected light; at z = d the mirror case with R_b
        for (double kd : new double[] {1e-4, 0.05, 0.7, 4}) {
            double t1 = t(kd);
            for (double f : FORWARD) {
                for (double rb : R_BACK) {
                    for (double rf : R_FRONT) {
                        double in = f + (1 - f) * rf;
                        double aFront = in * LambertianSlab.absorbedFront(t1, rb, rf);
                        double eFront = in * LambertianSlab.escapedFront(t1, rb, rf) + (1 - f) * (1 - rf);
                        double lFront = in * LambertianSlab.lostBackFront(t1, rb, rf);
                        assertEquals(aFront, LambertianSlab.absorbedInside(t1, 1, t1, f, rb, rf), 1e-15);
                        assertEquals(eFront, LambertianSlab.escapedInside(t1, 1, t1, f, rb, rf), 1e-15);
                        assertEquals(lFront, LambertianSlab.lostBackInside(t1, 1, t1, f, rb, rf), 1e-15);
                        double back = f * rb + (1 - f);
                        double aBack = back * LambertianSlab.absorbedBack(t1, rb, rf);
                        double eBack = back * LambertianSlab.escapedBack(t1, rb, rf);
                        double lBack = back * LambertianSlab.lostBackBack(t1, rb, rf) + f * (1 - rb);
                        assertEquals(aBack, LambertianSlab.absorbedInside(t1, t1, 1, f, rb, rf), 1e-15);
                        assertEquals(eBack, LambertianSlab.escapedInside(t1, t1, 1, f, rb, rf), 1e-15);
                        assertEquals(lBack, LambertianSlab.lostBackInside(t1, t1, 1, f, rb, rf), 1e-15);
                        // the limits are approached continuously
                        double zr = 1e-9;
                        assertEquals(aFront, LambertianSlab.absorbedInside(t1, t(kd * zr), t(kd * (1 - zr)), f, rb, rf),
                                1e-8);
                        assertEquals(aBack, LambertianSlab.absorbedInside(t1, t(kd * (1 - zr)), t(kd * zr), f, rb, rf),
                                1e-8);
                    }
                }
            }
        }
    }

    @Test
    void noAbsorptionWithoutAbsorber() {
        // source: device-model.md section 4.5: A_diff -> 0 as kappa -> 0
        for (double zr : DEPTHS) {
            double kd = 1e-12;
            for (double rb : new double[] {0, 0.5, 0.95}) {
                double a = LambertianSlab.absorbedInside(t(kd), t(kd * zr), t(kd * (1 - zr)), 0.5, rb, 0.723);
                assertEquals(0, a, 1e-9);
            }
        }
    }

    @Test
    void backwardShareLosesMoreNearTheFront() {
        // common practice (escape cone): the nearer the front a source lies, the more of its backward light
        // leaves before it is absorbed; a weak absorber with a good mirror
        double kd = 0.3;
        double t1 = t(kd);
        double previous = -1;
        for (double zr = 1; zr >= 0; zr -= 0.125) {
            double e = LambertianSlab.escapedInside(t1, t(kd * zr), t(kd * (1 - zr)), 0, 0.9, 0.723);
            assertTrue(e > previous, "z/d " + zr);
            previous = e;
        }
    }

    @Test
    void exponentialIntegralAgainstTheTable() {
        // from memory: Abramowitz & Stegun, Handbook of Mathematical Functions (1964), Table 5.1, E_n(x) for
        // n = 3, six decimals; cross-checked below by quadrature of the definition
        double[][] table = {{0.1, 0.416291}, {0.5, 0.221604}, {1.0, 0.109692}, {2.0, 0.030133}};
        for (double[] row : table) {
            assertEquals(row[1], LambertianSlab.expIntegral(3, row[0]), 1e-6, "E_3(" + row[0] + ")");
            assertEquals(row[1], 0.5 * t(row[0]), 1e-6, "T_1/2 at " + row[0]);
        }
    }

    /** 2 ∫₀¹ μ e^{−x/μ} dμ by composite Simpson's rule; the integrand and all its derivatives vanish at μ = 0. */
    private static double lambertianTransmission(double x) {
        int m = 100_000;
        double h = 1.0 / m;
        double s = 0;
        for (int i = 0; i <= m; i++) {
            double mu = i * h;
            double f = mu == 0 ? 0 : mu * Math.exp(-x / mu);
            s += (i == 0 || i == m ? 1 : (i % 2 == 1 ? 4 : 2)) * f;
        }
        return 2 * s * h / 3;
    }

    @Test
    void transmissionIsTheLambertianAverage() {
        // source: the angular average of the class comment, T(s) = 2 ∫₀¹ μ e^{−κs/μ} dμ, summed numerically
        // (Simpson's rule, common practice) against the closed form 2E_3 (A&S 5.1.4 with t = 1/μ)
        for (double x : new double[] {1e-4, 0.02, 0.3, 0.999, 1.0, 1.7, 5, 12}) {
            double num = lambertianTransmission(x);
            assertEquals(num, t(x), 1e-10 * Math.max(num, 1e-3), "x = " + x);
        }
        // and the A&S table entry at x = 1 a second way
        assertEquals(2 * 0.109692, lambertianTransmission(1.0), 2e-6);
    }
}
