package org.fabspread.sampling;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;

class IntervalsTest {

    private static double[] bounds(Interval i) {
        return new double[] {i.low(), i.high()};
    }

    @Test
    void wilsonIntervalAgainstItsFormula() {
        // source: Wilson, JASA 22, 209 (1927); check values from statistics-and-doe.md
        Interval a = Intervals.wilson(0, 10, 0.95);
        assertEquals(0, a.low(), 1e-12);
        assertEquals(0.2775, a.high(), 5e-5);
        Interval b = Intervals.wilson(990, 1000, 0.95);
        assertEquals(0.9817, b.low(), 5e-5);
        assertEquals(0.9946, b.high(), 5e-5);
        // the formula written out once more with z = 1.959964
        double z = 1.959963984540054;
        double p = 0.4;
        int n = 50;
        double lo = (p + z * z / (2 * n) - z * Math.sqrt(p * (1 - p) / n + z * z / (4.0 * n * n))) / (1 + z * z / n);
        assertEquals(lo, Intervals.wilson(20, 50, 0.95).low(), 1e-12);
    }

    @Test
    void clopperPearsonCheckValuesAndBetaQuantiles() {
        // source: Clopper & Pearson, Biometrika 26, 404 (1934); check values from statistics-and-doe.md
        Interval a = Intervals.clopperPearson(0, 10, 0.95);
        assertEquals(0, a.low(), 0);
        assertEquals(0.3085, a.high(), 5e-5);
        Interval b = Intervals.clopperPearson(990, 1000, 0.95);
        assertEquals(0.9817, b.low(), 5e-5);
        assertEquals(0.9952, b.high(), 5e-5);
        // against commons-math3 Beta quantiles, and a second route: the binomial tails equal α/2 at the bounds
        long x = 37;
        long n = 120;
        Interval c = Intervals.clopperPearson(x, n, 0.90);
        assertEquals(new BetaDistribution(x, n - x + 1).inverseCumulativeProbability(0.05), c.low(), 1e-9);
        assertEquals(new BetaDistribution(x + 1, n - x).inverseCumulativeProbability(0.95), c.high(), 1e-9);
        assertEquals(0.05, 1 - new BinomialDistribution((int) n, c.low()).cumulativeProbability((int) x - 1), 1e-6);
        assertEquals(0.05, new BinomialDistribution((int) n, c.high()).cumulativeProbability((int) x), 1e-6);
        assertEquals(1.0, Intervals.clopperPearson(10, 10, 0.95).high(), 0);
    }


    @Test
    void wilsonIntervalCheckValues() {
        // source: statistics-and-doe reference, "Yield against a target" (Wilson, JASA 22, 209 (1927)):
        // x = 0, n = 10 → (0, 0.2775); x = 990, n = 1000 → (0.9817, 0.9946)
        assertArrayEquals(new double[] {0, 0.2775}, bounds(Intervals.wilson(0, 10, 0.95)), 5e-5);
        assertArrayEquals(new double[] {0.9817, 0.9946}, bounds(Intervals.wilson(990, 1000, 0.95)), 5e-5);
        // closed form at x = 0: upper = z²/(n + z²)
        double z = Intervals.z(0.95);
        assertEquals(z * z / (10 + z * z), Intervals.wilson(0, 10, 0.95).high(), 1e-15);
        // source: Abramowitz & Stegun (1964), table 26.1: z_0.975 = 1.959963985
        assertEquals(1.959963985, z, 1e-9);
        assertArrayEquals(new double[] {0, 1}, bounds(Intervals.wilson(0, 0, 0.95)), 0.0);
        assertArrayEquals(new double[] {0, 1}, bounds(Intervals.clopperPearson(0, 0, 0.95)), 0.0);
    }

    @Test
    void orderStatisticIntervalForTheMedian() {
        // from memory: the distribution-free 95 % interval for the median of n = 100 is [X(40), X(61)]
        // (Conover, Practical Nonparametric Statistics (1999), table A3); cross-checked by the exact
        // binomial coverage P(40 ≤ B ≤ 60) ≥ 0.95 with B ~ Bin(100, 1/2), and by minimality
        long[] rs = Intervals.quantileRanks(100, 0.5, 0.95);
        assertArrayEquals(new long[] {40, 61}, rs);
        BinomialDistribution b = new BinomialDistribution(null, 100, 0.5);
        double coverage = b.cumulativeProbability(60) - b.cumulativeProbability(39);
        assertTrue(coverage >= 0.95, "coverage " + coverage);
        assertTrue(b.cumulativeProbability(59) - b.cumulativeProbability(40) < 0.95);
    }

    @Test
    void orderStatisticIntervalsCoverAtTheirLevelForAnyQuantile() {
        for (long n : new long[] {20, 137, 1000, 100_000}) {
            for (double p : RunJob.QUANTILES) {
                long[] rs = Intervals.quantileRanks(n, p, 0.95);
                BinomialDistribution b = new BinomialDistribution(null, (int) n, p);
                double lo = rs[0] >= 1 ? b.cumulativeProbability((int) rs[0] - 1) : 0;
                double hi = rs[1] <= n ? b.cumulativeProbability((int) rs[1] - 1) : 1;
                // source: David & Nagaraja, Order Statistics (2003), sec. 7.1: coverage = P(r ≤ B ≤ s − 1)
                assertTrue(hi - lo >= 0.95, "n=" + n + " p=" + p);
                assertTrue(rs[0] <= rs[1]);
            }
        }
        // too few samples for a lower bound of the 1 % quantile
        assertEquals(0, Intervals.quantileRanks(20, 0.01, 0.95)[0]);
    }

    @Test
    void quantile7InterpolatesOrderStatistics() {
        double[] s = {1, 2, 4, 8};
        // source: Hyndman & Fan, Am. Stat. 50, 361 (1996), definition 7: position 1 + p(n − 1)
        assertEquals(3.0, Intervals.quantile7(s, 4, 0.5), 0.0);
        assertEquals(1.0, Intervals.quantile7(s, 4, 0.0), 0.0);
        assertEquals(8.0, Intervals.quantile7(s, 4, 1.0), 0.0);
    }
}
