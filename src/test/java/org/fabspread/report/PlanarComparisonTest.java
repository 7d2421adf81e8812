package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class PlanarComparisonTest {

    @Test
    void pairedTIntervalOfAWorkedExample() {
        // from memory: Student t table, t(0.975, 4 df) = 2.776; differences 1..5 have mean 3 and s = √2.5,
        // so the 95 % interval is 3 ± 2.776 · √2.5/√5 = 3 ± 1.963
        double[] with = {11, 12, 13, 14, 15};
        double[] without = {10, 10, 10, 10, 10};
        PlanarComparison c = PlanarComparison.of(with, without, 0.95);
        assertEquals(5, c.n());
        assertEquals(3.0, c.mean(), 1e-12);
        assertEquals(3 - 1.963, c.low(), 2e-3);
        assertEquals(3 + 1.963, c.high(), 2e-3);
        assertTrue(c.clear());
        // cross-check a second way: the half-width is the t quantile times the standard error √2.5/√5
        assertEquals(2.776, (c.high() - c.mean()) / Math.sqrt(2.5 / 5), 1e-3);
        // type-7 quantiles of 1..5: 5 % at 1 + 0.2 = 1.2, 95 % at 4.8 (Hyndman & Fan 1996, worked by hand)
        assertEquals(1.2, c.q05(), 1e-12);
        assertEquals(4.8, c.q95(), 1e-12);
    }

    @Test
    void noiseAroundZeroIsNotClearAndNaNPairsAreLeftOut() {
        // common practice: an interval that spans zero does not establish a difference
        PlanarComparison c = PlanarComparison.of(new double[] {1, 2, Double.NaN, 1.5}, new double[] {1.5, 1.5, 1, 1.5},
                0.95);
        assertEquals(3, c.n());
        assertFalse(c.clear());
        assertThrows(IllegalArgumentException.class, () -> PlanarComparison.of(new double[] {1}, new double[] {0}, 0.95));
        assertThrows(IllegalArgumentException.class, () -> PlanarComparison.of(new double[] {1, 2}, new double[] {0}, 0.95));
    }
}
