package org.fabspread.report;

import static org.fabspread.report.ChartChecks.*;
import static org.fabspread.report.ChartParts.*;
import static org.fabspread.report.ChartText.*;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.markers.SeriesMarkers;

/** Charts of tolerance advice: yield gained per input and the allocation trade-off. */
final class ToleranceCharts {

    private final ChartCanvas canvas;

    ToleranceCharts(ChartCanvas canvas) {
        this.canvas = canvas;
    }

    /**
     * Yield gained by tightening each input, as horizontal bars sorted largest first.
     *
     * @param gain yield gained per input as a fraction (0.05 = five percentage points)
     */
    Chart toleranceRanking(String name, String title, String[] inputs, double[] gain) {
        int n = requireLabels(name, inputs);
        requireLength(name, "gain", gain, n);
        requireSomeFinite(name, "gain", gain);
        double[] pp = new double[n];
        for (int i = 0; i < n; i++) {
            pp[i] = 100 * gain[i];
        }
        return canvas.sortedBars(name, title, Quantity.of("yield gained", "percentage points"),
                Quantity.of("input", "sorted by gain"), inputs, pp, "yield gained", 1);
    }

    /**
     * Tolerance allocation trade-off: predicted yield against the cost of the tightened tolerances,
     * one point per allocation (joined in order of cost), with the yield goal as a dashed line.
     *
     * @param predictedYield yields as fractions 0–1
     * @param goal           the yield goal as a fraction 0–1
     */
    Chart allocationTradeoff(String name, String title, Quantity cost, double[] costs,
                                    double[] predictedYield, double goal) {
        return allocationTradeoff(name, title, cost, costs, predictedYield, null, null, goal);
    }

    /** As above, each point with its interval (fractions; null for none) drawn as a vertical bar with caps. */
    Chart allocationTradeoff(String name, String title, Quantity cost, double[] costs, double[] predictedYield,
                             double[] low, double[] high, double goal) {
        Objects.requireNonNull(cost, "cost");
        requireSameLength(name, "costs", costs, "predictedYield", predictedYield);
        if (!Double.isFinite(goal)) {
            throw new IllegalArgumentException(name + ": the yield goal must be finite, got " + goal);
        }
        int n = 0;
        Integer[] idx = new Integer[costs.length];
        for (int i = 0; i < costs.length; i++) {
            if (Double.isFinite(costs[i]) && Double.isFinite(predictedYield[i])) {
                idx[n++] = i;
            }
        }
        if (n == 0) {
            throw new IllegalArgumentException(name + ": no allocation has both cost and yield finite (all NaN)");
        }
        Integer[] sorted = Arrays.copyOf(idx, n);
        Arrays.sort(sorted, (a, b) -> Double.compare(costs[a], costs[b]));
        double[] cx = new double[n];
        double[] cy = new double[n];
        for (int k = 0; k < n; k++) {
            cx[k] = costs[sorted[k]];
            cy[k] = 100 * predictedYield[sorted[k]];
        }
        PathChart c = canvas.newChart(name, title, cost, Quantity.of("predicted yield", "%"));
        List<String> names = new ArrayList<>();
        XYSeries s = c.addSeries(uniqueName(names, "allocations"), cx, cy);
        styleLine(s, ChartStyle.PALETTE[1], ChartStyle.STROKES[0], true);
        s.setMarker(SeriesMarkers.CIRCLE);
        double span = cx[n - 1] - cx[0];
        double pad = span > 0 ? 0.04 * span : Math.max(Math.abs(cx[0]) * 0.1, 1);
        double ylo = min(cy);
        double yhi = max(cy);
        if (low != null && high != null) {
            requireSameLength(name, "low", low, "high", high);
            double[] vx = new double[9 * n];
            double[] vy = new double[9 * n];
            int p = 0;
            double cap = Math.max(pad * 0.4, 1e-9);
            for (int k = 0; k < n; k++) {
                double a = 100 * low[sorted[k]];
                double b = 100 * high[sorted[k]];
                if (!Double.isFinite(a) || !Double.isFinite(b)) {
                    continue;
                }
                double x = cx[k];
                double[] sx = {x - cap, x + cap, Double.NaN, x, x, Double.NaN, x - cap, x + cap, Double.NaN};
                double[] sy = {a, a, Double.NaN, a, b, Double.NaN, b, b, Double.NaN};
                System.arraycopy(sx, 0, vx, p, 9);
                System.arraycopy(sy, 0, vy, p, 9);
                p += 9;
                ylo = Math.min(ylo, a);
                yhi = Math.max(yhi, b);
            }
            if (p > 0) {
                XYSeries iv = c.addSeries(uniqueName(names, "interval of each point"), Arrays.copyOf(vx, p - 1),
                        Arrays.copyOf(vy, p - 1));
                styleLine(iv, ChartStyle.PALETTE[0], ChartStyle.solid(1.4f), false);
            }
        }
        XYSeries g = c.addSeries(uniqueName(names, "goal " + percent(goal) + " %"),
                new double[] {cx[0] - pad, cx[n - 1] + pad}, new double[] {100 * goal, 100 * goal});
        styleLine(g, ChartStyle.PALETTE[0], ChartStyle.dashed(2.2f), false);
        XYStyler st = c.getStyler();
        st.setXAxisMin(cx[0] - pad);
        st.setXAxisMax(cx[n - 1] + pad);
        double ymin = Math.min(100 * goal, ylo);
        double ymax = Math.max(100 * goal, yhi);
        double ypad = Math.max(0.5, 0.08 * (ymax - ymin));
        st.setYAxisMin(Math.max(0, ymin - ypad));
        st.setYAxisMax(Math.min(100, ymax + ypad));
        legendInside(c, Styler.LegendPosition.InsideSE);
        return canvas.finish(c, name, n, names);
    }

    /**
     * Yield gained per unit cost: for each input, the yield gained by halving its σ divided by the
     * study's cost of halving it, as horizontal bars sorted largest first (the cheapest lever on top).
     *
     * @param gainPerCost yield gained per cost unit as a fraction (0.01 = one percentage point per unit)
     */
    Chart costWeightedGain(String name, String title, String[] inputs, double[] gainPerCost) {
        int n = requireLabels(name, inputs);
        requireLength(name, "gainPerCost", gainPerCost, n);
        requireSomeFinite(name, "gainPerCost", gainPerCost);
        double[] pp = new double[n];
        for (int i = 0; i < n; i++) {
            pp[i] = 100 * gainPerCost[i];
        }
        return canvas.sortedBars(name, title, Quantity.of("yield gained per unit cost", "percentage points per cost unit"),
                Quantity.of("input", "sorted by gain per cost"), inputs, pp, "yield gained per unit cost", 2);
    }
}
