package org.fabspread.shapes;

import java.util.List;
import java.util.Map;

/** Builds an analytic shape from its kind and named parameters (nm), as a study names them. */
public final class Shapes {
    private Shapes() {
    }

    /** Parameter names of each analytic kind, in the order the records take them. */
    public static final Map<String, List<String>> PARAMETERS = Map.of(
            "sphere", List.of("diameter"),
            "spheroid", List.of("length", "width"),
            "rod", List.of("length", "diameter"),
            "disk", List.of("diameter", "thickness"),
            "triangular_prism", List.of("edge", "thickness"),
            "crescent", List.of("outer_diameter", "bite_diameter", "bite_offset", "thickness"));

    /**
     * @throws IllegalArgumentException for an unknown kind, a missing parameter or a value the shape refuses
     */
    public static Solid create(String kind, Map<String, Double> p) {
        List<String> names = PARAMETERS.get(kind);
        if (names == null) {
            throw new IllegalArgumentException("unknown shape '" + kind + "'; known: "
                    + String.join(", ", new java.util.TreeSet<>(PARAMETERS.keySet())) + ", voxel_file");
        }
        double[] v = new double[names.size()];
        for (int i = 0; i < v.length; i++) {
            Double x = p.get(names.get(i));
            if (x == null) {
                throw new IllegalArgumentException(kind + ": missing " + names.get(i));
            }
            v[i] = x;
        }
        return switch (kind) {
            case "sphere" -> new Sphere(v[0]);
            case "spheroid" -> new Spheroid(v[0], v[1]);
            case "rod" -> new Rod(v[0], v[1]);
            case "disk" -> new Disk(v[0], v[1]);
            case "triangular_prism" -> new TriangularPrism(v[0], v[1]);
            default -> new Crescent(v[0], v[1], v[2], v[3]);
        };
    }
}
