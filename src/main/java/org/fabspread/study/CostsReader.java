package org.fabspread.study;

import java.util.LinkedHashMap;
import java.util.Map;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Scalar;

/** The {@code costs} section: the relative cost of tightening each uncertain input. */
final class CostsReader extends SectionReader {

    CostsReader(ReadContext ctx) {
        super(ctx);
    }

    Map<String, Double> costs(YamlNode n, String path, Map<String, Parameter> params) {
        if (!(n instanceof Mapping m)) {
            throw err(n, path, "expected a section of input: cost pairs, got " + n.kindName());
        }
        Map<String, Double> out = new LinkedHashMap<>();
        for (YamlNode.Entry e : m.entries().values()) {
            String id = e.key().name();
            String p = child(path, id);
            input(new YamlNode.Scalar(id, Scalar.Type.STRING, e.key().line(), e.key().column()), p, id, params);
            double c = number(e.value(), p, Rule.of(id, Quantity.DIMENSIONLESS).above(0, true));
            out.put(id, c);
        }
        return out;
    }
}
