package org.fabspread.study;

import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * A particle shape named by the study ({@code particles.shape}) for the discrete-dipole path: its kind and
 * its plain parameters in nm, each a {@link Parameter} with id {@code particles.shape.<name>} that may be
 * uncertain like any other input.
 *
 * @param kind       sphere, spheroid, rod, disk, triangular_prism or crescent
 * @param parameters the shape's parameters by name (nm), in the order the kind lists them
 * @param height     the nominal shape's extent along the film normal (nm): the particle layer's height
 * @param latticePitch   the discrete-dipole lattice pitch (nm; {@code lattice_pitch}, default 2 nm)
 * @param nodes          table nodes per uncertain shape parameter ({@code table_nodes}, default 5)
 * @param wavelengthStep spacing of the table's wavelength subgrid (nm; {@code table_wavelength_step}, default 25 nm)
 */
public record ParticleShape(String kind, Map<String, Parameter> parameters, double height, double latticePitch,
                            int nodes, double wavelengthStep) {

    /** The tabulation settings' keys beside the shape's parameters. */
    public static final List<String> SETTINGS = List.of("lattice_pitch", "table_nodes", "table_wavelength_step");

    /** Parameter names of each kind, in the order a study lists them (the same as {@code shapes.Shapes}). */
    public static final Map<String, List<String>> KINDS = Map.of(
            "sphere", List.of("diameter"),
            "spheroid", List.of("length", "width"),
            "rod", List.of("length", "diameter"),
            "disk", List.of("diameter", "thickness"),
            "triangular_prism", List.of("edge", "thickness"),
            "crescent", List.of("outer_diameter", "bite_diameter", "bite_offset", "thickness"));

    public ParticleShape {
        parameters = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(parameters));
    }

    /** The known kinds, sorted. */
    public static List<String> kinds() {
        return List.copyOf(new TreeMap<>(KINDS).keySet());
    }

    /** The parameter id of a shape parameter. */
    public static String id(String name) {
        return "particles.shape." + name;
    }

    /** The parameter name of the kind's extent along the film normal. */
    static String heightParameter(String kind) {
        return switch (kind) {
            case "sphere", "rod" -> "diameter";
            case "spheroid" -> "width";
            default -> "thickness";
        };
    }
}
