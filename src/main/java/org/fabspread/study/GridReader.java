package org.fabspread.study;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;

/**
 * The {@code wavelengths} section: the grid from, to, step, and the check that every material named
 * in the study is tabulated over it.
 */
final class GridReader extends SectionReader {

    GridReader(ReadContext ctx) {
        super(ctx);
    }

    WavelengthGrid grid(YamlNode n, String path) {
        Mapping m = mapping(n, path, keys("from", "to", "step"));
        Rule len = Rule.of("wavelength", Quantity.LENGTH).above(0, true);
        double from = number(req(m, path, "from"), child(path, "from"), len);
        YamlNode toN = req(m, path, "to");
        double to = number(toN, child(path, "to"), len);
        YamlNode stepN = req(m, path, "step");
        String st = text(stepN, child(path, "step"));
        double step;
        try {
            step = Units.toCanonical(st, Quantity.LENGTH);
        } catch (IllegalArgumentException e) {
            throw err(stepN, child(path, "step"), e.getMessage());
        }
        if (!(step > 0) || Double.isInfinite(step)) {
            throw err(stepN, child(path, "step"), "step must be > 0 nm, got " + Quantity.LENGTH.show(step));
        }
        if (!(to > from)) {
            throw err(toN, child(path, "to"), "the grid runs backwards or is empty: to (" + Quantity.LENGTH.show(to)
                    + ") must be above from (" + Quantity.LENGTH.show(from) + ")");
        }
        double steps = (to - from) / step;
        if (steps + 1 > Limits.MAX_WAVELENGTHS) {
            throw err(stepN, child(path, "step"), "a step of " + Quantity.LENGTH.show(step) + " gives "
                    + (steps < 1e12 ? Long.toString((long) Math.floor(steps) + 1) : "more than 10^12")
                    + " wavelengths from " + Quantity.LENGTH.show(from) + " to " + Quantity.LENGTH.show(to) + "; at most "
                    + Limits.MAX_WAVELENGTHS + " (each costs one optical solve per device): use a step of at least "
                    + Units.format(Math.ceil((to - from) / (Limits.MAX_WAVELENGTHS - 1) * 1000) / 1000) + " nm");
        }
        if (Math.abs(steps - Math.rint(steps)) > 1e-9 * Math.max(1, steps)) {
            throw err(stepN, child(path, "step"), "the range " + Units.format(from) + " to " + Units.format(to)
                    + " nm is not a whole number of " + Units.format(step) + " nm steps");
        }
        return new WavelengthGrid(from, to, step);
    }

    void checkGrid(YamlNode gridNode, WavelengthGrid g) {
        for (ReadContext.MaterialUse u : ctx.materialUses()) {
            double[] r = u.range();
            boolean low = g.startNm() < r[0];
            boolean high = g.stopNm() > r[1];
            if (low || high) {
                YamlNode at = gridNode;
                String path = "wavelengths";
                if (gridNode instanceof Mapping gm && gm.get(low ? "from" : "to") != null) {
                    at = gm.get(low ? "from" : "to");
                    path = "wavelengths." + (low ? "from" : "to");
                }
                throw err(at, path, "the grid " + Units.format(g.startNm()) + " to " + Units.format(g.stopNm())
                        + " nm leaves the table of material '" + u.material() + "' (" + u.usedBy() + "), tabulated "
                        + Units.format(r[0]) + " to " + Units.format(r[1]) + " nm");
            }
        }
    }
}
