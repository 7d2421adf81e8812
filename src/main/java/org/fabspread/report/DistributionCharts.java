package org.fabspread.report;

import static org.fabspread.report.ChartChecks.*;
import static org.fabspread.report.ChartParts.*;
import static org.fabspread.report.ChartText.*;

import java.awt.Color;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.fabspread.sampling.Interval;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.XYSeries.XYSeriesRenderStyle;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.markers.SeriesMarkers;

/** Charts of the Monte Carlo outputs: histograms with the target and yield, scatter against an input. */
final class DistributionCharts {

    /** Scatter plots draw at most this many points. */
    static final int MAX_SCATTER_POINTS = ChartFactory.MAX_SCATTER_POINTS;

    private final ChartCanvas canvas;

    DistributionCharts(ChartCanvas canvas) {
        this.canvas = canvas;
    }

    /**
     * Histogram of one output over the Monte Carlo samples, with the target as a vertical dashed line
     * and the yield with its interval in the title ({@code "… — yield 87.3 % (85.1–89.2)"}).
     * Bin width by the Freedman–Diaconis rule, h = 2 IQR n^(−1/3) (Freedman &amp; Diaconis,
     * Z. Wahrscheinlichkeitstheorie verw. Gebiete 57, 453 (1981)), kept between 8 and 60 bins.
     *
     * @param values samples of the output; NaN (failed samples) are left out
     * @param target the target value in the output's unit
     * @param atLeast whether the target is a lower bound (J_sc ≥ target) rather than an upper one
     * @param yield  the yield as a fraction 0–1
     * @param interval the yield's interval; its bounds must be finite and enclose the yield
     */
    Chart histogram(String name, String title, Quantity output, double[] values, double target,
                    boolean atLeast, double yield, Interval interval) {
        Objects.requireNonNull(output, "output");
        Objects.requireNonNull(interval, "interval");
        if (!Double.isFinite(yield) || !interval.bounded() || !interval.contains(yield)) {
            throw new IllegalArgumentException(name + ": the yield's interval must be finite and enclose it: " + yield
                    + " not within (" + interval.low() + ", " + interval.high() + ")");
        }
        double[] v = finiteSorted(name, "values", values);
        if (!Double.isFinite(target)) {
            throw new IllegalArgumentException(name + ": the target must be finite, got " + target);
        }
        double[] edges = histogramEdges(v);
        int bins = edges.length - 1;
        double[] counts = new double[bins];
        double lo = edges[0];
        double w = edges[1] - edges[0];
        for (double x : v) {
            int b = (int) ((x - lo) / w);
            counts[Math.min(Math.max(b, 0), bins - 1)]++;
        }
        double maxCount = 0;
        for (double c : counts) {
            maxCount = Math.max(maxCount, c);
        }
        String fullTitle = title + " — yield " + percent(yield) + " % (" + percent(interval.low()) + "–"
                + percent(interval.high()) + ")";
        Quantity yq = Quantity.of("samples per bin", "count");
        PathChart c = canvas.newChart(name, fullTitle, output, yq);
        List<String> names = new ArrayList<>();
        double[][] bars = new double[2][];
        rectangles(edges, counts, bars);
        XYSeries s = c.addSeries(uniqueName(names, "samples (n = " + v.length + ")"), bars[0], bars[1]);
        styleBars(s, 2);
        XYSeries t = c.addSeries(uniqueName(names, "target: " + output.label() + (atLeast ? " ≥ " : " ≤ ")
                + number(target) + " " + output.unit()), new double[] {target, target},
                new double[] {0, maxCount * 1.06});
        styleLine(t, ChartStyle.PALETTE[0], ChartStyle.dashed(2.6f), false);
        XYStyler st = c.getStyler();
        st.setYAxisMin(0.0);
        st.setYAxisMax(maxCount * 1.08);
        st.setXAxisMin(Math.min(edges[0], target) - 0.02 * (edges[bins] - edges[0]));
        st.setXAxisMax(Math.max(edges[bins], target) + 0.02 * (edges[bins] - edges[0]));
        st.setPlotGridVerticalLinesVisible(false);
        roundTicksX(c, edges, 0);
        return canvas.finish(c, name, v.length, names);
    }

