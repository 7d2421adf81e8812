package org.fabspread.report;

import org.fabspread.sampling.Interval;
/**
 * Draws the report's charts from plain arrays, each as a PNG (with its resolution recorded, 110 dpi)
 * and an SVG, in one sober style that stays readable in greyscale (see {@link ChartStyle}).
 *
 * <p>This is the one entry point the report uses; the drawing itself lives in one class per chart
 * domain ({@link DistributionCharts}, {@link SensitivityCharts}, {@link ToleranceCharts},
 * {@link OpticsCharts}, {@link PlanCharts}) on a shared {@link ChartCanvas}. A new domain is a new
 * class that takes {@link #canvas()}.
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

    private final ChartCanvas canvas;
    private final DistributionCharts distributions;
    private final SensitivityCharts sensitivity;
    private final ToleranceCharts tolerance;
    private final OpticsCharts optics;
    private final PlanCharts plans;

    public ChartFactory() {
        this(DEFAULT_WIDTH, DEFAULT_HEIGHT);
    }

    public ChartFactory(int width, int height) {
        if (width < 300 || height < 200 || width > 4000 || height > 4000) {
            throw new IllegalArgumentException("chart size " + width + "x" + height
                    + " is outside 300x200 to 4000x4000 pixels");
        }
        this.canvas = new ChartCanvas(width, height);
        this.distributions = new DistributionCharts(canvas);
        this.sensitivity = new SensitivityCharts(canvas);
        this.tolerance = new ToleranceCharts(canvas);
        this.optics = new OpticsCharts(canvas);
        this.plans = new PlanCharts(canvas);
    }

    /** The drawing surface shared by the chart domains, for a new domain to draw on. */
    ChartCanvas canvas() {
        return canvas;
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
    public Chart histogram(String name, String title, Quantity output, double[] values, double target,
                           boolean atLeast, double yield, Interval interval) {
        return distributions.histogram(name, title, output, values, target, atLeast, yield, interval);
    }

    /**
     * Scatter of an output against one input. More than {@link #MAX_SCATTER_POINTS} valid pairs are
     * thinned deterministically to evenly spaced sample indices ({@link #subsampleIndices}).
     */
    public Chart scatter(String name, String title, Quantity input, double[] x, Quantity output, double[] y) {
        return distributions.scatter(name, title, input, x, output, y);
    }

    /**
     * Variance contributions: first-order and total Sobol indices per input as grouped horizontal bars
     * (largest total on top), each with its interval drawn as a bar with end caps. Interval bounds
     * may be NaN where none was computed (Saltelli et al., Comput. Phys. Commun. 181, 259 (2010)).
     */
    public Chart varianceContributions(String name, String title, String[] inputs,
                                       double[] first, double[] firstLow, double[] firstHigh,
                                       double[] total, double[] totalLow, double[] totalHigh) {
        return sensitivity.varianceContributions(name, title, inputs, first, firstLow, firstHigh, total, totalLow, totalHigh);
    }

    /**
     * First-order indices estimated from given data (no intervals), as horizontal bars sorted largest
     * first, for studies without a Sobol design: the correlation ratio over equal-count bins with its
     * no-effect bias (M − 1)/(n − 1) removed (Saltelli et al., Global Sensitivity Analysis: The Primer
     * (2008), ch. 1).
     * Negative estimates (noise around zero) are drawn to the left of zero.
     */
    public Chart firstOrderIndices(String name, String title, String[] inputs, double[] index) {
        return sensitivity.firstOrderIndices(name, title, inputs, index);
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
        return sensitivity.convergence(name, title, index, sampleSizes, inputs, indices);
    }

    /**
     * Yield gained by tightening each input, as horizontal bars sorted largest first.
     *
     * @param gain yield gained per input as a fraction (0.05 = five percentage points)
     */
    public Chart toleranceRanking(String name, String title, String[] inputs, double[] gain) {
        return tolerance.toleranceRanking(name, title, inputs, gain);
    }

    /**
     * Sorted horizontal bars with an interval on each (the tolerance ranking's paired gains, Shapley
     * effects); see {@link IntervalBarCharts}.
     */
    public Chart intervalBars(String name, String title, Quantity valueAxis, Quantity categoryAxis, String[] inputs,
                              double[] values, double[] low, double[] high, String seriesName,
                              String intervalLabel) {
        return new IntervalBarCharts(canvas).bars(name, title, valueAxis, categoryAxis, inputs, values, low, high,
                seriesName, intervalLabel);
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
        return tolerance.allocationTradeoff(name, title, cost, costs, predictedYield, goal);
    }

    /** The allocation trade-off with each point's interval (fractions 0–1) as a vertical bar. */
    public Chart allocationTradeoff(String name, String title, Quantity cost, double[] costs,
                                    double[] predictedYield, double[] low, double[] high, double goal) {
        return tolerance.allocationTradeoff(name, title, cost, costs, predictedYield, low, high, goal);
    }

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
        return optics.absorptionSpectra(name, title, wavelengthNm, layers, absorptance, eqe, reflectance);
    }

    /**
     * Generation rate against depth in the absorber, one curve per case (for example with and
     * without particles).
     *
     * @param generation generation[case][depth] in {@code generationUnit}
     */
    public Chart generationProfile(String name, String title, double[] depthNm, String[] cases,
                                   double[][] generation, String generationUnit) {
        return optics.generationProfile(name, title, depthNm, cases, generation, generationUnit);
    }

    /**
     * Cross-sections of one particle against wavelength: extinction (solid), scattering (dashed) and
     * absorption (dotted); extinction = scattering + absorption (Bohren &amp; Huffman, Absorption and
     * Scattering of Light by Small Particles (1983), §3.4).
     */
    public Chart crossSections(String name, String title, double[] wavelengthNm, double[] extinction,
                               double[] scattering, double[] absorption, String areaUnit) {
        return optics.crossSections(name, title, wavelengthNm, extinction, scattering, absorption, areaUnit);
    }

    /** Extinction of one particle per in-plane polarisation and their unpolarised mean ({@link OpticsCharts}). */
    public Chart polarisedExtinction(String name, String title, double[] wavelengthNm, double[] alongX,
                                     double[] alongY, String areaUnit) {
        return optics.polarisedExtinction(name, title, wavelengthNm, alongX, alongY, areaUnit);
    }

    /**
     * The plan's predicted effects (high-level mean minus low-level mean) as horizontal bars sorted by
     * magnitude, largest on top; positive and negative effects in two shades.
     */
    public Chart predictedEffects(String name, String title, Quantity response, String[] effects, double[] values) {
        return plans.predictedEffects(name, title, response, effects, values);
    }

    /**
     * Half-normal plot of measured effects (Daniel, Technometrics 1, 311 (1959)): the absolute effects,
     * sorted, against the half-normal quantiles Φ⁻¹(0.5 + 0.5 (i − 0.5)/m), i = 1 … m, with Lenth's
     * margin of error ME and simultaneous margin SME as horizontal lines (Lenth, Technometrics 31, 469
     * (1989)) and the largest {@code labelTop} effects named.
     */
    public Chart halfNormal(String name, String title, Quantity response, String[] effects, double[] values,
                            double me, double sme, int labelTop) {
        return plans.halfNormal(name, title, response, effects, values, me, sme, labelTop);
    }

    /**
     * Histogram of one output without a target, with its mean (dashed) and 5 % and 95 % quantiles
     * (dotted); Freedman–Diaconis bins as in {@link #histogram}.
     */
    public Chart distribution(String name, String title, Quantity output, double[] values) {
        return distributions.distribution(name, title, output, values);
    }

    /**
     * Yield against the target value, with its pointwise confidence band shaded and the study's target
     * as a dashed line (yields and band edges as fractions 0–1).
     */
    public Chart yieldCurve(String name, String title, Quantity output, double[] threshold, double[] yield,
                            double[] low, double[] high, double target, String bandLabel) {
        return distributions.yieldCurve(name, title, output, threshold, yield, low, high, target, bandLabel);
    }

    /** Yield gained by halving each input's σ per unit of its cost, sorted largest first (fractions per unit). */
    public Chart costWeightedGain(String name, String title, String[] inputs, double[] gainPerCost) {
        return tolerance.costWeightedGain(name, title, inputs, gainPerCost);
    }

    /**
     * Indices {@code floor(k n / max)}, k = 0 … max − 1, when n exceeds max, else 0 … n − 1: an evenly
     * spread, reproducible subsample (the samples are already in random order).
     */
    static int[] subsampleIndices(int n, int max) {
        return DistributionCharts.subsampleIndices(n, max);
    }

    /** Half-normal quantiles Φ⁻¹(0.5 + 0.5 (i − 0.5)/m), i = 1 … m (Daniel 1959). */
    static double[] halfNormalQuantiles(int m) {
        return PlanCharts.halfNormalQuantiles(m);
    }

    /**
     * Bin edges for sorted finite data: Freedman–Diaconis width, 8 to 60 bins, edges on a round
     * multiple of the width. A single repeated value gets one bin around it.
     */
    static double[] histogramEdges(double[] sorted) {
        return DistributionCharts.histogramEdges(sorted);
    }

    /** The smallest of 1, 2, 2.5, 5 times a power of ten that is at least x. */
    static double niceStep(double x) {
        return DistributionCharts.niceStep(x);
    }

    /** Linear-interpolation quantile of sorted data (Hyndman &amp; Fan, Am. Stat. 50, 361 (1996), type 7). */
    static double quantileSorted(double[] sorted, double p) {
        return DistributionCharts.quantileSorted(sorted, p);
    }
}
