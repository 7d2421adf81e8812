package org.fabspread.study;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The output ids a study may name in targets and plans, with the quantity of each. Loss outputs
 * are {@code loss_<cause>} (photocurrent lost to that cause, mA/cm^2); the device model defines the
 * causes.
 */
public final class OutputCatalog {
    private static final Map<String, Units.Quantity> OUTPUTS = new LinkedHashMap<>();

    static {
        OUTPUTS.put("jsc", Units.Quantity.CURRENT_DENSITY);
        OUTPUTS.put("jsc_optical", Units.Quantity.CURRENT_DENSITY);
        OUTPUTS.put("absorber_absorptance", Units.Quantity.FRACTION);
        OUTPUTS.put("jsc_planar", Units.Quantity.CURRENT_DENSITY);
        OUTPUTS.put("enhancement", Units.Quantity.DIMENSIONLESS);
        OUTPUTS.put("voc", Units.Quantity.VOLTAGE);
        OUTPUTS.put("ff", Units.Quantity.FRACTION);
        OUTPUTS.put("efficiency", Units.Quantity.FRACTION);
    }

    /**
     * The loss causes the device model reports as {@code loss_<cause>}, in its order; a test holds
     * this list equal to the model's outputs.
     */
    private static final List<String> LOSSES = List.of("metal", "electrodes", "transport", "substrate", "scattering",
            "quenching", "collection", "reflection", "transmission");

    private OutputCatalog() {
    }

    /** The fixed output ids (the {@code loss_*} family not included). */
    public static List<String> ids() {
        return List.copyOf(OUTPUTS.keySet());
    }

    /** The loss outputs, {@code loss_metal} ... {@code loss_transmission}. */
    public static List<String> lossIds() {
        return LOSSES.stream().map(c -> "loss_" + c).toList();
    }

    /** The quantity of an output, or null when the id is not an output. */
    public static Units.Quantity quantity(String id) {
        if (id.startsWith("loss_") && LOSSES.contains(id.substring(5))) {
            return Units.Quantity.CURRENT_DENSITY;
        }
        return OUTPUTS.get(id);
    }

    /** True when the output needs the diode block. */
    public static boolean needsDiode(String id) {
        return id.equals("voc") || id.equals("ff") || id.equals("efficiency");
    }

    /** True when the output needs the planar reference solve. */
    public static boolean needsPlanarReference(String id) {
        return id.equals("jsc_planar") || id.equals("enhancement");
    }
}
