package org.fabspread.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.Arrays;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.XYSeries.XYSeriesRenderStyle;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.lines.SeriesLines;
import org.knowm.xchart.style.markers.SeriesMarkers;

/** Building blocks shared by the chart domains: series styles, bar and interval outlines, legends, axes. */
final class ChartParts {

    private ChartParts() {
    }

    /**
     * The chart library places x ticks at the data's own x values when all series share one evenly
     * spaced grid (a wavelength grid, say), packing a label at every few points. A hidden, undrawn
     * point between the first two grid values breaks that pattern, so the ticks fall on round numbers
     * spaced by the tick-spacing hint instead. It has no legend entry and is not counted as a series.
     */
    static void roundTicksX(XYChart c, double[] grid, double y) {
        if (grid.length < 2) {
            return;
        }
        XYSeries s = c.addSeries("\u2060", new double[] {0.5 * (grid[0] + grid[1])}, new double[] {y});
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.NONE);
        s.setShowInLegend(false);
    }

    /** A vertical legend inside the plot, in a corner the data leave free. */
    static void legendInside(XYChart c, Styler.LegendPosition corner) {
        c.getStyler().setLegendPosition(corner);
        c.getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
    }

    static void legendRight(XYChart c, int series) {
        if (series > 3) {
            c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
            c.getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
        }
    }

    /**
     * A densely sampled curve drawn as one continuous path ({@link PathChart}): an undrawn series
     * carries the data for the axis ranges, a one-point series carries the legend entry.
     */
    static void curve(PathChart c, List<String> names, String label, double[] x, double[] y, Color color,
                              BasicStroke stroke) {
        String shown = uniqueName(names, label);
        XYSeries data = c.addSeries("\u2060" + shown, x, y);
        data.setXYSeriesRenderStyle(XYSeriesRenderStyle.Line);
        data.setLineStyle(SeriesLines.NONE);
        data.setMarker(SeriesMarkers.NONE);
        data.setShowInLegend(false);
        int first = 0;
        while (first < x.length - 1 && !(Double.isFinite(x[first]) && Double.isFinite(y[first]))) {
            first++;
        }
        XYSeries legend = c.addSeries(shown, new double[] {x[first]}, new double[] {Double.isFinite(y[first]) ? y[first] : 0});
        styleLine(legend, color, stroke, false);
        c.addCurve(x, y, color, stroke);
    }

    static void styleLine(XYSeries s, Color color, BasicStroke stroke, boolean markers) {
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Line);
        s.setLineColor(color);
        s.setLineStyle(stroke);
        s.setMarkerColor(color);
        if (!markers) {
            s.setMarker(SeriesMarkers.NONE);
        }
    }

    /** Bars as closed polygons, filled with palette colour {@code shade}, edged in near-black. */
    static XYSeries styleBars(XYSeries s, int shade) {
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.PolygonArea);
        s.setMarker(SeriesMarkers.NONE);
        s.setFillColor(ChartStyle.PALETTE[shade]);
        s.setLineColor(ChartStyle.BAR_EDGE);
        s.setLineStyle(ChartStyle.solid(1.0f));
        return s;
    }

    /** Vertical histogram bars as rectangles separated by NaN (one polygon each), skipping empty bins. */
    static void rectangles(double[] edges, double[] counts, double[][] out) {
        int bins = counts.length;
        double[] x = new double[bins * 6];
        double[] y = new double[bins * 6];
        int p = 0;
        for (int b = 0; b < bins; b++) {
            if (counts[b] <= 0) {
                continue;
            }
            double x0 = edges[b];
            double x1 = edges[b + 1];
            double[] rx = {x0, x0, x1, x1, x0, Double.NaN};
            double[] ry = {0, counts[b], counts[b], 0, 0, Double.NaN};
            System.arraycopy(rx, 0, x, p, 6);
            System.arraycopy(ry, 0, y, p, 6);
            p += 6;
        }
        out[0] = Arrays.copyOf(x, Math.max(0, p - 1));
        out[1] = Arrays.copyOf(y, Math.max(0, p - 1));
    }

    /** Horizontal bars from 0 to value, centred at y with thickness h; NaN values are skipped. */
    static void horizontalBars(double[] centre, double[] value, double h, double[][] out) {
        int n = centre.length;
        double[] x = new double[n * 6];
        double[] y = new double[n * 6];
        int p = 0;
        for (int r = 0; r < n; r++) {
            double v = value[r];
            if (!Double.isFinite(v)) {
                continue;
            }
            double y0 = centre[r] - h / 2;
            double y1 = centre[r] + h / 2;
            double[] rx = {0, v, v, 0, 0, Double.NaN};
            double[] ry = {y0, y0, y1, y1, y0, Double.NaN};
            System.arraycopy(rx, 0, x, p, 6);
            System.arraycopy(ry, 0, y, p, 6);
            p += 6;
        }
        out[0] = Arrays.copyOf(x, Math.max(0, p - 1));
        out[1] = Arrays.copyOf(y, Math.max(0, p - 1));
    }

    /** Appends interval segments with end caps (NaN-separated) to acc. */
    static void intervalsCollect(double[] centre, double[] lo, double[] hi, double cap, double[][] acc) {
        double[] x = new double[centre.length * 9];
        double[] y = new double[centre.length * 9];
        int p = 0;
        for (int r = 0; r < centre.length; r++) {
            if (!Double.isFinite(lo[r]) || !Double.isFinite(hi[r])) {
                continue;
            }
            double yc = centre[r];
            double[] rx = {lo[r], lo[r], Double.NaN, lo[r], hi[r], Double.NaN, hi[r], hi[r], Double.NaN};
            double[] ry = {yc - cap / 2, yc + cap / 2, Double.NaN, yc, yc, Double.NaN, yc - cap / 2, yc + cap / 2, Double.NaN};
            System.arraycopy(rx, 0, x, p, 9);
            System.arraycopy(ry, 0, y, p, 9);
            p += 9;
        }
        double[] ox = acc[0] == null ? new double[0] : acc[0];
        double[] oy = acc[1] == null ? new double[0] : acc[1];
        double[] nx = Arrays.copyOf(ox, ox.length + p);
        double[] ny = Arrays.copyOf(oy, oy.length + p);
        System.arraycopy(x, 0, nx, ox.length, p);
        System.arraycopy(y, 0, ny, oy.length, p);
        acc[0] = nx;
        acc[1] = ny;
    }

    /** A value axis that includes zero, with a little room beyond the extremes. */
    static void valueAxisX(XYChart c, double min, double max) {
        double span = max - min;
        if (span <= 0) {
            span = 1;
        }
        XYStyler st = c.getStyler();
        st.setXAxisMin(min < 0 ? min - 0.05 * span : 0.0);
        st.setXAxisMax(max > 0 ? max + 0.05 * span : 0.0 + 0.05 * span);
    }

    static String uniqueName(List<String> names, String base) {
        String s = base;
        int k = 2;
        while (names.contains(s)) {
            s = base + " (" + k++ + ")";
        }
        names.add(s);
        return s;
    }

    static Integer[] orderDescending(double[] key) {
        Integer[] order = new Integer[key.length];
        for (int i = 0; i < key.length; i++) {
            order[i] = i;
        }
        // NaN last, ties keep the given order
        Arrays.sort(order, (a, b) -> {
            double ka = Double.isNaN(key[a]) ? Double.NEGATIVE_INFINITY : key[a];
            double kb = Double.isNaN(key[b]) ? Double.NEGATIVE_INFINITY : key[b];
            return Double.compare(kb, ka);
        });
        return order;
    }
}
