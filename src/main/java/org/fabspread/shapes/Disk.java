package org.fabspread.shapes;

import java.util.LinkedHashMap;
import java.util.Map;

/** A flat disk in the film plane: diameter {@code diameter}, {@code thickness} along z. */
public record Disk(double diameter, double thickness) implements Solid {

    public Disk {
        Checks.positive("disk", "diameter", diameter);
        Checks.positive("disk", "thickness", thickness);
    }

    @Override
    public String kind() {
        return "disk";
    }

    @Override
    public Map<String, Double> parameters() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("diameter", diameter);
        m.put("thickness", thickness);
        return m;
    }

    @Override
    public double volume() {
        return Math.PI / 4 * diameter * diameter * thickness;
    }

    @Override
    public boolean contains(double x, double y, double z) {
        double r = diameter / 2;
        return x * x + y * y <= r * r && Math.abs(z) <= thickness / 2;
    }

    @Override
    public double[] halfExtent() {
        return new double[] {diameter / 2, diameter / 2, thickness / 2};
    }
}
