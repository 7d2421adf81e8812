package org.fabspread.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Set;
import javax.imageio.IIOImage;
import javax.imageio.ImageIO;
import javax.imageio.ImageTypeSpecifier;
import javax.imageio.ImageWriteParam;
import javax.imageio.ImageWriter;
import javax.imageio.metadata.IIOMetadata;
import javax.imageio.metadata.IIOMetadataNode;
import javax.imageio.stream.ImageOutputStream;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.fabspread.sampling.Interval;
import org.knowm.xchart.AnnotationText;
import org.knowm.xchart.VectorGraphicsEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.XYSeries.XYSeriesRenderStyle;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.lines.SeriesLines;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * Draws the report's charts from plain arrays, each as a PNG (with its resolution recorded, 110 dpi)
 * and an SVG, in one sober style that stays readable in greyscale (see {@link ChartStyle}).
 *
 * <p>Every method refuses empty data and data without a single finite value with an
 * {@link IllegalArgumentException}; NaN values (failed samples, missing intervals) are left out of
 * the drawing. Every axis title carries a unit ({@link Quantity}). Names must be file-safe
 * ({@link Chart#requireFileSafe(String)}) because the report writes {@code charts/<name>.png}.
 *
 * <p>Java's drawing runs headless: loading this class sets {@code java.awt.headless=true} unless the
 * property was set explicitly.
 */
public final class ChartFactory {

    static {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
    }

    public static final int DEFAULT_WIDTH = 900;
    public static final int DEFAULT_HEIGHT = 560;
    /** The resolution recorded in the PNG files. */
    public static final int DPI = 110;
    /** Scatter plots draw at most this many points. */
    public static final int MAX_SCATTER_POINTS = 5000;

    private static final String INTERVAL_LABEL = "95 % interval";

    private final int width;
    private final int height;

    public ChartFactory() {
        this(DEFAULT_WIDTH, DEFAULT_HEIGHT);
    }

    public ChartFactory(int width, int height) {
        if (width < 300 || height < 200 || width > 4000 || height > 4000) {
            throw new IllegalArgumentException("chart size " + width + "x" + height
                    + " is outside 300x200 to 4000x4000 pixels");
        }
        this.width = width;
        this.height = height;
    }

    // ------------------------------------------------------------------------------------------------
    // Monte Carlo output

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
    public Chart histogram(String name, String title, Quantity output, double[] values, double target,
                           boolean atLeast, double yield, Interval interval) {
        Objects.requireNonNull(output, "output");
        Objects.requireNonNull(interval, "interval");
        if (!Double.isFinite(yield) || !interval.isFinite() || !interval.contains(yield)) {
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
        PathChart c = newChart(name, fullTitle, output, yq);
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
        return finish(c, name, v.length, names);
    }

    /**
     * Scatter of an output against one input. More than {@link #MAX_SCATTER_POINTS} valid pairs are
     * thinned deterministically to evenly spaced sample indices ({@link #subsampleIndices}).
     */
    public Chart scatter(String name, String title, Quantity input, double[] x, Quantity output, double[] y) {
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
        PathChart c = newChart(name, title, input, output);
        List<String> names = new ArrayList<>();
        String label = pick.length < n ? "samples (" + pick.length + " of " + n + " shown)" : "samples (n = " + n + ")";
        XYSeries s = c.addSeries(uniqueName(names, label), px, py);
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.CIRCLE);
        s.setMarkerColor(new Color(0x2f, 0x43, 0x56, 110));
        c.getStyler().setMarkerSize(pick.length > 2000 ? 4 : 6);
        c.getStyler().setLegendVisible(true);
        return finish(c, name, pick.length, names);
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

    // ------------------------------------------------------------------------------------------------
    // Sensitivity

    /**
     * Variance contributions: first-order and total Sobol indices per input as grouped horizontal bars
     * (largest total on top), each with its interval drawn as a bar with end caps. Interval bounds
     * may be NaN where none was computed (Saltelli et al., Comput. Phys. Commun. 181, 259 (2010)).
     */
    public Chart varianceContributions(String name, String title, String[] inputs,
                                       double[] first, double[] firstLow, double[] firstHigh,
                                       double[] total, double[] totalLow, double[] totalHigh) {
        int n = requireLabels(name, inputs);
        for (double[] a : new double[][] {first, firstLow, firstHigh, total, totalLow, totalHigh}) {
            requireLength(name, "index arrays", a, n);
        }
        requireSomeFinite(name, "indices", first, total);
        Integer[] order = orderDescending(total);
        Quantity xq = Quantity.dimensionless("Sobol index");
        PathChart c = newChart(name, title, xq, Quantity.of("input", "sorted by S_Ti"));
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
        categoryAxisY(c, order, inputs);
        valueAxisX(c, min, max);
        legendInside(c, Styler.LegendPosition.InsideSE);
        return finish(c, name, points, names);
    }

    /**
     * First-order indices estimated from given data (no intervals), as horizontal bars sorted largest
     * first, for studies without a Sobol design: the correlation ratio over equal-count bins with its
     * no-effect bias (M − 1)/(n − 1) removed (Saltelli et al., Global Sensitivity Analysis: The Primer
     * (2008), ch. 1).
     * Negative estimates (noise around zero) are drawn to the left of zero.
     */
    public Chart firstOrderIndices(String name, String title, String[] inputs, double[] index) {
        int n = requireLabels(name, inputs);
        requireLength(name, "index", index, n);
        requireSomeFinite(name, "index", index);
        return sortedBars(name, title, Quantity.dimensionless("first-order index S_i from the sample"),
                Quantity.of("input", "sorted by S_i"), inputs, index, "first-order S_i (no interval)", 3);
    }

    /**
     * Convergence of an index with the sample size: one line per input against N on a base-2
     * logarithmic axis (ticks at powers of two).
     *
     * @param sampleSizes the sample sizes N (positive, increasing)
     * @param indices     indices[input][k] at sampleSizes[k]
     */
    public Chart convergence(String name, String title, Quantity index, double[] sampleSizes, String[] inputs,
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
        PathChart c = newChart(name, title, Quantity.of("sample size N", "count, log₂ axis"), index);
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
        st.setXAxisTickMarkSpacingHint(Math.max(8, (int) (plotWidthEstimate() * 0.45 / (kmax - kmin + 0.5))));
        c.setCustomXAxisTickLabelsFormatter(TickLabels.atIntegers(k -> k >= 0 && k < 63 ? Long.toString(1L << k) : null));
        legendRight(c, n);
        return finish(c, name, points, names);
    }

    // ------------------------------------------------------------------------------------------------
    // Tolerance

    /**
     * Yield gained by tightening each input, as horizontal bars sorted largest first.
     *
     * @param gain yield gained per input as a fraction (0.05 = five percentage points)
     */
    public Chart toleranceRanking(String name, String title, String[] inputs, double[] gain) {
        int n = requireLabels(name, inputs);
        requireLength(name, "gain", gain, n);
        requireSomeFinite(name, "gain", gain);
        double[] pp = new double[n];
        for (int i = 0; i < n; i++) {
            pp[i] = 100 * gain[i];
        }
        return sortedBars(name, title, Quantity.of("yield gained", "percentage points"),
                Quantity.of("input", "sorted by gain"), inputs, pp, "yield gained", 1);
    }

    /** One value per input as horizontal bars sorted largest first, without a legend. */
    private Chart sortedBars(String name, String title, Quantity valueAxis, Quantity categoryAxis, String[] inputs,
                             double[] values, String seriesName, int shade) {
        int n = values.length;
        Integer[] order = orderDescending(values);
        PathChart c = newChart(name, title, valueAxis, categoryAxis);
        List<String> names = new ArrayList<>();
        double[] centre = new double[n];
        double[] val = new double[n];
        double min = 0;
        double max = 0;
        for (int r = 0; r < n; r++) {
            centre[r] = n - 1 - r;
            val[r] = values[order[r]];
            if (Double.isFinite(val[r])) {
                min = Math.min(min, val[r]);
                max = Math.max(max, val[r]);
            }
        }
        double[][] bars = new double[2][];
        horizontalBars(centre, val, 0.62, bars);
        XYSeries s = c.addSeries(uniqueName(names, seriesName), bars[0], bars[1]);
        styleBars(s, shade);
        c.getStyler().setLegendVisible(false);
        categoryAxisY(c, order, inputs);
        valueAxisX(c, min, max);
        return finish(c, name, countFinite(values), names);
    }

    /**
     * Tolerance allocation trade-off: predicted yield against the cost of the tightened tolerances,
     * one point per allocation (joined in order of cost), with the yield goal as a dashed line.
     *
     * @param predictedYield yields as fractions 0–1
     * @param goal           the yield goal as a fraction 0–1
     */
    public Chart allocationTradeoff(String name, String title, Quantity cost, double[] costs,
                                    double[] predictedYield, double goal) {
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
        PathChart c = newChart(name, title, cost, Quantity.of("predicted yield", "%"));
        List<String> names = new ArrayList<>();
        XYSeries s = c.addSeries(uniqueName(names, "allocations"), cx, cy);
        styleLine(s, ChartStyle.PALETTE[1], ChartStyle.STROKES[0], true);
        s.setMarker(SeriesMarkers.CIRCLE);
        double span = cx[n - 1] - cx[0];
        double pad = span > 0 ? 0.04 * span : Math.max(Math.abs(cx[0]) * 0.1, 1);
        XYSeries g = c.addSeries(uniqueName(names, "goal " + percent(goal) + " %"),
                new double[] {cx[0] - pad, cx[n - 1] + pad}, new double[] {100 * goal, 100 * goal});
        styleLine(g, ChartStyle.PALETTE[0], ChartStyle.dashed(2.2f), false);
        XYStyler st = c.getStyler();
        st.setXAxisMin(cx[0] - pad);
        st.setXAxisMax(cx[n - 1] + pad);
        double ymin = Math.min(100 * goal, min(cy));
        double ymax = Math.max(100 * goal, max(cy));
        double ypad = Math.max(0.5, 0.08 * (ymax - ymin));
        st.setYAxisMin(Math.max(0, ymin - ypad));
        st.setYAxisMax(Math.min(100, ymax + ypad));
        legendInside(c, Styler.LegendPosition.InsideSE);
        return finish(c, name, n, names);
    }

    // ------------------------------------------------------------------------------------------------
    // Device

    /**
     * Nominal absorption spectra stacked by layer: band k reaches from the sum of the layers before it
     * to the sum including it, so the top of the stack is the total absorptance. The absorber's EQE is
     * drawn as a line, and the reflectance as a line hanging from 1 (at 1 − R), so that the gap between
     * the stack and that line is the light transmitted or lost otherwise.
     *
     * @param absorptance absorptance[layer][wavelength], fractions, layers in stack order
     * @param eqe         the absorber's external quantum efficiency (fraction), or null to omit it
     * @param reflectance the reflectance (fraction), or null to omit it
     */
    public Chart absorptionSpectra(String name, String title, double[] wavelengthNm, String[] layers,
                                   double[][] absorptance, double[] eqe, double[] reflectance) {
        int nl = requireLabels(name, layers);
        int nw = requireNonEmpty(name, "wavelengthNm", wavelengthNm);
        requireIncreasing(name, "wavelengthNm", wavelengthNm);
        if (absorptance == null || absorptance.length != nl) {
            throw new IllegalArgumentException(name + ": one absorptance row per layer is needed (" + nl + " layers)");
        }
        for (double[] row : absorptance) {
            requireLength(name, "absorptance row", row, nw);
        }
        requireSomeFinite(name, "absorptance", absorptance);
        double[][] cumulative = new double[nl][nw];
        for (int j = 0; j < nw; j++) {
            double sum = 0;
            for (int l = 0; l < nl; l++) {
                double a = absorptance[l][j];
                sum += Double.isFinite(a) ? a : 0;
                cumulative[l][j] = sum;
            }
        }
        PathChart c = newChart(name, title, Quantity.of("wavelength", "nm"), Quantity.dimensionless("fraction of incident photons"));
        List<String> names = new ArrayList<>();
        Color[] fills = ChartStyle.fillRamp(nl);
        int points = 0;
        double[] bx = new double[2 * nw + 1];
        for (int j = 0; j < nw; j++) {
            bx[j] = wavelengthNm[j];
            bx[2 * nw - 1 - j] = wavelengthNm[j];
        }
        bx[2 * nw] = wavelengthNm[0];
        for (int l = nl - 1; l >= 0; l--) {
            // band l: along its upper edge left to right, back along the edge below it, closed
            double[] by = new double[2 * nw + 1];
            for (int j = 0; j < nw; j++) {
                by[j] = cumulative[l][j];
                by[2 * nw - 1 - j] = l == 0 ? 0 : cumulative[l - 1][j];
            }
            by[2 * nw] = by[0];
            XYSeries s = c.addSeries(uniqueName(names, layers[l]), bx, by);
            s.setXYSeriesRenderStyle(XYSeriesRenderStyle.PolygonArea);
            s.setMarker(SeriesMarkers.NONE);
            s.setFillColor(fills[l]);
            s.setLineColor(ChartStyle.BAR_EDGE);
            s.setLineStyle(ChartStyle.solid(0.7f));
            points += countFinite(absorptance[l]);
        }
        if (eqe != null) {
            requireLength(name, "eqe", eqe, nw);
            curve(c, names, "EQE (absorber)", wavelengthNm, eqe, ChartStyle.PALETTE[0], ChartStyle.dashed(2.6f));
            points += countFinite(eqe);
        }
        if (reflectance != null) {
            requireLength(name, "reflectance", reflectance, nw);
            double[] top = new double[nw];
            for (int j = 0; j < nw; j++) {
                top[j] = 1 - reflectance[j];
            }
            curve(c, names, "1 − R", wavelengthNm, top, ChartStyle.PALETTE[0], ChartStyle.dotted(2.8f));
            points += countFinite(reflectance);
        }
        XYStyler st = c.getStyler();
        st.setYAxisMin(0.0);
        st.setYAxisMax(1.0);
        st.setXAxisMin(wavelengthNm[0]);
        st.setXAxisMax(wavelengthNm[nw - 1]);
        roundTicksX(c, wavelengthNm, 0);
        legendRight(c, names.size());
        return finish(c, name, points, names);
    }

    /**
     * Generation rate against depth in the absorber, one curve per case (for example with and
     * without particles).
     *
     * @param generation generation[case][depth] in {@code generationUnit}
     */
    public Chart generationProfile(String name, String title, double[] depthNm, String[] cases,
                                   double[][] generation, String generationUnit) {
        int nc = requireLabels(name, cases);
        int nx = requireNonEmpty(name, "depthNm", depthNm);
        if (generation == null || generation.length != nc) {
            throw new IllegalArgumentException(name + ": one generation row per case is needed (" + nc + " cases)");
        }
        for (double[] row : generation) {
            requireLength(name, "generation row", row, nx);
        }
        requireSomeFinite(name, "generation", generation);
        double big = 0;
        for (double[] row : generation) {
            for (double v : row) {
                if (Double.isFinite(v)) {
                    big = Math.max(big, Math.abs(v));
                }
            }
        }
        int exponent = big > 0 ? (int) Math.floor(Math.log10(big)) : 0;
        // large rates are drawn in units of 10^e so that the ticks read 1, 2, 3 … instead of 1E21
        double scale = Math.abs(exponent) >= 4 ? Math.pow(10, -exponent) : 1;
        String unit = scale == 1 ? generationUnit : "10" + superscript(exponent) + " " + generationUnit;
        PathChart c = newChart(name, title, Quantity.of("depth from the front of the absorber", "nm"),
                Quantity.of("generation rate", unit));
        List<String> names = new ArrayList<>();
        int points = 0;
        for (int k = 0; k < nc; k++) {
            double[] row = new double[nx];
            for (int j = 0; j < nx; j++) {
                row[j] = generation[k][j] * scale;
            }
            curve(c, names, cases[k], depthNm, row, ChartStyle.lineColor(k), ChartStyle.stroke(k));
            points += countFinite(generation[k]);
        }
        c.getStyler().setYAxisMin(0.0);
        c.getStyler().setLegendVisible(nc > 1);
        roundTicksX(c, depthNm, 0);
        return finish(c, name, points, names);
    }

    /**
     * Cross-sections of one particle against wavelength: extinction (solid), scattering (dashed) and
     * absorption (dotted); extinction = scattering + absorption (Bohren &amp; Huffman, Absorption and
     * Scattering of Light by Small Particles (1983), §3.4).
     */
    public Chart crossSections(String name, String title, double[] wavelengthNm, double[] extinction,
                               double[] scattering, double[] absorption, String areaUnit) {
        int nw = requireNonEmpty(name, "wavelengthNm", wavelengthNm);
        requireLength(name, "extinction", extinction, nw);
        requireLength(name, "scattering", scattering, nw);
        requireLength(name, "absorption", absorption, nw);
        requireSomeFinite(name, "cross-sections", extinction, scattering, absorption);
        PathChart c = newChart(name, title, Quantity.of("wavelength", "nm"), Quantity.of("cross-section", areaUnit));
        List<String> names = new ArrayList<>();
        String[] labels = {"extinction", "scattering", "absorption"};
        double[][] data = {extinction, scattering, absorption};
        int points = 0;
        for (int k = 0; k < 3; k++) {
            curve(c, names, labels[k], wavelengthNm, data[k], ChartStyle.lineColor(k), ChartStyle.stroke(k));
            points += countFinite(data[k]);
        }
        c.getStyler().setYAxisMin(0.0);
        c.getStyler().setXAxisMin(wavelengthNm[0]);
        c.getStyler().setXAxisMax(wavelengthNm[nw - 1]);
        roundTicksX(c, wavelengthNm, 0);
        return finish(c, name, points, names);
    }

    // ------------------------------------------------------------------------------------------------
    // Experiment plans

    /**
     * The plan's predicted effects (high-level mean minus low-level mean) as horizontal bars sorted by
     * magnitude, largest on top; positive and negative effects in two shades.
     */
    public Chart predictedEffects(String name, String title, Quantity response, String[] effects, double[] values) {
        Objects.requireNonNull(response, "response");
        int n = requireLabels(name, effects);
        requireLength(name, "values", values, n);
        requireSomeFinite(name, "values", values);
        double[] mag = new double[n];
        for (int i = 0; i < n; i++) {
            mag[i] = Math.abs(values[i]);
        }
        Integer[] order = orderDescending(mag);
        PathChart c = newChart(name, title, Quantity.of("effect on " + response.label(), response.unit()),
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
        categoryAxisY(c, order, effects);
        valueAxisX(c, min, max);
        return finish(c, name, countFinite(values), names);
    }

    /**
     * Half-normal plot of measured effects (Daniel, Technometrics 1, 311 (1959)): the absolute effects,
     * sorted, against the half-normal quantiles Φ⁻¹(0.5 + 0.5 (i − 0.5)/m), i = 1 … m, with Lenth's
     * margin of error ME and simultaneous margin SME as horizontal lines (Lenth, Technometrics 31, 469
     * (1989)) and the largest {@code labelTop} effects named.
     */
    public Chart halfNormal(String name, String title, Quantity response, String[] effects, double[] values,
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
        PathChart c = newChart(name, title, Quantity.dimensionless("half-normal quantile"),
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
            double charWidth = 7.2 * xmax / plotWidthEstimate();
            double xText = q[k] - (label.length() * charWidth) / 2 - 1.4 * charWidth;
            c.addAnnotation(new AnnotationText(label, Math.max(xText, label.length() * charWidth / 2), abs[k], false));
        }
        return finish(c, name, m, names);
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

    // ------------------------------------------------------------------------------------------------
    // Histogram bins

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

    // ------------------------------------------------------------------------------------------------
    // Building blocks

    private PathChart newChart(String name, String title, Quantity x, Quantity y) {
        Chart.requireFileSafe(name);
        Objects.requireNonNull(title, "title");
        PathChart c = new PathChart(width, height);
        ChartStyle.apply(c.getStyler());
        c.setTitle(title);
        c.setXAxisTitle(x.axisTitle());
        c.setYAxisTitle(y.axisTitle());
        c.getStyler().setXAxisTickMarkSpacingHint(95);
        c.getStyler().setXAxisMaxLabelCount(12);
        c.setCustomXAxisTickLabelsFormatter(ChartFactory::tick);
        c.setCustomYAxisTickLabelsFormatter(ChartFactory::tick);
        return c;
    }

    private double plotWidthEstimate() {
        return width - 200.0;
    }

    private double plotHeightEstimate() {
        return height - 190.0;
    }

    /**
     * The chart library places x ticks at the data's own x values when all series share one evenly
     * spaced grid (a wavelength grid, say), packing a label at every few points. A hidden, undrawn
     * point between the first two grid values breaks that pattern, so the ticks fall on round numbers
     * spaced by the tick-spacing hint instead. It has no legend entry and is not counted as a series.
     */
    private static void roundTicksX(XYChart c, double[] grid, double y) {
        if (grid.length < 2) {
            return;
        }
        XYSeries s = c.addSeries("\u2060", new double[] {0.5 * (grid[0] + grid[1])}, new double[] {y});
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.NONE);
        s.setShowInLegend(false);
    }

    /** A vertical legend inside the plot, in a corner the data leave free. */
    private static void legendInside(XYChart c, Styler.LegendPosition corner) {
        c.getStyler().setLegendPosition(corner);
        c.getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
    }

    private static void legendRight(XYChart c, int series) {
        if (series > 3) {
            c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
            c.getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
        }
    }

    /**
     * A densely sampled curve drawn as one continuous path ({@link PathChart}): an undrawn series
     * carries the data for the axis ranges, a one-point series carries the legend entry.
     */
    private static void curve(PathChart c, List<String> names, String label, double[] x, double[] y, Color color,
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

    private static void styleLine(XYSeries s, Color color, BasicStroke stroke, boolean markers) {
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.Line);
        s.setLineColor(color);
        s.setLineStyle(stroke);
        s.setMarkerColor(color);
        if (!markers) {
            s.setMarker(SeriesMarkers.NONE);
        }
    }

    /** Bars as closed polygons, filled with palette colour {@code shade}, edged in near-black. */
    private static XYSeries styleBars(XYSeries s, int shade) {
        s.setXYSeriesRenderStyle(XYSeriesRenderStyle.PolygonArea);
        s.setMarker(SeriesMarkers.NONE);
        s.setFillColor(ChartStyle.PALETTE[shade]);
        s.setLineColor(ChartStyle.BAR_EDGE);
        s.setLineStyle(ChartStyle.solid(1.0f));
        return s;
    }

    /** Vertical histogram bars as rectangles separated by NaN (one polygon each), skipping empty bins. */
    private static void rectangles(double[] edges, double[] counts, double[][] out) {
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
    private static void horizontalBars(double[] centre, double[] value, double h, double[][] out) {
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
    private static void intervalsCollect(double[] centre, double[] lo, double[] hi, double cap, double[][] acc) {
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

    /** Names the rows of a horizontal bar chart: row r (from the top) shows inputs[order[r]]. */
    private void categoryAxisY(XYChart c, Integer[] order, String[] labels) {
        int n = order.length;
        XYStyler st = c.getStyler();
        st.setYAxisMin(-0.6);
        st.setYAxisMax(n - 0.4);
        st.setPlotGridHorizontalLinesVisible(false);
        st.setYAxisTickMarksColor(Color.WHITE);
        if (n > 16) {
            st.setAxisTickLabelsFont(ChartStyle.TICK_FONT.deriveFont(11f));
        }
        st.setYAxisTickMarkSpacingHint(Math.max(6, (int) (plotHeightEstimate() * 0.55 / n)));
        c.setCustomYAxisTickLabelsFormatter(TickLabels.atIntegers(k -> k >= 0 && k < n ? labels[order[n - 1 - k]] : null));
    }

    /** A value axis that includes zero, with a little room beyond the extremes. */
    private static void valueAxisX(XYChart c, double min, double max) {
        double span = max - min;
        if (span <= 0) {
            span = 1;
        }
        XYStyler st = c.getStyler();
        st.setXAxisMin(min < 0 ? min - 0.05 * span : 0.0);
        st.setXAxisMax(max > 0 ? max + 0.05 * span : 0.0 + 0.05 * span);
    }

    private Chart finish(XYChart c, String name, int points, List<String> names) {
        return new Chart(name, c.getTitle(), png(c), svg(c), width, height, names.size(), points,
                c.getXAxisTitle(), c.getYAxisTitle(), names);
    }

    private byte[] png(XYChart c) {
        BufferedImage img = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
            c.paint(g, width, height);
        } finally {
            g.dispose();
        }
        ImageWriter w = ImageIO.getImageWritersByFormatName("png").next();
        ByteArrayOutputStream out = new ByteArrayOutputStream(64 * 1024);
        try (ImageOutputStream ios = ImageIO.createImageOutputStream(out)) {
            ImageWriteParam p = w.getDefaultWriteParam();
            IIOMetadata md = w.getDefaultImageMetadata(ImageTypeSpecifier.createFromRenderedImage(img), p);
            // the native pHYs chunk (the standard-format pixel size is misread by some JDK writers)
            String perMetre = Long.toString(Math.round(DPI / 0.0254));
            IIOMetadataNode phys = new IIOMetadataNode("pHYs");
            phys.setAttribute("pixelsPerUnitXAxis", perMetre);
            phys.setAttribute("pixelsPerUnitYAxis", perMetre);
            phys.setAttribute("unitSpecifier", "meter");
            IIOMetadataNode root = new IIOMetadataNode("javax_imageio_png_1.0");
            root.appendChild(phys);
            md.mergeTree("javax_imageio_png_1.0", root);
            w.setOutput(ios);
            w.write(null, new IIOImage(img, null, md), p);
        } catch (IOException e) {
            throw new UncheckedIOException("PNG encoding failed", e);
        } finally {
            w.dispose();
        }
        return out.toByteArray();
    }

    private static String svg(XYChart c) {
        ByteArrayOutputStream out = new ByteArrayOutputStream(64 * 1024);
        try {
            VectorGraphicsEncoder.saveVectorGraphic(c, out, VectorGraphicsEncoder.VectorGraphicsFormat.SVG);
        } catch (IOException e) {
            throw new UncheckedIOException("SVG encoding failed", e);
        }
        return out.toString(StandardCharsets.UTF_8);
    }

    // ------------------------------------------------------------------------------------------------
    // Checks and small helpers

    private static double[] finiteSorted(String name, String what, double[] values) {
        requireNonEmpty(name, what, values);
        double[] v = new double[values.length];
        int n = 0;
        for (double x : values) {
            if (Double.isFinite(x)) {
                v[n++] = x;
            }
        }
        if (n == 0) {
            throw new IllegalArgumentException(name + ": " + what + " has no finite value (all NaN)");
        }
        v = Arrays.copyOf(v, n);
        Arrays.sort(v);
        return v;
    }

    private static int requireNonEmpty(String name, String what, double[] a) {
        if (a == null || a.length == 0) {
            throw new IllegalArgumentException(name + ": " + what + " is empty");
        }
        return a.length;
    }

    private static void requireLength(String name, String what, double[] a, int n) {
        if (a == null || a.length != n) {
            throw new IllegalArgumentException(name + ": " + what + " must have " + n + " values, has "
                    + (a == null ? "none" : a.length));
        }
    }

    private static void requireSameLength(String name, String wa, double[] a, String wb, double[] b) {
        requireNonEmpty(name, wa, a);
        requireNonEmpty(name, wb, b);
        if (a.length != b.length) {
            throw new IllegalArgumentException(name + ": " + wa + " has " + a.length + " values, " + wb + " has " + b.length);
        }
    }

    private static void requireIncreasing(String name, String what, double[] a) {
        for (int i = 0; i < a.length; i++) {
            if (!Double.isFinite(a[i]) || (i > 0 && a[i] <= a[i - 1])) {
                throw new IllegalArgumentException(name + ": " + what + " must be finite and increasing");
            }
        }
    }

    private static void requireSomeFinite(String name, String what, double[]... arrays) {
        boolean empty = true;
        for (double[] a : arrays) {
            if (a == null) {
                continue;
            }
            if (a.length > 0) {
                empty = false;
            }
            for (double x : a) {
                if (Double.isFinite(x)) {
                    return;
                }
            }
        }
        throw new IllegalArgumentException(name + ": " + what + (empty ? " is empty" : " has no finite value (all NaN)"));
    }

    private static int requireLabels(String name, String[] labels) {
        Chart.requireFileSafe(name);
        if (labels == null || labels.length == 0) {
            throw new IllegalArgumentException(name + ": no series or categories given (empty)");
        }
        Set<String> seen = new HashSet<>();
        for (String l : labels) {
            if (l == null || l.isBlank()) {
                throw new IllegalArgumentException(name + ": a label is blank");
            }
            if (!seen.add(l)) {
                throw new IllegalArgumentException(name + ": the label '" + l + "' appears twice");
            }
        }
        return labels.length;
    }

    private static String uniqueName(List<String> names, String base) {
        String s = base;
        int k = 2;
        while (names.contains(s)) {
            s = base + " (" + k++ + ")";
        }
        names.add(s);
        return s;
    }

    private static Integer[] orderDescending(double[] key) {
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

    private static int countFinite(double[] a) {
        int n = 0;
        for (double x : a) {
            if (Double.isFinite(x)) {
                n++;
            }
        }
        return n;
    }

    private static double min(double[] a) {
        double m = Double.POSITIVE_INFINITY;
        for (double x : a) {
            m = Math.min(m, x);
        }
        return m;
    }

    private static double max(double[] a) {
        double m = Double.NEGATIVE_INFINITY;
        for (double x : a) {
            m = Math.max(m, x);
        }
        return m;
    }

    /** An integer exponent in superscript digits (−12 → ⁻¹²). */
    static String superscript(int e) {
        String digits = "⁰¹²³⁴⁵⁶⁷⁸⁹";
        StringBuilder sb = new StringBuilder();
        if (e < 0) {
            sb.append('⁻');
        }
        for (char ch : Integer.toString(Math.abs(e)).toCharArray()) {
            sb.append(digits.charAt(ch - '0'));
        }
        return sb.toString();
    }

    /** A tick value: at most six significant digits, no exponent, no trailing zeros, a true minus sign. */
    static String tick(double v) {
        if (!Double.isFinite(v)) {
            return "";
        }
        if (Math.abs(v) < 1e-12) {
            return "0";
        }
        String s = new java.math.BigDecimal(v).round(new java.math.MathContext(6)).stripTrailingZeros().toPlainString();
        return s.replace('-', '−');
    }

    /** A fraction as a percentage with one decimal. */
    static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.1f", 100 * fraction);
    }

    /** Up to four significant digits, no exponent for everyday magnitudes. */
    static String number(double v) {
        if (v == 0) {
            return "0";
        }
        double a = Math.abs(v);
        if (a >= 1e-3 && a < 1e6) {
            String s = new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
            return s.replace('-', '−');
        }
        return String.format(Locale.ROOT, "%.3e", v).replace('-', '−');
    }
}
