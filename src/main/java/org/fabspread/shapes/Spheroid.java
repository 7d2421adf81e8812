package org.fabspread.shapes;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A spheroid whose axis of revolution lies along x in the film plane: diameter {@code length} along x and
 * {@code width} across (prolate when length &gt; width, oblate when length &lt; width).
 */
public record Spheroid(double length, double width) implements Solid {

    public Spheroid {
        Checks.positive("spheroid", "length", length);
        Checks.positive("spheroid", "width", width);
    }

    @Override
    public String kind() {
        return "spheroid";
    }

    @Override
    public Map<String, Double> parameters() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("length", length);
        m.put("width", width);
        return m;
    }

    @Override
    public double volume() {
        return Math.PI / 6 * length * width * width;
    }

    @Override
    public boolean contains(double x, double y, double z) {
        double a = length / 2;
        double b = width / 2;
        return x * x / (a * a) + (y * y + z * z) / (b * b) <= 1;
    }

    @Override
    public double[] halfExtent() {
        return new double[] {length / 2, width / 2, width / 2};
    }
}
