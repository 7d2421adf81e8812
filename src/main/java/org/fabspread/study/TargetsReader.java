package org.fabspread.study;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.fabspread.study.Units.Quantity;
import org.fabspread.study.YamlNode.Mapping;
import org.fabspread.study.YamlNode.Sequence;

/** The {@code targets} section: specification limits on outputs ({@code jsc >= 15 mA/cm^2}). */
final class TargetsReader extends SectionReader {

    TargetsReader(ReadContext ctx) {
        super(ctx);
    }

    private static final Pattern TARGET = Pattern.compile("^\\s*([A-Za-z_][A-Za-z0-9_]*)\\s*(>=|<=|≥|≤|>|<|=)\\s*(.*)$");

    List<Target> targets(YamlNode n, String path, boolean hasDiode) {
        Sequence s = list(n, path);
        List<Target> out = new ArrayList<>();
        for (int i = 0; i < s.items().size(); i++) {
            String p = path + "[" + i + "]";
            YamlNode item = s.items().get(i);
            String output;
            boolean atLeast;
            String value;
            YamlNode valueNode;
            YamlNode outputNode;
            if (item instanceof Mapping tm) {
                mapping(tm, p, keys("output", "at_least", "at_most"));
                outputNode = req(tm, p, "output");
                output = text(outputNode, child(p, "output"));
                YamlNode lo = opt(tm, "at_least");
                YamlNode hi = opt(tm, "at_most");
                if ((lo == null) == (hi == null)) {
                    throw err(tm, p, "give exactly one of at_least and at_most");
                }
                atLeast = lo != null;
                valueNode = atLeast ? lo : hi;
                value = text(valueNode, child(p, atLeast ? "at_least" : "at_most"));
            } else {
                String t = text(item, p);
                Matcher tmatch = TARGET.matcher(t);
                if (!tmatch.matches()) {
                    throw err(item, p, "write a target as 'OUTPUT >= VALUE UNIT' or 'OUTPUT <= VALUE UNIT', e.g. 'jsc >= 15 mA/cm^2'");
                }
                String op = tmatch.group(2);
                if (!op.equals(">=") && !op.equals("<=") && !op.equals("≥") && !op.equals("≤")) {
                    throw err(item, p, "use >= or <= in a target, got '" + op + "'");
                }
                output = tmatch.group(1);
                atLeast = op.equals(">=") || op.equals("≥");
                value = tmatch.group(3);
                valueNode = item;
                outputNode = item;
            }
            Quantity q = outputQuantity(output, outputNode, p, hasDiode);
            double v = finite(value, q, valueNode, p, "target on " + output, "target value must be finite");
            out.add(new Target(output, atLeast, v, q.canonical(), loc(item, p)));
        }
        return out;
    }
}
