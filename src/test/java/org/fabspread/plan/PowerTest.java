package org.fabspread.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.junit.jupiter.api.Test;

class PowerTest {

    /**
     * P(T ≤ t) = ∫ Φ(t sqrt(v/ν) − δ) f_χ²ν(v) dv, integrated here independently of the series: v = w²,
     * composite 5-point Gauss–Legendre over w.
     */
    private static double integrated(double t, double nu, double delta) {
        ChiSquaredDistribution chi = new ChiSquaredDistribution(null, nu);
        NormalDistribution z = new NormalDistribution(null, 0, 1);
        double[] gx = {-0.9061798459386640, -0.5384693101056831, 0, 0.5384693101056831, 0.9061798459386640};
        double[] gw = {0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665,
                0.2369268850561891};
        double wMax = Math.sqrt(nu + 40 * Math.sqrt(2 * nu) + 40);
        int panels = 4000;
        double h = wMax / panels;
        double sum = 0;
        for (int i = 0; i < panels; i++) {
            double mid = (i + 0.5) * h;
            for (int j = 0; j < 5; j++) {
                double w = mid + 0.5 * h * gx[j];
                double v = w * w;
                sum += 0.5 * h * gw[j] * z.cumulativeProbability(t * w / Math.sqrt(nu) - delta) * chi.density(v) * 2 * w;
            }
        }
        return sum;
    }

    @Test
    void zeroNoncentralityIsTheCentralT() {
        // source: Lenth, Appl. Stat. 38, 185 (1989): with delta = 0 the noncentral t is Student's t
        for (double nu : new double[]{1, 2.5, 5, 17, 120}) {
            TDistribution t = new TDistribution(null, nu);
            for (double x : new double[]{-4, -1.3, -0.2, 0, 0.7, 2.1, 6}) {
                assertEquals(t.cumulativeProbability(x), NoncentralT.cdf(x, nu, 0), 1e-10, "nu " + nu + " t " + x);
            }
        }
    }

    @Test
    void seriesAgreesWithNumericalIntegration() {
        // source: definition T = (Z + delta)/sqrt(chi2_nu/nu), integrated numerically against the AS 243 series
        double[][] cases = {{2.571, 5, 2.5}, {-1, 3, 1}, {0.5, 10, -0.7}, {3, 40, 4}, {1.2, 2.2, 0.3}, {8, 12, 6}};
        for (double[] c : cases) {
            double series = NoncentralT.cdf(c[0], c[1], c[2]);
            assertEquals(integrated(c[0], c[1], c[2]), series, 1e-8, java.util.Arrays.toString(c));
            assertEquals(NoncentralT.cdfByIntegration(c[0], c[1], c[2]), series, 1e-8);
        }
    }

    @Test
    void powerAtSmallDegreesOfFreedomAndItsNormalApproximation() {
        // source: statistics-and-doe.md "Experiment plans": at nu = 5, delta = 2.5, alpha = 0.05 the exact
        // power is 0.523 and the normal approximation 0.705; the exact value is cross-checked by integration
        double exact = Power.power(2.5, 5, 0.05);
        assertEquals(0.523, exact, 5e-4);
        double tc = new TDistribution(null, 5).inverseCumulativeProbability(0.975);
        double byIntegral = 1 - integrated(tc, 5, 2.5) + integrated(-tc, 5, 2.5);
        assertEquals(byIntegral, exact, 1e-8);
        assertEquals(0.705, Power.normalApproximation(2.5, 0.05), 5e-4);
    }

    @Test
    void largeDegreesOfFreedomTendToTheNormalApproximation() {
        // source: statistics-and-doe.md: for large nu power -> Phi(delta - z) + Phi(-delta - z)
        for (double delta : new double[]{0.5, 1.5, 2.8, 4}) {
            assertEquals(Power.normalApproximation(delta, 0.05), Power.power(delta, 1e5, 0.05), 1e-4);
        }
        // at delta = 0 the power is the test's size
        assertEquals(0.05, Power.power(0, 7, 0.05), 1e-10);
    }

    @Test
    void powerRisesWithReplicatesAndTheSearchStopsAtTheFirstSufficient() {
        // common practice: more replicates raise both delta and nu, so power rises
        int runs = 8;
        double prev = 0;
        for (int r = 1; r <= 6; r++) {
            int rr = r;
            double nu = runs * rr - 1 - 4;
            double pw = Power.power(Power.noncentrality(1.0, 1.0, runs * rr), nu, 0.05);
            assertTrue(pw > prev, "r = " + r);
            prev = pw;
        }
        Power.Replicates need = Power.replicatesNeeded(1.0, 1.0, 8, r -> 8.0 * r - 5, 0.05, 0.8, 50);
        assertTrue(need.reached());
        assertTrue(need.power() >= 0.8);
        int r = need.replicates();
        double before = Power.power(Power.noncentrality(1.0, 1.0, 8 * (r - 1)), 8.0 * (r - 1) - 5, 0.05);
        assertTrue(before < 0.8);
        // normal approximation with nu -> infinity would need N >= (2 (z_.975 + z_.8))^2 = 31.4 runs; the
        // exact t answer cannot need fewer
        assertTrue(need.effectRuns() >= 32);
    }
}
