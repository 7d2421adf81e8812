package org.fabspread.study;

import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;

/**
 * The {@code particles.shape} section: {@code kind} (sphere, spheroid, rod, disk, triangular_prism,
 * crescent) and the kind's parameters as lengths, each fixed or uncertain (ids
 * {@code particles.shape.<name>}). With a shape, the ellipsoid keys (diameter, semi_axes, aspect ratios) are
 * refused: the shape replaces them.
 */
final class ShapeReader extends SectionReader {

    ShapeReader(ReadContext ctx) {
        super(ctx);
    }

    ParticleShape shape(YamlNode n, String path, Mapping particles, String particlesPath) {
        for (String k : List.of("diameter", "semi_axes", "in_plane_aspect", "out_of_plane_aspect")) {
            if (opt(particles, k) != null) {
                YamlNode.Key key = particles.entries().get(k).key();
                throw StudyException.at(new SourceLocation(file, key.line(), key.column(), child(particlesPath, k)),
                        "give either shape or " + k + ", not both (the shape's own parameters set its size)");
            }
        }
        if (!(n instanceof Mapping pre)) {
            throw err(n, path, "expected a section with kind and the shape's parameters, e.g. kind: crescent, got "
                    + n.kindName());
        }
        YamlNode kn = req(pre, path, "kind");
        String kind = word(kn, child(path, "kind"), ParticleShape.kinds());
        List<String> names = ParticleShape.KINDS.get(kind);
        Set<String> allowed = new LinkedHashSet<>();
        allowed.add("kind");
        allowed.addAll(names);
        allowed.addAll(ParticleShape.SETTINGS);
        Mapping m = mapping(n, path, allowed);
        Map<String, Parameter> params = new LinkedHashMap<>();
        for (String name : names) {
            Rule rule = Rule.of(ParticleShape.id(name), Quantity.LENGTH);
            rule = name.equals("bite_offset") ? rule.above(0, false) : rule.above(0, true);
            params.put(name, param(m, path, name, rule));
        }
        if (kind.equals("crescent")) {
            double outer = params.get("outer_diameter").nominal();
            double bite = params.get("bite_diameter").nominal();
            double off = params.get("bite_offset").nominal();
            if (off + outer / 2 <= bite / 2) {
                throw err(m.get("bite_offset"), child(path, "bite_offset"), "the bite (diameter "
                        + Units.format(bite) + " nm at " + Units.format(off) + " nm from the centre) removes the whole disk"
                        + " (outer diameter " + Units.format(outer) + " nm): need offset + outer/2 > bite/2");
            }
        }
        double height = params.get(ParticleShape.heightParameter(kind)).nominal();
        YamlNode pn = opt(m, "lattice_pitch");
        double pitch = pn == null ? 2.0 : number(pn, child(path, "lattice_pitch"),
                Rule.of("lattice_pitch", Quantity.LENGTH).above(0, true));
        YamlNode nn = opt(m, "table_nodes");
        double nodes = nn == null ? 5 : number(nn, child(path, "table_nodes"),
                Rule.of("table_nodes", Quantity.DIMENSIONLESS).above(2, false).below(12, false));
        if (nodes != Math.rint(nodes)) {
            throw err(nn, child(path, "table_nodes"), "table_nodes must be a whole number, got " + Units.format(nodes));
        }
        YamlNode wn = opt(m, "table_wavelength_step");
        double step = wn == null ? 25.0 : number(wn, child(path, "table_wavelength_step"),
                Rule.of("table_wavelength_step", Quantity.LENGTH).above(0, true));
        return new ParticleShape(kind, params, height, pitch, (int) nodes, step);
    }
}
