package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;

class TailFitTest {

    private static final NormalDistribution STD = new NormalDistribution(null, 0, 1);
    /** Φ⁻¹(1 − 1e-4). */
    private static final double Z4 = STD.inverseCumulativeProbability(1 - 1e-4);

    private static Target atLeast(double v) {
        return new Target("y", true, v, "mA/cm^2", SourceLocation.unknown("targets[0]"));
    }

    private static Target atMost(double v) {
        return new Target("y", false, v, "mA/cm^2", SourceLocation.unknown("targets[0]"));
    }

    private static SampleTable table(double[] y) {
        boolean[] ok = new boolean[y.length];
        java.util.Arrays.fill(ok, true);
        return new SampleTable(List.of("x1"), List.of("y"), new double[][] {y.clone()}, new double[][] {y}, ok);
    }

    private static double[] normal(int n, double mean, double sd, long seed) {
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(
                RandomSource.XO_SHI_RO_256_PP.create(new long[] {seed, 7}));
        double[] y = new double[n];
        for (int j = 0; j < n; j++) {
            y[j] = mean + sd * g.sample();
        }
        return y;
    }

    private static double[] gpd(GeneralizedPareto d, int n, long seed) {
        UniformRandomProvider rng = RandomSource.XO_SHI_RO_256_PP.create(new long[] {seed, 3});
        double[] y = new double[n];
        for (int j = 0; j < n; j++) {
            y[j] = d.inverseCdf(rng.nextDouble());
        }
        return y;
    }

