package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;

class IntervalChartsTest {

    private static final ChartFactory F = new ChartFactory();

    @Test
    void toleranceBarsCarryTheirIntervalsAndRefuseMismatchedBounds() {
        // common practice: every estimate on a chart shows its interval
        Chart c = F.intervalBars("t", "Yield gained", Quantity.of("yield gained", "percentage points"),
                Quantity.of("input", "sorted by gain"), new String[] {"a", "b", "c"}, new double[] {6.5, 0.9, -0.2},
                new double[] {5.4, -0.1, -1.1}, new double[] {7.6, 1.9, 0.7}, "yield gained", "95 % paired interval");
        assertEquals(List.of("yield gained", "95 % paired interval"), c.seriesNames());
        assertThrows(IllegalArgumentException.class, () -> F.intervalBars("t", "x", Quantity.of("y", "%"),
                Quantity.of("input", "sorted"), new String[] {"a", "b"}, new double[] {1, 2}, new double[] {0},
                new double[] {2, 3}, "s", "i"));
    }

    @Test
    void tradeOffPointsCarryTheirIntervals() {
        Chart c = F.allocationTradeoff("a", "Trade-off", Quantity.of("cost", "units"), new double[] {0, 2, 5},
                new double[] {0.886, 0.93, 0.96}, new double[] {0.87, 0.915, 0.945}, new double[] {0.9, 0.945, 0.975},
                0.95);
        assertTrue(c.seriesNames().contains("interval of each point"), c.seriesNames().toString());
        Chart plain = F.allocationTradeoff("a", "Trade-off", Quantity.of("cost", "units"), new double[] {0, 2, 5},
                new double[] {0.886, 0.93, 0.96}, 0.95);
        assertTrue(!plain.seriesNames().contains("interval of each point"));
    }
}
