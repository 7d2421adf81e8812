package org.fabspread.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Path2D;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.function.Function;
import org.knowm.xchart.AnnotationText;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.style.XYStyler;

/**
 * An XY chart that can draw a curve as one continuous path. The library draws a line series segment
 * by segment, so a dash pattern restarts at every data point and a densely sampled dashed or dotted
 * curve looks solid; drawn as one path, the pattern runs along the whole curve and stays legible in
 * greyscale. The curves are painted over the library's drawing, in the library's own coordinates.
 */
final class PathChart extends XYChart {

    private record Curve(double[] x, double[] y, Color color, BasicStroke stroke) {
    }

    private final List<Curve> curves = new ArrayList<>();
    /** Every string the chart's tick formatters and labels returned, for the SVG's real text. */
    private final Set<String> strings = new LinkedHashSet<>();

    PathChart(int width, int height) {
        super(width, height);
    }

    @Override
    public void setCustomXAxisTickLabelsFormatter(Function<Double, String> f) {
        super.setCustomXAxisTickLabelsFormatter(recording(f));
    }

    @Override
    public void setCustomYAxisTickLabelsFormatter(Function<Double, String> f) {
        super.setCustomYAxisTickLabelsFormatter(recording(f));
    }

    private Function<Double, String> recording(Function<Double, String> f) {
        return v -> {
            String s = f.apply(v);
            if (s != null) {
                strings.add(s);
            }
            return s;
        };
    }

    /** A text label at a point of the plot, in the chart's coordinates. */
    void addLabel(String text, double x, double y) {
        strings.add(text);
        addAnnotation(new AnnotationText(text, x, y, false));
    }

    /**
     * The strings the chart can draw (title, axis titles, series names, tick labels, labels) in each of
     * its fonts: the texts {@link TextKeepingGraphics} keeps as text in the SVG.
     */
    List<TextKeepingGraphics.Text> texts() {
        Set<String> all = new LinkedHashSet<>();
        all.add(getTitle());
        all.add(getXAxisTitle());
        all.add(getYAxisTitle());
        all.addAll(getSeriesMap().keySet());
        all.addAll(strings);
        XYStyler st = getStyler();
        List<Font> fonts = List.of(st.getChartTitleFont(), st.getAxisTitleFont(), st.getAxisTickLabelsFont(),
                st.getLegendFont(), st.getAnnotationTextFont());
        List<TextKeepingGraphics.Text> out = new ArrayList<>();
        for (String s : all) {
            // hidden series carry a leading word joiner and never show; their names would shadow the legend's
            if (s == null || s.isEmpty() || s.charAt(0) == '\u2060') {
                continue;
            }
            for (Font f : new LinkedHashSet<>(fonts)) {
                out.add(new TextKeepingGraphics.Text(s, f));
            }
        }
        return out;
    }

    void addCurve(double[] x, double[] y, Color color, BasicStroke stroke) {
        curves.add(new Curve(x, y, color, stroke));
    }

    @Override
    public void paint(Graphics2D g, int width, int height) {
        super.paint(g, width, height);
        Object aa = g.getRenderingHint(RenderingHints.KEY_ANTIALIASING);
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        for (Curve c : curves) {
            Path2D.Double path = new Path2D.Double();
            boolean open = false;
            for (int i = 0; i < c.x.length; i++) {
                if (!Double.isFinite(c.x[i]) || !Double.isFinite(c.y[i])) {
                    open = false;
                    continue;
                }
                double sx = getScreenXFromChart(c.x[i]);
                double sy = getScreenYFromChart(c.y[i]);
                if (open) {
                    path.lineTo(sx, sy);
                } else {
                    path.moveTo(sx, sy);
                    open = true;
                }
            }
            g.setColor(c.color);
            g.setStroke(c.stroke);
            g.draw(path);
        }
        if (aa != null) {
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, aa);
        }
    }
}