    @Test
    void probabilityWeightedMomentsOfTheParetoAreAsDerived() {
        IterativeLegendreGaussIntegrator quad = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-14);
        for (double xi : new double[] {0.2, -0.3}) {
            GeneralizedPareto d = new GeneralizedPareto(xi, 1.5);
            // source: Hosking & Wallis, Technometrics 29, 339 (1987): a_s = E[Y (1 − F)^s] = σ/((s + 1)(s + 1 − ξ));
            // cross-checked by integrating the quantile function, a_s = ∫ Q(p) (1 − p)^s dp, with 1 − p = e^(−v)
            // to smooth the end point (the integral beyond v = 35 is below 1e-11)
            double a0 = quad.integrate(1_000_000, v -> d.inverseCdf(-Math.expm1(-v)) * Math.exp(-v), 0, 35);
            double a1 = quad.integrate(1_000_000, v -> d.inverseCdf(-Math.expm1(-v)) * Math.exp(-2 * v), 0, 35);
            assertEquals(1.5 / (1 - xi), a0, 1e-6);
            assertEquals(1.5 / (2 * (2 - xi)), a1, 1e-7);
            // survival and quantile are inverse to each other; ξ → 0 tends to the exponential
            assertEquals(0.25, d.survival(d.inverseCdf(0.75)), 1e-12);
            // an evenly spread "sample" of quantiles at (i − 0.5)/n has PWMs within O(1/n) of the population's
            int n = 200_000;
            double[] y = new double[n];
            for (int i = 0; i < n; i++) {
                y[i] = d.inverseCdf((i + 0.5) / n);
            }
            GeneralizedPareto fit = GeneralizedPareto.fitPwm(y);
            assertEquals(xi, fit.shape(), 2e-3);
            assertEquals(1.5, fit.scale(), 2e-3);
        }
        assertEquals(Math.exp(-2.0 / 1.5), new GeneralizedPareto(1e-12, 1.5).survival(2), 1e-10);
        assertEquals(new GeneralizedPareto(0, 1.5).survival(2), new GeneralizedPareto(1e-7, 1.5).survival(2), 1e-6);
        assertEquals(0, new GeneralizedPareto(-0.5, 1).survival(2.5), 0); // beyond the end −σ/ξ = 2
    }

    @Test
    void pwmRecoversKnownParametersFromSimulatedSamples() {
        for (double[] par : new double[][] {{0.2, 1.5}, {-0.25, 2.0}}) {
            GeneralizedPareto truth = new GeneralizedPareto(par[0], par[1]);
            // the estimator's spread measured on 30 replicate samples of 4000
            int reps = 30;
            double[] xi = new double[reps];
            double[] sigma = new double[reps];
            for (int r = 0; r < reps; r++) {
                GeneralizedPareto f = GeneralizedPareto.fitPwm(gpd(truth, 4000, 100 + r));
                xi[r] = f.shape();
                sigma[r] = f.scale();
            }
            double sdXi = Math.sqrt(Stats.variance(xi));
            double sdSigma = Math.sqrt(Stats.variance(sigma));
            // source: Hosking & Wallis (1987): PWM estimators are consistent, with small bias for ξ < 1/2;
            // the replicate mean lies within 4 standard errors of the truth
            assertEquals(par[0], Stats.mean(xi), 4 * sdXi / Math.sqrt(reps));
            assertEquals(par[1], Stats.mean(sigma), 4 * sdSigma / Math.sqrt(reps));
            // one large sample of 40000: the spread shrinks as 1/√n, so 4 sd·√(4000/40000)
            GeneralizedPareto big = GeneralizedPareto.fitPwm(gpd(truth, 40_000, 1));
            assertEquals(par[0], big.shape(), 4 * sdXi * Math.sqrt(0.1));
            assertEquals(par[1], big.scale(), 4 * sdSigma * Math.sqrt(0.1));
            assertTrue(sdXi < 0.05, "sd of xi at n = 4000: " + sdXi);
        }
    }

    /** Population PWM fit to the excesses of a standard normal over its (1 − ζ) quantile; P(Z > z) predicted. */
    private static double penultimateRatio(double zeta, double z) {
        IterativeLegendreGaussIntegrator quad = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-15);
        double u = STD.inverseCumulativeProbability(1 - zeta);
        // excess Y = Z − u given Z > u: S(y) = Φ̄(u + y)/ζ; a0 = ∫ S dy, a1 = E[Y S(Y)] = ∫ y S(y) φ(u + y)/ζ dy
        double a0 = quad.integrate(1_000_000, y -> TailYield.upperTail(u + y) / zeta, 0, 40);
        double a1 = quad.integrate(1_000_000, y -> y * TailYield.upperTail(u + y) / zeta * STD.density(u + y) / zeta,
                0, 40);
        double k = a0 / (a0 - 2 * a1) - 2;
        GeneralizedPareto g = new GeneralizedPareto(-k, 2 * a0 * a1 / (a0 - 2 * a1));
        return zeta * g.survival(z - u) / TailYield.upperTail(z);
    }

    @Test
    void aTenPercentThresholdUnderstatesANormalTailAndAOnePercentOneHardly() {
        // source: numerical integration (this test); the figures the automatic threshold rests on
        // (TailFit.Options.tailFraction): top 10 % → 1e-4 predicted as 0.24e-4, top 1 % → 0.94e-4, top 0.5 % → 0.99e-4
        assertEquals(0.237, penultimateRatio(0.10, Z4), 0.01);
        assertEquals(0.942, penultimateRatio(0.01, Z4), 0.01);
        assertEquals(0.985, penultimateRatio(0.005, Z4), 0.01);
        TailFit.Options o = TailFit.Options.defaults();
        assertEquals(0.10, o.tailFraction(1000), 0);
        assertEquals(0.03, o.tailFraction(10_000), 1e-12);
        assertEquals(0.005, o.tailFraction(100_000), 0);
    }

    @Test
    void normalDataAtOneInTenThousandIsExtrapolatedWithinAFactorOfTwo() {
        // y ~ N(20, 0.5), spec y >= 20 − 0.5 z with Φ(−z) = 1e-4
        double limit = 20 - 0.5 * Z4;
        double truth = 1e-4; // source: closed form, P(y < limit) = Φ(−z) by construction
        // Tolerance: the top 0.5 % of 1e5 samples (500 exceedances) extrapolated two decades; the population fit
        // is 0.99x the truth (test above) and the log ratio's sampling spread is about 0.3 (40 trial seeds: ratios
        // 0.6-1.6), so a factor of 2 is about 2.3 spreads.
        int within = 0;
        for (long seed = 1; seed <= 4; seed++) {
            double[] y = normal(100_000, 20, 0.5, seed);
            TailFitResult r = TailFit.of(table(y), atLeast(limit), TailFit.Options.defaults().withBootstrap(200)
                    .withSeed(seed));
            assertEquals("generalised-pareto", r.preferred());
            assertEquals("below", r.failureSide());
            double ratio = r.pareto().probability() / truth;
            within += ratio > 0.5 && ratio < 2 ? 1 : 0;
            // the normal fit is the right model here: within 15 % (sd of the mean and sd over 1e5 samples moves
            // Φ(−3.72) by about 4 %), and its interval covers the truth
            assertEquals(truth, r.normal().probability(), 0.15 * truth);
            assertTrue(r.normal().low() <= truth && truth <= r.normal().high(), r.normal().toString());
            assertEquals(1 - r.pareto().probability(), r.yield(), 0);
            assertTrue(r.pareto().low() < r.pareto().probability() && r.pareto().probability() < r.pareto().high());
            assertTrue(r.caveat().contains("assumes the tail keeps the generalised Pareto shape"), r.caveat());
            assertEquals(500, r.pareto().exceedances());
        }
        assertEquals(4, within);
    }

    @Test
    void aSkewedTailDefeatsTheNormalFitButNotThePareto() {
        // y = exp(0.5 Z): lognormal; spec y <= exp(0.5 z) with Φ(−z) = 1e-4, so P(fail) = 1e-4 exactly
        double[] y = normal(100_000, 0, 0.5, 21);
        for (int j = 0; j < y.length; j++) {
            y[j] = Math.exp(y[j]);
        }
        TailFitResult r = TailFit.of(table(y), atMost(Math.exp(0.5 * Z4)), TailFit.Options.defaults().withBootstrap(200));
        double truth = 1e-4; // source: closed form, P(exp(0.5 Z) > exp(0.5 z)) = Φ(−z)
        assertEquals("above", r.failureSide());
        double ratio = r.pareto().probability() / truth;
        assertTrue(ratio > 0.5 && ratio < 2, "Pareto ratio " + ratio);
        // the normal fit puts the limit ~7 sd out (the lognormal mean is 1.13, its sd 0.60): a gross understatement
        assertTrue(r.normal().probability() < 1e-8, r.normal().toString());
        assertTrue(r.pareto().shape() > r.pareto().shapeLow() && r.pareto().shape() < r.pareto().shapeHigh());
    }

    @Test
    void mirroredTargetsGiveTheSameAnswer() {
        double[] y = normal(20_000, 5, 1, 3);
        double[] m = new double[y.length];
        for (int j = 0; j < y.length; j++) {
            m[j] = -y[j];
        }
        TailFitResult low = TailFit.of(table(y), atLeast(5 - 3.2), TailFit.Options.defaults().withBootstrap(100));
        TailFitResult high = TailFit.of(table(m), atMost(-5 + 3.2), TailFit.Options.defaults().withBootstrap(100));
        assertEquals(low.pareto().probability(), high.pareto().probability(), 1e-15);
        assertEquals(low.pareto().low(), high.pareto().low(), 1e-15);
        assertEquals(low.normal().probability(), high.normal().probability(), 1e-15);
        assertEquals(low.counted(), high.counted());
        assertEquals(-low.pareto().threshold(), high.pareto().threshold(), 0);
        assertEquals(low, TailFit.of(table(y), atLeast(5 - 3.2), TailFit.Options.defaults().withBootstrap(100)),
                "same seed, same result");
    }

    @Test
    void commonFailuresAreCountedAndSmallSamplesFallBackToTheNormal() {
        double[] y = normal(5000, 0, 1, 4);
        // P(y > 1) = 16 %, more than the 6 % tail fraction used for 5000 samples (300/5000): the count answers
        TailFitResult common = TailFit.of(table(y), atMost(1.0), TailFit.Options.defaults().withBootstrap(50));
        assertEquals("counted", common.preferred());
        assertFalse(common.pareto().applicable());
        assertTrue(common.caveat().contains("counted directly"), common.caveat());
        double truth = TailYield.upperTail(1.0); // source: closed form Φ(−1)
        assertTrue(common.counted().low() <= truth && truth <= common.counted().high(), common.counted().toString());

        TailFitResult small = TailFit.of(table(java.util.Arrays.copyOf(y, 200)), atMost(3.5),
                TailFit.Options.defaults().withBootstrap(50));
        assertFalse(small.pareto().applicable(), "20 exceedances are fewer than 30");
        assertEquals("normal", small.preferred());
        assertEquals(small.normal().probability(), 1 - small.yield(), 1e-15);
    }

    @Test
    void failedSamplesAreLeftOut() {
        double[] y = normal(4000, 0, 1, 5);
        boolean[] ok = new boolean[y.length];
        java.util.Arrays.fill(ok, true);
        for (int j = 0; j < 100; j++) {
            ok[j * 7] = false;
            y[j * 7] = Double.NaN;
        }
        TailFitResult r = TailFit.of(new SampleTable(List.of("x1"), List.of("y"), new double[][] {y}, new double[][] {y},
                ok), atMost(3.0), TailFit.Options.defaults().withBootstrap(50));
        assertEquals(3900, r.samples());
        assertEquals(100, r.failedSamples());
        assertTrue(Double.isFinite(r.normal().probability()));
    }

    @Test
    void resultSerialisesToJsonAndRendersAsText() throws Exception {
        double[] y = normal(20_000, 15, 0.4, 6);
        List<TailFitResult> rs = TailFit.of(table(y), List.of(atLeast(15 - 0.4 * 3.5), atMost(15 + 0.4 * 3.8)),
                TailFit.Options.defaults().withBootstrap(100));
        ObjectMapper json = new ObjectMapper();
        String text = json.writeValueAsString(rs);
        TailFitResult[] back = json.readValue(text, TailFitResult[].class);
        assertEquals(rs.get(0), back[0]);
        assertEquals(rs.get(1), back[1]);
        assertEquals("generalised-pareto", json.readTree(text).get(0).get("preferred").asText());
        String s = TailText.render(rs);
        assertTrue(s.contains("Fitted tail of y >= "), s);
        assertTrue(s.contains("gen. Pareto  P(fail)"), s);
        assertTrue(s.contains("from the generalised-pareto estimate"), s);
        assertEquals(12, s.lines().count(), s);
    }
}
