package org.fabspread.report;

import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * A rendered chart: its file-safe name, its title, the PNG bytes and the SVG text, and a description
 * of what it plotted (number of series drawn including reference lines, number of data points, axis
 * titles and series labels) so that callers and tests can check it without looking at the pixels.
 *
 * @param name        file-safe name, {@code [A-Za-z0-9][A-Za-z0-9_-]*} (at most 64 characters); files are
 *                    written as {@code charts/<name>.png} and {@code .svg}
 * @param title       the title drawn above the plot
 * @param png         the bitmap (the accessor returns a copy)
 * @param svg         the vector drawing, a complete SVG document
 * @param width       the bitmap width in pixels
 * @param height      the bitmap height in pixels
 * @param seriesCount series drawn, including reference lines (targets, goals, thresholds)
 * @param pointCount  data points plotted (finite values after any subsampling; reference lines excluded)
 * @param xAxisTitle  the horizontal axis title, with its unit
 * @param yAxisTitle  the vertical axis title, with its unit
 * @param seriesNames the legend labels of all series drawn, in drawing order
 */
public record Chart(String name, String title, byte[] png, String svg, int width, int height,
                    int seriesCount, int pointCount, String xAxisTitle, String yAxisTitle,
                    List<String> seriesNames) {

    static final Pattern NAME = Pattern.compile("[A-Za-z0-9][A-Za-z0-9_-]{0,63}");

    public Chart {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(title, "title");
        Objects.requireNonNull(png, "png");
        Objects.requireNonNull(svg, "svg");
        Objects.requireNonNull(xAxisTitle, "xAxisTitle");
        Objects.requireNonNull(yAxisTitle, "yAxisTitle");
        requireFileSafe(name);
        png = png.clone();
        seriesNames = List.copyOf(seriesNames);
        if (seriesNames.size() != seriesCount) {
            throw new IllegalArgumentException("chart '" + name + "': " + seriesNames.size()
                    + " series names for " + seriesCount + " series");
        }
    }

    /** Throws IllegalArgumentException unless {@code name} can be used as a file name everywhere. */
    public static void requireFileSafe(String name) {
        if (name == null || !NAME.matcher(name).matches()) {
            throw new IllegalArgumentException("chart name '" + name
                    + "' is not file-safe: use letters, digits, '_' and '-', starting with a letter or digit, at most 64");
        }
    }

    @Override
    public byte[] png() {
        return png.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Chart c && name.equals(c.name) && title.equals(c.title) && Arrays.equals(png, c.png)
                && svg.equals(c.svg) && width == c.width && height == c.height && seriesCount == c.seriesCount
                && pointCount == c.pointCount && xAxisTitle.equals(c.xAxisTitle) && yAxisTitle.equals(c.yAxisTitle)
                && seriesNames.equals(c.seriesNames);
    }

    @Override
    public int hashCode() {
        return Objects.hash(name, title, Arrays.hashCode(png), svg, width, height, seriesCount, pointCount,
                xAxisTitle, yAxisTitle, seriesNames);
    }

    @Override
    public String toString() {
        return "Chart[" + name + ", '" + title + "', " + width + "x" + height + ", " + seriesCount + " series, "
                + pointCount + " points, x '" + xAxisTitle + "', y '" + yAxisTitle + "', png " + png.length
                + " bytes, svg " + svg.length() + " chars]";
    }
}
