package org.fabspread.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Scalar;
import org.fabspread.study.YamlNode.Sequence;

/**
 * The optional {@code particles} section: metal, host layer and placement, shape (diameter and
 * aspect ratios or semi-axes), size spread, coverage, scattering split, orientation, mixing rule,
 * free-electron parameters and an optional enhancement table.
 */
final class ParticlesReader extends SectionReader {

    ParticlesReader(ReadContext ctx) {
        super(ctx);
    }

    /** Where the particles sit in their host and the offset parameter (fixed 0 at a face). */
    private record Placed(ParticleLayer.Placement placement, Parameter offset) {
    }

    /** The median particle's shape as volume-equivalent diameter and the two aspect ratios. */
    private record Shape(Parameter diameter, Parameter inPlane, Parameter outOfPlane) {
    }

    ParticleLayer particles(YamlNode n, String path, List<Layer> stack) {
        Mapping m = mapping(n, path, keys("metal", "host", "placement", "diameter", "semi_axes", "size_spread",
                "in_plane_aspect", "out_of_plane_aspect", "coverage", "forward_fraction", "orientation", "mixing",
                "metal_parameters", "enhancement_table", "shape"));
        YamlNode metalN = req(m, path, "metal");
        MaterialRef metal = new MaterialReader(ctx).material(metalN, child(path, "metal"), "particles");
        YamlNode hn = req(m, path, "host");
        Layer hostLayer = hostLayer(hn, path, stack);
        String host = hostLayer.name();
        Placed placed = placement(m, path);
        ParticleLayer.Placement placement = placed.placement();
        Parameter offset = placed.offset();
        YamlNode axes = opt(m, "semi_axes");
        YamlNode shapeN = opt(m, "shape");
        ParticleShape dda = shapeN == null ? null : new ShapeReader(ctx).shape(shapeN, child(path, "shape"), m, path);
        Shape shape = dda == null ? shape(m, path, axes) : new Shape(Parameter.fixed("particles.diameter", "nm",
                volumeDiameter(dda)), Parameter.fixed("particles.in_plane_aspect", "1", 1),
                Parameter.fixed("particles.out_of_plane_aspect", "1", 1));
        Parameter diameter = shape.diameter();
        Parameter inPlane = shape.inPlane();
        Parameter outOfPlane = shape.outOfPlane();
        Parameter sizeCv = param(m, path, "size_spread",
                Rule.of("particles.size_cv", Quantity.FRACTION).above(0, false).below(1, true), 0);
        Parameter coverage = param(m, path, "coverage",
                Rule.of("particles.coverage", Quantity.FRACTION).above(0, false).below(1, true));
        // left out: the device model takes the forward share of the scattered light from the Mie series
        Parameter forward = opt(m, "forward_fraction") == null ? null : param(m, path, "forward_fraction",
                Rule.of("particles.forward_fraction", Quantity.FRACTION).above(0, false).below(1, false), 0.5);
        YamlNode on = opt(m, "orientation");
        boolean aligned = on == null || word(on, child(path, "orientation"), List.of("aligned", "random")).equals("aligned");
        YamlNode mx = opt(m, "mixing");
        ParticleLayer.MixingRule mixing = mx == null || word(mx, child(path, "mixing"),
                List.of("maxwell-garnett", "bruggeman")).equals("maxwell-garnett")
                ? ParticleLayer.MixingRule.MAXWELL_GARNETT : ParticleLayer.MixingRule.BRUGGEMAN;
        MetalParameters mp = metalParameters(m, path, metal, metalN);
        YamlNode et = opt(m, "enhancement_table");
        Path table = et == null ? null : existing(et, child(path, "enhancement_table"));

        // the particle layer's thickness is the median particle's height 2c = D p^(1/3) q^(2/3) (see ParticleLayer)
        double height = dda != null ? dda.height()
                : diameter.nominal() * Math.cbrt(inPlane.nominal()) * Math.pow(outOfPlane.nominal(), 2.0 / 3);
        double hostT = hostLayer.thickness().nominal();
        double needed = height + (placement == ParticleLayer.Placement.OFFSET ? offset.nominal() : 0);
        if (needed > hostT) {
            YamlNode at = dda != null ? shapeN : axes != null ? axes : m.get("diameter");
            String ap = dda != null ? child(path, "shape") : axes != null ? child(path, "semi_axes") : child(path, "diameter");
            throw err(at, ap, "the particle layer (" + Units.format(height) + " nm high"
                    + (placement == ParticleLayer.Placement.OFFSET ? ", starting " + Units.format(offset.nominal()) + " nm in" : "")
                    + ") does not fit in its host layer '" + host + "' (" + Units.format(hostT) + " nm)");
        }
        return new ParticleLayer(metal, host, placement, offset, diameter, sizeCv, inPlane, outOfPlane, coverage,
                forward, aligned, mixing, mp, table, dda);
    }

