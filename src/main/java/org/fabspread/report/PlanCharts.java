package org.fabspread.report;

import static org.fabspread.report.ChartChecks.*;
import static org.fabspread.report.ChartParts.*;
import static org.fabspread.report.ChartText.*;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.XYSeries.XYSeriesRenderStyle;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.markers.SeriesMarkers;

/** Charts of experiment plans: predicted effects and the half-normal plot of measured effects. */
final class PlanCharts {

    private final ChartCanvas canvas;

    PlanCharts(ChartCanvas canvas) {
        this.canvas = canvas;
    }

    /**
     * The plan's predicted effects (high-level mean minus low-level mean) as horizontal bars sorted by
     * magnitude, largest on top; positive and negative effects in two shades.
     */
    Chart predictedEffects(String name, String title, Quantity response, String[] effects, double[] values) {
        Objects.requireNonNull(response, "response");
        int n = requireLabels(name, effects);
        requireLength(name, "values", values, n);
        requireSomeFinite(name, "values", values);
        double[] mag = new double[n];
        for (int i = 0; i < n; i++) {
            mag[i] = Math.abs(values[i]);
        }
        Integer[] order = orderDescending(mag);
        PathChart c = canvas.newChart(name, title, Quantity.of("effect on " + response.label(), response.unit()),
                Quantity.of("effect", "sorted by size"));
        List<String> names = new ArrayList<>();
        double[] centre = new double[n];
        double[] pos = new double[n];
        double[] neg = new double[n];
        double min = 0;
        double max = 0;
        for (int r = 0; r < n; r++) {
            centre[r] = n - 1 - r;
            double v = values[order[r]];
            pos[r] = v >= 0 ? v : Double.NaN;
            neg[r] = v < 0 ? v : Double.NaN;
            if (Double.isFinite(v)) {
                min = Math.min(min, v);
                max = Math.max(max, v);
            }
        }
        double[][] bars = new double[2][];
        horizontalBars(centre, pos, 0.62, bars);
        if (bars[0].length > 0) {
            styleBars(c.addSeries(uniqueName(names, "raises " + response.label()), bars[0], bars[1]), 1);
        }
        horizontalBars(centre, neg, 0.62, bars);
        if (bars[0].length > 0) {
            styleBars(c.addSeries(uniqueName(names, "lowers " + response.label()), bars[0], bars[1]), 3);
        }
        canvas.categoryAxisY(c, order, effects);
        valueAxisX(c, min, max);
        return canvas.finish(c, name, countFinite(values), names);
    }

    /**
     * Half-normal plot of measured effects (Daniel, Technometrics 1, 311 (1959)): the absolute effects,
     * sorted, against the half-normal quantiles Φ⁻¹(0.5 + 0.5 (i − 0.5)/m), i = 1 … m, with Lenth's
     * margin of error ME and simultaneous margin SME as horizontal lines (Lenth, Technometrics 31, 469
     * (1989)) and the largest {@code labelTop} effects named.
     */
    Chart halfNormal(String name, String title, Quantity response, String[] effects, double[] values,
                            double me, double sme, int labelTop) {
        Objects.requireNonNull(response, "response");
        int n = requireLabels(name, effects);
        requireLength(name, "values", values, n);
        requireSomeFinite(name, "values", values);
        if (!(me > 0) || !(sme >= me) || !Double.isFinite(sme)) {
            throw new IllegalArgumentException(name + ": need 0 < ME <= SME, finite; got ME " + me + ", SME " + sme);
        }
        if (labelTop < 0) {
            throw new IllegalArgumentException(name + ": labelTop must be >= 0, got " + labelTop);
        }
        int m = 0;
        Integer[] idx = new Integer[n];
        for (int i = 0; i < n; i++) {
            if (Double.isFinite(values[i])) {
                idx[m++] = i;
            }
        }
        Integer[] sorted = Arrays.copyOf(idx, m);
        Arrays.sort(sorted, (a, b) -> Double.compare(Math.abs(values[a]), Math.abs(values[b])));
        double[] q = halfNormalQuantiles(m);
        double[] abs = new double[m];
        for (int k = 0; k < m; k++) {
            abs[k] = Math.abs(values[sorted[k]]);
        }
        PathChart c = canvas.newChart(name, title, Quantity.dimensionless("half-normal quantile"),
                Quantity.of("|effect on " + response.label() + "|", response.unit()));
        List<String> names = new ArrayList<>();
        XYSeries s = c.addSeries(uniqueName(names, "measured effects"), q, abs);
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.CIRCLE);
        s.setMarkerColor(ChartStyle.PALETTE[1]);
        double xmax = q[m - 1] * 1.12 + 0.15;
        XYSeries a = c.addSeries(uniqueName(names, "ME " + number(me) + " " + response.unit()), new double[] {0, xmax}, new double[] {me, me});
        styleLine(a, ChartStyle.PALETTE[2], ChartStyle.dashed(2.2f), false);
        XYSeries b = c.addSeries(uniqueName(names, "SME " + number(sme) + " " + response.unit()), new double[] {0, xmax}, new double[] {sme, sme});
        styleLine(b, ChartStyle.PALETTE[0], ChartStyle.dotted(2.8f), false);
        double ymax = Math.max(sme, abs[m - 1]) * 1.12;
        XYStyler st = c.getStyler();
        st.setXAxisMin(0.0);
        st.setXAxisMax(xmax);
        st.setYAxisMin(0.0);
        st.setYAxisMax(ymax);
        legendInside(c, Styler.LegendPosition.InsideNW);
        int shown = Math.min(labelTop, m);
        for (int k = m - shown; k < m; k++) {
            String label = effects[sorted[k]];
            // label sits left of its point, its right end about a marker's width away
            double charWidth = 7.2 * xmax / canvas.plotWidthEstimate();
            double xText = q[k] - (label.length() * charWidth) / 2 - 1.4 * charWidth;
            c.addLabel(label, Math.max(xText, label.length() * charWidth / 2), abs[k]);
        }
        return canvas.finish(c, name, m, names);
    }

    /** Half-normal quantiles Φ⁻¹(0.5 + 0.5 (i − 0.5)/m), i = 1 … m (Daniel 1959). */
    static double[] halfNormalQuantiles(int m) {
        NormalDistribution z = new NormalDistribution(null, 0, 1);
        double[] q = new double[m];
        for (int i = 1; i <= m; i++) {
            q[i - 1] = z.inverseCumulativeProbability(0.5 + 0.5 * (i - 0.5) / m);
        }
        return q;
    }
}
