package org.fabspread.dda;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import org.fabspread.shapes.Shape;
import org.fabspread.shapes.Shapes;

/** An analytic shape kind ({@link Shapes}) with some parameters fixed and the others varying. */
public record ParametricFamily(String kind, Map<String, Double> fixed, List<String> varying) implements ShapeFamily {

    public ParametricFamily {
        fixed = new TreeMap<>(fixed);
        varying = List.copyOf(varying);
        List<String> names = Shapes.PARAMETERS.get(kind);
        if (names == null) {
            throw new IllegalArgumentException("unknown shape '" + kind + "'");
        }
        for (String n : names) {
            if (fixed.containsKey(n) == varying.contains(n)) {
                throw new IllegalArgumentException(kind + ": parameter " + n + " must be either fixed or varying");
            }
        }
    }

    @Override
    public Shape shape(double[] values) {
        Map<String, Double> p = new LinkedHashMap<>(fixed);
        for (int i = 0; i < varying.size(); i++) {
            p.put(varying.get(i), values[i]);
        }
        return Shapes.create(kind, p);
    }

    @Override
    public String describe() {
        StringBuilder b = new StringBuilder(kind);
        fixed.forEach((k, v) -> b.append(';').append(k).append('=').append(Double.doubleToLongBits(v)));
        return b.toString();
    }
}
