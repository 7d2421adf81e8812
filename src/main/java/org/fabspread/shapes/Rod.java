package org.fabspread.shapes;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A rod along x in the film plane: a cylinder of diameter {@code diameter} closed by hemispherical caps,
 * {@code length} from tip to tip (≥ diameter).
 */
public record Rod(double length, double diameter) implements Solid {

    public Rod {
        Checks.positive("rod", "length", length);
        Checks.positive("rod", "diameter", diameter);
        if (length < diameter) {
            throw new IllegalArgumentException("rod: length must be >= diameter, got " + length + " < " + diameter);
        }
    }

    @Override
    public String kind() {
        return "rod";
    }

    @Override
    public Map<String, Double> parameters() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("length", length);
        m.put("diameter", diameter);
        return m;
    }

    @Override
    public double volume() {
        double r = diameter / 2;
        return Math.PI * r * r * (length - diameter) + 4.0 / 3 * Math.PI * r * r * r;
    }

    @Override
    public boolean contains(double x, double y, double z) {
        double r = diameter / 2;
        double cap = length / 2 - r;
        double ax = Math.max(0, Math.abs(x) - cap);
        return ax * ax + y * y + z * z <= r * r;
    }

    @Override
    public double[] halfExtent() {
        return new double[] {length / 2, diameter / 2, diameter / 2};
    }
}