    /**
     * A nominal volume-equivalent diameter for a named shape (the ensemble's size variable is not used on
     * the discrete-dipole path; this only fills {@code particles.diameter}): the largest in-plane extent.
     */
    private static double volumeDiameter(ParticleShape s) {
        double d = 0;
        for (Parameter p : s.parameters().values()) {
            d = Math.max(d, p.nominal());
        }
        return d;
    }

    /** The host layer named under {@code host}: it must exist and be coherent. */
    private Layer hostLayer(YamlNode hn, String path, List<Layer> stack) {
        String host = text(hn, child(path, "host"));
        Layer hostLayer = null;
        List<String> names = new ArrayList<>();
        for (Layer l : stack) {
            names.add(l.name());
            if (l.name().equals(host)) {
                hostLayer = l;
            }
        }
        if (hostLayer == null) {
            throw err(hn, child(path, "host"), "no layer named '" + host + "' in the stack"
                    + Suggestions.didYouMean(host, names) + " (layers: " + String.join(", ", names) + ")");
        }
        if (hostLayer.incoherent()) {
            throw err(hn, child(path, "host"), "particles cannot sit in the incoherent layer '" + host
                    + "'; put them in a thin (coherent) layer");
        }
        return hostLayer;
    }

    private Placed placement(Mapping m, String path) {
        YamlNode pl = req(m, path, "placement");
        String plp = child(path, "placement");
        ParticleLayer.Placement placement;
        Parameter offset;
        String pt = pl instanceof Scalar ps ? ps.text().strip() : null;
        if ("front".equals(pt) || "back".equals(pt)) {
            placement = "front".equals(pt) ? ParticleLayer.Placement.FRONT : ParticleLayer.Placement.BACK;
            offset = Parameter.fixed("particles.offset", "nm", 0);
        } else {
            if (pt != null && Units.split(pt) == null && !DistributionReader.PLUS_MINUS.matcher(pt).find()) {
                throw err(pl, plp, "placement must be front, back or a distance from the host's front face such as '5 nm', got '"
                        + pt + "'" + Suggestions.didYouMean(pt, List.of("front", "back")));
            }
            placement = ParticleLayer.Placement.OFFSET;
            offset = param(pl, plp, Rule.of("particles.offset", Quantity.LENGTH).above(0, false));
        }
        return new Placed(placement, offset);
    }

