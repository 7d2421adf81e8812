package org.fabspread.shapes;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A flat equilateral triangular prism in the film plane: triangle edge {@code edge}, {@code thickness} along
 * z, centroid at the origin, one vertex pointing along +x (mirror plane y = 0).
 */
public record TriangularPrism(double edge, double thickness) implements Solid {

    public TriangularPrism {
        Checks.positive("triangular prism", "edge", edge);
        Checks.positive("triangular prism", "thickness", thickness);
    }

    @Override
    public String kind() {
        return "triangular_prism";
    }

    @Override
    public Map<String, Double> parameters() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("edge", edge);
        m.put("thickness", thickness);
        return m;
    }

    @Override
    public double volume() {
        return Math.sqrt(3) / 4 * edge * edge * thickness;
    }

    @Override
    public boolean contains(double x, double y, double z) {
        double h = edge * Math.sqrt(3) / 2;
        return Math.abs(z) <= thickness / 2 && x >= -h / 3 && Math.abs(y) <= (2 * h / 3 - x) / Math.sqrt(3);
    }

    @Override
    public double[] halfExtent() {
        // box centred on the centroid: x from −h/3 to 2h/3
        double h = edge * Math.sqrt(3) / 2;
        return new double[] {2 * h / 3, edge / 2, thickness / 2};
    }
}
