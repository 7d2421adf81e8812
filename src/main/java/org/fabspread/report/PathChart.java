package org.fabspread.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Path2D;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.XYChart;

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

    PathChart(int width, int height) {
        super(width, height);
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
