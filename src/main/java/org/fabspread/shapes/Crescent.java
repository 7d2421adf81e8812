package org.fabspread.shapes;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A crescent as made by template lithography: a flat disk of diameter {@code outerDiameter} centred on the
 * origin with a circular bite of diameter {@code biteDiameter} removed, the bite's centre displaced by
 * {@code biteOffset} along +x; {@code thickness} along z. The opening faces +x; y = 0 is a mirror plane.
 */
public record Crescent(double outerDiameter, double biteDiameter, double biteOffset, double thickness)
        implements Solid {

    public Crescent {
        Checks.positive("crescent", "outer_diameter", outerDiameter);
        Checks.positive("crescent", "bite_diameter", biteDiameter);
        Checks.positive("crescent", "thickness", thickness);
        if (!(biteOffset >= 0) || Double.isInfinite(biteOffset)) {
            throw new IllegalArgumentException("crescent: bite_offset must be >= 0 nm, got " + biteOffset);
        }
        if (biteOffset + outerDiameter / 2 <= biteDiameter / 2) {
            throw new IllegalArgumentException("crescent: the bite (diameter " + biteDiameter + " nm, offset "
                    + biteOffset + " nm) removes the whole disk");
        }
    }

    @Override
    public String kind() {
        return "crescent";
    }

    @Override
    public Map<String, Double> parameters() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("outer_diameter", outerDiameter);
        m.put("bite_diameter", biteDiameter);
        m.put("bite_offset", biteOffset);
        m.put("thickness", thickness);
        return m;
    }

    /** Disk area minus the lens where the two circles overlap (circle–circle intersection), times thickness. */
    @Override
    public double volume() {
        double r1 = outerDiameter / 2;
        double r2 = biteDiameter / 2;
        double d = biteOffset;
        double lens;
        if (d >= r1 + r2) {
            lens = 0;
        } else if (d <= Math.abs(r1 - r2)) {
            double r = Math.min(r1, r2);
            lens = Math.PI * r * r;
        } else {
            double a1 = r1 * r1 * Math.acos((d * d + r1 * r1 - r2 * r2) / (2 * d * r1));
            double a2 = r2 * r2 * Math.acos((d * d + r2 * r2 - r1 * r1) / (2 * d * r2));
            double tri = 0.5 * Math.sqrt((-d + r1 + r2) * (d + r1 - r2) * (d - r1 + r2) * (d + r1 + r2));
            lens = a1 + a2 - tri;
        }
        return (Math.PI * r1 * r1 - lens) * thickness;
    }

    @Override
    public boolean contains(double x, double y, double z) {
        double r1 = outerDiameter / 2;
        double r2 = biteDiameter / 2;
        double bx = x - biteOffset;
        return Math.abs(z) <= thickness / 2 && x * x + y * y <= r1 * r1 && bx * bx + y * y > r2 * r2;
    }

    @Override
    public double[] halfExtent() {
        return new double[] {outerDiameter / 2, outerDiameter / 2, thickness / 2};
    }
}
