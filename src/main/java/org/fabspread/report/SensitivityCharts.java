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

/** Charts of variance contributions: Sobol indices with intervals, given-data indices, convergence. */
final class SensitivityCharts {

    private static final String INTERVAL_LABEL = "95 % interval";

    private final ChartCanvas canvas;

    SensitivityCharts(ChartCanvas canvas) {
        this.canvas = canvas;
    }

    /**
     * Variance contributions: first-order and total Sobol indices per input as grouped horizontal bars
     * (largest total on top), each with its interval drawn as a bar with end caps. Interval bounds
     * may be NaN where none was computed (Saltelli et al., Comput. Phys. Commun. 181, 259 (2010)).
     */
    Chart varianceContributions(String name, String title, String[] inputs,
                                       double[] first, double[] firstLow, double[] firstHigh,
                                       double[] total, double[] totalLow, double[] totalHigh) {
        int n = requireLabels(name, inputs);
        for (double[] a : new double[][] {first, firstLow, firstHigh, total, totalLow, totalHigh}) {
            requireLength(name, "index arrays", a, n);
        }
        requireSomeFinite(name, "indices", first, total);
        Integer[] order = orderDescending(total);
        Quantity xq = Quantity.dimensionless("Sobol index");
        PathChart c = canvas.newChart(name, title, xq, Quantity.of("input", "sorted by S_Ti"));
        List<String> names = new ArrayList<>();
        double[][] groups = {first, total};
        double[][] lows = {firstLow, totalLow};
        double[][] highs = {firstHigh, totalHigh};
        String[] labels = {"first-order S_i", "total S_Ti"};
        double min = 0;
        double max = 0;
        int points = 0;
        double band = 0.8;
        double h = band / 2;
        double[][] iv = new double[2][];
        for (int g = 1; g >= 0; g--) {
            // total first in the legend and drawn above the first-order bar of the same input
            double[][] bars = new double[2][];
            double[] lo = new double[n];
            double[] hi = new double[n];
            double[] val = new double[n];
            double[] centre = new double[n];
            for (int r = 0; r < n; r++) {
                int i = order[r];
                double yc = n - 1 - r + (g == 1 ? h / 2 : -h / 2);
                centre[r] = yc;
                val[r] = groups[g][i];
                lo[r] = lows[g][i];
                hi[r] = highs[g][i];
                if (Double.isFinite(val[r])) {
                    points++;
                    min = Math.min(min, val[r]);
                    max = Math.max(max, val[r]);
                }
                if (Double.isFinite(lo[r])) {
                    min = Math.min(min, lo[r]);
                }
                if (Double.isFinite(hi[r])) {
                    max = Math.max(max, hi[r]);
                }
            }
            horizontalBars(centre, val, h * 0.92, bars);
            XYSeries s = c.addSeries(uniqueName(names, labels[g]),
                    bars[0], bars[1]);
            styleBars(s, g == 1 ? 1 : 3);
            intervalsCollect(centre, lo, hi, h * 0.45, iv);
        }
        if (iv[0] != null && iv[0].length > 0) {
            XYSeries e = c.addSeries(uniqueName(names, INTERVAL_LABEL), iv[0], iv[1]);
            styleLine(e, ChartStyle.PALETTE[0], ChartStyle.solid(1.6f), false);
        }
        canvas.categoryAxisY(c, order, inputs);
        valueAxisX(c, min, max);
        legendInside(c, Styler.LegendPosition.InsideSE);
        return canvas.finish(c, name, points, names);
    }

    /**
     * First-order indices estimated from given data (no intervals), as horizontal bars sorted largest
     * first, for studies without a Sobol design: the correlation ratio over equal-count bins with its
     * no-effect bias (M − 1)/(n − 1) removed (Saltelli et al., Global Sensitivity Analysis: The Primer
     * (2008), ch. 1).
     * Negative estimates (noise around zero) are drawn to the left of zero.
     */
    Chart firstOrderIndices(String name, String title, String[] inputs, double[] index) {
        int n = requireLabels(name, inputs);
        requireLength(name, "index", index, n);
        requireSomeFinite(name, "index", index);
        return canvas.sortedBars(name, title, Quantity.dimensionless("first-order index S_i from the sample"),
                Quantity.of("input", "sorted by S_i"), inputs, index, "first-order S_i (no interval)", 3);
    }

    /**
     * Convergence of an index with the sample size: one line per input against N on a base-2
     * logarithmic axis (ticks at powers of two).
     *
     * @param sampleSizes the sample sizes N (positive, increasing)
     * @param indices     indices[input][k] at sampleSizes[k]
     */
    Chart convergence(String name, String title, Quantity index, double[] sampleSizes, String[] inputs,
                             double[][] indices) {
        Objects.requireNonNull(index, "index");
        int n = requireLabels(name, inputs);
        requireNonEmpty(name, "sampleSizes", sampleSizes);
        if (indices == null || indices.length != n) {
            throw new IllegalArgumentException(name + ": one index row per input is needed (" + n + " inputs)");
        }
        double[] lx = new double[sampleSizes.length];
        for (int k = 0; k < sampleSizes.length; k++) {
            double s = sampleSizes[k];
            if (!(s > 0) || !Double.isFinite(s) || (k > 0 && s <= sampleSizes[k - 1])) {
                throw new IllegalArgumentException(name + ": sample sizes must be positive and increasing, got "
                        + Arrays.toString(sampleSizes));
            }
            lx[k] = Math.log(s) / Math.log(2);
        }
        for (double[] row : indices) {
            requireLength(name, "index row", row, sampleSizes.length);
        }
        requireSomeFinite(name, "indices", indices);
        PathChart c = canvas.newChart(name, title, Quantity.of("sample size N", "count, log₂ axis"), index);
        List<String> names = new ArrayList<>();
        int points = 0;
        for (int i = 0; i < n; i++) {
            XYSeries s = c.addSeries(uniqueName(names, inputs[i]), lx, indices[i]);
            styleLine(s, ChartStyle.lineColor(i), ChartStyle.stroke(i), true);
            s.setMarker(ChartStyle.marker(i));
            points += countFinite(indices[i]);
        }
        int kmin = (int) Math.floor(lx[0]);
        int kmax = (int) Math.ceil(lx[lx.length - 1]);
        if (kmax == kmin) {
            kmax++;
        }
        XYStyler st = c.getStyler();
        st.setXAxisMin((double) kmin - 0.25);
        st.setXAxisMax((double) kmax + 0.25);
        st.setXAxisTickMarkSpacingHint(Math.max(8, (int) (canvas.plotWidthEstimate() * 0.45 / (kmax - kmin + 0.5))));
        c.setCustomXAxisTickLabelsFormatter(TickLabels.atIntegers(k -> k >= 0 && k < 63 ? Long.toString(1L << k) : null));
        legendRight(c, n);
        return canvas.finish(c, name, points, names);
    }
}