    private Shape shape(Mapping m, String path, YamlNode axes) {
        Parameter diameter;
        Parameter inPlane;
        Parameter outOfPlane;
        if (axes != null) {
            for (String k : List.of("diameter", "in_plane_aspect", "out_of_plane_aspect")) {
                if (opt(m, k) != null) {
                    YamlNode.Key key = m.entries().get(k).key();
                    throw StudyException.at(new SourceLocation(file, key.line(), key.column(), child(path, k)),
                            "give either semi_axes or diameter and aspect ratios, not both");
                }
            }
            String ap = child(path, "semi_axes");
            Sequence s = list(axes, ap);
            if (s.items().size() != 3) {
                throw err(s, ap, "give three semi-axes [a, b, c] (a, b in the film plane, c normal to it), got "
                        + s.items().size());
            }
            double[] v = new double[3];
            for (int i = 0; i < 3; i++) {
                v[i] = number(s.items().get(i), ap + "[" + i + "]", Rule.of("semi-axis", Quantity.LENGTH).above(0, true));
            }
            if (v[0] < v[1]) {
                throw err(s, ap, "list the in-plane semi-axes longest first: a (" + Units.format(v[0])
                        + " nm) must be >= b (" + Units.format(v[1]) + " nm)");
            }
            // volume-equivalent diameter D = 2 (abc)^(1/3); p = a/b; q = c/a (see ParticleLayer)
            SourceLocation where = loc(s, ap);
            diameter = new Parameter("particles.diameter", "nm",
                    new DistributionSpec.Fixed(2 * Math.cbrt(v[0] * v[1] * v[2])), where);
            inPlane = new Parameter("particles.in_plane_aspect", "1", new DistributionSpec.Fixed(v[0] / v[1]), where);
            outOfPlane = new Parameter("particles.out_of_plane_aspect", "1", new DistributionSpec.Fixed(v[2] / v[0]), where);
        } else {
            diameter = param(m, path, "diameter",
                    Rule.of("particles.diameter", Quantity.LENGTH).above(0, true));
            inPlane = param(m, path, "in_plane_aspect",
                    Rule.of("particles.in_plane_aspect", Quantity.DIMENSIONLESS).above(1, false), 1);
            outOfPlane = param(m, path, "out_of_plane_aspect",
                    Rule.of("particles.out_of_plane_aspect", Quantity.DIMENSIONLESS).above(0, true), 1);
        }
        return new Shape(diameter, inPlane, outOfPlane);
    }

    /**
     * Free-electron parameters; defaults for silver and gold: plasma energy 9.01 / 9.03 eV, bulk
     * damping 0.018 / 0.027 eV (Ordal et al., Appl. Opt. 24, 4493 (1985)), Fermi velocity
     * 1.39e6 / 1.40e6 m/s (Kittel, Introduction to Solid State Physics), A_s = 1.
     */
    private MetalParameters metalParameters(Mapping particles, String path, MaterialRef metal, YamlNode metalN) {
        String p = child(path, "metal_parameters");
        YamlNode n = opt(particles, "metal_parameters");
        Mapping m = n == null ? null : mapping(n, p, keys("plasma_energy", "bulk_damping", "fermi_velocity",
                "surface_scattering"));
        double[] d = null;
        String id = metal.id().toLowerCase(Locale.ROOT);
        if (metal.isBundled() && id.startsWith("ag-")) {
            d = new double[] {9.01, 0.018, 1.39e6};
        } else if (metal.isBundled() && id.startsWith("au-")) {
            d = new double[] {9.03, 0.027, 1.40e6};
        }
        String[] keys = {"plasma_energy", "bulk_damping", "fermi_velocity"};
        Quantity[] qs = {Quantity.ENERGY, Quantity.ENERGY, Quantity.SPEED};
        Parameter[] out = new Parameter[3];
        for (int i = 0; i < 3; i++) {
            Rule r = Rule.of("particles." + keys[i], qs[i]).above(0, true);
            YamlNode v = m == null ? null : opt(m, keys[i]);
            if (v != null) {
                out[i] = param(v, child(p, keys[i]), r);
            } else if (d != null) {
                out[i] = Parameter.fixed(r.id(), qs[i].canonical(), d[i]);
            } else {
                throw err(m == null ? metalN : m, m == null ? child(path, "metal") : child(p, keys[i]),
                        "no default free-electron parameters for metal '" + metal.id()
                                + "' (known for silver and gold); give metal_parameters with plasma_energy, bulk_damping and fermi_velocity");
            }
        }
        Parameter as = m == null ? Parameter.fixed("particles.surface_scattering", "1", 1)
                : param(m, p, "surface_scattering", Rule.of("particles.surface_scattering", Quantity.DIMENSIONLESS)
                .above(0, false), 1);
        return new MetalParameters(out[0], out[1], out[2], as);
    }
}
