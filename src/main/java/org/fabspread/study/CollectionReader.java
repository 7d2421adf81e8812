package org.fabspread.study;

import java.util.List;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;

/**
 * The {@code collection} section: exciton dissociation, carrier mobility-lifetime products, built-in
 * voltage, quenching distance and which contact collects the electrons.
 */
final class CollectionReader extends SectionReader {

    CollectionReader(ReadContext ctx) {
        super(ctx);
    }

    ChargeCollection collection(YamlNode n, String path, List<Layer> stack) {
        Mapping m = mapping(n, path, keys("dissociation", "electron_mu_tau", "hole_mu_tau", "built_in_voltage",
                "quenching_distance", "electrons_collected_at"));
        Parameter diss = param(m, path, "dissociation",
                Rule.of("collection.dissociation", Quantity.FRACTION).above(0, true).below(1, false), 1);
        Parameter emt = param(m, path, "electron_mu_tau",
                Rule.of("collection.electron_mu_tau", Quantity.MU_TAU).above(0, true));
        Parameter hmt = param(m, path, "hole_mu_tau",
                Rule.of("collection.hole_mu_tau", Quantity.MU_TAU).above(0, true));
        Parameter vbi = param(m, path, "built_in_voltage",
                Rule.of("collection.built_in_voltage", Quantity.VOLTAGE).above(0, true));
        Parameter quench = param(m, path, "quenching_distance",
                Rule.of("collection.quenching_distance", Quantity.LENGTH).above(0, false), 0);
        YamlNode en = opt(m, "electrons_collected_at");
        boolean front;
        if (en != null) {
            front = word(en, child(path, "electrons_collected_at"), List.of("front", "back")).equals("front");
        } else {
            Boolean inferred = electronsAtFront(stack);
            if (inferred == null) {
                throw err(m, child(path, "electrons_collected_at"),
                        "cannot tell the cell's orientation from the stack roles; give electrons_collected_at: front or back");
            }
            front = inferred;
        }
        return new ChargeCollection(diss, emt, hmt, vbi, quench, front);
    }

    /**
     * Orientation from the roles: an electron-transport layer before the first absorber, or a
     * hole-transport layer after it, means the electrons leave at the front (inverted cell).
     */
    private static Boolean electronsAtFront(List<Layer> stack) {
        int absorber = -1;
        for (int i = 0; i < stack.size(); i++) {
            if (stack.get(i).isAbsorber()) {
                absorber = i;
                break;
            }
        }
        Boolean etlFront = null;
        for (int i = 0; i < stack.size(); i++) {
            LayerRole r = stack.get(i).role();
            if (r == LayerRole.ELECTRON_TRANSPORT) {
                etlFront = i < absorber;
                break;
            }
            if (r == LayerRole.HOLE_TRANSPORT) {
                etlFront = i > absorber;
                break;
            }
        }
        return etlFront;
    }
}
