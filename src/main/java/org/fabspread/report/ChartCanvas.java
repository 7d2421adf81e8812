package org.fabspread.report;

import static org.fabspread.report.ChartChecks.*;
import static org.fabspread.report.ChartParts.*;
import static org.fabspread.report.ChartText.*;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import de.erichseifert.vectorgraphics2d.VectorGraphics2D;
import de.erichseifert.vectorgraphics2d.svg.SVGProcessor;
import de.erichseifert.vectorgraphics2d.util.PageSize;
import javax.imageio.IIOImage;
import javax.imageio.ImageIO;
import javax.imageio.ImageTypeSpecifier;
import javax.imageio.ImageWriteParam;
import javax.imageio.ImageWriter;
import javax.imageio.metadata.IIOMetadata;
import javax.imageio.metadata.IIOMetadataNode;
import javax.imageio.stream.ImageOutputStream;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.XYStyler;

/**
 * The shared drawing surface of every chart domain: a chart of one size in the house style
 * ({@link ChartStyle}), the category axis of bar charts, and the encoding of a finished chart as PNG
 * (with its resolution recorded) and SVG. A new chart domain takes a canvas and draws on it.
 */
final class ChartCanvas {

    private final int width;
    private final int height;

    ChartCanvas(int width, int height) {
        this.width = width;
        this.height = height;
    }

    int width() {
        return width;
    }

    int height() {
        return height;
    }

    PathChart newChart(String name, String title, Quantity x, Quantity y) {
        Chart.requireFileSafe(name);
        Objects.requireNonNull(title, "title");
        PathChart c = new PathChart(width, height);
        ChartStyle.apply(c.getStyler());
        c.setTitle(title);
        c.setXAxisTitle(x.axisTitle());
        c.setYAxisTitle(y.axisTitle());
        c.getStyler().setXAxisTickMarkSpacingHint(95);
        c.getStyler().setXAxisMaxLabelCount(12);
        c.setCustomXAxisTickLabelsFormatter(ChartText::tick);
        c.setCustomYAxisTickLabelsFormatter(ChartText::tick);
        return c;
    }

    double plotWidthEstimate() {
        return width - 200.0;
    }

    double plotHeightEstimate() {
        return height - 190.0;
    }

    /** Names the rows of a horizontal bar chart: row r (from the top) shows inputs[order[r]]. */
    void categoryAxisY(XYChart c, Integer[] order, String[] labels) {
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

    /** One value per input as horizontal bars sorted largest first, without a legend. */
    Chart sortedBars(String name, String title, Quantity valueAxis, Quantity categoryAxis, String[] inputs,
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

    Chart finish(XYChart c, String name, int points, List<String> names) {
        return new Chart(name, c.getTitle(), png(c), svg(c), width, height, names.size(), points,
                c.getXAxisTitle(), c.getYAxisTitle(), names);
    }

    byte[] png(XYChart c) {
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
            String perMetre = Long.toString(Math.round(ChartFactory.DPI / 0.0254));
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

    /**
     * The chart as SVG, drawn through {@link TextKeepingGraphics} so that its strings stay text (the
     * library's own encoder would write every glyph as an outline).
     */
    static String svg(XYChart c) {
        VectorGraphics2D vg = new VectorGraphics2D();
        Graphics2D g = c instanceof PathChart p ? new TextKeepingGraphics(vg, p.texts()) : vg;
        c.paint(g, c.getWidth(), c.getHeight());
        ByteArrayOutputStream out = new ByteArrayOutputStream(64 * 1024);
        try {
            new SVGProcessor().getDocument(vg.getCommands(), new PageSize(0.0, 0.0, c.getWidth(), c.getHeight()))
                    .writeTo(out);
        } catch (IOException e) {
            throw new UncheckedIOException("SVG encoding failed", e);
        }
        return out.toString(StandardCharsets.UTF_8);
    }
}
