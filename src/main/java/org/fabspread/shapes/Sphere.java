package org.fabspread.shapes;

import java.util.Map;

/** A sphere of diameter {@code diameter} (nm) centred on the origin. */
public record Sphere(double diameter) implements Solid {

    public Sphere {
        Checks.positive("sphere", "diameter", diameter);
    }

    @Override
    public String kind() {
        return "sphere";
    }

    @Override
    public Map<String, Double> parameters() {
        return Map.of("diameter", diameter);
    }

    @Override
    public double volume() {
        return Math.PI / 6 * diameter * diameter * diameter;
    }

    @Override
    public boolean contains(double x, double y, double z) {
        double r = diameter / 2;
        return x * x + y * y + z * z <= r * r;
    }

    @Override
    public double[] halfExtent() {
        return new double[] {diameter / 2, diameter / 2, diameter / 2};
    }
}
