package org.fabspread.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.function.Function;

import org.apache.commons.math3.distribution.TDistribution;
import org.junit.jupiter.api.Test;

class CalibrationPiecesTest {

    static final double[] X = {0.8, 0.9, 1.0, 1.1, 1.2, 1.3};
    static final double[] Y = {1.62, 1.79, 2.03, 2.18, 2.41, 2.62};

    @Test
    void profileIntervalOfALinearModelIsTheExactTInterval() {
        // closed form (common practice): for y = theta x the least-squares estimate is sum(xy)/sum(x^2) and the
        // profile sum of squares is a parabola, so the profile interval equals theta_hat -/+ t s / sqrt(sum x^2)
        Function<double[], double[]> f = t -> {
            double[] v = new double[X.length];
            for (int i = 0; i < X.length; i++) {
                v[i] = t[0] * X[i];
            }
            return v;
        };
        double sxx = 0;
        double sxy = 0;
        for (int i = 0; i < X.length; i++) {
            sxx += X[i] * X[i];
            sxy += X[i] * Y[i];
        }
        double est = sxy / sxx;
        BoundedFit.Result fit = BoundedFit.fit(f, Y, new double[] {1}, new double[] {0}, new double[] {10});
        assertEquals(est, fit.theta()[0], 1e-7);
        int nu = X.length - 1;
        double s2 = fit.rss() / nu;
        double t = new TDistribution(null, nu).inverseCumulativeProbability(0.975);
        double half = t * Math.sqrt(s2 / sxx);
        ProfileInterval.Bounds b = ProfileInterval.of(f, Y, fit.theta(), fit.rss(), s2 * t * t,
                new double[] {Math.sqrt(s2 / sxx)}, new double[] {1}, new double[] {0}, new double[] {10});
        assertEquals(est - half, b.lower()[0], 1e-6);
        assertEquals(est + half, b.upper()[0], 1e-6);
        // a physical range that cuts the interval: it ends at the limit and says so
        ProfileInterval.Bounds cut = ProfileInterval.of(f, Y, fit.theta(), fit.rss(), s2 * t * t,
                new double[] {Math.sqrt(s2 / sxx)}, new double[] {1}, new double[] {0}, new double[] {est + half / 2});
        assertEquals(est + half / 2, cut.upper()[0], 0);
        assertTrue(cut.upperAtLimit()[0]);
    }

    @Test
    void boundedFitStopsAtThePhysicalLimit() {
        // the unbounded answer is above 1; the bounded one is the limit (to the transform's resolution)
        Function<double[], double[]> f = t -> {
            double[] v = new double[X.length];
            for (int i = 0; i < X.length; i++) {
                v[i] = t[0] * X[i];
            }
            return v;
        };
        BoundedFit.Result fit = BoundedFit.fit(f, Y, new double[] {0.9}, new double[] {0}, new double[] {1});
        assertTrue(fit.theta()[0] <= 1 && fit.theta()[0] > 0.999, "theta " + fit.theta()[0]);
    }

    @Test
    void conditionIndexOfTwoColumnsMatchesTheClosedForm() {
        // closed form: two unit columns with cosine c have Gram eigenvalues 1 +/- c, so the condition index
        // (Belsley, Kuh & Welsch 1980) is sqrt((1 + c)/(1 - c)) and the estimates' correlation is -c
        double[][] j = {{1, 1}, {1, 1.1}, {1, 0.9}, {1, 1.05}};
        double n0 = Identifiability.norm(j, 0);
        double n1 = Identifiability.norm(j, 1);
        double dot = 0;
        for (double[] r : j) {
            dot += r[0] * r[1];
        }
        double c = dot / (n0 * n1);
        assertEquals(Math.sqrt((1 + c) / (1 - c)), Identifiability.condition(j, List.of(0, 1)), 1e-9);
        assertEquals(-c, Identifiability.correlation(j, List.of(0, 1))[0][1], 1e-9);
        Identifiability.Check check = Identifiability.check(j, new double[] {1, 1}, List.of("a", "b"), "y");
        // b's column is the longer (it moves y more), so b is kept and a held at nominal
        assertEquals(List.of(1), check.kept());
        assertTrue(check.sentence().contains("so only b is fitted and a stays at its nominal value"), check.sentence());
        // orthogonal columns are identifiable
        double[][] o = {{1, 1}, {1, -1}, {-1, 1}, {-1, -1}};
        assertEquals(List.of(0, 1), Identifiability.check(o, new double[] {1, 1}, List.of("a", "b"), "y").kept());
    }
}
