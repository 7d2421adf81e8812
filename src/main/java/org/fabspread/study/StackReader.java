package org.fabspread.study;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Sequence;

/**
 * The {@code stack} section: the layers in the order light meets them, each with its material,
 * thickness, role, coherence and optical-constant adjustments.
 */
final class StackReader extends SectionReader {

    StackReader(ReadContext ctx) {
        super(ctx);
    }

    private static final Pattern LAYER_NAME = Pattern.compile("[a-z][a-z0-9_-]*");

    List<Layer> stack(YamlNode n, String path) {
        Sequence s = list(n, path);
        if (s.items().isEmpty()) {
            throw err(s, path, "the stack has no layers");
        }
        if (s.items().size() > Limits.MAX_LAYERS) {
            throw err(s.items().get(Limits.MAX_LAYERS), path + "[" + Limits.MAX_LAYERS + "]", "at most "
                    + Limits.MAX_LAYERS + " layers, got " + s.items().size());
        }
        List<Layer> layers = new ArrayList<>();
        Map<String, Integer> names = new LinkedHashMap<>();
        for (int i = 0; i < s.items().size(); i++) {
            String p = path + "[" + i + "]";
            Mapping m = mapping(s.items().get(i), p, keys("name", "material", "thickness", "role", "incoherent",
                    "n_shift", "k_scale"));
            YamlNode nn = req(m, p, "name");
            String name = text(nn, child(p, "name"));
            if (!LAYER_NAME.matcher(name).matches()) {
                throw err(nn, child(p, "name"), "layer name '" + name
                        + "' must start with a lower-case letter and use only a-z, 0-9, _ and -");
            }
            if (names.containsKey(name)) {
                throw err(nn, child(p, "name"), "duplicate layer name '" + name + "' (also stack[" + names.get(name) + "])");
            }
            names.put(name, i);
            String idBase = "stack." + name + ".";
            YamlNode matN = req(m, p, "material");
            MaterialRef mat = new MaterialReader(ctx).material(matN, child(p, "material"), "layer '" + name + "'");
            Parameter thickness = param(m, p, "thickness",
                    Rule.of(idBase + "thickness", Quantity.LENGTH).above(0, true));
            YamlNode rn = opt(m, "role");
            LayerRole role = rn == null ? LayerRole.OTHER : LayerRole.valueOf(word(rn, child(p, "role"),
                    List.of("substrate", "electrode", "electron-transport", "hole-transport", "absorber", "other"))
                    .toUpperCase(Locale.ROOT).replace('-', '_'));
            YamlNode inc = opt(m, "incoherent");
            boolean incoherent = inc != null && bool(inc, child(p, "incoherent"));
            if (incoherent && i > 0) {
                boolean earlier = layers.stream().anyMatch(Layer::incoherent);
                throw err(inc, child(p, "incoherent"), earlier
                        ? "only one layer may be incoherent (the first, usually the glass)"
                        : "only the first layer may be incoherent (light meets the thick substrate first)");
            }
            Parameter nShift = param(m, p, "n_shift", Rule.of(idBase + "n_shift", Quantity.DIMENSIONLESS), 0);
            Parameter kScale = param(m, p, "k_scale", Rule.of(idBase + "k_scale", Quantity.DIMENSIONLESS).above(0, false), 1);
            if (role == LayerRole.SUBSTRATE) {
                for (int j = 0; j < layers.size(); j++) {
                    if (layers.get(j).role() == LayerRole.SUBSTRATE) {
                        throw err(rn, child(p, "role"), "a second substrate ('" + name + "'; stack[" + j + "] '"
                                + layers.get(j).name() + "' is one already): a cell is built on one substrate");
                    }
                }
            }
            layers.add(new Layer(name, mat, thickness, incoherent, role, nShift, kScale));
        }
        if (layers.stream().noneMatch(Layer::isAbsorber)) {
            throw err(s, path, "no layer has role: absorber; mark the photoactive layer");
        }
        if (layers.size() == 1 && layers.get(0).incoherent()) {
            throw err(s, path, "the stack needs thin layers after the incoherent substrate");
        }
        return layers;
    }
}
