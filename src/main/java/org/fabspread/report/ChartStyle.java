package org.fabspread.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import org.knowm.xchart.style.AxesChartStyler;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.Marker;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * The look of every chart: a palette whose colours differ in lightness so that series stay apart when
 * printed in greyscale, line styles and markers that separate series without colour, a white
 * background with a light grid, and one font family throughout.
 *
 * <p>Lightness is CIE L* (CIE 15:2004, Colorimetry, 3rd ed., §8.2.1) computed from sRGB (IEC 61966-2-1).
 */
final class ChartStyle {

    private ChartStyle() {
    }

    /** Line and marker colours, dark to light: near-black, dark slate, mid grey-blue, warm ochre, light grey. */
    static final Color[] PALETTE = {
        new Color(0x1c1c1c), new Color(0x2f4356), new Color(0x6a84a0), new Color(0xcc9a44), new Color(0xd2d2d2),
    };

    /** Order in which line series take palette colours: the light grey goes last, it is weak on white. */
    private static final int[] LINE_ORDER = {0, 2, 1, 3, 4};

    static final Color TEXT = new Color(0x1c1c1c);
    static final Color GRID = new Color(0xe4e4e4);
    static final Color FRAME = new Color(0x9a9a9a);
    static final Color BAR_EDGE = new Color(0x1c1c1c);

    static final String FONT_FAMILY = Font.SANS_SERIF;
    static final Font TITLE_FONT = new Font(FONT_FAMILY, Font.BOLD, 17);
    static final Font AXIS_TITLE_FONT = new Font(FONT_FAMILY, Font.PLAIN, 15);
    static final Font TICK_FONT = new Font(FONT_FAMILY, Font.PLAIN, 13);
    static final Font LEGEND_FONT = new Font(FONT_FAMILY, Font.PLAIN, 13);
    static final Font ANNOTATION_FONT = new Font(FONT_FAMILY, Font.PLAIN, 12);

    static final float LINE_WIDTH = 2.2f;

    /** Solid, dashed, dotted, dash-dot, long dash. */
    static final BasicStroke[] STROKES = {
        new BasicStroke(LINE_WIDTH, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND),
        new BasicStroke(LINE_WIDTH, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, new float[] {9f, 5f}, 0f),
        new BasicStroke(LINE_WIDTH, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND, 10f, new float[] {0.5f, 5f}, 0f),
        new BasicStroke(LINE_WIDTH, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, new float[] {11f, 4f, 2f, 4f}, 0f),
        new BasicStroke(LINE_WIDTH, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, new float[] {16f, 6f}, 0f),
    };

    static final Marker[] MARKERS = {
        SeriesMarkers.CIRCLE, SeriesMarkers.SQUARE, SeriesMarkers.TRIANGLE_UP, SeriesMarkers.DIAMOND,
        SeriesMarkers.CROSS, SeriesMarkers.TRIANGLE_DOWN,
    };

    static Color lineColor(int i) {
        return PALETTE[LINE_ORDER[i % LINE_ORDER.length]];
    }

    /** Line style of series i: colour, dash and marker cycle with different periods, so pairs differ. */
    static BasicStroke stroke(int i) {
        return STROKES[i % STROKES.length];
    }

    static Marker marker(int i) {
        return MARKERS[i % MARKERS.length];
    }

    static BasicStroke solid(float width) {
        return new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND);
    }

    static BasicStroke dashed(float width) {
        return new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, new float[] {9f, 5f}, 0f);
    }

    static BasicStroke dotted(float width) {
        return new BasicStroke(width, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND, 10f, new float[] {0.5f, 5f}, 0f);
    }

    /**
     * {@code n} fill colours for stacked bands, evenly spaced in L* from dark (L* 22) to light (L* 90),
     * alternating between a cool and a warm hue so that neighbours differ in hue as well as lightness.
     */
    static Color[] fillRamp(int n) {
        Color[] out = new Color[n];
        for (int k = 0; k < n; k++) {
            double l = n == 1 ? 55 : 22 + 68.0 * k / (n - 1);
            boolean warm = (k % 2) == 1;
            out[k] = fromLab(l, warm ? 5 : -3, warm ? 30 : -16);
        }
        return out;
    }

    /** CIE L* of an sRGB colour (D65). */
    static double lightness(Color c) {
        double y = 0.2126 * linear(c.getRed()) + 0.7152 * linear(c.getGreen()) + 0.0722 * linear(c.getBlue());
        return y > 216.0 / 24389 ? 116 * Math.cbrt(y) - 16 : y * 24389.0 / 27;
    }

    private static double linear(int channel) {
        double v = channel / 255.0;
        return v <= 0.04045 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4);
    }

    /** sRGB colour of a CIELAB point (D65 white), clipped to the gamut channel by channel. */
    static Color fromLab(double l, double a, double b) {
        double fy = (l + 16) / 116;
        double fx = fy + a / 500;
        double fz = fy - b / 200;
        double x = 0.95047 * finv(fx);
        double y = finv(fy);
        double z = 1.08883 * finv(fz);
        double r = 3.2404542 * x - 1.5371385 * y - 0.4985314 * z;
        double g = -0.9692660 * x + 1.8760108 * y + 0.0415560 * z;
        double bl = 0.0556434 * x - 0.2040259 * y + 1.0572252 * z;
        return new Color(gamma(r), gamma(g), gamma(bl));
    }

    private static double finv(double t) {
        return t > 6.0 / 29 ? t * t * t : 3 * (6.0 / 29) * (6.0 / 29) * (t - 4.0 / 29);
    }

    private static int gamma(double v) {
        double c = v <= 0.0031308 ? 12.92 * v : 1.055 * Math.pow(v, 1 / 2.4) - 0.055;
        return (int) Math.round(Math.max(0, Math.min(1, c)) * 255);
    }

    /** Applies the common layout to an axes chart. */
    static void apply(AxesChartStyler s) {
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotBackgroundColor(Color.WHITE);
        s.setPlotBorderColor(FRAME);
        s.setPlotBorderVisible(true);
        s.setPlotGridLinesVisible(true);
        s.setPlotGridLinesColor(GRID);
        s.setPlotGridLinesStroke(solid(1f));
        s.setChartFontColor(TEXT);
        s.setChartTitleFont(TITLE_FONT);
        s.setChartTitleBoxVisible(false);
        s.setChartTitlePadding(10);
        s.setChartPadding(14);
        s.setAxisTitleFont(AXIS_TITLE_FONT);
        s.setAxisTickLabelsFont(TICK_FONT);
        s.setAxisTickLabelsColor(TEXT);
        s.setAxisTickMarksColor(FRAME);
        s.setAxisTitlePadding(8);
        s.setAxisTickPadding(5);
        s.setLegendFont(LEGEND_FONT);
        s.setLegendBackgroundColor(Color.WHITE);
        s.setLegendBorderColor(FRAME);
        s.setLegendPadding(8);
        s.setLegendSeriesLineLength(24);
        s.setLegendPosition(Styler.LegendPosition.OutsideS);
        s.setLegendLayout(Styler.LegendLayout.Horizontal);
        s.setMarkerSize(8);
        s.setSeriesColors(PALETTE);
        s.setSeriesLines(STROKES);
        s.setSeriesMarkers(MARKERS);
        s.setAnnotationTextFont(ANNOTATION_FONT);
        s.setAnnotationTextFontColor(TEXT);
        s.setAnnotationLineColor(TEXT);
        s.setToolTipsEnabled(false);
        s.setAntiAlias(true);
        s.setPlotContentSize(0.94);
    }
}
