package org.fabspread.study;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;

/** The optional {@code diode} section: the one-diode model's parameters. */
final class DiodeReader extends SectionReader {

    DiodeReader(ReadContext ctx) {
        super(ctx);
    }

    Diode diode(YamlNode n, String path) {
        Mapping m = mapping(n, path, keys("saturation_current", "ideality", "series_resistance", "shunt_resistance",
                "temperature"));
        Parameter j0 = param(m, path, "saturation_current",
                Rule.of("diode.saturation_current", Quantity.CURRENT_DENSITY).above(0, true));
        Parameter nid = param(m, path, "ideality",
                Rule.of("diode.ideality", Quantity.DIMENSIONLESS).above(0, true));
        Parameter rs = param(m, path, "series_resistance",
                Rule.of("diode.series_resistance", Quantity.AREA_RESISTANCE).above(0, false), 0);
        Parameter rsh = param(m, path, "shunt_resistance",
                Rule.of("diode.shunt_resistance", Quantity.AREA_RESISTANCE).above(0, true).infinite(),
                Double.POSITIVE_INFINITY);
        Parameter temp = param(m, path, "temperature",
                Rule.of("diode.temperature", Quantity.TEMPERATURE).above(0, true), 300);
        return new Diode(j0, nid, rs, rsh, temp);
    }
}
