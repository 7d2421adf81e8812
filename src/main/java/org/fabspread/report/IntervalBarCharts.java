package org.fabspread.report;

import static org.fabspread.report.ChartChecks.*;
import static org.fabspread.report.ChartParts.*;

import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;

/**
 * Horizontal bars sorted largest first, each with its interval drawn with end caps: the tolerance
 * ranking's paired yield gains and the Shapley effects.
 */
final class IntervalBarCharts {

    private final ChartCanvas canvas;

    IntervalBarCharts(ChartCanvas canvas) {
        this.canvas = canvas;
    }

    /**
     * @param values the bar lengths, in the value axis's unit
     * @param low    each bar's lower bound (NaN: no interval drawn)
     * @param high   each bar's upper bound
     * @param intervalLabel the legend entry of the intervals, e.g. "95 % paired interval"
     */
    Chart bars(String name, String title, Quantity valueAxis, Quantity categoryAxis, String[] inputs, double[] values,
               double[] low, double[] high, String seriesName, String intervalLabel) {
        int n = requireLabels(name, inputs);
        requireLength(name, "values", values, n);
        requireLength(name, "low", low, n);
        requireLength(name, "high", high, n);
        requireSomeFinite(name, "values", values);
        Integer[] order = orderDescending(values);
        PathChart c = canvas.newChart(name, title, valueAxis, categoryAxis);
        List<String> names = new ArrayList<>();
        double[] centre = new double[n];
        double[] val = new double[n];
        double[] lo = new double[n];
        double[] hi = new double[n];
        double min = 0;
        double max = 0;
        for (int r = 0; r < n; r++) {
            centre[r] = n - 1 - r;
            val[r] = values[order[r]];
            lo[r] = low[order[r]];
            hi[r] = high[order[r]];
            for (double v : new double[] {val[r], lo[r], hi[r]}) {
                if (Double.isFinite(v)) {
                    min = Math.min(min, v);
                    max = Math.max(max, v);
                }
            }
        }
        double[][] bars = new double[2][];
        horizontalBars(centre, val, 0.62, bars);
        XYSeries s = c.addSeries(uniqueName(names, seriesName), bars[0], bars[1]);
        styleBars(s, 1);
        double[][] iv = new double[2][];
        intervalsCollect(centre, lo, hi, 0.62 * 0.45, iv);
        if (iv[0] != null && iv[0].length > 0) {
            XYSeries e = c.addSeries(uniqueName(names, intervalLabel), iv[0], iv[1]);
            styleLine(e, ChartStyle.PALETTE[0], ChartStyle.solid(1.6f), false);
        }
        canvas.categoryAxisY(c, order, inputs);
        valueAxisX(c, min, max);
        legendInside(c, Styler.LegendPosition.InsideSE);
        return canvas.finish(c, name, countFinite(values), names);
    }
}
