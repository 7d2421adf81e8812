package org.fabspread.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.function.DoubleUnaryOperator;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.distribution.LogNormalDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.RealDistribution;
import org.apache.commons.math3.distribution.TriangularDistribution;
import org.apache.commons.math3.distribution.UniformRealDistribution;
import org.apache.commons.math3.stat.descriptive.rank.Percentile;
import org.fabspread.study.DistributionSpec;
import org.junit.jupiter.api.Test;

class DistributionsTest {

    private static final double[] PS = {1e-12, 1e-6, 0.001, 0.01, 0.025, 0.1, 0.3, 0.5, 0.7, 0.9, 0.975, 0.99, 0.999, 1 - 1e-6};

    /** ∫ f over [a, b] by adaptive Gauss–Legendre (independent of the closed forms under test). */
    static double integrate(DoubleUnaryOperator f, double a, double b) {
        IterativeLegendreGaussIntegrator in = new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-15);
        double sum = 0;
        int pieces = 64;
        for (int i = 0; i < pieces; i++) {
            double x0 = a + (b - a) * i / pieces;
            double x1 = a + (b - a) * (i + 1) / pieces;
            sum += in.integrate(1_000_000, f::applyAsDouble, x0, x1);
        }
        return sum;
    }

    /** ∫₀¹ f dp over the k equal segments on which the raw empirical quantile function is smooth. */
    static double integrateSegments(DoubleUnaryOperator f, int k) {
        IterativeLegendreGaussIntegrator in = new IterativeLegendreGaussIntegrator(8, 1e-14, 1e-16);
        double sum = 0;
        for (int i = 0; i < k; i++) {
            sum += in.integrate(100_000, f::applyAsDouble, (double) i / k, (double) (i + 1) / k);
        }
        return sum;
    }

    /** Mean and sd from the density by quadrature over [a, b]. */
    static double[] momentsByDensity(Distribution d, double a, double b) {
        double mass = integrate(d::density, a, b);
        double m = integrate(x -> x * d.density(x), a, b) / mass;
        double v = integrate(x -> (x - m) * (x - m) * d.density(x), a, b) / mass;
        return new double[] {mass, m, Math.sqrt(v)};
    }

    static void agreesWithCommons(Distribution d, RealDistribution ref, double quantileTol) {
        for (double p : PS) {
            double x = d.inverseCdf(p);
            if (p >= 1e-3 && p <= 0.999) {
                // Commons Math's inverses lose the relative precision of p in the tails (they form 2p − 1
                // or use a root finder with an absolute tolerance): compared in the body only, the
                // tails are held by the round trip below
                assertEquals(ref.inverseCumulativeProbability(p), x, quantileTol * Math.max(1, Math.abs(x)), "quantile " + p);
            }
            assertEquals(ref.cumulativeProbability(x), d.cdf(x), 1e-13 + 1e-12 * p, "cdf at quantile " + p);
            assertEquals(ref.density(x), d.density(x), 1e-12 * Math.max(1, ref.density(x)), "density " + p);
            assertRoundTrip(d, p);
        }
        assertEquals(ref.getNumericalMean(), d.mean(), 1e-12 * Math.max(1, Math.abs(d.mean())));
        assertEquals(Math.sqrt(ref.getNumericalVariance()), d.standardDeviation(), 1e-12 * Math.max(1, d.standardDeviation()));
    }

    /** |F(F⁻¹(p)) − p| within the rounding of p and of the returned x (density × ulp). */
    static void assertRoundTrip(Distribution d, double p) {
        double x = d.inverseCdf(p);
        double dens = Double.isNaN(d.density(x)) ? 0 : d.density(x);
        double tol = 1e-12 * Math.min(p, 1 - p) + 4 * dens * Math.ulp(x) + 2 * Math.ulp(p);
        assertEquals(p, d.cdf(x), tol, "round trip p=" + p + " x=" + x);
    }

    @Test
    void standardNormalQuantileKeepsRelativePrecisionDownTo1eMinus300() {
        // source: Abramowitz & Stegun (1964), table 26.1: z_0.975 = 1.959963985 (to the table's digits)
        assertEquals(1.959963985, StandardNormal.quantile(0.975), 1e-9);
        NormalDistribution ref = new NormalDistribution(null, 0, 1);
        assertEquals(ref.inverseCumulativeProbability(0.975), StandardNormal.quantile(0.975), 1e-14);
        for (int k = 1; k <= 300; k++) {
            double p = Math.pow(10, -k);
            double z = StandardNormal.quantile(p);
            // relative error of Φ(z) from rounding z alone is about |z| ulp(z)
            assertEquals(1.0, StandardNormal.cdf(z) / p, 1e-14 + 4 * Math.abs(z) * Math.ulp(z), "p=1e-" + k);
            assertEquals(-z, StandardNormal.upperQuantile(p), 0.0);
        }
        for (double p = 0.001; p < 1; p += 0.001) {
            double z = StandardNormal.quantile(p);
            assertEquals(p, StandardNormal.cdf(z), 1e-15 + 2e-15 * p, "p=" + p);
            assertEquals(ref.inverseCumulativeProbability(p), z, 2e-13 * Math.max(1, Math.abs(z)));
        }
        assertEquals(Double.NEGATIVE_INFINITY, StandardNormal.quantile(0));
        assertTrue(Double.isFinite(StandardNormal.quantile(StandardNormal.P_MAX)));
        assertTrue(StandardNormal.P_MAX < 1 && StandardNormal.P_MAX + Math.ulp(StandardNormal.P_MAX) == 1.0);
    }

    @Test
    void normalMatchesCommonsMath() {
        // source: Commons Math 3.6.1 NormalDistribution (reference implementation)
        agreesWithCommons(Distributions.of(new DistributionSpec.Normal(100, 4)), new NormalDistribution(null, 100, 4), 1e-9);
    }

    @Test
    void lognormalFromMedianAndCvMatchesCommonsAndClosedForm() {
        double median = 60;
        double cv = 0.25;
        Distribution d = Distributions.of(new DistributionSpec.LogNormal(median, cv));
        double s = Math.sqrt(Math.log1p(cv * cv));
        // source: Johnson, Kotz & Balakrishnan, Continuous Univariate Distributions vol. 1 (1994), ch. 14:
        // median e^mu, mean e^(mu + s^2/2), CV^2 = e^(s^2) - 1
        LogNormalDistribution ref = new LogNormalDistribution(null, Math.log(median), s);
        agreesWithCommons(d, ref, 1e-8);
        assertEquals(median, d.inverseCdf(0.5), 1e-12 * median);
        assertEquals(cv, d.standardDeviation() / d.mean(), 1e-14);
        double[] m = momentsByDensity(d, 1e-9, 400);
        assertEquals(1.0, m[0], 1e-10);
        assertEquals(d.mean(), m[1], 1e-8);
        assertEquals(d.standardDeviation(), m[2], 1e-8);
        assertEquals(median, d.nominal());
    }

    @Test
    void uniformAndTriangularMatchCommonsMath() {
        // source: Commons Math 3.6.1 UniformRealDistribution, TriangularDistribution
        agreesWithCommons(Distributions.of(new DistributionSpec.Uniform(2, 5)), new UniformRealDistribution(null, 2, 5), 1e-13);
        agreesWithCommons(Distributions.of(new DistributionSpec.Triangular(1, 2, 6)), new TriangularDistribution(null, 1, 2, 6), 1e-12);
        agreesWithCommons(Distributions.of(new DistributionSpec.Triangular(0, 0, 3)), new TriangularDistribution(null, 0, 0, 3), 1e-12);
        Distribution t = Distributions.of(new DistributionSpec.Triangular(1, 2, 6));
        double[] m = momentsByDensity(t, 1, 6);
        // source: closed form mean (a+b+c)/3 against quadrature of the density
        assertEquals(3.0, t.mean(), 1e-15);
        assertEquals(t.mean(), m[1], 1e-10);
        assertEquals(t.standardDeviation(), m[2], 1e-10);
    }

    @Test
    void truncatedNormalMomentsAgainstQuadrature() {
        Distribution d = Distributions.of(new DistributionSpec.TruncatedNormal(100, 10, 85, 130));
        double[] m = momentsByDensity(d, 85, 130);
        // source: Johnson, Kotz & Balakrishnan vol. 1 (1994), sec. 13.10 (truncated normal moments),
        // checked against a quadrature of the density
        assertEquals(1.0, m[0], 1e-12);
        assertEquals(m[1], d.mean(), 1e-10);
        assertEquals(m[2], d.standardDeviation(), 1e-10);
        NormalDistribution parent = new NormalDistribution(null, 100, 10);
        double kept = parent.cumulativeProbability(130) - parent.cumulativeProbability(85);
        assertEquals(1 - kept, d.truncatedMass(), 1e-14);
        for (double p : PS) {
            double x = d.inverseCdf(p);
            assertTrue(x >= 85 && x <= 130);
            assertRoundTrip(d, p);
            // exact inverse CDF on the range: Φ(α) + p (Φ(β) − Φ(α)) = Φ((x − μ)/σ)
            assertEquals(parent.cumulativeProbability(85) + p * kept, parent.cumulativeProbability(x), 1e-13);
        }
    }

    @Test
    void truncatedNormalFarUpperTail() {
        Distribution d = Distributions.of(new DistributionSpec.TruncatedNormal(0, 1, 5, Double.POSITIVE_INFINITY));
        // from memory: Q(5) = 1 − Φ(5) = 2.866515718791939e-7; cross-checked by quadrature of φ over [5, 40]
        double q5 = 2.866515718791939e-7;
        double q5quad = integrate(StandardNormal::density, 5, 40);
        assertEquals(q5, q5quad, 1e-12 * q5);
        assertEquals(1 - q5, d.truncatedMass(), 1e-16);
        // source: inverse Mills ratio, mean of N(0,1) on [a, ∞) = φ(a)/Q(a) (Johnson, Kotz & Balakrishnan
        // vol. 1 (1994), sec. 13.10); checked against quadrature
        double mean = StandardNormal.density(5) / q5;
        assertEquals(mean, d.mean(), 1e-10 * mean);
        double[] m = momentsByDensity(d, 5, 15);
        assertEquals(1.0, m[0], 1e-9);
        assertEquals(m[1], d.mean(), 1e-9);
        assertEquals(m[2], d.standardDeviation(), 1e-7);
        double prev = 5;
        for (double p : new double[] {StandardNormal.P_MIN, 1e-9, 0.1, 0.5, 0.9, 1 - 1e-9, StandardNormal.P_MAX}) {
            double x = d.inverseCdf(p);
            assertTrue(Double.isFinite(x) && x >= prev, "p=" + p + " x=" + x);
            prev = x;
            assertRoundTrip(d, p);
        }
        // median: Q(x) = Q(5)/2
        assertEquals(q5 / 2, StandardNormal.upperCdf(d.inverseCdf(0.5)), 1e-13 * q5);
    }

    @Test
    void truncatedNormalLowerTailAndTinyRemovedMass() {
        Distribution low = Distributions.of(new DistributionSpec.TruncatedNormal(0, 2, Double.NEGATIVE_INFINITY, -12));
        double q6 = StandardNormal.cdf(-6);
        assertEquals(1 - q6, low.truncatedMass(), 1e-16);
        assertEquals(0.5 * q6, StandardNormal.cdf(low.inverseCdf(0.5) / 2), 1e-12 * q6);
        Distribution wide = Distributions.of(new DistributionSpec.TruncatedNormal(0, 1, -10, 10));
        // from memory: Q(10) = 7.619853024160527e-24; cross-checked by quadrature of φ over [10, 40]
        double q10 = 7.619853024160527e-24;
        assertEquals(q10, integrate(StandardNormal::density, 10, 40), 1e-10 * q10);
        assertEquals(2 * q10, wide.truncatedMass(), 1e-12 * q10);
        assertThrows(IllegalArgumentException.class,
                () -> Distributions.of(new DistributionSpec.TruncatedNormal(0, 1, 50, 60)));
    }

    @Test
    void rawEmpiricalIsTheInterpolatedInverseEcdfWithItsExactMoments() {
        double[] v = {3.1, 2.4, 5.0, 4.4, 3.9, 2.9, 3.3, 4.1};
        Distribution d = Distributions.of(new DistributionSpec.Empirical(v, false, "test"));
        Percentile r7 = new Percentile().withEstimationType(Percentile.EstimationType.R_7);
        for (double p : new double[] {0.01, 0.1, 0.25, 0.5, 0.75, 0.9, 0.99}) {
            // source: Hyndman & Fan, Am. Stat. 50, 361 (1996), definition 7 (Commons Math R_7)
            assertEquals(r7.evaluate(v, p * 100), d.inverseCdf(p), 1e-14);
            assertEquals(p, d.cdf(d.inverseCdf(p)), 1e-14);
        }
        // moments of what is sampled: E X = ∫ F⁻¹(p) dp, checked by quadrature over p
        double m = integrateSegments(d::inverseCdf, v.length - 1);
        double var = integrateSegments(p -> Math.pow(d.inverseCdf(p) - m, 2), v.length - 1);
        assertEquals(m, d.mean(), 1e-10);
        assertEquals(Math.sqrt(var), d.standardDeviation(), 1e-9);
        assertEquals(2.4, d.supportLower());
        assertEquals(5.0, d.supportUpper());
        assertEquals(new DistributionSpec.Empirical(v, false, "test").nominal(), d.nominal(), 1e-15);
    }

    @Test
    void smoothedEmpiricalIsAGaussianKernelDensity() {
        double[] v = {3.1, 2.4, 5.0, 4.4, 3.9, 2.9, 3.3, 4.1, 3.6, 3.0};
        Distributions.Empirical d = (Distributions.Empirical) Distributions.of(new DistributionSpec.Empirical(v, true, "test"));
        org.apache.commons.math3.stat.descriptive.DescriptiveStatistics ds = new org.apache.commons.math3.stat.descriptive.DescriptiveStatistics(v);
        double iqr = new Percentile().withEstimationType(Percentile.EstimationType.R_7).evaluate(v, 75)
                - new Percentile().withEstimationType(Percentile.EstimationType.R_7).evaluate(v, 25);
        // source: Silverman, Density Estimation for Statistics and Data Analysis (1986), eq. 3.31
        double h = 0.9 * Math.min(ds.getStandardDeviation(), iqr / 1.34) * Math.pow(v.length, -0.2);
        assertEquals(h, d.bandwidth(), 1e-14);
        double[] m = momentsByDensity(d, 2.4 - 15 * h, 5.0 + 15 * h);
        assertEquals(1.0, m[0], 1e-10);
        assertEquals(m[1], d.mean(), 1e-10);
        assertEquals(m[2], d.standardDeviation(), 1e-9);
        for (double p : new double[] {StandardNormal.P_MIN, 1e-9, 0.05, 0.5, 0.95, 1 - 1e-9}) {
            assertRoundTrip(d, p);
        }
    }

    @Test
    void badParametersAreRejected() {
        assertThrows(IllegalArgumentException.class, () -> Distributions.of(new DistributionSpec.Normal(0, 0)));
        assertThrows(IllegalArgumentException.class, () -> Distributions.of(new DistributionSpec.LogNormal(-1, 0.1)));
        assertThrows(IllegalArgumentException.class, () -> Distributions.of(new DistributionSpec.Triangular(0, 5, 3)));
        assertThrows(IllegalArgumentException.class, () -> Distributions.of(new DistributionSpec.Empirical(new double[] {1}, false, "t")));
    }
}