    /**
     * Scatter of an output against one input. More than {@link #MAX_SCATTER_POINTS} valid pairs are
     * thinned deterministically to evenly spaced sample indices ({@link #subsampleIndices}).
     */
    Chart scatter(String name, String title, Quantity input, double[] x, Quantity output, double[] y) {
        requireSameLength(name, "x", x, "y", y);
        int n = 0;
        int[] valid = new int[x.length];
        for (int i = 0; i < x.length; i++) {
            if (Double.isFinite(x[i]) && Double.isFinite(y[i])) {
                valid[n++] = i;
            }
        }
        if (n == 0) {
            throw new IllegalArgumentException(name + ": no sample has both values finite (all NaN)");
        }
        int[] pick = subsampleIndices(n, MAX_SCATTER_POINTS);
        double[] px = new double[pick.length];
        double[] py = new double[pick.length];
        for (int k = 0; k < pick.length; k++) {
            px[k] = x[valid[pick[k]]];
            py[k] = y[valid[pick[k]]];
        }
        PathChart c = canvas.newChart(name, title, input, output);
        List<String> names = new ArrayList<>();
        String label = pick.length < n ? "samples (" + pick.length + " of " + n + " shown)" : "samples (n = " + n + ")";
        XYSeries s = c.addSeries(uniqueName(names, label), px, py);
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.CIRCLE);
        s.setMarkerColor(new Color(0x2f, 0x43, 0x56, 110));
        c.getStyler().setMarkerSize(pick.length > 2000 ? 4 : 6);
        c.getStyler().setLegendVisible(true);
        return canvas.finish(c, name, pick.length, names);
    }

    /**
     * Histogram of one output without a target: the samples, their mean as a dashed line and the 5 %
     * and 95 % quantiles as dotted lines. Same bins as {@link #histogram}.
     *
     * @param values samples of the output in the quantity's unit; NaN are left out
     */
    Chart distribution(String name, String title, Quantity output, double[] values) {
        Objects.requireNonNull(output, "output");
        double[] v = finiteSorted(name, "values", values);
        double[] edges = histogramEdges(v);
        int bins = edges.length - 1;
        double[] counts = new double[bins];
        double w = edges[1] - edges[0];
        double sum = 0;
        for (double x : v) {
            int b = (int) ((x - edges[0]) / w);
            counts[Math.min(Math.max(b, 0), bins - 1)]++;
            sum += x;
        }
        double maxCount = max(counts);
        PathChart c = canvas.newChart(name, title, output, Quantity.of("samples per bin", "count"));
        List<String> names = new ArrayList<>();
        double[][] bars = new double[2][];
        rectangles(edges, counts, bars);
        styleBars(c.addSeries(uniqueName(names, "samples (n = " + v.length + ")"), bars[0], bars[1]), 2);
        double mean = sum / v.length;
        double top = maxCount * 1.06;
        styleLine(c.addSeries(uniqueName(names, "mean " + number(mean)), new double[] {mean, mean},
                new double[] {0, top}), ChartStyle.PALETTE[0], ChartStyle.dashed(2.4f), false);
        double q05 = quantileSorted(v, 0.05);
        double q95 = quantileSorted(v, 0.95);
        XYSeries q = c.addSeries(uniqueName(names, "5 % and 95 % quantiles"), new double[] {q05, q05, Double.NaN, q95, q95},
                new double[] {0, top, Double.NaN, 0, top});
        styleLine(q, ChartStyle.PALETTE[0], ChartStyle.dotted(2.4f), false);
        XYStyler st = c.getStyler();
        st.setYAxisMin(0.0);
        st.setYAxisMax(maxCount * 1.3);
        st.setXAxisMin(edges[0] - 0.02 * (edges[bins] - edges[0]));
        st.setXAxisMax(edges[bins] + 0.02 * (edges[bins] - edges[0]));
        st.setPlotGridVerticalLinesVisible(false);
        legendInside(c, Styler.LegendPosition.InsideNW);
        roundTicksX(c, edges, 0);
        return canvas.finish(c, name, v.length, names);
    }

    /**
     * How the yield moves if the target moves: the share of samples meeting a target at each value of
     * the threshold, with its pointwise confidence band as a shaded area, and the study's target as a
     * vertical dashed line.
     *
     * @param threshold target values, increasing
     * @param yield     the yield at each threshold, fraction 0–1
     * @param low       the band's lower edge, fraction
     * @param high      the band's upper edge, fraction
     * @param target    the study's target
     */
    Chart yieldCurve(String name, String title, Quantity output, double[] threshold, double[] yield, double[] low,
                     double[] high, double target, String bandLabel) {
        int n = requireNonEmpty(name, "threshold", threshold);
        requireIncreasing(name, "threshold", threshold);
        requireLength(name, "yield", yield, n);
        requireLength(name, "low", low, n);
        requireLength(name, "high", high, n);
        requireSomeFinite(name, "yield", yield);
        PathChart c = canvas.newChart(name, title, output, Quantity.of("yield", "%"));
        List<String> names = new ArrayList<>();
        double[] bx = new double[2 * n + 1];
        double[] by = new double[2 * n + 1];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            bx[i] = threshold[i];
            by[i] = 100 * high[i];
            bx[2 * n - 1 - i] = threshold[i];
            by[2 * n - 1 - i] = 100 * low[i];
            y[i] = 100 * yield[i];
        }
        bx[2 * n] = bx[0];
        by[2 * n] = by[0];
        XYSeries band = c.addSeries(uniqueName(names, bandLabel), bx, by);
        band.setXYSeriesRenderStyle(XYSeriesRenderStyle.PolygonArea);
        band.setMarker(SeriesMarkers.NONE);
        band.setFillColor(ChartStyle.fillRamp(3)[2]);
        band.setLineColor(ChartStyle.PALETTE[2]);
        band.setLineStyle(ChartStyle.solid(0.6f));
        styleLine(c.addSeries(uniqueName(names, "yield"), threshold, y), ChartStyle.PALETTE[1], ChartStyle.solid(2.2f),
                false);
        styleLine(c.addSeries(uniqueName(names, "the study's target " + number(target)), new double[] {target, target},
                new double[] {0, 100}), ChartStyle.PALETTE[0], ChartStyle.dashed(2.4f), false);
        XYStyler st = c.getStyler();
        st.setYAxisMin(0.0);
        st.setYAxisMax(100.0);
        st.setXAxisMin(Math.min(threshold[0], target));
        st.setXAxisMax(Math.max(threshold[n - 1], target));
        legendInside(c, Styler.LegendPosition.InsideNE);
        roundTicksX(c, threshold, 50);
        return canvas.finish(c, name, countFinite(yield), names);
    }

    /**
     * Indices {@code floor(k n / max)}, k = 0 … max − 1, when n exceeds max, else 0 … n − 1: an evenly
     * spread, reproducible subsample (the samples are already in random order).
     */
    static int[] subsampleIndices(int n, int max) {
        int m = Math.min(n, max);
        int[] out = new int[m];
        for (int k = 0; k < m; k++) {
            out[k] = (int) ((long) k * n / m);
        }
        return out;
    }

    /**
     * Bin edges for sorted finite data: Freedman–Diaconis width, 8 to 60 bins, edges on a round
     * multiple of the width. A single repeated value gets one bin around it.
     */
    static double[] histogramEdges(double[] sorted) {
        int n = sorted.length;
        double lo = sorted[0];
        double hi = sorted[n - 1];
        if (hi == lo) {
            double half = lo == 0 ? 0.5 : Math.abs(lo) * 0.01;
            return new double[] {lo - half, lo + half};
        }
        double iqr = quantileSorted(sorted, 0.75) - quantileSorted(sorted, 0.25);
        int bins;
        if (iqr > 0) {
            double h = 2 * iqr / Math.cbrt(n);
            bins = (int) Math.ceil((hi - lo) / h);
        } else {
            bins = (int) Math.ceil(Math.log(n) / Math.log(2)) + 1; // Sturges
        }
        bins = Math.max(8, Math.min(60, bins));
        double w = niceStep((hi - lo) / bins);
        double start = Math.floor(lo / w) * w;
        int count = (int) Math.ceil((hi - start) / w);
        if (start + count * w <= hi) {
            count++;
        }
        count = Math.max(1, count);
        double[] edges = new double[count + 1];
        for (int k = 0; k <= count; k++) {
            edges[k] = start + k * w;
        }
        return edges;
    }

    /** The smallest of 1, 2, 2.5, 5 times a power of ten that is at least x. */
    static double niceStep(double x) {
        double p = Math.pow(10, Math.floor(Math.log10(x)));
        for (double f : new double[] {1, 2, 2.5, 5, 10}) {
            if (f * p >= x * (1 - 1e-12)) {
                return f * p;
            }
        }
        return 10 * p;
    }

    /** Linear-interpolation quantile of sorted data (Hyndman &amp; Fan, Am. Stat. 50, 361 (1996), type 7). */
    static double quantileSorted(double[] sorted, double p) {
        double h = (sorted.length - 1) * p;
        int i = (int) Math.floor(h);
        if (i >= sorted.length - 1) {
            return sorted[sorted.length - 1];
        }
        return sorted[i] + (h - i) * (sorted[i + 1] - sorted[i]);
    }
}
