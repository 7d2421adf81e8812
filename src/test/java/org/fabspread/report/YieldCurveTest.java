package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fabspread.sampling.Interval;
import org.junit.jupiter.api.Test;

class YieldCurveTest {

    @Test
    void countsTheSamplesMeetingEachThreshold() {
        // worked by hand: of 1..10, seven are ≥ 4 and four are ≤ 4; ties count as meeting the target
        double[] v = {5, 3, 8, 1, 10, 2, 9, 4, 7, 6, Double.NaN};
        YieldCurve up = YieldCurve.at(sorted(v), true, new double[] {4, 10.5}, 0.95);
        assertEquals(0.7, up.yield()[0], 1e-15);
        assertEquals(0.0, up.yield()[1], 1e-15);
        YieldCurve down = YieldCurve.at(sorted(v), false, new double[] {4}, 0.95);
        assertEquals(0.4, down.yield()[0], 1e-15);
        assertEquals(10, up.n());
    }

    @Test
    void bandIsTheWilsonInterval() {
        // source: Wilson, J. Am. Stat. Assoc. 22, 209 (1927): 7 of 10 at 95 % gives 0.3968–0.8922
        // (from memory, cross-checked against the closed form (p + z²/2n ± z√(p(1−p)/n + z²/4n²))/(1 + z²/n))
        YieldCurve c = YieldCurve.at(sorted(new double[] {1, 2, 3, 4, 5, 6, 7, 8, 9, 10}), true, new double[] {4}, 0.95);
        double z = 1.959964;
        double p = 0.7;
        double n = 10;
        double centre = (p + z * z / (2 * n)) / (1 + z * z / n);
        double half = z * Math.sqrt(p * (1 - p) / n + z * z / (4 * n * n)) / (1 + z * z / n);
        assertEquals(centre - half, c.low()[0], 1e-6);
        assertEquals(centre + half, c.high()[0], 1e-6);
        assertEquals(0.3968, c.low()[0], 1e-4);
        assertEquals(0.8922, c.high()[0], 1e-4);
    }

    @Test
    void spansTheSamplesAndTheTarget() {
        double[] v = new double[1000];
        for (int i = 0; i < v.length; i++) {
            v[i] = i;
        }
        YieldCurve c = YieldCurve.of(v, true, 1500, 0.95);
        assertEquals(YieldCurve.POINTS, c.threshold().length);
        assertTrue(c.threshold()[0] <= 10 && c.threshold()[YieldCurve.POINTS - 1] == 1500);
        for (int i = 1; i < c.yield().length; i++) {
            assertTrue(c.yield()[i] <= c.yield()[i - 1], "a lower bound's yield falls as the target rises");
        }
        Interval w = new Interval(c.low()[0], c.high()[0]);
        assertTrue(w.contains(c.yield()[0]));
    }

    private static double[] sorted(double[] v) {
        return java.util.Arrays.stream(v).filter(Double::isFinite).sorted().toArray();
    }
}
